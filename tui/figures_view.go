package tui

import (
	"fmt"
	"math"
	"strings"

	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/report"
)

// figure is one line of the floating position: what, the figure now, a few
// words on where or which way, and the change since intact.
type figure struct {
	label, value, note, delta string
	alarm                     bool // the figure itself is bad news (immersed, negative)
}

// figures are the floating-position lines for the current result, blanked
// when there is none.
func (m model) figures() []figure {
	labels := []string{"Draft aft", "Draft mid", "Draft fwd", "Heel", "Trim", "GM", "Displacement", "Deck edge", "Opening"}
	var p, b *engine.Position
	if m.cur != nil {
		p = m.cur.Position
	}
	if m.base != nil {
		b = m.base.Position
	}
	if p == nil {
		out := make([]figure, len(labels))
		for i, l := range labels {
			out[i] = figure{label: l, value: blank, delta: blank}
		}
		return out
	}
	dif := func(f func(*engine.Position) float64, prec int) string {
		if b == nil {
			return blank
		}
		return signed(f(p)-f(b), prec)
	}
	metres := func(v float64) string { return withUnit(num(v, 2), "m") }
	out := []figure{
		{label: "Draft aft", value: metres(p.DraftAftM), delta: dif(func(q *engine.Position) float64 { return q.DraftAftM }, 2)},
		{label: "Draft mid", value: metres(p.DraftMidM), delta: dif(func(q *engine.Position) float64 { return q.DraftMidM }, 2)},
		{label: "Draft fwd", value: metres(p.DraftFwdM), delta: dif(func(q *engine.Position) float64 { return q.DraftFwdM }, 2)},
	}
	heel := figure{label: "Heel", value: num(math.Abs(p.HeelDeg), 1) + "°", note: heelSide(p.HeelDeg), delta: blank}
	if b != nil {
		heel.delta = heelShort(p.HeelDeg - b.HeelDeg)
	}
	trim := figure{label: "Trim", value: metres(math.Abs(p.TrimM)), note: trimSense(p.TrimM),
		delta: dif(func(q *engine.Position) float64 { return q.TrimM }, 2)}
	// GM is the upright GM of the condition; where she lies heeled the GZ
	// slope there is said beside it, and a negative upright GM with a heel
	// is a loll, in the danger style.
	gmNote := "KM " + num(p.KMTM, 2) + " m"
	if math.Abs(p.HeelDeg) >= 0.05 {
		gmNote = "at rest " + num(p.GMAtRestM, 2) + " m"
	}
	if p.IsLoll() {
		gmNote = "LOLL, not a list"
	}
	gm := figure{label: "GM upright", value: metres(p.GMUprightM), note: gmNote,
		delta: dif(func(q *engine.Position) float64 { return q.GMUprightM }, 2), alarm: !(p.GMUprightM > 0)}
	// On the lost-buoyancy basis the displacement is the ship's weight
	// without the sea water in flooded spaces: labelled so, and the water
	// (open spaces and water held) said beside it.
	disp := figure{label: "Displacement", value: withUnit(num(p.DisplacementT, 0), "t"),
		delta: dif(func(q *engine.Position) float64 { return q.DisplacementT - q.HeldWaterT }, 0)}
	if w := p.OpenWaterT + p.HeldWaterT; w > 0 {
		disp.label = "Ship weight"
		disp.value = withUnit(num(p.DisplacementT-p.HeldWaterT, 0), "t")
		disp.note = "+" + num(w, 0) + " t water"
	}
	out = append(out, heel, trim, gm, disp)

	de := p.DeckEdge
	deck := figure{label: "Deck edge", value: metres(de.HeightM), delta: blank}
	if finite(de.HeightM) {
		deck.note = sideShort(de.Side) + " at " + num(de.XM, 1) + " m"
		deck.alarm = de.HeightM < 0
		if b != nil && finite(b.DeckEdge.HeightM) {
			deck.delta = signed(de.HeightM-b.DeckEdge.HeightM, 2)
		}
	} else {
		deck.value = blank
	}
	out = append(out, deck)

	op := figure{label: "Opening", value: blank, note: "none in the file", delta: blank}
	k := m.derived.nearest
	wt := false
	if k < 0 {
		k, wt = m.derived.nearestAll, true
	}
	if k >= 0 && k < len(p.Openings) {
		o := p.Openings[k]
		op.value = metres(o.HeightM)
		op.note = o.Name
		if wt {
			op.note += " (weathertight)"
		}
		op.alarm = o.HeightM < 0
		if b != nil && k < len(b.Openings) {
			op.delta = signed(o.HeightM-b.Openings[k].HeightM, 2)
		}
	}
	return append(out, op)
}

func withUnit(s, unit string) string {
	if s == blank {
		return s
	}
	return s + " " + unit
}

func heelSide(deg float64) string { return report.HeelSide(deg, 1) }

func trimSense(m float64) string { return report.TrimSense(m, 2) }

func sideShort(s engine.Side) string { return report.SideShort(s) }

// figuresView draws the floating position in w columns, figLines lines.
func (m model) figuresView(w int) []string {
	st := m.st
	const labelW, valueW, deltaW = 12, 8, 7
	noteW := max(0, w-labelW-valueW-deltaW-3)
	// The changes are against her intact in the loading she has now: once
	// the condition is changed on the panel (a righting option taken in,
	// say), that intact may itself list, and the heading says so.
	since := "since intact"
	if changeOnly(m.condition) != "" {
		since = "since intact, this loading"
	}
	head := fitLine(st.Heading.Render("FLOATING POSITION"), w-len(since)-1) + " " + st.Dim.Render(since)
	lines := []string{head}
	for _, f := range m.figures() {
		vs, ns, ls := st.Value, st.Text, st.Dim
		label := f.label
		if f.alarm {
			// Marked by shape as well as colour: under water, or GM gone.
			vs, ns, ls = st.Danger, st.Danger, st.Danger
			label = "‼ " + label
		}
		lines = append(lines, ls.Render(pad(label, labelW))+" "+vs.Render(padLeft(f.value, valueW))+" "+
			ns.Render(pad(f.note, noteW))+" "+st.Change.Render(padLeft(f.delta, deltaW)))
	}
	return fit(lines, w, figLines)
}

// flagsView lists the flags about the ship, danger first, in w × h: each
// flag with the mark of its severity and its sentence, wrapped. When not
// all of them fit whole, the first get their whole sentence and each of the
// rest at least its first line; when not even that fits, the last line
// says how many more there are.
func (m model) flagsView(w, h int) []string {
	return fit(m.flagLines(w, h), w, h)
}

// flagsNeed is how many lines the flags take whole at width w.
func (m model) flagsNeed(w int) int {
	n := 0
	for _, f := range m.derived.flags {
		n += len(wrap(f.Message, w-2))
	}
	return max(1, n)
}

// flagLines is flagsView's lines, at most h of them.
func (m model) flagLines(w, h int) []string {
	st := m.st
	if h <= 0 {
		return nil
	}
	flags := m.derived.flags
	if len(flags) == 0 {
		if m.cur == nil {
			return []string{st.Dim.Render("computing the intact condition…")}
		}
		return []string{st.Dim.Render("no flags raised")}
	}
	var lines []string
	if len(flags) > h {
		for i, f := range flags[:h] {
			if i == h-1 {
				more := len(flags) - i
				if h == 1 {
					// One line only: the worst flag, and the count of the rest.
					return []string{flagLine(st, f, fmt.Sprintf("(+%d) ", more-1))}
				}
				return append(lines, st.Dim.Render(fmt.Sprintf("… %d more flags on the criteria sheet", more)))
			}
			lines = append(lines, flagLine(st, f, ""))
		}
		return lines
	}
	spare := h - len(flags)
	for _, f := range flags {
		ws := wrap(f.Message, w-2)
		take := min(len(ws), 1+spare)
		spare -= take - 1
		if take < len(ws) {
			// The rest of the sentence on its last line, cut with "…".
			ws[take-1] = strings.Join(ws[take-1:], " ")
		}
		for k, l := range ws[:take] {
			if k == 0 {
				lines = append(lines, flagMark(st, f)+st.Text.Render(l))
			} else {
				lines = append(lines, "  "+st.Text.Render(l))
			}
		}
	}
	return lines
}

// flagLine is one flag: a mark by its severity and its sentence.
func flagLine(st *Styles, f engine.Flag, prefix string) string {
	s := st.Info
	switch f.Severity {
	case engine.Danger:
		s = st.Danger
	case engine.Caution:
		s = st.Caution
	}
	return flagMark(st, f) + s.Render(prefix) + st.Text.Render(f.Message)
}

// bannerView says plainly that there is no floating position: she sinks,
// she capsizes, or the solver found none; the reason and the flags follow.
func (m model) bannerView(w, h int) []string {
	st := m.st
	what := "NO FLOATING POSITION FOUND"
	reason := m.failure
	if m.cur != nil && m.cur.NoEq != nil {
		switch m.cur.NoEq.Outcome {
		case engine.Sinks:
			what = "SHE SINKS"
		case engine.Capsizes:
			what = "SHE CAPSIZES"
		}
		reason = m.cur.NoEq.Reason
	}
	if m.failure != "" {
		what = "THE COMPUTATION FAILED"
		reason = "engine failure: " + m.failure + " (the figures are blanked; undo the last change)"
	}
	// Framed in block characters, so that it stands out in every palette
	// and on a screen without colour.
	mid := "█  " + what + " — figures blanked  █"
	lines := []string{
		st.Banner.Render(strings.Repeat("▄", w)),
		st.Banner.Width(w).Align(lipgloss.Center).Render(mid),
		st.Banner.Render(strings.Repeat("▀", w)),
	}
	for _, l := range wrap(reason, w) {
		lines = append(lines, st.Danger.Render(l))
	}
	for _, f := range m.derived.flags {
		for _, l := range wrap(f.Message, w-2) {
			lines = append(lines, flagLineText(st, f, l))
		}
	}
	return fit(lines, w, h)
}

func flagLineText(st *Styles, f engine.Flag, l string) string {
	if f.Severity == engine.Danger {
		return st.Danger.Render("‼ " + l)
	}
	return st.Caution.Render("! " + l)
}

// noPosition reports whether the current result has no floating position.
func (m model) noPosition() bool {
	return m.failure != "" || (m.cur != nil && m.cur.Position == nil)
}
