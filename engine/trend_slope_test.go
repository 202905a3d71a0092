package engine

import (
	"math"
	"testing"
)

// TestWeightedSlope: two points give the slope through them with error
// √(σ1² + σ2²)/Δt (propagation of independent errors, any statistics
// text); points on a line give its slope exactly, and scatter beyond the
// errors widens the error by √(χ²/dof).
func TestWeightedSlope(t *testing.T) {
	b, sb := weightedSlope([]float64{0, 10}, []float64{5, 25}, []float64{3, 4})
	if math.Abs(b-2) > 1e-12 || math.Abs(sb-5.0/10) > 1e-12 {
		t.Errorf("two points: %v ± %v, want 2 ± 0.5", b, sb)
	}
	b, sb = weightedSlope([]float64{0, 1, 2, 3}, []float64{1, 3, 5, 7}, []float64{1, 1, 1, 1})
	// σ_b = 1/√Σ(t−t̄)² = 1/√5 for unit errors.
	if math.Abs(b-2) > 1e-12 || math.Abs(sb-1/math.Sqrt(5)) > 1e-12 {
		t.Errorf("line: %v ± %v", b, sb)
	}
	_, wide := weightedSlope([]float64{0, 1, 2, 3}, []float64{1, 8, 0, 7}, []float64{1, 1, 1, 1})
	if !(wide > sb) {
		t.Errorf("scatter did not widen the error: %v", wide)
	}
}
