package engine

import "math"

// ShellDistance returns how far the point (x, y, z), in metres in the ship
// frame, lies from the hull's shell: the least distance, in the transverse
// section at x, to the section's outline without its deck (the edges that
// run along the top of the section). It is +Inf where the hull has no
// section at x. A hole in a compartment lets the sea in only where it is on
// the shell; a point a metre or more from it is on an inner bulkhead or
// tank top, which the sea reaches only through another space.
//
// Validity: the section is the hull's own (stations interpolated
// linearly), so a point read off the vessel file's offsets is within
// round-off of the shell.
func (h *Hull) ShellDistance(x, y, z float64) float64 {
	poly := h.SectionAt(x)
	if len(poly) < 3 {
		return math.Inf(1)
	}
	top := math.Inf(-1)
	for _, p := range poly {
		top = math.Max(top, p.Z)
	}
	const onDeck = 1e-9
	best := math.Inf(1)
	for k := range poly {
		a, b := poly[k], poly[(k+1)%len(poly)]
		if a.Z >= top-onDeck && b.Z >= top-onDeck {
			continue // the deck, not the shell
		}
		best = math.Min(best, segmentDistance(a, b, Point{Y: y, Z: z}))
	}
	return best
}

// segmentDistance is the distance from p to the segment ab in the (y, z)
// plane.
func segmentDistance(a, b, p Point) float64 {
	dy, dz := b.Y-a.Y, b.Z-a.Z
	t := 0.0
	if l2 := dy*dy + dz*dz; l2 > 0 {
		t = math.Max(0, math.Min(1, ((p.Y-a.Y)*dy+(p.Z-a.Z)*dz)/l2))
	}
	return math.Hypot(p.Y-(a.Y+t*dy), p.Z-(a.Z+t*dz))
}
