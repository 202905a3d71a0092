package engine_test

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"heelwatch/engine"
)

// handSpec is a compartment of a test vessel.
type handSpec struct {
	name string
	box  engine.Box
	mu   float64
	liq  *engine.Liquid
}

// handBox builds a box vessel L × B × D carrying weights ws, with the
// given compartments.
func handBox(t testing.TB, L, B, D float64, ws []engine.Weight, specs ...handSpec) *engine.Vessel {
	t.Helper()
	h, err := engine.NewBoxHull(L, B, D)
	if err != nil {
		t.Fatal(err)
	}
	return handVessel(t, h, ws, specs...)
}

func handVessel(t testing.TB, h *engine.Hull, ws []engine.Weight, specs ...handSpec) *engine.Vessel {
	t.Helper()
	return flagShip(t, h, ws, nil, specs...)
}

// handOpen returns a damage state with compartments idx open.
func handOpen(v *engine.Vessel, idx ...int) engine.Damage {
	d := v.Intact()
	for _, i := range idx {
		d[i].Open = true
	}
	return d
}

// handAndSolve works the hand method and the direct solution of v under d,
// failing the test when either cannot.
func handAndSolve(t testing.TB, v *engine.Vessel, d engine.Damage) (*engine.HandWorking, engine.Position) {
	t.Helper()
	hw, err := engine.HandMethod(v, d)
	if err != nil {
		t.Fatal(err)
	}
	pos, err := engine.Solve(v, d)
	if err != nil {
		t.Fatal(err)
	}
	return hw, pos
}

func handWeight(massT, lcg, tcg, kg float64) []engine.Weight {
	return []engine.Weight{{Name: "ship and load", MassT: massT, LCGM: lcg, TCGM: tcg, VCGM: kg}}
}

// TestHandFullBreadthSinkage: a compartment across the whole breadth, open
// from the keel through the waterline, sinks a box parallel by
// s = l·b·T·μ/((L − μl)·B) with b = B (practice: the lost-buoyancy sinkage of a
// box, lost volume ÷ intact waterplane), and moves the centre of flotation
// only lengthwise.
func TestHandFullBreadthSinkage(t *testing.T) {
	cases := []struct {
		name       string
		L, B, D, T float64
		x0, l, mu  float64
	}{
		{"60×12×6 at 3 m, 10 m machinery amidships", 60, 12, 6, 3, 25, 10, 0.85},
		{"100×20×10 at 5 m, 20 m void amidships", 100, 20, 10, 5, 40, 20, 1},
		{"80×16×8 at 4 m, 12 m stores forward", 80, 16, 8, 4, 60, 12, 0.6},
		{"150×24×14 at 9 m, 15 m aft", 150, 24, 14, 9, 5, 15, 0.95},
	}
	const tol = 1e-9
	for _, c := range cases {
		mass := engine.SeaWaterDensity * c.L * c.B * c.T
		v := handBox(t, c.L, c.B, c.D, handWeight(mass, c.L/2, 0, c.D/2),
			handSpec{"hold", engine.Box{X0: c.x0, X1: c.x0 + c.l, Y0: -c.B / 2, Y1: c.B / 2, Z0: 0, Z1: c.D}, c.mu, nil})
		hw, err := engine.HandMethod(v, handOpen(v, 0))
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		want := c.l * c.B * c.T * c.mu / ((c.L - c.mu*c.l) * c.B) // practice: box lost-buoyancy sinkage
		if math.Abs(hw.SinkageM-want) > tol {
			t.Errorf("%s: sinkage %.12f, want %.12f", c.name, hw.SinkageM, want)
		}
		if math.Abs(hw.DraftM-(c.T+want)) > tol {
			t.Errorf("%s: draft %.12f, want %.12f", c.name, hw.DraftM, c.T+want)
		}
		// practice: the intact waterplane is the box less μ·l·B, its centroid
		// the moment balance of the two rectangles.
		xF := (c.L*c.B*c.L/2 - c.mu*c.l*c.B*(c.x0+c.l/2)) / ((c.L - c.mu*c.l) * c.B)
		if math.Abs(hw.LCFM-xF) > tol || hw.CFShiftM != 0 || hw.HeelDeg != 0 {
			t.Errorf("%s: LCF %.9f (want %.9f), CF shift %g, heel %g", c.name, hw.LCFM, xF, hw.CFShiftM, hw.HeelDeg)
		}
	}
}

// handWant is what a worked case expects of the hand method.
type handWant struct {
	sinkage, draft, cfShift, kb, bm, km, gm, heelDeg, aft, fwd, trim float64
	lcf, tcb                                                         float64
}

// TestHandWorkedCases checks the hand method against worked cases of our
// own (invented numbers), each worked out by hand in its comment with the
// lost-buoyancy steps as Barrass & Derrett set them out (memory) (practice: sinkage = lost volume ÷ intact
// waterplane; parallel-axis theorem I = I₀ + A·d²; BM = I/V; GM = KB + BM −
// KG; tan θ = lever/GM; trim = Δ·lever/MCTC = lever·L/GML). Sea water
// 1.025 t/m³ (Barrass & Derrett p.130, found).
func TestHandWorkedCases(t *testing.T) {
	const tol = 1e-9
	var cases []struct {
		name string
		v    *engine.Vessel
		d    engine.Damage
		want handWant
	}
	add := func(name string, v *engine.Vessel, d engine.Damage, w handWant) {
		cases = append(cases, struct {
			name string
			v    *engine.Vessel
			d    engine.Damage
			want handWant
		}{name, v, d, w})
	}

	// A. Box 100 × 20 × 10, Δ = 10250 t, KG 6, G amidships on the centreline.
	// Wing void 40–60 m, y 6–10 (l 20, b 4, yc 8), keel to deck, μ = 1.
	//   V = 10250/1.025 = 10000 m³, T₀ = 10000/(100·20) = 5 m
	//   v = 20·4·5 = 400 m³, a = 80 m², A = 2000 − 80 = 1920 m²
	//   s = 400/1920 = 0.208333 m, T₁ = 5.208333 m
	//   yF = −(80·8)/1920 = −1/3 m (to port), xF = 50
	//   I_T = 100·20³/12 + 2000·(1/3)² − [20·4³/12 + 80·(8 + 1/3)²] = 61226.667 m⁴
	//   BM = 6.122667; KB = T₁/2 = 2.604167 (the lost prism runs keel to waterline)
	//   KM = 8.726833, GM = 2.726833
	//   TCB = −80·T₁·8/10000 = −1/3 (= yF here), lever = 0 − (−1/3)
	//   tan θ = (1/3)/2.726833 = 0.122242, θ = 6.969369° to starboard
	//   drafts aft = fwd = T₁ − tan θ·yF = 5.249081 m, trim 0
	{
		T1 := 5 + 400.0/1920
		yF := -80.0 * 8 / 1920
		iT := 100*math.Pow(20, 3)/12 + 2000*yF*yF - (20*math.Pow(4, 3)/12 + 80*math.Pow(8-yF, 2))
		bm := iT / 10000
		kb := T1 / 2
		gm := kb + bm - 6
		tcb := -80 * T1 * 8 / 10000
		tn := (0 - tcb) / gm
		dr := T1 - tn*yF
		v := handBox(t, 100, 20, 10, handWeight(10250, 50, 0, 6),
			handSpec{"wing void S", engine.Box{X0: 40, X1: 60, Y0: 6, Y1: 10, Z0: 0, Z1: 10}, 1, nil})
		add("A: side wing keel to deck", v, handOpen(v, 0), handWant{
			sinkage: 400.0 / 1920, draft: T1, cfShift: 1.0 / 3, kb: kb, bm: bm, km: kb + bm, gm: gm,
			heelDeg: math.Atan(tn) * 180 / math.Pi, aft: dr, fwd: dr, trim: 0, lcf: 50, tcb: tcb})
	}

	// B. The same box; double bottom 0–15 m aft, full breadth, 0–1.5 m: wholly
	// under water, nothing lost from the waterplane.
	//   v = 15·20·1.5 = 450 m³, a = 0, s = 450/2000 = 0.225 m, T₁ = 5.225 m
	//   I_T = 100·20³/12 = 66666.667, BM = 6.666667
	//   KB = (2000·5.225²/2 − 450·0.75)/10000 = (27300.625 − 337.5)/10000 = 2.6963125
	//   GM = 2.6963125 + 6.666667 − 6 = 3.362979
	//   LCB = (2000·5.225·50 − 450·7.5)/10000 = 51.9125
	//   BML = 20·100³/12/10000 = 166.666667, GML = 2.6963125 + 166.666667 − 6 = 163.362979
	//   trim = (51.9125 − 50)·100/163.362979 = 1.170706 m by the stern
	//   aft = 5.225 + 1.170706·50/100 = 5.810353, fwd = 5.225 − 0.585353 = 4.639647
	{
		T1 := 5.225
		kb := (2000*T1*T1/2 - 450*0.75) / 10000
		bm := 100 * math.Pow(20, 3) / 12 / 10000
		gml := kb + 20*math.Pow(100, 3)/12/10000 - 6
		trim := ((2000*T1*50-450*7.5)/10000 - 50) * 100 / gml
		v := handBox(t, 100, 20, 10, handWeight(10250, 50, 0, 6),
			handSpec{"DB 1", engine.Box{X0: 0, X1: 15, Y0: -10, Y1: 10, Z0: 0, Z1: 1.5}, 1, nil})
		add("B: double bottom wholly under water", v, handOpen(v, 0), handWant{
			sinkage: 0.225, draft: T1, cfShift: 0, kb: kb, bm: bm, km: kb + bm, gm: kb + bm - 6,
			heelDeg: 0, aft: T1 + trim*50/100, fwd: T1 - trim*50/100, trim: trim, lcf: 50, tcb: 0})
	}

	// C. Box 80 × 16 × 8, Δ = 5248 t (V = 5120, T₀ = 4), KG 5, G amidships on
	// the centreline. Wing store 50–62 m (l 12, xc 56), y 3–8 (b 5, yc 5.5),
	// z 1.5–8 (bottom above the keel), μ = 0.95: off-centre and off-midships.
	//   v = 0.95·12·5·(4 − 1.5) = 142.5 m³, a = 0.95·60 = 57 m², A = 1223 m²
	//   s = 142.5/1223 = 0.116517 m, T₁ = 4.116517 m
	//   xF = (1280·40 − 57·56)/1223 = 39.254293, yF = −57·5.5/1223 = −0.256337
	//   I_T = 80·16³/12 + 1280·yF² − 0.95[12·5³/12 + 60(5.5 − yF)²] = 25383.305
	//   I_L = 16·80³/12 + 1280(40 − xF)² − 0.95[5·12³/12 + 60(56 − xF)²] = 666710.58
	//   lost below T₁: vl = 57(T₁ − 1.5) = 149.141455 m³ centred at z = 1.5 + (T₁ − 1.5)/2
	//   KB = (1280·T₁²/2 − vl·2.808258)/5120 = 2.036411
	//   TCB = −vl·5.5/5120 = −0.160211 (not yF: the space stops short of the keel)
	//   GM = 2.036411 + 25383.305/5120 − 5 = 1.994088; tan θ = 0.160211/1.994088 = 0.080343, 4.593434°
	//   LCB = (1280·T₁·40 − vl·56)/5120 = 39.533933; GML = 2.036411 + 130.216910 − 5 = 127.253322
	//   trim = (39.533933 − 40)·80/127.253322 = −0.293001 m (by the head)
	//   aft = T₁ + trim·xF/80 − tan θ·yF = 3.993342, fwd = T₁ − trim(80 − xF)/80 − tan θ·yF = 4.286343
	{
		s := 142.5 / 1223
		T1 := 4 + s
		xF := (1280*40 - 57*56) / 1223.0
		yF := -57 * 5.5 / 1223.0
		iT := 80*math.Pow(16, 3)/12 + 1280*yF*yF - 0.95*(12*math.Pow(5, 3)/12+60*math.Pow(5.5-yF, 2))
		iL := 16*math.Pow(80, 3)/12 + 1280*math.Pow(40-xF, 2) - 0.95*(5*math.Pow(12, 3)/12+60*math.Pow(56-xF, 2))
		vl := 57 * (T1 - 1.5)
		kb := (1280*T1*T1/2 - vl*(1.5+(T1-1.5)/2)) / 5120
		tcb := -vl * 5.5 / 5120
		lcb := (1280*T1*40 - vl*56) / 5120
		gm := kb + iT/5120 - 5
		gml := kb + iL/5120 - 5
		tn := -tcb / gm
		trim := (lcb - 40) * 80 / gml
		v := handBox(t, 80, 16, 8, handWeight(5248, 40, 0, 5),
			handSpec{"3 wing store S", engine.Box{X0: 50, X1: 62, Y0: 3, Y1: 8, Z0: 1.5, Z1: 8}, 0.95, nil})
		add("C: off-centre, off-midships, bottom above the keel", v, handOpen(v, 0), handWant{
			sinkage: s, draft: T1, cfShift: -yF, kb: kb, bm: iT / 5120, km: kb + iT/5120, gm: gm,
			heelDeg: math.Atan(tn) * 180 / math.Pi, aft: T1 + trim*xF/80 - tn*yF, fwd: T1 - trim*(80-xF)/80 - tn*yF,
			trim: trim, lcf: xF, tcb: tcb})
	}

	// D. Box 100 × 20 × 10, Δ = 10250 t; tank 40–60 m across the breadth, keel
	// to 5.1 m (its top just above the intact waterline), μ = 1.
	//   first estimate: v = 20·20·5 = 2000, A = 2000 − 400 = 1600, s = 1.25: T₀ + s
	//   = 6.25 passes the top at 5.1, so in stages:
	//   5 → 5.1 over 1600 m² regains 160 m³ of 2000; wanting 1840
	//   above 5.1 the whole 2000 m² is intact: T₁ = 5.1 + 1840/2000 = 6.02 m, s = 1.02
	//   check: 2000·6.02 − 20·20·5.1 = 12040 − 2040 = 10000 ✓
	//   KB = (2000·6.02²/2 − 2040·2.55)/10000 = 3.10384, BM = 6.666667, GM = 3.770507
	{
		T1 := 5.1 + 1840.0/2000
		kb := (2000*T1*T1/2 - 2040*2.55) / 10000
		bm := 100 * math.Pow(20, 3) / 12 / 10000
		v := handBox(t, 100, 20, 10, handWeight(10250, 50, 0, 6),
			handSpec{"2 DB tank", engine.Box{X0: 40, X1: 60, Y0: -10, Y1: 10, Z0: 0, Z1: 5.1}, 1, nil})
		add("D: sinkage passes a tank top", v, handOpen(v, 0), handWant{
			sinkage: T1 - 5, draft: T1, kb: kb, bm: bm, km: kb + bm, gm: kb + bm - 6, aft: T1, fwd: T1, lcf: 50})
	}

	// E. The same box; hold 40–60 m across the breadth, keel to deck, and a
	// 'tween-deck wing 0–20 m, y 6–10, from 5.5 m up (its bottom above the
	// intact waterline), both open, μ = 1.
	//   first estimate: s = 2000/1600 = 1.25 passes the wing's bottom at 5.5:
	//   5 → 5.5 over 1600 m² regains 800 of 2000; wanting 1200
	//   above 5.5: A = 2000 − 400 − 80 = 1520, T₁ = 5.5 + 1200/1520 = 6.289474
	//   xF = (2000·50 − 400·50 − 80·10)/1520 = 52.105263, yF = −80·8/1520 = −0.421053
	//   I_T = 100·20³/12 + 2000·yF² − [20·20³/12 + 400·yF²] − [20·4³/12 + 80·(8 − yF)²]
	//   KB = (2000·T₁²/2 − 400·T₁·T₁/2 − 80(T₁ − 5.5)(5.5 + (T₁ − 5.5)/2))/10000
	//   TCB = −80(T₁ − 5.5)·8/10000, LCB = (2000·T₁·50 − 400·T₁·50 − 80(T₁ − 5.5)·10)/10000
	//   I_L = 20·100³/12 + 2000(50 − xF)² − [20·20³/12 + 400(50 − xF)²] − [4·20³/12 + 80(10 − xF)²]
	{
		T1 := 5.5 + 1200.0/1520
		xF := (2000*50 - 400*50 - 80*10) / 1520.0
		yF := -80.0 * 8 / 1520
		iT := 100*math.Pow(20, 3)/12 + 2000*yF*yF - (20*math.Pow(20, 3)/12 + 400*yF*yF) - (20*math.Pow(4, 3)/12 + 80*math.Pow(8-yF, 2))
		iL := 20*math.Pow(100, 3)/12 + 2000*math.Pow(50-xF, 2) - (20*math.Pow(20, 3)/12 + 400*math.Pow(50-xF, 2)) - (4*math.Pow(20, 3)/12 + 80*math.Pow(10-xF, 2))
		dw := T1 - 5.5
		kb := (2000*T1*T1/2 - 400*T1*T1/2 - 80*dw*(5.5+dw/2)) / 10000
		tcb := -80 * dw * 8 / 10000
		lcb := (2000*T1*50 - 400*T1*50 - 80*dw*10) / 10000
		gm := kb + iT/10000 - 6
		gml := kb + iL/10000 - 6
		tn := -tcb / gm
		trim := (lcb - 50) * 100 / gml
		v := handBox(t, 100, 20, 10, handWeight(10250, 50, 0, 6),
			handSpec{"hold 2", engine.Box{X0: 40, X1: 60, Y0: -10, Y1: 10, Z0: 0, Z1: 10}, 1, nil},
			handSpec{"tween wing S", engine.Box{X0: 0, X1: 20, Y0: 6, Y1: 10, Z0: 5.5, Z1: 10}, 1, nil})
		add("E: sinkage passes a wing's bottom, two spaces open", v, handOpen(v, 0, 1), handWant{
			sinkage: T1 - 5, draft: T1, cfShift: -yF, kb: kb, bm: iT / 10000, km: kb + iT/10000, gm: gm,
			heelDeg: math.Atan(tn) * 180 / math.Pi, aft: T1 + trim*xF/100 - tn*yF, fwd: T1 - trim*(100-xF)/100 - tn*yF,
			trim: trim, lcf: xF, tcb: tcb})
	}

	for _, c := range cases {
		hw, err := engine.HandMethod(c.v, c.d)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		w := c.want
		for _, f := range []struct {
			name      string
			got, want float64
		}{
			{"sinkage", hw.SinkageM, w.sinkage}, {"draft", hw.DraftM, w.draft}, {"cf shift", hw.CFShiftM, w.cfShift},
			{"KB", hw.KBM, w.kb}, {"BM", hw.BMM, w.bm}, {"KM", hw.KMM, w.km}, {"GM", hw.GMM, w.gm},
			{"heel", hw.HeelDeg, w.heelDeg}, {"draft aft", hw.DraftAftM, w.aft}, {"draft fwd", hw.DraftFwdM, w.fwd},
			{"trim", hw.TrimM, w.trim}, {"LCF", hw.LCFM, w.lcf}, {"TCB", hw.TCBM, w.tcb},
		} {
			if math.Abs(f.got-f.want) > tol*math.Max(1, math.Abs(f.want)) {
				t.Errorf("%s: %s = %.12f, want %.12f", c.name, f.name, f.got, f.want)
			}
		}
		if len(hw.Steps) < 10 {
			t.Errorf("%s: only %d steps of working", c.name, len(hw.Steps))
		}
		for _, s := range hw.Steps {
			if s.Label == "" || s.Formula == "" || math.IsNaN(s.Value) || math.IsInf(s.Value, 0) {
				t.Errorf("%s: step %+v is incomplete", c.name, s)
			}
		}
	}
}

// TestHandWorkingStaged: where the sinkage passes a space's top, the working
// says so and shows the stages.
func TestHandWorkingStaged(t *testing.T) {
	v := handBox(t, 100, 20, 10, handWeight(10250, 50, 0, 6),
		handSpec{"2 DB tank", engine.Box{X0: 40, X1: 60, Y0: -10, Y1: 10, Z0: 0, Z1: 5.1}, 1, nil})
	hw, err := engine.HandMethod(v, handOpen(v, 0))
	if err != nil {
		t.Fatal(err)
	}
	var labels []string
	for _, s := range hw.Steps {
		labels = append(labels, s.Label)
	}
	all := strings.Join(labels, "\n")
	for _, want := range []string{"the sinkage passes the top of 2 DB tank", "stage 5.000 → 5.100 m", "last stage"} {
		if !strings.Contains(all, want) {
			t.Errorf("working lacks %q:\n%s", want, all)
		}
	}
}

// TestHandNotApplicable: where the method does not apply, a nil result and
// a *HandNotApplicable saying why.
func TestHandNotApplicable(t *testing.T) {
	sh, err := engine.NewSectionHull(60, []engine.Station{
		{X: 0, Offsets: []engine.Point{{Y: 0, Z: 0}, {Y: 6, Z: 0}, {Y: 6, Z: 6}}},
		{X: 60, Offsets: []engine.Point{{Y: 0, Z: 0}, {Y: 6, Z: 0}, {Y: 6, Z: 6}}},
	})
	if err != nil {
		t.Fatal(err)
	}
	wing := handSpec{"wing", engine.Box{X0: 20, X1: 40, Y0: 2, Y1: 6, Z0: 0, Z1: 6}, 1, nil}
	hold := handSpec{"hold", engine.Box{X0: 10, X1: 50, Y0: -6, Y1: 6, Z0: 0, Z1: 6}, 1, nil}
	mass := engine.SeaWaterDensity * 60 * 12 * 3
	_ = sh // a hull from offsets has the ship's working (hand_ship_test.go)
	bv := handBox(t, 60, 12, 6, handWeight(mass, 30, 0, 4), wing, hold)
	heldOnly := bv.Intact()
	heldOnly[0].WaterM3 = 50
	mixed := handOpen(bv, 1)
	mixed[0].WaterM3 = 50
	cases := []struct {
		name string
		v    *engine.Vessel
		d    engine.Damage
		want string // part of the reason
	}{
		{"nothing open", bv, bv.Intact(), "no compartment is open to the sea"},
		{"only added-weight water", bv, heldOnly, "the only floodwater is held as an added weight (wing)"},
		{"added weight beside an open space", bv, mixed, "held as an added weight in wing"},
		{"sinkage past the deck", bv, handOpen(bv, 0, 1), "past the deck"},
	}
	for _, c := range cases {
		hw, err := engine.HandMethod(c.v, c.d)
		var na *engine.HandNotApplicable
		if hw != nil || !errors.As(err, &na) {
			t.Errorf("%s: got %v, %v; want nil and a *HandNotApplicable", c.name, hw, err)
			continue
		}
		if !strings.Contains(na.Reason, c.want) {
			t.Errorf("%s: reason %q lacks %q", c.name, na.Reason, c.want)
		}
	}
}

// TestHandAgreesWithDirectAtSmallHeel: at heels under 3° the hand method and
// the direct solution (engine.Solve, the free-floating equilibrium from the
// geometry) agree within 1 % of the draft and 0.1° of heel — well inside
// the acceptance tolerances for onboard programs (MSC.1/Circ.1229: drafts
// 1 %, memory; equilibrium angles ±1°, memory).
func TestHandAgreesWithDirectAtSmallHeel(t *testing.T) {
	wingS := handSpec{"wing S", engine.Box{X0: 36, X1: 44, Y0: 6.5, Y1: 8, Z0: 0, Z1: 8}, 0.95, nil}
	wingP := handSpec{"wing P aft", engine.Box{X0: 8, X1: 18, Y0: -8, Y1: -6, Z0: 1.2, Z1: 8}, 0.85, nil}
	dbC := handSpec{"DB centre fwd", engine.Box{X0: 55, X1: 70, Y0: -3, Y1: 3, Z0: 0, Z1: 1.2}, 0.95, nil}
	engR := handSpec{"engine room", engine.Box{X0: 4, X1: 16, Y0: -8, Y1: 8, Z0: 0, Z1: 8}, 0.85, nil}
	tank := handSpec{"fuel 3 S", engine.Box{X0: 45, X1: 55, Y0: 2, Y1: 8, Z0: 0, Z1: 5}, 0.95, &engine.Liquid{Name: "fuel oil", Density: 0.95, Fill: 0.6}}
	// The fuel tank's contents (0.95 × 0.6 × 300 m³ = 171 t at y = 5) are
	// balanced by stores to port, so that she floats upright intact.
	ws := []engine.Weight{{Name: "ship", MassT: 4300, LCGM: 39, TCGM: 0, VCGM: 4.6, FSMTm: 300},
		{Name: "stores P", MassT: 171, LCGM: 50, TCGM: -5, VCGM: 3}}
	v := handBox(t, 80, 16, 8, ws, wingS, wingP, dbC, engR, tank)
	cases := []struct {
		name string
		open []int
	}{
		{"wing amidships", []int{0}},
		{"wing aft with its bottom above the keel", []int{1}},
		{"double bottom, wholly under water", []int{2}},
		{"engine room across the breadth", []int{3}},
		{"fuel tank loses its contents", []int{4}},
		{"wing and double bottom", []int{0, 2}},
		{"two wings, opposite sides", []int{0, 1}},
		{"engine room, wing, double bottom", []int{0, 2, 3}},
	}
	const heelTol, draftTol = 0.1, 0.01
	for _, c := range cases {
		d := handOpen(v, c.open...)
		hw, err := engine.HandMethod(v, d)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		pos, err := engine.Solve(v, d)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if math.Abs(pos.HeelDeg) >= 3 {
			t.Fatalf("%s: direct heel %.2f° is not under 3°: the case does not test what it says", c.name, pos.HeelDeg)
		}
		if dh := math.Abs(hw.HeelDeg - pos.HeelDeg); dh > heelTol {
			t.Errorf("%s: heel hand %.4f°, direct %.4f°", c.name, hw.HeelDeg, pos.HeelDeg)
		}
		for _, dr := range []struct {
			name      string
			hand, dir float64
		}{{"aft", hw.DraftAftM, pos.DraftAftM}, {"mid", hw.DraftMidM, pos.DraftMidM}, {"fwd", hw.DraftFwdM, pos.DraftFwdM}} {
			if math.Abs(dr.hand-dr.dir) > draftTol*pos.DraftMidM {
				t.Errorf("%s: draft %s hand %.4f, direct %.4f", c.name, dr.name, dr.hand, dr.dir)
			}
		}
		t.Logf("%s: heel hand %.4f° (coupled %.4f°) direct %.4f°; trim hand %.4f (coupled %.4f) direct %.4f; GM hand %.3f",
			c.name, hw.HeelDeg, hw.CoupledHeelDeg, pos.HeelDeg, hw.TrimM, hw.CoupledTrimM, pos.TrimM, hw.GMM)
	}
}

// TestHandPartsAsWallSided: a box with a wing open amidships (so that heel
// and trim do not couple) and G on the centreline. While the deck edge is
// dry and the bilge under, the direct heel satisfies the wall-sided relation
// tan θ·(GM + ½·BM·tan²θ) = TCG − TCB' of the remaining body (wall-sided
// formula, Barrass & Derrett p.130 and Tupper p.49, found), whose small-angle
// limit is the hand method's tan θ = lever/GM. So the two part by exactly
// ½·BM·tan³θ/GM in tan θ: growing as the cube of the heel.
func TestHandPartsAsWallSided(t *testing.T) {
	const L, B, D, T = 80.0, 16.0, 8.0, 4.0
	mass := engine.SeaWaterDensity * L * B * T
	var prevGap float64
	for i, b := range []float64{0.8, 1.6, 2.4, 3.2, 4.0} {
		v := handBox(t, L, B, D, handWeight(mass, L/2, 0, 5.6),
			handSpec{"wing", engine.Box{X0: 30, X1: 50, Y0: B/2 - b, Y1: B / 2, Z0: 0, Z1: D}, 1, nil})
		d := handOpen(v, 0)
		hw, pos := handAndSolve(t, v, d)
		if pos.DeckEdge.HeightM <= 0 || pos.Plane.Height(0, -B/2, 0) >= 0 {
			t.Fatalf("wing %.1f m: deck edge or bilge reached at %.2f°: outside the wall-sided range", b, pos.HeelDeg)
		}
		td := math.Tan(pos.HeelDeg * math.Pi / 180)
		th := math.Tan(hw.HeelDeg * math.Pi / 180)
		lever := 0 - hw.TCBM
		// wall-sided relation (found): GM·t + ½·BM·t³ = lever
		if r := hw.GMM*td + hw.BMM*td*td*td/2 - lever; math.Abs(r) > 1e-9 {
			t.Errorf("wing %.1f m: wall-sided residual %.3g at %.4f°", b, r, pos.HeelDeg)
		}
		// hand: its small-angle limit; the gap is ½·BM·t³/GM
		gap := th - td
		want := hw.BMM * td * td * td / 2 / hw.GMM
		if math.Abs(gap-want) > 1e-9 {
			t.Errorf("wing %.1f m: hand − direct tan θ = %.6g, wall-sided term predicts %.6g", b, gap, want)
		}
		if i > 0 && !(gap > prevGap) {
			t.Errorf("wing %.1f m: the gap %.6g does not grow with the heel (was %.6g)", b, gap, prevGap)
		}
		prevGap = gap
		t.Logf("wing %.1f m: direct %.4f°, hand %.4f°, apart %.4f°", b, pos.HeelDeg, hw.HeelDeg, hw.HeelDeg-pos.HeelDeg)
	}
}

// handExpect is the lost-buoyancy method worked independently of hand.go
// for a box with open spaces: the new draft by bisection on the volume,
// the second moments about the centreline and the aft perpendicular shifted
// back to the centroid (the parallel-axis theorem used the other way round),
// and KB, LCB, TCB as moments of the remaining prisms (practice: the
// lost-buoyancy steps as Barrass & Derrett set them out, memory).
type handExpect struct {
	sinkage, draft, cfShift, kb, bm, km, gm, heelDeg, aft, fwd, trim float64
}

type handRect struct{ x0, x1, y0, y1, z0, z1, mu float64 }

func handExpected(L, B, D, V, kg, lcg, tcg, fsc float64, sp []handRect) (handExpect, bool) {
	LB := L * B
	dep := func(r handRect, t float64) float64 { return math.Max(0, math.Min(t, r.z1)-r.z0) }
	lost := func(t float64) float64 {
		s := 0.0
		for _, r := range sp {
			s += r.mu * (r.x1 - r.x0) * (r.y1 - r.y0) * dep(r, t)
		}
		return s
	}
	T0 := V / LB
	lo, hi := T0, D
	if LB*D-lost(D) <= V {
		return handExpect{}, false
	}
	for i := 0; i < 200; i++ {
		m := (lo + hi) / 2
		if LB*m-lost(m) < V {
			lo = m
		} else {
			hi = m
		}
	}
	T1 := (lo + hi) / 2
	A, sx, sy := LB, LB*L/2, 0.0
	icl, iap := L*B*B*B/12, B*L*L*L/3
	for _, r := range sp {
		if !(T1 >= r.z0 && T1 < r.z1) {
			continue
		}
		l, b := r.x1-r.x0, r.y1-r.y0
		a := r.mu * l * b
		xc, yc := (r.x0+r.x1)/2, (r.y0+r.y1)/2
		A -= a
		sx -= a * xc
		sy -= a * yc
		icl -= r.mu * (l*b*b*b/12 + l*b*yc*yc)
		iap -= r.mu * (b*l*l*l/12 + l*b*xc*xc)
	}
	xF, yF := sx/A, sy/A
	iT := icl - A*yF*yF
	iL := iap - A*xF*xF
	mz, mx, my := LB*T1*T1/2, LB*T1*L/2, 0.0
	for _, r := range sp {
		dd := dep(r, T1)
		vol := r.mu * (r.x1 - r.x0) * (r.y1 - r.y0) * dd
		mz -= vol * (r.z0 + dd/2)
		mx -= vol * (r.x0 + r.x1) / 2
		my -= vol * (r.y0 + r.y1) / 2
	}
	kb, lcb, tcb := mz/V, mx/V, my/V
	gm := kb + iT/V - kg - fsc
	gml := kb + iL/V - kg - fsc
	tn := (tcg - tcb) / gm
	trim := (lcb - lcg) * L / gml
	return handExpect{
		sinkage: T1 - T0, draft: T1, cfShift: math.Abs(yF), kb: kb, bm: iT / V, km: kb + iT/V, gm: gm,
		heelDeg: math.Atan(tn) * 180 / math.Pi,
		aft:     T1 + trim*xF/L - tn*yF, fwd: T1 - trim*(L-xF)/L - tn*yF, trim: trim,
	}, true
}

// TestHandPropertyRandomBoxes: on random boxes with one to three open
// spaces (any place, clipped by the hull, any height range), the hand
// method's figures match the lost-buoyancy method worked independently
// (handExpected; practice) to 1 mm, 0.1 % and 0.02°.
func TestHandPropertyRandomBoxes(t *testing.T) {
	rng := rand.New(rand.NewPCG(4, 2026))
	const mm, rel, deg = 1e-3, 1e-3, 0.02
	checked := 0
	for n := 0; n < 400; n++ {
		L := 40 + 110*rng.Float64()
		B := 8 + 22*rng.Float64()
		D := 0.35*B + 0.4*B*rng.Float64()
		T := D * (0.3 + 0.35*rng.Float64())
		V := L * B * T
		var specs []handSpec
		var rects []handRect
		for k := 0; k < 1+rng.IntN(3); k++ {
			x0 := -5 + (L+5)*rng.Float64()
			y0 := -B/2 - 1 + (B+1)*rng.Float64()
			z0 := math.Max(0, -1+D*rng.Float64())
			bx := engine.Box{X0: x0, X1: x0 + 3 + 0.2*L*rng.Float64(), Y0: y0, Y1: y0 + 1 + 0.6*B*rng.Float64(),
				Z0: z0, Z1: z0 + 0.5 + D*rng.Float64()}
			// The part inside the hull, as the hand method clips it.
			r := handRect{math.Max(bx.X0, 0), math.Min(bx.X1, L), math.Max(bx.Y0, -B/2), math.Min(bx.Y1, B/2),
				math.Max(bx.Z0, 0), math.Min(bx.Z1, D), 0.6 + 0.4*rng.Float64()}
			if r.x1-r.x0 < 0.5 || r.y1-r.y0 < 0.5 || r.z1-r.z0 < 0.2 {
				continue
			}
			specs = append(specs, handSpec{fmt.Sprintf("space %d", k+1), bx, r.mu, nil})
			rects = append(rects, r)
		}
		if len(specs) == 0 {
			continue
		}
		// KG leaving an upright GM of at least 0.3 m intact and after damage
		// (checked below); G a little off amidships and the centreline.
		lcg := L/2 + 0.02*L*(rng.Float64()-0.5)
		tcg := 0.01 * B * (rng.Float64() - 0.5)
		kg := T/2 + B*B/(12*T) - 0.5 - 2*rng.Float64()
		fsm := 50 * rng.Float64()
		mass := engine.SeaWaterDensity * V
		want, ok := handExpected(L, B, D, V, kg, lcg, tcg, fsm/mass, rects)
		if !ok || want.gm < 0.3 {
			continue
		}
		v := handBox(t, L, B, D, []engine.Weight{{Name: "ship", MassT: mass, LCGM: lcg, TCGM: tcg, VCGM: kg, FSMTm: fsm}}, specs...)
		d := v.Intact()
		for i := range d {
			d[i].Open = true
		}
		hw, err := engine.HandMethod(v, d)
		if err != nil {
			t.Errorf("case %d: %v", n, err)
			continue
		}
		checked++
		for _, f := range []struct {
			name      string
			got, want float64
			tol       float64
		}{
			{"sinkage_m", hw.SinkageM, want.sinkage, mm}, {"draft_m", hw.DraftM, want.draft, mm},
			{"cf_shift_m", hw.CFShiftM, want.cfShift, mm}, {"kb_m", hw.KBM, want.kb, mm},
			{"bm_m", hw.BMM, want.bm, rel * want.bm}, {"km_m", hw.KMM, want.km, mm}, {"gm_m", hw.GMM, want.gm, mm},
			{"heel_deg", hw.HeelDeg, want.heelDeg, deg}, {"draft_aft_m", hw.DraftAftM, want.aft, mm},
			{"draft_fwd_m", hw.DraftFwdM, want.fwd, mm}, {"trim_m", hw.TrimM, want.trim, mm},
		} {
			if !(math.Abs(f.got-f.want) <= f.tol) {
				t.Errorf("case %d (L %.1f B %.1f D %.1f T %.2f, %d spaces): %s = %.6f, want %.6f", n, L, B, D, T, len(specs), f.name, f.got, f.want)
			}
		}
	}
	if checked < 150 {
		t.Errorf("only %d random cases were checked", checked)
	}
	t.Logf("%d random box cases checked", checked)
}

// TestHandLoll: with GM negative after flooding there is no small-angle
// list; the working gives the angle of loll of the wall-sided relation,
// tan θ = √(−2GM/BM) with G on the centreline (practice: it follows from the
// wall-sided formula, Barrass & Derrett p.130, found, with GZ = 0), which the
// direct solution also finds on a box. Hold across the breadth amidships,
// keel to deck, μ = 0.5: T₁ = T + μ·l·B·T/(L·B − μ·l·B), KB = T₁/2 (the
// remaining body is a prism), I = (L − μ·l)·B³/12.
func TestHandLoll(t *testing.T) {
	const L, B, D, T, l, mu = 60.0, 12.0, 8.0, 3.0, 10.0, 0.5
	kg := T/2 + B*B/(12*T) + 0.1 // intact GM −0.1 (practice: box KM = T/2 + B²/12T)
	v := handBox(t, L, B, D, handWeight(engine.SeaWaterDensity*L*B*T, L/2, 0, kg),
		handSpec{"hold", engine.Box{X0: 25, X1: 35, Y0: -B / 2, Y1: B / 2, Z0: 0, Z1: D}, mu, nil})
	d := handOpen(v, 0)
	T1 := T + mu*l*B*T/(L*B-mu*l*B)
	bm := (L - mu*l) * B * B * B / 12 / (L * B * T)
	gm := T1/2 + bm - kg
	want := math.Atan(math.Sqrt(-2*gm/bm)) * 180 / math.Pi
	hw, pos := handAndSolve(t, v, d)
	if math.Abs(hw.GMM-gm) > 1e-9 || math.Abs(hw.HeelDeg-want) > 1e-7 || math.Abs(math.Abs(pos.HeelDeg)-want) > 1e-7 {
		t.Errorf("GM %.9f (want %.9f); loll hand %.9f°, direct %.9f°, closed form %.9f°", hw.GMM, gm, hw.HeelDeg, pos.HeelDeg, want)
	}
	found := false
	for _, s := range hw.Steps {
		found = found || s.Label == "tan θ (loll)"
	}
	if !found {
		t.Error("the working does not say the heel is a loll")
	}
}
