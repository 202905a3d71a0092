package engine

import (
	"math"
	"testing"
)

// TestBoundedLeastSquaresStaysInBounds: at an upper bound the Jacobian's
// step is turned inward; where the model has no answer there either, the
// fit must not try the other way past the bound (a permeability of 1.01
// reached the engine so, found by the diagnosis harness), but stop with
// what it has. Every x the model is asked about lies within [lo, hi].
func TestBoundedLeastSquaresStaysInBounds(t *testing.T) {
	lo, hi, h := []float64{0.5}, []float64{1}, []float64{0.01}
	res := func(x []float64) ([]float64, bool) {
		if x[0] < lo[0] || x[0] > hi[0] {
			t.Fatalf("the model was asked about x = %v, outside [%v, %v]", x[0], lo[0], hi[0])
		}
		if x[0] < 0.99 {
			return nil, false // no answer below 0.99: the ship does not float
		}
		return []float64{x[0] - 2}, true
	}
	x, r, ok := boundedLeastSquares([]float64{0.995}, lo, hi, h, 10, 0, res)
	if !ok || x[0] < lo[0] || x[0] > hi[0] || len(r) != 1 || math.IsNaN(r[0]) {
		t.Errorf("x %v r %v ok %v", x, r, ok)
	}
}
