package engine

// Tests of flooding through a hole over time. Each compares with a closed
// form derived in its comment from Torricelli's law (practice: any
// hydraulics text) or with the lost-buoyancy solution, which the added-weight
// method must meet in the final waterline (Barrass & Derrett, bilging
// chapter; Tupper, flooding chapter — memory).

import (
	"math"
	"math/rand"
	"strings"
	"testing"
)

// flBox is a box barge floating level at draft T with KG kg, and its
// compartments.
type flBox struct {
	L, B, D, T, KG float64
	comps          []flComp
	openings       []Opening
	shipType       string
}

type flComp struct {
	name string
	box  Box
	mu   float64
}

func (b flBox) vessel(t testing.TB) *Vessel {
	t.Helper()
	h, err := NewBoxHull(b.L, b.B, b.D)
	if err != nil {
		t.Fatal(err)
	}
	v := Vessel{Name: "flooding test barge (invented)", Hull: h, Openings: b.openings, ShipType: b.shipType,
		Weights: []Weight{{Name: "barge", MassT: SeaWaterDensity * b.L * b.B * b.T, LCGM: b.L / 2, VCGM: b.KG}}}
	for _, c := range b.comps {
		cp, err := NewCompartment(h, c.name, c.box)
		if err != nil {
			t.Fatal(err)
		}
		cp.Permeability = c.mu
		v.Compartments = append(v.Compartments, cp)
	}
	vs, err := NewVessel(v)
	if err != nil {
		t.Fatal(err)
	}
	return vs
}

// flTorricelliTime is the closed form for a compartment of constant plan
// area A_e filling through a hole of area a, coefficient C_d, while the head
// goes from h0 to h1.
//
// Derivation (Torricelli, practice): the inflow is dV/dt = C_d·a·√(2 g h);
// the head falls as the water rises, dh = −dV/A_e, so
// dh/dt = −(C_d·a·√(2g)/A_e)·√h. Separating, dh/√h = −k dt with
// k = C_d·a·√(2g)/A_e, and integrating, 2(√h0 − √h1) = k·t, that is
// t = (2·A_e/(C_d·a·√(2g)))·(√h0 − √h1).
func flTorricelliTime(ae, cd, a, h0, h1 float64) float64 {
	return 2 * ae / (cd * a * math.Sqrt(2*StandardGravity)) * (math.Sqrt(h0) - math.Sqrt(h1))
}

func flClose(got, want, tol float64) bool {
	return math.Abs(got-want) <= tol
}

// TestFloodIntegratorFixedSea checks the integrator alone (no ship) against
// the closed form: a box compartment of plan area A_c, its hole in the
// bottom, the sea at a fixed height H above it. Inside level y/A_c, head
// H − y/A_c, dy/dt = C_d·a·√(2 g (H − y/A_c)); the time for the head to go
// from H to h1 is flTorricelliTime(A_c, C_d, a, H, h1) (Torricelli,
// practice), and the volume at time t is A_c·(H − (√H − k t/2)²).
func TestFloodIntegratorFixedSea(t *testing.T) {
	cases := []struct {
		name         string
		ac, a, cd, H float64
		tol          float64 // relative, on volume and on times
	}{
		{"small hole, deep", 80, 0.05, 0.6, 5, 1e-7},
		{"large hole, shallow", 12, 0.5, 0.7, 1.2, 1e-7},
		{"ragged hole, big tank", 400, 0.2, 0.65, 8, 1e-7},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			f := func(y float64) (float64, error) {
				h := c.H - y/c.ac
				return math.Copysign(c.cd*c.a*math.Sqrt(2*StandardGravity*math.Abs(h)), h), nil
			}
			cap := c.ac * c.H * 2
			st := stepper{f: f, fy: c.cd * c.a * math.Sqrt(2*StandardGravity*c.H), dt: 1, atol: floodAbsTol * cap, rtol: floodRelTol, dtMin: 1e-3, ymax: cap, maxTries: 5000}
			k := c.cd * c.a * math.Sqrt(2*StandardGravity) / c.ac
			tEq := flTorricelliTime(c.ac, c.cd, c.a, c.H, 0)
			h1 := c.H / 4
			tQuarter := flTorricelliTime(c.ac, c.cd, c.a, c.H, h1)
			var quarterAt float64
			// As far as a run goes: to 1 mm of head.
			tStop := flTorricelliTime(c.ac, c.cd, c.a, c.H, FloodHeadTolM)
			var worst float64
			for st.t < tStop {
				rec, err := st.advance(tStop)
				if err != nil {
					t.Fatal(err)
				}
				s := math.Sqrt(c.H) - k*rec.t1/2
				want := c.ac * (c.H - s*s)
				worst = math.Max(worst, math.Abs(rec.y1-want)/(c.ac*c.H))
				if !flClose(rec.y1, want, c.tol*c.ac*c.H) {
					t.Fatalf("t %.3f s: volume %.9g, closed form %.9g", rec.t1, rec.y1, want)
				}
				// The time the head passed H/4, on the step's interpolant.
				target := c.ac * (c.H - h1)
				if quarterAt == 0 && rec.y0 < target && rec.y1 >= target {
					lo, hi := 0.0, 1.0
					for i := 0; i < 60; i++ {
						if m := (lo + hi) / 2; rec.at(m) < target {
							lo = m
						} else {
							hi = m
						}
					}
					quarterAt = rec.t0 + (lo+hi)/2*(rec.t1-rec.t0)
				}
			}
			if !flClose(quarterAt, tQuarter, c.tol*tEq) {
				t.Errorf("head H/4 reached at %.6f s, closed form %.6f s", quarterAt, tQuarter)
			}
			t.Logf("%d trial steps, worst error %.2g of the volume", st.tries, worst)
			if st.tries > 400 {
				t.Errorf("%d trial steps: the error control is not working", st.tries)
			}
		})
	}
}

// TestFloodCentreBoxClosedForm runs whole flooding cases on a box barge
// with a box compartment amidships on the centreline, its hole in the
// bottom: she sinks bodily (no heel, no trim; the sides are vertical), so
// the sea at the hole rises by V/A_wp and the water inside by V/(μ·A_c).
// The head is h = T0 + V/A_wp − V/(μ·A_c) = T0 − V/A_e with
// 1/A_e = 1/(μ·A_c) − 1/A_wp, and dh/dt = −(C_d·a·√(2g)/A_e)·√h: the same
// Torricelli closed form (practice) with the effective area A_e. The levels
// meet at t = flTorricelliTime(A_e, C_d, a, T0, 0) holding V = A_e·T0; the
// margin line (76 mm below the deck, SOLAS 1974 II-1, found) goes under when
// the draft is D − 0.076, at V = A_wp·(D − 0.076 − T0); the final state
// equals the lost-buoyancy solution (memory).
func TestFloodCentreBoxClosedForm(t *testing.T) {
	cases := []struct {
		name        string
		b           flBox
		a, cd       float64
		margin      bool    // the margin line goes under before the levels meet
		tolS, tolM3 float64 // on the times, on the volume
	}{
		{"void amidships", flBox{L: 100, B: 20, D: 10, T: 5, KG: 4, comps: []flComp{{"centre void", Box{45, 55, -4, 4, 0, 10}, 1}}}, 0.05, 0.6, false, 0.5, 0.05},
		{"stores μ 0.6", flBox{L: 100, B: 20, D: 10, T: 5, KG: 4, comps: []flComp{{"centre store", Box{45, 55, -4, 4, 0, 10}, 0.6}}}, 0.1, 0.65, false, 0.5, 0.05},
		{"full-breadth hold, margin line, door", flBox{L: 100, B: 20, D: 6, T: 5, KG: 4, shipType: "passenger", comps: []flComp{{"hold", Box{42, 58, -10, 10, 0, 6}, 1}},
			openings: []Opening{{Name: "side door", X: 70, Y: 10, Z: 5.5}, {Name: "closed port", X: 30, Y: -10, Z: 5.3, Weathertight: true}}}, 0.3, 0.6, true, 0.5, 0.2},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			v := c.b.vessel(t)
			cp := c.b.comps[0]
			ac := (cp.box.X1 - cp.box.X0) * (cp.box.Y1 - cp.box.Y0)
			awp := c.b.L * c.b.B
			ae := 1 / (1/(cp.mu*ac) - 1/awp)
			hole := Hole{AreaM2: c.a, XM: c.b.L / 2, YM: 0, ZM: 0, Cd: c.cd}
			rep, err := RunFlood(FloodCase{Vessel: v, Compartment: 0, Hole: hole}, nil)
			if err != nil {
				t.Fatal(err)
			}
			if rep.End != FloodEqualised {
				t.Fatalf("end %v (%s), want equalised", rep.End, rep.EndReason)
			}
			tEq := flTorricelliTime(ae, c.cd, c.a, c.b.T, 0) // Torricelli (practice)
			if !flClose(rep.EqualiseS, tEq, c.tolS) {
				t.Errorf("time to equalise %.3f s, closed form %.3f s", rep.EqualiseS, tEq)
			}
			if !flClose(rep.FinalWaterM3, ae*c.b.T, ae*FloodHeadTolM) { // stops within 1 mm of head
				t.Errorf("water at equalisation %.4f m³, closed form A_e·T0 = %.4f m³", rep.FinalWaterM3, ae*c.b.T)
			}
			// Every step on the closed-form path: V(t) = A_e·(T0 − (√T0 − k t/2)²).
			k := c.cd * c.a * math.Sqrt(2*StandardGravity) / ae
			for _, s := range rep.Trace {
				r := math.Max(math.Sqrt(c.b.T)-k*s.TimeS/2, 0)
				if want := ae * (c.b.T - r*r); !flClose(s.WaterM3, want, c.tolM3) {
					t.Fatalf("t %.1f s: water %.4f m³, closed form %.4f m³", s.TimeS, s.WaterM3, want)
				}
				if p := s.Position; p == nil || math.Abs(p.HeelDeg) > 1e-6 || math.Abs(p.TrimM) > 1e-6 {
					t.Fatalf("t %.1f s: not upright and level: %+v", s.TimeS, p)
				}
			}
			// Final state against the lost-buoyancy solution (memory), 5 mm.
			if rep.LostBuoyancy == nil || rep.FinalDiffM > 0.005 {
				t.Errorf("final drafts differ from lost buoyancy by %.4f m (lost buoyancy %v)", rep.FinalDiffM, rep.LostBuoyancyNoEq)
			}
			// Each opening that is not weathertight goes under when the
			// draft reaches its height: at V = A_wp·(z − T0).
			for _, o := range c.b.openings {
				var ev *FloodEvent
				for i, e := range rep.Events {
					if e.Kind == OpeningReached && e.Name == o.Name {
						ev = &rep.Events[i]
					}
				}
				if o.Weathertight {
					if ev != nil {
						t.Errorf("%s is weathertight but reported at %.1f s", o.Name, ev.TimeS)
					}
					continue
				}
				vo := awp * (o.Z - c.b.T)
				to := flTorricelliTime(ae, c.cd, c.a, c.b.T, c.b.T-vo/ae) // Torricelli (practice)
				if ev == nil || !flClose(ev.TimeS, to, c.tolS) || !flClose(ev.WaterM3, vo, c.tolM3) {
					t.Errorf("%s: event %+v; closed form %.3f s with %.3f m³", o.Name, ev, to, vo)
				}
			}
			var ml *FloodEvent
			for i, e := range rep.Events {
				if e.Kind == MarginLineReached {
					ml = &rep.Events[i]
				}
				if e.Kind == DeckEdgeReached {
					t.Errorf("deck edge reported under at %.1f s; the final draft is below the deck", e.TimeS)
				}
			}
			if c.margin {
				vml := awp * (c.b.D - MarginLineDepthM - c.b.T)
				tml := flTorricelliTime(ae, c.cd, c.a, c.b.T, c.b.T-vml/ae) // Torricelli (practice)
				if ml == nil {
					t.Fatalf("margin line not reported; events %+v", rep.Events)
				}
				if !flClose(ml.TimeS, tml, c.tolS) || !flClose(ml.WaterM3, vml, c.tolM3) {
					t.Errorf("margin line at %.3f s with %.3f m³; closed form %.3f s with %.3f m³", ml.TimeS, ml.WaterM3, tml, vml)
				}
			} else if ml != nil {
				t.Errorf("margin line reported at %.1f s; it stays clear", ml.TimeS)
			}
		})
	}
}

// TestFloodPumpsSteadyLevel: pumps of capacity Q_p hold the level where the
// inflow equals them, C_d·a·√(2 g h_s) = Q_p (Torricelli, practice), so
// h_s = (Q_p/(C_d·a))²/(2g); on the centre box (see
// TestFloodCentreBoxClosedForm) the water then held is A_e·(T0 − h_s).
func TestFloodPumpsSteadyLevel(t *testing.T) {
	b := flBox{L: 100, B: 20, D: 10, T: 5, KG: 4, comps: []flComp{{"centre void", Box{45, 55, -4, 4, 0, 10}, 1}}}
	v := b.vessel(t)
	ae := 1 / (1/80.0 - 1/2000.0)
	cases := []struct {
		name   string
		hs     float64 // the steady head the pumps are sized for
		a, cd  float64
		tolH   float64
		tolM3  float64
		pumps  int
		limitS float64
	}{
		{"one pump, 1 m", 1, 0.05, 0.6, FloodHeadTolM, ae * FloodHeadTolM * 1.01, 1, 0},
		{"two pumps, 3 m", 3, 0.02, 0.7, FloodHeadTolM, ae * FloodHeadTolM * 1.01, 2, 0},
		{"small pump, 0.1 m", 0.1, 0.08, 0.6, FloodHeadTolM, ae * FloodHeadTolM * 1.01, 1, 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			q := c.cd * c.a * math.Sqrt(2*StandardGravity*c.hs) * 3600 // m³/h
			var pumps []Pump
			for i := 0; i < c.pumps; i++ {
				pumps = append(pumps, Pump{Name: "pump", CapacityM3h: q / float64(c.pumps)})
			}
			rep, err := RunFlood(FloodCase{Vessel: v, Hole: Hole{AreaM2: c.a, XM: 50, ZM: 0, Cd: c.cd}, Pumps: pumps, LimitS: c.limitS}, nil)
			if err != nil {
				t.Fatal(err)
			}
			if rep.End != FloodPumpsHold || !rep.PumpsHoldLevel {
				t.Fatalf("end %v (%s), want pumps-hold", rep.End, rep.EndReason)
			}
			if !flClose(rep.SteadyHeadM, c.hs, 1e-12*c.hs) {
				t.Errorf("steady head %.6f m, closed form %.6f m", rep.SteadyHeadM, c.hs)
			}
			if !flClose(rep.Final.HeadM, c.hs, c.tolH) {
				t.Errorf("head at the end %.5f m, closed form %.5f m", rep.Final.HeadM, c.hs)
			}
			if !flClose(rep.FinalWaterM3, ae*(b.T-c.hs), c.tolM3) {
				t.Errorf("water held %.3f m³, closed form %.3f m³", rep.FinalWaterM3, ae*(b.T-c.hs))
			}
			if !flClose(rep.Final.InflowM3h, q, 0.01*q) || rep.Final.PumpedM3h != q {
				t.Errorf("inflow %.2f m³/h, pumped %.2f m³/h, want both %.2f", rep.Final.InflowM3h, rep.Final.PumpedM3h, q)
			}
		})
	}
}

// flWing is a box barge with a wing void to starboard and a double-bottom
// tank, openings on deck, for the cases that heel.
func flWing() flBox {
	return flBox{L: 100, B: 20, D: 8, T: 5, KG: 5,
		comps: []flComp{
			{"3 wing void S", Box{40, 60, 6, 10, 0, 8}, 0.95},
			{"2 double bottom C", Box{20, 40, -10, 10, 0, 1.2}, 0.95},
			{"1 hold", Box{10, 90, -10, 10, 0, 8}, 0.7},
		},
		openings: []Opening{
			{Name: "wing vent", Kind: "vent", X: 50, Y: 9.5, Z: 8.6},
			{Name: "hatch coaming", Kind: "hatch", X: 50, Y: 0, Z: 9.5, Weathertight: true},
		},
	}
}

// TestFloodWingTankStages floods a wing void through a hole in its side:
// the final state must be the lost-buoyancy solution within 5 mm in the
// drafts (both methods give the same final waterline: Barrass & Derrett,
// bilging chapter, memory) and the same heel within 0.01°; the intermediate
// stages at 25, 50, 75 and 100 % must hold more water and sit deeper
// (mean draft: the mass afloat grows with the water, and the waterplane
// area is positive) and heel further to the flooded side, one after the
// other; the stage at 100 % is the lost-buoyancy waterline again.
func TestFloodWingTankStages(t *testing.T) {
	v := flWing().vessel(t)
	for _, c := range []struct {
		name string
		z    float64
		area float64
		cd   float64
	}{
		{"low hole", math.NaN(), 0.1, 0.6},
		{"hole at 2 m", 2, 0.25, 0.7},
	} {
		t.Run(c.name, func(t *testing.T) {
			h, err := ShellHole(v, 0, c.area, c.z, c.cd)
			if err != nil {
				t.Fatal(err)
			}
			if h.YM != 10 || h.XM != 50 {
				t.Fatalf("hole at y %.3f, x %.3f: want the starboard shell at x 50", h.YM, h.XM)
			}
			rep, err := RunFlood(FloodCase{Vessel: v, Compartment: 0, Hole: h}, nil)
			if err != nil {
				t.Fatal(err)
			}
			if rep.End != FloodEqualised {
				t.Fatalf("end %v (%s)", rep.End, rep.EndReason)
			}
			lb := rep.LostBuoyancy
			if lb == nil {
				t.Fatal("no lost-buoyancy solution")
			}
			f := rep.Final.Position
			if rep.FinalDiffM > 0.005 || math.Abs(f.HeelDeg-lb.HeelDeg) > 0.01 {
				t.Errorf("final drafts %.4f/%.4f/%.4f heel %.3f°; lost buoyancy %.4f/%.4f/%.4f heel %.3f°",
					f.DraftAftM, f.DraftMidM, f.DraftFwdM, f.HeelDeg, lb.DraftAftM, lb.DraftMidM, lb.DraftFwdM, lb.HeelDeg)
			}
			if !flClose(rep.FinalWaterM3, rep.LostBuoyancyWaterM3, 0.002*rep.LostBuoyancyWaterM3) {
				t.Errorf("water at equalisation %.3f m³; lost buoyancy's %.3f m³", rep.FinalWaterM3, rep.LostBuoyancyWaterM3)
			}
			if len(rep.Stages) != 4 {
				t.Fatalf("%d stages", len(rep.Stages))
			}
			prev := rep.Start.Position
			prevT := -1.0
			for _, s := range rep.Stages {
				p := s.Position
				if p == nil || !s.Reached {
					t.Fatalf("stage %.0f %%: %+v", 100*s.Fraction, s)
				}
				if !(p.DraftMidM > prev.DraftMidM && p.HeelDeg > prev.HeelDeg && s.TimeS > prevT) {
					t.Errorf("stage %.0f %%: mid draft %.4f heel %.3f° at %.0f s, not past the one before (%.4f, %.3f°, %.0f s)",
						100*s.Fraction, p.DraftMidM, p.HeelDeg, s.TimeS, prev.DraftMidM, prev.HeelDeg, prevT)
				}
				prev, prevT = p, s.TimeS
			}
			last := rep.Stages[3].Position
			if d := math.Abs(last.DraftMidM - lb.DraftMidM); d > 0.005 {
				t.Errorf("stage 100 %%: mid draft %.4f vs lost buoyancy %.4f", last.DraftMidM, lb.DraftMidM)
			}
			// The table: times ascending, nothing that is not a number.
			for i, r := range rep.Table {
				if i > 0 && r.TimeS < rep.Table[i-1].TimeS {
					t.Errorf("table row %d at %.1f s before row %d", i, r.TimeS, i-1)
				}
				for _, x := range []float64{r.TimeS, r.WaterM3, r.InflowM3h, r.HeadM, r.SoundingM, r.Position.HeelDeg, r.Position.DraftMidM, r.Position.GMM} {
					if math.IsNaN(x) || math.IsInf(x, 0) {
						t.Fatalf("table row %d: %+v", i, r)
					}
				}
			}
		})
	}
}

// TestFloodFullCompartment: a double bottom whose top is below the sea
// fills to the top; full, the added weight is the whole space's μ·V and the
// lost buoyancy of a space wholly under water is the same volume, so the
// two solutions agree (memory) and the time is Torricelli's with the head
// falling only by the ship's sinkage until the tank is full — not checked
// here beyond ending full.
func TestFloodFullCompartment(t *testing.T) {
	v := flWing().vessel(t)
	rep, err := RunFlood(FloodCase{Vessel: v, Compartment: 1, Hole: Hole{AreaM2: 0.05, XM: 30, YM: 0, ZM: 0}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if rep.End != FloodFull {
		t.Fatalf("end %v (%s)", rep.End, rep.EndReason)
	}
	if !flClose(rep.FinalWaterM3, rep.CapacityM3, 1e-6*rep.CapacityM3) || !flClose(rep.CapacityM3, 0.95*20*20*1.2, 1e-9) {
		t.Errorf("water %.4f m³, capacity %.4f m³; want μ·l·b·h = %.4f", rep.FinalWaterM3, rep.CapacityM3, 0.95*20*20*1.2)
	}
	if rep.FinalDiffM > 0.005 {
		t.Errorf("full: drafts differ from lost buoyancy by %.4f m", rep.FinalDiffM)
	}
}

// TestFloodEnds covers the other ways a run ends, each against what the
// geometry says at once: a hole above the water lets nothing in; pumps
// larger than the inflow at the start keep the space dry (C_d·a·√(2 g h0)
// ≤ Q_p, Torricelli, practice); a time limit stops the run there; a hold
// too big for the reserve of buoyancy sinks her, at the volume where her
// mass reaches ρ·L·B·D (the box's whole volume) and at the time the closed
// form of TestFloodCentreBoxClosedForm gives for it; a tender barge
// capsizes.
func TestFloodEnds(t *testing.T) {
	v := flWing().vessel(t)
	q0 := 0.6 * 0.1 * math.Sqrt(2*StandardGravity*5) * 3600
	sink := flBox{L: 100, B: 20, D: 5.9, T: 5, KG: 4, comps: []flComp{{"hold", Box{42, 58, -10, 10, 0, 5.9}, 1}}}
	ae := 1 / (1/320.0 - 1/2000.0)
	vSink := 2000 * (5.9 - 5.0)
	tSink := flTorricelliTime(ae, 0.6, 0.3, 5, 5-vSink/ae)
	// A tender barge whose wing void, open to the sea, capsizes her: the
	// run must not equalise but capsize on the way (the final waterline
	// is the lost-buoyancy one or none: memory), the stages leading up to
	// it heeling ever further.
	tender := flWing()
	tender.KG = 8
	cases := []struct {
		name string
		c    FloodCase
		end  FloodEnd
		endS float64
		tolS float64
	}{
		{"hole above the water", FloodCase{Vessel: v, Hole: Hole{AreaM2: 0.1, XM: 50, YM: 10, ZM: 6}}, FloodNoInflow, 0, 0},
		{"pumps keep it dry", FloodCase{Vessel: v, Hole: Hole{AreaM2: 0.1, XM: 50, YM: 10, ZM: 0}, Pumps: []Pump{{"main", q0 * 1.001}}}, FloodKeptDry, 0, 0},
		{"time limit", FloodCase{Vessel: v, Hole: Hole{AreaM2: 0.1, XM: 50, YM: 10, ZM: 0}, LimitS: 60}, FloodTimeLimit, 60, 0},
		{"sinks", FloodCase{Vessel: sink.vessel(t), Hole: Hole{AreaM2: 0.3, XM: 50, ZM: 0}}, FloodSinks, tSink, 1.5},
		{"capsizes", FloodCase{Vessel: tender.vessel(t), Hole: Hole{AreaM2: 0.2, XM: 50, YM: 10, ZM: 0}}, FloodCapsizes, -1, 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			rep, err := RunFlood(c.c, nil)
			if err != nil {
				t.Fatal(err)
			}
			if rep.End != c.end || (c.endS >= 0 && !flClose(rep.EndS, c.endS, c.tolS)) {
				t.Errorf("end %v at %.2f s (%s); want %v at %.2f s", rep.End, rep.EndS, rep.EndReason, c.end, c.endS)
			}
			if n := len(rep.Events); n == 0 || rep.Events[n-1].Kind != RunEnds {
				t.Errorf("events do not close with the end: %+v", rep.Events)
			}
			// Stages of a filling that never happens are not shown: when
			// nothing comes in only the end is (issue 10).
			wantStages := len(stageFractions)
			if c.end == FloodNoInflow || c.end == FloodKeptDry {
				wantStages = 1
			}
			if len(rep.Stages) != wantStages || len(rep.Table) == 0 {
				t.Errorf("%d stages (want %d), %d rows", len(rep.Stages), wantStages, len(rep.Table))
			}
			if c.end == FloodCapsizes {
				if rep.LostBuoyancy != nil || rep.LostBuoyancyNoEq == nil || rep.LostBuoyancyNoEq.Outcome != Capsizes {
					t.Errorf("lost buoyancy %+v / %v: want it to capsize too", rep.LostBuoyancy, rep.LostBuoyancyNoEq)
				}
				prev := 0.0
				for _, s := range rep.Stages {
					if s.Position == nil || !(s.Position.HeelDeg > prev) {
						t.Fatalf("stage %.0f %%: %+v, not heeling further than %.2f°", 100*s.Fraction, s.Position, prev)
					}
					prev = s.Position.HeelDeg
				}
				if last := rep.Table[len(rep.Table)-1]; last.Position != nil || last.NoEq == nil || last.NoEq.Outcome != Capsizes {
					t.Errorf("last row %+v: want the capsize", last)
				}
			}
		})
	}
}

// TestFloodBadInput: each bad input is an error naming what is wrong, never
// a panic.
func TestFloodBadInput(t *testing.T) {
	v := flWing().vessel(t)
	good := Hole{AreaM2: 0.1, XM: 50, YM: 10, ZM: 0}
	open := v.Intact()
	open[0].Open = true
	cases := []struct {
		name string
		c    FloodCase
		want string
	}{
		{"no vessel", FloodCase{Hole: good}, "no vessel"},
		{"index", FloodCase{Vessel: v, Compartment: 7, Hole: good}, "out of range"},
		{"area zero", FloodCase{Vessel: v, Hole: Hole{XM: 50, YM: 10}}, "hole area"},
		{"area NaN", FloodCase{Vessel: v, Hole: Hole{AreaM2: math.NaN(), XM: 50, YM: 10}}, "hole area"},
		{"position NaN", FloodCase{Vessel: v, Hole: Hole{AreaM2: 1, XM: math.NaN()}}, "not finite"},
		{"cd", FloodCase{Vessel: v, Hole: Hole{AreaM2: 1, XM: 50, YM: 10, Cd: 1.4}}, "discharge coefficient"},
		{"outside", FloodCase{Vessel: v, Hole: Hole{AreaM2: 1, XM: 5, YM: 10}}, "outside the compartment"},
		{"pump", FloodCase{Vessel: v, Hole: good, Pumps: []Pump{{"p", -1}}}, "pump"},
		{"limit", FloodCase{Vessel: v, Hole: good, LimitS: math.Inf(1)}, "time limit"},
		{"open", FloodCase{Vessel: v, Hole: good, Base: open}, "already open"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, err := RunFlood(c.c, nil)
			if err == nil || !strings.Contains(err.Error(), c.want) {
				t.Errorf("error %v, want one naming %q", err, c.want)
			}
		})
	}
}

// TestFloodRandomHoles runs seeded random holes in the wing void (area,
// height, C_d) and pumps: every run ends, within its bounds, with every
// number finite; those that equalise meet the lost-buoyancy solution within
// 5 mm (memory), those the pumps hold sit at h_s = (Q_p/(C_d·a))²/(2g)
// within 1 mm (Torricelli, practice).
func TestFloodRandomHoles(t *testing.T) {
	v := flWing().vessel(t)
	rng := rand.New(rand.NewSource(7))
	for i := 0; i < 6; i++ {
		area := 0.02 + 0.5*rng.Float64()
		z := 4.5 * rng.Float64()
		cd := 0.6 + 0.15*rng.Float64()
		var pumps []Pump
		if rng.Intn(2) == 0 {
			pumps = []Pump{{"p", 3600 * cd * area * math.Sqrt(2*StandardGravity*(0.3+2*rng.Float64())) * (0.2 + rng.Float64())}}
		}
		h, err := ShellHole(v, 0, area, z, cd)
		if err != nil {
			t.Fatal(err)
		}
		rep, err := RunFlood(FloodCase{Vessel: v, Hole: h, Pumps: pumps}, nil)
		if err != nil {
			t.Fatal(err)
		}
		for _, s := range rep.Trace {
			for _, x := range []float64{s.TimeS, s.WaterM3, s.InflowM3h, s.PumpedM3h, s.HeadM, s.SoundingM} {
				if math.IsNaN(x) || math.IsInf(x, 0) {
					t.Fatalf("case %d: a sample is not a number: %+v", i, s)
				}
			}
		}
		switch rep.End {
		case FloodEqualised:
			if rep.FinalDiffM > 0.005 {
				t.Errorf("case %d: final drafts %.4f m from lost buoyancy", i, rep.FinalDiffM)
			}
		case FloodPumpsHold:
			if math.Abs(rep.Final.HeadM-rep.SteadyHeadM) > FloodHeadTolM {
				t.Errorf("case %d: head %.4f, steady %.4f", i, rep.Final.HeadM, rep.SteadyHeadM)
			}
		case FloodKeptDry, FloodNoInflow:
		default:
			t.Errorf("case %d (area %.3f z %.2f pumps %v): end %v (%s)", i, area, z, pumps, rep.End, rep.EndReason)
		}
	}
}

// TestFloodStepIterator drives a run step by step as a screen would: the
// progress rises, ends at done, and Report gives what RunFlood gives.
func TestFloodStepIterator(t *testing.T) {
	v := flWing().vessel(t)
	c := FloodCase{Vessel: v, Hole: Hole{AreaM2: 0.1, XM: 50, YM: 10, ZM: 0}}
	r, err := NewFloodRun(c)
	if err != nil {
		t.Fatal(err)
	}
	last := -1.0
	n := 0
	for r.Step() {
		p := r.Progress()
		if p.Fraction() < last || p.Done {
			t.Fatalf("progress %v after %v", p.Fraction(), last)
		}
		last = p.Fraction()
		n++
	}
	if p := r.Progress(); !p.Done || p.Fraction() != 1 {
		t.Errorf("final progress %+v", p)
	}
	a := r.Report()
	b, err := RunFlood(c, nil)
	if err != nil {
		t.Fatal(err)
	}
	// Same steps, same answer (the solver is deterministic).
	if a.End != b.End || a.EqualiseS != b.EqualiseS || a.Steps != b.Steps || n < a.Steps-1 {
		t.Errorf("iterator: %v %.6f s %d steps; RunFlood: %v %.6f s %d steps", a.End, a.EqualiseS, n, b.End, b.EqualiseS, b.Steps)
	}
}

// TestFloodCriterionEvent: a criterion given through the hook fails inside
// a step and the event is placed where it fails. On the centre box (see
// TestFloodCentreBoxClosedForm) a test criterion "mean draft ≤ T0 + s" fails
// when the water held reaches A_wp·s (wall-sided sinkage, practice) and
// the time is Torricelli's closed form with head T0 − A_wp·s/A_e.
func TestFloodCriterionEvent(t *testing.T) {
	b := flBox{L: 100, B: 20, D: 10, T: 5, KG: 4, comps: []flComp{{"centre void", Box{45, 55, -4, 4, 0, 10}, 1}}}
	v := b.vessel(t)
	ae := 1 / (1/80.0 - 1/2000.0)
	for _, c := range []struct {
		name    string
		sinkage float64
		tolS    float64
		tolM3   float64
	}{
		{"10 cm", 0.10, 0.05, 0.01},
		{"18 cm", 0.18, 0.05, 0.01},
	} {
		t.Run(c.name, func(t *testing.T) {
			limit := b.T + c.sinkage
			calls := 0
			judge := func(v *Vessel, d Damage, pos Position) []CriterionResult {
				calls++
				m := limit - pos.DraftMidM
				return []CriterionResult{{Set: "test", Code: "mean-draft", Requirement: "mean draft ≤ limit", Required: limit,
					Actual: pos.DraftMidM, Unit: "m", AtMost: true, Pass: m >= 0, Margin: m}}
			}
			rep, err := RunFlood(FloodCase{Vessel: v, Hole: Hole{AreaM2: 0.05, XM: 50}, Criteria: judge}, nil)
			if err != nil {
				t.Fatal(err)
			}
			w := 2000 * c.sinkage
			want := flTorricelliTime(ae, 0.6, 0.05, b.T, b.T-w/ae) // Torricelli (practice)
			var ev *FloodEvent
			for i := range rep.Events {
				if rep.Events[i].Kind == CriterionFails {
					ev = &rep.Events[i]
				}
			}
			if ev == nil || ev.Name != "mean-draft" {
				t.Fatalf("no criterion event: %+v", rep.Events)
			}
			if !flClose(ev.TimeS, want, c.tolS) || !flClose(ev.WaterM3, w, c.tolM3) {
				t.Errorf("fails at %.3f s with %.4f m³; closed form %.3f s with %.4f m³", ev.TimeS, ev.WaterM3, want, w)
			}
			for _, s := range rep.Stages {
				if len(s.Criteria) != 1 || s.Criteria[0].Pass != (s.Position.DraftMidM <= limit) {
					t.Errorf("stage %.0f %%: criteria %+v", 100*s.Fraction, s.Criteria)
				}
			}
			t.Logf("%d criteria calls", calls)
		})
	}
}

// TestFloodHoledTankKeepsContents: a ballast tank holed below the water
// still holds its ballast at the moment of holing, so the run starts at the
// intact displacement and position (conservation of mass; practice), with
// the contents counted as sea water (here sea-water ballast, so its very
// volume), and ends at the lost-buoyancy waterline (the tank open to the
// sea, contents lost) within 5 mm.
func TestFloodHoledTankKeepsContents(t *testing.T) {
	h, err := NewBoxHull(60, 12, 6)
	if err != nil {
		t.Fatal(err)
	}
	c, err := NewCompartment(h, "DB ballast", Box{X0: 20, X1: 40, Y0: -6, Y1: 6, Z0: 0, Z1: 1})
	if err != nil {
		t.Fatal(err)
	}
	c.Permeability = 0.95
	c.Liquid = &Liquid{Name: "sea water ballast", Density: SeaWaterDensity, Fill: 0.5}
	v, err := NewVessel(Vessel{Name: "holed tank", Hull: h, Compartments: []*Compartment{c},
		Weights: []Weight{{Name: "barge", MassT: 60 * 12 * 2.5 * SeaWaterDensity, LCGM: 30, VCGM: 3}}})
	if err != nil {
		t.Fatal(err)
	}
	intact, err := Solve(v, nil)
	if err != nil {
		t.Fatal(err)
	}
	rep, err := RunFlood(FloodCase{Vessel: v, Compartment: 0, Hole: Hole{AreaM2: 0.02, XM: 30, YM: 0, ZM: 0}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	want := 0.5 * 0.95 * 20 * 12 * 1 // the ballast's volume: half the capacity μ × 20 × 12 × 1 m³
	if !flClose(rep.ContentsM3, want, 1e-9*want) {
		t.Errorf("contents at the start %.6f m³, want %.6f", rep.ContentsM3, want)
	}
	p0 := rep.Start.Position
	if p0 == nil {
		t.Fatal("no position at the start")
	}
	if !flClose(p0.DisplacementT, intact.DisplacementT, 1e-9*intact.DisplacementT) || !flClose(p0.DraftMidM, intact.DraftMidM, 1e-9) {
		t.Errorf("start: Δ %.4f t, draft %.6f m; intact Δ %.4f t, draft %.6f m", p0.DisplacementT, p0.DraftMidM, intact.DisplacementT, intact.DraftMidM)
	}
	if rep.FinalDiffM > 0.005 {
		t.Errorf("final drafts differ from lost buoyancy by %.4f m", rep.FinalDiffM)
	}
}
