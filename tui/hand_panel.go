package tui

import (
	"fmt"
	"math"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
)

// handPanel is the hand method's panel: its answers beside the direct
// solution's and its working step by step, or why it does not apply. It is
// a child of the dashboard with its own update and view; it holds whether
// it is shown and how far it is scrolled, and is given the figures, the
// styles and the room it is drawn in (with, room).
type handPanel struct {
	show   bool
	scroll int // the first line shown under the heading

	a       *engine.Assessment // the figures shown; nil while computing
	st      *Styles
	caveats []engine.Flag // the hand method's caveats among the flags (severity.go)

	w, h        int  // the room it is drawn in (room)
	withAnswers bool // its answers are in it (narrow screens)
}

// with returns the panel drawing assessment a in styles st.
func (hp handPanel) with(a *engine.Assessment, st *Styles) handPanel {
	hp.a, hp.st = a, st
	return hp
}

// room returns the panel drawn in w × h, with its answers or without.
func (hp handPanel) room(w, h int, withAnswers bool) handPanel {
	hp.w, hp.h, hp.withAnswers = w, h, withAnswers
	return hp
}

// working reports whether there is a working to show and scroll.
func (hp handPanel) hasWorking() bool { return hp.show && hp.a != nil && hp.a.Hand != nil }

// update takes the keys that are the panel's: the hand key shows or hides
// it, and while it shows a working the scroll keys move everything under
// its heading (answers, caveats and working) a few lines at a time, so
// that every line is reached however small the room. It reports whether
// it took the key.
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
		body, _ := hp.body(hp.w, hp.withAnswers)
		hp.scroll = scrolled(hp.scroll, body, hp.h-1, step)
		return hp, true
	}
	return hp, false
}

// view shows the lost-buoyancy hand method in w × h: its answers beside
// the direct ones when withAnswers is set, its caveats whole, and its
// working step by step, or why it does not apply. What does not fit under
// the heading scrolls with the working keys, and the heading says which
// steps are in view.
func (hp handPanel) view(w, h int, withAnswers bool) []string {
	st := hp.st
	title := "HAND METHOD · lost buoyancy, small angles"
	if hp.a != nil && hp.a.Hand.Unusable() != "" {
		title = "HAND METHOD · NOT USABLE here"
	}
	if hp.a == nil {
		return fit([]string{st.Heading.Render(title), st.Dim.Render("computing…")}, w, h)
	}
	body, stepAt := hp.body(w, withAnswers)
	room := max(h-1, 0)
	first := 0
	if len(body) > room {
		first = scrolled(hp.scroll, body, room, 0)
	}
	if n := len(stepAt); n > 0 {
		// The steps whose lines are (at least partly) in view.
		a, b := 0, 0
		for k, at := range stepAt {
			end := len(body)
			if k+1 < n {
				end = stepAt[k+1]
			}
			if end > first && at < first+room {
				if a == 0 {
					a = k + 1
				}
				b = k + 1
			}
		}
		right := fmt.Sprintf("steps %d–%d of %d", a, b, n)
		if a == 0 {
			right = fmt.Sprintf("%d steps below", n)
		}
		if len(body) > room {
			right += " · [ ] scroll"
		}
		if len([]rune(title))+3+len([]rune(right)) > w {
			title = "HAND METHOD" // the steps in view before the method's words
			if hp.a.Hand.Unusable() != "" {
				title = "HAND METHOD ✗"
			}
		}
		title = titleFit(w, title, right)
	}
	lines := []string{st.Heading.Render(title)}
	return fit(append(lines, body[first:min(len(body), first+room)]...), w, h)
}

// body is everything under the heading, drawn w wide: the answers (when
// withAnswers), or why there is no hand working; the caveats; the
// working. stepAt gives the line each step of the working starts on.
func (hp handPanel) body(w int, withAnswers bool) (lines []string, stepAt []int) {
	st := hp.st
	if hp.a == nil {
		return nil, nil
	}
	if hp.a.Hand == nil {
		for _, l := range wrap(hp.why(), w) {
			lines = append(lines, st.Dim.Render(l))
		}
		return append(lines, hp.caveatLines(w)...), nil
	}
	if withAnswers {
		lines = append(lines, hp.answers(w)...)
	}
	if why := hp.a.Hand.Unusable(); why != "" {
		// Said before the caveats and the working, in the danger style:
		// the hand heel and drafts beside are not to be worked from.
		for k, l := range wrap("NOT USABLE: the hand heel and drafts are not to be worked from: "+why+".", w-2) {
			mark := "  "
			if k == 0 {
				mark = "✗ "
			}
			lines = append(lines, st.Danger.Render(mark+l))
		}
	}
	lines = append(lines, hp.caveatLines(w)...)
	lines = append(lines, st.Dim.Render(fmt.Sprintf("working, %d steps", len(hp.a.Hand.Steps))))
	// The label column as wide as the longest label, up to 2/5 of the width.
	lw := 0
	for _, s := range hp.a.Hand.Steps {
		lw = max(lw, len([]rune(s.Label)))
	}
	lw = min(lw, w*2/5)
	for _, s := range hp.a.Hand.Steps {
		stepAt = append(stepAt, len(lines))
		lines = append(lines, hp.stepLines(s, w, lw)...)
	}
	return lines, stepAt
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
		if label == "Trim" {
			// Trim with its sense, not a sign to be decoded: "0.32 st"
			// by the stern, "0.05 hd" by the head.
			show = func(v float64) string {
				switch r := math.Round(v*100) / 100; {
				case r > 0:
					return num(v, prec) + " st"
				case r < 0:
					return num(-v, prec) + " hd"
				}
				return "even"
			}
		}
		d, apart := blank, blank
		if p != nil {
			d = show(dv(p))
			apart = num(math.Abs(hv-dv(p)), prec)
			if unit == "" {
				apart += "°" // heel: the unit is on each figure
			}
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

// stepLines is one step of the working, w wide (labels lw wide), its
// result always whole and in a column of its own (as the printed working
// has it): on a wide column the label, the result, then the formula
// wrapped under its own column; on a narrow one the label with the
// result, the formula wrapped under them. A caution among the steps (its label says so) is marked as
// one, so that its figure is read as the figure it is about, not as the
// answer its text points to.
func (hp handPanel) stepLines(s engine.HandStep, w, lw int) []string {
	st := hp.st
	const vw = 13 // "−12345.678 t·m" at most, right-aligned
	value := withUnit(num(s.Value, precFor(s.Value)), s.Unit)
	labelStyle := st.Dim
	if strings.HasPrefix(s.Label, "caution") {
		// Its figure is the hand method's, which the caution is about.
		labelStyle = st.Caution
		value = "hand " + value
	}
	if fw := w - lw - vw - 2; w >= 70 && fw >= 20 {
		// A label longer than its column wraps; the result and the formula
		// start on its last line.
		label, formula := wrap(s.Label, lw), wrap(s.Formula, fw)
		at := len(label) - 1
		var out []string
		for k := 0; k < max(len(label), at+len(formula)); k++ {
			l, v, f := "", "", ""
			if k < len(label) {
				l = label[k]
			}
			if k == at {
				v = value
			}
			if k >= at && k-at < len(formula) {
				f = formula[k-at]
			}
			out = append(out, strings.TrimRight(labelStyle.Render(pad(l, lw))+" "+st.Value.Render(padLeft(v, vw))+"  "+st.Text.Render(f), " "))
		}
		return out
	}
	lw = max(1, w-vw-1)
	out := []string{labelStyle.Render(pad(s.Label, lw)) + " " + st.Value.Render(padLeft(value, vw))}
	if len([]rune(s.Label)) > lw {
		// A label longer than its room: whole on its own line, then the result.
		out = nil
		for _, l := range wrap(s.Label, w) {
			out = append(out, labelStyle.Render(l))
		}
		out = append(out, st.Value.Render(padLeft(value, w)))
	}
	for _, f := range wrap(s.Formula, max(1, w-2)) {
		out = append(out, "  "+st.Text.Render(f))
	}
	return out
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
