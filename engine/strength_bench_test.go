package engine_test

// The cost of the hull girder's strength in a keystroke (issue 15: at most
// 0.3 ms more on the bundled freighter). Compare BenchmarkRecompute with
// BenchmarkRecomputeNoStrength, the same keystroke with the weights'
// extents taken away so that no strength is worked out:
//
//	go test ./engine -run '^$' -bench 'Recompute$|RecomputeNoStrength|GirderStrength' -cpu 1 -count 6

import (
	"testing"

	"heelwatch/engine"
)

// BenchmarkRecomputeNoStrength is BenchmarkRecompute without strength.
func BenchmarkRecomputeNoStrength(b *testing.B) {
	v, d := refBundledDamaged(b, refBenchSpaces...)
	bare := *v
	bare.Weights = append([]engine.Weight(nil), v.Weights...)
	for i := range bare.Weights {
		bare.Weights[i].ExtentM = [2]float64{}
	}
	nv, err := engine.NewVessel(bare)
	if err != nil {
		b.Fatal(err)
	}
	if a := engine.Assess(nv, d); a.Strength != nil || a.Position == nil {
		b.Fatal("the case should float without strength")
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		engine.Assess(nv, d)
	}
}

// BenchmarkGirderStrength times the strength alone at the solved position.
func BenchmarkGirderStrength(b *testing.B) {
	v, d := refBundledDamaged(b, refBenchSpaces...)
	pos, err := engine.Solve(v, d)
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if s, why := engine.GirderStrength(v, d, &pos); s == nil {
			b.Fatal(why)
		}
	}
}
