package engine

import (
	"math"
	"sort"
)

// Plane is the free water surface z = A + B·x + C·y in the ship frame.
// A is the centreline draft at the aft perpendicular (m), B = −trim/L and
// C = tan(heel), heel positive starboard down.
type Plane struct{ A, B, C float64 }

// Z returns the height of the plane above the baseline at (x, y).
func (p Plane) Z(x, y float64) float64 { return p.A + p.B*x + p.C*y }

// Height returns the signed distance of the point (x, y, z) above the plane,
// measured along the true vertical (the plane's normal): positive above the
// water, negative immersed.
func (p Plane) Height(x, y, z float64) float64 {
	return (z - p.Z(x, y)) / math.Sqrt(1+p.B*p.B+p.C*p.C)
}

// HeelRad returns the heel, atan(C).
func (p Plane) HeelRad() float64 { return math.Atan(p.C) }

// slab is a piece of a solid between x0 and x1 whose section polygon has
// vertex k at p0[k] + (x − x0)·dp[k]: a ruled surface.
//
// The fields read at every evaluation below a plane come first, and the
// vertices are also kept as pairs (v) so that the few a cut looks at take
// one cache line each rather than one per slice: a sweep of a solid is
// bound by memory as much as by arithmetic.
type slab struct {
	x0, x1 float64
	zmin   float64
	zmax   float64
	ymax   float64 // largest |y| of any vertex
	convex bool    // the vertices below a plane are one arc (convex_cut.go)…
	base   int     // the vertex the prefix sums pre start from
	v      []slabVertex
	pre    []edgePoly // prefix sums of the edges' shoelace polynomials (waterline_cut.go)
	dents  []dent     // …unless the plane runs in one of these directions

	p0, dp []Point
	p1     []Point // the vertices at x1, p0 + (x1 − x0)·dp
	blocks []vertexBlock
	full   Immersion // the whole slab, waterplane terms zero
}

// slabVertex is a vertex of a slab's section: at p + (x − x0)·d.
type slabVertex struct{ p, d Point }

// at returns the vertex at s = x − x0.
func (q *slabVertex) at(s float64) (y, z float64) { return q.p.Y + s*q.d.Y, q.p.Z + s*q.d.Z }

// planeSpan returns the lowest and the highest z of plane p over the
// slab's box (x from x0 to x1, |y| up to ymax): a slab whose lowest point
// is above hi is dry, one whose highest is below lo wholly immersed.
func (s *slab) planeSpan(p Plane) (lo, hi float64) {
	lo = p.A + min(p.B*s.x0, p.B*s.x1) - math.Abs(p.C)*s.ymax
	hi = p.A + max(p.B*s.x0, p.B*s.x1) + math.Abs(p.C)*s.ymax
	return lo, hi
}

func newSlab(x0, x1 float64, a, b []Point) slab {
	if len(a) != len(b) {
		panic("engine: slab ends with different vertex counts")
	}
	s := slab{x0: x0, x1: x1, p0: append([]Point(nil), a...), dp: make([]Point, len(a))}
	dx := x1 - x0
	s.zmin, s.zmax = math.Inf(1), math.Inf(-1)
	for k := range a {
		if dx > 0 {
			s.dp[k] = Point{(b[k].Y - a[k].Y) / dx, (b[k].Z - a[k].Z) / dx}
		}
		for _, q := range []Point{a[k], b[k]} {
			s.zmin = math.Min(s.zmin, q.Z)
			s.zmax = math.Max(s.zmax, q.Z)
			s.ymax = math.Max(s.ymax, math.Abs(q.Y))
		}
	}
	s.full = s.integrate(Plane{A: math.Inf(1)}, x0, x1)
	s.p1 = s.section(x1)
	s.base = prefixBase(s.p0, s.p1)
	s.pre = edgePrefix(s.p0, s.dp, s.base)
	s.v = make([]slabVertex, len(a))
	for k := range s.v {
		s.v[k] = slabVertex{s.p0[k], s.dp[k]}
	}
	s.blocks = vertexBlocks(s.p0, s.p1)
	s.convex, s.dents = arcSection(s.p0, s.p1)
	return s
}

// section returns the slab's polygon at x (x0 ≤ x ≤ x1).
func (s *slab) section(x float64) []Point {
	out := make([]Point, len(s.p0))
	t := x - s.x0
	for k := range s.p0 {
		out[k] = Point{s.p0[k].Y + t*s.dp[k].Y, s.p0[k].Z + t*s.dp[k].Z}
	}
	return out
}

// Two-point Gauss–Legendre nodes and weights on [0, 1]: exact for cubics.
var (
	gaussNode   = [2]float64{0.5 - 0.5/math.Sqrt(3), 0.5 + 0.5/math.Sqrt(3)}
	gaussWeight = [2]float64{0.5, 0.5}
)

// integrate adds the slab's part below p between xa and xb (inside the slab)
// with two-point Gauss–Legendre.
func (s *slab) integrate(p Plane, xa, xb float64) Immersion {
	var im Immersion
	dx := xb - xa
	if dx <= 0 {
		return im
	}
	for g := range gaussNode {
		x := xa + gaussNode[g]*dx
		w := gaussWeight[g] * dx
		m := clipBelow(s.p0, s.dp, x-s.x0, p.C, p.A+p.B*x)
		im.V += w * m.A
		im.MX += w * x * m.A
		im.MY += w * m.SY
		im.MZ += w * m.SZ
		im.AW += w * m.W
		im.SX += w * x * m.W
		im.SY += w * m.WY
		im.IXX += w * x * x * m.W
		im.IXY += w * x * m.WY
		im.IYY += w * m.WYY
	}
	return im
}

// below returns the slab's immersion below p, split at every x where a
// vertex crosses the plane so each piece is smooth.
func (s *slab) below(p Plane) Immersion {
	var sc cutScratch
	return s.belowWith(p, &sc)
}

func (s *slab) belowWith(p Plane, sc *cutScratch) Immersion {
	var im Immersion
	if s.belowChains(p, &im, sc) {
		return im
	}
	return s.belowClip(p)
}

// belowClip is below with every piece clipped afresh (clipBelow): for
// sections beyond the chain method's bounds.
func (s *slab) belowClip(p Plane) Immersion {
	n := len(s.p0)
	dx := s.x1 - s.x0
	allAbove, allBelow := true, true
	var cuts [64]float64
	roots := cuts[:0]
	for k := 0; k < n; k++ {
		d0 := s.p0[k].Z - p.C*s.p0[k].Y - p.A - p.B*s.x0
		z1, y1 := s.p0[k].Z+dx*s.dp[k].Z, s.p0[k].Y+dx*s.dp[k].Y
		d1 := z1 - p.C*y1 - p.A - p.B*s.x1
		if d0 < 0 || d1 < 0 {
			allAbove = false
		}
		if d0 > 0 || d1 > 0 {
			allBelow = false
		}
		if (d0 < 0 && d1 > 0) || (d0 > 0 && d1 < 0) {
			roots = append(roots, s.x0+dx*d0/(d0-d1))
		}
	}
	if allAbove {
		return Immersion{}
	}
	if allBelow {
		return s.full
	}
	if len(roots) > 1 {
		sort.Float64s(roots)
	}
	var im Immersion
	xa := s.x0
	for _, r := range roots {
		if r-xa > 1e-12*(1+math.Abs(r)) {
			im.add(s.integrate(p, xa, r), 1)
			xa = r
		}
	}
	im.add(s.integrate(p, xa, s.x1), 1)
	return im
}

// Immersion holds the integrals of a solid below a plane.
//
// V = ∭ dV, (MX, MY, MZ) = ∭ (x, y, z) dV: volume and first moments.
// The waterplane terms are over the solid's cut by the plane, projected on
// the xy plane: AW = ∬ dA, (SX, SY) = ∬ (x, y) dA and the second moments
// IXX = ∬ x² dA, IXY = ∬ xy dA, IYY = ∬ y² dA, all about the origin of the
// ship frame. They are the derivatives of V and the first moments with
// respect to the plane's A, B and C (see momentRates and Problem.eval in
// equilibrium.go, which build the solve's Jacobian from them).
type Immersion struct {
	V, MX, MY, MZ             float64
	AW, SX, SY, IXX, IXY, IYY float64
}

func (im *Immersion) add(o Immersion, f float64) {
	im.V += f * o.V
	im.MX += f * o.MX
	im.MY += f * o.MY
	im.MZ += f * o.MZ
	im.AW += f * o.AW
	im.SX += f * o.SX
	im.SY += f * o.SY
	im.IXX += f * o.IXX
	im.IXY += f * o.IXY
	im.IYY += f * o.IYY
}

// Centroid returns the centre of volume (LCB, TCB, VCB for a hull); zero for
// an empty immersion.
func (im Immersion) Centroid() (x, y, z float64) {
	if im.V <= 0 {
		return 0, 0, 0
	}
	return im.MX / im.V, im.MY / im.V, im.MZ / im.V
}

// Solid is a closed body described by slabs along x: a hull or a
// compartment. Its zero value is an empty solid.
type Solid struct {
	slabs []slab
	whole Immersion
	xmin  float64
	xmax  float64
	zmin  float64
	zmax  float64
}

func newSolid(slabs []slab) *Solid {
	s := &Solid{slabs: slabs, xmin: math.Inf(1), xmax: math.Inf(-1), zmin: math.Inf(1), zmax: math.Inf(-1)}
	for i := range slabs {
		s.whole.add(slabs[i].full, 1)
		s.xmin = math.Min(s.xmin, slabs[i].x0)
		s.xmax = math.Max(s.xmax, slabs[i].x1)
		s.zmin = math.Min(s.zmin, slabs[i].zmin)
		s.zmax = math.Max(s.zmax, slabs[i].zmax)
	}
	return s
}

// Below returns the integrals of the part of the solid below the plane p.
func (s *Solid) Below(p Plane) Immersion { return s.belowHinted(p, nil) }

// newArcHints returns a guess of the arc under the water (convex_cut.go)
// for each of the solid's slabs, none known yet: what a caller that
// immerses the solid again and again at nearby planes keeps between calls.
func (s *Solid) newArcHints() []arc {
	if s == nil {
		return nil
	}
	h := make([]arc, len(s.slabs))
	for i := range h {
		h[i].cnt = -1
	}
	return h
}

// belowHinted is Below, with hints (one per slab, or nil) the guesses of
// the convex slabs' arcs under the water, updated to the arcs found. The
// guesses only speed the search: any guess gives the same answer.
func (s *Solid) belowHinted(p Plane, hints []arc) Immersion {
	var im Immersion
	var sc cutScratch
	if s == nil {
		return im
	}
	guess := arc{cnt: -1}
	guessAt, guessN := -1, 0 // the slab guess is meant for, and the vertices of the one it came from
	phi := math.Atan(p.C)
	for i := range s.slabs {
		sl := &s.slabs[i]
		// Whole-slab bounds test.
		zlo, zhi := sl.planeSpan(p)
		switch {
		case sl.zmin >= zhi:
			continue
		case sl.zmax <= zlo:
			im.add(sl.full, 1)
			continue
		}
		if sl.convex && (len(sl.dents) == 0 || !dentsHit(sl.dents, phi)) {
			// The best guess is the arc at the end of the slab just
			// aft, when its section has as many vertices (on a hull,
			// the same station): the same plane at the same section.
			// Else the arc of the last evaluation.
			g := guess
			if hints != nil && hints[i].cnt >= 0 && (guessAt != i || guessN != len(sl.p0)) {
				g = hints[i]
			}
			if a0, a1, ok := sl.belowConvex(p, &im, g, sc.roots[:0]); ok {
				if hints != nil {
					hints[i] = a0
				}
				guess, guessAt, guessN = a1, i+1, len(sl.p0)
				continue
			}
		}
		im.add(sl.belowWith(p, &sc), 1)
	}
	return im
}

// Volume returns the whole solid's volume (m³).
func (s *Solid) Volume() float64 {
	if s == nil {
		return 0
	}
	return s.whole.V
}

// Whole returns the integrals of the whole solid (waterplane terms zero).
func (s *Solid) Whole() Immersion {
	if s == nil {
		return Immersion{}
	}
	return s.whole
}

// Extent returns the solid's x and z ranges.
func (s *Solid) Extent() (xmin, xmax, zmin, zmax float64) {
	return s.xmin, s.xmax, s.zmin, s.zmax
}

// SectionAt returns the solid's section polygons at x (counter-clockwise,
// in the (y, z) plane); nil where the solid does not reach. A section may be
// several polygons where slabs meet at x; the first slab that holds x wins.
func (s *Solid) SectionAt(x float64) []Point {
	if s == nil {
		return nil
	}
	for i := range s.slabs {
		sl := &s.slabs[i]
		if x >= sl.x0 && x <= sl.x1 {
			return sl.section(x)
		}
	}
	return nil
}
