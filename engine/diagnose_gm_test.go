package engine_test

import (
	"math"
	"math/rand"
	"testing"

	"heelwatch/engine"
)

// TestDiagnoseUprightGM: every explanation carries the upright GM (the GM
// the reports and the JSON's gm_m show), not NaN. For the freighter's
// wing tank open to the sea, the best explanation holds the sea's water in
// it as an added weight; on the ship's own weight its upright GM is the
// lost-buoyancy solve's (the two methods give the same righting moment:
// Barrass & Derrett, bilging), to the fit's few millimetres.
func TestDiagnoseUprightGM(t *testing.T) {
	v, d := refBundledDamaged(t, "Wing tank 2 S")
	pos, err := engine.Solve(v, d)
	if err != nil {
		t.Fatal(err)
	}
	r := crewReading(v, pos, 0, rand.New(rand.NewSource(3)))
	dg, err := engine.Diagnose(v, []engine.Reading{r}, engine.DiagnoseOptions{})
	if err != nil {
		t.Fatal(err)
	}
	for i, e := range dg.Explanations {
		if e.Position == nil || math.IsNaN(e.Position.GMUprightM) {
			t.Errorf("explanation %d (%s): no upright GM", i+1, e.Names(v))
		}
	}
	if best := dg.Explanations[0]; math.Abs(best.Position.GMUprightM-pos.GMUprightM) > 0.02 {
		t.Errorf("best %s: upright GM %.3f m; the lost-buoyancy solve gives %.3f m", best.Names(v), best.Position.GMUprightM, pos.GMUprightM)
	}
}
