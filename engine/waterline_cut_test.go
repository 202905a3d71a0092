package engine

import (
	"math"
	"math/rand"
	"testing"
)

// TestChainsMatchClip checks the prefix-sum integration of slab pieces
// against the plain streaming clip (clipBelow, itself checked against
// paulmach/orb in clip_test.go) on seeded random planes through a hull of
// curved, twisted stations and through compartments clipped from it.
func TestChainsMatchClip(t *testing.T) {
	var st []Station
	L, B, D := 60.0, 12.0, 7.0
	for i := 0; i <= 12; i++ {
		x := L * float64(i) / 12
		xi := 2*x/L - 1
		var off []Point
		for k := 0; k <= 9; k++ {
			z := D * float64(k) / 9
			hb := B / 2 * (1 - xi*xi*xi*xi) * (0.55 + 0.45*math.Sqrt(z/D))
			off = append(off, Point{math.Max(hb, 0.05), z + 0.3*xi*xi*float64(k)/9})
		}
		st = append(st, Station{X: x, Offsets: off})
	}
	h, err := NewSectionHull(L, st)
	if err != nil {
		t.Fatal(err)
	}
	c, err := NewCompartment(h, "wing", Box{20, 41, 2, 9, 0.8, 7})
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewSource(7))
	for _, sol := range []*Solid{h.Solid(), c.Solid()} {
		for trial := 0; trial < 400; trial++ {
			p := Plane{A: rng.Float64() * 8, B: (rng.Float64() - 0.5) * 0.2, C: math.Tan((rng.Float64() - 0.5) * 3)}
			var fast Immersion
			for i := range sol.slabs {
				sl := &sol.slabs[i]
				fast.add(sl.below(p), 1)
			}
			slow := slowBelow(sol, p)
			sameImmersion(t, "", p, fast, slow, sol.Volume(), L, B, D)
		}
	}
}

// slowBelow is Solid.Below with every piece integrated by clipBelow.
func slowBelow(s *Solid, p Plane) Immersion {
	var im Immersion
	for i := range s.slabs {
		im.add(s.slabs[i].belowClip(p), 1)
	}
	return im
}

// sameImmersion fails the test when fast and slow, the immersions of a
// solid of volume vol within a box L × B × D under plane p, differ by more
// than 1e-12 of each moment's scale (round-off: both are exact on a ruled
// slab).
func sameImmersion(t *testing.T, name string, p Plane, fast, slow Immersion, vol, L, B, D float64) {
	t.Helper()
	for _, q := range [][3]float64{
		{fast.V, slow.V, vol},
		{fast.MX, slow.MX, vol * L},
		{fast.MY, slow.MY, vol * B},
		{fast.MZ, slow.MZ, vol * D},
		{fast.AW, slow.AW, L * B},
		{fast.SX, slow.SX, L * B * L},
		{fast.SY, slow.SY, L * B * B},
		{fast.IXX, slow.IXX, L * B * L * L},
		{fast.IXY, slow.IXY, L * B * L * B},
		{fast.IYY, slow.IYY, L * B * B * B},
	} {
		if math.Abs(q[0]-q[1]) > 1e-12*q[2] {
			t.Fatalf("%splane %+v: fast %v, clip %v", name, p, q[0], q[1])
		}
	}
}
