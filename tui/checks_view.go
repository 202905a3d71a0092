package tui

import (
	"fmt"
	"strings"

	"heelwatch/engine"
)

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
			// The sets named judge other states than this one (intact sets
			// and a flooded ship, say), or the curve they need is missing.
			why := "criteria: none of the file's sets (" + strings.Join(m.v.CriteriaSets, ", ") + ") applies to this state"
			if engine.IsDamaged(m.damage) {
				why = "criteria: none of the file's sets (" + strings.Join(m.v.CriteriaSets, ", ") + ") judges a flooded ship: no damage criteria are checked"
			}
			for _, n := range m.cur.Notes {
				if strings.HasPrefix(n, "criteria") || strings.HasPrefix(n, "GZ curve") {
					why = n
				}
			}
			for _, l := range wrap(why, w) {
				lines = append(lines, st.Dim.Render(l))
			}
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

func flagMark(st *Styles, f engine.Flag) string {
	switch f.Severity {
	case engine.Danger:
		return st.Danger.Render("‼ ")
	case engine.Caution:
		return st.Caution.Render("! ")
	}
	return st.Info.Render("· ")
}
