package vessels_test

// BenchmarkLoadLargeHull times reading the vessel file of a large generated
// ship (vessels/largeship, an invented vessel: 160 stations of 60 offsets
// and 200 compartments) into engine values: what the dashboard does before
// its first frame, whose budget is 100 ms.

import (
	"testing"

	"heelwatch/vessels"
	"heelwatch/vessels/largeship"
)

func BenchmarkLoadLargeHull(b *testing.B) {
	src := largeship.TOML(largeship.Standard)
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, _, err := vessels.Parse("large.toml", src); err != nil {
			b.Fatal(err)
		}
	}
}
