package engine_test

// Properties that must hold at any attitude and for any condition, on the
// box and the Wigley hull: below + above = whole, symmetry, mirror images,
// and the agreement of the lost-buoyancy and added-weight methods.

import (
	"fmt"
	"math"
	"math/rand"
	"testing"

	"heelwatch/engine"
)

// refFlippedWigley is refWigley turned upside down within its depth
// (z → D − z): its part below the plane (D − A, −B, −C) is the Wigley
// hull's part above (A, B, C).
func refFlippedWigley(t testing.TB, L, B, T, D float64, nst, nwl int) *engine.Hull {
	t.Helper()
	var sts []engine.Station
	for i := 0; i < nst; i++ {
		x := L * float64(i) / float64(nst-1)
		xi := 2 * (x - L/2) / L
		deck := B / 2 * (1 - xi*xi)
		off := []engine.Point{{Y: deck, Z: 0}}
		for j := nwl - 1; j >= 0; j-- {
			z := T * float64(j) / float64(nwl-1)
			zeta := (T - z) / T
			off = append(off, engine.Point{Y: deck * (1 - zeta*zeta), Z: D - z})
		}
		sts = append(sts, engine.Station{X: x, Offsets: off})
	}
	h, err := engine.NewSectionHull(L, sts)
	if err != nil {
		t.Fatal(err)
	}
	return h
}

// TestBelowPlusAboveIsWhole: at random attitudes the part of a hull below
// the plane and the part above it (the flipped hull below the flipped
// plane) add up to the whole in volume and first moments, and share one
// waterplane (practice: additivity of integrals).
func TestBelowPlusAboveIsWhole(t *testing.T) {
	const L, B, T, D = 100.0, 10.0, 6.25, 9.0
	box := refBoxHull(t, L, B, D)
	hulls := []struct {
		name        string
		hull, upsid *engine.Hull
		volume      float64 // the whole, independently
		tol         float64 // relative to the whole (volume, moments) or to the plan's L·B and its powers (waterplane)
	}{
		// practice: L·B·D; the box is its own flip, and exact to round-off.
		{"box", box, box, L * B * D, 1e-11},
		// Twisted ruled slabs: both parts carry the slab quadrature's error
		// (see TestRuledSlabQuadrature), which does not cancel.
		{"Wigley 21×11", refWigley(t, L, B, T, D, 21, 11), refFlippedWigley(t, L, B, T, D, 21, 11), 0, 2e-7},
		{"Wigley 41×41", refWigley(t, L, B, T, D, 41, 41), refFlippedWigley(t, L, B, T, D, 41, 41), 0, 2e-8},
	}
	rng := rand.New(rand.NewSource(11))
	for _, h := range hulls {
		whole := h.hull.Solid().Whole()
		if h.volume > 0 && relErr(whole.V, h.volume) > 1e-13 {
			t.Errorf("%s: whole volume %.12g, want %.12g", h.name, whole.V, h.volume)
		}
		if fv := h.upsid.Solid().Volume(); relErr(fv, whole.V) > 1e-12 {
			t.Errorf("%s: flipped volume %.12g, upright %.12g", h.name, fv, whole.V)
		}
		worst := 0.0
		for i := 0; i < 400; i++ {
			p := engine.Plane{A: -2 + (D+4)*rng.Float64(), B: (rng.Float64()*2 - 1) * 0.1, C: math.Tan((rng.Float64()*2 - 1) * 85 * math.Pi / 180)}
			below := h.hull.Solid().Below(p)
			above := h.upsid.Solid().Below(engine.Plane{A: D - p.A, B: -p.B, C: -p.C})
			sums := []struct {
				name      string
				got, want float64
				norm      float64
			}{
				{"V", below.V + above.V, whole.V, whole.V},
				{"MX", below.MX + above.MX, whole.MX, whole.V * L},
				{"MY", below.MY + above.MY, whole.MY, whole.V * B},
				{"MZ", below.MZ + (D*above.V - above.MZ), whole.MZ, whole.V * D},
				{"AW", below.AW - above.AW, 0, L * B},
				{"SX", below.SX - above.SX, 0, L * L * B},
				{"SY", below.SY - above.SY, 0, L * B * B},
				{"IXX", below.IXX - above.IXX, 0, L * L * L * B},
				{"IYY", below.IYY - above.IYY, 0, L * B * B * B},
			}
			for _, s := range sums {
				e := math.Abs(s.got-s.want) / s.norm
				worst = math.Max(worst, e)
				if !(e <= h.tol) {
					t.Errorf("%s at %+v: %s below + above %.15g, whole %.15g", h.name, p, s.name, s.got, s.want)
				}
			}
		}
		t.Logf("%s: below + above = whole to %.2e", h.name, worst)
	}
}

// refCondition is a random condition on a hull that is symmetric about the
// centreline: one weight on the centreline and some compartments.
type refCondition struct {
	hull  *engine.Hull
	w     engine.Weight
	boxes []engine.Box
	mu    []float64
	dmg   engine.Damage
}

func (c refCondition) vessel(t testing.TB) *engine.Vessel {
	t.Helper()
	var comps []*engine.Compartment
	for i, b := range c.boxes {
		cm, err := engine.NewCompartment(c.hull, fmt.Sprintf("space %d", i+1), b)
		if err != nil {
			t.Fatal(err)
		}
		cm.Permeability = c.mu[i]
		comps = append(comps, cm)
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "property test", Hull: c.hull, Weights: []engine.Weight{c.w}, Compartments: comps})
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// refHullsForProperties are the symmetric hulls the properties run on,
// with the draft and KG of their loads.
func refHullsForProperties(t testing.TB) []struct {
	name   string
	hull   *engine.Hull
	T, KG  float64
	volume float64
} {
	const L, B, D = 100.0, 10.0, 9.0
	box, err := engine.NewBoxHull(L, 16, D)
	if err != nil {
		t.Fatal(err)
	}
	wig := refWigley(t, L, B, 6.25, D, 41, 21)
	return []struct {
		name   string
		hull   *engine.Hull
		T, KG  float64
		volume float64
	}{
		{"box", box, 4, 4.5, box.Solid().Below(engine.Plane{A: 4}).V},
		{"Wigley", wig, 5, 2.5, wig.Solid().Below(engine.Plane{A: 5}).V},
	}
}

// refRandomSpace returns a random compartment box between 0.3L and 0.7L
// (x), off the centreline from y0 outwards to beyond the shell (y), and
// from near the keel to above the waterline (z).
func refRandomSpace(rng *rand.Rand, L, B, D float64) engine.Box {
	x0 := L * (0.3 + 0.3*rng.Float64())
	x1 := x0 + L*(0.05+0.1*rng.Float64())
	y0 := B / 2 * 0.6 * rng.Float64()
	z0 := D * 0.3 * rng.Float64()
	z1 := z0 + D*(0.3+0.6*rng.Float64())
	return engine.Box{X0: x0, X1: x1, Y0: y0, Y1: B, Z0: z0, Z1: z1}
}

func refMirror(b engine.Box) engine.Box {
	return engine.Box{X0: b.X0, X1: b.X1, Y0: -b.Y1, Y1: -b.Y0, Z0: b.Z0, Z1: b.Z1}
}

// TestSymmetricFloodingFloatsUpright: with a symmetric load, flooding a
// centreline compartment, or a compartment and its mirror image together,
// open to the sea or holding water, leaves her upright (symmetry; practice).
func TestSymmetricFloodingFloatsUpright(t *testing.T) {
	const tol = 1e-9 // degrees
	rng := rand.New(rand.NewSource(13))
	for _, h := range refHullsForProperties(t) {
		L, B, D := h.hull.LengthM, h.hull.BreadthM, h.hull.DepthM
		worst := 0.0
		for i := 0; i < 40; i++ {
			c := refCondition{hull: h.hull, w: engine.Weight{Name: "load", MassT: engine.SeaWaterDensity * h.volume * (0.8 + 0.2*rng.Float64()), LCGM: L * (0.45 + 0.1*rng.Float64()), VCGM: h.KG}}
			b := refRandomSpace(rng, L, B, D)
			mu := 0.5 + 0.5*rng.Float64()
			held := rng.Intn(2) == 0
			st := engine.SpaceState{Open: !held}
			if rng.Intn(2) == 0 {
				// A centreline space.
				half := 0.5 + B/2*rng.Float64()
				b.Y0, b.Y1 = -half, half
				c.boxes, c.mu = []engine.Box{b}, []float64{mu}
				c.dmg = engine.Damage{st}
			} else {
				c.boxes, c.mu = []engine.Box{b, refMirror(b)}, []float64{mu, mu}
				c.dmg = engine.Damage{st, st}
			}
			v := c.vessel(t)
			if held {
				fill := 0.6 * rng.Float64()
				for j := range c.dmg {
					c.dmg[j].WaterM3 = mu * v.Compartments[0].Volume() * fill
				}
			}
			pos, err := engine.Solve(v, c.dmg)
			if err != nil {
				t.Errorf("%s case %d (%d spaces, held %v): %v", h.name, i, len(c.boxes), held, err)
				continue
			}
			worst = math.Max(worst, math.Abs(pos.HeelDeg))
			if !(math.Abs(pos.HeelDeg) < tol) {
				t.Errorf("%s case %d (%d spaces, held %v, GM %.3f): heel %g°, want upright", h.name, i, len(c.boxes), held, pos.GMM, pos.HeelDeg)
			}
		}
		t.Logf("%s: symmetric flooding, worst heel %.2e°", h.name, worst)
	}
}

// TestMirrorFloodingMirrorsHeel: flooding a compartment or its mirror image
// gives equal and opposite heel and the same drafts on the centreline
// (symmetry; practice).
func TestMirrorFloodingMirrorsHeel(t *testing.T) {
	const tolDeg, tolM = 1e-9, 1e-9
	rng := rand.New(rand.NewSource(17))
	for _, h := range refHullsForProperties(t) {
		L, B, D := h.hull.LengthM, h.hull.BreadthM, h.hull.DepthM
		var worstH, worstD float64
		for i := 0; i < 40; i++ {
			b := refRandomSpace(rng, L, B, D)
			mu := 0.5 + 0.5*rng.Float64()
			c := refCondition{hull: h.hull, w: engine.Weight{Name: "load", MassT: engine.SeaWaterDensity * h.volume * (0.7 + 0.2*rng.Float64()), LCGM: L * (0.45 + 0.1*rng.Float64()), VCGM: h.KG},
				boxes: []engine.Box{b, refMirror(b)}, mu: []float64{mu, mu}}
			v := c.vessel(t)
			var st engine.SpaceState
			if rng.Intn(2) == 0 {
				st.Open = true
			} else {
				st.WaterM3 = mu * v.Compartments[0].Volume() * rng.Float64()
			}
			ps, errS := engine.Solve(v, engine.Damage{st, {}})
			pp, errP := engine.Solve(v, engine.Damage{{}, st})
			if (errS == nil) != (errP == nil) {
				t.Errorf("%s case %d: starboard %v, port %v", h.name, i, errS, errP)
				continue
			}
			if errS != nil {
				t.Logf("%s case %d: both %v", h.name, i, errS)
				continue
			}
			eh := math.Abs(ps.HeelDeg + pp.HeelDeg)
			ed := math.Max(math.Abs(ps.DraftAftM-pp.DraftAftM), math.Abs(ps.DraftFwdM-pp.DraftFwdM))
			worstH, worstD = math.Max(worstH, eh), math.Max(worstD, ed)
			if !(eh <= tolDeg) || !(ed <= tolM) {
				t.Errorf("%s case %d: starboard space heel %.12f° drafts %.12f/%.12f; port space heel %.12f° drafts %.12f/%.12f",
					h.name, i, ps.HeelDeg, ps.DraftAftM, ps.DraftFwdM, pp.HeelDeg, pp.DraftAftM, pp.DraftFwdM)
			}
		}
		t.Logf("%s: mirror images, worst heel sum %.2e°, draft difference %.2e m", h.name, worstH, worstD)
	}
}

// TestLostBuoyancyEqualsAddedWeight: solve with a compartment open to the
// sea (lost buoyancy); the water it then holds is μ × its volume below that
// waterline; held as added weight (SpaceState.WaterM3) it must give the same
// waterline (Barrass & Derrett, bilging chapter; Tupper, flooding chapter;
// memory).
func TestLostBuoyancyEqualsAddedWeight(t *testing.T) {
	const tol = 1e-9 // m, the water's height at the four corners of the hull's plan
	rng := rand.New(rand.NewSource(19))
	for _, h := range refHullsForProperties(t) {
		L, B, D := h.hull.LengthM, h.hull.BreadthM, h.hull.DepthM
		worst := 0.0
		for i := 0; i < 40; i++ {
			b := refRandomSpace(rng, L, B, D)
			if rng.Intn(3) == 0 {
				b = refMirror(b)
			}
			mu := 0.5 + 0.5*rng.Float64()
			c := refCondition{hull: h.hull, w: engine.Weight{Name: "load", MassT: engine.SeaWaterDensity * h.volume * (0.7 + 0.2*rng.Float64()), LCGM: L * (0.4 + 0.2*rng.Float64()), TCGM: (rng.Float64()*2 - 1) * 0.02 * B, VCGM: h.KG},
				boxes: []engine.Box{b}, mu: []float64{1}}
			v := c.vessel(t)
			lost, err := engine.Solve(v, engine.Damage{{Open: true, Permeability: mu}})
			if err != nil {
				t.Logf("%s case %d: lost buoyancy: %v", h.name, i, err)
				continue
			}
			water := mu * v.Compartments[0].Solid().Below(lost.Plane).V
			added, err := engine.Solve(v, engine.Damage{{WaterM3: water, Permeability: mu}})
			if err != nil {
				t.Errorf("%s case %d: added weight of %.3f m³: %v (lost buoyancy floats at heel %.3f°)", h.name, i, water, err, lost.HeelDeg)
				continue
			}
			for _, pt := range [][2]float64{{0, -B / 2}, {0, B / 2}, {L, -B / 2}, {L, B / 2}} {
				e := math.Abs(lost.Plane.Z(pt[0], pt[1]) - added.Plane.Z(pt[0], pt[1]))
				worst = math.Max(worst, e)
				if !(e <= tol) {
					t.Errorf("%s case %d: water at (%g, %g): lost buoyancy %.12f m, added weight %.12f m (heel %.4f° / %.4f°)",
						h.name, i, pt[0], pt[1], lost.Plane.Z(pt[0], pt[1]), added.Plane.Z(pt[0], pt[1]), lost.HeelDeg, added.HeelDeg)
					break
				}
			}
			if e := relErr(added.DisplacementT, lost.DisplacementT+engine.SeaWaterDensity*water); e > 1e-12 {
				t.Errorf("%s case %d: added-weight displacement %.6f t, want %.6f t", h.name, i, added.DisplacementT, lost.DisplacementT+engine.SeaWaterDensity*water)
			}
		}
		t.Logf("%s: lost buoyancy vs added weight, worst waterline difference %.2e m", h.name, worst)
	}
}

// TestMomentOfStaticalStabilityAgrees: upright, with a centreline
// compartment flooded, GM differs between the lost-buoyancy and the
// added-weight methods but Δ·GM agrees (Barrass & Derrett, bilging chapter;
// Tupper, flooding chapter; memory).
func TestMomentOfStaticalStabilityAgrees(t *testing.T) {
	const tol = 1e-9 // relative
	for _, h := range refHullsForProperties(t) {
		L, B, D := h.hull.LengthM, h.hull.BreadthM, h.hull.DepthM
		for _, c := range []struct {
			name string
			box  engine.Box
			mu   float64
		}{
			{"amidships, through the waterline", engine.Box{X0: 0.45 * L, X1: 0.55 * L, Y0: -B / 4, Y1: B / 4, Z0: 0.5, Z1: D}, 1},
			{"forward of amidships (trims her)", engine.Box{X0: 0.55 * L, X1: 0.7 * L, Y0: -B, Y1: B, Z0: 0, Z1: D}, 0.85},
			{"low, partly filled", engine.Box{X0: 0.35 * L, X1: 0.5 * L, Y0: -B / 3, Y1: B / 3, Z0: 0.2, Z1: D}, 0.6},
		} {
			cond := refCondition{hull: h.hull, w: engine.Weight{Name: "load", MassT: engine.SeaWaterDensity * h.volume * 0.8, LCGM: L / 2, VCGM: h.KG},
				boxes: []engine.Box{c.box}, mu: []float64{c.mu}}
			v := cond.vessel(t)
			lost, err := engine.Solve(v, engine.Damage{{Open: true}})
			if err != nil {
				t.Fatalf("%s %s: %v", h.name, c.name, err)
			}
			water := c.mu * v.Compartments[0].Solid().Below(lost.Plane).V
			added, err := engine.Solve(v, engine.Damage{{WaterM3: water}})
			if err != nil {
				t.Fatalf("%s %s: %v", h.name, c.name, err)
			}
			ml, ma := lost.DisplacementT*lost.GMM, added.DisplacementT*added.GMM
			if e := relErr(ma, ml); !(e <= tol) {
				t.Errorf("%s %s: Δ·GM lost buoyancy %.9f t·m (GM %.6f), added weight %.9f t·m (GM %.6f)", h.name, c.name, ml, lost.GMM, ma, added.GMM)
			}
			if relErr(added.GMM, lost.GMM) < 1e-6 {
				t.Errorf("%s %s: GM %.6f by both methods; they should differ", h.name, c.name, lost.GMM)
			}
			t.Logf("%s %s: GM %.4f m (lost buoyancy) vs %.4f m (added weight); Δ·GM %.3f vs %.3f t·m", h.name, c.name, lost.GMM, added.GMM, ml, ma)
		}
	}
}
