package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// A box hull's shell is its sides and bottom: the distance from a point
// inside to it is the least of B/2 − |y| and z (closed form, plain
// geometry); the deck is not shell.
func TestShellDistanceBox(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct{ y, z, want float64 }{
		{8, 3, 0},       // on the starboard side
		{-8, 3, 0},      // on the port side
		{2, 0, 0},       // on the bottom
		{5.7, 3, 2.3},   // a longitudinal bulkhead 2.3 m inboard
		{0, 7.9, 7.9},   // just under the deck on the centreline: the deck is not shell
		{7.5, 0.2, 0.2}, // near the bilge: nearer the bottom
	} {
		if got := h.ShellDistance(40, c.y, c.z); math.Abs(got-c.want) > 1e-9 {
			t.Errorf("ShellDistance(40, %g, %g) = %g, want %g", c.y, c.z, got, c.want)
		}
	}
	if got := h.ShellDistance(120, 0, 1); !math.IsInf(got, 1) {
		t.Errorf("beyond the hull's length: %g, want +Inf", got)
	}
}

// The volume no compartment holds is the hull's L·B·D less the boxes'
// volumes (closed form, plain geometry).
func TestUnheldVolumeBox(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	var cs []*engine.Compartment
	for _, b := range []engine.Box{
		{X0: 0, X1: 40, Y0: -8, Y1: 8, Z0: 0, Z1: 8},  // 5120 m³
		{X0: 40, X1: 80, Y0: -8, Y1: 8, Z0: 0, Z1: 6}, // 3840 m³: its top 2 m short of the deck
	} {
		c, err := engine.NewCompartment(h, "c", b)
		if err != nil {
			t.Fatal(err)
		}
		cs = append(cs, c)
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "box", Hull: h, WaterDensity: 1.025, Compartments: cs,
		Weights: []engine.Weight{{Name: "all", MassT: 4000, LCGM: 40, VCGM: 4}}})
	if err != nil {
		t.Fatal(err)
	}
	hull, unheld := engine.UnheldVolume(v)
	if math.Abs(hull-10240) > 1e-6 || math.Abs(unheld-1280) > 1e-6 {
		t.Errorf("hull %.3f m³, unheld %.3f m³; want 10240 and 1280 (80 × 16 × 2)", hull, unheld)
	}
}

func TestSameName(t *testing.T) {
	if !engine.SameName("Hold 2", "hold 2") || !engine.SameName(" HOLD 2", "Hold 2") || engine.SameName("Hold 2", "Hold 1") {
		t.Error("SameName does not match names ignoring case and surrounding spaces only")
	}
}
