package engine

import (
	"math/rand/v2"
	"sort"
	"testing"
)

// randomOutline is a half outline with heights that ascend and repeat
// (flat runs at the keel, the deck and between), as offsets may.
func randomOutline(rng *rand.Rand, n int) []Point {
	o := make([]Point, n)
	z := float64(rng.IntN(3))
	for i := range o {
		if i > 0 && rng.IntN(3) > 0 {
			z += float64(rng.IntN(3)) * 0.5
		}
		o[i] = Point{Y: float64(rng.IntN(10)), Z: z}
	}
	if o[n-1].Z == o[0].Z {
		o[n-1].Z += 1
	}
	return o
}

// TestOutlineCursorAgreesWithScan: the cursor gives, point for point, what
// the plain scan outlineAt gives, for every height of two outlines' union
// and for heights between and beyond them.
func TestOutlineCursorAgreesWithScan(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 3))
	for trial := 0; trial < 500; trial++ {
		o := randomOutline(rng, 2+rng.IntN(12))
		other := randomOutline(rng, 2+rng.IntN(12))
		var zs []float64
		for _, p := range append(append([]Point(nil), o...), other...) {
			zs = append(zs, p.Z, p.Z+0.25, p.Z-0.25)
		}
		sort.Float64s(zs)
		c := newOutlineCursor(o)
		for _, z := range zs {
			a0, a1 := outlineAt(o, z)
			b0, b1 := c.at(z)
			if a0 != b0 || a1 != b1 {
				t.Fatalf("outline %v at z %g: scan %v %v, cursor %v %v", o, z, a0, a1, b0, b1)
			}
		}
	}
}

// BenchmarkMatchStations shows the resampling linear in the points: the
// time per point stays flat from 1 000 to 16 000 points (it grew with the
// count when each height scanned the outline).
func BenchmarkMatchStations(b *testing.B) {
	for _, n := range []int{1000, 4000, 16000} {
		a := make([]Point, n)
		c := make([]Point, n)
		for i := range a {
			a[i] = Point{Y: 5, Z: 10 * float64(i) / float64(n)}
			c[i] = Point{Y: 4, Z: 10 * (float64(i) + 0.5) / float64(n)}
		}
		b.Run(itoaBench(n), func(b *testing.B) {
			for b.Loop() {
				matchStations(a, c)
			}
		})
	}
}

func itoaBench(n int) string {
	s := ""
	for n > 0 {
		s = string(rune('0'+n%10)) + s
		n /= 10
	}
	return "points=" + s
}
