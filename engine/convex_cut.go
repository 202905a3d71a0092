package engine

import "math"

// A convex slab (its section convex all along it, as most of a ship's hull
// is, or nearly so: see arcSection) has at most one chain under a plane:
// the vertices below the plane are one run of consecutive vertices, an arc. Its ends are found by
// walking from a guess — the arc of the same slab at the last evaluation,
// or of the slab before — instead of classifying every vertex, and only the
// vertices between the arcs at the slab's two ends can cross the plane
// inside it. The pieces are then integrated as belowChains does
// (pieceChains), with the same sums.

// arc is the run of a convex section's vertices below a plane: lo, lo+1, …,
// lo+cnt−1 (mod n). cnt = 0: none below; cnt = n: all below; cnt < 0: not
// known (no guess).
type arc struct{ lo, cnt int }

// dent is a vertex where a slab's section turns right somewhere along the
// slab (round-off in the offsets, or a hollow): the directions its two
// edges take along the slab lie within half of mid (radians, atan2 of
// (dz, dy)).
type dent struct{ mid, half float64 }

// maxDents bounds the dents a slab may have and still use the arc walk.
const maxDents = 8

// arcSection reports whether the vertices of the slab's polygon (p0 at one
// end, p1 at the other) below any plane are one arc, except for planes
// whose direction lies within one of the dents returned.
//
// Why: along the polygon the height above the plane, z − C·y, grows along
// an edge whose direction e has (−C, 1)·e > 0 and falls where it is
// negative. The polygon is simple and goes once round counter-clockwise
// (total turn 2π), so its edge directions go once round; where they only
// advance (a left turn or straight on at every vertex: a convex section)
// they pass each of the two directions of the plane, atan(C) and
// atan(C) + π, once, and the height falls along one run of edges and rises
// along the rest: the vertices below any level are one arc. Where the
// directions step back (a right turn at a vertex) they pass the directions
// within that step more than once, so a plane whose direction lies there is
// left to the general method. The turn at vertex k, the cross product of
// the edges into and out of it, is a quadratic in x: its sign is checked at
// both ends, midway and at its extremum. A polygon with an edge of no
// length at either end, that winds other than once, or with more than
// maxDents dents or one over 0.5 rad, is refused.
func arcSection(p0, p1 []Point) (bool, []dent) {
	n := len(p0)
	if n < 3 || len(p1) != n {
		return false, nil
	}
	at := func(t float64, k int) Point {
		return Point{p0[k].Y + t*(p1[k].Y-p0[k].Y), p0[k].Z + t*(p1[k].Z-p0[k].Z)}
	}
	edge := func(t float64, k int) Point {
		a, b := at(t, k), at(t, (k+1)%n)
		return Point{b.Y - a.Y, b.Z - a.Z}
	}
	for _, t := range []float64{0, 1} {
		var total float64
		for k := 0; k < n; k++ {
			e1, e2 := edge(t, (k+n-1)%n), edge(t, k)
			if (e2 == Point{}) {
				return false, nil
			}
			total += math.Atan2(e1.Y*e2.Z-e1.Z*e2.Y, e1.Y*e2.Y+e1.Z*e2.Z)
		}
		if math.Abs(total-2*math.Pi) > 1e-6 {
			return false, nil
		}
	}
	turn := func(t float64, k int) float64 {
		e1, e2 := edge(t, (k+n-1)%n), edge(t, k)
		return e1.Y*e2.Z - e1.Z*e2.Y
	}
	var dents []dent
	for k := 0; k < n; k++ {
		c0, cm, c1 := turn(0, k), turn(0.5, k), turn(1, k)
		right := c0 < 0 || cm < 0 || c1 < 0
		// The quadratic through t = 0, ½, 1 and its extremum.
		if qa := 2*c0 - 4*cm + 2*c1; !right && qa != 0 {
			if t := -(-3*c0 + 4*cm - c1) / (2 * qa); t > 0 && t < 1 {
				right = turn(t, k) < 0
			}
		}
		if !right {
			continue
		}
		if len(dents) == maxDents {
			return false, nil
		}
		// The directions of both edges at both ends, unwrapped about the
		// first.
		e := edge(0, (k+n-1)%n)
		ref := math.Atan2(e.Z, e.Y)
		lo, hi := ref, ref
		for _, q := range []Point{edge(1, (k+n-1)%n), edge(0, k), edge(1, k)} {
			a := ref + math.Remainder(math.Atan2(q.Z, q.Y)-ref, 2*math.Pi)
			lo, hi = math.Min(lo, a), math.Max(hi, a)
		}
		if hi-lo > 0.5 {
			return false, nil
		}
		dents = append(dents, dent{(lo + hi) / 2, (hi - lo) / 2})
	}
	return true, dents
}

// dentsHit reports whether a plane at heel phi (radians, atan of its
// slope C) runs in a direction that one of the dents passes more than once.
func dentsHit(dents []dent, phi float64) bool {
	for _, d := range dents {
		for _, f := range [2]float64{phi, phi + math.Pi} {
			// f − mid, brought within [−π, π]: both lie within 2π of 0.
			a := f - d.mid
			for a > math.Pi {
				a -= 2 * math.Pi
			}
			for a < -math.Pi {
				a += 2 * math.Pi
			}
			if math.Abs(a) <= d.half+1e-9 {
				return true
			}
		}
	}
	return false
}

// side tells which vertices findArc looks for: those below the plane
// z = h0 + c·y (with h1 at the slab's other end) just forward of x0
// (atEnd false) or just aft of x1 (atEnd true). A vertex on the plane
// takes the side it goes to.
type side struct {
	p0, p1 []Point
	c      float64
	h0, h1 float64
	atEnd  bool
}

func (sd *side) below(k int) bool {
	d0 := sd.p0[k].Z - sd.c*sd.p0[k].Y - sd.h0
	d1 := sd.p1[k].Z - sd.c*sd.p1[k].Y - sd.h1
	if sd.atEnd {
		d0, d1 = d1, d0
	}
	return d0 < 0 || d0 == 0 && d1 < 0
}

// findArc returns the arc of vertices below (see side), walking from the
// guess g. The vertices below must be one run of consecutive vertices (or
// none, or all), as on a convex section.
func findArc(sd *side, n int, g arc) arc {
	lo := 0
	if g.cnt >= 0 {
		lo = ((g.lo % n) + n) % n
	}
	prev := func(k int) int {
		if k == 0 {
			return n - 1
		}
		return k - 1
	}
	next := func(k int) int {
		if k == n-1 {
			return 0
		}
		return k + 1
	}
	// The start: a vertex below whose predecessor is not.
	if sd.below(lo) {
		for steps := 0; sd.below(prev(lo)); steps++ {
			if steps == n {
				return arc{0, n}
			}
			lo = prev(lo)
		}
	} else {
		steps := 0
		for !sd.below(lo) {
			if steps++; steps > n {
				return arc{0, 0}
			}
			lo = next(lo)
		}
	}
	// The end, from the guess's end.
	hi := lo
	if g.cnt > 0 {
		hi = (((g.lo + g.cnt - 1) % n) + n) % n
	}
	if sd.below(hi) {
		for steps := 0; sd.below(next(hi)) && steps < n; steps++ {
			hi = next(hi)
		}
	} else {
		for !sd.below(hi) {
			hi = prev(hi)
		}
	}
	return arc{lo, (hi-lo+n)%n + 1}
}

// belowConvex is belowChains for a convex slab, from the guess g of the
// arc at x0; it returns the arcs found at x0 and x1 (the next guesses for
// this slab and the one forward of it), and false
// (nothing added) when the vertices' crossings do not keep one arc, which
// convexity rules out but round-off might not.
func (s *slab) belowConvex(p Plane, im *Immersion, g arc, roots []cutRoot) (a0, a1 arc, ok bool) {
	n := len(s.p0)
	dx := s.x1 - s.x0
	h0, h1 := p.A+p.B*s.x0, p.A+p.B*s.x1
	p0, p1 := s.p0[:n], s.p1[:n]
	// Sides just forward of x0 and just aft of x1.
	sd := side{p0: p0, p1: p1, c: p.C, h0: h0, h1: h1}
	a0 = findArc(&sd, n, g)
	sd.atEnd = true
	a1 = findArc(&sd, n, a0)
	// The vertices that cross inside the slab are those between the arcs'
	// starts and between their ends; when the arcs do not overlap (or one
	// is empty or whole) every vertex is looked at.
	roots = roots[:0]
	root := func(k int) {
		a := p0[k].Z - p.C*p0[k].Y - h0
		b := p1[k].Z - p.C*p1[k].Y - h1
		if (a < 0 && b > 0) || (a > 0 && b < 0) {
			roots = append(roots, cutRoot{s.x0 + dx*a/(a-b), k})
		}
	}
	cyc := func(d int) int { // d reduced to (−n/2, n/2]
		d = ((d % n) + n) % n
		if d > n/2 {
			d -= n
		}
		return d
	}
	if a0.cnt == 0 || a1.cnt == 0 || a0.cnt == n || a1.cnt == n {
		if a0 == a1 && (a0.cnt == 0 || a0.cnt == n) {
			if a0.cnt == n {
				im.add(s.full, 1)
			}
			return a0, a1, true
		}
		for k := 0; k < n; k++ {
			root(k)
		}
	} else {
		dlo := cyc(a1.lo - a0.lo)
		dhi := cyc((a1.lo + a1.cnt) - (a0.lo + a0.cnt))
		if abs(dlo)+abs(dhi) >= min(a0.cnt, a1.cnt) {
			for k := 0; k < n; k++ {
				root(k)
			}
		} else {
			for k, i := min(a0.lo, a0.lo+dlo), 0; i < abs(dlo); k, i = k+1, i+1 {
				root(((k % n) + n) % n)
			}
			e0 := a0.lo + a0.cnt
			for k, i := min(e0, e0+dhi), 0; i < abs(dhi); k, i = k+1, i+1 {
				root(((k % n) + n) % n)
			}
		}
	}
	sortRoots(roots)
	var part Immersion
	cur := a0
	var ch [1]chain
	xa := s.x0
	for i := 0; i <= len(roots); i++ {
		xb := s.x1
		if i < len(roots) {
			xb = roots[i].x
		}
		if xb-xa > 1e-12*(1+math.Abs(xb)) {
			var chains []chain
			if cur.cnt > 0 && cur.cnt < n {
				ch[0] = chain{(cur.lo + n - 1) % n, (cur.lo + cur.cnt - 1) % n}
				chains = ch[:]
			}
			s.pieceChains(p, xa, xb, cur.cnt, chains, &part)
			xa = xb
		}
		if i < len(roots) {
			var ok bool
			if cur, ok = cur.flip(roots[i].k, n); !ok {
				return a0, a1, false
			}
		}
	}
	im.add(part, 1)
	return a0, a1, true
}

// flip returns the arc with vertex k moved to the other side of the plane;
// false when k is neither next to the arc nor at one of its ends.
func (a arc) flip(k, n int) (arc, bool) {
	in := (k-a.lo+n)%n < a.cnt
	switch {
	case a.cnt == n:
		return arc{(k + 1) % n, n - 1}, true
	case in && k == a.lo:
		return arc{(a.lo + 1) % n, a.cnt - 1}, true
	case in && k == (a.lo+a.cnt-1)%n:
		return arc{a.lo, a.cnt - 1}, true
	case in:
		return a, false
	case a.cnt == 0:
		return arc{k, 1}, true
	case k == (a.lo+n-1)%n:
		return arc{k, a.cnt + 1}, true
	case k == (a.lo+a.cnt)%n:
		return arc{a.lo, a.cnt + 1}, true
	}
	return a, false
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}
