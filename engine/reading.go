package engine

import (
	"fmt"
	"math"
)

// Reading is what the crew reads at one moment: drafts at some of the
// vessel's marks, the inclinometer, and soundings of some compartments.
type Reading struct {
	Minutes float64 // since the first reading
	HeelDeg float64 // inclinometer, + starboard down; read only when HasHeel
	HasHeel bool
	Drafts  []MarkReading
	Levels  []LevelReading
}

// MarkReading is the draft read at one mark.
type MarkReading struct {
	Mark   int     // index into Vessel.DraftMarks
	DraftM float64 // m above the baseline
}

// LevelReading is a sounding: the height of the water surface inside a
// compartment above its lowest point, taken at the compartment's middle
// along z (as FloodSample.SoundingM).
type LevelReading struct {
	Compartment int // index into Vessel.Compartments
	LevelM      float64
}

// The errors heelwatch assumes of a reading, one standard deviation: marks
// read to the centimetre (practice: a mark is read by eye against waves to
// about a centimetre), the inclinometer to 0.2° (practice) and a sounding
// to 5 cm (practice).
const (
	DraftErrorM  = 0.01
	HeelErrorDeg = 0.2
	LevelErrorM  = 0.05
)

// ObservedPlane is the water surface that the marks and the inclinometer of
// one reading imply, found without any model of the loading: each read
// mark is a point (x, y(d), d) on the shell where the water meets it, and
// the inclinometer says C = tan(heel); A, B and C are fitted to them by
// weighted least squares (each mark ±DraftErrorM, the heel ±HeelErrorDeg).
// Where the readings leave a slope undetermined (marks at one station only,
// no heel read) it is held near level by a weak prior (±10° of heel, ±L/10
// of trim), which the readings override whenever they say anything.
type ObservedPlane struct {
	Plane      Plane
	Residuals  []float64 // per mark of the reading, read − fitted, m
	HeelResDeg float64   // read − fitted heel, degrees (0 when no heel was read)
}

// FitObservedPlane fits the plane of reading r on v.
func FitObservedPlane(v *Vessel, r Reading) ObservedPlane {
	return fitObserved(v, r, -1)
}

// fitObserved fits the plane leaving out mark reading skip (−1: none).
func fitObserved(v *Vessel, r Reading, skip int) ObservedPlane {
	var n [3][3]float64
	var rhs [3]float64
	add := func(row [3]float64, val, w float64) {
		for i := 0; i < 3; i++ {
			for j := 0; j < 3; j++ {
				n[i][j] += w * row[i] * row[j]
			}
			rhs[i] += w * row[i] * val
		}
	}
	ys := make([]float64, len(r.Drafts))
	for k, mr := range r.Drafts {
		m := v.DraftMarks[mr.Mark]
		ys[k] = markShellY(v.Hull, m, mr.DraftM)
		if k == skip {
			continue
		}
		add([3]float64{1, m.XM, ys[k]}, mr.DraftM, 1/(DraftErrorM*DraftErrorM))
	}
	if r.HasHeel {
		s := HeelErrorDeg * math.Pi / 180
		add([3]float64{0, 0, 1}, math.Tan(r.HeelDeg*math.Pi/180), 1/(s*s))
	}
	// Weak priors: level in heel and trim, a draft of half the depth.
	L := v.Hull.LengthM
	add([3]float64{0, 0, 1}, 0, 1/math.Pow(math.Tan(10*math.Pi/180), 2))
	add([3]float64{0, 1, 0}, 0, 1/math.Pow(0.1, 2))
	add([3]float64{1, L / 2, 0}, v.Hull.DepthM/2, 1/math.Pow(10*v.Hull.DepthM, 2))
	a, ok := solve3(n, rhs)
	if !ok {
		panic("engine: the observed plane's normal equations are singular despite the priors")
	}
	p := Plane{a[0], a[1], a[2]}
	op := ObservedPlane{Plane: p, Residuals: make([]float64, len(r.Drafts))}
	for k, mr := range r.Drafts {
		m := v.DraftMarks[mr.Mark]
		op.Residuals[k] = mr.DraftM - p.Z(m.XM, ys[k])
	}
	if r.HasHeel {
		op.HeelResDeg = r.HeelDeg - math.Atan(p.C)*180/math.Pi
	}
	return op
}

// markShellY returns y of the shell at mark m at height z (0 for a centre
// mark).
func markShellY(h *Hull, m DraftMark, z float64) float64 {
	if m.Side == Both {
		return 0
	}
	sec := h.SectionAt(m.XM)
	if len(sec) < 3 {
		return 0
	}
	s := float64(m.Side)
	return s * outboard(sec, z, s)
}

// Disagreement is a reading that does not agree with the others of its
// moment: said, never averaged away.
type Disagreement struct {
	Reading int    // index of the reading
	What    string // the mark's name, or "heel"
	ReadM   float64
	// ExpectM is what the other readings of the moment put it at (metres
	// for a mark, degrees for the heel).
	Expect  float64
	Message string
}

// DisagreeLimit is how far, in standard deviations of a reading, a mark or
// the heel may lie from what the others imply before it is pointed out.
const DisagreeLimit = 4.0

// Disagreements checks each reading's marks against the plane that its
// other marks and heel imply (leave-one-out: a wrong mark cannot hide by
// pulling the fit towards itself), and the inclinometer against the marks.
// A mark needs at least three others of its moment to be judged.
func Disagreements(v *Vessel, rs []Reading) []Disagreement {
	var out []Disagreement
	for i, r := range rs {
		if len(r.Drafts) >= 4 {
			// The inclinometer is judged on its own below; when the marks
			// fix the heel they are judged among themselves.
			rm := r
			if markSides(v, r) {
				rm.HasHeel = false
			}
			// The suspect is the mark without which the others agree best
			// (least squares of the rest); it is named when it lies far
			// from what they say.
			best, bestRest, bestRes := -1, math.Inf(1), 0.0
			for k := range rm.Drafts {
				op := fitObserved(v, rm, k)
				var rest float64
				for j, res := range op.Residuals {
					if j != k {
						rest += res * res
					}
				}
				if rest < bestRest {
					best, bestRest, bestRes = k, rest, op.Residuals[k]
				}
			}
			if best >= 0 && math.Abs(bestRes) > DisagreeLimit*DraftErrorM*1.5 {
				mr := r.Drafts[best]
				name := v.DraftMarks[mr.Mark].Name
				exp := mr.DraftM - bestRes
				out = append(out, Disagreement{Reading: i, What: name, ReadM: mr.DraftM, Expect: exp,
					Message: fmt.Sprintf("at %s min, %s reads %.2f m but the other marks put it at %.2f m (%+.0f cm): read it again", fmtMin(r.Minutes), name, mr.DraftM, exp, 100*bestRes)})
			}
		}
		if r.HasHeel && len(r.Drafts) >= 2 {
			noHeel := r
			noHeel.HasHeel = false
			op := FitObservedPlane(v, noHeel)
			if markSides(v, r) {
				h := math.Atan(op.Plane.C) * 180 / math.Pi
				if d := r.HeelDeg - h; math.Abs(d) > DisagreeLimit*HeelErrorDeg*1.5 {
					out = append(out, Disagreement{Reading: i, What: "heel", ReadM: r.HeelDeg, Expect: h,
						Message: fmt.Sprintf("at %s min the inclinometer reads %.1f° but the marks port and starboard say %.1f°: check the inclinometer (a pendulum swings; read the mean)", fmtMin(r.Minutes), r.HeelDeg, h)})
				}
			}
		}
	}
	return out
}

// markSides reports whether reading r holds marks on both sides at one
// station (so that the marks alone fix the heel).
func markSides(v *Vessel, r Reading) bool {
	var p, s bool
	for _, mr := range r.Drafts {
		switch v.DraftMarks[mr.Mark].Side {
		case Port:
			p = true
		case Starboard:
			s = true
		}
	}
	return p && s
}

func fmtMin(m float64) string {
	if m == math.Trunc(m) {
		return fmt.Sprintf("%.0f", m)
	}
	return fmt.Sprintf("%.1f", m)
}
