package tui

import (
	"math"

	"heelwatch/engine"
)

// deckAt returns the deck at side at x: half-breadth and height,
// interpolated linearly between stations (the hull's own rule).
func deckAt(h *engine.Hull, x float64) (hb, z float64) {
	st := h.Stations()
	n := len(st)
	if n == 0 {
		return h.BreadthM / 2, h.DepthM
	}
	if x <= st[0].X {
		_, hb, z = h.DeckEdge(0)
		return hb, z
	}
	for i := 1; i < n; i++ {
		if x <= st[i].X {
			_, h0, z0 := h.DeckEdge(i - 1)
			_, h1, z1 := h.DeckEdge(i)
			t := (x - st[i-1].X) / (st[i].X - st[i-1].X)
			return h0 + t*(h1-h0), z0 + t*(z1-z0)
		}
	}
	_, hb, z = h.DeckEdge(n - 1)
	return hb, z
}

// keelAt returns the height of the keel on the centreline at station i.
func keelAt(st engine.Station) float64 {
	if len(st.Offsets) == 0 {
		return 0
	}
	return st.Offsets[0].Z
}

// profileView draws the ship from the side she lies to (the low side; from
// starboard when upright): keel, ends and the deck line at side, the
// waterline at the ship's side on that side dashed, the open compartments
// shaded below it, the selected compartment outlined and the openings
// marked. Scales: metres from the aft perpendicular along, metres above the
// baseline up; the vertical scale is enlarged.
func (m model) profileView(w, h int) []string {
	st := m.st
	L := m.v.Hull.LengthM
	p, side := m.profileSide()
	title := "PROFILE from " + sideShort(side)
	if p != nil {
		title += " · " + trimText(m.cur.Position.TrimM)
	}
	lines := []string{st.Heading.Render(title)}
	cw, ch := w-axisW, h-2
	if cw < 8 || ch < 3 {
		return fit(lines, w, h)
	}
	c := m.profileCanvas(cw, ch)
	step := niceStep(c.y1-c.y0, max(2, ch/3))
	xstep := niceStep(L, max(2, cw/10))
	marks := []tick{{0, "AP"}}
	for v := xstep; v < L-xstep/2; v += xstep {
		marks = append(marks, tick{v, num(v, 0)})
	}
	marks = append(marks, tick{L, "FP"})
	lines = append(lines, m.framed(c, step, func(v float64) string { return num(v, 0) })...)
	lines = append(lines, st.Axis.Render(scaleLine(c, marks, "m")))
	return fit(lines, w, h)
}

// profileSide returns the sea's surface (nil before the first figures)
// and the side the profile is seen from: the low side, starboard when
// upright.
func (m model) profileSide() (*engine.Plane, engine.Side) {
	if m.cur == nil || m.cur.Position == nil {
		return nil, engine.Starboard
	}
	pl := m.cur.Position.Plane
	if heelShort(m.cur.Position.HeelDeg) != "0.0°" && pl.C < 0 {
		return &pl, engine.Port
	}
	return &pl, engine.Starboard
}

// profileCanvas draws profileView's picture on a canvas of cw × ch cells,
// without its title and scales.
func (m model) profileCanvas(cw, ch int) *canvas {
	hull := m.v.Hull
	L := hull.LengthM
	p, side := m.profileSide()
	c := newCanvas(cw, ch)
	stations := hull.Stations()
	zlo, zhi := 0.0, hull.DepthM
	for _, s := range stations {
		zlo = math.Min(zlo, keelAt(s))
	}
	waterAt := func(x float64) float64 {
		hb, _ := deckAt(hull, x)
		return p.Z(x, float64(side)*hb)
	}
	if p != nil {
		for _, x := range []float64{0, L} {
			if z := waterAt(x); finite(z) {
				zlo, zhi = math.Min(zlo, z), math.Max(zhi, z)
			}
		}
	}
	zlo = math.Max(zlo, -hull.DepthM)
	zhi = math.Min(zhi, 2*hull.DepthM)
	for _, o := range m.v.Openings {
		zhi = math.Max(zhi, math.Min(o.Z, 2*hull.DepthM))
	}
	dz := 0.1 * (zhi - zlo)
	c.window(-0.03*L, 1.03*L, zlo-dz, zhi+dz)

	// Open compartments: shade the part of each box (cut at the deck) below
	// the water at the middle of its breadth; partly flooded ones below the
	// free surface of the water they hold. A compartment given by outlines
	// is shaded the same way between the bottom and the top of its own
	// section at each x (outlineSpan), not its box.
	for i, comp := range m.v.Compartments {
		if p == nil {
			break
		}
		surface := p
		if !m.openNow(i) {
			surface = nil
			for k := range m.cur.Position.Held {
				if hw := &m.cur.Position.Held[k]; hw.Index == i && hw.VolumeM3 > 0 {
					surface = &hw.Surface
				}
			}
			if surface == nil {
				continue
			}
		}
		if comp.Sections != nil {
			shadeOutlineProfile(c, comp, surface)
			continue
		}
		b := comp.Box
		yc := (math.Max(b.Y0, -hull.BreadthM/2) + math.Min(b.Y1, hull.BreadthM/2)) / 2
		for cx := 0; cx < c.w; cx++ {
			x := c.worldX(cx)
			if x < b.X0 || x > b.X1 || x < 0 || x > L {
				continue
			}
			_, deck := deckAt(hull, x)
			top := math.Min(b.Z1, deck)
			wl := surface.Z(x, yc)
			for cy := 0; cy < c.h; cy++ {
				z := c.worldY(cy)
				if z >= b.Z0 && z <= top && z < wl {
					c.fillCell(cx, cy, floodShade, inkFlood)
				}
			}
		}
	}
	// The hull: keel, deck at side and the two ends.
	for i := 1; i < len(stations); i++ {
		a, b := stations[i-1], stations[i]
		_, _, za := hull.DeckEdge(i - 1)
		_, _, zb := hull.DeckEdge(i)
		c.line(a.X, za, b.X, zb, inkHull)
		c.line(a.X, keelAt(a), b.X, keelAt(b), inkHull)
	}
	if n := len(stations); n > 0 {
		_, _, z0 := hull.DeckEdge(0)
		_, _, z1 := hull.DeckEdge(n - 1)
		c.line(stations[0].X, keelAt(stations[0]), stations[0].X, z0, inkHull)
		c.line(stations[n-1].X, keelAt(stations[n-1]), stations[n-1].X, z1, inkHull)
	}
	if len(m.v.Compartments) > 0 && m.v.Compartments[m.sel].Sections != nil {
		outlineProfile(c, m.v.Compartments[m.sel], inkSpace)
	} else if len(m.v.Compartments) > 0 {
		b := m.v.Compartments[m.sel].Box
		x0, x1 := math.Max(b.X0, 0), math.Min(b.X1, L)
		_, d0 := deckAt(hull, x0)
		_, d1 := deckAt(hull, x1)
		c.polygon([]float64{x0, x1, x1, x0}, []float64{b.Z0, b.Z0, math.Min(b.Z1, d1), math.Min(b.Z1, d0)}, inkSpace)
	}
	if p != nil {
		// The waterline along the side, in pieces so that it follows the
		// breadth of the deck.
		n := 2 * c.w
		prevX, prevZ := c.x0, waterAt(math.Max(c.x0, 0))
		for k := 1; k <= n; k++ {
			x := c.x0 + (c.x1-c.x0)*float64(k)/float64(n)
			z := waterAt(math.Min(math.Max(x, 0), L))
			if k%3 != 0 {
				c.line(prevX, prevZ, x, z, inkWater)
			}
			prevX, prevZ = x, z
		}
		for _, oc := range m.cur.Position.Openings {
			m.markOpening(c, oc, oc.X, oc.Z)
		}
	}
	return c
}
