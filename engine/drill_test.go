package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// openDrillShip opens a bundled demo ship (our own invention) and the
// index of one of its compartments.
func openDrillShip(t *testing.T, ship, comp string) (*engine.Vessel, *vessels.Info, int) {
	t.Helper()
	v, info, err := vessels.Open(ship)
	if err != nil {
		t.Fatal(err)
	}
	for i, c := range v.Compartments {
		if c.Name == comp {
			return v, info, i
		}
	}
	t.Fatalf("%s has no compartment %q", ship, comp)
	return nil, nil, 0
}

// TestDrillBreachMatchesFlood: a drill with one breach at minute 2 and
// nothing else follows the same path as the flooding run of the same hole
// from time zero, shifted by two minutes. The flooding run is the
// reference (one compartment, Dormand–Prince 5(4) at 1e-8; the drill runs
// the flooding through the ship, NetworkRun's Rosenbrock 2(3) at 1e-5); it
// is stopped at each minute by its time limit. Tolerance: 5 mm of draft and 0.02° of heel, far inside the
// MSC.1/Circ.1229 acceptance tolerances of an onboard program (drafts 1 % /
// 5 cm, equilibrium angles ±1°; references.md).
func TestDrillBreachMatchesFlood(t *testing.T) {
	for _, c := range [][2]string{{"freighter", "Hold 1"}, {"freighter", "Wing tank 2 S"}, {"ferry", "Wing void S"}} {
		t.Run(c[0]+"/"+c[1], func(t *testing.T) { drillMatchesFlood(t, c[0], c[1]) })
	}
}

func drillMatchesFlood(t *testing.T, ship, comp string) {
	v, info, ci := openDrillShip(t, ship, comp)
	hole := *info.Compartments[ci].Hole
	const shift = 2.0
	d, err := engine.NewDrill(v, nil, []engine.DrillEvent{{Minutes: shift, Kind: engine.DrillBreach, Compartment: ci, Hole: hole}}, 14)
	if err != nil {
		t.Fatal(err)
	}
	d.AdvanceTo(14)
	checked := 0
	for _, row := range d.Rows() {
		if row.Event != "" || row.Minutes <= shift {
			continue
		}
		rep, err := engine.RunFlood(engine.FloodCase{Vessel: v, Compartment: ci, Hole: hole, LimitS: (row.Minutes - shift) * 60}, nil)
		if err != nil {
			t.Fatal(err)
		}
		want := rep.Final.Position
		if want == nil || row.Position == nil {
			t.Fatalf("minute %g: no position (flood %v, drill %v)", row.Minutes, want == nil, row.Position == nil)
		}
		got := row.Position
		for _, q := range [][3]float64{{got.DraftAftM, want.DraftAftM, 0.005}, {got.DraftFwdM, want.DraftFwdM, 0.005}, {got.HeelDeg, want.HeelDeg, 0.02}} {
			if math.Abs(q[0]-q[1]) > q[2] {
				t.Errorf("minute %g: drill %.4f, flood %.4f (tolerance %g)", row.Minutes, q[0], q[1], q[2])
			}
		}
		checked++
		t.Logf("minute %g: aft %.4f/%.4f fwd %.4f/%.4f heel %.3f/%.3f", row.Minutes, got.DraftAftM, want.DraftAftM, got.DraftFwdM, want.DraftFwdM, got.HeelDeg, want.HeelDeg)
	}
	if checked < 10 {
		t.Fatalf("only %d minutes checked", checked)
	}
}

// TestDrillDeterministic: the same events give the same timeline, bit for
// bit, and the crew's reading of a moment is the same each time asked.
func TestDrillDeterministic(t *testing.T) {
	v, info, ci := openDrillShip(t, "freighter", "Wing tank 2 S")
	ev := []engine.DrillEvent{{Minutes: 1, Kind: engine.DrillBreach, Compartment: ci, Hole: *info.Compartments[ci].Hole}}
	run := func() []engine.DrillRow {
		d, err := engine.NewDrill(v, nil, ev, 6)
		if err != nil {
			t.Fatal(err)
		}
		d.AdvanceTo(6)
		return d.Rows()
	}
	a, b := run(), run()
	if len(a) != len(b) {
		t.Fatalf("%d rows, then %d", len(a), len(b))
	}
	for i := range a {
		if a[i].Position.HeelDeg != b[i].Position.HeelDeg || a[i].Position.DraftAftM != b[i].Position.DraftAftM {
			t.Fatalf("row %d differs", i)
		}
	}
	last := a[len(a)-1]
	r1 := engine.CrewReading(v, *last.Position, last.Minutes, 7)
	r2 := engine.CrewReading(v, *last.Position, last.Minutes, 7)
	if r1.HeelDeg != r2.HeelDeg || len(r1.Drafts) != len(r2.Drafts) || r1.Drafts[0] != r2.Drafts[0] {
		t.Fatal("the same reading asked twice differs")
	}
	// Errors within the readings' bounds: heel ±0.2° then rounded to 0.1°,
	// marks ±1 cm then rounded to the centimetre.
	if math.Abs(r1.HeelDeg-last.Position.HeelDeg) > engine.HeelErrorDeg+0.05+1e-9 {
		t.Errorf("heel read %.2f, true %.3f", r1.HeelDeg, last.Position.HeelDeg)
	}
}

// TestDrillPumpHoldsAndEqualises: pumps started on a holed compartment
// keep its water below what it takes without them; a breach with no pump
// ends equalised, at the lost-buoyancy state of that compartment open
// (the added-weight and
// lost-buoyancy methods give the same final waterline: Barrass & Derrett,
// bilging chapter, references.md, memory).
func TestDrillPumpHoldsAndEqualises(t *testing.T) {
	v, info, ci := openDrillShip(t, "freighter", "Engine room")
	hole := *info.Compartments[ci].Hole
	breach := engine.DrillEvent{Minutes: 0, Kind: engine.DrillBreach, Compartment: ci, Hole: hole}
	free, err := engine.NewDrill(v, nil, []engine.DrillEvent{breach}, 600)
	if err != nil {
		t.Fatal(err)
	}
	free.AdvanceTo(600)
	end := free.Rows()[len(free.Rows())-1]
	d := v.Intact()
	d[ci].Open = true
	lb, err := engine.Solve(v, d)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(end.Position.DraftAftM-lb.DraftAftM) > 0.005 || math.Abs(end.Position.HeelDeg-lb.HeelDeg) > 0.02 {
		t.Errorf("end of drill: aft %.3f heel %.2f; lost buoyancy aft %.3f heel %.2f", end.Position.DraftAftM, end.Position.HeelDeg, lb.DraftAftM, lb.HeelDeg)
	}
	pumped, err := engine.NewDrill(v, nil, []engine.DrillEvent{breach, {Minutes: 5, Kind: engine.DrillPump, Compartment: ci, PumpM3h: 200}}, 60)
	if err != nil {
		t.Fatal(err)
	}
	pumped.AdvanceTo(60)
	free2, _ := engine.NewDrill(v, nil, []engine.DrillEvent{breach}, 60)
	free2.AdvanceTo(60)
	wp := pumped.Rows()[len(pumped.Rows())-1].WaterM3[ci]
	wf := free2.Rows()[len(free2.Rows())-1].WaterM3[ci]
	if !(wp < wf) {
		t.Errorf("with pumps %.1f m³, without %.1f m³", wp, wf)
	}
}
