package engine

import "math"

// A faster way to integrate a slab piece whose waterline crossings are
// fixed. Between two x where a vertex crosses the waterline, the same
// vertices stay submerged, so the clipped section is made of the same runs
// of whole edges, joined by the points where the waterline cuts a few
// edges. A whole edge's shoelace terms are polynomials in x (the vertices
// move linearly), so a run of them is a difference of prefix sums,
// evaluated in constant time; only the cut edges are worked at each Gauss
// node. The sums are the same as clipBelow's, in another order.

// edgePoly holds the shoelace terms of one edge v_k → v_{k+1} as
// polynomials in s = x − x0: the cross product y_k z_{k+1} − y_{k+1} z_k
// (degree 2) and that cross product times (y_k + y_{k+1}) and times
// (z_k + z_{k+1}) (degree 3).
type edgePoly struct {
	a  [3]float64
	sy [4]float64
	sz [4]float64
}

func (e *edgePoly) add(o *edgePoly, f float64) {
	for i := range e.a {
		e.a[i] += f * o.a[i]
	}
	for i := range e.sy {
		e.sy[i] += f * o.sy[i]
		e.sz[i] += f * o.sz[i]
	}
}

// eval returns the three sums at s.
func (e *edgePoly) eval(s float64) (a, sy, sz float64) {
	a = e.a[0] + s*(e.a[1]+s*e.a[2])
	sy = e.sy[0] + s*(e.sy[1]+s*(e.sy[2]+s*e.sy[3]))
	sz = e.sz[0] + s*(e.sz[1]+s*(e.sz[2]+s*e.sz[3]))
	return
}

// edgePrefix returns the prefix sums pre[k] = Σ_{i<k} the polynomials of
// edge base+i (mod n), k = 0 … n, of the polygon p0 + s·dp. Counting from
// base, a vertex that is seldom under water (prefixBase), a run of whole
// edges under water seldom passes the end of the sums: see runAt.
func edgePrefix(p0, dp []Point, base int) []edgePoly {
	n := len(p0)
	pre := make([]edgePoly, n+1)
	for i := 0; i < n; i++ {
		k := (base + i) % n
		j := (k + 1) % n
		ay, by, az, bz := p0[k].Y, dp[k].Y, p0[k].Z, dp[k].Z
		ay1, by1, az1, bz1 := p0[j].Y, dp[j].Y, p0[j].Z, dp[j].Z
		c0 := ay*az1 - ay1*az
		c1 := ay*bz1 + by*az1 - ay1*bz - by1*az
		c2 := by*bz1 - by1*bz
		e0, e1 := ay+ay1, by+by1
		f0, f1 := az+az1, bz+bz1
		var e edgePoly
		e.a = [3]float64{c0, c1, c2}
		e.sy = [4]float64{e0 * c0, e0*c1 + e1*c0, e0*c2 + e1*c1, e1 * c2}
		e.sz = [4]float64{f0 * c0, f0*c1 + f1*c0, f0*c2 + f1*c1, f1 * c2}
		pre[i+1] = pre[i]
		pre[i+1].add(&e, 1)
	}
	return pre
}

// prefixBase returns the vertex the edges' prefix sums start from: the
// highest at the slab's two ends together (on a hull, a deck edge), the
// first of equals.
func prefixBase(p0, p1 []Point) int {
	base := 0
	for k := range p0 {
		if p0[k].Z+p1[k].Z > p0[base].Z+p1[base].Z {
			base = k
		}
	}
	return base
}

// runAt returns the sums of the shoelace terms of the whole edges lo …
// hi−1 (vertex indices mod n, lo ≠ hi) at s, from the prefix sums pre
// counted from base: with i = lo − base and j = hi − base (mod n),
// pre[j] − pre[i], or pre[n] − pre[i] + pre[j] when the run passes base
// (i > j).
func runAt(pre []edgePoly, base, lo, hi int, s float64) (a, sy, sz float64) {
	n := len(pre) - 1
	i, j := lo-base, hi-base
	if i < 0 {
		i += n
	}
	if j < 0 {
		j += n
	}
	a, sy, sz = pre[j].eval(s)
	qa, qsy, qsz := pre[i].eval(s)
	a, sy, sz = a-qa, sy-qsy, sz-qsz
	if i > j {
		ra, rsy, rsz := pre[n].eval(s)
		a, sy, sz = a+ra, sy+rsy, sz+rsz
	}
	return a, sy, sz
}

// chain is one stretch of the clipped section: it enters the water on edge
// in (v_in above, v_in+1 below), follows whole edges in+1 … out−1 and leaves
// on edge out (v_out below, v_out+1 above).
type chain struct{ in, out int }

// maxChains bounds the chains handled without falling back to clipBelow.
const maxChains = 16

// cutEdge is an edge k (v_k → v_k+1) with one end below the plane and one
// above; in: v_k+1 is the end below (the section goes into the water
// along it).
type cutEdge struct {
	k  int
	in bool
}

// cutState tracks, along a slab, how many vertices are below the plane and
// which edges the plane cuts (in ascending order), updated vertex by vertex
// as the plane passes them. It keeps no side per vertex (a vertex crosses
// at most once in a slab, so its side is known from its root), so its size
// does not depend on the section's; it holds no pointers and stays on the
// stack.
type cutState struct {
	nin  int
	cut  [2 * maxChains]cutEdge
	ncut int
	ok   bool // false once the cut edges outgrow cut

	// Working space of chains and pieceChains, kept here so that it is not
	// cleared for every piece.
	ins, outs [maxChains]int
	chainBuf  [maxChains]chain
}

// markCut records that edge e is cut at the slab's start; when the list is
// full the fast path gives up (ok false) and the slab is clipped instead.
func (c *cutState) markCut(e int, in bool) {
	if c.ncut == len(c.cut) {
		c.ok = false
		return
	}
	c.cut[c.ncut] = cutEdge{e, in}
	c.ncut++
}

// toggle removes edge e from the cut edges if it is there, and otherwise
// adds it with direction in.
func (c *cutState) toggle(e int, in bool) {
	i := 0
	for i < c.ncut && c.cut[i].k < e {
		i++
	}
	if i < c.ncut && c.cut[i].k == e {
		copy(c.cut[i:c.ncut], c.cut[i+1:c.ncut])
		c.ncut--
		return
	}
	if c.ncut == len(c.cut) {
		c.ok = false
		return
	}
	copy(c.cut[i+1:c.ncut+1], c.cut[i:c.ncut])
	c.cut[i] = cutEdge{e, in}
	c.ncut++
}

// flip moves vertex k to the other side of the plane; was says whether it
// was below before.
// The edge into it is cut afterwards if it was not before, with v_k its
// end below if k is now below; the edge out of it likewise, with v_k+1 on
// the side k has left.
func (c *cutState) flip(k, n int, was bool) {
	now := !was
	if now {
		c.nin++
	} else {
		c.nin--
	}
	c.toggle((k+n-1)%n, now)
	c.toggle(k, was)
}

// chains pairs each edge where the section enters the water with the next
// edge where it leaves, in the polygon's order.
func (c *cutState) chains(out *[maxChains]chain) (int, bool) {
	ins, outs := &c.ins, &c.outs
	ni, no := 0, 0
	for _, e := range c.cut[:c.ncut] {
		if e.in {
			if ni == maxChains {
				return 0, false
			}
			ins[ni] = e.k
			ni++
		} else {
			if no == maxChains {
				return 0, false
			}
			outs[no] = e.k
			no++
		}
	}
	if ni != no || ni == 0 {
		return 0, false
	}
	first := 0
	if outs[0] < ins[0] {
		first = 1 // the first leaving edge closes the last chain (wrap)
	}
	for i := 0; i < ni; i++ {
		out[i] = chain{ins[i], outs[(i+first)%no]}
	}
	return ni, true
}

// blockSize is the number of consecutive section vertices bounded
// together, so that a run of vertices far from the waterline is passed over
// at once.
const blockSize = 8

// vertexBlock bounds vertices k … k+blockSize−1 of a slab at both its ends
// (and so, the vertices moving linearly, all along it).
type vertexBlock struct{ ymin, ymax, zmin, zmax float64 }

// vertexBlocks returns the bounds of each block of the polygons a and b.
func vertexBlocks(a, b []Point) []vertexBlock {
	var out []vertexBlock
	for k0 := 0; k0 < len(a); k0 += blockSize {
		bb := vertexBlock{math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)}
		for k := k0; k < min(k0+blockSize, len(a)); k++ {
			for _, q := range [2]Point{a[k], b[k]} {
				bb.ymin, bb.ymax = math.Min(bb.ymin, q.Y), math.Max(bb.ymax, q.Y)
				bb.zmin, bb.zmax = math.Min(bb.zmin, q.Z), math.Max(bb.zmax, q.Z)
			}
		}
		out = append(out, bb)
	}
	return out
}

// cutRoot is an x where vertex k crosses the plane; below: its side
// before.
type cutRoot struct {
	x     float64
	k     int
	below bool
}

// cutScratch is belowChains's working space.
type cutScratch struct {
	st    cutState
	roots [64]cutRoot
}

// belowChains is slab.below by the chain method; false when the slab is
// beyond its bounds (then nothing is added).
//
// sc is scratch space that the caller keeps across slabs, so that it is
// not cleared for each one.
func (s *slab) belowChains(p Plane, im *Immersion, sc *cutScratch) bool {
	n := len(s.p0)
	if n < 3 {
		return false
	}
	dx := s.x1 - s.x0
	st := &sc.st
	st.nin = 0
	roots := sc.roots[:0]
	h0, h1 := p.A+p.B*s.x0, p.A+p.B*s.x1
	p0, p1 := s.p0[:n], s.p1[:n]
	st.ncut, st.ok = 0, true
	prev, first := false, false
	hlo, hhi := min(h0, h1), max(h0, h1)
	for bi, bb := range s.blocks {
		k0, k1 := bi*blockSize, min(bi*blockSize+blockSize, n)
		// The plane's height above every vertex of the block, over the
		// whole slab, lies within [dmin, dmax].
		cy0, cy1 := p.C*bb.ymin, p.C*bb.ymax
		dmax := bb.zmax - min(cy0, cy1) - hlo
		dmin := bb.zmin - max(cy0, cy1) - hhi
		if dmax < 0 || dmin > 0 {
			// The whole block is on one side all along the slab: no roots
			// and no cut edges inside it.
			b := dmax < 0
			if b {
				st.nin += k1 - k0
			}
			if k0 == 0 {
				first = b
			} else if b != prev {
				st.markCut(k0-1, b)
			}
			prev = b
			continue
		}
		for k := k0; k < k1; k++ {
			d0 := p0[k].Z - p.C*p0[k].Y - h0
			d1 := p1[k].Z - p.C*p1[k].Y - h1
			// The side just forward of x0 (a vertex on the plane there takes
			// the side it goes to).
			b := d0 < 0 || d0 == 0 && d1 < 0
			if b {
				st.nin++
			}
			if k == 0 {
				first = b
			} else if b != prev {
				st.markCut(k-1, b) // edge k−1 is cut at x0
			}
			prev = b
			if (d0 < 0 && d1 > 0) || (d0 > 0 && d1 < 0) {
				roots = append(roots, cutRoot{s.x0 + dx*d0/(d0-d1), k, b})
			}
		}
	}
	if prev != first {
		st.markCut(n-1, first)
	}
	if len(roots) == 0 {
		switch st.nin {
		case 0:
			return true
		case n:
			im.add(s.full, 1)
			return true
		}
	}
	sortRoots(roots)
	if !st.ok {
		return false
	}
	var part Immersion
	xa := s.x0
	for i := 0; i <= len(roots); i++ {
		xb := s.x1
		if i < len(roots) {
			xb = roots[i].x
		}
		if xb-xa > 1e-12*(1+math.Abs(xb)) {
			if !st.ok || !s.pieceCut(p, xa, xb, st, &part) {
				part.add(s.integrate(p, xa, xb), 1)
			}
			xa = xb
		}
		if i < len(roots) {
			st.flip(roots[i].k, n, roots[i].below)
		}
	}
	im.add(part, 1)
	return true
}

// pieceCut integrates [xa, xb], along which st holds, adding to im;
// false (nothing added) when there are too many chains.
func (s *slab) pieceCut(p Plane, xa, xb float64, st *cutState, im *Immersion) bool {
	if st.nin == 0 || st.nin == len(s.p0) {
		s.pieceChains(p, xa, xb, st.nin, nil, im)
		return true
	}
	nc, ok := st.chains(&st.chainBuf)
	if !ok {
		return false
	}
	s.pieceChains(p, xa, xb, st.nin, st.chainBuf[:nc], im)
	return true
}

// pieceChains integrates [xa, xb], along which nin vertices are below the
// plane and the clipped section is made of chains, adding to im.
//
// At each Gauss node x the section below is the chains' runs of whole
// edges, each a difference of prefix sums (runAt), and the cut edges with
// the waterline between them, worked at the node.
func (s *slab) pieceChains(p Plane, xa, xb float64, nin int, chains []chain, im *Immersion) {
	n := len(s.p0)
	dx := xb - xa
	if nin == 0 {
		return
	}
	pre := s.pre[:n+1]
	if nin == n {
		// The whole section is under water along the piece.
		var v2, mx2, my6, mz6 float64
		for g := range gaussNode {
			x := xa + gaussNode[g]*dx
			w := gaussWeight[g] * dx
			a, sy, sz := pre[n].eval(x - s.x0)
			v2 += w * a
			mx2 += w * x * a
			my6 += w * sy
			mz6 += w * sz
		}
		im.V += v2 / 2
		im.MX += mx2 / 2
		im.MY += my6 / 6
		im.MZ += mz6 / 6
		return
	}
	// As in pieceArc, the sums are kept as they come (twice the area, six
	// times the moments, two and three times the waterline's moments) and
	// divided once for the piece.
	var v2, mx2, my6, mz6, aw, sx, sy2, ixx, ixy2, iyy3 float64
	vs := s.v[:n]
	for g := range gaussNode {
		x := xa + gaussNode[g]*dx
		w := gaussWeight[g] * dx
		sg := x - s.x0
		h := p.A + p.B*x
		// W, WY, WYY: the waterline's breadth and twice and three times
		// its moments.
		var a2, sy6, sz6, W, WY, WYY float64
		var lastOutY, lastOutZ, firstInY, firstInZ float64
		for c, ch := range chains {
			// Entry point on edge in.
			k, j := ch.in, ch.in+1
			if j == n {
				j = 0
			}
			ky, kz := vs[k].at(sg)
			jy, jz := vs[j].at(sg)
			dk, dj := kz-p.C*ky-h, jz-p.C*jy-h
			t := dk / (dk - dj)
			iy, iz := ky+t*(jy-ky), kz+t*(jz-kz)
			// Edge entry → v_{in+1}.
			cr := iy*jz - jy*iz
			a2 += cr
			sy6 += (iy + jy) * cr
			sz6 += (iz + jz) * cr
			y2 := iy * iy
			W -= iy
			WY -= y2
			WYY -= y2 * iy
			if c == 0 {
				firstInY, firstInZ = iy, iz
			} else {
				// The waterline edge from the last chain's exit to this entry.
				cr := lastOutY*iz - iy*lastOutZ
				a2 += cr
				sy6 += (lastOutY + iy) * cr
				sz6 += (lastOutZ + iz) * cr
			}
			// Whole edges in+1 … out−1.
			if lo := j; lo != ch.out {
				pa, psy, psz := runAt(pre, s.base, lo, ch.out, sg)
				a2 += pa
				sy6 += psy
				sz6 += psz
			}
			// Exit point on edge out, and edge v_out → exit.
			k, j = ch.out, ch.out+1
			if j == n {
				j = 0
			}
			ky, kz = vs[k].at(sg)
			jy, jz = vs[j].at(sg)
			dk, dj = kz-p.C*ky-h, jz-p.C*jy-h
			t = dk / (dk - dj)
			oy, oz := ky+t*(jy-ky), kz+t*(jz-kz)
			cr = ky*oz - oy*kz
			a2 += cr
			sy6 += (ky + oy) * cr
			sz6 += (kz + oz) * cr
			y2 = oy * oy
			W += oy
			WY += y2
			WYY += y2 * oy
			lastOutY, lastOutZ = oy, oz
		}
		// Close: the last exit to the first entry.
		cr := lastOutY*firstInZ - firstInY*lastOutZ
		a2 += cr
		sy6 += (lastOutY + firstInY) * cr
		sz6 += (lastOutZ + firstInZ) * cr

		v2 += w * a2
		mx2 += w * x * a2
		my6 += w * sy6
		mz6 += w * sz6
		aw += w * W
		sx += w * x * W
		sy2 += w * WY
		ixx += w * x * x * W
		ixy2 += w * x * WY
		iyy3 += w * WYY
	}
	im.addPiece(v2, mx2, my6, mz6, aw, sx, sy2, ixx, ixy2, iyy3)
}

// addPiece adds a piece's sums as pieceArc and pieceChains keep them while
// they run over the Gauss nodes — twice the area (v2, mx2), six times the
// section's moments (my6, mz6), and the waterline's sums with its y
// moments two (sy2, ixy2) and three (iyy3) times over — divided once for
// the piece.
func (im *Immersion) addPiece(v2, mx2, my6, mz6, aw, sx, sy2, ixx, ixy2, iyy3 float64) {
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

// sortRoots puts the waterline's crossings of a slab in order along x:
// an insertion sort, since there are a handful at most and they come
// nearly in order.
func sortRoots(roots []cutRoot) {
	for i := 1; i < len(roots); i++ {
		for j := i; j > 0 && roots[j].x < roots[j-1].x; j-- {
			roots[j], roots[j-1] = roots[j-1], roots[j]
		}
	}
}
