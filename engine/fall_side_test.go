package engine_test

import (
	"testing"

	"heelwatch/engine"
)

// TestSymmetricLollTakesStarboard: a box barge 40 × 10 × 4 m, KG 2.5 m,
// 800 t, wholly one compartment holding water W (added weight). The
// condition is symmetric about the centreline, so the lever upright is
// zero but for round-off, whose sign changes with W. With little water
// (the water's own shift is small) she floats upright; with enough for
// the free surface to make GM negative (box: KB + BM − KG − FSC,
// FSC = b³l/12 / ∇ = 4.27 m at full breadth: Barrass & Derrett, free
// surface chapter) she lolls — always to starboard, the side heelwatch
// takes when nothing chooses one, never to the side round-off picks.
func TestSymmetricLollTakesStarboard(t *testing.T) {
	h, err := engine.NewBoxHull(40, 10, 4)
	if err != nil {
		t.Fatal(err)
	}
	whole, err := engine.NewCompartment(h, "Whole hull", engine.Box{X0: 0, X1: 40, Y0: -5, Y1: 5, Z0: 0, Z1: 4})
	if err != nil {
		t.Fatal(err)
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "symmetric barge (invented)", Hull: h,
		Weights: []engine.Weight{{Name: "all", MassT: 800, LCGM: 20, VCGM: 2.5}}, Compartments: []*engine.Compartment{whole}})
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range []float64{1.6e-6, 0.01, 0.1, 1, 5} {
		d := v.Intact()
		d[0].WaterM3 = w
		p, err := engine.Solve(v, d)
		if err != nil {
			t.Errorf("W = %g m³: %v, want upright", w, err)
			continue
		}
		if p.HeelDeg < -1e-6 || p.HeelDeg > 1e-6 {
			t.Errorf("W = %g m³: heel %g°, want upright", w, p.HeelDeg)
		}
	}
	for _, w := range []float64{20, 87, 175, 262} {
		d := v.Intact()
		d[0].WaterM3 = w
		p, err := engine.Solve(v, d)
		if err != nil {
			t.Errorf("W = %g m³: %v", w, err)
			continue
		}
		if !(p.HeelDeg > 0.5) {
			t.Errorf("W = %g m³: heel %g°, want a loll to starboard", w, p.HeelDeg)
		}
	}
}
