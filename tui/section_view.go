package tui

import (
	"fmt"
	"math"

	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
)

// The shade that fills a flooded space in the pictures.
const floodShade = '░'

// pictureInks maps the inks of a picture to the styles of the palette.
func (st *Styles) pictureInks() map[ink]lipgloss.Style {
	return map[ink]lipgloss.Style{
		inkAxis: st.Axis, inkFlood: st.Flood, inkBulkhead: st.Bulkhead, inkWater: st.Waterline,
		inkHull: st.Hull, inkCurve: st.Curve, inkSpace: st.Space, inkMark: st.Mark,
		inkOpening: st.Opening, inkOpeningWet: st.OpeningWet, inkText: st.Dim,
	}
}

// axisW is the width of the vertical scale left of a picture.
const axisW = 5

// framed puts a vertical scale left of a picture's canvas, labelled at
// round values of the world's y, and returns the canvas's lines.
func (m *model) framed(c *canvas, yStep float64, yFmt func(float64) string) []string {
	return framedIn(m.st, m.inks, c, yStep, yFmt)
}

// framedIn is framed for a part that holds its own styles.
func framedIn(st *Styles, inks map[ink]lipgloss.Style, c *canvas, yStep float64, yFmt func(float64) string) []string {
	body := c.render(inks)
	left := make([]string, c.h)
	if yStep > 0 {
		for v := math.Ceil(c.y0/yStep) * yStep; v <= c.y1; v += yStep {
			cy := c.cellY(v)
			if cy >= 0 && cy < c.h && left[cy] == "" {
				left[cy] = yFmt(v)
			}
		}
	}
	out := make([]string, 0, c.h+1)
	for i := range body {
		tickMark := "┤"
		if left[i] == "" {
			tickMark = "│"
		}
		out = append(out, st.Axis.Render(padLeft(left[i], axisW-1)+tickMark)+body[i])
	}
	return out
}

// scaleLine writes tick labels under a canvas: each at the column of its
// world x, skipped where it would overlap the one before.
// The unit is written at the right end.
func scaleLine(c *canvas, marks []tick, unit string) string {
	line := []rune(fmt.Sprintf("%*s", axisW+c.w, ""))
	u := []rune(unit)
	end := len(line) - len(u) - 1
	next := 0
	for _, t := range marks {
		cx := axisW + c.cellX(t.at)
		r := []rune(t.text)
		start := cx - len(r)/2
		if start < next || start < 0 || start+len(r) > end {
			continue
		}
		copy(line[start:], r)
		next = start + len(r) + 1
	}
	if end >= 0 {
		copy(line[end+1:], u)
	}
	return string(line)
}

type tick struct {
	at   float64
	text string
}

// sectionX is where the section is cut: the middle of the selected
// compartment, or where the deck edge is nearest the water when the vessel
// has no compartments.
func (m model) sectionX() float64 {
	L := m.v.Hull.LengthM
	x := L / 2
	if len(m.v.Compartments) > 0 {
		b := m.v.Compartments[m.sel].Box
		x = (math.Max(b.X0, 0) + math.Min(b.X1, L)) / 2
	} else if m.cur != nil && m.cur.Position != nil && finite(m.cur.Position.DeckEdge.XM) {
		x = m.cur.Position.DeckEdge.XM
	}
	return math.Min(math.Max(x, 0), L)
}

// sectionView draws the transverse section at sectionX, looking forward
// (port on the left): the hull, the compartments there (the selected one
// marked), the heeled waterline dashed, the spaces open to the sea shaded
// below it and a partly flooded space shaded below the free surface of its
// water (engine.Position.Held). Scales: height above the baseline and distance from the centreline,
// in metres, equal on both axes.
func (m model) sectionView(w, h int) []string {
	st := m.st
	x := m.sectionX()
	parts := []string{"SECTION at " + num(x, 1) + " m"}
	if len(m.v.Compartments) > 0 {
		parts = append(parts, m.v.Compartments[m.sel].Name)
	}
	parts = append(parts, "looking fwd")
	lines := []string{st.Heading.Render(titleFit(w, parts...))}
	cw, ch := w-axisW, h-2
	if cw < 8 || ch < 3 {
		return fit(lines, w, h)
	}
	c := m.sectionCanvas(x, cw, ch)
	half := m.v.Hull.BreadthM / 2
	step := niceStep(c.y1-c.y0, max(2, ch/3))
	ystep := niceStep(half*2, 4)
	var marks []tick
	for v := -math.Floor(half/ystep) * ystep; v <= half+1e-9; v += ystep {
		marks = append(marks, tick{v, num(math.Abs(v), 0)})
	}
	lines = append(lines, m.framed(c, step, func(v float64) string { return num(v, 0) })...)
	lines = append(lines, st.Axis.Render(scaleLine(c, marks, "m")))
	return fit(lines, w, h)
}

// sectionCanvas draws sectionView's picture of the section at x on a
// canvas of cw × ch cells, without its title and scales.
func (m model) sectionCanvas(x float64, cw, ch int) *canvas {
	hull := m.v.Hull
	c := newCanvas(cw, ch)
	half := hull.BreadthM / 2
	zlo, zhi := 0.0, hull.DepthM
	var p *engine.Plane
	if m.cur != nil && m.cur.Position != nil {
		pl := m.cur.Position.Plane
		p = &pl
		for _, y := range []float64{-half, half} {
			z := pl.Z(x, y)
			if finite(z) {
				zlo, zhi = math.Min(zlo, z), math.Max(zhi, z)
			}
		}
	}
	zlo = math.Max(zlo, -hull.DepthM)
	zhi = math.Min(zhi, 2*hull.DepthM)
	pad := 0.08 * math.Max(hull.DepthM, half)
	c.windowStretched(-half*1.08, half*1.08, zlo-pad, zhi+pad, 2)

	// Flooded spaces: cells whose centre is inside an open compartment's
	// section and below the sea, or inside a partly flooded one's and below
	// the free surface of the water it holds.
	for i, comp := range m.v.Compartments {
		b := comp.Box
		if x < b.X0 || x > b.X1 {
			continue
		}
		ys, zs := splitPoints(comp.Solid().SectionAt(x))
		if len(ys) < 3 {
			continue
		}
		var surface *engine.Plane
		switch {
		case p != nil && m.openNow(i):
			surface = p
		case p != nil:
			for k := range m.cur.Position.Held {
				if hw := &m.cur.Position.Held[k]; hw.Index == i && hw.VolumeM3 > 0 {
					surface = &hw.Surface
				}
			}
		}
		if surface != nil {
			for cy := 0; cy < c.h; cy++ {
				wz := c.worldY(cy)
				for cx := 0; cx < c.w; cx++ {
					wy := c.worldX(cx)
					if wz < surface.Z(x, wy) && pointInPolygon(ys, zs, wy, wz) {
						c.fillCell(cx, cy, floodShade, inkFlood)
					}
				}
			}
			if surface != p {
				// The free surface inside, in dots, so that a shallow layer
				// shows even where no cell's centre is under it.
				for px := 0; px < 2*c.w; px++ {
					wy := c.x0 + (float64(px)+0.5)/float64(2*c.w)*(c.x1-c.x0)
					wz := surface.Z(x, wy)
					if pointInPolygon(ys, zs, wy, wz) {
						c.dot(px, int(math.Floor(c.dotY(wz))), inkWater)
					}
				}
			}
		}
		k := inkBulkhead
		if i == m.sel {
			k = inkSpace
		}
		c.polygon(ys, zs, k)
	}
	ys, zs := splitPoints(hull.Solid().SectionAt(x))
	c.polygon(ys, zs, inkHull)
	if p != nil {
		c.dashed(c.x0, p.Z(x, c.x0), c.x1, p.Z(x, c.x1), inkWater)
	}
	// Openings within a few metres of the section.
	near := math.Max(2, 0.04*hull.LengthM)
	if p != nil {
		for _, oc := range m.cur.Position.Openings {
			if math.Abs(oc.X-x) > near {
				continue
			}
			m.markOpening(c, oc, oc.Y, oc.Z)
		}
	}
	c.label(0, 0, "P", inkText)
	c.label(c.w-1, 0, "S", inkText)
	return c
}

// titleFit joins the parts of a title with " · " while they fit in w;
// the first part always stands.
func titleFit(w int, parts ...string) string {
	t := parts[0]
	for _, p := range parts[1:] {
		if len([]rune(t))+3+len([]rune(p)) > w {
			break
		}
		t += " · " + p
	}
	return t
}

// markOpening puts an opening's mark on a picture: ○ above the water,
// ● under it.
func (m model) markOpening(c *canvas, oc engine.OpeningClearance, wx, wy float64) {
	cx, cy := c.cellX(wx), c.cellY(wy)
	if oc.Weathertight {
		c.label(cx, cy, "◇", inkOpening)
		return
	}
	if oc.HeightM < 0 {
		c.label(cx, cy, "●", inkOpeningWet)
	} else {
		c.label(cx, cy, "○", inkOpening)
	}
}

// splitPoints returns a polygon's y and z coordinates.
func splitPoints(pts []engine.Point) (ys, zs []float64) {
	ys, zs = make([]float64, len(pts)), make([]float64, len(pts))
	for i, q := range pts {
		ys[i], zs[i] = q.Y, q.Z
	}
	return ys, zs
}
