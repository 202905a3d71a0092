package engine_test

// Tests of the criteria table: each criterion passes on a condition built
// to sit just above its limit and fails just below it (curves made
// directly as GZCurve values, read by the spline, which reproduces
// polynomials up to cubics exactly); the SOLAS s indicator against its
// formula; which sets apply; bad input.

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// critCurve samples gz(θ) (θ in radians) at 1° from 0° to endDeg.
func critCurve(endDeg float64, gz func(th float64) float64) *engine.GZCurve {
	c := &engine.GZCurve{Toward: engine.Starboard, VanishingDeg: endDeg, DeckEdgeDeg: 90, DownfloodingDeg: 90}
	for d := 0.0; d <= endDeg+1e-9; d++ {
		c.HeelDeg = append(c.HeelDeg, d)
		c.GZM = append(c.GZM, gz(d*math.Pi/180))
	}
	c.RangeDeg = endDeg
	c.GZMaxM, c.GZMaxDeg = c.MaxBetween(0, endDeg)
	return c
}

// critLinear is GZ = k·θ, scaled so that its area from a to b degrees is
// area: ∫ k θ dθ = k (b² − a²)/2 in radians (practice).
func critLinear(area, a, b float64) func(float64) float64 {
	ra, rb := a*math.Pi/180, b*math.Pi/180
	k := 2 * area / (rb*rb - ra*ra)
	return func(th float64) float64 { return k * th }
}

func critConst(g float64) func(float64) float64 { return func(float64) float64 { return g } }

// critFind returns the result with the given set and code.
func critFind(t *testing.T, rs []engine.CriterionResult, set, code string) engine.CriterionResult {
	t.Helper()
	for _, r := range rs {
		if r.Set == set && r.Code == code {
			return r
		}
	}
	t.Fatalf("no result %s/%s among %d", set, code, len(rs))
	return engine.CriterionResult{}
}

// TestCriteriaEitherSideOfLimit builds, for each criterion, a condition a
// hair above and a hair below its limit (values from references.md: IMO
// 2008 IS Code Part A 2.2, found (secondary text); MARPOL Annex I Reg.
// 28.3, found) and checks pass, fail and the signed margin.
func TestCriteriaEitherSideOfLimit(t *testing.T) {
	const eps = 1e-6
	upright := engine.Position{GMM: 1.0, DeckEdge: engine.Clearance{HeightM: 1}}
	type build func(sign float64) engine.CriteriaCase // sign +1: just passing, −1: just failing
	intact := func(c *engine.GZCurve, eq engine.Position) engine.CriteriaCase {
		return engine.CriteriaCase{Curve: c, Eq: eq}
	}
	damaged := func(c *engine.GZCurve, eq engine.Position) engine.CriteriaCase {
		return engine.CriteriaCase{Curve: c, Eq: eq, Damaged: true}
	}
	listed := func(heel float64, deckIn bool) engine.Position {
		p := engine.Position{HeelDeg: heel, GMM: 0.5, DeckEdge: engine.Clearance{HeightM: 0.5}}
		if deckIn {
			p.DeckEdge.HeightM = -0.2
		}
		return p
	}
	for _, tc := range []struct {
		set, code string
		limit     float64
		atMost    bool
		build     build
	}{
		// IS Code 2.2.1: areas.
		{"is-code-2008", "area-0-30", 0.055, false, func(s float64) engine.CriteriaCase {
			return intact(critCurve(70, critLinear(0.055+s*eps, 0, 30)), upright)
		}},
		{"is-code-2008", "area-0-40", 0.090, false, func(s float64) engine.CriteriaCase {
			return intact(critCurve(70, critLinear(0.090+s*eps, 0, 40)), upright)
		}},
		{"is-code-2008", "area-0-40", 0.090, false, func(s float64) engine.CriteriaCase { // to downflooding at 35°
			c := critCurve(70, critLinear(0.090+s*eps, 0, 35))
			c.DownfloodingDeg, c.Downflooding = 35, "vent"
			return intact(c, upright)
		}},
		{"is-code-2008", "area-30-40", 0.030, false, func(s float64) engine.CriteriaCase {
			return intact(critCurve(70, critLinear(0.030+s*eps, 30, 40)), upright)
		}},
		{"is-code-2008", "area-30-40", 0.030, false, func(s float64) engine.CriteriaCase { // 30° to downflooding at 37.5°
			c := critCurve(70, critLinear(0.030+s*eps, 30, 37.5))
			c.DownfloodingDeg, c.Downflooding = 37.5, "vent"
			return intact(c, upright)
		}},
		// 2.2.2: GZ at 30° or more, on a constant curve.
		{"is-code-2008", "gz-30", 0.20, false, func(s float64) engine.CriteriaCase {
			return intact(critCurve(70, critConst(0.20+s*eps)), upright)
		}},
		// The largest GZ from 30° on is read where the curve peaks: a
		// parabola g − a(θ − 50°)², maximum g at 50° (exact for the spline).
		{"is-code-2008", "gz-30", 0.20, false, func(s float64) engine.CriteriaCase {
			g := 0.20 + s*eps
			return intact(critCurve(80, func(th float64) float64 { d := th - 50*math.Pi/180; return g - 0.8*d*d }), upright)
		}},
		// 2.2.3: the angle of GZmax, read from the curve's field.
		{"is-code-2008", "gzmax-angle", 25, false, func(s float64) engine.CriteriaCase {
			c := critCurve(70, critConst(0.5))
			c.GZMaxDeg = 25 + s*eps
			return intact(c, upright)
		}},
		// 2.2.4: GM0.
		{"is-code-2008", "gm0", 0.15, false, func(s float64) engine.CriteriaCase {
			eq := upright
			eq.GMM = 0.15 + s*eps
			return intact(critCurve(70, critConst(0.5)), eq)
		}},
		// MARPOL Annex I Reg. 28.3.
		{"marpol-i-28", "openings-clear", 0, false, func(s float64) engine.CriteriaCase {
			eq := listed(5, false)
			eq.Openings = []engine.OpeningClearance{{Opening: engine.Opening{Name: "air pipe"}, HeightM: 2}, {Opening: engine.Opening{Name: "door", Weathertight: true}, HeightM: s * eps}}
			return damaged(critCurve(70, critConst(0.5)), eq)
		}},
		{"marpol-i-28", "heel", 25, true, func(s float64) engine.CriteriaCase {
			return damaged(critCurve(70, critConst(0.5)), listed(25-s*eps, true))
		}},
		{"marpol-i-28", "heel", 30, true, func(s float64) engine.CriteriaCase { // no deck-edge immersion: 30°
			return damaged(critCurve(70, critConst(0.5)), listed(30-s*eps, false))
		}},
		{"marpol-i-28", "heel", 25, true, func(s float64) engine.CriteriaCase { // to port
			return damaged(critCurve(70, critConst(0.5)), listed(-(25-s*eps), true))
		}},
		{"marpol-i-28", "range", 20, false, func(s float64) engine.CriteriaCase {
			c := critCurve(70, critConst(0.5))
			c.EquilibriumDeg, c.VanishingDeg, c.Vanishes = 8, 28+s*eps, true
			c.RangeDeg = c.VanishingDeg - c.EquilibriumDeg
			return damaged(c, listed(8, false))
		}},
		{"marpol-i-28", "gzmax-range", 0.1, false, func(s float64) engine.CriteriaCase {
			// Largest GZ inside [θe, θe+20°] = [6°, 26°]; bigger beyond it.
			c := critCurve(70, func(th float64) float64 { return (0.1 + s*eps) * th / (26 * math.Pi / 180) })
			c.EquilibriumDeg, c.VanishingDeg, c.Vanishes = 6, 70, true
			return damaged(c, listed(6, false))
		}},
		{"marpol-i-28", "area-range", 0.0175, false, func(s float64) engine.CriteriaCase {
			c := critCurve(70, critLinear(0.0175+s*eps, 7, 27))
			c.EquilibriumDeg, c.VanishingDeg, c.Vanishes = 7, 70, true
			return damaged(c, listed(7, false))
		}},
		{"marpol-i-28", "area-range", 0.0175, false, func(s float64) engine.CriteriaCase { // range cut at vanishing, 22°
			c := critCurve(70, critLinear(0.0175+s*eps, 7, 22))
			c.EquilibriumDeg, c.VanishingDeg, c.Vanishes = 7, 22, true
			return damaged(c, listed(7, false))
		}},
		{"marpol-i-28", "openings-range", 20, false, func(s float64) engine.CriteriaCase {
			c := critCurve(70, critConst(0.5))
			c.EquilibriumDeg, c.DownfloodingDeg, c.Downflooding = 4, 24+s*eps, "vent"
			return damaged(c, listed(4, false))
		}},
	} {
		for _, sign := range []float64{1, -1} {
			k := tc.build(sign)
			rs, err := engine.EvaluateCriteria([]string{tc.set}, k)
			if err != nil {
				t.Fatal(err)
			}
			r := critFind(t, rs, tc.set, tc.code)
			wantPass := sign > 0
			if r.Pass != wantPass {
				t.Errorf("%s/%s (%s): pass %v with actual %.9f against %v, want %v", tc.set, tc.code, r.Note, r.Pass, r.Actual, r.Required, wantPass)
			}
			if r.Required != tc.limit || r.AtMost != tc.atMost {
				t.Errorf("%s/%s: limit %v (at most %v), want %v (%v)", tc.set, tc.code, r.Required, r.AtMost, tc.limit, tc.atMost)
			}
			// The margin is the distance to the limit, positive passing;
			// the spline is exact on these polynomial curves.
			if d := math.Abs(r.Margin - sign*eps); d > 1e-10 {
				t.Errorf("%s/%s: margin %.6e, want %.6e", tc.set, tc.code, r.Margin, sign*eps)
			}
			if r.Requirement == "" || r.Source == "" {
				t.Errorf("%s/%s: requirement %q source %q must be filled", tc.set, tc.code, r.Requirement, r.Source)
			}
		}
	}
}

// TestCriteriaSurvivalFactor: s_final = K·[(GZmax/0.12)·(Range/16)]^¼ with
// GZmax ≤ 0.12 m, Range ≤ 16° and K = √((θmax − θe)/(θmax − θmin)) between
// θmin and θmax, 7°/15° passenger and 25°/30° cargo (SOLAS II-1 Reg. 7-2,
// values in references.md marked memory).
func TestCriteriaSurvivalFactor(t *testing.T) {
	for _, tc := range []struct {
		name      string
		shipType  string
		heel      float64
		gz        float64 // constant GZ beyond the equilibrium
		vanishDeg float64
		floodDeg  float64
		want      float64
	}{
		{"full", "cargo", 5, 0.2, 40, 90, 1},
		{"capped both", "passenger", 3, 0.5, 80, 90, 1},
		{"small GZ", "cargo", 5, 0.06, 40, 90, math.Pow(0.5, 0.25)},
		{"short range", "cargo", 5, 0.2, 13, 90, math.Pow(0.5, 0.25)},
		{"range to downflooding", "cargo", 5, 0.2, 40, 9, math.Pow(0.25, 0.25)},
		{"passenger heel 11", "passenger", 11, 0.2, 40, 90, math.Sqrt(0.5)},
		{"cargo heel 27.5", "cargo", 27.5, 0.2, 60, 90, math.Sqrt(0.5)},
		{"default cargo", "", 27.5, 0.2, 60, 90, math.Sqrt(0.5)},
		{"passenger heel 15", "passenger", 15, 0.2, 40, 90, 0},
		{"cargo heel 31", "cargo", 31, 0.2, 60, 90, 0},
		{"no range", "cargo", 5, 0.2, 5, 90, 0},
	} {
		t.Run(tc.name, func(t *testing.T) {
			c := critCurve(80, critConst(tc.gz))
			c.EquilibriumDeg, c.VanishingDeg, c.Vanishes = tc.heel, tc.vanishDeg, true
			c.DownfloodingDeg, c.Downflooding = tc.floodDeg, "vent"
			if tc.floodDeg >= 90 {
				c.Downflooding = ""
			}
			rs, err := engine.EvaluateCriteria([]string{"solas-s-factor"}, engine.CriteriaCase{Curve: c, Eq: engine.Position{HeelDeg: tc.heel}, Damaged: true, ShipType: tc.shipType})
			if err != nil {
				t.Fatal(err)
			}
			r := critFind(t, rs, "solas-s-factor", "s-final")
			if math.Abs(r.Actual-tc.want) > 1e-12 {
				t.Errorf("s = %.12f, want %.12f (%s)", r.Actual, tc.want, r.Note)
			}
			if !r.Indicator || !strings.Contains(r.Source, "(memory)") {
				t.Errorf("s must be an indicator with its source marked memory: %+v", r)
			}
			if r.Pass != (tc.want >= 1) {
				t.Errorf("pass %v for s = %v", r.Pass, r.Actual)
			}
		})
	}
}

// TestCriteriaApplicability: the intact set gives rows only for an intact
// condition, the damage sets only for a damaged one; the order of the sets
// named is kept; unknown names and ship types are errors, not panics.
func TestCriteriaApplicability(t *testing.T) {
	all := engine.CriteriaSetIDs()
	if strings.Join(all, ",") != "is-code-2008,marpol-i-28,solas-s-factor" {
		t.Fatalf("sets %v", all)
	}
	c := critCurve(70, critConst(0.5))
	rs, err := engine.EvaluateCriteria(all, engine.CriteriaCase{Curve: c, Eq: engine.Position{GMM: 1}})
	if err != nil {
		t.Fatal(err)
	}
	if len(rs) != 6 {
		t.Errorf("intact: %d rows, want the IS Code's 6", len(rs))
	}
	for _, r := range rs {
		if r.Set != "is-code-2008" {
			t.Errorf("intact condition got %s/%s", r.Set, r.Code)
		}
	}
	rs, err = engine.EvaluateCriteria([]string{"solas-s-factor", "is-code-2008", "marpol-i-28"}, engine.CriteriaCase{Curve: c, Damaged: true})
	if err != nil {
		t.Fatal(err)
	}
	if len(rs) != 7 || rs[0].Set != "solas-s-factor" || rs[1].Set != "marpol-i-28" {
		t.Errorf("damaged: %d rows starting %s, %s; want s then MARPOL's 6", len(rs), rs[0].Set, rs[1].Set)
	}
	// No openings listed: the waterline criterion has nothing to check.
	if r := critFind(t, rs, "marpol-i-28", "openings-clear"); !r.Pass || r.Note == "" {
		t.Errorf("no openings: %+v", r)
	}
	for _, bad := range []struct {
		sets []string
		k    engine.CriteriaCase
		want string
	}{
		{[]string{"is-code-2009"}, engine.CriteriaCase{Curve: c}, "is-code-2009"},
		{[]string{"marpol-i-28"}, engine.CriteriaCase{}, "curve"},
		{[]string{"solas-s-factor"}, engine.CriteriaCase{Curve: c, ShipType: "tanker"}, "tanker"},
	} {
		if _, err := engine.EvaluateCriteria(bad.sets, bad.k); err == nil || !strings.Contains(err.Error(), bad.want) {
			t.Errorf("%v: error %v, want one naming %q", bad.sets, err, bad.want)
		}
	}
	if err := engine.CheckCriteriaSets([]string{"marpol-i-28", "nope"}); err == nil || !strings.Contains(err.Error(), `"nope"`) {
		t.Errorf("CheckCriteriaSets: %v", err)
	}
	if !engine.IsDamaged(engine.Damage{{}, {WaterM3: 3}}) || engine.IsDamaged(engine.Damage{{}, {Permeability: 0.5}}) {
		t.Error("IsDamaged: water held counts, a permeability alone does not")
	}
}

// TestCriteriaOnBoxCurve: the IS Code areas read off a real curve agree
// with the closed-form wall-sided curve of the same box (Barrass & Derrett
// p.130: found) integrated by the polynomial-exact rule on a fine grid,
// and GM0 with KB + BM − KG (practice).
func TestCriteriaOnBoxCurve(t *testing.T) {
	const L, B, D, T, KG = 80.0, 12.0, 14.0, 6.0, 5.0 // wall-sided to 45°
	v := gzBox(t, L, B, D, T, 0, KG, nil, nil, nil)
	eq, c := gzCurve(t, v, v.Intact())
	rs, err := engine.EvaluateCriteria([]string{"is-code-2008"}, engine.CriteriaCase{Curve: c, Eq: eq})
	if err != nil {
		t.Fatal(err)
	}
	area := func(a, b float64) float64 { // composite Simpson, 2000 panels
		const n = 2000
		h := (b - a) / n
		s := gzWallSided(B, T, KG, a) + gzWallSided(B, T, KG, b)
		for i := 1; i < n; i++ {
			w := 2.0
			if i%2 == 1 {
				w = 4
			}
			s += w * gzWallSided(B, T, KG, a+float64(i)*h)
		}
		return s * h / 3
	}
	r := math.Pi / 180
	for _, w := range []struct {
		code string
		want float64
		tol  float64
	}{
		{"area-0-30", area(0, 30*r), 5e-8},
		{"area-0-40", area(0, 40*r), 5e-8},
		{"area-30-40", area(30*r, 40*r), 5e-8},
		{"gm0", T/2 + B*B/(12*T) - KG, 1e-9},
	} {
		got := critFind(t, rs, "is-code-2008", w.code)
		if math.Abs(got.Actual-w.want) > w.tol {
			t.Errorf("%s: %.10f, want %.10f", w.code, got.Actual, w.want)
		}
	}
}

// TestGM0IsUpright: the IS Code's GM₀ (2.2.4) is the initial metacentric
// height upright, not the GM at the angle she lists or lolls to. A box
// 80 × 16 × 8 m at 4 m draft has KM = KB + BM = 2 + 16²/(12·4) = 7.333 m
// (closed form, practice); with KG 7.2333 m, GM₀ = 0.100 m, below 0.15 m,
// whatever the list an off-centre weight gives her.
func TestGM0IsUpright(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	for _, tcg := range []float64{0, 0.1} {
		v, err := engine.NewVessel(engine.Vessel{Name: "listed box", Hull: h, CriteriaSets: []string{"is-code-2008"},
			Weights: []engine.Weight{{Name: "all", MassT: 80 * 16 * 4 * 1.025, LCGM: 40, TCGM: tcg, VCGM: 2 + 16.0*16/48 - 0.1}}})
		if err != nil {
			t.Fatal(err)
		}
		a := engine.Assess(v, v.Intact())
		var found bool
		for _, r := range a.Criteria {
			if r.Code != "gm0" {
				continue
			}
			found = true
			if math.Abs(r.Actual-0.1) > 1e-9 || r.Pass {
				t.Errorf("TCG %.1f m (heel %.2f°): GM₀ %.6f m, pass %v; want 0.100000 m, fail", tcg, a.Position.HeelDeg, r.Actual, r.Pass)
			}
		}
		if !found {
			t.Errorf("TCG %.1f m: no gm0 criterion", tcg)
		}
	}
}

// TestGZ30StopsAtDownflooding: IS Code 2.2.2's GZ at 30° or more is read
// only up to the downflooding angle (the curve is not credited past it;
// practice). The curve GZ = 0.3·sin(180°·θ/90°) rises to 0.3 m at 45°; with
// downflooding at 35° the most that counts is its value there,
// 0.3·sin 70° = 0.2819 m; with downflooding at 25°, none counts.
func TestGZ30StopsAtDownflooding(t *testing.T) {
	mk := func(df float64) *engine.GZCurve {
		c := &engine.GZCurve{Toward: engine.Starboard, VanishingDeg: 90, RangeDeg: 90, DeckEdgeDeg: 90, DownfloodingDeg: df}
		for deg := 0.0; deg <= 89; deg++ {
			c.HeelDeg = append(c.HeelDeg, deg)
			c.GZM = append(c.GZM, 0.3*math.Sin(math.Pi*deg/90))
		}
		return c
	}
	for _, c := range []struct {
		df, want float64
	}{{90, 0.3}, {35, 0.3 * math.Sin(70*math.Pi/180)}, {25, 0}} {
		rs, err := engine.EvaluateCriteria([]string{"is-code-2008"}, engine.CriteriaCase{Curve: mk(c.df)})
		if err != nil {
			t.Fatal(err)
		}
		for _, r := range rs {
			if r.Code == "gz-30" && math.Abs(r.Actual-c.want) > 2e-4 {
				t.Errorf("downflooding %v°: GZ counted %.4f m, want %.4f (%s)", c.df, r.Actual, c.want, r.Note)
			}
		}
	}
}
