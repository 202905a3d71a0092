package engine

import "sync"

// clipScratch holds the buffers that clipping a solid by a convex region
// (clipSlabs) reuses from one section to the next, so that the hundreds
// of sections a compartment's clip looks at cost no allocation each. It
// is owned by one clip at a time (not shared between goroutines); the
// clips of a ship's compartments take it in turn from clipScratches.
type clipScratch struct {
	sec        []Point   // the slab's section at x, before clipping
	ping, pong []Point   // the section after each half-plane in turn
	pa, pb, pm []Point   // the clipped sections at a piece's ends and at a bisection's midpoint
	cuts       []float64 // the x where a vertex crosses a side, sorted
}

// clipScratches keeps clipScratch values between clips, so that building
// a ship's compartments one after another (or a few at once) reuses a few
// sets of buffers.
var clipScratches = sync.Pool{New: func() any { return new(clipScratch) }}

// clipAt returns the section of sl at x clipped by planes, written into
// dst's storage, and its topology signature: the same polygon as clipping
// sl.section(x) by each of planes in turn with clipPolygon, and the
// signature sig·31 + s over the planes' signatures s, computed with the
// same arithmetic in the same order (so the results agree to the bit).
func (sc *clipScratch) clipAt(dst []Point, sl *slab, x float64, planes []halfPlane) ([]Point, uint64) {
	t := x - sl.x0
	sec := sc.sec[:0]
	for k := range sl.p0 {
		sec = append(sec, Point{sl.p0[k].Y + t*sl.dp[k].Y, sl.p0[k].Z + t*sl.dp[k].Z})
	}
	sc.sec = sec
	if len(planes) == 0 {
		return append(dst[:0], sec...), 0
	}
	p := sec
	var sig uint64
	for i, hp := range planes {
		var s uint64
		switch {
		case i == len(planes)-1:
			p, s = clipPolygonInto(dst[:0], p, hp)
		case i%2 == 0:
			p, s = clipPolygonInto(sc.ping[:0], p, hp)
			sc.ping = p
		default:
			p, s = clipPolygonInto(sc.pong[:0], p, hp)
			sc.pong = p
		}
		sig = sig*31 + s
	}
	return p, sig
}

// clipPolygonInto is clipPolygon appending the clipped polygon to dst,
// which must not share storage with p.
func clipPolygonInto(dst, p []Point, hp halfPlane) ([]Point, uint64) {
	out := dst
	var sig uint64 = 1469598103934665603
	n := len(p)
	if n == 0 {
		return out, sig
	}
	last := p[n-1]
	dLast := hp.ny*last.Y + hp.nz*last.Z - hp.k
	for _, cur := range p {
		dCur := hp.ny*cur.Y + hp.nz*cur.Z - hp.k
		inLast, inCur := dLast <= 0, dCur <= 0
		bit := uint64(0)
		if inCur {
			bit = 1
		}
		sig = (sig ^ bit) * 1099511628211
		if inLast != inCur {
			t := dLast / (dLast - dCur)
			out = append(out, Point{last.Y + t*(cur.Y-last.Y), last.Z + t*(cur.Z-last.Z)})
		}
		if inCur {
			out = append(out, cur)
		}
		last, dLast = cur, dCur
	}
	return out, sig
}
