package tui

import (
	"math"

	"heelwatch/engine"
)

// This file draws a compartment given by outlines ([[compartment.section]])
// in the profile by its own extent along the ship and up, where its box
// would show a hopper or a raked peak as a rectangle.

// outlineSpan returns the lowest and highest z of compartment comp's
// section at x and the middle of its breadth there, all in metres in the
// ship frame. The section is the engine's own (engine.Solid.SectionAt):
// the outline at x as the engine interpolates it between the outline
// stations, clipped by the hull, so the picture shows the space whose
// volume the figures use. ok is false where the compartment does not
// reach x.
func outlineSpan(comp *engine.Compartment, x float64) (zlo, zhi, ymid float64, ok bool) {
	pts := comp.Solid().SectionAt(x)
	if len(pts) < 3 {
		return 0, 0, 0, false
	}
	zlo, zhi = math.Inf(1), math.Inf(-1)
	ylo, yhi := math.Inf(1), math.Inf(-1)
	for _, q := range pts {
		zlo, zhi = math.Min(zlo, q.Z), math.Max(zhi, q.Z)
		ylo, yhi = math.Min(ylo, q.Y), math.Max(yhi, q.Y)
	}
	if !(zhi > zlo) || !finite(zlo, zhi, ylo, yhi) {
		return 0, 0, 0, false
	}
	return zlo, zhi, (ylo + yhi) / 2, true
}

// shadeOutlineProfile shades, column by column, the cells of compartment
// comp whose centre lies between the bottom and the top of its section at
// that x and below surface at the middle of its breadth there: the rule
// the profile uses for a box, with the box's sides replaced by the
// section's.
func shadeOutlineProfile(c *canvas, comp *engine.Compartment, surface *engine.Plane) {
	for cx := 0; cx < c.w; cx++ {
		x := c.worldX(cx)
		zlo, zhi, ym, ok := outlineSpan(comp, x)
		if !ok {
			continue
		}
		wl := surface.Z(x, ym)
		for cy := 0; cy < c.h; cy++ {
			z := c.worldY(cy)
			if z >= zlo && z <= zhi && z < wl {
				c.fillCell(cx, cy, floodShade, inkFlood)
			}
		}
	}
}

// outlineProfile draws the side view of compartment comp: the top and the
// bottom of its section sampled at every dot across its length (and at
// its ends), closed by upright lines where it starts and ends (also where
// it leaves off and starts again).
func outlineProfile(c *canvas, comp *engine.Compartment, k ink) {
	xmin, xmax, _, _ := comp.Solid().Extent()
	if !finite(xmin, xmax) || !(xmax > xmin) {
		return
	}
	dotW := (c.x1 - c.x0) / float64(2*c.w)
	n := int(math.Ceil((xmax - xmin) / dotW))
	n = min(max(n, 1), 8*c.w)
	var px, plo, phi float64
	prev := false
	for i := 0; i <= n; i++ {
		x := xmin + (xmax-xmin)*float64(i)/float64(n)
		zlo, zhi, _, ok := outlineSpan(comp, x)
		switch {
		case ok && prev:
			c.line(px, plo, x, zlo, k)
			c.line(px, phi, x, zhi, k)
		case ok:
			c.line(x, zlo, x, zhi, k)
		case prev:
			c.line(px, plo, px, phi, k)
		}
		if ok && i == n {
			c.line(x, zlo, x, zhi, k)
		}
		px, plo, phi, prev = x, zlo, zhi, ok
	}
}
