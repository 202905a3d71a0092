package engine_test

// The two GMs of issue 10: the upright GM of the condition (gm_m) and the
// GM where she lies, the slope of the GZ curve at her heel (gm_at_rest_m),
// checked on box barges against the wall-sided closed forms.

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// refWallSidedSlope is dGZ/dθ of the wall-sided curve of a box with G off
// the centreline by y: GZ(θ) = sin θ (GM + ½ BM tan² θ) − y cos θ (Barrass
// & Derrett, Ship Stability for Masters and Mates, p.130, with the
// off-centre weight's lever y cos θ), differentiated:
// cos θ (GM + ½ BM t²) + sin θ · BM t sec² θ + y sin θ, t = tan θ.
func refWallSidedSlope(gm, bm, y, th float64) float64 {
	tn := math.Tan(th)
	return math.Cos(th)*(gm+bm*tn*tn/2) + math.Sin(th)*bm*tn/(math.Cos(th)*math.Cos(th)) + y*math.Sin(th)
}

// refWallSidedHeel solves tan θ (GM + ½ BM tan² θ) = y for the heel of a
// box with G off the centreline by y > 0 (the wall-sided equilibrium), by
// bisection on tan θ in [0, 10].
func refWallSidedHeel(gm, bm, y float64) float64 {
	lo, hi := 0.0, 10.0
	for i := 0; i < 200; i++ {
		m := (lo + hi) / 2
		if m*(gm+bm*m*m/2) < y {
			lo = m
		} else {
			hi = m
		}
	}
	return math.Atan((lo + hi) / 2)
}

// TestGMUprightAndAtRestOnHeeledBox: intact boxes with an off-centre G.
// The upright GM is KB + BM − KG = T/2 + B²/(12T) − KG (box closed forms,
// practice), whatever the heel; the GM at rest is the wall-sided curve's
// slope at the heel where she lies. Both to 5 mm (the tolerance;
// the box is exact, so much closer in fact).
func TestGMUprightAndAtRestOnHeeledBox(t *testing.T) {
	const L, B, D, T = 80.0, 16.0, 8.0, 4.0
	bm := B * B / (12 * T)
	for _, c := range []struct{ kg, tcg float64 }{
		{5.0, 0.10}, {5.0, 0.40}, {6.5, 0.05}, {7.0, 0.02},
	} {
		gm := T/2 + bm - c.kg
		v := refBoxVessel(t, L, B, D, engine.Weight{Name: "all", MassT: engine.SeaWaterDensity * L * B * T, LCGM: L / 2, TCGM: c.tcg, VCGM: c.kg})
		a := engine.Assess(v, v.Intact())
		if a.Position == nil {
			t.Fatalf("KG %.2f TCG %.2f: no equilibrium", c.kg, c.tcg)
		}
		p := a.Position
		th := refWallSidedHeel(gm, bm, c.tcg)
		if p.DeckEdge.HeightM < 0 {
			t.Fatalf("deck edge immersed: outside the wall-sided formula")
		}
		if d := math.Abs(p.HeelDeg - th/refDeg); d > 1e-6 {
			t.Errorf("KG %.2f TCG %.2f: heel %.6f°, wall-sided %.6f°", c.kg, c.tcg, p.HeelDeg, th/refDeg)
		}
		if d := math.Abs(p.GMUprightM - gm); d > 0.005 {
			t.Errorf("KG %.2f TCG %.2f: upright GM %.4f m, closed form %.4f m", c.kg, c.tcg, p.GMUprightM, gm)
		}
		if a.UprightGMM == nil || *a.UprightGMM != p.GMUprightM {
			t.Errorf("KG %.2f TCG %.2f: Assessment.UprightGMM differs from the position's", c.kg, c.tcg)
		}
		want := refWallSidedSlope(gm, bm, c.tcg, th)
		if d := math.Abs(p.GMAtRestM - want); d > 0.005 {
			t.Errorf("KG %.2f TCG %.2f: GM at rest %.4f m, wall-sided slope %.4f m", c.kg, c.tcg, p.GMAtRestM, want)
		}
		// And the slope is the GZ curve's own, by a central difference of
		// solved levers at ±0.01° about the equilibrium (practice).
		pr := engine.NewProblem(v, v.Intact())
		h := 0.01 * refDeg
		_, g1, err1 := pr.AtHeel(th+h, p.Plane)
		_, g0, err0 := pr.AtHeel(th-h, p.Plane)
		if err0 != nil || err1 != nil {
			t.Fatal(err0, err1)
		}
		if d := math.Abs((g1-g0)/(2*h) - p.GMAtRestM); d > 1e-4 {
			t.Errorf("KG %.2f TCG %.2f: GM at rest %.5f m, curve's slope %.5f m", c.kg, c.tcg, p.GMAtRestM, (g1-g0)/(2*h))
		}
		t.Logf("KG %.2f TCG %.2f: heel %.3f°, upright GM %.4f (closed %.4f), at rest %.4f (closed %.4f)", c.kg, c.tcg, p.HeelDeg, p.GMUprightM, gm, p.GMAtRestM, want)
	}
}

// TestLollAngleAndUprightGM: a box with G above M lolls at
// tan θ = √(−2 GM / BM) (Barrass & Derrett, Ship Stability for Masters and
// Mates, the angle of loll, wall-sided); the upright GM shown is the
// negative GM₀, and the GM at rest is positive: the wall-sided slope
// cos θ (GM + ½ BM t²) + sin θ BM t sec² θ is −2 GM₀ / cos θ there, since
// GM + ½ BM t² = 0 at the loll.
func TestLollAngleAndUprightGM(t *testing.T) {
	const L, B, D, T = 80.0, 16.0, 8.0, 4.0
	bm := B * B / (12 * T)
	for _, gm := range []float64{-0.05, -0.2} {
		kg := T/2 + bm - gm
		v := refBoxVessel(t, L, B, D, engine.Weight{Name: "all", MassT: engine.SeaWaterDensity * L * B * T, LCGM: L / 2, VCGM: kg})
		a := engine.Assess(v, v.Intact())
		p := a.Position
		if p == nil {
			t.Fatalf("GM %.2f: no equilibrium", gm)
		}
		want := engine.LollAngleDeg(gm, bm)
		if d := math.Abs(math.Abs(p.HeelDeg) - want); d > 1e-6 {
			t.Errorf("GM %.2f: loll %.5f°, Barrass & Derrett %.5f°", gm, p.HeelDeg, want)
		}
		if math.Abs(p.GMUprightM-gm) > 0.005 || !p.IsLoll() {
			t.Errorf("GM %.2f: upright GM %.4f, loll %v", gm, p.GMUprightM, p.IsLoll())
		}
		th := want * refDeg
		if slope := -2 * gm / math.Cos(th); math.Abs(p.GMAtRestM-slope) > 0.005 {
			t.Errorf("GM %.2f: GM at rest %.4f m, wall-sided %.4f m", gm, p.GMAtRestM, slope)
		}
	}
}
