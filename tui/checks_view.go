package tui

import (
	"fmt"
	"math"

	"heelwatch/engine"
)

// handView shows the lost-buoyancy hand method: its answers beside the
// direct ones when withAnswers is set, and its working step by step
// (scrolled with the working keys), or why it does not apply.
func (m model) handView(w, h int, withAnswers bool) []string {
	st := m.st
	lines := []string{st.Heading.Render("HAND METHOD · lost buoyancy, small angles")}
	if m.cur == nil {
		return fit(append(lines, st.Dim.Render("computing…")), w, h)
	}
	if m.cur.Hand == nil {
		for _, l := range wrap(m.handWhy(), w) {
			lines = append(lines, st.Dim.Render(l))
		}
		return fit(append(lines, m.handCaveatLines(w)...), w, h)
	}
	if withAnswers {
		lines = append(lines, m.handAnswers(w)...)
	}
	lines = append(lines, m.handCaveatLines(w)...)
	return fit(append(lines, m.handWorking(w, h-len(lines))...), w, h)
}

// handWhy says why there is no hand working.
func (m model) handWhy() string {
	if m.cur != nil && m.cur.HandWhy != "" {
		return m.cur.HandWhy
	}
	return "hand method: not yet available"
}

// handAnswers is the hand method's answers beside the direct solution's,
// and how far they part.
func (m model) handAnswers(w int) []string {
	st := m.st
	hw := m.cur.Hand
	lw := 10
	vw := max(6, min(9, (w-lw-2)/3))
	lines := []string{st.Dim.Render(pad("", lw) + padLeft("hand", vw) + padLeft("direct", vw) + padLeft("apart", vw))}
	p := m.cur.Position
	row := func(label string, hv float64, dv func(*engine.Position) float64, prec int, unit string) {
		show := func(v float64) string { return num(v, prec) }
		if unit == "°" {
			// Heel with its side, as everywhere else on the screen.
			show, unit = heelShort, ""
		}
		d, apart := blank, blank
		if p != nil {
			d = show(dv(p))
			apart = num(math.Abs(hv-dv(p)), prec)
		}
		lines = append(lines, st.Dim.Render(pad(label, lw))+st.Value.Render(padLeft(show(hv), vw))+
			st.Text.Render(padLeft(d, vw))+st.Change.Render(padLeft(apart, vw))+st.Dim.Render(" "+unit))
	}
	row("Draft aft", hw.DraftAftM, func(q *engine.Position) float64 { return q.DraftAftM }, 2, "m")
	row("Draft fwd", hw.DraftFwdM, func(q *engine.Position) float64 { return q.DraftFwdM }, 2, "m")
	row("Trim", hw.TrimM, func(q *engine.Position) float64 { return q.TrimM }, 2, "m")
	row("Heel", hw.HeelDeg, func(q *engine.Position) float64 { return q.HeelDeg }, 1, "°")
	row("GM", hw.GMM, func(q *engine.Position) float64 { return q.GMM }, 2, "m")
	return lines
}

// handWorking is the hand method's steps from the scroll position, in
// w × h: one line a step when there is room, else the label over the
// formula.
func (m model) handWorking(w, h int) []string {
	st := m.st
	steps := m.cur.Hand.Steps
	if h <= 0 {
		return nil
	}
	first := min(m.handScroll, max(0, len(steps)-1))
	head := fmt.Sprintf("working, steps %d–%d of %d", first+1, len(steps), len(steps))
	var body []string
	twoLines := w < 70
	for k := first; k < len(steps); k++ {
		s := steps[k]
		result := st.Text.Render(s.Formula+" = ") + st.Value.Render(withUnit(num(s.Value, precFor(s.Value)), s.Unit))
		if twoLines {
			body = append(body, st.Dim.Render(s.Label), "  "+result)
		} else {
			lw := min(34, w*2/5)
			body = append(body, st.Dim.Render(pad(s.Label, lw))+" "+result)
		}
		if len(body) >= h-1 {
			last := k + 1
			head = fmt.Sprintf("working, steps %d–%d of %d · [ ] scroll", first+1, last, len(steps))
			break
		}
	}
	return fit(append([]string{st.Dim.Render(head)}, body...), w, h)
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
	if m.cur == nil {
		return fit([]string{st.Heading.Render(title), st.Dim.Render("computing…")}, w, h)
	}
	body := m.criteriaLines(w, withFlags)
	if len(body) <= h-1 {
		return fit(append([]string{st.Heading.Render(title)}, body...), w, h)
	}
	// Too long for the room: scrolled with [ and ].
	first := min(m.textScroll, max(0, len(body)-(h-1)))
	last := min(len(body), first+h-1)
	head := st.Heading.Render(title) + st.Dim.Render(fmt.Sprintf(" %d–%d/%d [ ]", first+1, last, len(body)))
	return fit(append([]string{head}, body[first:last]...), w, h)
}

// criteriaLines is the body of criteriaView, every line of it.
func (m model) criteriaLines(w int, withFlags bool) []string {
	st := m.st
	var lines []string
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
	if len(cr) == 0 && m.cur.Position == nil {
		return append(lines, st.Dim.Render("criteria: none without a floating position"))
	}
	if len(cr) == 0 {
		if len(m.v.CriteriaSets) > 0 {
			lines = append(lines, st.Dim.Render("criteria: not yet available"))
		} else {
			lines = append(lines, st.Dim.Render("criteria: the vessel file names none"))
		}
		return lines
	}
	pass, counted := 0, 0
	for _, c := range cr {
		if c.Indicator {
			continue // read, not judged (SOLAS s)
		}
		counted++
		if c.Pass {
			pass++
		}
	}
	lines = append(lines, st.Dim.Render(fmt.Sprintf("criteria: %d of %d pass", pass, counted)))
	set := ""
	for _, c := range cr {
		if c.Set != set {
			set = c.Set
			lines = append(lines, st.Group.Render(clip(set, w)))
		}
		verdict := st.Pass.Render("pass ")
		switch {
		case c.Indicator:
			verdict = st.Dim.Render("read ") // an indicator: shown, not judged
		case !c.Pass:
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
		prec, unit := criterionFormat(c.Unit)
		// The limit is in the requirement's words; the figures follow.
		lines = append(lines, "     "+st.Dim.Render("found ")+st.Value.Render(num(c.Actual, prec)+unit)+
			st.Dim.Render(", margin "+signed(c.Margin, prec)))
	}
	return lines
}

// criterionFormat gives the decimals and the unit text of a criterion's
// figures: degrees to 0.1, metres to 0.01, areas (m·rad) and plain numbers
// to 0.001.
func criterionFormat(unit string) (int, string) {
	switch unit {
	case "°", "deg":
		return 1, "°"
	case "m":
		return 2, " m"
	case "":
		return 3, ""
	}
	return 3, " " + unit
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
