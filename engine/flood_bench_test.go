package engine_test

// Flooding runs of the bundled ship (an invented demo vessel): a hole in a
// wing tank, as the vessel file sets it. The benchmark times a whole run;
// the test checks the run's final state against the lost-buoyancy
// solution.

import (
	"math"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// bundledWingCase returns the flooding case of the bundled ship's first
// wing tank that carries a hole in its vessel file, without pumps.
func bundledWingCase(tb testing.TB) engine.FloodCase {
	tb.Helper()
	v, info, err := vessels.Open(vessels.Default)
	if err != nil {
		tb.Fatal(err)
	}
	for i, ci := range info.Compartments {
		if ci.Hole == nil || ci.Group != "wing tanks" {
			continue
		}
		h := ci.Hole
		return engine.FloodCase{Vessel: v, Compartment: i,
			Hole: *h}
	}
	tb.Skipf("the bundled vessel %q has no wing tank with a hole", vessels.Default)
	return engine.FloodCase{}
}

// TestFloodBundledWingTank: the run through the bundled wing tank's hole
// equalises, and its final state is the lost-buoyancy solution within 5 mm
// in the drafts and 0.05° in heel (both methods give the same final
// waterline: Barrass & Derrett, bilging chapter; Tupper, flooding chapter —
// memory). The stages hold more water and sit deeper one after the other.
func TestFloodBundledWingTank(t *testing.T) {
	c := bundledWingCase(t)
	rep, err := engine.RunFlood(c, nil)
	if err != nil {
		t.Fatal(err)
	}
	if rep.End != engine.FloodEqualised {
		t.Fatalf("end %v: %s", rep.End, rep.EndReason)
	}
	f, lb := rep.Final.Position, rep.LostBuoyancy
	if lb == nil || f == nil {
		t.Fatalf("final %v, lost buoyancy %v", f, rep.LostBuoyancyNoEq)
	}
	if rep.FinalDiffM > 0.005 || math.Abs(f.HeelDeg-lb.HeelDeg) > 0.05 {
		t.Errorf("final drafts %.4f/%.4f/%.4f m heel %.3f°; lost buoyancy %.4f/%.4f/%.4f m heel %.3f°",
			f.DraftAftM, f.DraftMidM, f.DraftFwdM, f.HeelDeg, lb.DraftAftM, lb.DraftMidM, lb.DraftFwdM, lb.HeelDeg)
	}
	prevW, prevD := 0.0, rep.Start.Position.DraftMidM
	for _, s := range rep.Stages {
		if s.Position == nil || !(s.WaterM3 > prevW) || !(s.Position.DraftMidM > prevD) {
			t.Errorf("stage %.0f %%: %+v not past the one before (%.2f m³, %.4f m)", 100*s.Fraction, s, prevW, prevD)
			continue
		}
		prevW, prevD = s.WaterM3, s.Position.DraftMidM
	}
	t.Logf("%s: equalised after %.0f s, %.2f m³; final drafts %.4f/%.4f/%.4f heel %.3f°, lost buoyancy %.4f/%.4f/%.4f heel %.3f° (largest draft difference %.2f mm); %d steps, %d rejected, %d solves",
		rep.Compartment, rep.EqualiseS, rep.FinalWaterM3,
		f.DraftAftM, f.DraftMidM, f.DraftFwdM, f.HeelDeg, lb.DraftAftM, lb.DraftMidM, lb.DraftFwdM, lb.HeelDeg, 1000*rep.FinalDiffM,
		rep.Steps, rep.Rejected, rep.Solves)
	for _, e := range rep.Events {
		t.Logf("event %s %s at %.1f s (%.2f m³): %s", e.Kind, e.Name, e.TimeS, e.WaterM3, e.Message)
	}
}

// BenchmarkFloodRun times a whole flooding run of the bundled ship through
// the wing tank's hole, report (table and stages) included.
func BenchmarkFloodRun(b *testing.B) {
	c := bundledWingCase(b)
	b.ReportAllocs()
	var solves int
	for i := 0; i < b.N; i++ {
		rep, err := engine.RunFlood(c, nil)
		if err != nil {
			b.Fatal(err)
		}
		solves = rep.Solves
	}
	b.ReportMetric(float64(solves), "solves/run")
}

// BenchmarkFloodRunCriteria is BenchmarkFloodRun with the vessel's own
// criteria judged at every step, stage and row (engine.FloodCriteria).
func BenchmarkFloodRunCriteria(b *testing.B) {
	c := bundledWingCase(b)
	c.Criteria = engine.FloodCriteria("cargo")
	for i := 0; i < b.N; i++ {
		if _, err := engine.RunFlood(c, nil); err != nil {
			b.Fatal(err)
		}
	}
}
