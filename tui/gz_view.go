package tui

import (
	"math"
)

// gzView draws the righting-lever curve of the current state: GZ in metres
// up, heel in degrees along, towards the side she lies to, with the angle
// she lies at (e), the downflooding angle (f) and the angle of vanishing
// stability (v) marked, and the range of positive stability between e
// and v drawn under the axis.
func (m model) gzView(w, h int) []string {
	st := m.st
	var lines []string
	if m.cur == nil || m.cur.Position == nil {
		return fit([]string{st.Heading.Render("GZ CURVE"), st.Dim.Render("no floating position: no righting levers")}, w, h)
	}
	g := m.cur.GZ
	if g == nil || len(g.HeelDeg) < 2 || len(g.HeelDeg) != len(g.GZM) {
		return fit([]string{st.Heading.Render("GZ CURVE"), st.Dim.Render("GZ curve: not yet available")}, w, h)
	}
	title := titleFit(w, "GZ m, to "+sideShort(g.Toward), "max "+num(g.GZMaxM, 2)+" at "+num(g.GZMaxDeg, 0)+"°", "range "+num(g.RangeDeg, 0)+"°")
	lines = append(lines, st.Heading.Render(title))
	cw, ch := w-axisW, h-3
	if cw < 8 || ch < 3 {
		return fit(lines, w, h)
	}
	c := newCanvas(cw, ch)
	xmax := g.HeelDeg[len(g.HeelDeg)-1]
	ylo, yhi := 0.0, 0.0
	for _, v := range g.GZM {
		if finite(v) {
			ylo, yhi = math.Min(ylo, v), math.Max(yhi, v)
		}
	}
	if !(yhi > ylo) {
		yhi = ylo + 0.1
	}
	pad := 0.1 * (yhi - ylo)
	c.window(0, xmax*1.01, ylo-pad, yhi+pad)
	c.line(0, 0, xmax, 0, inkAxis)
	type mark struct {
		deg   float64
		label string
	}
	marks := []mark{{g.EquilibriumDeg, "e"}, {g.DownfloodingDeg, "f"}, {g.VanishingDeg, "v"}}
	for _, mk := range marks {
		if !finite(mk.deg) || mk.deg < 0 || mk.deg > xmax {
			continue
		}
		c.dashed(mk.deg, c.y0, mk.deg, c.y1, inkMark)
		c.label(c.cellX(mk.deg), 0, mk.label, inkMark)
	}
	// The range of positive stability, under the axis.
	if finite(g.EquilibriumDeg, g.RangeDeg) && g.RangeDeg > 0 {
		zy := c.cellY(0) + 1
		if zy < c.h {
			a, b := c.cellX(g.EquilibriumDeg), c.cellX(math.Min(g.EquilibriumDeg+g.RangeDeg, xmax))
			for cx := a; cx <= b; cx++ {
				c.label(cx, zy, "─", inkMark)
			}
			c.label(a, zy, "├", inkMark)
			c.label(b, zy, "┤", inkMark)
		}
	}
	for i := 1; i < len(g.HeelDeg); i++ {
		c.line(g.HeelDeg[i-1], g.GZM[i-1], g.HeelDeg[i], g.GZM[i], inkCurve)
	}
	step := niceStep(c.y1-c.y0, max(2, ch/3))
	xstep := niceStep(xmax, max(2, cw/8))
	var ticks []tick
	for v := 0.0; v <= xmax+1e-9; v += xstep {
		ticks = append(ticks, tick{v, num(v, 0)})
	}
	lines = append(lines, m.framed(c, step, func(v float64) string { return num(v, 1) })...)
	lines = append(lines, st.Axis.Render(scaleLine(c, ticks, "°")))
	legend := "e at rest " + num(g.EquilibriumDeg, 1) + "° · f flooding " + num(g.DownfloodingDeg, 0) + "°"
	if g.Downflooding != "" {
		legend += " (" + g.Downflooding + ")"
	}
	legend += " · v " + num(g.VanishingDeg, 0) + "°"
	lines = append(lines, st.Dim.Render(legend))
	return fit(lines, w, h)
}
