package engine

import (
	"errors"
	"math"
)

// MarkSurvey is what the draft marks say once carried to the
// perpendiculars, as a draft survey does it: the marks are grouped aft
// (x < L/3), amidships and forward (x > 2L/3); each mark is first brought
// to the centreline along the heeled waterline, d − tan(heel)·y with y where
// the water meets the shell at the mark (exact for a plane waterline; upright,
// port and starboard alike), and each group's draft is the mean of its
// marks; the apparent trim between the aft and
// forward groups carries each group to its perpendicular,
//
//	correction = apparent trim × (distance of the marks from the perpendicular) / (length between the marks),
//
// and the hog or sag is the midship draft minus the mean of the forward and
// aft drafts (draft survey practice; Barrass & Derrett, Ship Stability for
// Masters and Mates, ch. 25, p. 236). A rigid hull floating in still water
// has none: on a computed position the deflection is zero to round-off; on
// readings it is the hull's bending (and the readers' errors).
type MarkSurvey struct {
	AftM, MidM, FwdM float64 // centreline drafts at the AP, at L/2 and at the FP
	TrimM            float64 // AftM − FwdM, + by the stern
	DeflectionM      float64 // MidM − (AftM + FwdM)/2: positive sag, negative hog; NaN without midship marks
	HaveMid          bool    // midship marks were read

	// The groups as read, before the correction: mean draft and mean x.
	AftMarksM, MidMarksM, FwdMarksM float64
	AftXM, MidXM, FwdXM             float64
}

// SurveyMarks carries mark drafts to the perpendiculars of a ship of length
// lengthM heeled by atan(tanHeel). It needs at least one mark aft of L/3 and
// one forward of 2L/3.
func SurveyMarks(lengthM, tanHeel float64, marks []MarkDraft) (MarkSurvey, error) {
	var sum [3]struct{ d, x float64 }
	var n [3]int
	for _, m := range marks {
		g := 1
		switch {
		case m.XM < lengthM/3:
			g = 0
		case m.XM > 2*lengthM/3:
			g = 2
		}
		sum[g].d += m.DraftM - tanHeel*m.YM
		sum[g].x += m.XM
		n[g]++
	}
	if n[0] == 0 || n[2] == 0 {
		return MarkSurvey{}, errors.New("carrying the marks to the perpendiculars needs marks read both aft and forward")
	}
	var s MarkSurvey
	s.AftMarksM, s.AftXM = sum[0].d/float64(n[0]), sum[0].x/float64(n[0])
	s.FwdMarksM, s.FwdXM = sum[2].d/float64(n[2]), sum[2].x/float64(n[2])
	lbm := s.FwdXM - s.AftXM
	if !(lbm > 0) {
		return MarkSurvey{}, errors.New("the forward marks are not forward of the aft marks")
	}
	// Apparent trim per metre, + by the stern: the draft falls going forward.
	slope := (s.AftMarksM - s.FwdMarksM) / lbm
	s.AftM = s.AftMarksM + slope*s.AftXM
	s.FwdM = s.FwdMarksM - slope*(lengthM-s.FwdXM)
	s.TrimM = s.AftM - s.FwdM
	s.DeflectionM = math.NaN()
	if n[1] > 0 {
		s.HaveMid = true
		s.MidMarksM, s.MidXM = sum[1].d/float64(n[1]), sum[1].x/float64(n[1])
		s.MidM = s.MidMarksM + slope*(s.MidXM-lengthM/2)
		s.DeflectionM = s.MidM - (s.AftM+s.FwdM)/2
	} else {
		s.MidM = (s.AftM + s.FwdM) / 2
	}
	return s, nil
}

// SurveyReading carries the marks of a reading to the perpendiculars: each
// read mark placed where the water meets its shell line at the draft read,
// brought to the centreline at the heel the reading implies (its marks and
// inclinometer together, FitObservedPlane).
func SurveyReading(v *Vessel, r Reading) (MarkSurvey, error) {
	var md []MarkDraft
	for _, d := range r.Drafts {
		m := v.DraftMarks[d.Mark]
		md = append(md, MarkDraft{DraftMark: m, DraftM: d.DraftM, YM: markShellY(v.Hull, m, d.DraftM)})
	}
	return SurveyMarks(v.Hull.LengthM, FitObservedPlane(v, r).Plane.C, md)
}
