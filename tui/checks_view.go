package tui

import (
	"fmt"
	"math"

	"heelwatch/engine"
)

// handView shows the lost-buoyancy hand method's working step by step and
// its answers beside the direct ones, or why it does not apply.
func (m model) handView(w, h int) []string {
	st := m.st
	lines := []string{st.Heading.Render("HAND METHOD · lost buoyancy, small angles")}
	if m.cur == nil {
		return fit(append(lines, st.Dim.Render("computing…")), w, h)
	}
	hw := m.cur.Hand
	if hw == nil {
		why := m.cur.HandWhy
		if why == "" {
			why = "hand method: not yet available"
		}
		for _, l := range wrap(why, w) {
			lines = append(lines, st.Dim.Render(l))
		}
		return fit(lines, w, h)
	}
	// Answers first: they must fit even on a small screen.
	const lw, vw = 12, 9
	lines = append(lines, st.Dim.Render(pad("", lw)+padLeft("hand", vw)+padLeft("direct", vw)+padLeft("apart", vw)))
	p := m.cur.Position
	row := func(label string, hv float64, dv func(*engine.Position) float64, prec int, unit string) {
		d, apart := blank, blank
		if p != nil {
			d = num(dv(p), prec)
			apart = num(math.Abs(hv-dv(p)), prec)
		}
		lines = append(lines, st.Dim.Render(pad(label, lw))+st.Value.Render(padLeft(num(hv, prec), vw))+
			st.Text.Render(padLeft(d, vw))+st.Change.Render(padLeft(apart, vw))+st.Dim.Render(" "+unit))
	}
	row("Draft aft", hw.DraftAftM, func(q *engine.Position) float64 { return q.DraftAftM }, 2, "m")
	row("Draft fwd", hw.DraftFwdM, func(q *engine.Position) float64 { return q.DraftFwdM }, 2, "m")
	row("Trim", hw.TrimM, func(q *engine.Position) float64 { return q.TrimM }, 2, "m")
	row("Heel", hw.HeelDeg, func(q *engine.Position) float64 { return q.HeelDeg }, 1, "°")
	row("GM", hw.GMM, func(q *engine.Position) float64 { return q.GMM }, 2, "m")
	lines = append(lines, st.Dim.Render("working:"))
	for _, s := range hw.Steps {
		lines = append(lines, st.Dim.Render(pad(s.Label, min(18, w/3)))+" "+st.Text.Render(s.Formula)+" = "+st.Value.Render(num(s.Value, precFor(s.Value))+" "+s.Unit))
	}
	return fit(lines, w, h)
}

// precFor picks decimals for a figure of the hand working: three for small
// numbers, fewer for large.
func precFor(v float64) int {
	switch a := math.Abs(v); {
	case a >= 1000:
		return 0
	case a >= 100:
		return 1
	case a >= 1:
		return 2
	}
	return 3
}

// criteriaView shows each criterion with pass or fail, the value found
// and the margin, after every flag in full when withFlags is set.
func (m model) criteriaView(w, h int, withFlags bool) []string {
	st := m.st
	title := "CRITERIA"
	if withFlags {
		title = "FLAGS AND CRITERIA"
	}
	lines := []string{st.Heading.Render(title)}
	if m.cur == nil {
		return fit(append(lines, st.Dim.Render("computing…")), w, h)
	}
	for _, f := range m.derived.flags {
		if !withFlags {
			break
		}
		ws := wrap(f.Code+": "+f.Message, w-2)
		for k, l := range ws {
			if k == 0 {
				lines = append(lines, flagMark(st, f)+st.Text.Render(l))
			} else {
				lines = append(lines, "  "+st.Text.Render(l))
			}
		}
	}
	if withFlags && len(m.derived.flags) == 0 {
		lines = append(lines, st.Dim.Render("no flags raised"))
	}
	cr := m.cur.Criteria
	if len(cr) == 0 {
		if len(m.v.CriteriaSets) > 0 {
			lines = append(lines, st.Dim.Render("criteria: not yet available"))
		} else {
			lines = append(lines, st.Dim.Render("criteria: the vessel file names none"))
		}
		return fit(lines, w, h)
	}
	pass := 0
	for _, c := range cr {
		if c.Pass {
			pass++
		}
	}
	lines = append(lines, st.Dim.Render(fmt.Sprintf("criteria: %d of %d pass", pass, len(cr))))
	set := ""
	for _, c := range cr {
		if c.Set != set {
			set = c.Set
			lines = append(lines, st.Group.Render(clip(set, w)))
		}
		verdict := st.Pass.Render("pass ")
		if !c.Pass {
			verdict = st.Fail.Render("FAIL ")
		}
		req := wrap(c.Requirement, w-5)
		for k, l := range req {
			if k == 0 {
				lines = append(lines, verdict+st.Text.Render(l))
			} else {
				lines = append(lines, "     "+st.Text.Render(l))
			}
		}
		unit := ""
		if c.Unit != "" {
			unit = " " + c.Unit
		}
		lines = append(lines, "     "+st.Dim.Render("found ")+st.Value.Render(num(c.Actual, 3)+unit)+
			st.Dim.Render(" · limit "+num(c.Required, 3)+unit+" · margin "+signed(c.Margin, 3)))
	}
	return fit(lines, w, h)
}

func flagMark(st Styles, f engine.Flag) string {
	switch f.Severity {
	case engine.Danger:
		return st.Danger.Render("‼ ")
	case engine.Caution:
		return st.Caution.Render("! ")
	}
	return st.Info.Render("· ")
}
