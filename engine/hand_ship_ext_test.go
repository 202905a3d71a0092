package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestHandShipAgreesWithDirect: on the bundled freighter (an invented demo
// ship) with small damage, the ship's hand working (her own hydrostatics
// at the draft, the lost waterplane's own inertia) agrees with the direct
// solution within the MSC.1/Circ.1229 tolerances (references.md: drafts
// and GM 1 % / 5 cm, found (secondary); equilibrium angles ±1°, found
// (secondary)); and with a wing tank open the hand working is there.
func TestHandShipAgreesWithDirect(t *testing.T) {
	for _, open := range [][]string{{"Wing tank 2 S"}, {"DB 2 S"}, {"Hopper 2 S"}, {"Fuel oil tank P"}, {"DB 1 P", "Hopper 2 P"}} {
		v, d := refBundledDamaged(t, open...)
		a := engine.Assess(v, d)
		if a.Hand == nil || a.Position == nil {
			t.Fatalf("%v: hand %v (%s), position %v", open, a.Hand, a.HandWhy, a.Position)
		}
		hw, p := a.Hand, a.Position
		tol := func(ref, pct, capM float64) float64 { return math.Min(pct/100*math.Abs(ref), capM) }
		for _, q := range []struct {
			name         string
			hand, direct float64
			tolerance    float64
		}{
			{"draft aft", hw.DraftAftM, p.DraftAftM, tol(p.DraftAftM, 1, 0.05)},
			{"draft fwd", hw.DraftFwdM, p.DraftFwdM, tol(p.DraftFwdM, 1, 0.05)},
			{"heel", hw.HeelDeg, p.HeelDeg, 1},
			{"GM", hw.GMM, *a.UprightGMM, tol(*a.UprightGMM, 1, 0.05)},
		} {
			if math.Abs(q.hand-q.direct) > q.tolerance {
				t.Errorf("%v: %s hand %.4f, direct %.4f (tolerance %.4f)", open, q.name, q.hand, q.direct, q.tolerance)
			}
		}
	}
	// A hull from offsets that is a box gives the box's own working.
	sv, _, err := vessels.Parse("box.toml", []byte(`format = 1
name = "Box from offsets"
[hull]
shape = "sections"
length = 60.0
[[hull.section]]
x = 0.0
offsets = [[0.0, 0.0], [6.0, 0.0], [6.0, 6.0]]
[[hull.section]]
x = 60.0
offsets = [[0.0, 0.0], [6.0, 0.0], [6.0, 6.0]]
[[weight]]
name = "all"
mass = 2214.0
lcg = 30.0
vcg = 4.0
[[compartment]]
name = "wing"
use = "void"
permeability = 1.0
x = [20.0, 40.0]
y = [2.0, 6.0]
z = [0.0, 6.0]
`))
	if err != nil {
		t.Fatal(err)
	}
	d := sv.Intact()
	d[0].Open = true
	hw, err := engine.HandMethod(sv, d)
	if err != nil {
		t.Fatal(err)
	}
	// Box closed forms: T0 = 2214/1.025/(60·12) = 3 m, v = 20·4·3, s = v/(720 − 80).
	if want := 20.0 * 4 * 3 / (720 - 80); math.Abs(hw.SinkageM-want) > 1e-9 {
		t.Errorf("sinkage %.12f, box closed form %.12f", hw.SinkageM, want)
	}
}
