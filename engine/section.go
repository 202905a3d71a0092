package engine

import "math"

// Point is a point of a transverse section: Y to starboard, Z up, metres.
type Point struct{ Y, Z float64 }

// areaMoments accumulates the area and first moments of a polygon in the
// (y, z) plane and the chords that the waterline cuts from it.
//
// A is ∮ in the counter-clockwise sense, SY = ∫∫ y dA and SZ = ∫∫ z dA
// (shoelace formulas). W, WY and WYY are ∫ dy, ∫ y dy and ∫ y² dy along the
// waterline's chords, projected on the y axis: the waterplane's breadth and its
// first and second moments at this x.
type areaMoments struct {
	A, SY, SZ  float64
	W, WY, WYY float64
}

// clipBelow walks the polygon whose vertex k is p0[k] + s·dp[k] and keeps the
// part with z − c·y < h (below the waterline of slope c = tan(heel) and height
// h on the centreline). It returns the clipped polygon's moments without
// building it (a streaming Sutherland–Hodgman clip). The polygon must be
// counter-clockwise; a non-convex one is handled correctly, the extra edges
// that the clip makes along the waterline cancelling in the sums.
//
// Special cases: an empty polygon gives zero moments; with h = +Inf the whole
// polygon is kept and W, WY, WYY are zero.
func clipBelow(p0, dp []Point, s, c, h float64) areaMoments {
	var m areaMoments
	n := len(p0)
	if n == 0 {
		return m
	}
	var sh shoelace
	lastY, lastZ := p0[n-1].Y+s*dp[n-1].Y, p0[n-1].Z+s*dp[n-1].Z
	dLast := lastZ - c*lastY - h
	for k := 0; k < n; k++ {
		curY, curZ := p0[k].Y+s*dp[k].Y, p0[k].Z+s*dp[k].Z
		dCur := curZ - c*curY - h
		inLast, inCur := dLast < 0, dCur < 0
		if inLast != inCur {
			t := dLast / (dLast - dCur)
			qY, qZ := lastY+t*(curY-lastY), lastZ+t*(curZ-lastZ)
			sh.vertex(qY, qZ)
			y2 := qY * qY
			if inLast { // leaving the water: a chord starts here
				m.W += qY
				m.WY += y2 / 2
				m.WYY += y2 * qY / 3
			} else { // entering: the chord ends here
				m.W -= qY
				m.WY -= y2 / 2
				m.WYY -= y2 * qY / 3
			}
		}
		if inCur {
			sh.vertex(curY, curZ)
		}
		lastY, lastZ, dLast = curY, curZ, dCur
	}
	if sh.have {
		sh.vertex(sh.firstY, sh.firstZ)
	}
	m.A = sh.a2 / 2
	m.SY = sh.sy6 / 6
	m.SZ = sh.sz6 / 6
	return m
}

// shoelace sums a polygon's area and first moments vertex by vertex (the
// shoelace formula): twice the area and six times the moments about the
// axes, from the cross product of each edge's ends. The polygon closes on
// its first vertex again.
type shoelace struct {
	firstY, firstZ, prevY, prevZ float64
	have                         bool
	a2, sy6, sz6                 float64
}

func (s *shoelace) vertex(y, z float64) {
	if !s.have {
		s.firstY, s.firstZ, s.have = y, z, true
	} else {
		cr := s.prevY*z - y*s.prevZ
		s.a2 += cr
		s.sy6 += (s.prevY + y) * cr
		s.sz6 += (s.prevZ + z) * cr
	}
	s.prevY, s.prevZ = y, z
}

// polygonMoments returns area and first moments of a whole polygon.
func polygonMoments(p []Point) areaMoments {
	dp := make([]Point, len(p))
	return clipBelow(p, dp, 0, 0, math.Inf(1))
}

// halfPlane is the region ny·y + nz·z ≤ k of a section.
type halfPlane struct{ ny, nz, k float64 }

// clipPolygon returns the part of p inside hp (Sutherland–Hodgman) and a
// signature of which vertices were inside, so that two clips of polygons
// with corresponding vertices can be told to have the same topology.
func clipPolygon(p []Point, hp halfPlane) ([]Point, uint64) {
	return clipPolygonInto(nil, p, hp)
}
