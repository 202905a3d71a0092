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

// dent is a range of directions of a line in the (y, z) plane, lo to hi
// (radians, taken modulo π into [−π/2, π/2], lo ≤ hi), that a slab's
// section passes more than once: about a vertex where it turns right
// somewhere along the slab (round-off in the offsets, or a hollow), the
// directions its two edges take along the slab. A plane whose direction
// lies in one is left to the general method.
type dent struct{ lo, hi float64 }

// dentMargin widens every dent (radians) so that round-off in the plane's
// direction does not carry it out of one.
const dentMargin = 1e-9

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
// length at either end, that winds other than once, or with a dent over
// 0.5 rad, is refused. The dents are returned as sorted, disjoint ranges
// (addDent), however many there are: the many round-off dents of a long
// flat side, all about one direction, mostly merge.
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
		dents = addDent(dents, lo-dentMargin, hi+dentMargin)
	}
	return true, dents
}

// addDent adds the directions lo … hi (radians, hi − lo < π) to the
// ranges ds, kept sorted and apart: the range is taken modulo π into
// [−π/2, π/2] (split in two where it passes π/2) and merged with those
// it overlaps.
func addDent(ds []dent, lo, hi float64) []dent {
	l := math.Remainder(lo, math.Pi)
	h := l + (hi - lo)
	if h > math.Pi/2 {
		ds = mergeDent(ds, dent{-math.Pi / 2, h - math.Pi})
		h = math.Pi / 2
	}
	return mergeDent(ds, dent{l, h})
}

// mergeDent adds d to the sorted, disjoint ranges ds.
func mergeDent(ds []dent, d dent) []dent {
	var out []dent
	placed := false
	for _, e := range ds {
		switch {
		case e.hi < d.lo:
			out = append(out, e)
		case d.hi < e.lo:
			if !placed {
				out, placed = append(out, d), true
			}
			out = append(out, e)
		default: // overlap: d takes e in
			d = dent{math.Min(d.lo, e.lo), math.Max(d.hi, e.hi)}
		}
	}
	if !placed {
		out = append(out, d)
	}
	return out
}

// dentsHit reports whether a plane at heel phi (radians, atan of its
// slope C, in (−π/2, π/2)) runs in a direction that one of the dents
// (sorted and apart, as addDent keeps them) passes more than once: a
// bisection for the first dent that ends at or beyond phi.
func dentsHit(dents []dent, phi float64) bool {
	lo, hi := 0, len(dents)
	for lo < hi {
		m := int(uint(lo+hi) >> 1)
		if dents[m].hi < phi {
			lo = m + 1
		} else {
			hi = m
		}
	}
	return lo < len(dents) && dents[lo].lo <= phi
}

// side tells which vertices findArc looks for: those below the plane
// z = h0 + c·y (with h1 at the slab's other end, dx along it) just forward
// of x0 (atEnd false) or just aft of x1 (atEnd true). A vertex on the
// plane takes the side it goes to.
type side struct {
	v      []slabVertex
	dx, c  float64
	h0, h1 float64
	atEnd  bool
}

// heights returns the heights of vertex k above the plane at x0 and x1:
// z − c·y − h at each end, the vertex at x1 being p + dx·d (the same
// figures as the slab's p1).
func (sd *side) heights(k int) (d0, d1 float64) {
	q := &sd.v[k]
	y1, z1 := q.at(sd.dx)
	return q.p.Z - sd.c*q.p.Y - sd.h0, z1 - sd.c*y1 - sd.h1
}

func (sd *side) below(k int) bool {
	d0, d1 := sd.heights(k)
	if sd.atEnd {
		d0, d1 = d1, d0
	}
	return d0 < 0 || d0 == 0 && d1 < 0
}

// holds reports whether the arc g (0 < g.cnt < n) is the arc below at both
// ends of the slab: its end vertices below and their outer neighbours not,
// just forward of x0 and just aft of x1. Then no vertex crosses the plane
// inside the slab (the vertices below are one arc at each end: see
// arcSection). A vertex is below at both ends when its heights there are
// d0, d1 ≤ 0, not both 0; above at both when d0, d1 ≥ 0.
func (sd *side) holds(g arc, n int) bool {
	lo, hi := g.lo, g.lo+g.cnt-1
	if hi >= n {
		hi -= n
	}
	before, after := lo-1, hi+1
	if before < 0 {
		before = n - 1
	}
	if after == n {
		after = 0
	}
	below := func(k int) bool {
		d0, d1 := sd.heights(k)
		return d0 <= 0 && d1 <= 0 && (d0 < 0 || d1 < 0)
	}
	above := func(k int) bool {
		d0, d1 := sd.heights(k)
		return d0 >= 0 && d1 >= 0
	}
	return below(lo) && above(before) && below(hi) && above(after)
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

// crossings appends to roots the vertices k, k+1, …, k+m−1 (mod n, with
// 0 ≤ k < n) that cross the plane inside the slab: those whose heights at
// the two ends, d0 and d1, have strictly opposite signs, at
// x = x0 + (x1 − x0)·d0/(d0 − d1).
func (s *slab) crossings(sd *side, k, m int, roots []cutRoot) []cutRoot {
	n := len(s.p0)
	dx := s.x1 - s.x0
	for i := 0; i < m; i++ {
		d0, d1 := sd.heights(k)
		if (d0 < 0 && d1 > 0) || (d0 > 0 && d1 < 0) {
			roots = append(roots, cutRoot{s.x0 + dx*d0/(d0-d1), k, d0 < 0})
		}
		if k++; k == n {
			k = 0
		}
	}
	return roots
}

// belowConvex is belowChains for a convex slab, from the guess g of the
// arc at x0; it returns the arcs found at x0 and x1 (the next guesses for
// this slab and the one forward of it), and false
// (nothing added) when the vertices' crossings do not keep one arc, which
// convexity rules out but round-off might not.
//
// Most often the guess is the arc at both ends (holds: four vertices
// looked at) and the slab is one piece.
func (s *slab) belowConvex(p Plane, im *Immersion, g arc, roots []cutRoot) (a0, a1 arc, ok bool) {
	n := len(s.p0)
	h0, h1 := p.A+p.B*s.x0, p.A+p.B*s.x1
	// Sides just forward of x0 and just aft of x1.
	sd := side{v: s.v[:n], dx: s.x1 - s.x0, c: p.C, h0: h0, h1: h1}
	if g.cnt > 0 && g.cnt < n && g.lo >= 0 && g.lo < n && sd.holds(g, n) {
		if s.x1-s.x0 > 1e-12*(1+math.Abs(s.x1)) {
			s.pieceArc(p, s.x0, s.x1, g, im)
		}
		return g, g, true
	}
	a0 = findArc(&sd, n, g)
	sd.atEnd = true
	a1 = findArc(&sd, n, a0)
	// The vertices that cross inside the slab are those between the arcs'
	// starts and between their ends; when the arcs do not overlap (or one
	// is empty or whole) every vertex is looked at.
	roots = roots[:0]
	if a0.cnt == 0 || a1.cnt == 0 || a0.cnt == n || a1.cnt == n {
		if a0 == a1 && (a0.cnt == 0 || a0.cnt == n) {
			if a0.cnt == n {
				im.add(s.full, 1)
			}
			return a0, a1, true
		}
		roots = s.crossings(&sd, 0, n, roots)
	} else {
		dlo := cyc(a1.lo-a0.lo, n)
		dhi := cyc((a1.lo+a1.cnt)-(a0.lo+a0.cnt), n)
		if abs(dlo)+abs(dhi) >= min(a0.cnt, a1.cnt) {
			roots = s.crossings(&sd, 0, n, roots)
		} else {
			// From the earlier of the two starts, and of the two ends.
			roots = s.crossings(&sd, mod(min(a0.lo, a0.lo+dlo), n), abs(dlo), roots)
			e0 := a0.lo + a0.cnt
			roots = s.crossings(&sd, mod(min(e0, e0+dhi), n), abs(dhi), roots)
		}
	}
	sortRoots(roots)
	var part Immersion
	cur := a0
	xa := s.x0
	for i := 0; i <= len(roots); i++ {
		xb := s.x1
		if i < len(roots) {
			xb = roots[i].x
		}
		if xb-xa > 1e-12*(1+math.Abs(xb)) {
			s.pieceArc(p, xa, xb, cur, &part)
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

// pieceArc integrates [xa, xb], along which the vertices below the plane
// are the arc a, adding to im: pieceChains for its one chain, which
// enters on edge in = lo − 1 (v_in above, v_lo below), follows the whole
// edges lo … out−1 and leaves on edge out = lo + cnt − 1.
//
// At a Gauss node x the section below is the polygon entry point → v_lo →
// … → v_out → exit point → entry point. Its shoelace terms (area 2A = Σ
// y_k z_k+1 − y_k+1 z_k, and that cross product times y_k + y_k+1 and
// times z_k + z_k+1, 6·A·ȳ and 6·A·z̄) are the whole edges' prefix
// polynomials (a run of prefix sums, as runAt), formed once for the
// piece, plus the two cut edges and the waterline. The waterline, from the
// exit at y_o to the entry at y_i, adds the waterplane's breadth y_o − y_i
// and its moments (y_o² − y_i²)/2 and (y_o³ − y_i³)/3 at x.
func (s *slab) pieceArc(p Plane, xa, xb float64, a arc, im *Immersion) {
	n := len(s.p0)
	if a.cnt <= 0 || a.cnt >= n {
		s.pieceChains(p, xa, xb, max(a.cnt, 0), nil, im)
		return
	}
	lo, out := a.lo, a.lo+a.cnt-1
	in, after := lo-1, out+1
	if in < 0 {
		in += n
	}
	if out >= n {
		out -= n
	}
	if after >= n {
		after -= n
	}
	// The whole edges lo … out−1: pre[j] − pre[i] (+ pre[n] when the run
	// passes the base), coefficient by coefficient.
	var r edgePoly
	if lo != out {
		pre := s.pre[:n+1]
		i, j := lo-s.base, out-s.base
		if i < 0 {
			i += n
		}
		if j < 0 {
			j += n
		}
		h, l := &pre[j], &pre[i]
		r.a = [3]float64{h.a[0] - l.a[0], h.a[1] - l.a[1], h.a[2] - l.a[2]}
		r.sy = [4]float64{h.sy[0] - l.sy[0], h.sy[1] - l.sy[1], h.sy[2] - l.sy[2], h.sy[3] - l.sy[3]}
		r.sz = [4]float64{h.sz[0] - l.sz[0], h.sz[1] - l.sz[1], h.sz[2] - l.sz[2], h.sz[3] - l.sz[3]}
		if i > j {
			r.add(&pre[n], 1)
		}
	}
	vs := s.v[:n]
	vk, vj, vu, vv := &vs[in], &vs[lo], &vs[out], &vs[after]
	dx := xb - xa
	// The sums are kept as twice the area and six times the moments (the
	// shoelace terms as they come) and three times the second moment of
	// the waterline, and divided once for the piece.
	var v2, mx2, my6, mz6, aw, sx, sy2, ixx, ixy2, iyy3 float64
	for g := range gaussNode {
		x := xa + gaussNode[g]*dx
		w := gaussWeight[g] * dx
		sg := x - s.x0
		h := p.A + p.B*x
		a2, sy6, sz6 := r.eval(sg)
		// The cut edges' ends and their heights above the plane: edge in
		// from k to j, edge out from u to v. The waterline crosses them at
		// the fractions dk/(dk − dj) and du/(du − dv).
		ky, kz := vk.at(sg)
		jy, jz := vj.at(sg)
		uy, uz := vu.at(sg)
		vy, vz := vv.at(sg)
		dk, dj := kz-p.C*ky-h, jz-p.C*jy-h
		du, dv := uz-p.C*uy-h, vz-p.C*vy-h
		ti, to := dk/(dk-dj), du/(du-dv)
		// Entry point, and the edge entry → v_lo.
		iy, iz := ky+ti*(jy-ky), kz+ti*(jz-kz)
		cr := iy*jz - jy*iz
		a2 += cr
		sy6 += (iy + jy) * cr
		sz6 += (iz + jz) * cr
		// Exit point, and the edge v_out → exit.
		oy, oz := uy+to*(vy-uy), uz+to*(vz-uz)
		cr = uy*oz - oy*uz
		a2 += cr
		sy6 += (uy + oy) * cr
		sz6 += (uz + oz) * cr
		// The waterline, exit → entry.
		cr = oy*iz - iy*oz
		a2 += cr
		sy6 += (oy + iy) * cr
		sz6 += (oz + iz) * cr
		iy2, oy2 := iy*iy, oy*oy
		W := oy - iy
		v2 += w * a2
		mx2 += w * x * a2
		my6 += w * sy6
		mz6 += w * sz6
		aw += w * W
		sx += w * x * W
		sy2 += w * (oy2 - iy2)
		ixx += w * x * x * W
		ixy2 += w * x * (oy2 - iy2)
		iyy3 += w * (oy2*oy - iy2*iy)
	}
	im.V += v2 / 2
	im.MX += mx2 / 2
	im.MY += my6 / 6
	im.MZ += mz6 / 6
	im.AW += aw
	im.SX += sx
	im.SY += sy2 / 2
	im.IXX += ixx
	im.IXY += ixy2 / 2
	im.IYY += iyy3 / 3
}

// cyc returns d reduced modulo n to (−n/2, n/2].
func cyc(d, n int) int {
	d = mod(d, n)
	if d > n/2 {
		d -= n
	}
	return d
}

// mod returns d modulo n in [0, n).
func mod(d, n int) int { return ((d % n) + n) % n }

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
