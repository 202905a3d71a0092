package engine_test

// Reference tests on a box-shaped hull: the closed forms upright and, at any
// heel and trim, an exact polyhedron computation written out here that
// shares nothing with the engine's slab integration.

import (
	"math"
	"math/rand"
	"testing"

	"heelwatch/engine"
)

// refVec is a point of the ship frame used by the test's own geometry.
type refVec struct{ x, y, z float64 }

func (a refVec) sub(b refVec) refVec { return refVec{a.x - b.x, a.y - b.y, a.z - b.z} }

func refDet(a, b, c refVec) float64 {
	return a.x*(b.y*c.z-b.z*c.y) - a.y*(b.x*c.z-b.z*c.x) + a.z*(b.x*c.y-b.y*c.x)
}

// refBoxBelow returns the volume and centroid of the part of the box
// [0,L]×[−B/2,B/2]×[0,D] below the plane z = p.A + p.B·x + p.C·y.
//
// Method (divergence theorem on a closed polyhedron): the part below the
// plane is a convex polyhedron bounded by the six faces of the box, each
// clipped by the plane, and by the cap where the plane cuts the box. With a
// reference point r on the plane, V = Σ over faces and fan triangles
// (a, b, c) of det(a−r, b−r, c−r)/6 with the faces oriented outward; the cap
// adds nothing because its triangles are coplanar with r. Each tetrahedron's
// centroid is (r+a+b+c)/4. Exact for any plane (derived).
func refBoxBelow(L, B, D float64, p engine.Plane) (v float64, c refVec) {
	b := B / 2
	corner := func(i, j, k int) refVec {
		return refVec{float64(i) * L, -b + float64(j)*B, float64(k) * D}
	}
	// The six faces, each as four corners in cyclic order with its outward
	// normal.
	type face struct {
		q [4]refVec
		n refVec
	}
	faces := []face{
		{[4]refVec{corner(0, 0, 0), corner(0, 1, 0), corner(0, 1, 1), corner(0, 0, 1)}, refVec{-1, 0, 0}},
		{[4]refVec{corner(1, 0, 0), corner(1, 1, 0), corner(1, 1, 1), corner(1, 0, 1)}, refVec{1, 0, 0}},
		{[4]refVec{corner(0, 0, 0), corner(1, 0, 0), corner(1, 0, 1), corner(0, 0, 1)}, refVec{0, -1, 0}},
		{[4]refVec{corner(0, 1, 0), corner(1, 1, 0), corner(1, 1, 1), corner(0, 1, 1)}, refVec{0, 1, 0}},
		{[4]refVec{corner(0, 0, 0), corner(1, 0, 0), corner(1, 1, 0), corner(0, 1, 0)}, refVec{0, 0, -1}},
		{[4]refVec{corner(0, 0, 1), corner(1, 0, 1), corner(1, 1, 1), corner(0, 1, 1)}, refVec{0, 0, 1}},
	}
	depth := func(q refVec) float64 { return q.z - (p.A + p.B*q.x + p.C*q.y) }
	r := refVec{0, 0, p.A}
	var mx, my, mz float64
	for _, f := range faces {
		poly := f.q[:]
		// Orient outward (Newell's normal against the outward normal).
		var nw refVec
		for i := range poly {
			a, c := poly[i], poly[(i+1)%len(poly)]
			nw.x += (a.y - c.y) * (a.z + c.z)
			nw.y += (a.z - c.z) * (a.x + c.x)
			nw.z += (a.x - c.x) * (a.y + c.y)
		}
		if nw.x*f.n.x+nw.y*f.n.y+nw.z*f.n.z < 0 {
			poly = []refVec{poly[3], poly[2], poly[1], poly[0]}
		}
		// Keep the part with depth ≤ 0, edge by edge.
		var kept []refVec
		for i := range poly {
			a, c := poly[(i+len(poly)-1)%len(poly)], poly[i]
			da, dc := depth(a), depth(c)
			if (da < 0) != (dc < 0) {
				t := da / (da - dc)
				kept = append(kept, refVec{a.x + t*(c.x-a.x), a.y + t*(c.y-a.y), a.z + t*(c.z-a.z)})
			}
			if dc < 0 {
				kept = append(kept, c)
			}
		}
		for i := 1; i+1 < len(kept); i++ {
			a, bb, cc := kept[0], kept[i], kept[i+1]
			dv := refDet(a.sub(r), bb.sub(r), cc.sub(r)) / 6
			v += dv
			mx += dv * (r.x + a.x + bb.x + cc.x) / 4
			my += dv * (r.y + a.y + bb.y + cc.y) / 4
			mz += dv * (r.z + a.z + bb.z + cc.z) / 4
		}
	}
	if v > 0 {
		c = refVec{mx / v, my / v, mz / v}
	}
	return v, c
}

// refPlaneMoments holds a plane region's area and moments about the origin.
type refPlaneMoments struct{ a, sx, sy, ixx, ixy, iyy float64 }

// refBoxWaterplane returns the moments of the box's waterplane projected on
// the xy plane: the rectangle [0,L]×[−B/2,B/2] where 0 ≤ A + Bx + Cy ≤ D,
// a convex polygon. Its moments come from the polygon formulas (Green's
// theorem; practice): with c_i = x_i·y_{i+1} − x_{i+1}·y_i,
// A = Σc/2, ∫x = Σ(x_i+x_{i+1})c/6, ∫x² = Σ(x_i²+x_i x_{i+1}+x_{i+1}²)c/12,
// ∫xy = Σ(x_i y_{i+1} + 2x_i y_i + 2x_{i+1} y_{i+1} + x_{i+1} y_i)c/24.
func refBoxWaterplane(L, B, D float64, p engine.Plane) refPlaneMoments {
	type pt struct{ x, y float64 }
	poly := []pt{{0, -B / 2}, {L, -B / 2}, {L, B / 2}, {0, B / 2}}
	clip := func(poly []pt, f func(pt) float64) []pt {
		var out []pt
		for i := range poly {
			a, c := poly[(i+len(poly)-1)%len(poly)], poly[i]
			fa, fc := f(a), f(c)
			if (fa <= 0) != (fc <= 0) {
				t := fa / (fa - fc)
				out = append(out, pt{a.x + t*(c.x-a.x), a.y + t*(c.y-a.y)})
			}
			if fc <= 0 {
				out = append(out, c)
			}
		}
		return out
	}
	zw := func(q pt) float64 { return p.A + p.B*q.x + p.C*q.y }
	poly = clip(poly, func(q pt) float64 { return -zw(q) })
	poly = clip(poly, func(q pt) float64 { return zw(q) - D })
	var m refPlaneMoments
	for i := range poly {
		a, c := poly[i], poly[(i+1)%len(poly)]
		cr := a.x*c.y - c.x*a.y
		m.a += cr / 2
		m.sx += (a.x + c.x) * cr / 6
		m.sy += (a.y + c.y) * cr / 6
		m.ixx += (a.x*a.x + a.x*c.x + c.x*c.x) * cr / 12
		m.iyy += (a.y*a.y + a.y*c.y + c.y*c.y) * cr / 12
		m.ixy += (a.x*c.y + 2*a.x*a.y + 2*c.x*c.y + c.x*a.y) * cr / 24
	}
	return m
}

func refBoxHull(t *testing.T, L, B, D float64) *engine.Hull {
	t.Helper()
	h, err := engine.NewBoxHull(L, B, D)
	if err != nil {
		t.Fatal(err)
	}
	return h
}

// refBoxVessel returns a box barge carrying one weight.
func refBoxVessel(t testing.TB, L, B, D float64, w engine.Weight) *engine.Vessel {
	t.Helper()
	h, err := engine.NewBoxHull(L, B, D)
	if err != nil {
		t.Fatal(err)
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "reference box", Hull: h, Weights: []engine.Weight{w}})
	if err != nil {
		t.Fatal(err)
	}
	return v
}

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got-want) / math.Abs(want)
}

// TestBoxUprightClosedForms checks the box's upright hydrostatics at several
// drafts, from Solid.Below and from a full Solve.
func TestBoxUprightClosedForms(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	h := refBoxHull(t, L, B, D)
	cases := []struct {
		T   float64
		tol float64 // relative
	}{{0.5, 1e-9}, {2, 1e-9}, {4, 1e-9}, {6.25, 1e-9}, {7.9, 1e-9}}
	worst := 0.0
	for _, c := range cases {
		im := h.Solid().Below(engine.Plane{A: c.T})
		x, y, z := im.Centroid()
		bmt := (im.IYY - im.SY*im.SY/im.AW) / im.V
		bml := (im.IXX - im.SX*im.SX/im.AW) / im.V
		checks := []struct {
			name      string
			got, want float64
		}{
			{"volume L·B·T", im.V, L * B * c.T},       // practice: prism
			{"KB = T/2", z, c.T / 2},                  // practice: box KB = T/2
			{"LCB = L/2", x, L / 2},                   // practice: prism
			{"waterplane L·B", im.AW, L * B},          // practice
			{"BMT = B²/12T", bmt, B * B / (12 * c.T)}, // practice: box BM_T = B²/(12T)
			{"BML = L²/12T", bml, L * L / (12 * c.T)}, // practice: box BM_L = L²/(12T)
			{"LCF = L/2", im.SX / im.AW, L / 2},       // practice
		}
		for _, k := range checks {
			e := relErr(k.got, k.want)
			worst = math.Max(worst, e)
			if e > c.tol {
				t.Errorf("T=%g: %s: got %.15g, want %.15g (rel err %.2e > %.0e)", c.T, k.name, k.got, k.want, e, c.tol)
			}
		}
		if math.Abs(y) > 1e-12*B {
			t.Errorf("T=%g: TCB = %g, want 0", c.T, y)
		}

		// The same through Solve: a weight of ρLBT at (L/2, 0, KG) floats at T.
		const kg = 3.0
		v := refBoxVessel(t, L, B, D, engine.Weight{Name: "load", MassT: engine.SeaWaterDensity * L * B * c.T, LCGM: L / 2, VCGM: kg})
		pos, err := engine.Solve(v, v.Intact())
		if err != nil {
			t.Fatalf("T=%g: %v", c.T, err)
		}
		gm := c.T/2 + B*B/(12*c.T) - kg // practice: GM = KB + BM − KG
		sol := []struct {
			name      string
			got, want float64
		}{
			{"draft mid", pos.DraftMidM, c.T},
			{"draft aft", pos.DraftAftM, c.T},
			{"draft fwd", pos.DraftFwdM, c.T},
			{"VCB", pos.VCBM, c.T / 2},
			{"BMT", pos.BMTM, B * B / (12 * c.T)},
			{"BML", pos.BMLM, L * L / (12 * c.T)},
			{"KMT", pos.KMTM, c.T/2 + B*B/(12*c.T)},
			{"GM", pos.GMM, gm},
			{"waterplane", pos.WaterplaneAreaM2, L * B},
			{"LCF", pos.LCFM, L / 2},
		}
		for _, k := range sol {
			e := relErr(k.got, k.want)
			worst = math.Max(worst, e)
			if e > c.tol {
				t.Errorf("T=%g Solve: %s: got %.15g, want %.15g (rel err %.2e > %.0e)", c.T, k.name, k.got, k.want, e, c.tol)
			}
		}
		if math.Abs(pos.HeelDeg) > 1e-9 || math.Abs(pos.TrimM) > 1e-9 {
			t.Errorf("T=%g: heel %g° trim %g m, want level", c.T, pos.HeelDeg, pos.TrimM)
		}
	}
	t.Logf("box upright: worst relative error %.2e", worst)
}

// refBoxAttitudes are named planes on the 80 × 16 × 8 m box, chosen so the
// waterline crosses the deck edge, the bilge, the ends, or several at once.
var refBoxAttitudes = []struct {
	name string
	p    engine.Plane
}{
	{"upright", engine.Plane{A: 4}},
	{"heel 10°", engine.Plane{A: 4, C: math.Tan(10 * math.Pi / 180)}},
	{"heel 30° deck edge in, bilge out", engine.Plane{A: 4, C: math.Tan(30 * math.Pi / 180)}},
	{"heel −45° port deck edge in", engine.Plane{A: 4.5, C: -1}},
	{"heel 70° deep", engine.Plane{A: 6, C: math.Tan(70 * math.Pi / 180)}},
	{"trim by head, stern out", engine.Plane{A: -1, B: 0.1}},
	{"trim by stern, bow deck in", engine.Plane{A: 10, B: -0.09}},
	{"heel and trim, deck in fwd, bilge out aft", engine.Plane{A: 1.5, B: 0.07, C: 0.4}},
	{"heel and trim, one corner wet", engine.Plane{A: -6, B: 0.05, C: 0.6}},
	{"heel and trim, one corner dry", engine.Plane{A: 12, B: -0.05, C: -0.6}},
	{"wholly under", engine.Plane{A: 30, B: 0.01, C: 0.1}},
	{"wholly clear", engine.Plane{A: -30, B: 0.01, C: 0.1}},
}

// TestBoxAnyAttitude compares the engine's immersion of a box hull with the
// exact polyhedron of refBoxBelow and the exact waterplane polygon of
// refBoxWaterplane, at the named attitudes and at seeded random ones.
func TestBoxAnyAttitude(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	const (
		volTol    = 1e-9 // relative to L·B·D
		centreTol = 1e-6 // m
		wpTol     = 1e-9 // relative to the matching moment of the whole rectangle
	)
	h := refBoxHull(t, L, B, D)
	cases := append([]struct {
		name string
		p    engine.Plane
	}(nil), refBoxAttitudes...)
	rng := rand.New(rand.NewSource(3))
	for i := 0; i < 300; i++ {
		heel := (rng.Float64()*2 - 1) * 85 * math.Pi / 180
		cases = append(cases, struct {
			name string
			p    engine.Plane
		}{"random", engine.Plane{A: -4 + 16*rng.Float64(), B: (rng.Float64()*2 - 1) * 0.2, C: math.Tan(heel)}})
	}
	var worstV, worstC, worstW float64
	for i, c := range cases {
		im := h.Solid().Below(c.p)
		v, ctr := refBoxBelow(L, B, D, c.p)
		ev := math.Abs(im.V-v) / (L * B * D)
		worstV = math.Max(worstV, ev)
		if ev > volTol {
			t.Errorf("%d %s %+v: volume %.12g, exact %.12g", i, c.name, c.p, im.V, v)
		}
		if v > 1e-6*L*B*D {
			x, y, z := im.Centroid()
			for _, d := range []struct {
				n         string
				got, want float64
			}{{"LCB", x, ctr.x}, {"TCB", y, ctr.y}, {"VCB", z, ctr.z}} {
				e := math.Abs(d.got - d.want)
				worstC = math.Max(worstC, e)
				if e > centreTol {
					t.Errorf("%d %s %+v: %s %.12g, exact %.12g", i, c.name, c.p, d.n, d.got, d.want)
				}
			}
		}
		wp := refBoxWaterplane(L, B, D, c.p)
		for _, d := range []struct {
			n               string
			got, want, norm float64
		}{
			{"AW", im.AW, wp.a, L * B},
			{"SX", im.SX, wp.sx, L * L * B},
			{"SY", im.SY, wp.sy, L * B * B},
			{"IXX", im.IXX, wp.ixx, L * L * L * B},
			{"IXY", im.IXY, wp.ixy, L * L * B * B},
			{"IYY", im.IYY, wp.iyy, L * B * B * B},
		} {
			e := math.Abs(d.got-d.want) / d.norm
			worstW = math.Max(worstW, e)
			if e > wpTol {
				t.Errorf("%d %s %+v: waterplane %s %.12g, exact %.12g", i, c.name, c.p, d.n, d.got, d.want)
			}
		}
	}
	t.Logf("box at %d attitudes: worst volume err %.2e of LBD, centre err %.2e m, waterplane err %.2e", len(cases), worstV, worstC, worstW)
}

// TestBoxEquilibriumAtGivenAttitude runs the equilibrium backwards: for an
// attitude chosen in advance, the exact polyhedron gives the displaced
// volume and the centre of buoyancy; a weight of ρ∇ placed at that centre
// makes the attitude an equilibrium (G on the vertical through B, and
// stable since G = B lies below the metacentre), and Solve must find it.
func TestBoxEquilibriumAtGivenAttitude(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	const tol = 1e-6 // m, on the water's height at the ends and at the sides
	cases := []struct {
		name string
		p    engine.Plane
	}{
		{"level", engine.Plane{A: 3}},
		{"heel 5°", engine.Plane{A: 3, C: math.Tan(5 * math.Pi / 180)}},
		{"trim by head", engine.Plane{A: 2, B: 0.02}},
		{"heel 20° and trim by stern", engine.Plane{A: 4.5, B: -0.015, C: math.Tan(20 * math.Pi / 180)}},
		{"heel −35° deck edge in", engine.Plane{A: 4, B: 0.01, C: -math.Tan(35 * math.Pi / 180)}},
	}
	worst := 0.0
	for _, c := range cases {
		vol, ctr := refBoxBelow(L, B, D, c.p)
		v := refBoxVessel(t, L, B, D, engine.Weight{Name: "load", MassT: engine.SeaWaterDensity * vol, LCGM: ctr.x, TCGM: ctr.y, VCGM: ctr.z})
		pos, err := engine.Solve(v, v.Intact())
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		for _, pt := range [][2]float64{{0, -B / 2}, {0, B / 2}, {L, -B / 2}, {L, B / 2}} {
			e := math.Abs(pos.Plane.Z(pt[0], pt[1]) - c.p.Z(pt[0], pt[1]))
			worst = math.Max(worst, e)
			if e > tol {
				t.Errorf("%s: water at (%g, %g) %.9f m, want %.9f m", c.name, pt[0], pt[1], pos.Plane.Z(pt[0], pt[1]), c.p.Z(pt[0], pt[1]))
			}
		}
	}
	t.Logf("box equilibrium at a given attitude: worst waterline error %.2e m", worst)
}

// TestBoxCompartmentVolume checks that a compartment box reaching past the
// shell of a box hull keeps exactly the intersection of the two boxes
// (practice: volume of a rectangular box), and that its immersion at a
// heeled, trimmed plane matches refBoxBelow on the box it really is.
func TestBoxCompartmentVolume(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	h := refBoxHull(t, L, B, D)
	cases := []struct {
		box  engine.Box
		want engine.Box // the part inside the hull
	}{
		{engine.Box{X0: 30, X1: 45, Y0: 4, Y1: 20, Z0: -1, Z1: 9}, engine.Box{X0: 30, X1: 45, Y0: 4, Y1: 8, Z0: 0, Z1: 8}},
		{engine.Box{X0: -5, X1: 10, Y0: -3, Y1: 3, Z0: 1, Z1: 5}, engine.Box{X0: 0, X1: 10, Y0: -3, Y1: 3, Z0: 1, Z1: 5}},
		{engine.Box{X0: 70, X1: 90, Y0: -9, Y1: -2, Z0: 2, Z1: 12}, engine.Box{X0: 70, X1: 80, Y0: -8, Y1: -2, Z0: 2, Z1: 8}},
	}
	p := engine.Plane{A: 3.5, B: 0.02, C: 0.3}
	for i, c := range cases {
		cm, err := engine.NewCompartment(h, "test space", c.box)
		if err != nil {
			t.Fatal(err)
		}
		w := c.want
		want := (w.X1 - w.X0) * (w.Y1 - w.Y0) * (w.Z1 - w.Z0)
		if e := relErr(cm.Volume(), want); e > 1e-12 {
			t.Errorf("case %d: volume %.12g, want %.12g", i, cm.Volume(), want)
		}
		// The compartment is the box w: shift the frame so w becomes a box
		// hull at the origin, and the plane with it.
		q := engine.Plane{A: p.A + p.B*w.X0 + p.C*(w.Y0+w.Y1)/2 - w.Z0, B: p.B, C: p.C}
		vol, ctr := refBoxBelow(w.X1-w.X0, w.Y1-w.Y0, w.Z1-w.Z0, q)
		im := cm.Solid().Below(p)
		if e := math.Abs(im.V-vol) / want; e > 1e-9 {
			t.Errorf("case %d: immersed volume %.12g, exact %.12g", i, im.V, vol)
		}
		if vol > 0 {
			x, y, z := im.Centroid()
			gx, gy, gz := ctr.x+w.X0, ctr.y+(w.Y0+w.Y1)/2, ctr.z+w.Z0
			if math.Abs(x-gx) > 1e-6 || math.Abs(y-gy) > 1e-6 || math.Abs(z-gz) > 1e-6 {
				t.Errorf("case %d: centroid (%g, %g, %g), exact (%g, %g, %g)", i, x, y, z, gx, gy, gz)
			}
		}
	}
}

// refBoxTrimExact returns the plane (A, B) of a box barge floating level in
// heel at constant displacement with G at (xg, zg), found in the (x, z)
// plane where the problem is two-dimensional: the immersed part of the
// profile rectangle is the clipped rectangle of refRectangleBelow (exact),
// its waterline found by bisection on the area, and the trim by bisection
// on the equilibrium condition (xB − xG) + B·(zB − zG) = 0 (B − G
// perpendicular to the water) between the slopes lo and hi (derived).
func refBoxTrimExact(L, D, area, xg, zg, lo, hi float64) engine.Plane {
	at := func(s float64) (res, h float64) {
		t := math.Abs(s)
		a, b := -t*L/2, D+t*L/2
		for i := 0; i < 200 && b-a > 1e-15*(1+math.Abs(b)); i++ {
			m := (a + b) / 2
			if ar, _, _ := refRectangleBelow(L/2, D, m, t); ar < area {
				a = m
			} else {
				b = m
			}
		}
		h = (a + b) / 2
		_, xc, zc := refRectangleBelow(L/2, D, h, t)
		if s < 0 {
			xc = -xc // the mirror image of the profile cut at slope |s|
		}
		return (xc + L/2 - xg) + s*(zc-zg), h
	}
	rlo, _ := at(lo)
	for i := 0; i < 200 && hi-lo > 1e-15; i++ {
		m := (lo + hi) / 2
		if r, _ := at(m); (r < 0) == (rlo < 0) {
			lo, rlo = m, r
		} else {
			hi = m
		}
	}
	s := (lo + hi) / 2
	_, h := at(s)
	return engine.Plane{A: h - s*L/2, B: s}
}

// TestBoxLargeTrim: a box barge with G far aft trims until the profile is
// a wedge (forefoot out of the water) or the deck is under aft; the draft
// and trim at zero heel (Problem.AtHeel) must match the exact profile cut.
func TestBoxLargeTrim(t *testing.T) {
	const L, B, D = 100.0, 16.0, 10.0
	const tol = 1e-6 // m, on the water's height at the perpendiculars
	cases := []struct {
		fill, lcg float64 // displacement as a fraction of L·B·D; LCG as a fraction of L
	}{
		{0.5, 0.4}, {0.5, 0.3}, {0.05, 0.3}, {0.05, 0.1}, {0.2, 0.1}, {0.8, 0.4}, {0.05, 0.02}, {0.5, 0.2},
	}
	worst := 0.0
	for _, c := range cases {
		zg := 0.4 * D
		v := refBoxVessel(t, L, B, D, engine.Weight{Name: "load", MassT: engine.SeaWaterDensity * c.fill * L * B * D, LCGM: c.lcg * L, VCGM: zg})
		p, _, err := engine.NewProblem(v, nil).AtHeel(0, engine.Plane{A: c.fill * D})
		if err != nil {
			t.Errorf("fill %g LCG %gL: %v", c.fill, c.lcg, err)
			continue
		}
		// Trim by the stern: bracket the slope between level and 85°.
		want := refBoxTrimExact(L, D, c.fill*L*D, c.lcg*L, zg, -math.Tan(85*math.Pi/180), 0)
		for _, x := range []float64{0, L} {
			e := math.Abs(p.Z(x, 0) - want.Z(x, 0))
			worst = math.Max(worst, e)
			if !(e <= tol) {
				t.Errorf("fill %g LCG %gL: water at x = %g: %.9f m, exact %.9f m (trim angle %.3f°, exact %.3f°)", c.fill, c.lcg, x, p.Z(x, 0), want.Z(x, 0), math.Atan(-p.B)*180/math.Pi, math.Atan(-want.B)*180/math.Pi)
			}
		}
	}
	t.Logf("large trim: worst error %.2e m", worst)
}
