package engine

import (
	"math"
	"math/rand"
	"testing"
)

// TestDentsHitMatchesEachDent checks the merged, sorted dent ranges
// (addDent, dentsHit) against the plain definition they replace: a plane
// at heel phi hits a dent of edge directions lo … hi when phi or phi + π,
// brought within π of the dent's middle, is within its half-width of it.
// Seeded random dents, many about the vertical as on a flat ship's side
// rounded to print, others anywhere.
func TestDentsHitMatchesEachDent(t *testing.T) {
	rng := rand.New(rand.NewSource(23))
	plain := func(raw [][2]float64, phi float64) bool {
		for _, d := range raw {
			mid, half := (d[0]+d[1])/2, (d[1]-d[0])/2
			for _, f := range [2]float64{phi, phi + math.Pi} {
				a := math.Remainder(f-mid, 2*math.Pi)
				if math.Abs(a) <= half+dentMargin {
					return true
				}
			}
		}
		return false
	}
	for trial := 0; trial < 300; trial++ {
		var raw [][2]float64
		var ds []dent
		for i := rng.Intn(40); i >= 0; i-- {
			var lo float64
			if rng.Intn(2) == 0 {
				lo = math.Copysign(math.Pi/2, rng.Float64()-0.5) + (rng.Float64()-0.5)*0.01
			} else {
				lo = (rng.Float64()*2 - 1) * math.Pi
			}
			hi := lo + rng.Float64()*rng.Float64()*0.5
			raw = append(raw, [2]float64{lo, hi})
			ds = addDent(ds, lo-dentMargin, hi+dentMargin)
		}
		for i := 1; i < len(ds); i++ {
			if !(ds[i-1].hi < ds[i].lo) {
				t.Fatalf("dents not sorted and apart: %v", ds)
			}
		}
		for k := 0; k < 200; k++ {
			phi := (rng.Float64() - 0.5) * math.Pi
			if k%4 == 0 && len(raw) > 0 {
				// At a dent's end, where the margin decides.
				d := raw[rng.Intn(len(raw))]
				phi = math.Remainder(d[rng.Intn(2)]+(rng.Float64()-0.5)*4e-9, math.Pi)
			}
			if got, want := dentsHit(ds, phi), plain(raw, phi); got != want {
				// Round-off in taking directions modulo π may move a
				// dent's end by an ulp or so: only a plane that close to
				// the widened end may differ.
				near := false
				for _, d := range raw {
					for _, e := range [2]float64{d[0] - dentMargin, d[1] + dentMargin} {
						if math.Abs(math.Remainder(phi-e, math.Pi)) < 1e-14 {
							near = true
						}
					}
				}
				if !near {
					t.Fatalf("phi %v: dentsHit %v, each dent %v (dents %v)", phi, got, want, raw)
				}
			}
		}
	}
}
