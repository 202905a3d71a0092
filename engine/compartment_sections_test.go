package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// prismSections returns two sections at x0 and x1 with the same outline.
func prismSections(x0, x1 float64, o ...engine.Point) []engine.CompartmentSection {
	return []engine.CompartmentSection{{X: x0, Outline: o}, {X: x1, Outline: o}}
}

// TestSectionCompartmentPrism: a triangular prism inside a box barge, and a
// hopper-shaped triangle that reaches past her side and is clipped by it,
// have the volume and centres of the exact prism: area × length, the
// centroid of the triangle (the mean of its corners) and mid-length
// (closed forms of a triangle: any mechanics text, practice).
func TestSectionCompartmentPrism(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name           string
		outline        []engine.Point
		area, yc, zc   float64
		x0, x1, wantXc float64
	}{
		// Inside: corners (2, 1.2), (7, 1.2), (7, 4.5), closed.
		{"inside", []engine.Point{{Y: 2, Z: 1.2}, {Y: 7, Z: 1.2}, {Y: 7, Z: 4.5}, {Y: 2, Z: 1.2}}, 0.5 * 5 * 3.3, 16.0 / 3, 6.9 / 3, 30, 42, 36},
		// Clockwise, to y = 10 past the side at 8: inside the hull the
		// triangle (2, 1.2), (8, 1.2), (8, 4.2).
		{"clipped by the side", []engine.Point{{Y: 2, Z: 1.2}, {Y: 10, Z: 5.2}, {Y: 10, Z: 1.2}}, 0.5 * 6 * 3, 6, 6.6 / 3, 10, 25, 17.5},
	} {
		c, err := engine.NewSectionCompartment(h, tc.name, prismSections(tc.x0, tc.x1, tc.outline...))
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		wantV := tc.area * (tc.x1 - tc.x0)
		x, y, z := c.Solid().Whole().Centroid()
		for _, q := range [][3]float64{{c.Volume(), wantV, 1}, {x, tc.wantXc, 1}, {y, tc.yc, 1}, {z, tc.zc, 1}} {
			if math.Abs(q[0]-q[1]) > 1e-12*math.Max(1, math.Abs(q[1])) {
				t.Errorf("%s: volume and centre %.12g %.12g %.12g %.12g, want %.12g %.12g %.12g %.12g", tc.name, c.Volume(), x, y, z, wantV, tc.wantXc, tc.yc, tc.zc)
				break
			}
		}
	}
}

// TestSectionCompartmentErrors: bad outlines are refused with a reason.
func TestSectionCompartmentErrors(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	tri := []engine.Point{{Y: 2, Z: 1}, {Y: 7, Z: 1}, {Y: 7, Z: 4}}
	for _, tc := range []struct {
		name string
		secs []engine.CompartmentSection
	}{
		{"one section", []engine.CompartmentSection{{X: 1, Outline: tri}}},
		{"x not ascending", []engine.CompartmentSection{{X: 5, Outline: tri}, {X: 5, Outline: tri}}},
		{"two points", prismSections(1, 5, engine.Point{Y: 1, Z: 1}, engine.Point{Y: 2, Z: 2})},
		{"no area", prismSections(1, 5, engine.Point{Y: 1, Z: 1}, engine.Point{Y: 2, Z: 2}, engine.Point{Y: 3, Z: 3})},
		{"not convex", prismSections(1, 5, engine.Point{Y: 0, Z: 0}, engine.Point{Y: 4, Z: 0}, engine.Point{Y: 1, Z: 1}, engine.Point{Y: 0, Z: 4})},
		{"point counts differ", []engine.CompartmentSection{{X: 1, Outline: tri}, {X: 5, Outline: append(tri, engine.Point{Y: 2, Z: 4})}}},
		{"outside", prismSections(1, 5, engine.Point{Y: 2, Z: 9}, engine.Point{Y: 7, Z: 9}, engine.Point{Y: 7, Z: 12})},
		{"not a number", prismSections(1, 5, engine.Point{Y: math.NaN(), Z: 9}, engine.Point{Y: 7, Z: 9}, engine.Point{Y: 7, Z: 12})},
	} {
		if _, err := engine.NewSectionCompartment(h, tc.name, tc.secs); err == nil {
			t.Errorf("%s: accepted", tc.name)
		}
	}
}

// TestSectionCompartmentTaper: a tank whose triangle grows linearly along
// the ship (a pyramid's frustum) has the volume of the prismoidal formula
// L/6·(A0 + 4Am + A1), exact for a section area quadratic in x (practice),
// to the midpoint rule's error (step²/24 · A″ · L).
func TestSectionCompartmentTaper(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	a := []engine.Point{{Y: 2, Z: 1}, {Y: 4, Z: 1}, {Y: 4, Z: 2}}
	b := []engine.Point{{Y: 2, Z: 1}, {Y: 6, Z: 1}, {Y: 6, Z: 3}}
	c, err := engine.NewSectionCompartment(h, "taper", []engine.CompartmentSection{{X: 10, Outline: a}, {X: 20, Outline: b}})
	if err != nil {
		t.Fatal(err)
	}
	// Legs 2+2t by 1+t: area (1+t)², t from 0 to 1 over 10 m.
	L := 10.0
	want := L / 6 * (1 + 4*2.25 + 4)
	A2 := 2.0 / (L * L) // A″ in x
	if d := math.Abs(c.Volume() - want); d > 0.25*0.25/24*A2*L*1.0001 {
		t.Errorf("volume %.9f, want %.9f (diff %.2e)", c.Volume(), want, d)
	}
}

// TestSectionCompartmentOpenOnBox: the triangular prism opened to the sea
// on a box barge gives the floating position of the exact lost-buoyancy
// answer, solved here from closed forms: the box below the plane
// z = A + B·x + C·y (wall-sided, the waterline on the sides all round) has
// V = 2bL(A + BL/2), MX = 2b(AL²/2 + BL³/3), MY = (2b³/3)·L·C and
// MZ = ∫∫ (A + Bx + Cy)²/2 dy dx, less the prism (wholly under water:
// area × length at the triangle's centroid); at rest G lies on the normal
// through B: (xB − xG) + B(zB − zG) = 0 and (yB − yG) + C(zB − zG) = 0,
// with V = Δ/ρ. (The equations are the engine's own statement of
// equilibrium; the integrals are independent of its slabs.)
func TestSectionCompartmentOpenOnBox(t *testing.T) {
	const L, Bm, D, rho = 80.0, 16.0, 8.0, 1.025
	h, err := engine.NewBoxHull(L, Bm, D)
	if err != nil {
		t.Fatal(err)
	}
	tri := []engine.Point{{Y: 2, Z: 1.2}, {Y: 7, Z: 1.2}, {Y: 7, Z: 4.5}}
	c, err := engine.NewSectionCompartment(h, "Hopper S", prismSections(30, 42, tri...))
	if err != nil {
		t.Fatal(err)
	}
	mass, kg := rho*L*Bm*5.0, 5.0
	v, err := engine.NewVessel(engine.Vessel{Hull: h, Compartments: []*engine.Compartment{c},
		Weights: []engine.Weight{{Name: "all", MassT: mass, LCGM: L / 2, VCGM: kg}}})
	if err != nil {
		t.Fatal(err)
	}
	d := v.Intact()
	d[0].Open = true
	pos, err := engine.Solve(v, d)
	if err != nil {
		t.Fatal(err)
	}
	// The closed-form answer by Newton's method on (A, B, C), numerical
	// Jacobian.
	b := Bm / 2
	pv, px, py, pz := 0.5*5*3.3*12, 36.0, 16.0/3, 6.9/3
	res := func(A, B, C float64) [3]float64 {
		V := 2*b*L*(A+B*L/2) - pv
		MX := 2*b*(A*L*L/2+B*L*L*L/3) - pv*px
		MY := 2*b*b*b/3*L*C - pv*py
		// ∫∫ (A+Bx+Cy)²/2: expand, odd powers of y vanish.
		MZ := (2*b*(A*A*L+A*B*L*L+B*B*L*L*L/3)+C*C*2*b*b*b/3*L)/2 - pv*pz
		return [3]float64{V - mass/rho, (MX/V - L/2) + B*(MZ/V-kg), MY/V + C*(MZ/V-kg)}
	}
	x := [3]float64{5, 0, 0}
	for it := 0; it < 50; it++ {
		f := res(x[0], x[1], x[2])
		var j [3][3]float64
		for k := 0; k < 3; k++ {
			y := x
			hk := 1e-7
			y[k] += hk
			g := res(y[0], y[1], y[2])
			for r := 0; r < 3; r++ {
				j[r][k] = (g[r] - f[r]) / hk
			}
		}
		dx := solve3(j, f)
		for k := range x {
			x[k] -= dx[k]
		}
	}
	A, B, C := x[0], x[1], x[2]
	wantAft, wantFwd := A, A+B*L
	wantHeel := math.Atan(C) * 180 / math.Pi
	if math.Abs(pos.DraftAftM-wantAft) > 1e-7 || math.Abs(pos.DraftFwdM-wantFwd) > 1e-7 || math.Abs(pos.HeelDeg-wantHeel) > 1e-6 {
		t.Errorf("drafts %.9f/%.9f heel %.9f°; closed form %.9f/%.9f heel %.9f°", pos.DraftAftM, pos.DraftFwdM, pos.HeelDeg, wantAft, wantFwd, wantHeel)
	}
	// The prism stays under water and the waterline on the sides.
	if !(A+B*30+C*7 > 4.5) || !(wantFwd < D) {
		t.Fatalf("the closed form's conditions do not hold: A %v B %v C %v", A, B, C)
	}
	// The hand method is worked for an outlined space too (from the hull's
	// own hydrostatics): the prism lies wholly under the water, so it takes
	// nothing from the waterplane and the sinkage is μ·v/(L·B), the box's
	// closed form.
	hw, err := engine.HandMethod(v, d)
	if err != nil {
		t.Fatalf("hand method on a box with an outlined space: %v", err)
	}
	mu := v.Permeability(d, 0)
	if want := mu * pv / (L * Bm); math.Abs(hw.SinkageM-want) > 1e-9 {
		t.Errorf("sinkage %.12f m, closed form μ·v/(L·B) = %.12f m", hw.SinkageM, want)
	}
}

// solve3 solves a 3×3 linear system by Cramer's rule.
func solve3(a [3][3]float64, b [3]float64) [3]float64 {
	det := func(m [3][3]float64) float64 {
		return m[0][0]*(m[1][1]*m[2][2]-m[1][2]*m[2][1]) - m[0][1]*(m[1][0]*m[2][2]-m[1][2]*m[2][0]) + m[0][2]*(m[1][0]*m[2][1]-m[1][1]*m[2][0])
	}
	d := det(a)
	var x [3]float64
	for c := 0; c < 3; c++ {
		m := a
		for r := 0; r < 3; r++ {
			m[r][c] = b[r]
		}
		x[c] = det(m) / d
	}
	return x
}
