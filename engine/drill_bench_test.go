package engine_test

import (
	"testing"

	"heelwatch/vessels"
)

// BenchmarkDrillPlay plays each bundled scenario (our own invention) to its
// end with no crew action, as `heelwatch drill NAME --run` does.
//
//	go test ./engine -run '^$' -bench DrillPlay -benchtime 5x
func BenchmarkDrillPlay(b *testing.B) {
	for _, s := range vessels.BundledScenarios() {
		sc, err := vessels.OpenScenario(s.Name)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(s.Name, func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				if _, err := sc.Setup().Play(); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
