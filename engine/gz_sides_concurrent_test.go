package engine

import (
	"reflect"
	"testing"
)

// TestBothSidesBesideEqualsInTurn: the two sides of the curve worked on
// two goroutines (leversBothSides) are exactly the curves worked one after
// the other (RightingLevers, then withOtherSide), bit for bit, for a box
// barge (invented) lying 0.3°–4° to either side with G off the centreline.
func TestBothSidesBesideEqualsInTurn(t *testing.T) {
	h, err := NewBoxHull(60, 12, 6)
	if err != nil {
		t.Fatal(err)
	}
	for _, tcg := range []float64{0.02, -0.03, 0.05} {
		v, err := NewVessel(Vessel{Name: "box barge (invented)", Hull: h,
			Weights: []Weight{{Name: "all", MassT: 60 * 12 * 3 * SeaWaterDensity, LCGM: 30, TCGM: tcg, VCGM: 4.6}}})
		if err != nil {
			t.Fatal(err)
		}
		d := v.Intact()
		pos, err := NewProblem(v, d).Equilibrium()
		if err != nil {
			t.Fatal(err)
		}
		if h := pos.HeelDeg; h*h < 1e-6 || h*h > NearUprightDeg*NearUprightDeg {
			t.Fatalf("TCG %g: she lies at %.4f°, not near upright", tcg, h)
		}
		pr := NewProblem(v, d)
		want, err := RightingLevers(pr, pos)
		if err != nil {
			t.Fatal(err)
		}
		want = pr.withOtherSide(want, pos)
		got, err := NewProblem(v, d).leversBothSides(pos)
		if err != nil {
			t.Fatal(err)
		}
		if want.Other == nil || !reflect.DeepEqual(want, got) {
			t.Errorf("TCG %g (heel %.4f°): the sides worked beside each other differ from those worked in turn", tcg, pos.HeelDeg)
		}
	}
}
