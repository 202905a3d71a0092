package tui

import (
	"math"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/report"
)

// girderPanel is the hull girder's panel: the still-water shear force and
// bending moment along the ship, now (solid) and intact (dotted), against
// the permissible values at the read-out points (dashed), with the
// readings in a table. The root model holds it, opens it with the girder
// key and hands it the figures to draw (with); it answers its own key, the
// limits key (sea or harbour values).
type girderPanel struct {
	show bool
	flip bool // the other set of limits than the vessel's (sea or harbour)

	cur, base *engine.Assessment // the state shown and the intact one
	st        *Styles
	inks      map[ink]lipgloss.Style
}

// girderLimitsKey turns between the sea and the harbour values while the
// panel is shown.
var girderLimitsKey = key.NewBinding(key.WithKeys("l"), key.WithHelp("l", "sea/harbour limits"))

// handles reports whether the panel answers msg.
func (p girderPanel) handles(msg tea.KeyMsg) bool {
	return p.show && key.Matches(msg, girderLimitsKey)
}

// update answers the panel's own key.
func (p girderPanel) update(msg tea.Msg) (girderPanel, tea.Cmd) {
	if k, ok := msg.(tea.KeyMsg); ok && key.Matches(k, girderLimitsKey) {
		p.flip = !p.flip
	}
	return p, nil
}

// with returns the panel with the figures and styles to draw.
func (p girderPanel) with(cur, base *engine.Assessment, st *Styles, inks map[ink]lipgloss.Style) girderPanel {
	p.cur, p.base, p.st, p.inks = cur, base, st, inks
	return p
}

// strength returns the strength shown, with the readings against the set
// of limits chosen in the panel.
func (p girderPanel) strength() (*engine.Strength, string) {
	if p.cur == nil {
		return nil, "not yet computed"
	}
	s := p.cur.Strength
	if s == nil {
		why := p.cur.StrengthWhy
		if why == "" {
			why = "not worked out"
		}
		return nil, why
	}
	c := *s
	c.Harbour = s.Harbour != p.flip
	c.Points = s.Against(c.Harbour)
	return &c, ""
}

func (p girderPanel) intact() *engine.Strength {
	if p.base == nil || p.cur == nil || p.base == p.cur || !engine.IsDamaged(p.cur.Damage) {
		return nil
	}
	return p.base.Strength
}

// view draws the panel in w × h: on a wide panel the table at the left and
// the two curves side by side at the right, else the table over the curves.
func (p girderPanel) view(w, h int) string {
	st := p.st
	s, why := p.strength()
	set := "limits at sea (l)"
	switch {
	case s != nil && !s.HasLimits():
		set = "no limits in the file"
	case s != nil && s.Harbour:
		set = "limits in harbour (l)"
	}
	head := st.Heading.Render(titleFit(w, "HULL GIRDER", set, "still water, hogging +", "b closes"))
	lines := []string{head}
	if s == nil {
		for _, l := range wrap("Shear force and bending moment: "+why+".", w) {
			lines = append(lines, st.Dim.Render(l))
		}
		return strings.Join(fit(lines, w, h), "\n")
	}
	table := p.table(s, min(w, 60))
	body := h - 1
	if w >= 100 {
		tw := min(60, w*45/100)
		pw := (w - tw - 2) / 2
		left := fit(p.table(s, tw), tw, body)
		sep := st.Dim.Render("│")
		lines = append(lines, besides(sep, left,
			fit(p.plot(s, false, pw, body), pw, body),
			fit(p.plot(s, true, w-tw-2-pw, body), w-tw-2-pw, body))...)
		return strings.Join(fit(lines, w, h), "\n")
	}
	lines = append(lines, table...)
	rest := body - len(table)
	switch {
	case rest >= 12:
		lines = append(lines, p.plot(s, false, w, rest/2)...)
		lines = append(lines, p.plot(s, true, w, rest-rest/2)...)
	case rest >= 4:
		// Room for one curve: the one nearer its limits.
		lines = append(lines, p.plot(s, momentWorse(s), w, rest)...)
	}
	return strings.Join(fit(lines, w, h), "\n")
}

// table lists the readings: name, x, shear force and moment with their
// shares of the permissible values, and the largest values and the
// closing error under them.
func (p girderPanel) table(s *engine.Strength, w int) []string {
	st := p.st
	withX := w >= 52
	fixed := 33
	if withX {
		fixed += 6
	}
	nameW := max(6, w-fixed)
	row := func(name, x, sf, sfp, bm, bmp, mark string) string {
		r := padRight(clip(name, nameW), nameW)
		if withX {
			r += padLeft(x, 6)
		}
		return r + padLeft(sf, 7) + padLeft(sfp, 6) + padLeft(bm, 8) + padLeft(bmp, 6) + " " + mark
	}
	out := []string{st.Dim.Render(row("read-out", "x m", "SF kN", "%", "BM kN·m", "%", ""))}
	for _, r := range s.Points {
		mark := ""
		style := st.Text
		switch r.Level {
		case engine.Danger:
			mark, style = "‼", st.Danger
		case engine.Caution:
			mark, style = "!", st.Caution
		}
		out = append(out, style.Render(row(r.Name, num(r.XM, 1), num(r.ShearKN, 0), report.PctWords(r.ShearPct, r.ShearLimitKN),
			num(r.MomentKNm, 0), report.PctWords(r.MomentPct, r.MomentLimitKNm), mark)))
	}
	sp, mp := s.ClosingPct()
	out = append(out, st.Dim.Render(clip("max SF "+num(math.Abs(s.MaxShear.Value), 0)+" kN @"+num(s.MaxShear.XM, 1)+" m · BM "+
		num(math.Abs(s.MaxMoment.Value), 0)+" kN·m "+report.SenseWords(s.MaxMoment.Value)[:3]+" @"+num(s.MaxMoment.XM, 1)+" m", w)))
	out = append(out, st.Dim.Render(clip("closing error "+num(sp, 1)+" % SF, "+num(mp, 1)+" % BM, spread along her", w)))
	return out
}

// plot draws one curve (the moment when moment, else the shear force) in
// MN or MN·m along the ship: now solid, intact dotted, the permissible
// values at the read-out points joined by dashes, zero as the axis.
func (p girderPanel) plot(s *engine.Strength, moment bool, w, h int) []string {
	st := p.st
	ys := s.ShearKN
	title := "shear force MN"
	if moment {
		ys, title = s.MomentKNm, "bending moment MN·m"
	}
	in := p.intact()
	var iys []float64
	if in != nil {
		iys = in.ShearKN
		if moment {
			iys = in.MomentKNm
		}
		title += " · intact dotted"
	}
	lines := []string{st.Heading.Render(clip(title, w))}
	cw, ch := w-axisW, h-2
	if cw < 8 || ch < 2 {
		return fit(lines, w, h)
	}
	// Limits: + the hogging or shear value, − the sagging or shear value.
	type lim struct{ x, up, down float64 }
	var lims []lim
	for _, r := range s.Points {
		l := r.Sea
		if s.Harbour {
			l = r.Harbour
		}
		up, down := l.ShearKN, l.ShearKN
		if moment {
			up, down = l.HogKNm, l.SagKNm
		}
		lims = append(lims, lim{r.XM, up, down})
	}
	lo, hi := 0.0, 0.0
	for _, v := range append(append([]float64(nil), ys...), iys...) {
		if finite(v) {
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
	}
	for _, l := range lims {
		if l.up > 0 {
			hi = math.Max(hi, l.up)
		}
		if l.down > 0 {
			lo = math.Min(lo, -l.down)
		}
	}
	if !(hi > lo) {
		hi = lo + 1
	}
	const mega = 1000.0
	pad := 0.08 * (hi - lo)
	c := newCanvas(cw, ch)
	x0, x1 := s.XM[0], s.XM[len(s.XM)-1]
	c.window(x0, x1, (lo-pad)/mega, (hi+pad)/mega)
	c.line(x0, 0, x1, 0, inkAxis)
	for i := 1; i < len(lims); i++ {
		a, b := lims[i-1], lims[i]
		if a.up > 0 && b.up > 0 {
			c.dashed(a.x, a.up/mega, b.x, b.up/mega, inkMark)
		}
		if a.down > 0 && b.down > 0 {
			c.dashed(a.x, -a.down/mega, b.x, -b.down/mega, inkMark)
		}
	}
	for i := 1; i < len(iys) && i < len(s.XM); i++ {
		c.dotted(s.XM[i-1], iys[i-1]/mega, s.XM[i], iys[i]/mega, inkBulkhead)
	}
	for i := 1; i < len(ys); i++ {
		c.line(s.XM[i-1], ys[i-1]/mega, s.XM[i], ys[i]/mega, inkCurve)
	}
	for _, r := range s.Points {
		if r.Level == engine.Danger {
			c.label(c.cellX(r.XM), 0, "‼", inkOpeningWet)
		}
	}
	step := niceStep(c.y1-c.y0, max(2, ch/2))
	prec := 0
	if step < 1 {
		prec = 1
	}
	lines = append(lines, framedIn(st, p.inks, c, step, func(v float64) string { return num(v, prec) })...)
	xstep := niceStep(x1-x0, max(2, cw/8))
	var ticks []tick
	for v := math.Ceil(x0/xstep) * xstep; v <= x1+1e-9; v += xstep {
		ticks = append(ticks, tick{v, num(v, 0)})
	}
	lines = append(lines, st.Axis.Render(scaleLine(c, ticks, "m")))
	return fit(lines, w, h)
}

// momentWorse reports whether the bending moment is nearer its limits
// than the shear force (true too when neither has limits).
func momentWorse(s *engine.Strength) bool {
	var sf, bm float64
	for _, r := range s.Points {
		sf, bm = math.Max(sf, r.ShearPct), math.Max(bm, r.MomentPct)
	}
	return bm >= sf
}

// padRight pads s with spaces to w runes.
func padRight(s string, w int) string {
	if n := len([]rune(s)); n < w {
		return s + strings.Repeat(" ", w-n)
	}
	return s
}

// girderLines is the hull girder's panel in w × h for the root model's
// layouts.
func (m model) girderLines(w, h int) []string {
	return strings.Split(m.girder.with(m.cur, m.base, m.st, m.inks).view(w, h), "\n")
}

// girderKey opens or closes the panel; the righting options give way to it.
func (m model) girderKey() (tea.Model, tea.Cmd) {
	m.girder.show = !m.girder.show
	if m.girder.show {
		m.rem.show = false
	}
	return m, nil
}
