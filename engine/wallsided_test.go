package engine_test

// The wall-sided formula on box barges, and beyond it the exact area of the
// clipped rectangle; heel from an off-centre weight, the angle of loll,
// sinking and capsizing.

import (
	"errors"
	"math"
	"testing"

	"heelwatch/engine"
)

const refDeg = math.Pi / 180

// refWallSidedGZ is the wall-sided formula GZ = sin θ (GM + ½ BM tan² θ)
// (Barrass & Derrett, Ship Stability for Masters and Mates, p.130; Tupper,
// Introduction to Naval Architecture), valid while the sides are vertical
// between the upright and the heeled waterline.
func refWallSidedGZ(gm, bm, heel float64) float64 {
	tn := math.Tan(heel)
	return math.Sin(heel) * (gm + bm*tn*tn/2)
}

// refRectangleBelow returns the area and centroid of the part of the
// rectangle −b ≤ y ≤ b, 0 ≤ z ≤ d below the line z = h + t·y, t > 0, in
// closed form (derived): with u = h + t·y and c(u) = min(max(u, 0), d) the
// depth of the section's immersed column at y,
//
//	area      = ∫ c dy         = [F0]/t
//	∫∫ y dA   = ∫ y c dy       = ([F1] − h[F0])/t²
//	∫∫ z dA   = ∫ c²/2 dy      = [F2]/t
//
// where [F] = F(h+tb) − F(h−tb) and F0, F1, F2 are the antiderivatives of
// c(u), u·c(u) and c(u)²/2, polynomials on u < 0, 0 ≤ u ≤ d and u > d.
func refRectangleBelow(b, d, h, t float64) (area, yc, zc float64) {
	f0 := func(u float64) float64 {
		switch {
		case u <= 0:
			return 0
		case u <= d:
			return u * u / 2
		}
		return d*d/2 + d*(u-d)
	}
	f1 := func(u float64) float64 {
		switch {
		case u <= 0:
			return 0
		case u <= d:
			return u * u * u / 3
		}
		return d*d*d/3 + d*(u*u-d*d)/2
	}
	f2 := func(u float64) float64 {
		switch {
		case u <= 0:
			return 0
		case u <= d:
			return u * u * u / 6
		}
		return d*d*d/6 + d*d*(u-d)/2
	}
	u0, u1 := h-t*b, h+t*b
	d0 := f0(u1) - f0(u0)
	area = d0 / t
	if area <= 0 {
		return 0, 0, 0
	}
	sy := (f1(u1) - f1(u0) - h*d0) / (t * t)
	sz := (f2(u1) - f2(u0)) / t
	return area, sy / area, sz / area
}

// refBoxGZExact returns the righting lever of a box barge of breadth B,
// depth D and level draft T with G on the centreline at height kg, heeled
// to heel > 0 at constant displacement: the heeled waterline is found by
// bisection on the exact immersed area B·T of the clipped rectangle, and
// GZ = (y_B − y_G) cos θ + (z_B − z_G) sin θ, the horizontal distance from
// G to the vertical through B (derived).
func refBoxGZExact(B, D, T, kg, heel float64) float64 {
	if heel == 0 {
		return 0 // upright, G and B on the centreline
	}
	t := math.Tan(heel)
	want := B * T
	lo, hi := -t*B/2, D+t*B/2
	for i := 0; i < 200 && hi-lo > 1e-15*(1+math.Abs(hi)); i++ {
		mid := (lo + hi) / 2
		if a, _, _ := refRectangleBelow(B/2, D, mid, t); a < want {
			lo = mid
		} else {
			hi = mid
		}
	}
	_, yb, zb := refRectangleBelow(B/2, D, (lo+hi)/2, t)
	return yb*math.Cos(heel) + (zb-kg)*math.Sin(heel)
}

// refBisect returns the first root of f on (a, b] found by scanning in
// steps of step and bisecting the first bracket; ok is false if none.
func refBisect(f func(float64) float64, a, b, step float64) (float64, bool) {
	x0, f0 := a, f(a)
	for x1 := a + step; x1 <= b+1e-15; x1 += step {
		f1 := f(x1)
		if (f0 < 0) != (f1 < 0) {
			lo, hi, flo := x0, x1, f0
			for i := 0; i < 200 && hi-lo > 1e-15; i++ {
				mid := (lo + hi) / 2
				if fm := f(mid); (fm < 0) == (flo < 0) {
					lo, flo = mid, fm
				} else {
					hi = mid
				}
			}
			return (lo + hi) / 2, true
		}
		x0, f0 = x1, f1
	}
	return 0, false
}

// refBarge is a box barge floating level at draft T with G at height KG on
// the centreline, amidships.
type refBarge struct {
	name       string
	L, B, D, T float64
	KG         float64
}

func (b refBarge) bm() float64   { return b.B * b.B / (12 * b.T) } // practice: box BM = B²/12T
func (b refBarge) gm() float64   { return b.T/2 + b.bm() - b.KG }  // practice: GM = KB + BM − KG
func (b refBarge) mass() float64 { return engine.SeaWaterDensity * b.L * b.B * b.T }

// wallSidedLimit is the heel at which the deck edge immerses or the bilge
// comes out, whichever is first: tan θ = min(D − T, T)/(B/2).
func (b refBarge) wallSidedLimit() float64 {
	return math.Atan(math.Min(b.D-b.T, b.T) / (b.B / 2))
}

func (b refBarge) vessel(t testing.TB, tcg float64) *engine.Vessel {
	return refBoxVessel(t, b.L, b.B, b.D, engine.Weight{Name: "load", MassT: b.mass(), LCGM: b.L / 2, TCGM: tcg, VCGM: b.KG})
}

var refBarges = []refBarge{
	{"80×16×8 at 4 m", 80, 16, 8, 4, 6},
	{"60×12×6 at 2 m, bilge first", 60, 12, 6, 2, 4.5},
	{"100×20×10 at 7 m, deck first", 100, 20, 10, 7, 8},
}

// TestWallSidedGZCurve compares the engine's righting lever at fixed heel
// (free trim, constant displacement) with the wall-sided formula until the
// deck edge immerses or the bilge emerges, and with the exact clipped
// rectangle beyond.
func TestWallSidedGZCurve(t *testing.T) {
	const tol = 1e-9 // m
	for _, b := range refBarges {
		v := b.vessel(t, 0)
		pr := engine.NewProblem(v, v.Intact())
		limit := b.wallSidedLimit()
		guess := engine.Plane{A: b.T}
		var worstWS, worstEx float64
		for deg := 0.0; deg <= 89; deg += 0.5 {
			heel := deg * refDeg
			p, gz, err := pr.AtHeel(heel, guess)
			if err != nil {
				t.Errorf("%s at %g°: %v", b.name, deg, err)
				continue
			}
			guess = p
			exact := refBoxGZExact(b.B, b.D, b.T, b.KG, heel)
			if e := math.Abs(gz - exact); !(e <= tol) {
				t.Errorf("%s at %g°: GZ %.12f m, exact clipped rectangle %.12f m", b.name, deg, gz, exact)
			} else {
				worstEx = math.Max(worstEx, e)
			}
			if heel <= limit {
				ws := refWallSidedGZ(b.gm(), b.bm(), heel) // Barrass & Derrett p.130; Tupper (found)
				if e := math.Abs(gz - ws); !(e <= tol) {
					t.Errorf("%s at %g°: GZ %.12f m, wall-sided %.12f m", b.name, deg, gz, ws)
				} else {
					worstWS = math.Max(worstWS, e)
				}
				// The reference itself: the exact rectangle equals the
				// wall-sided formula where the latter holds (derived).
				if e := math.Abs(exact - ws); !(e <= 1e-9) {
					t.Errorf("%s at %g°: the test's exact rectangle %.12f disagrees with the wall-sided formula %.12f", b.name, deg, exact, ws)
				}
				// Wall-sided: the waterline pivots on the centreline.
				if e := math.Abs(p.Z(b.L/2, 0) - b.T); e > 1e-9 {
					t.Errorf("%s at %g°: centreline draft %.12f, want %g", b.name, deg, p.Z(b.L/2, 0), b.T)
				}
			}
			if math.Abs(p.B) > 1e-12 {
				t.Errorf("%s at %g°: trimmed (B = %g), want level", b.name, deg, p.B)
			}
		}
		t.Logf("%s: GZ worst error %.2e m vs wall-sided (to %.2f°), %.2e m vs exact rectangle (0–89°)", b.name, worstWS, limit/refDeg, worstEx)
	}
}

// TestWallSidedHeelFromOffCentreWeight shifts the barge's G off the
// centreline by tcg and compares Solve's heel with the root of
// TCG·cos θ = GZ(θ), found by bisection on the wall-sided formula while it
// holds and on the exact clipped rectangle beyond it.
func TestWallSidedHeelFromOffCentreWeight(t *testing.T) {
	const tol = 1e-7 // degrees
	b := refBarges[0]
	limit := b.wallSidedLimit()
	cases := []struct {
		tcg       float64
		wallSided bool // the expected heel is within the wall-sided range
		side      float64
	}{
		{0.05, true, 1},
		{-0.2, true, -1},
		{0.8, true, 1},
		{0.95, true, 1},
		{-1.2, false, -1},
		{1.1, false, 1},
	}
	worst := 0.0
	for _, c := range cases {
		a := math.Abs(c.tcg)
		var want float64
		var ok bool
		if c.wallSided {
			// Barrass & Derrett p.130 (found): TCG cos θ = sin θ (GM + ½BM tan²θ).
			want, ok = refBisect(func(h float64) float64 { return refWallSidedGZ(b.gm(), b.bm(), h) - a*math.Cos(h) }, 0, limit, limit/50)
		} else {
			// Derived: the exact clipped rectangle.
			want, ok = refBisect(func(h float64) float64 { return refBoxGZExact(b.B, b.D, b.T, b.KG, h) - a*math.Cos(h) }, 0, 89*refDeg, 0.5*refDeg)
		}
		if !ok {
			t.Fatalf("tcg %g: the reference found no heel", c.tcg)
		}
		if c.wallSided != (want <= limit) {
			t.Fatalf("tcg %g: reference heel %.3f° is not on the side of the deck-edge heel %.3f° the case expects", c.tcg, want/refDeg, limit/refDeg)
		}
		want *= c.side
		pos, err := engine.Solve(b.vessel(t, c.tcg), nil)
		if err != nil {
			t.Errorf("tcg %g: %v", c.tcg, err)
			continue
		}
		e := math.Abs(pos.HeelDeg - want/refDeg)
		worst = math.Max(worst, e)
		if !(e <= tol) {
			t.Errorf("tcg %g: heel %.10f°, reference %.10f°", c.tcg, pos.HeelDeg, want/refDeg)
		}
		if c.wallSided {
			// GM at the heeled equilibrium is the slope of the righting
			// lever there: d/dθ [sin θ (GM + ½BM tan²θ) − TCG cos θ]
			// (derived from the wall-sided formula).
			th, tn := math.Abs(want), math.Tan(math.Abs(want))
			slope := math.Cos(th)*(b.gm()+b.bm()*tn*tn/2) + math.Sin(th)*b.bm()*tn/(math.Cos(th)*math.Cos(th)) + a*math.Sin(th)
			if e := math.Abs(pos.GMM - slope); !(e <= 1e-6) {
				t.Errorf("tcg %g: GM at %.3f° heel %.9f m, slope of the wall-sided lever %.9f m", c.tcg, pos.HeelDeg, pos.GMM, slope)
			}
		}
		if c.wallSided && math.Abs(pos.DraftMidM-b.T) > 1e-9 {
			t.Errorf("tcg %g: draft amidships %.12f, wall-sided pivot at %g", c.tcg, pos.DraftMidM, b.T)
		}
		if math.Abs(pos.TrimM) > 1e-9 {
			t.Errorf("tcg %g: trim %g, want none", c.tcg, pos.TrimM)
		}
	}
	t.Logf("heel from an off-centre weight: worst error %.2e°", worst)
}

// TestAngleOfLoll gives a box barge a small negative GM: it must lie at the
// angle of loll tan θ = √(−2GM/BM), the root of the wall-sided formula
// (Barrass & Derrett; practice), with a positive GM there of
// dGZ/dθ = −2GM/cos θ (derived by differentiating the wall-sided formula at
// the root).
func TestAngleOfLoll(t *testing.T) {
	cases := []struct {
		gm  float64 // initial GM, m (negative)
		tol float64 // degrees
	}{{-0.01, 1e-6}, {-0.05, 1e-6}, {-0.2, 1e-6}, {-0.6, 1e-6}}
	for _, c := range cases {
		b := refBarges[0]
		b.KG = b.T/2 + b.bm() - c.gm
		want := math.Atan(math.Sqrt(-2*c.gm/b.bm())) / refDeg // practice
		if want*refDeg > b.wallSidedLimit() {
			t.Fatalf("GM %g: loll %.2f° is beyond the wall-sided range", c.gm, want)
		}
		pos, err := engine.Solve(b.vessel(t, 0), nil)
		if err != nil {
			t.Errorf("GM %g: %v", c.gm, err)
			continue
		}
		if e := math.Abs(math.Abs(pos.HeelDeg) - want); e > c.tol {
			t.Errorf("GM %g: heel %.9f°, angle of loll %.9f°", c.gm, pos.HeelDeg, want)
		} else {
			t.Logf("GM %g: loll %.9f°, engine %.9f° (err %.1e°, %d iterations)", c.gm, want, pos.HeelDeg, e, pos.Iterations)
		}
		gmLoll := -2 * c.gm / math.Cos(want*refDeg) // derived
		if e := math.Abs(pos.GMM - gmLoll); e > 1e-6 {
			t.Errorf("GM %g: GM at loll %.9f m, derived %.9f m", c.gm, pos.GMM, gmLoll)
		}
	}
}

// TestNoEquilibriumOutcomes: a barge loaded beyond her buoyancy sinks; one
// with G far above the metacentre, so that GZ is negative at every heel on
// either side, capsizes; neither gives NaN.
func TestNoEquilibriumOutcomes(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	full := engine.SeaWaterDensity * L * B * D // practice: reserve buoyancy exhausted past ρLBD
	cases := []struct {
		name string
		w    engine.Weight
		want []engine.Outcome // acceptable outcomes; nil: must float
	}{
		{"just over full buoyancy", engine.Weight{MassT: full * 1.0001, LCGM: L / 2, VCGM: 4}, []engine.Outcome{engine.Sinks}},
		{"twice full buoyancy", engine.Weight{MassT: 2 * full, LCGM: L / 2, VCGM: 4}, []engine.Outcome{engine.Sinks}},
		{"G three depths up", engine.Weight{MassT: full / 2, LCGM: L / 2, VCGM: 3 * D}, []engine.Outcome{engine.Capsizes}},
		{"G ten depths up, off centre", engine.Weight{MassT: full / 3, LCGM: L / 2, TCGM: 1, VCGM: 10 * D}, []engine.Outcome{engine.Capsizes}},
		// G above KM by a metre and a half: no wall-sided loll (tan²θ would
		// be 2·1.5/5.33 > the deck-edge limit); she either lolls past the
		// deck edge or capsizes.
		{"G well above KM", engine.Weight{MassT: engine.SeaWaterDensity * L * B * 4, LCGM: L / 2, VCGM: 2 + 16.0/3 + 1.5}, []engine.Outcome{engine.Capsizes, 0}},
	}
	for _, c := range cases {
		v := refBoxVessel(t, L, B, D, c.w)
		pos, err := engine.Solve(v, nil)
		var ne *engine.NoEquilibrium
		got := engine.Outcome(0)
		if errors.As(err, &ne) {
			got = ne.Outcome
			if ne.Reason == "" {
				t.Errorf("%s: no reason given", c.name)
			}
		} else if err != nil {
			t.Errorf("%s: error %v is not a *NoEquilibrium", c.name, err)
			continue
		}
		okOutcome := false
		for _, w := range c.want {
			okOutcome = okOutcome || w == got
		}
		if !okOutcome {
			t.Errorf("%s: outcome %v (%v), want one of %v", c.name, got, err, c.want)
		}
		if err == nil {
			refCheckFinite(t, c.name, pos)
			if !(pos.GMM > 0) {
				t.Errorf("%s: floats at %.2f° with GM %.3f, not a stable position", c.name, pos.HeelDeg, pos.GMM)
			}
			t.Logf("%s: lolls at %.3f°", c.name, pos.HeelDeg)
		}
	}
}
