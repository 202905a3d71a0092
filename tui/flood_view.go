package tui

import (
	"fmt"
	"math"
	"strings"

	"heelwatch/engine"
	"heelwatch/report"
)

// view is the flooding run on a narrow screen, in w × h: the times
// and the stages on top, the plot against time under them when it has
// room.
func (p floodPanel) view(w, h int) string {
	const minPlot = 7
	text := p.text(w, h, h-minPlot)
	if len(text)+minPlot > h {
		return strings.Join(fit(p.text(w, h, h), w, h), "\n")
	}
	out := append(text, p.cachedPlot(w, h-len(text))...)
	return strings.Join(fit(out, w, h), "\n")
}

// row is the wide screen's row of pictures while the panel is shown, in
// w × h: the section (drawn by section), the run's times and stages, and
// its plot.
func (p floodPanel) row(w, h int, section func(w, h int) []string) string {
	if w < 3 {
		return strings.Join(fit(nil, w, h), "\n")
	}
	sep := p.st.Dim.Render("│")
	tw := max((w-2)/3, min(46, w-2))
	sw := (w - 2 - tw) / 2
	pw := w - 2 - tw - sw
	return strings.Join(besides(sep,
		fit(section(sw, h), sw, h),
		fit(p.text(tw, h, h), tw, h),
		fit(p.cachedPlot(pw, h), pw, h)), "\n")
}

// cachedPlot is plot, drawn again only when the run, the dashboard's
// state or the size changed since it was last drawn.
func (p floodPanel) cachedPlot(w, h int) []string {
	k := p.plotKey
	k.w, k.h = w, h
	k.floodSeq, k.floodN, k.floodRep, k.running, k.floodNet = p.seq, len(p.track), p.rep, p.running, p.net
	return p.pics.drawn(k, p.plot)
}

// text is the panel's text in width w: what is flooding and through
// what, then the progress while the run computes, or its outcome, the
// times to each event and the intermediate stages. It takes at most h
// lines, and tries to keep within want by shortening the list of events.
func (p floodPanel) text(w, h, want int) []string {
	st := p.st
	f := p
	head := []string{st.Heading.Render(clip("FLOODING RUN", w))}
	if f.seq == 0 {
		name := ""
		if len(p.v.Compartments) > 0 {
			name = " (" + p.v.Compartments[p.sel].Name + ")"
		}
		for _, l := range wrap("No run yet. f sets a hole and pumps for the selected compartment"+name+
			" and starts one: how long until the levels meet, what goes under on the way, whether the pumps hold. t hides this panel.", w) {
			head = append(head, st.Dim.Render(l))
		}
		return fit(head, w, min(h, len(head)))
	}
	name := p.v.Compartments[f.req.ci].Name
	head[0] = st.Heading.Render(titleFit(w, "FLOODING RUN", name))
	hole := f.hole
	if hole.AreaM2 == 0 {
		hole = engine.Hole{AreaM2: f.req.areaM2, ZM: f.req.zM, Cd: f.req.cd}
	}
	pumps := "no pumps"
	if f.req.pumpM3h > 0 {
		pumps = "pumps " + num(f.req.pumpM3h, 0) + " m³/h"
	}
	for _, l := range joinWrap(w, " · ", fmt.Sprintf("hole %s m² at z %s m, Cd %s", short(hole.AreaM2, 4), num(hole.ZM, 2), num(hole.Cd, 2)), pumps) {
		head = append(head, st.Dim.Render(l))
	}

	switch {
	case f.err != "":
		lines := head
		for _, l := range wrap("The run could not go on: "+f.err, w) {
			lines = append(lines, st.Error.Render(l))
		}
		lines = append(lines, st.Dim.Render(clip("f sets the hole again", w)))
		return fit(lines, w, min(h, len(lines)))
	case f.running:
		return fit(append(head, p.progress(w)...), w, min(h, len(head)+4))
	case f.rep == nil:
		lines := append(head, st.Dim.Render(clip("stopped before its end · f runs it again", w)))
		return fit(lines, w, min(h, len(lines)))
	}
	r := f.rep
	verdict := st.Value
	switch r.End {
	case engine.FloodSinks, engine.FloodCapsizes, engine.FloodFailed:
		verdict = st.Danger
	case engine.FloodTimeLimit, engine.FloodFull:
		verdict = st.Caution
	}
	out := wrap(outcomeText(*r), w)
	if len(out) > 3 {
		out = append(out[:2], clip(strings.Join(out[2:], " "), w))
	}
	for _, l := range out {
		head = append(head, verdict.Render(l))
	}
	if f.baseChanged(p.damage) {
		head = append(head, st.Caution.Render(clip("! the dashboard has changed since: f runs it again", w)))
	}
	if p.spreadBeyond() {
		for _, l := range wrap("! this space alone, its connections shut; through the ship the water spreads further (\"through the ship\")", w) {
			head = append(head, st.Caution.Render(l))
		}
	}

	events := p.events(w)
	stages := p.stages(w)
	var clear []string
	if c := clearLine(r, p.v.Passenger()); c != "" {
		clear = []string{st.Dim.Render(clip(c, w))}
	}
	fixed := len(head) + len(stages)
	if fixed+len(events)+len(clear) > want {
		clear = nil
	}
	if room := h - fixed; len(events) > room {
		room = max(1, room)
		more := len(events) - room + 1
		events = append(events[:room-1:room-1], st.Dim.Render(clip(fmt.Sprintf("… %d more events to the end", more), w)))
	}
	lines := append(head, events...)
	lines = append(lines, clear...)
	lines = append(lines, stages...)
	return fit(lines, w, min(h, len(lines)))
}

// progress is the progress bar and the figures of a run in progress.
func (f floodPanel) progress(w int) []string {
	st := f.st
	p := f.prog
	bar := f.bar
	bar.Width = max(10, w-10)
	lines := []string{st.Busy.Render("computing ") + bar.ViewAs(p.Fraction())}
	target := ""
	if p.TargetM3 > 0 {
		target = " of " + num(p.TargetM3, 0)
	}
	lines = append(lines,
		st.Text.Render(clip("flooding time "+report.Duration(p.TimeS), w)),
		st.Text.Render(clip(fmt.Sprintf("water %s%s m³ · head %s m · step %d", num(p.WaterM3, 1), target, num(p.HeadM, 2), p.Steps), w)))
	if f.finishing {
		lines = append(lines, st.Dim.Render(clip("working out the table and the stages…", w)))
	}
	return lines
}

// joinWrap joins parts with sep while they fit in w, starting a new line
// where the next part would not.
func joinWrap(w int, sep string, parts ...string) []string {
	var out []string
	line := ""
	for _, p := range parts {
		switch {
		case line == "":
			line = p
		case len([]rune(line+sep+p)) <= w:
			line += sep + p
		default:
			out = append(out, clip(line, w))
			line = p
		}
	}
	return append(out, clip(line, w))
}

// eventMark is the letter an event has in the list and on the plot.
func eventMark(k engine.FloodEventKind) string {
	switch k {
	case engine.DeckEdgeReached:
		return "d"
	case engine.MarginLineReached:
		return "m"
	case engine.OpeningReached:
		return "o"
	case engine.CriterionFails:
		return "c"
	}
	return "»"
}

// eventWords says what happened at an event, briefly.
func eventWords(e engine.FloodEvent, r *engine.FloodReport) string {
	switch e.Kind {
	case engine.DeckEdgeReached:
		return "deck edge immersed"
	case engine.MarginLineReached:
		return "margin line immersed"
	case engine.OpeningReached:
		return e.Name + " immersed"
	case engine.CriterionFails:
		return e.Name + " fails"
	}
	// The outcome's own head words, so the end's line agrees with the
	// outcome above it ("floods despite the pumps", not "pumps hold").
	head, _ := report.FloodOutcome(*r)
	return head
}

// floodEvents lists the run's events in time order, the end last: mark,
// time from the start, water in, what happened.
func (p floodPanel) events(w int) []string {
	st := p.st
	r := p.rep
	var lines []string
	for _, e := range r.Events {
		t := e.TimeS
		if e.Kind == engine.RunEnds && r.End == engine.FloodEqualised {
			t = r.EqualiseS
		}
		s := st.Text
		switch {
		case e.Kind == engine.RunEnds && (r.End == engine.FloodSinks || r.End == engine.FloodCapsizes):
			s = st.Danger
		case e.Kind == engine.OpeningReached || e.Kind == engine.CriterionFails:
			s = st.Caution
		case e.Kind == engine.RunEnds:
			s = st.Value
		}
		text := eventMark(e.Kind) + " " + padLeft(report.Duration(t), 11) + " " + padLeft(num(e.WaterM3, 0), 4) + " m³ " + eventWords(e, r)
		lines = append(lines, s.Render(clip(text, w)))
	}
	return lines
}

// clearLine says which of the deck edge and the margin line stayed clear
// of the water all through the run ("" if both went under). A cargo ship
// has no margin line (a passenger-ship notion): only the deck edge is said.
func clearLine(r *engine.FloodReport, passenger bool) string {
	var deck, margin bool
	for _, e := range r.Events {
		deck = deck || e.Kind == engine.DeckEdgeReached
		margin = margin || e.Kind == engine.MarginLineReached
	}
	switch {
	case !passenger && !deck:
		return "  deck edge (bulkhead deck) stays clear"
	case !passenger:
		return ""
	case !deck && !margin:
		return "  deck edge and margin line stay clear"
	case !deck:
		return "  deck edge stays clear"
	case !margin:
		return "  margin line stays clear"
	}
	return ""
}

// floodStages is the table of the intermediate stages: the fraction of the
// final water, the water, when the run reached it, heel, GM, (on a wider
// panel) the deck edge's freeboard, and the criteria.
func (p floodPanel) stages(w int) []string {
	st := p.st
	r := p.rep
	if len(r.Stages) == 0 {
		return nil
	}
	deck := w >= 52
	head := "STAGE" + padLeft("m³", 4) + " " + padLeft("reached", 11) + " " + padLeft("heel", 7) + " " + padLeft("GM", 5)
	if deck {
		head += " " + padLeft("deck", 5)
	}
	head += " criteria"
	lines := []string{st.Heading.Render(clip(head, w))}
	for _, s := range r.Stages {
		reached := "not reached"
		if s.Reached {
			reached = report.Duration(s.TimeS)
		}
		row := padLeft(stageName(s.Fraction), 4) + " " + padLeft(num(s.WaterM3, 0), 4) + " " + padLeft(reached, 11) + " "
		crit, bad := criteriaWord(s.Criteria)
		style := st.Text
		if p := s.Position; p != nil {
			row += padLeft(heelShort(p.HeelDeg), 7) + " " + padLeft(num(p.GMUprightM, 2), 5)
			if deck {
				row += " " + padLeft(num(p.DeckEdge.HeightM, 2), 5)
			}
		} else {
			why := "no position"
			if s.NoEq != nil {
				why = s.NoEq.Outcome.String()
			}
			row += padLeft(why, 13)
			if deck {
				row += "      "
			}
			style, crit = st.Danger, ""
		}
		if bad {
			style = st.Caution
		}
		text := clip(row+" "+crit, w)
		if p.stageShown(s) {
			// The stage the dashboard shows now (the stage key).
			style, text = st.Selected, pad(text, w)
		}
		lines = append(lines, style.Render(text))
	}
	return lines
}

// stageShown reports whether the dashboard holds stage s now: the run's
// compartment not open and holding that stage's water.
func (p floodPanel) stageShown(s engine.FloodStage) bool {
	ci := p.req.ci
	if ci >= len(p.damage) || s.WaterM3 <= 0 {
		return false
	}
	d := p.damage[ci]
	return !d.Open && d.WaterM3 == s.WaterM3
}

// criteriaWord sums up a stage's criteria: "pass", "FAIL code" with the
// count of the others that fail, or "—" when none were judged.
func criteriaWord(cs []engine.CriterionResult) (string, bool) {
	var fails []string
	judged := 0
	for _, c := range cs {
		if c.Indicator {
			continue
		}
		judged++
		if !c.Pass {
			fails = append(fails, c.Code)
		}
	}
	switch {
	case judged == 0:
		return blank, false
	case len(fails) == 0:
		return "pass", false
	case len(fails) == 1:
		return "FAIL " + fails[0], true
	}
	return fmt.Sprintf("FAIL %s +%d", fails[0], len(fails)-1), true
}

// timeUnit picks the unit of a time axis running to T seconds.
func timeUnit(T float64) (scale float64, unit string) {
	switch {
	case T <= 300:
		return 1, "s"
	case T <= 5*3600:
		return 60, "min"
	}
	return 3600, "h"
}

// floodPlot draws heel (solid, scale on the left) and water in the
// compartment (dotted, scale on the right) against time since the hole
// was made, with the events marked by their letters; while the run
// computes, the water so far.
func (p floodPanel) plot(w, h int) []string {
	if p.net != nil {
		return p.netPlot(w, h)
	}
	st := p.st
	f := p
	const rightW = 6
	cw, ch := w-axisW-rightW, h-2
	if cw < 10 || ch < 3 || f.seq == 0 || f.err != "" {
		return fit(nil, w, h)
	}
	var ts, heel, water []float64
	var marks []engine.FloodEvent
	T, wmax := 0.0, 0.0
	side := "S"
	switch {
	case f.rep != nil:
		r := f.rep
		for _, s := range r.Trace {
			ts = append(ts, s.TimeS)
			water = append(water, s.WaterM3)
			hd := math.NaN()
			if s.Position != nil {
				hd = s.Position.HeelDeg
			}
			heel = append(heel, hd)
		}
		if len(ts) > 0 {
			T = ts[len(ts)-1]
		}
		if r.End == engine.FloodEqualised {
			T = math.Max(T, r.EqualiseS)
		}
		for _, e := range r.Events {
			if e.Kind != engine.RunEnds {
				marks = append(marks, e)
			}
		}
		wmax = r.CapacityM3
	case f.running:
		for _, p := range f.track {
			ts = append(ts, p.timeS)
			water = append(water, p.waterM3)
			heel = append(heel, math.NaN())
		}
		if len(ts) > 0 {
			T = ts[len(ts)-1]
		}
		wmax = math.Max(f.prog.TargetM3, 0)
	default:
		return fit(nil, w, h)
	}
	for _, x := range water {
		if finite(x) {
			wmax = math.Max(wmax, x)
		}
	}
	if !(wmax > 0) {
		wmax = 1
	}
	T = math.Max(T, 1)
	lo, hi := 0.0, 0.0
	any := false
	for _, x := range heel {
		if finite(x) {
			lo, hi, any = math.Min(lo, x), math.Max(hi, x), true
		}
	}
	if any && hi <= 0 && lo < 0 {
		// Heeling to port all the way: plot the heel to port upwards.
		for i := range heel {
			heel[i] = -heel[i]
		}
		lo, hi, side = 0, -lo, "P"
	}
	if !(hi-lo > 1) {
		hi = lo + 1
	}
	parts := []string{"HEEL ° " + side + " ─ left", "WATER m³ ┄ right", "against time"}
	if !any {
		parts = []string{"WATER IN SO FAR, m³ ┄ right"}
	}
	lines := []string{st.Heading.Render(titleFit(w, parts...))}
	c := newCanvas(cw, ch)
	margin := 0.05 * (hi - lo)
	c.window(0, T*1.02, lo-margin, hi+margin)
	wy := func(x float64) float64 { return lo + x/wmax*(hi-lo) }
	for _, e := range marks {
		c.dashed(e.TimeS, c.y0, e.TimeS, c.y1, inkMark)
		c.label(c.cellX(e.TimeS), 0, eventMark(e.Kind), inkMark)
	}
	for i := 1; i < len(ts); i++ {
		if finite(heel[i-1], heel[i]) {
			c.line(ts[i-1], heel[i-1], ts[i], heel[i], inkCurve)
		}
	}
	// Water dotted: every other dot of its line.
	for i := 1; i < len(ts); i++ {
		c.dotted(ts[i-1], wy(water[i-1]), ts[i], wy(water[i]), inkWater)
	}
	body := framedIn(p.st, p.inks, c, niceStep(hi-lo, max(2, ch/3)), func(v float64) string { return num(v, 0) })
	if !any {
		body = framedIn(p.st, p.inks, c, 0, nil)
	}
	// The water's scale on the right.
	right := make([]string, c.h)
	step := niceStep(wmax, max(2, ch/3))
	for v := 0.0; v <= wmax+1e-9; v += step {
		cy := c.cellY(wy(v))
		if cy >= 0 && cy < c.h && right[cy] == "" {
			right[cy] = "├" + num(v, 0)
		}
	}
	for i := range body {
		r := right[i]
		if r == "" {
			r = "│"
		}
		body[i] += st.Axis.Render(pad(r, rightW))
	}
	lines = append(lines, body...)
	scale, unit := timeUnit(T)
	xstep := niceStep(T/scale, max(2, cw/8)) * scale
	var ticks []tick
	for v := 0.0; v <= T+1e-9; v += xstep {
		ticks = append(ticks, tick{v, num(v/scale, 0)})
	}
	lines = append(lines, st.Axis.Render(scaleLine(c, ticks, unit)))
	return fit(lines, w, h)
}
