package tui

import (
	"fmt"
	"math"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
)

// handPanel is the hand method's panel: its answers beside the direct
// solution's and its working step by step, or why it does not apply. It is
// a child of the dashboard with its own update and view; it holds whether
// it is shown and how far its working is scrolled, and is given the
// figures and the styles to draw with (with).
type handPanel struct {
	show   bool
	scroll int // the first step of the working shown

	a       *engine.Assessment // the figures shown; nil while computing
	st      Styles
	caveats []engine.Flag // the hand method's caveats among the flags (severity.go)
}

// with returns the panel drawing assessment a in styles st.
func (hp handPanel) with(a *engine.Assessment, st Styles) handPanel {
	hp.a, hp.st = a, st
	return hp
}

// working reports whether there is a working to show and scroll.
func (hp handPanel) hasWorking() bool { return hp.show && hp.a != nil && hp.a.Hand != nil }

// update takes the keys that are the panel's: the hand key shows or hides
// it, and while it shows a working the scroll keys move it a step at a
// time. It reports whether it took the key.
func (hp handPanel) update(msg tea.KeyMsg, k keyMap) (handPanel, bool) {
	switch {
	case key.Matches(msg, k.Hand):
		hp.show = !hp.show
		return hp, true
	case hp.hasWorking() && (key.Matches(msg, k.WorkUp) || key.Matches(msg, k.WorkDown)):
		step := scrollStep
		if key.Matches(msg, k.WorkUp) {
			step = -scrollStep
		}
		hp.scroll = scrolled(hp.scroll, make([]string, len(hp.a.Hand.Steps)), 1, step)
		return hp, true
	}
	return hp, false
}

// view shows the lost-buoyancy hand method: its answers beside the
// direct ones when withAnswers is set, and its working step by step
// (scrolled with the working keys), or why it does not apply.
func (hp handPanel) view(w, h int, withAnswers bool) []string {
	st := hp.st
	lines := []string{st.Heading.Render("HAND METHOD · lost buoyancy, small angles")}
	if hp.a == nil {
		return fit(append(lines, st.Dim.Render("computing…")), w, h)
	}
	if hp.a.Hand == nil {
		for _, l := range wrap(hp.why(), w) {
			lines = append(lines, st.Dim.Render(l))
		}
		return fit(append(lines, hp.caveatLines(w)...), w, h)
	}
	if withAnswers {
		lines = append(lines, hp.answers(w)...)
	}
	lines = append(lines, hp.caveatLines(w)...)
	return fit(append(lines, hp.working(w, h-len(lines))...), w, h)
}

// why says why there is no hand working.
func (hp handPanel) why() string {
	if hp.a != nil && hp.a.HandWhy != "" {
		return hp.a.HandWhy
	}
	return "hand method: not yet available"
}

// answers is the hand method's answers beside the direct solution's,
// and how far they part.
func (hp handPanel) answers(w int) []string {
	st := hp.st
	hw := hp.a.Hand
	lw := 10
	vw := max(6, min(9, (w-lw-2)/3))
	lines := []string{st.Dim.Render(pad("", lw) + padLeft("hand", vw) + padLeft("direct", vw) + padLeft("apart", vw))}
	p := hp.a.Position
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
	row("GM upright", hw.GMM, func(q *engine.Position) float64 { return q.GMUprightM }, 2, "m")
	return lines
}

// working is the hand method's steps from the scroll position, in
// w × h: one line a step when there is room, else the label over the
// formula.
func (hp handPanel) working(w, h int) []string {
	st := hp.st
	steps := hp.a.Hand.Steps
	if h <= 0 {
		return nil
	}
	first := min(hp.scroll, max(0, len(steps)-1))
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
