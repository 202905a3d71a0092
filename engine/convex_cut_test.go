package engine

import (
	"math"
	"math/rand"
	"testing"
)

// convexTestHull is a hull of n offsets per station whose sections are all
// convex: hd·(1 − (1 − z/D)^k) with the half-breadth hd and the exponent
// k growing towards amidships (an invented form); with hollow > 0 the
// offsets are rounded and hollowed by that much (m) low on the side.
func convexTestHull(t *testing.T, stations, n int, hollow float64) *Hull {
	t.Helper()
	L, B, D := 60.0, 12.0, 7.0
	var st []Station
	for i := 0; i < stations; i++ {
		x := L * float64(i) / float64(stations-1)
		xi := 2*x/L - 1
		f := math.Max(0.05, 1-xi*xi)
		var off []Point
		for j := 0; j < n; j++ {
			u := float64(j) / float64(n-1)
			z := D * u * math.Sqrt(u)
			y := B / 2 * (0.3 + 0.7*f) * (1 - math.Pow(1-z/D, 2+8*f))
			if hollow > 0 {
				// Rounded to 1e-4 m, as offsets are printed, with a hollow
				// of that depth low on the side.
				y = math.Round(y*1e4)/1e4 - hollow*math.Exp(-math.Pow((z-1.5)/0.5, 2))
			}
			off = append(off, Point{math.Max(y, 0), z})
		}
		st = append(st, Station{X: x, Offsets: off})
	}
	h, err := NewSectionHull(L, st)
	if err != nil {
		t.Fatal(err)
	}
	return h
}

// TestConvexMatchesClip checks the convex slabs' arc walk (belowConvex,
// with guesses carried from one plane to the next as a solve carries them)
// against the plain streaming clip (clipBelow, itself checked against
// paulmach/orb in clip_test.go) on seeded random planes, small steps and
// large jumps, through hulls of 12, 60 and 300 offsets per station (the
// last beyond the chain method's own array of sides), through a box and
// through a compartment clipped from a hull.
func TestConvexMatchesClip(t *testing.T) {
	box, err := NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	h12 := convexTestHull(t, 9, 12, 0)
	c, err := NewCompartment(h12, "wing", Box{20, 41, 2, 9, 0.8, 7})
	if err != nil {
		t.Fatal(err)
	}
	solids := map[string]*Solid{
		"12 offsets": h12.Solid(), "60 offsets": convexTestHull(t, 9, 60, 0).Solid(),
		"300 offsets": convexTestHull(t, 5, 300, 0).Solid(), "box": box.Solid(), "compartment": c.Solid(),
		"rounded": convexTestHull(t, 9, 60, 1e-9).Solid(), "hollow": convexTestHull(t, 9, 40, 0.01).Solid(),
	}
	rng := rand.New(rand.NewSource(17))
	for name, sol := range solids {
		convex := 0
		for i := range sol.slabs {
			if sol.slabs[i].convex {
				convex++
			}
		}
		if convex == 0 {
			t.Fatalf("%s: no slab taken as convex", name)
		}
		hints := sol.newArcHints()
		p := Plane{A: 3, C: 0}
		for trial := 0; trial < 600; trial++ {
			if trial%5 == 0 {
				p = Plane{A: rng.Float64() * 9, B: (rng.Float64() - 0.5) * 0.2, C: math.Tan((rng.Float64() - 0.5) * 3)}
			} else {
				p.A += (rng.Float64() - 0.5) * 0.2
				p.B += (rng.Float64() - 0.5) * 0.002
				p.C = math.Tan(math.Atan(p.C) + (rng.Float64()-0.5)*0.05)
			}
			fast := sol.belowHinted(p, hints)
			slow := slowBelow(sol, p)
			sameImmersion(t, name+", ", p, fast, slow, sol.Volume(), 80, 16, 8)
		}
	}
}

// TestArcFlip: moving a vertex at an end of the arc, or next to it, keeps
// one arc; one in its middle does not.
func TestArcFlip(t *testing.T) {
	const n = 10
	for _, tc := range []struct {
		a    arc
		k    int
		want arc
		ok   bool
	}{
		{arc{8, 4}, 8, arc{9, 3}, true},
		{arc{8, 4}, 1, arc{8, 3}, true},
		{arc{8, 4}, 7, arc{7, 5}, true},
		{arc{8, 4}, 2, arc{8, 5}, true},
		{arc{8, 4}, 9, arc{8, 4}, false},
		{arc{8, 4}, 5, arc{8, 4}, false},
		{arc{0, 0}, 5, arc{5, 1}, true},
		{arc{3, n}, 6, arc{7, n - 1}, true},
	} {
		got, ok := tc.a.flip(tc.k, n)
		if ok != tc.ok || ok && got != tc.want {
			t.Errorf("%+v flip %d = %+v %v, want %+v %v", tc.a, tc.k, got, ok, tc.want, tc.ok)
		}
	}
}
