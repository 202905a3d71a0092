package engine

import "testing"

// TestChainsAllocationFree checks that the chain method allocates nothing
// on sections of any size (it once kept the vertices' sides in a slice
// grown for sections over 256 vertices): hulls of 60 and 300 offsets per
// station, 120 and 600 vertices a section.
func TestChainsAllocationFree(t *testing.T) {
	for _, n := range []int{60, 300} {
		sol := convexTestHull(t, 5, n, 0).Solid()
		sl := &sol.slabs[1]
		p := Plane{A: 3, B: 0.01, C: 0.2}
		if got := testing.AllocsPerRun(20, func() { sl.below(p) }); got != 0 {
			t.Errorf("%d offsets: %v allocations per slab", n, got)
		}
		if got := testing.AllocsPerRun(20, func() { sol.Below(p) }); got != 0 {
			t.Errorf("%d offsets: %v allocations per solid", n, got)
		}
	}
}
