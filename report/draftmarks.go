package report

import (
	"math"

	"heelwatch/engine"
)

// MarkDoc is the draft at one draft mark in the `solve` JSON (draft_marks).
type MarkDoc struct {
	Name   string `json:"name"`
	XM     Num    `json:"x_m"`
	Side   string `json:"side"` // port | starboard | centre
	DraftM Num    `json:"draft_m"`
	// State: "reads"; "keel out" (the water is below the keel at that
	// side: draft_m is the water's height at the shell's lowest point);
	// "under water" (above the deck at side).
	State string `json:"state"`
}

// SurveyDoc is the marks carried to the perpendiculars (draft survey
// practice): centreline drafts at AP, L/2 and FP, the trim, and the hog
// (negative) or sag (positive) of the midship draft against the mean of
// the ends; null figures where the marks do not allow them.
type SurveyDoc struct {
	DraftAftM   Num `json:"draft_aft_m"`
	DraftMidM   Num `json:"draft_mid_m"`
	DraftFwdM   Num `json:"draft_fwd_m"`
	TrimM       Num `json:"trim_m"`
	DeflectionM Num `json:"hog_sag_m"`
}

// MarkSideWord is the word for a mark's side: port, starboard or centre.
func MarkSideWord(s engine.Side) string {
	if s == engine.Both {
		return "centre"
	}
	return s.String()
}

// MarkDrafts returns the drafts at v's marks in position p (nil if either
// is missing).
func MarkDrafts(v *engine.Vessel, p *engine.Position) []engine.MarkDraft {
	if v == nil || p == nil || len(v.DraftMarks) == 0 {
		return nil
	}
	return engine.MarkDrafts(v.Hull, p.Plane, v.DraftMarks)
}

// MarkDocs returns the JSON rows of the marks; never nil.
func MarkDocs(md []engine.MarkDraft) []MarkDoc {
	out := []MarkDoc{}
	for _, m := range md {
		out = append(out, MarkDoc{m.Name, Num(m.XM), MarkSideWord(m.Side), Num(m.DraftM), m.State.String()})
	}
	return out
}

// Survey returns the marks carried to the perpendiculars, nil when they
// cannot be (no marks both aft and forward).
func Survey(lengthM, tanHeel float64, md []engine.MarkDraft) *SurveyDoc {
	s, err := engine.SurveyMarks(lengthM, tanHeel, md)
	if err != nil {
		return nil
	}
	return &SurveyDoc{Num(s.AftM), Num(s.MidM), Num(s.FwdM), Num(s.TrimM), Num(s.DeflectionM)}
}

// HogSagWords says a deflection: "sag 0.06 m", "hog 0.04 m", "none".
func HogSagWords(m float64) string {
	switch {
	case !finite(m):
		return "—"
	case math.Abs(m) < 0.005:
		return "none"
	case m > 0:
		return "sag " + num(m, 2, "m")
	}
	return "hog " + num(-m, 2, "m")
}

// markLines writes the marks as a small table for the text report.
func markLines(r Report) []string {
	md := MarkDrafts(r.Vessel, r.Assessment.Position)
	if len(md) == 0 {
		return nil
	}
	t := table{right: []bool{false, false, true, false, true, false}}
	for _, m := range md {
		note := ""
		if m.State != engine.MarkReads {
			note = m.State.String()
		}
		t.add(m.Name, "at x", num(m.XM, 1, "m"), MarkSideWord(m.Side), num(m.DraftM, 2, "m"), note)
	}
	lines := append([]string{"Draft marks (what the crew will read)"}, t.lines("  ")...)
	if s, err := engine.SurveyMarks(r.Vessel.Hull.LengthM, r.Assessment.Position.Plane.C, md); err == nil {
		lines = append(lines, "  to the perpendiculars: aft "+num(s.AftM, 2, "m")+", amidships "+num(s.MidM, 2, "m")+
			", forward "+num(s.FwdM, 2, "m")+"; hog/sag "+HogSagWords(s.DeflectionM))
	}
	return lines
}

// markdownMarks writes the marks as a Markdown section (nothing without marks).
func markdownMarks(e *errWriter, r Report) {
	marks := MarkDrafts(r.Vessel, r.Assessment.Position)
	if len(marks) == 0 {
		return
	}
	e.line("## Draft marks")
	e.line()
	e.line("| Mark | x | Side | Draft | State |")
	e.line("|---|--:|---|--:|---|")
	for _, m := range marks {
		e.line("| ", md(m.Name), " | ", num(m.XM, 1, "m"), " | ", MarkSideWord(m.Side), " | ", num(m.DraftM, 2, "m"), " | ", m.State.String(), " |")
	}
	if s, err := engine.SurveyMarks(r.Vessel.Hull.LengthM, r.Assessment.Position.Plane.C, marks); err == nil {
		e.line()
		e.line("Carried to the perpendiculars (draft survey practice): aft ", num(s.AftM, 2, "m"), ", amidships ", num(s.MidM, 2, "m"),
			", forward ", num(s.FwdM, 2, "m"), "; hog/sag ", HogSagWords(s.DeflectionM), ".")
	}
	e.line()
}
