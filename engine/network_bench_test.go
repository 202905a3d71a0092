package engine_test

// Benchmarks of flooding through the ship on the bundled freighter (an
// invented demo vessel): a network run through three connected
// compartments, and the keystroke that opens a door (the spread to a
// fixed point and everything the dashboard recomputes).

import (
	"math"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// freighterDoors returns the bundled freighter with both engine-room
// doors open and a hole low in the engine room: the sea reaches the
// engine room, the provision store and the steering gear room.
func freighterDoors(tb testing.TB) (*engine.Vessel, engine.NetworkCase) {
	tb.Helper()
	v, _, err := vessels.Open("freighter")
	if err != nil {
		tb.Fatal(err)
	}
	for i, c := range v.Connections {
		if c.Name == "WT door ER/stores" || c.Name == "WT door stores/steering" {
			v = v.WithConnection(i, true)
		}
	}
	er := v.CompartmentIndex("Engine room")
	h, err := engine.ShellHole(v, er, 0.05, 2.0, 0.6)
	if err != nil {
		tb.Fatal(err)
	}
	return v, engine.NetworkCase{Vessel: v, Holes: []engine.NetHole{{Compartment: er, Hole: h}}}
}

// TestNetworkFreighterDoors: the run floods the three spaces and ends at
// the static spread within 5 mm (equalisation reaches the lost-buoyancy
// state: Barrass & Derrett, bilging chapter — memory); water conserved.
func TestNetworkFreighterDoors(t *testing.T) {
	_, c := freighterDoors(t)
	rep, err := engine.RunNetwork(c, nil)
	if err != nil {
		t.Fatal(err)
	}
	wet := 0
	for _, cp := range rep.Compartments {
		if !math.IsNaN(cp.FirstWaterS) {
			wet++
		}
	}
	if rep.End != engine.FloodEqualised || wet != 3 || rep.FinalDiffM > 0.005 {
		t.Fatalf("end %v (%s), %d compartments wet, %.4f m off the static spread", rep.End, rep.EndReason, wet, rep.FinalDiffM)
	}
	var in, start float64
	for k := range rep.Compartments {
		in += rep.Final.WaterM3[k]
		start += rep.Start.WaterM3[k]
	}
	if math.Abs(rep.SeaInM3-rep.PumpedM3-(in-start)) > 1e-6*rep.SeaInM3 {
		t.Errorf("sea in %.4f m³, held %.4f m³", rep.SeaInM3, in-start)
	}
	t.Logf("%.0f s, %d steps, %d solves", rep.EndS, rep.Steps, rep.Solves)
}

// BenchmarkNetworkRunFreighter times the whole network run through three
// connected compartments, report included (goal: under 0.5 s).
func BenchmarkNetworkRunFreighter(b *testing.B) {
	_, c := freighterDoors(b)
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := engine.RunNetwork(c, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkOpenDoor is the keystroke that opens a door on the dashboard:
// the spread to a fixed point, then everything Assess recomputes (goal:
// inside the 2 ms frame budget of BenchmarkRecompute's note in
// DEVELOPERS.md, with the spread's extra solves).
func BenchmarkOpenDoor(b *testing.B) {
	v, _ := freighterDoors(b)
	d := v.Intact()
	d[v.CompartmentIndex("Engine room")].Open = true
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		sp := engine.Progressive(v, d)
		if a := engine.Assess(v, sp.Damage); a.Position == nil {
			b.Fatal(a.NoEq)
		}
	}
}

// BenchmarkOpenDoorAssessOnly is BenchmarkOpenDoor's final state assessed
// without the spread (the three spaces named open): the difference is
// what the spread itself costs a keystroke.
func BenchmarkOpenDoorAssessOnly(b *testing.B) {
	v, _ := freighterDoors(b)
	d := v.Intact()
	for _, n := range []string{"Engine room", "Provision store", "Steering gear room"} {
		d[v.CompartmentIndex(n)].Open = true
	}
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if a := engine.Assess(v, d); a.Position == nil {
			b.Fatal(a.NoEq)
		}
	}
}
