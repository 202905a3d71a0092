package engine

import (
	"errors"
	"fmt"
	"math"
)

// CompartmentSection is one station of a compartment given by its own
// outline instead of a box: a closed polygon in the ship's (y, z) plane at
// x, the whole section (not a half), in either sense of travel. The
// closing point may be repeated or left out.
type CompartmentSection struct {
	X       float64
	Outline []Point
}

// outlineStepM bounds the length along the ship of each prism that stands
// for the part of a compartment between two sections of different outline.
const outlineStepM = 0.25

// NewSectionCompartment builds a compartment from its sections, aft to
// forward, clipped by the hull as a box is (where an outline reaches past
// the shell the compartment follows the shell).
//
// Between two sections with the same outline the compartment is that
// outline's prism, and the clip is exact (the hull's slabs cut by the
// outline's sides, each a plane along the ship). Between two sections of
// different outline, point k of one runs straight to point k of the next
// (the outlines must have the same number of points); that part is taken
// as prisms of the outline midway along steps of at most outlineStepM: the
// midpoint rule, whose error in volume is (step²/24)·∫A″ dx for a
// section area A(x) that is quadratic in x between the sections.
//
// Each outline, and each outline between two sections, must be convex:
// a space whose section is not (an L-shaped tank) is given as two
// compartments. Errors name the section (counted from 1) and say why.
func NewSectionCompartment(h *Hull, name string, secs []CompartmentSection) (*Compartment, error) {
	if len(secs) < 2 {
		return nil, fmt.Errorf("compartment %q: give at least two sections (aft and forward ends)", name)
	}
	outlines := make([][]Point, len(secs))
	box := Box{math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)}
	for i, sc := range secs {
		if math.IsNaN(sc.X) || math.IsInf(sc.X, 0) {
			return nil, fmt.Errorf("compartment %q section %d: x is not a finite number", name, i+1)
		}
		if i > 0 && !(sc.X > secs[i-1].X) {
			return nil, fmt.Errorf("compartment %q section %d: x = %g is not forward of the section before (x = %g)", name, i+1, sc.X, secs[i-1].X)
		}
		o, err := convexOutline(sc.Outline)
		if err != nil {
			return nil, fmt.Errorf("compartment %q section %d (x = %g): %v", name, i+1, sc.X, err)
		}
		if i > 0 && len(o) != len(outlines[i-1]) {
			return nil, fmt.Errorf("compartment %q section %d (x = %g): %d points, the section before has %d: give both the same number so that each point runs straight to its fellow", name, i+1, sc.X, len(o), len(outlines[i-1]))
		}
		outlines[i] = o
		box.X0, box.X1 = math.Min(box.X0, sc.X), math.Max(box.X1, sc.X)
		for _, q := range o {
			box.Y0, box.Y1 = math.Min(box.Y0, q.Y), math.Max(box.Y1, q.Y)
			box.Z0, box.Z1 = math.Min(box.Z0, q.Z), math.Max(box.Z1, q.Z)
		}
	}
	var slabs []slab
	var pieces []prismPiece
	for i := 1; i < len(secs); i++ {
		a, b := outlines[i-1], outlines[i]
		x0, x1 := secs[i-1].X, secs[i].X
		if samePoints(a, b) {
			pieces = append(pieces, prismPiece{x0, x1, a, outlinePlanes(a)})
			slabs = clipSlabs(slabs, h.solid, x0, x1, pieces[len(pieces)-1].planes)
			continue
		}
		// Two sections with the same first point but turned differently
		// would make a twisted solid: their points must correspond.
		n := int(math.Ceil((x1 - x0) / outlineStepM))
		for j := 0; j < n; j++ {
			xa, xb := x0+(x1-x0)*float64(j)/float64(n), x0+(x1-x0)*float64(j+1)/float64(n)
			t := (float64(j) + 0.5) / float64(n)
			mid := make([]Point, len(a))
			for k := range a {
				mid[k] = Point{a[k].Y + t*(b[k].Y-a[k].Y), a[k].Z + t*(b[k].Z-a[k].Z)}
			}
			if _, err := convexOutline(mid); err != nil {
				return nil, fmt.Errorf("compartment %q between sections %d and %d: the outline between them is not convex (%v); check that point k of one corresponds to point k of the other", name, i, i+1, err)
			}
			pieces = append(pieces, prismPiece{xa, xb, mid, outlinePlanes(mid)})
			slabs = clipSlabs(slabs, h.solid, xa, xb, pieces[len(pieces)-1].planes)
		}
	}
	s := newSolid(slabs)
	if !(s.Volume() > 1e-9*h.solid.Volume()) {
		return nil, fmt.Errorf("compartment %q: its sections lie outside the hull", name)
	}
	secsCopy := make([]CompartmentSection, len(secs))
	for i := range secs {
		secsCopy[i] = CompartmentSection{X: secs[i].X, Outline: outlines[i]}
	}
	return &Compartment{Name: name, Box: box, Permeability: 1, Sections: secsCopy, solid: s, pieces: pieces}, nil
}

// prismPiece is a part of a compartment's region: the points with x
// between x0 and x1 inside every one of planes.
type prismPiece struct {
	x0, x1  float64
	outline []Point // convex, counter-clockwise
	planes  []halfPlane
}

// region returns the pieces whose union is the compartment's region before
// the hull clips it: its box, or the prisms of its sections.
func (c *Compartment) region() []prismPiece {
	if c.pieces != nil {
		return c.pieces
	}
	b := c.Box
	o := []Point{{b.Y0, b.Z0}, {b.Y1, b.Z0}, {b.Y1, b.Z1}, {b.Y0, b.Z1}}
	return []prismPiece{{b.X0, b.X1, o, []halfPlane{{-1, 0, -b.Y0}, {1, 0, b.Y1}, {0, -1, -b.Z0}, {0, 1, b.Z1}}}}
}

// OverlapM3 returns the volume inside hull h that compartments a and b
// share (m³): zero when they only touch (anything under 1e-9 of the
// hull's volume is round-off on a shared face). For each pair of their
// pieces that overlap along the ship the common part of their outlines
// (convex) is found first; where it has area, the hull is clipped by it.
func OverlapM3(h *Hull, a, b *Compartment) float64 {
	ba, bb := a.Box, b.Box
	if ba.X1 <= bb.X0 || bb.X1 <= ba.X0 || ba.Y1 <= bb.Y0 || bb.Y1 <= ba.Y0 || ba.Z1 <= bb.Z0 || bb.Z1 <= ba.Z0 {
		return 0
	}
	var v float64
	for _, p := range a.region() {
		for _, q := range b.region() {
			x0, x1 := math.Max(p.x0, q.x0), math.Min(p.x1, q.x1)
			if !(x1 > x0) {
				continue
			}
			common := p.outline
			for _, hp := range q.planes {
				common, _ = clipPolygon(common, hp)
			}
			ap, ac := polygonMoments(p.outline).A, polygonMoments(common).A
			if !(ac > 1e-9*ap) {
				continue
			}
			planes := append(append([]halfPlane(nil), p.planes...), q.planes...)
			if o, err := convexOutline(common); err == nil {
				planes = outlinePlanes(o)
			}
			v += newSolid(clipSlabs(nil, h.solid, x0, x1, planes)).Volume()
		}
	}
	if v <= 1e-9*h.solid.Volume() {
		return 0
	}
	return v
}

// convexOutline returns the outline as an open polygon (the closing point
// dropped), counter-clockwise in (y, z), with repeated points dropped;
// an error if it has fewer than three points, encloses no area, is not
// convex or holds a number that is not finite.
func convexOutline(in []Point) ([]Point, error) {
	var o []Point
	for i, q := range in {
		if math.IsNaN(q.Y+q.Z) || math.IsInf(q.Y, 0) || math.IsInf(q.Z, 0) {
			return nil, fmt.Errorf("point %d is not a pair of finite numbers", i+1)
		}
		if len(o) > 0 && o[len(o)-1] == q {
			continue
		}
		o = append(o, q)
	}
	if len(o) > 1 && o[0] == o[len(o)-1] {
		o = o[:len(o)-1]
	}
	if len(o) < 3 {
		return nil, errors.New("an outline needs at least three different points")
	}
	m := polygonMoments(o)
	if math.Abs(m.A) <= 0 {
		return nil, errors.New("the outline encloses no area")
	}
	if m.A < 0 {
		for i, j := 0, len(o)-1; i < j; i, j = i+1, j-1 {
			o[i], o[j] = o[j], o[i]
		}
	}
	// Convex: every turn to the left (or straight on), once round.
	var total float64
	n := len(o)
	for k := 0; k < n; k++ {
		a, b, c := o[(k+n-1)%n], o[k], o[(k+1)%n]
		e1 := Point{b.Y - a.Y, b.Z - a.Z}
		e2 := Point{c.Y - b.Y, c.Z - b.Z}
		cr := e1.Y*e2.Z - e1.Z*e2.Y
		if cr < -1e-12*math.Hypot(e1.Y, e1.Z)*math.Hypot(e2.Y, e2.Z) {
			return nil, fmt.Errorf("the outline turns inwards at point %d (%g, %g): it must be convex", k+1, b.Y, b.Z)
		}
		total += math.Atan2(cr, e1.Y*e2.Y+e1.Z*e2.Z)
	}
	if math.Abs(total-2*math.Pi) > 1e-6 {
		return nil, errors.New("the outline crosses itself")
	}
	return o, nil
}

// outlinePlanes returns the half-planes whose common part is the convex,
// counter-clockwise outline o: the left of each edge.
func outlinePlanes(o []Point) []halfPlane {
	var hp []halfPlane
	for k := range o {
		a, b := o[k], o[(k+1)%len(o)]
		e := Point{b.Y - a.Y, b.Z - a.Z}
		// Left of a→b: e.Z·y − e.Y·z ≤ e.Z·a.Y − e.Y·a.Z.
		hp = append(hp, halfPlane{e.Z, -e.Y, e.Z*a.Y - e.Y*a.Z})
	}
	return hp
}

func samePoints(a, b []Point) bool {
	if len(a) != len(b) {
		return false
	}
	for k := range a {
		if a[k] != b[k] {
			return false
		}
	}
	return true
}
