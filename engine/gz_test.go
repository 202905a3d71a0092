package engine_test

// Tests of the righting-lever curve: the wall-sided formula on a box, an
// exact clipped-rectangle computation beyond it, areas against gonum's
// integration, lost buoyancy against the equivalent intact box, the
// deck-edge and downflooding angles, and convergence on a hull from offsets.

import (
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate"

	"heelwatch/engine"
	"heelwatch/vessels"
)

const gzRho = 1.025 // sea water, t/m³ (Barrass & Derrett p.130: found)

// gzBox returns a box vessel of draft T (level, LCG amidships unless lcg is
// given) with G at (lcg, tcg, kg), and its problem under d.
func gzBox(t testing.TB, L, B, D, T, tcg, kg float64, comps []engine.Box, mu []float64, open []engine.Opening) *engine.Vessel {
	t.Helper()
	h, err := engine.NewBoxHull(L, B, D)
	if err != nil {
		t.Fatal(err)
	}
	var cs []*engine.Compartment
	for i, b := range comps {
		c, err := engine.NewCompartment(h, fmt.Sprintf("space %d", i+1), b)
		if err != nil {
			t.Fatal(err)
		}
		c.Permeability = mu[i]
		cs = append(cs, c)
	}
	w := engine.Weight{Name: "box load", MassT: gzRho * L * B * T, LCGM: L / 2, TCGM: tcg, VCGM: kg}
	return gzVessel(t, h, []engine.Weight{w}, cs, open)
}

func gzVessel(t testing.TB, h *engine.Hull, w []engine.Weight, comps []*engine.Compartment, open []engine.Opening) *engine.Vessel {
	t.Helper()
	v, err := engine.NewVessel(engine.Vessel{Name: "test", Hull: h, WaterDensity: gzRho, Weights: w, Compartments: comps, Openings: open})
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// gzCurve solves v under d and returns its position and curve.
func gzCurve(t testing.TB, v *engine.Vessel, d engine.Damage) (engine.Position, *engine.GZCurve) {
	t.Helper()
	pr := engine.NewProblem(v, d)
	eq, err := pr.Equilibrium()
	if err != nil {
		t.Fatal(err)
	}
	c, err := engine.RightingLevers(pr, eq)
	if err != nil {
		t.Fatal(err)
	}
	if len(c.HeelDeg) != len(c.GZM) || c.HeelDeg[0] != 0 {
		t.Fatalf("curve malformed: %d heels, %d levers, first %v", len(c.HeelDeg), len(c.GZM), c.HeelDeg[0])
	}
	for i := 1; i < len(c.HeelDeg); i++ {
		if st := c.HeelDeg[i] - c.HeelDeg[i-1]; !(st > 0 && st <= 1+1e-12) {
			t.Fatalf("step %v° at %v°: steps must be positive and at most 1°", st, c.HeelDeg[i])
		}
	}
	return eq, c
}

// gzRefSection is an exact, independent computation of a box's righting
// lever at heel θ (radians, positive starboard down) at zero trim: the
// rectangle [−B/2, B/2] × [0, D] is clipped by the waterline
// −y sin θ + z cos θ < d (Sutherland–Hodgman on four corners), d found by
// bisection so that the immersed area is B·T (the volume per metre of a
// prismatic body at zero trim, which is the free-trim attitude of a box
// with G amidships), and the centroid (yB, zB) of the clipped polygon comes
// from the shoelace formulas (practice). GZ = (yB − yG) cos θ + (zB − zG)
// sin θ, the horizontal distance from G to the vertical through B.
func gzRefSection(B, D, T, yG, zG, theta float64) float64 {
	s, c := math.Sin(theta), math.Cos(theta)
	corners := [][2]float64{{-B / 2, 0}, {B / 2, 0}, {B / 2, D}, {-B / 2, D}}
	clip := func(d float64) (area, cy, cz float64) {
		f := func(p [2]float64) float64 { return -p[0]*s + p[1]*c - d }
		var poly [][2]float64
		for i := range corners {
			a, b := corners[(i+3)%4], corners[i]
			fa, fb := f(a), f(b)
			if (fa < 0) != (fb < 0) {
				u := fa / (fa - fb)
				poly = append(poly, [2]float64{a[0] + u*(b[0]-a[0]), a[1] + u*(b[1]-a[1])})
			}
			if fb < 0 {
				poly = append(poly, b)
			}
		}
		for i := range poly {
			p, q := poly[i], poly[(i+1)%len(poly)]
			cr := p[0]*q[1] - q[0]*p[1]
			area += cr / 2
			cy += (p[0] + q[0]) * cr / 6
			cz += (p[1] + q[1]) * cr / 6
		}
		if area > 0 {
			cy, cz = cy/area, cz/area
		}
		return
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, p := range corners {
		v := -p[0]*s + p[1]*c
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	for i := 0; i < 200 && hi-lo > 1e-15*(1+math.Abs(hi)); i++ {
		mid := (lo + hi) / 2
		if a, _, _ := clip(mid); a < B*T {
			lo = mid
		} else {
			hi = mid
		}
	}
	_, yB, zB := clip((lo + hi) / 2)
	return (yB-yG)*c + (zB-zG)*s
}

// gzWallSided is the wall-sided formula GZ = sin θ (GM + ½ BM tan² θ)
// (Barrass & Derrett, Ship Stability for Masters and Mates, p.130; Tupper,
// Introduction to Naval Architecture, p.49/61: found), for a box with
// KB = T/2 and BM = B²/(12T) (practice).
func gzWallSided(B, T, kg, theta float64) float64 {
	bm := B * B / (12 * T)
	gm := T/2 + bm - kg
	tn := math.Tan(theta)
	return math.Sin(theta) * (gm + bm*tn*tn/2)
}

// TestGZWallSidedBox: on a box, every sample of the curve from upright
// until the deck edge immerses or the bilge emerges, tan θ < min(2(D−T)/B,
// 2T/B), matches the wall-sided formula to 1e-9 m; the deck-edge angle is
// atan(2(D−T)/B) when it comes first (the waterline turns about the
// centreline while the sides are vertical: practice).
func TestGZWallSidedBox(t *testing.T) {
	for _, tc := range []struct {
		L, B, D, T, KG float64
		tol            float64
	}{
		{80, 16, 8, 4, 5.6, 1e-9},
		{80, 12, 14, 6, 5.0, 1e-9},
		{100, 20, 10, 7, 7.5, 1e-9},
		{60, 10, 12, 3, 3.1, 1e-9},
	} {
		t.Run(fmt.Sprintf("B%g_T%g_KG%g", tc.B, tc.T, tc.KG), func(t *testing.T) {
			v := gzBox(t, tc.L, tc.B, tc.D, tc.T, 0, tc.KG, nil, nil, nil)
			_, c := gzCurve(t, v, v.Intact())
			limit := math.Atan(math.Min(2*(tc.D-tc.T)/tc.B, 2*tc.T/tc.B)) * 180 / math.Pi
			n := 0
			for i, deg := range c.HeelDeg {
				if deg >= limit {
					break
				}
				want := gzWallSided(tc.B, tc.T, tc.KG, deg*math.Pi/180)
				if d := math.Abs(c.GZM[i] - want); d > tc.tol {
					t.Errorf("GZ at %.3f°: %.12f m, wall-sided formula %.12f (diff %.2e)", deg, c.GZM[i], want, d)
				}
				n++
			}
			if n < 10 {
				t.Fatalf("only %d samples in the wall-sided range", n)
			}
			if 2*(tc.D-tc.T) <= 2*tc.T {
				want := math.Atan(2*(tc.D-tc.T)/tc.B) * 180 / math.Pi
				if d := math.Abs(c.DeckEdgeDeg - want); d > 1e-7 {
					t.Errorf("deck-edge angle %.9f°, want %.9f°", c.DeckEdgeDeg, want)
				}
			}
			if c.EquilibriumDeg != 0 || c.Other == nil || c.Toward != engine.Starboard {
				t.Errorf("upright box: equilibrium %v°, other side %v, toward %v", c.EquilibriumDeg, c.Other != nil, c.Toward)
			}
		})
	}
}

// TestGZBoxExactSection: the box's whole curve, deck edge immersed and
// bilge out, against the exact clipped-rectangle computation, to 1e-6 m at
// every sample (the issue asks 5 mm to 50°); listed boxes start negative;
// the angle of vanishing stability agrees to 1e-6°.
func TestGZBoxExactSection(t *testing.T) {
	for _, tc := range []struct {
		name            string
		L, B, D, T, KG  float64
		TCG             float64
		wantToward      engine.Side
		wantVanishBelow float64 // the curve must vanish before this heel (0: may not)
	}{
		{"barge", 80, 16, 8, 4, 5.6, 0, engine.Starboard, 70},
		{"high-KG", 80, 16, 8, 4, 6.6, 0, engine.Starboard, 60},
		{"listed-starboard", 80, 16, 8, 4, 5.6, 0.4, engine.Starboard, 70},
		{"listed-port", 80, 16, 8, 5, 5.0, -0.6, engine.Port, 0},
		{"deep-deck", 100, 20, 10, 7, 7.5, 0.2, engine.Starboard, 0},
	} {
		t.Run(tc.name, func(t *testing.T) {
			v := gzBox(t, tc.L, tc.B, tc.D, tc.T, tc.TCG, tc.KG, nil, nil, nil)
			eq, c := gzCurve(t, v, v.Intact())
			if c.Toward != tc.wantToward {
				t.Fatalf("toward %v, want %v", c.Toward, tc.wantToward)
			}
			sgn := float64(c.Toward)
			ref := func(deg float64) float64 {
				return gzRefSection(tc.B, tc.D, tc.T, sgn*tc.TCG, tc.KG, deg*math.Pi/180)
			}
			worst := 0.0
			for i, deg := range c.HeelDeg {
				d := math.Abs(c.GZM[i] - ref(deg))
				worst = math.Max(worst, d)
				if d > 1e-6 {
					t.Errorf("GZ at %.3f°: %.9f m, exact section %.9f", deg, c.GZM[i], ref(deg))
				}
			}
			t.Logf("%d samples to %.2f°, worst difference %.1e m", len(c.HeelDeg), c.HeelDeg[len(c.HeelDeg)-1], worst)
			if c.HeelDeg[len(c.HeelDeg)-1] < 60 {
				t.Errorf("curve ends at %v°, before 60°", c.HeelDeg[len(c.HeelDeg)-1])
			}
			if tc.TCG != 0 {
				// Upright, B is on the centreline: GZ(0) = −|TCG| (practice).
				if d := math.Abs(c.GZM[0] + math.Abs(tc.TCG)); d > 1e-9 {
					t.Errorf("GZ at 0° = %.12f, want −|TCG| = %v", c.GZM[0], -math.Abs(tc.TCG))
				}
				if d := math.Abs(c.EquilibriumDeg - math.Abs(eq.HeelDeg)); d != 0 || c.EquilibriumDeg <= 0 {
					t.Errorf("equilibrium %v°, position heel %v°", c.EquilibriumDeg, eq.HeelDeg)
				}
				if r := ref(c.EquilibriumDeg); math.Abs(r) > 1e-9 {
					t.Errorf("exact GZ at the equilibrium %.6f° is %.2e, want 0", c.EquilibriumDeg, r)
				}
			}
			// The angle of vanishing stability: bisection on the exact lever.
			if tc.wantVanishBelow > 0 {
				if !c.Vanishes || c.VanishingDeg >= tc.wantVanishBelow {
					t.Fatalf("vanishing %v (found %v), want below %v°", c.VanishingDeg, c.Vanishes, tc.wantVanishBelow)
				}
				lo, hi := c.GZMaxDeg, 89.5
				for i := 0; i < 100; i++ {
					if mid := (lo + hi) / 2; ref(mid) > 0 {
						lo = mid
					} else {
						hi = mid
					}
				}
				if d := math.Abs(c.VanishingDeg - lo); d > 1e-6 {
					t.Errorf("vanishing angle %.9f°, exact %.9f°", c.VanishingDeg, lo)
				}
				if want := c.VanishingDeg - c.EquilibriumDeg; math.Abs(c.RangeDeg-want) > 1e-12 {
					t.Errorf("range %v, want %v", c.RangeDeg, want)
				}
			}
			// GZmax against a golden-section search of the exact lever
			// near the curve's maximum.
			a, b := c.GZMaxDeg-2, c.GZMaxDeg+2
			for i := 0; i < 200; i++ {
				m1, m2 := b-(b-a)*0.618, a+(b-a)*0.618
				if ref(m1) < ref(m2) {
					a = m1
				} else {
					b = m2
				}
			}
			if d := math.Abs(c.GZMaxM - ref((a+b)/2)); d > 1e-6 {
				t.Errorf("GZmax %.9f at %.4f°, exact %.9f at %.4f°", c.GZMaxM, c.GZMaxDeg, ref((a+b)/2), (a+b)/2)
			}
		})
	}
}

// TestGZAreasAgainstGonum: areas under the curve against gonum's
// integration (gonum.org/v1/gonum/integrate) of the same curve: Romberg on
// the closed-form wall-sided curve within its range, and Simpson's rule on
// the exact section lever densely sampled beyond it (deck edge immersed).
func TestGZAreasAgainstGonum(t *testing.T) {
	romberg := func(f func(float64) float64, a, b float64) float64 {
		const n = 1<<12 + 1
		ys := make([]float64, n)
		for i := range ys {
			ys[i] = f(a + (b-a)*float64(i)/(n-1))
		}
		return integrate.Romberg(ys, (b-a)/(n-1))
	}
	simpson := func(f func(float64) float64, a, b float64) float64 {
		const n = 4001
		xs, ys := make([]float64, n), make([]float64, n)
		for i := range xs {
			xs[i] = a + (b-a)*float64(i)/(n-1)
			ys[i] = f(xs[i])
		}
		return integrate.Simpsons(xs, ys)
	}
	rad := math.Pi / 180
	// Wall-sided to 45° (bilge) and 53.1° (deck edge).
	const L, B, D, T, KG = 80.0, 12.0, 14.0, 6.0, 5.0
	v := gzBox(t, L, B, D, T, 0, KG, nil, nil, nil)
	_, c := gzCurve(t, v, v.Intact())
	ws := func(th float64) float64 { return gzWallSided(B, T, KG, th) }
	// Beyond the deck edge: the exact section of another box.
	const B2, D2, T2, KG2 = 16.0, 8.0, 4.0, 5.6
	v2 := gzBox(t, 80, B2, D2, T2, 0, KG2, nil, nil, nil)
	_, c2 := gzCurve(t, v2, v2.Intact())
	ex := func(th float64) float64 { return gzRefSection(B2, D2, T2, 0, KG2, th) }
	for _, tc := range []struct {
		name     string
		c        *engine.GZCurve
		from, to float64
		want     func() float64
		tol      float64
	}{
		// A smooth curve: the spline's error at 1° steps is of order h⁴.
		{"wall-sided 0-30", c, 0, 30, func() float64 { return romberg(ws, 0, 30*rad) }, 5e-8},
		{"wall-sided 0-40", c, 0, 40, func() float64 { return romberg(ws, 0, 40*rad) }, 5e-8},
		{"wall-sided 30-40", c, 30, 40, func() float64 { return romberg(ws, 30*rad, 40*rad) }, 5e-8},
		{"wall-sided 7.3-41.7", c, 7.3, 41.7, func() float64 { return romberg(ws, 7.3*rad, 41.7*rad) }, 5e-8},
		{"wall-sided 12.25-12.75", c, 12.25, 12.75, func() float64 { return romberg(ws, 12.25*rad, 12.75*rad) }, 1e-10},
		// Deck edge in and bilge out together at 26.57°: GZ'' jumps there,
		// and the spline's error is of order h³ over that step.
		{"exact 0-20", c2, 0, 20, func() float64 { return simpson(ex, 0, 20*rad) }, 5e-8},
		{"exact 0-30", c2, 0, 30, func() float64 { return simpson(ex, 0, 30*rad) }, 1e-6},
		{"exact 0-40", c2, 0, 40, func() float64 { return simpson(ex, 0, 40*rad) }, 1e-6},
		{"exact 30-40", c2, 30, 40, func() float64 { return simpson(ex, 30*rad, 40*rad) }, 2e-7},
		{"exact 0-60", c2, 0, 60, func() float64 { return simpson(ex, 0, 60*rad) }, 1e-6},
		{"exact 14.1-55.9", c2, 14.1, 55.9, func() float64 { return simpson(ex, 14.1*rad, 55.9*rad) }, 1e-6},
	} {
		t.Run(tc.name, func(t *testing.T) {
			got, want := tc.c.AreaMRad(tc.from, tc.to), tc.want()
			if d := math.Abs(got - want); d > tc.tol {
				t.Errorf("area %v–%v° = %.12f m·rad, gonum %.12f (diff %.2e > %.0e)", tc.from, tc.to, got, want, d, tc.tol)
			}
		})
	}
	// Reversed and empty ranges.
	if a := c.AreaMRad(30, 10); a != 0 {
		t.Errorf("reversed range gives %v, want 0", a)
	}
}

// TestGZSymmetricFloodIsShorterBox: a box with a full-breadth, full-depth
// compartment open to the sea (permeability μ, length l) has lost the
// buoyancy of μ·l metres of its length at every attitude, and every section
// that remains is the box's own. With G over the centroid of what remains,
// she stays at zero trim at every heel, so her curve is that of the intact
// box of length L − μ·l with the same mass and G (lost buoyancy: Barrass &
// Derrett, bilging chapter; Tupper, flooding chapter: memory). The curve
// is compared sample by sample, with the derived angles; the flood is
// symmetric, so both sides are computed and agree.
func TestGZSymmetricFloodIsShorterBox(t *testing.T) {
	const L, B, D, KG = 80.0, 16.0, 8.0, 5.4
	for _, tc := range []struct {
		name   string
		x0, x1 float64
		mu     float64
		mass   float64
	}{
		{"midship hold, mu 1", 30, 40, 1, 4000},
		{"midship hold, mu 0.6", 30, 42, 0.6, 3800},
		{"end space, mu 0.95", 70, 80, 0.95, 4200},
	} {
		t.Run(tc.name, func(t *testing.T) {
			lost := tc.mu * (tc.x1 - tc.x0)
			// Centroid of the remaining buoyant length.
			xc := (L*L/2 - tc.mu*(tc.x1-tc.x0)*(tc.x0+tc.x1)/2) / (L - lost)
			h, _ := engine.NewBoxHull(L, B, D)
			comp, err := engine.NewCompartment(h, "hold", engine.Box{X0: tc.x0, X1: tc.x1, Y0: -B / 2, Y1: B / 2, Z0: 0, Z1: D})
			if err != nil {
				t.Fatal(err)
			}
			comp.Permeability = tc.mu
			op := []engine.Opening{{Name: "vent S", X: 20, Y: 7, Z: 9.5}}
			w := engine.Weight{Name: "load", MassT: tc.mass, LCGM: xc, VCGM: KG}
			damaged := gzVessel(t, h, []engine.Weight{w}, []*engine.Compartment{comp}, op)
			_, dc := gzCurve(t, damaged, engine.Damage{{Open: true}})

			hs, _ := engine.NewBoxHull(L-lost, B, D)
			w.LCGM = (L - lost) / 2
			op[0].X = 20 - xc + (L-lost)/2
			intact := gzVessel(t, hs, []engine.Weight{w}, nil, op)
			_, ic := gzCurve(t, intact, intact.Intact())

			if len(dc.HeelDeg) != len(ic.HeelDeg) {
				t.Fatalf("%d samples damaged, %d intact", len(dc.HeelDeg), len(ic.HeelDeg))
			}
			for i := range dc.HeelDeg {
				if math.Abs(dc.HeelDeg[i]-ic.HeelDeg[i]) > 1e-9 || math.Abs(dc.GZM[i]-ic.GZM[i]) > 1e-9 {
					t.Errorf("at %v° (intact %v°): GZ damaged %.12f, shorter box %.12f", dc.HeelDeg[i], ic.HeelDeg[i], dc.GZM[i], ic.GZM[i])
				}
			}
			for _, q := range []struct {
				name string
				a, b float64
				tol  float64
			}{
				{"vanishing", dc.VanishingDeg, ic.VanishingDeg, 1e-6},
				{"GZmax", dc.GZMaxM, ic.GZMaxM, 1e-9},
				{"deck edge", dc.DeckEdgeDeg, ic.DeckEdgeDeg, 1e-6},
				{"downflooding", dc.DownfloodingDeg, ic.DownfloodingDeg, 1e-6},
				{"area 0-40", dc.AreaMRad(0, 40), ic.AreaMRad(0, 40), 1e-9},
			} {
				if math.Abs(q.a-q.b) > q.tol {
					t.Errorf("%s: damaged %.9f, shorter box %.9f", q.name, q.a, q.b)
				}
			}
			// The port curve of the symmetric flood is the starboard one; the
			// vent is on the starboard side, so starboard is the worse.
			if dc.Toward != engine.Starboard || dc.Other == nil || dc.Downflooding != "vent S" || dc.Other.Downflooding != "" {
				t.Fatalf("toward %v, other %v, downflooding %q", dc.Toward, dc.Other != nil, dc.Downflooding)
			}
			for i := range dc.GZM {
				if dc.Other.GZM[i] != dc.GZM[i] {
					t.Fatalf("port and starboard differ at %v°", dc.HeelDeg[i])
				}
			}
		})
	}
}

// TestGZPortCurveOfAsymmetricFlood: an upright condition that is not
// symmetric (a wing space flooded, balanced by an off-centre weight) has
// both curves computed; each is checked against pr.AtHeel solved to the
// solver's own tolerance at the same heels, and the worse is returned.
func TestGZPortCurveOfAsymmetricFlood(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	h, _ := engine.NewBoxHull(L, B, D)
	comp, err := engine.NewCompartment(h, "wing S", engine.Box{X0: 30, X1: 42, Y0: 4, Y1: 8, Z0: 0, Z1: 8})
	if err != nil {
		t.Fatal(err)
	}
	v := gzVessel(t, h, []engine.Weight{{Name: "load", MassT: 4000, LCGM: 39, TCGM: 0, VCGM: 5.2}}, []*engine.Compartment{comp}, nil)
	d := engine.Damage{{Open: true}}
	pr := engine.NewProblem(v, d)
	eq, err := pr.Equilibrium()
	if err != nil {
		t.Fatal(err)
	}
	// Move G to port until she floats upright.
	tcg := 0.0
	for i := 0; i < 60 && math.Abs(eq.HeelDeg) > 1e-9; i++ {
		tcg -= eq.GMM * math.Tan(eq.HeelDeg*math.Pi/180)
		v = gzVessel(t, h, []engine.Weight{{Name: "load", MassT: 4000, LCGM: 39, TCGM: tcg, VCGM: 5.2}}, []*engine.Compartment{comp}, nil)
		pr = engine.NewProblem(v, d)
		if eq, err = pr.Equilibrium(); err != nil {
			t.Fatal(err)
		}
	}
	if math.Abs(eq.HeelDeg) > 1e-6 {
		t.Fatalf("could not balance her upright: heel %v", eq.HeelDeg)
	}
	c, err := engine.RightingLevers(pr, eq)
	if err != nil {
		t.Fatal(err)
	}
	if c.Other == nil {
		t.Fatal("upright: the other side's curve is missing")
	}
	for _, cv := range []*engine.GZCurve{c, c.Other} {
		sgn := float64(cv.Toward)
		g := eq.Plane
		for i, deg := range cv.HeelDeg {
			if deg > 89 {
				break
			}
			p, gz, err := pr.AtHeel(sgn*deg*math.Pi/180, g)
			if err != nil {
				t.Fatal(err)
			}
			g = p
			if deg == 0 {
				gz *= sgn // AtHeel's sign at zero heel is that of a lever to port
			}
			// The curve stops Newton one step early (see leverAt).
			if math.Abs(gz-cv.GZM[i]) > 5e-9 {
				t.Errorf("%v at %v°: curve %.12f, AtHeel %.12f", cv.Toward, deg, cv.GZM[i], gz)
			}
		}
	}
	// The worse side has the smaller reserve to the vanishing angle.
	if a, b := c.AreaMRad(0, c.VanishingDeg), c.Other.AreaMRad(0, c.Other.VanishingDeg); a > b {
		t.Errorf("returned %v side with reserve %v, other %v has %v", c.Toward, a, c.Other.Toward, b)
	}
}

// TestGZAngleOfLoll: a box with negative upright GM lies at the angle of
// loll, where the wall-sided formula gives GZ = 0: tan θ = √(−2 GM/BM)
// (from Barrass & Derrett p.130 / Tupper: found, solved for GZ = 0). The
// curve from upright is negative up to the loll, zero there, and the range
// counts from the loll.
func TestGZAngleOfLoll(t *testing.T) {
	const L, B, D, T = 80.0, 16.0, 12.0, 4.0
	bm := B * B / (12 * T)
	for _, kg := range []float64{7.4, 7.5, 7.7} {
		gm := T/2 + bm - kg
		loll := math.Atan(math.Sqrt(-2*gm/bm)) * 180 / math.Pi
		v := gzBox(t, L, B, D, T, 0, kg, nil, nil, nil)
		eq, c := gzCurve(t, v, v.Intact())
		if math.Abs(math.Abs(eq.HeelDeg)-loll) > 1e-6 || math.Abs(c.EquilibriumDeg-loll) > 1e-6 {
			t.Fatalf("KG %v: position heel %v°, curve equilibrium %v°, loll %v°", kg, eq.HeelDeg, c.EquilibriumDeg, loll)
		}
		if c.Other != nil || c.Toward != engine.Side(math.Copysign(1, eq.HeelDeg)) {
			t.Errorf("KG %v: she lies to one side; toward %v, other %v", kg, c.Toward, c.Other != nil)
		}
		for i, deg := range c.HeelDeg {
			if deg > 26 { // wall-sided to the deck edge and bilge, tan θ < 0.5
				break
			}
			want := gzWallSided(B, T, kg, deg*math.Pi/180)
			if math.Abs(c.GZM[i]-want) > 1e-9 {
				t.Errorf("KG %v at %v°: GZ %.12f, wall-sided %.12f", kg, deg, c.GZM[i], want)
			}
			if deg > 0 && deg < loll && !(c.GZM[i] < 0) {
				t.Errorf("KG %v at %v°: GZ %v before the loll, want negative", kg, deg, c.GZM[i])
			}
		}
		if math.Abs(c.RangeDeg-(c.VanishingDeg-loll)) > 1e-6 || !c.Vanishes {
			t.Errorf("KG %v: range %v, vanishing %v, loll %v", kg, c.RangeDeg, c.VanishingDeg, loll)
		}
	}
}

// TestGZDownflooding: an opening at (x, y, z) on an upright box immerses,
// while the sides are wall-sided and the waterline turns about the
// centreline at the draft T, at tan θ = (z − T)/y (practice); a
// weathertight opening lower down does not count; the port curve of a
// listed box sees only its own side's openings go under.
func TestGZDownflooding(t *testing.T) {
	const L, B, D, T, KG = 80.0, 16.0, 8.0, 4.0, 5.0
	open := []engine.Opening{
		{Name: "door S", X: 40, Y: 7.5, Z: 6.5, Weathertight: true},
		{Name: "vent S", X: 10, Y: 7, Z: 7.5},
		{Name: "vent P", X: 60, Y: -6, Z: 7.2},
	}
	v := gzBox(t, L, B, D, T, 0, KG, nil, nil, open)
	_, c := gzCurve(t, v, v.Intact())
	// Starboard: vent S at atan(3.5/7) = 26.565°; port: vent P at atan(3.2/6) = 28.07°.
	// The deck edge immerses at atan(4/8) = 26.565° as well, so both lie
	// in the wall-sided range.
	want := map[engine.Side]struct {
		name string
		deg  float64
	}{
		engine.Starboard: {"vent S", math.Atan(3.5/7) * 180 / math.Pi},
		engine.Port:      {"vent P", math.Atan(3.2/6) * 180 / math.Pi},
	}
	for _, cv := range []*engine.GZCurve{c, c.Other} {
		w := want[cv.Toward]
		if cv.Downflooding != w.name || math.Abs(cv.DownfloodingDeg-w.deg) > 1e-7 {
			t.Errorf("%v: downflooding %q at %.9f°, want %q at %.9f°", cv.Toward, cv.Downflooding, cv.DownfloodingDeg, w.name, w.deg)
		}
	}
	if c.Toward != engine.Starboard {
		t.Errorf("the worse side is starboard (vent S goes under first), got %v", c.Toward)
	}
	// No openings at all: 90° and no name.
	v2 := gzBox(t, L, B, D, T, 0, KG, nil, nil, nil)
	_, c2 := gzCurve(t, v2, v2.Intact())
	if c2.DownfloodingDeg != 90 || c2.Downflooding != "" {
		t.Errorf("no openings: downflooding %v %q, want 90 and none", c2.DownfloodingDeg, c2.Downflooding)
	}
}

// TestGZCurveBadInput: a nil problem is a programmer's mistake (panic); a
// heel that is not a number is an error, not a panic.
func TestGZCurveBadInput(t *testing.T) {
	v := gzBox(t, 80, 16, 8, 4, 0, 5, nil, nil, nil)
	pr := engine.NewProblem(v, v.Intact())
	if _, err := engine.RightingLevers(pr, engine.Position{HeelDeg: math.NaN()}); err == nil {
		t.Error("NaN heel: want an error")
	}
	defer func() {
		if r := recover(); r == nil {
			t.Error("nil problem: want a panic")
		}
	}()
	_, _ = engine.RightingLevers(nil, engine.Position{})
}

// gzWigleyHull returns a Wigley hull (y = (B/2)(1 − ξ²)(1 − (z'/T)²), ξ from
// amidships in half-lengths, z' depth below the design waterline T: Hally
// 1989, Journée 1992: found) with vertical sides from T up to the deck at
// D, given by ns stations and nw offsets below T on each.
func gzWigleyHull(t testing.TB, L, B, T, D float64, ns, nw int) *engine.Hull {
	t.Helper()
	var st []engine.Station
	for i := 0; i < ns; i++ {
		x := L * float64(i) / float64(ns-1)
		xi := 2*x/L - 1
		b := B / 2 * (1 - xi*xi)
		var off []engine.Point
		for j := 0; j <= nw; j++ {
			z := T * float64(j) / float64(nw)
			zp := (T - z) / T
			off = append(off, engine.Point{Y: b * (1 - zp*zp), Z: z})
		}
		off = append(off, engine.Point{Y: b, Z: D})
		st = append(st, engine.Station{X: x, Offsets: off})
	}
	h, err := engine.NewSectionHull(L, st)
	if err != nil {
		t.Fatal(err)
	}
	return h
}

// TestGZConvergesWithStations: the curve of a Wigley hull given by offsets
// converges as stations and waterlines are added. The hull between
// offsets is piecewise linear, so each halving of the spacing should cut
// the error by about four (second order, as the trapezoidal rule: practice);
// the test asks, from 11 stations on, for a factor of at least 2.5 between
// successive differences at 10°, 30° and 50°. The limit is anchored to the smooth
// hull by the initial slope: GZ(θ)/sin θ → GM as θ → 0, with GM from the
// Wigley hydrostatics at T (KB = 5T/8, BM = 3B²/(35T), ∇ = 4/9·LBT:
// derived in references), checked on the finest hull at 1° where the
// O(θ²) term is below 1 mm.
func TestGZConvergesWithStations(t *testing.T) {
	const L, B, T, D, KG = 100.0, 10.0, 6.25, 10.0, 4.0
	mass := gzRho * 4.0 / 9 * L * B * T
	at := []float64{10, 30, 50}
	var prev []float64
	var prevDiff []float64
	var finest *engine.GZCurve
	for _, n := range []int{6, 11, 21, 41, 81} {
		h := gzWigleyHull(t, L, B, T, D, n, n)
		v := gzVessel(t, h, []engine.Weight{{Name: "ship", MassT: mass, LCGM: L / 2, VCGM: KG}}, nil, nil)
		_, c := gzCurve(t, v, v.Intact())
		var cur []float64
		for _, deg := range at {
			cur = append(cur, c.At(deg))
		}
		if prev != nil {
			var diff []float64
			for i := range at {
				diff = append(diff, math.Abs(cur[i]-prev[i]))
			}
			t.Logf("%2d stations: GZ %v, change %.2e %.2e %.2e", n, fmtGZ(cur), diff[0], diff[1], diff[2])
			if prevDiff != nil && n > 21 {
				for i := range at {
					if diff[i] > prevDiff[i]/2.5 && diff[i] > 1e-7 {
						t.Errorf("at %v°: change %.2e after %.2e: not converging at second order", at[i], diff[i], prevDiff[i])
					}
				}
			}
			prevDiff = diff
		}
		prev = cur
		finest = c
	}
	gm := 5*T/8 + 3*B*B/(35*T) - KG
	slope := finest.At(1) / math.Sin(math.Pi/180)
	t.Logf("GZ(1°)/sin 1° = %.5f m, Wigley GM %.5f m", slope, gm)
	if d := math.Abs(slope - gm); d > 2e-3 {
		t.Errorf("GZ(1°)/sin 1° = %.5f m on the finest hull, Wigley GM %.5f m", slope, gm)
	}
}

func fmtGZ(v []float64) string {
	s := ""
	for _, x := range v {
		s += fmt.Sprintf("%.5f ", x)
	}
	return s
}

// BenchmarkRightingLevers: one curve per call, as a keystroke computes it,
// on a Wigley hull from 21 stations of 12 offsets (intact upright: both
// sides, mirrored; a wing space open: one side) and on the bundled ship
// (intact; and as BenchmarkRecompute floods her). Run with
//
//	go test ./engine -run '^$' -bench 'RightingLevers|Equilibrium$' -cpu 1
func BenchmarkRightingLevers(b *testing.B) {
	const L, B, T, D = 120.0, 18.0, 7.0, 11.0
	h := gzWigleyHull(b, L, B, T, D, 21, 10)
	comp, err := engine.NewCompartment(h, "wing S", engine.Box{X0: 50, X1: 66, Y0: 3, Y1: 10, Z0: 0, Z1: 11})
	if err != nil {
		b.Fatal(err)
	}
	mass := 4.0 / 9 * L * B * T * gzRho * 0.8
	wig := gzVessel(b, h, []engine.Weight{{Name: "ship", MassT: mass, LCGM: L / 2, VCGM: 5.0}}, []*engine.Compartment{comp}, nil)
	cases := []struct {
		name string
		v    *engine.Vessel
		d    engine.Damage
	}{{"wigley-intact", wig, wig.Intact()}, {"wigley-wing-open", wig, engine.Damage{{Open: true}}}}
	if ship, _, err := vessels.Open(vessels.Default); err == nil {
		type bcase = struct {
			name string
			v    *engine.Vessel
			d    engine.Damage
		}
		cases = append(cases, bcase{"bundled-intact", ship, ship.Intact()})
		// The keystroke benchmark's damage (bench_test.go): a wing tank and
		// the engine room open.
		d := ship.Intact()
		open := 0
		for i, c := range ship.Compartments {
			if c.Name == "Wing tank 2 S" || c.Name == "Engine room" {
				d[i].Open = true
				open++
			}
		}
		if open == 2 {
			cases = append(cases, bcase{"bundled-wing-and-engine-room-open", ship, d})
		}
	} else {
		b.Logf("bundled ship not available: %v", err)
	}
	for _, tc := range cases {
		b.Run(tc.name, func(b *testing.B) {
			pr := engine.NewProblem(tc.v, tc.d)
			eq, err := pr.Equilibrium()
			if err != nil {
				b.Skip(err)
			}
			var c *engine.GZCurve
			for b.Loop() {
				if c, err = engine.RightingLevers(pr, eq); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(len(c.HeelDeg)), "samples")
		})
	}
}

// ExampleRightingLevers: the righting-lever curve of a box barge (an
// invented example: 80 m × 16 m × 8 m, floating at 4 m with G 5.6 m above
// the keel), read off at a few heels, with its derived angles and the IS
// Code's first area. Up to the deck edge at 26.6° the levers are those of
// the wall-sided formula, GZ = sin θ (GM + ½ BM tan² θ).
func ExampleRightingLevers() {
	h, _ := engine.NewBoxHull(80, 16, 8)
	v, _ := engine.NewVessel(engine.Vessel{Name: "example barge", Hull: h,
		Weights: []engine.Weight{{Name: "barge and cargo", MassT: 1.025 * 80 * 16 * 4, LCGM: 40, VCGM: 5.6}}})
	pr := engine.NewProblem(v, v.Intact())
	eq, err := pr.Equilibrium()
	if err != nil {
		fmt.Println(err)
		return
	}
	c, err := engine.RightingLevers(pr, eq)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, deg := range []float64{10, 20, 30, 40} {
		fmt.Printf("GZ at %2.0f°: %.3f m\n", deg, c.At(deg))
	}
	fmt.Printf("GZmax %.3f m at %.1f°, deck edge in at %.1f°, vanishing at %.1f°\n", c.GZMaxM, c.GZMaxDeg, c.DeckEdgeDeg, c.VanishingDeg)
	fmt.Printf("area 0–30°: %.4f m·rad\n", c.AreaMRad(0, 30))
	// Output:
	// GZ at 10°: 0.315 m
	// GZ at 20°: 0.714 m
	// GZ at 30°: 1.221 m
	// GZ at 40°: 1.162 m
	// GZmax 1.262 m at 33.5°, deck edge in at 26.6°, vanishing at 63.8°
	// area 0–30°: 0.2856 m·rad
}
