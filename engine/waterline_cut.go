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

// edgePrefix returns the prefix sums pre[k] = Σ_{e<k} edge e's polynomials,
// k = 0 … n, of the polygon p0 + s·dp.
func edgePrefix(p0, dp []Point) []edgePoly {
	n := len(p0)
	pre := make([]edgePoly, n+1)
	for k := 0; k < n; k++ {
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
		pre[k+1] = pre[k]
		pre[k+1].add(&e, 1)
	}
	return pre
}

// chain is one stretch of the clipped section: it enters the water on edge
// in (v_in above, v_in+1 below), follows whole edges in+1 … out−1 and leaves
// on edge out (v_out below, v_out+1 above).
type chain struct{ in, out int }

// maxChains bounds the chains handled without falling back to clipBelow.
const maxChains = 16

// cutState tracks, along a slab, which vertices are below the plane and
// which edges the plane cuts (in ascending order), updated vertex by vertex
// as the plane passes them. It holds no pointers, so it stays on the stack.
type cutState struct {
	below [maxVertices]bool
	big   []bool // below, for sections of more than maxVertices vertices
	nin   int
	cut   [2 * maxChains]int // edges k (v_k → v_k+1) with one end below and one above
	ncut  int
	ok    bool // false once the cut edges outgrow cut

	// Working space of chains and pieceChains, kept here so that it is not
	// cleared for every piece.
	ins, outs [maxChains]int
	chainBuf  [maxChains]chain
}

// maxVertices is the number of section vertices whose sides are kept in
// cutState's own array; larger sections use a slice grown once per scratch.
const maxVertices = 256

// sides returns the working array of the vertices' sides for n vertices.
func (c *cutState) sides(n int) []bool {
	if n <= maxVertices {
		return c.below[:n]
	}
	if cap(c.big) < n {
		c.big = make([]bool, n)
	}
	return c.big[:n]
}

// markCut records that edge e is cut at the slab's start; when the list is
// full the fast path gives up (ok false) and the slab is clipped instead.
func (c *cutState) markCut(e int) {
	if c.ncut == len(c.cut) {
		c.ok = false
		return
	}
	c.cut[c.ncut] = e
	c.ncut++
}

func (c *cutState) toggle(e int) {
	i := 0
	for i < c.ncut && c.cut[i] < e {
		i++
	}
	if i < c.ncut && c.cut[i] == e {
		copy(c.cut[i:c.ncut], c.cut[i+1:c.ncut])
		c.ncut--
		return
	}
	if c.ncut == len(c.cut) {
		c.ok = false
		return
	}
	copy(c.cut[i+1:c.ncut+1], c.cut[i:c.ncut])
	c.cut[i] = e
	c.ncut++
}

// flip moves vertex k to the other side of the plane.
func (c *cutState) flip(below []bool, k, n int) {
	below[k] = !below[k]
	if below[k] {
		c.nin++
	} else {
		c.nin--
	}
	c.toggle((k + n - 1) % n)
	c.toggle(k)
}

// chains pairs each edge where the section enters the water with the next
// edge where it leaves, in the polygon's order.
func (c *cutState) chains(below []bool, out *[maxChains]chain) (int, bool) {
	n := len(below)
	ins, outs := &c.ins, &c.outs
	ni, no := 0, 0
	for _, k := range c.cut[:c.ncut] {
		j := k + 1
		if j == n {
			j = 0
		}
		if below[j] {
			if ni == maxChains {
				return 0, false
			}
			ins[ni] = k
			ni++
		} else {
			if no == maxChains {
				return 0, false
			}
			outs[no] = k
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

// cutRoot is an x where vertex k crosses the plane.
type cutRoot struct {
	x float64
	k int
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
	below := st.sides(n)
	st.ncut, st.ok = 0, true
	prev := false
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
			for k := k0; k < k1; k++ {
				below[k] = b
			}
			if b {
				st.nin += k1 - k0
			}
			if k0 > 0 && b != prev {
				st.markCut(k0 - 1)
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
			below[k] = b
			if b {
				st.nin++
			}
			if k > 0 && b != prev {
				st.markCut(k - 1) // edge k−1 is cut at x0
			}
			prev = b
			if (d0 < 0 && d1 > 0) || (d0 > 0 && d1 < 0) {
				roots = append(roots, cutRoot{s.x0 + dx*d0/(d0-d1), k})
			}
		}
	}
	if below[n-1] != below[0] {
		if st.ncut == len(st.cut) {
			st.ok = false
		} else {
			st.cut[st.ncut] = n - 1
			st.ncut++
		}
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
			if !st.ok || !s.pieceCut(p, xa, xb, st, below, &part) {
				part.add(s.integrate(p, xa, xb), 1)
			}
			xa = xb
		}
		if i < len(roots) {
			st.flip(below, roots[i].k, n)
		}
	}
	im.add(part, 1)
	return true
}

// pieceCut integrates [xa, xb], along which st holds, adding to im;
// false (nothing added) when there are too many chains.
func (s *slab) pieceCut(p Plane, xa, xb float64, st *cutState, below []bool, im *Immersion) bool {
	if st.nin == 0 || st.nin == len(s.p0) {
		s.pieceChains(p, xa, xb, st.nin, nil, im)
		return true
	}
	nc, ok := st.chains(below, &st.chainBuf)
	if !ok {
		return false
	}
	s.pieceChains(p, xa, xb, st.nin, st.chainBuf[:nc], im)
	return true
}

// pieceChains integrates [xa, xb], along which nin vertices are below the
// plane and the clipped section is made of chains, adding to im.
func (s *slab) pieceChains(p Plane, xa, xb float64, nin int, chains []chain, im *Immersion) {
	n := len(s.p0)
	dx := xb - xa
	if nin == 0 {
		return
	}
	pre := s.pre
	if nin == n {
		// The whole section is under water along the piece.
		for g := range gaussNode {
			x := xa + gaussNode[g]*dx
			w := gaussWeight[g] * dx
			a, sy, sz := pre[n].eval(x - s.x0)
			im.V += w * a / 2
			im.MX += w * x * a / 2
			im.MY += w * sy / 6
			im.MZ += w * sz / 6
		}
		return
	}
	nc := len(chains)
	for g := range gaussNode {
		x := xa + gaussNode[g]*dx
		w := gaussWeight[g] * dx
		sg := x - s.x0
		h := p.A + p.B*x
		var a2, sy6, sz6, W, WY, WYY float64
		var lastOutY, lastOutZ, firstInY, firstInZ float64
		for c := 0; c < nc; c++ {
			ch := chains[c]
			// Entry point on edge in.
			k, j := ch.in, ch.in+1
			if j == n {
				j = 0
			}
			ky, kz := s.p0[k].Y+sg*s.dp[k].Y, s.p0[k].Z+sg*s.dp[k].Z
			jy, jz := s.p0[j].Y+sg*s.dp[j].Y, s.p0[j].Z+sg*s.dp[j].Z
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
			WY -= y2 / 2
			WYY -= y2 * iy / 3
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
			lo, hi := j, ch.out
			if lo != hi {
				var pa, psy, psz float64
				if lo < hi {
					pa, psy, psz = pre[hi].eval(sg)
					qa, qsy, qsz := pre[lo].eval(sg)
					pa, psy, psz = pa-qa, psy-qsy, psz-qsz
				} else {
					pa, psy, psz = pre[n].eval(sg)
					qa, qsy, qsz := pre[lo].eval(sg)
					ra, rsy, rsz := pre[hi].eval(sg)
					pa, psy, psz = pa-qa+ra, psy-qsy+rsy, psz-qsz+rsz
				}
				a2 += pa
				sy6 += psy
				sz6 += psz
			}
			// Exit point on edge out, and edge v_out → exit.
			k, j = ch.out, ch.out+1
			if j == n {
				j = 0
			}
			ky, kz = s.p0[k].Y+sg*s.dp[k].Y, s.p0[k].Z+sg*s.dp[k].Z
			jy, jz = s.p0[j].Y+sg*s.dp[j].Y, s.p0[j].Z+sg*s.dp[j].Z
			dk, dj = kz-p.C*ky-h, jz-p.C*jy-h
			t = dk / (dk - dj)
			oy, oz := ky+t*(jy-ky), kz+t*(jz-kz)
			cr = ky*oz - oy*kz
			a2 += cr
			sy6 += (ky + oy) * cr
			sz6 += (kz + oz) * cr
			y2 = oy * oy
			W += oy
			WY += y2 / 2
			WYY += y2 * oy / 3
			lastOutY, lastOutZ = oy, oz
		}
		// Close: the last exit to the first entry.
		cr := lastOutY*firstInZ - firstInY*lastOutZ
		a2 += cr
		sy6 += (lastOutY + firstInY) * cr
		sz6 += (lastOutZ + firstInZ) * cr

		A := a2 / 2
		im.V += w * A
		im.MX += w * x * A
		im.MY += w * sy6 / 6
		im.MZ += w * sz6 / 6
		im.AW += w * W
		im.SX += w * x * W
		im.SY += w * WY
		im.IXX += w * x * x * W
		im.IXY += w * x * WY
		im.IYY += w * WYY
	}
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
