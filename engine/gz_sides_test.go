package engine_test

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// TestTinyShiftSwingsNoVerdict: a box barge with a vent low on the port
// side and one high on the starboard side, G a hair off the centreline
// either way (25 t moved by 1 cm on a 1850 t barge is 0.14 mm of TCG; here
// ±0.2 mm). Judged only towards the side she lies, the downflooding angle
// would jump from the starboard vent's to the port vent's with the sign of
// that hair, and with it the IS Code areas read to downflooding. Within
// NearUprightDeg both sides are judged and each criterion takes the worse,
// so both loadings get the same verdicts and, to a few 1e-4 of their
// value, the same figures (practice: the worse side governs near upright).
func TestTinyShiftSwingsNoVerdict(t *testing.T) {
	h, err := engine.NewBoxHull(60, 12, 6)
	if err != nil {
		t.Fatal(err)
	}
	ops := []engine.Opening{
		{Name: "vent P", Kind: "vent", X: 30, Y: -6, Z: 7.0}, // immerses near atan(4/6) = 33.7°
		{Name: "vent S", Kind: "vent", X: 30, Y: 6, Z: 9.5},  // near atan(6.5/6) = 47.3°
	}
	var got [2][]engine.CriterionResult
	for k, tcg := range []float64{2e-4, -2e-4} {
		v, err := engine.NewVessel(engine.Vessel{Name: "two-vent barge (invented)", Hull: h, Openings: ops,
			CriteriaSets: []string{"is-code-2008"},
			Weights:      []engine.Weight{{Name: "all", MassT: 60 * 12 * 3 * engine.SeaWaterDensity, LCGM: 30, TCGM: tcg, VCGM: 4.6}}})
		if err != nil {
			t.Fatal(err)
		}
		a := engine.Assess(v, v.Intact())
		if a.GZ == nil || a.GZ.Other == nil {
			t.Fatalf("TCG %g: no curve to the other side (heel %.4f°)", tcg, a.Position.HeelDeg)
		}
		got[k] = a.Criteria
		for _, c := range a.Criteria {
			t.Logf("TCG %+g heel %+.4f°: %-14s %8.4f %v %s", tcg, a.Position.HeelDeg, c.Code, c.Actual, c.Pass, c.Note)
		}
	}
	if len(got[0]) != len(got[1]) || len(got[0]) == 0 {
		t.Fatalf("criteria %d and %d", len(got[0]), len(got[1]))
	}
	sawPort := false
	for i := range got[0] {
		a, b := got[0][i], got[1][i]
		if a.Pass != b.Pass || math.Abs(a.Actual-b.Actual) > 5e-4*math.Max(1, math.Abs(a.Actual)) {
			t.Errorf("%s: %.5f (%v) with G a hair to starboard, %.5f (%v) to port", a.Code, a.Actual, a.Pass, b.Actual, b.Pass)
		}
		sawPort = sawPort || strings.Contains(a.Note, "heeling to port")
	}
	if !sawPort {
		t.Error("with G a hair to starboard no criterion was judged heeling to port, the side of the low vent")
	}
}
