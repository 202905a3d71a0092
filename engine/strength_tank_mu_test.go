package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// A tank's contents are μ × the space below their level (conventions: a
// tank's capacity is μ × its volume). The same tank, half full of fresh
// water at μ = 0.95, is then the block load of TestStrengthTankContentsAsBlock
// with m_t = 0.95 × 0.5 × 16 × 16 × 8 m³ × 1.000 t/m³ = 972.8 t; her weight
// and buoyancy balance, so the curves close at the ends to round-off
// (Tupper ch. 7: SF and BM are zero at both ends of a free-floating beam),
// and amidships BM(L/2) = −(m_t·g/4)(L/2 − a) (closed form derived in
// strength_test.go).
func TestStrengthTankContentsTakeMu(t *testing.T) {
	const a, mu = 8.0, 0.95
	h, err := engine.NewBoxHull(strL, strB, strD)
	if err != nil {
		t.Fatal(err)
	}
	c, err := engine.NewCompartment(h, "tank", engine.Box{X0: 40 - a, X1: 40 + a, Y0: -8, Y1: 8, Z0: 0, Z1: 8})
	if err != nil {
		t.Fatal(err)
	}
	c.Use, c.Permeability = "tank", mu
	c.Liquid = &engine.Liquid{Name: "fresh water", Density: 1, Fill: 0.5}
	v, err := engine.NewVessel(engine.Vessel{Name: "tank barge", Hull: h, Compartments: []*engine.Compartment{c},
		Weights: []engine.Weight{{Name: "lightship", MassT: 1100, LCGM: 40, VCGM: 4.2, ExtentM: [2]float64{0, 80}}}})
	if err != nil {
		t.Fatal(err)
	}
	s, _ := strAssess(t, v, v.Intact())
	mt := mu * 0.5 * 16 * 16 * 8.0
	g := engine.StandardGravity
	if tol := 1e-9 * (1100 + mt) * g; math.Abs(s.ClosingShearKN) > tol || math.Abs(s.ClosingMomentKNm) > tol*strL {
		t.Errorf("closing %g kN, %g kN·m; want round-off (weight and buoyancy balance)", s.ClosingShearKN, s.ClosingMomentKNm)
	}
	want := -(mt * g / 4) * (strL/2 - a)
	for i, x := range s.XM {
		if x == 40 && math.Abs(s.MomentKNm[i]-want) > 1e-9*math.Abs(want) {
			t.Errorf("BM amidships %g kN·m, closed form %g", s.MomentKNm[i], want)
		}
	}
}
