package engine

import (
	"fmt"
	"math"
)

// This file places a hole in a compartment's shell (ShellHole), for a
// flooding case given by its area and height only.

// ShellHole returns a hole of area areaM2 in the shell of compartment ci of
// v: at the middle of the compartment's length, on its outboard side
// (starboard for a compartment that straddles the centreline), at height
// zM; NaN for zM puts it at the compartment's lowest point (the worst
// case: the full head until the levels meet). A height outside the
// compartment is taken to its nearest bound.
func ShellHole(v *Vessel, ci int, areaM2, zM, cd float64) (Hole, error) {
	if v == nil || ci < 0 || ci >= len(v.Compartments) {
		return Hole{}, fmt.Errorf("flooding: no compartment %d", ci)
	}
	c := v.Compartments[ci]
	xmin, xmax, _, _ := c.solid.Extent()
	x := (xmin + xmax) / 2
	poly := c.solid.SectionAt(x)
	if len(poly) < 3 {
		return Hole{}, fmt.Errorf("flooding %q: no section at x %.2f m", c.Name, x)
	}
	side := 1.0
	if mid := (c.Box.Y0 + c.Box.Y1) / 2; mid < -1e-9 {
		side = -1
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, p := range poly {
		lo, hi = math.Min(lo, p.Z), math.Max(hi, p.Z)
	}
	if math.IsNaN(zM) {
		zM = lo
	}
	if math.IsInf(zM, 0) {
		return Hole{}, fmt.Errorf("flooding %q: hole height %v is not finite", c.Name, zM)
	}
	if zM < lo-1e-6 || zM > hi+1e-6 {
		return Hole{}, fmt.Errorf("flooding %q: a hole at height %.2f m is outside the compartment, which runs from z %.2f to %.2f m at mid-length", c.Name, zM, lo, hi)
	}
	zM = math.Max(lo, math.Min(hi, zM))
	// The outboard-most point of the section at that height: crossings of
	// the horizontal line with the edges, and vertices lying on it.
	best := math.Inf(-1)
	for k := range poly {
		a, b := poly[k], poly[(k+1)%len(poly)]
		var y float64
		switch {
		case a.Z == zM:
			y = a.Y
		case (a.Z < zM) != (b.Z < zM):
			y = a.Y + (zM-a.Z)/(b.Z-a.Z)*(b.Y-a.Y)
		default:
			continue
		}
		best = math.Max(best, side*y)
	}
	if math.IsInf(best, -1) {
		return Hole{}, fmt.Errorf("flooding %q: no shell at z %.2f m", c.Name, zM)
	}
	return Hole{AreaM2: areaM2, XM: x, YM: side * best, ZM: zM, Cd: cd}, nil
}
