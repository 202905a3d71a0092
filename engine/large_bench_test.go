package engine_test

// Benchmarks of a large ship, the size of a hull exported from a design
// program: 160 stations of 60 offsets each and 200 compartments, two of
// them open to the sea (vessels/largeship, an invented vessel). Goal
// (issue 17): BenchmarkRecomputeLargeHull ≤ 2 ms, as this benchmark
// measures it at the machine's default GOMAXPROCS (on a 2-core machine the
// line BenchmarkRecomputeLargeHull-2; the line without a suffix is
// -cpu 1, one core, kept to see that the work spread over the cores does
// not grow much). Run with
//
//	go test ./engine -run '^$' -bench 'LargeHull' -cpu 1,2 -count 6

import (
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
	"heelwatch/vessels/largeship"
)

// largeDamaged loads the generated ship of spec s and returns her with its
// two benchmark compartments open to the sea.
func largeDamaged(tb testing.TB, s largeship.Spec) (*engine.Vessel, engine.Damage) {
	tb.Helper()
	v, _, err := vessels.Parse("large.toml", largeship.TOML(s))
	if err != nil {
		tb.Fatal(err)
	}
	d := v.Intact()
	for _, n := range s.OpenSpaces() {
		found := false
		for i, c := range v.Compartments {
			if c.Name == n {
				d[i].Open, found = true, true
			}
		}
		if !found {
			tb.Fatalf("the generated ship has no compartment %q", n)
		}
	}
	return v, d
}

// BenchmarkRecomputeLargeHull times everything one keystroke recomputes
// (Assess) on the large generated ship with two compartments open.
func BenchmarkRecomputeLargeHull(b *testing.B) {
	v, d := largeDamaged(b, largeship.Standard)
	if a := engine.Assess(v, d); a.Position == nil {
		b.Fatalf("the benchmark case does not float: %v", a.NoEq)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if a := engine.Assess(v, d); a.Position == nil {
			b.Fatal(a.NoEq)
		}
	}
}

// BenchmarkHullBelowOffsets times one immersion of a generated hull at a
// heeled and trimmed waterline for several offsets per station: the cost
// should grow with the offsets, with no step where a section outgrows a
// fixed bound.
func BenchmarkHullBelowOffsets(b *testing.B) {
	for _, n := range []int{60, 120, 130, 240} {
		b.Run(itoa(n), func(b *testing.B) {
			v, _ := largeDamaged(b, largeship.Spec{Stations: 40, Offsets: n, Bays: 1})
			p := engine.Plane{A: v.Hull.DepthM * 0.6, B: -0.001, C: 0.2}
			s := v.Hull.Solid()
			b.ReportAllocs()
			b.ResetTimer()
			for i := 0; i < b.N; i++ {
				s.Below(p)
			}
		})
	}
}

func itoa(n int) string {
	const digits = "0123456789"
	if n < 10 {
		return digits[n : n+1]
	}
	return itoa(n/10) + digits[n%10:n%10+1]
}
