package engine

import (
	"fmt"
	"math"
	"sort"
)

// Box is an axis-aligned box in the ship frame, metres: X0 aft to X1
// forward, Y0 port to Y1 starboard, Z0 bottom to Z1 top.
type Box struct{ X0, X1, Y0, Y1, Z0, Z1 float64 }

// Liquid is what a tank holds.
type Liquid struct {
	Name    string  // e.g. "fuel oil", "sea water ballast"
	Density float64 // t/m³
	Fill    float64 // fraction of the tank's capacity (CapacityM3: μ × its volume inside the hull), 0 ≤ Fill ≤ 1
}

// Compartment is a space of the ship: a box clipped by the hull, so that a
// box reaching past the shell follows the shell.
type Compartment struct {
	Name         string
	Use          string
	Permeability float64              // μ, 0 < μ ≤ 1: the fraction of the space that water can fill
	Box          Box                  // the box clipped by the hull; for a compartment given by sections, the box that holds its outlines
	Liquid       *Liquid              // nil for a dry space
	Sections     []CompartmentSection // nil for a box; else its outlines (compartment_sections.go)
	pieces       []prismPiece         // the region of a compartment given by sections
	PumpM3h      float64              // pumping capacity on the compartment, m³/h (0: none given); the righting options' times
	Pipe         *SoundingPipe        // where the tank is sounded (the vessel file's sounding_pipe); nil: DefaultSoundingPipe (sounding.go)

	solid *Solid
}

// Solid returns the compartment's body (the box clipped by the hull).
func (c *Compartment) Solid() *Solid { return c.solid }

// Volume returns the compartment's moulded volume (m³), before permeability.
func (c *Compartment) Volume() float64 { return c.solid.Volume() }

// CapacityM3 returns what the compartment holds when full (m³): μ × its
// volume inside the hull. For a tank this is its capacity, and Liquid.Fill
// is a fraction of it; the sea fills the same μ of the space, so a tank
// pressed full of sea water and holed wholly below the water changes
// nothing (heelwatch conventions, "tanks and permeability").
func (c *Compartment) CapacityM3() float64 { return c.Permeability * c.solid.Volume() }

// NewCompartment clips box b by the hull. It fails when the box is not a
// proper box or holds no part of the hull.
func NewCompartment(h *Hull, name string, b Box) (*Compartment, error) {
	for _, v := range []float64{b.X0, b.X1, b.Y0, b.Y1, b.Z0, b.Z1} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, fmt.Errorf("compartment %q: bounds must be finite numbers", name)
		}
	}
	if !(b.X1 > b.X0) || !(b.Y1 > b.Y0) || !(b.Z1 > b.Z0) {
		return nil, fmt.Errorf("compartment %q: each bound pair must run from the lower to the higher value", name)
	}
	s := clipSolid(h.solid, b)
	if !(s.Volume() > 1e-9*h.solid.Volume()) {
		return nil, fmt.Errorf("compartment %q: its box lies outside the hull", name)
	}
	return &Compartment{Name: name, Box: b, Permeability: 1, solid: s}, nil
}

// clipSolid returns the part of s inside box b, slab by slab. Each slab is
// split where a vertex crosses one of the box's sides so that the clipped
// polygon keeps one topology along the piece; its ends are matched vertex
// for vertex.
func clipSolid(s *Solid, b Box) *Solid {
	planes := []halfPlane{{-1, 0, -b.Y0}, {1, 0, b.Y1}, {0, -1, -b.Z0}, {0, 1, b.Z1}}
	return newSolid(clipSlabs(nil, s, b.X0, b.X1, planes))
}

// clipSlabs appends to out the slabs of the part of s between x0 and x1
// inside every one of planes (a convex region of the section, the same
// all along).
func clipSlabs(out []slab, s *Solid, x0, x1 float64, planes []halfPlane) []slab {
	sc := clipScratches.Get().(*clipScratch)
	defer clipScratches.Put(sc)
	for i := range s.slabs {
		sl := &s.slabs[i]
		xa, xb := math.Max(sl.x0, x0), math.Min(sl.x1, x1)
		if !(xb > xa) {
			continue
		}
		cuts := append(sc.cuts[:0], xa, xb)
		for k := range sl.p0 {
			for _, hp := range planes {
				// d(x) = n·v(x) − k is linear in x.
				d0 := hp.ny*(sl.p0[k].Y+(xa-sl.x0)*sl.dp[k].Y) + hp.nz*(sl.p0[k].Z+(xa-sl.x0)*sl.dp[k].Z) - hp.k
				d1 := hp.ny*(sl.p0[k].Y+(xb-sl.x0)*sl.dp[k].Y) + hp.nz*(sl.p0[k].Z+(xb-sl.x0)*sl.dp[k].Z) - hp.k
				if (d0 < 0 && d1 > 0) || (d0 > 0 && d1 < 0) {
					cuts = append(cuts, xa+(xb-xa)*d0/(d0-d1))
				}
			}
		}
		sort.Float64s(cuts)
		sc.cuts = cuts
		for j := 1; j < len(cuts); j++ {
			out = appendClipped(out, sl, planes, cuts[j-1], cuts[j], 0, sc)
		}
	}
	return out
}

// appendClipped appends the slabs of sl clipped by planes between xa and xb,
// splitting the piece where its clipped section changes topology (found by
// bisection) until each piece keeps one. sc's buffers are its scratch; the
// slabs appended own their vertices.
func appendClipped(out []slab, sl *slab, planes []halfPlane, xa, xb float64, depth int, sc *clipScratch) []slab {
	if !(xb-xa > 1e-9) {
		return out
	}
	// Clip a little inside the ends so that a vertex lying exactly on a
	// side at a cut gives the topology of the piece's interior.
	eps := 1e-7 * (xb - xa)
	pa, sa := sc.clipAt(sc.pa, sl, xa+eps, planes)
	sc.pa = pa
	pb, sb := sc.clipAt(sc.pb, sl, xb-eps, planes)
	sc.pb = pb
	if sa == sb && len(pa) == len(pb) {
		if len(pa) >= 3 {
			// Extend the inset ends linearly back to xa and xb.
			f := eps / (xb - xa - 2*eps)
			ends := make([]Point, 2*len(pa))
			ea, eb := ends[:len(pa):len(pa)], ends[len(pa):]
			for k := range pa {
				dy, dz := pb[k].Y-pa[k].Y, pb[k].Z-pa[k].Z
				ea[k] = Point{pa[k].Y - f*dy, pa[k].Z - f*dz}
				eb[k] = Point{pb[k].Y + f*dy, pb[k].Z + f*dz}
			}
			out = append(out, newSlab(xa, xb, ea, eb))
		}
		return out
	}
	if depth >= 24 {
		pm, _ := sc.clipAt(sc.pm, sl, (xa+xb)/2, planes)
		sc.pm = pm
		if len(pm) >= 3 {
			own := append([]Point(nil), pm...)
			out = append(out, newSlab(xa, xb, own, own))
		}
		return out
	}
	// Find where the topology changes by bisection and split there, so that
	// each change costs two slabs.
	na := len(pa)
	lo, hi := xa+eps, xb-eps
	for i := 0; i < 60 && hi-lo > 1e-9*(xb-xa); i++ {
		mid := (lo + hi) / 2
		pm, sm := sc.clipAt(sc.pm, sl, mid, planes)
		sc.pm = pm
		if sm == sa && len(pm) == na {
			lo = mid
		} else {
			hi = mid
		}
	}
	xm := (lo + hi) / 2
	out = appendClipped(out, sl, planes, xa, xm, depth+1, sc)
	return appendClipped(out, sl, planes, xm, xb, depth+1, sc)
}
