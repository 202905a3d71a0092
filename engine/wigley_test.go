package engine_test

// The Wigley hull from offsets converging to its closed-form hydrostatics.

import (
	"fmt"
	"math"
	"math/rand"
	"testing"

	"heelwatch/engine"
)

// refWigley builds the Wigley hull y = (B/2)(1 − (2x'/L)²)(1 − (z'/T)²)
// (references.md: Hally, DREA Tech. Comm. 89/308; Journée, DUT-SHL 0909;
// found), x' = x − L/2 from amidships and z' = T − z the depth below the
// design waterline, from offsets at nst equally spaced stations and nwl
// equally spaced waterlines from the keel (z = 0) to the design waterline
// (z = T). Above T each section goes straight up to a deck at depth D, so
// the section is closed; the hull below T is the Wigley form.
func refWigley(t testing.TB, L, B, T, D float64, nst, nwl int) *engine.Hull {
	t.Helper()
	return refWigleySplit(t, L, B, T, D, nst, nwl, 1)
}

// refWigleySplit is refWigley with k − 1 extra stations in each interval,
// their offsets interpolated linearly between the two stations around
// them: the same ruled surface, cut into k times as many slabs.
func refWigleySplit(t testing.TB, L, B, T, D float64, nst, nwl, k int) *engine.Hull {
	t.Helper()
	offsets := func(i int) []engine.Point {
		x := L * float64(i) / float64(nst-1)
		xi := 2 * (x - L/2) / L
		var off []engine.Point
		for j := 0; j < nwl; j++ {
			z := T * float64(j) / float64(nwl-1)
			zeta := (T - z) / T
			off = append(off, engine.Point{Y: B / 2 * (1 - xi*xi) * (1 - zeta*zeta), Z: z})
		}
		return append(off, engine.Point{Y: B / 2 * (1 - xi*xi), Z: D})
	}
	var sts []engine.Station
	for i := 0; i < nst; i++ {
		a := offsets(i)
		sts = append(sts, engine.Station{X: L * float64(i) / float64(nst-1), Offsets: a})
		if i == nst-1 {
			break
		}
		b := offsets(i + 1)
		for s := 1; s < k; s++ {
			f := float64(s) / float64(k)
			mid := make([]engine.Point, len(a))
			for j := range a {
				mid[j] = engine.Point{Y: a[j].Y + f*(b[j].Y-a[j].Y), Z: a[j].Z}
			}
			sts = append(sts, engine.Station{X: L * (float64(i) + f) / float64(nst-1), Offsets: mid})
		}
	}
	h, err := engine.NewSectionHull(L, sts)
	if err != nil {
		t.Fatal(err)
	}
	return h
}

// refWigleyClosed holds the Wigley hull's hydrostatics at the design
// waterline. Derivation (with ξ = 2x'/L, ζ = z'/T, ∫₋₁¹(1−ξ²)dξ = 4/3,
// ∫₀¹(1−ζ²)dζ = 2/3, ∫₀¹ζ(1−ζ²)dζ = 1/4, ∫₋₁¹(1−ξ²)³dξ = 32/35,
// ∫₋₁¹ξ²(1−ξ²)dξ = 4/15):
//
//	∇    = ∬ 2y dx dz = B·(L/2)(4/3)·T(2/3)         = 4/9·LBT
//	A_WP = ∫ 2y(z'=0) dx = B·(L/2)(4/3)             = 2/3·LB
//	KB   = T − (∬ 2y z' dx dz)/∇ = T − T·(1/4)/(2/3) = 5T/8
//	I_T  = ∫ (2/3) y³ dx = (2/3)(B/2)³(L/2)(32/35)  = 4B³L/105, BM_T = I_T/∇ = 3B²/(35T)
//	I_L  = ∫ 2y x'² dx = B(L/2)³(4/15)              = BL³/30,   BM_L = I_L/∇ = 3L²/(40T)
//
// LCB = LCF = L/2 by symmetry fore and aft (derived, references.md).
func refWigleyClosed(L, B, T float64) map[string]float64 {
	return map[string]float64{
		"volume":     4.0 / 9 * L * B * T,
		"waterplane": 2.0 / 3 * L * B,
		"KB":         5 * T / 8,
		"BMT":        3 * B * B / (35 * T),
		"BML":        3 * L * L / (40 * T),
	}
}

func refWigleyHydrostatics(h *engine.Hull, T float64) map[string]float64 {
	im := h.Solid().Below(engine.Plane{A: T})
	_, _, z := im.Centroid()
	return map[string]float64{
		"volume":     im.V,
		"waterplane": im.AW,
		"KB":         z,
		"BMT":        (im.IYY - im.SY*im.SY/im.AW) / im.V,
		"BML":        (im.IXX - im.SX*im.SX/im.AW) / im.V,
	}
}

var refWigleyQuantities = []string{"volume", "waterplane", "KB", "BMT", "BML"}

// TestWigleyConvergence refines stations and waterlines together (the
// number of intervals doubling each time) and checks that each quantity
// converges to its closed form at second order, as the piecewise-linear
// offsets make it: the log₂ of the ratio of successive errors tends to 2.
// At 41 stations (and 41 waterlines) each is within 0.1 %.
func TestWigleyConvergence(t *testing.T) {
	const L, B, T, D = 100.0, 10.0, 6.25, 9.0 // the usual L/B = 10, B/T = 1.6
	exact := refWigleyClosed(L, B, T)
	counts := []int{6, 11, 21, 41, 81, 161}
	errs := map[string][]float64{}
	for _, n := range counts {
		got := refWigleyHydrostatics(refWigley(t, L, B, T, D, n, n), T)
		for _, q := range refWigleyQuantities {
			// against the derived closed forms of refWigleyClosed
			errs[q] = append(errs[q], relErr(got[q], exact[q]))
		}
	}
	head := fmt.Sprintf("%-10s", "stations")
	for _, n := range counts {
		head += fmt.Sprintf(" %10d", n)
	}
	t.Log(head)
	for _, q := range refWigleyQuantities {
		row := fmt.Sprintf("%-10s", q)
		for _, e := range errs[q] {
			row += fmt.Sprintf(" %10.3e", e)
		}
		row += "   order"
		for i := 1; i < len(counts); i++ {
			row += fmt.Sprintf(" %5.2f", math.Log2(errs[q][i-1]/errs[q][i]))
		}
		t.Log(row)
	}
	for _, q := range refWigleyQuantities {
		e := errs[q]
		for i, n := range counts {
			if n == 41 && !(e[i] < 1e-3) { // issue 3: within 0.1 % at 41 stations
				t.Errorf("%s at 41 stations: relative error %.3e, want < 1e-3", q, e[i])
			}
		}
		// Order from the two finest refinements.
		for i := len(counts) - 2; i < len(counts); i++ {
			if p := math.Log2(e[i-1] / e[i]); !(math.Abs(p-2) < 0.15) {
				t.Errorf("%s: order of convergence %.3f between %d and %d stations, want about 2", q, p, counts[i-1], counts[i])
			}
		}
	}
}

// TestWigleySolve floats the 41-station Wigley hull with the weight that
// its offsets displace at T, at LCB = L/2, and checks that Solve brings her
// to T and that its KB, BM and GM = KB + BM − KG are within 0.1 % of the
// closed forms. (A weight of ρ·4/9·LBT would sink the offset hull a little
// deeper, since its offsets lose 0.08 % of the volume at 41 stations.)
func TestWigleySolve(t *testing.T) {
	const L, B, T, D = 100.0, 10.0, 6.25, 9.0
	h := refWigley(t, L, B, T, D, 41, 41)
	exact := refWigleyClosed(L, B, T)
	const kg = 4.0
	vol := h.Solid().Below(engine.Plane{A: T}).V
	v, err := engine.NewVessel(engine.Vessel{Name: "Wigley", Hull: h, Weights: []engine.Weight{{Name: "load", MassT: engine.SeaWaterDensity * vol, LCGM: L / 2, VCGM: kg}}})
	if err != nil {
		t.Fatal(err)
	}
	pos, err := engine.Solve(v, nil)
	if err != nil {
		t.Fatal(err)
	}
	gm := exact["KB"] + exact["BMT"] - kg // practice: GM = KB + BM − KG
	if math.Abs(pos.DraftMidM-T) > 1e-9 {
		t.Errorf("draft %.12f m, want %g", pos.DraftMidM, T)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"displacement", pos.VolumeM3, exact["volume"]},
		{"KB", pos.VCBM, exact["KB"]},
		{"BMT", pos.BMTM, exact["BMT"]},
		{"BML", pos.BMLM, exact["BML"]},
		{"GM", pos.GMM, gm},
		{"LCB", pos.LCBM, L / 2},
		{"LCF", pos.LCFM, L / 2},
	} {
		// derived closed forms (refWigleyClosed); 0.1 %: issue 3's bar at 41 stations
		if e := relErr(c.got, c.want); !(e < 1e-3) {
			t.Errorf("%s: %.6f, closed form %.6f (rel err %.2e)", c.name, c.got, c.want, e)
		}
	}
	if math.Abs(pos.TrimM) > 1e-9 || math.Abs(pos.HeelDeg) > 1e-9 {
		t.Errorf("trim %g m, heel %g°: want level", pos.TrimM, pos.HeelDeg)
	}
}

// TestRuledSlabQuadrature measures the error of the slab integration on a
// hull whose slabs are twisted ruled surfaces (the Wigley hull from
// offsets). There the waterline's cut through an edge moves along the edge
// at a rate that varies with x, so the clipped section's moments are
// polynomials of degree four or more in x (rational functions once heeled)
// and two-point Gauss per piece, exact to degree three, is no longer exact
// as it is on a box. The reference is the same surface cut into 16 times as
// many slabs (Gauss's error falls as the fourth power of the piece's
// length; practice). The bounds are the measured errors with a margin:
// some 1e-8 of the volume upright and trimmed, 1e-7 at large heels — far
// below the offsets' own error (1e-3 at 21 stations) but above round-off.
func TestRuledSlabQuadrature(t *testing.T) {
	const L, B, T, D = 100.0, 10.0, 6.25, 9.0
	coarse := refWigley(t, L, B, T, D, 21, 11)
	fine := refWigleySplit(t, L, B, T, D, 21, 11, 16)
	if e := relErr(coarse.Solid().Volume(), fine.Solid().Volume()); e > 1e-13 {
		t.Fatalf("split hull has volume %.15g, original %.15g", fine.Solid().Volume(), coarse.Solid().Volume())
	}
	cases := []struct {
		name string
		maxH float64 // largest heel, degrees
		tol  float64 // relative to the whole volume
	}{{"upright, trimmed", 0, 2e-8}, {"heel to 30°", 30, 1e-7}, {"heel to 85°", 85, 5e-7}}
	rng := rand.New(rand.NewSource(23))
	whole := coarse.Solid().Volume()
	for _, c := range cases {
		worst := 0.0
		for i := 0; i < 200; i++ {
			p := engine.Plane{A: 1 + 7*rng.Float64(), B: (rng.Float64()*2 - 1) * 0.03, C: math.Tan((rng.Float64()*2 - 1) * c.maxH * math.Pi / 180)}
			a, b := coarse.Solid().Below(p), fine.Solid().Below(p)
			for _, d := range [][2]float64{{a.V, b.V}, {a.MX / L, b.MX / L}, {a.MY / B, b.MY / B}, {a.MZ / D, b.MZ / D}} {
				worst = math.Max(worst, math.Abs(d[0]-d[1])/whole)
			}
		}
		if !(worst <= c.tol) {
			t.Errorf("%s: quadrature error %.2e of the volume, want ≤ %.0e", c.name, worst, c.tol)
		}
		t.Logf("Wigley 21×11, %s: slab quadrature error %.2e of the volume (against 16× finer slabs)", c.name, worst)
	}
}
