package engine

import "math"

// Neighbours returns, for each compartment of v, the compartments that
// share a boundary with it: their boxes touch on a face (they meet in one
// axis and overlap over an area in the other two). A bulkhead or a deck
// between two spaces is where water most often finds its way next, so
// these are the plausible companions of a flooded space. Sorted ascending.
func Neighbours(v *Vessel) [][]int {
	const tol = 1e-6
	n := len(v.Compartments)
	out := make([][]int, n)
	overlap := func(a0, a1, b0, b1 float64) bool { return math.Min(a1, b1)-math.Max(a0, b0) > tol }
	touch := func(a0, a1, b0, b1 float64) bool { return math.Abs(a1-b0) <= tol || math.Abs(b1-a0) <= tol }
	for i := 0; i < n; i++ {
		a := v.Compartments[i].Box
		for j := 0; j < n; j++ {
			if i == j {
				continue
			}
			b := v.Compartments[j].Box
			ox, oy, oz := overlap(a.X0, a.X1, b.X0, b.X1), overlap(a.Y0, a.Y1, b.Y0, b.Y1), overlap(a.Z0, a.Z1, b.Z0, b.Z1)
			tx, ty, tz := touch(a.X0, a.X1, b.X0, b.X1), touch(a.Y0, a.Y1, b.Y0, b.Y1), touch(a.Z0, a.Z1, b.Z0, b.Z1)
			if (tx && oy && oz) || (ty && ox && oz) || (tz && ox && oy) {
				out[i] = append(out[i], j)
			}
		}
	}
	return out
}
