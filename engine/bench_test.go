package engine_test

// Benchmarks of what a keystroke costs on the bundled ship (an invented
// demo vessel) with two compartments open to the sea: a wing tank and the
// engine room. Goal (issue 3): BenchmarkRecompute ≤ 2 ms on one core, so a
// keystroke redraws well inside a 60 Hz frame. Run with
//
//	go test ./engine -run '^$' -bench 'Equilibrium|Recompute' -cpu 1 -count 6

import (
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// refBenchSpaces are the compartments the benchmarks open.
var refBenchSpaces = []string{"Wing tank 2 S", "Engine room"}

// refBundledDamaged opens the bundled ship and returns her with the
// compartments named open to the sea.
func refBundledDamaged(b testing.TB, names ...string) (*engine.Vessel, engine.Damage) {
	b.Helper()
	v, _, err := vessels.Open(vessels.Default)
	if err != nil {
		b.Fatal(err)
	}
	d := v.Intact()
	for _, n := range names {
		found := false
		for i, c := range v.Compartments {
			if c.Name == n {
				d[i].Open, found = true, true
			}
		}
		if !found {
			b.Fatalf("the bundled vessel %q has no compartment %q", vessels.Default, n)
		}
	}
	return v, d
}

// BenchmarkEquilibrium times the free-floating damaged equilibrium alone.
func BenchmarkEquilibrium(b *testing.B) {
	v, d := refBundledDamaged(b, refBenchSpaces...)
	if _, err := engine.Solve(v, d); err != nil {
		b.Fatalf("the benchmark case does not float: %v", err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := engine.Solve(v, d); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkRecompute times everything one keystroke recomputes: Assess
// (the equilibrium, freeboards, hand method, GZ curve, criteria, flags).
func BenchmarkRecompute(b *testing.B) {
	v, d := refBundledDamaged(b, refBenchSpaces...)
	if a := engine.Assess(v, d); a.Position == nil {
		b.Fatalf("the benchmark case does not float: %v", a.NoEq)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		a := engine.Assess(v, d)
		if a.Position == nil {
			b.Fatal(a.NoEq)
		}
	}
}

// BenchmarkRecomputeIntact is the same keystroke with nothing open, for
// comparison.
func BenchmarkRecomputeIntact(b *testing.B) {
	v, d := refBundledDamaged(b)
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		engine.Assess(v, d)
	}
}

// BenchmarkHullBelow times one immersion of the bundled ship's hull at a
// heeled and trimmed waterline: the unit of cost of every evaluation.
func BenchmarkHullBelow(b *testing.B) {
	v, _ := refBundledDamaged(b)
	p := engine.Plane{A: v.Hull.DepthM / 2, B: -0.005, C: 0.2}
	s := v.Hull.Solid()
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		s.Below(p)
	}
}
