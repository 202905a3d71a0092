package vessels

import (
	"math"

	"heelwatch/engine"
)

// This file reads a compartment given by its own outlines, station by
// station ([[compartment.section]] tables), instead of a box.

// sectionOutlines reads t's [[compartment.section]] tables: each an x and
// an outline of [y, z] pairs. It returns the sections, the box that holds
// them (for the checks a box gets) and whether all were read well; none
// (and true) when t has no sections.
func (r *reader) sectionOutlines(t *table) ([]engine.CompartmentSection, engine.Box, bool) {
	ts := t.entries("section", "a station of the compartment: x and outline")
	if len(ts) == 0 {
		return nil, engine.Box{}, true
	}
	ok := true
	for _, k := range []string{"x", "y", "z"} {
		if t.has(k) {
			r.addf(t.keyPath(k), "give either a box (x, y, z) or [[compartment.section]] outlines, not both")
			ok = false
		}
	}
	if len(ts) < 2 {
		r.addf(t.keyPath("section"), "has 1 section: give at least two, the compartment's aft and forward ends")
		ok = false
	}
	var out []engine.CompartmentSection
	box := engine.Box{X0: math.Inf(1), X1: math.Inf(-1), Y0: math.Inf(1), Y1: math.Inf(-1), Z0: math.Inf(1), Z1: math.Inf(-1)}
	for i, s := range ts {
		x, xOK := s.num("x", "m from the aft perpendicular", true)
		o, oOK := r.outline(s)
		s.finish()
		if !xOK || !oOK {
			ok = false
			continue
		}
		if i > 0 && len(out) > 0 && !(x > out[len(out)-1].X) {
			r.addf(s.keyPath("x"), "%g is not forward of the section before (x = %g): give the sections aft to forward", x, out[len(out)-1].X)
			ok = false
		}
		box.X0, box.X1 = math.Min(box.X0, x), math.Max(box.X1, x)
		for _, q := range o {
			box.Y0, box.Y1 = math.Min(box.Y0, q.Y), math.Max(box.Y1, q.Y)
			box.Z0, box.Z1 = math.Min(box.Z0, q.Z), math.Max(box.Z1, q.Z)
		}
		out = append(out, engine.CompartmentSection{X: x, Outline: o})
	}
	return out, box, ok
}

// outline reads a section's outline: a closed polygon of [y, z] pairs in
// metres, y to starboard.
func (r *reader) outline(s *table) ([]engine.Point, bool) {
	pts, ok := r.pointPairs(s, "outline", "y, z", "give the section's outline as [[y, z], …] around the space (y positive to starboard)")
	if pts == nil {
		return nil, false
	}
	out := make([]engine.Point, len(pts))
	for i, q := range pts {
		out[i] = q.Point
	}
	if ok && len(out) < 3 {
		r.addf(s.keyPath("outline"), "has %d point(s): an outline needs at least three [y, z] pairs", len(out))
		ok = false
	}
	return out, ok
}

// overlapM3 returns the volume two compartments share inside the hull:
// boxes by their common box, others by their outlines.
func overlapM3(h *engine.Hull, a, b *engine.Compartment) float64 {
	if a.Sections == nil && b.Sections == nil {
		return overlap(h, a.Box, b.Box)
	}
	return engine.OverlapM3(h, a, b)
}
