package engine

// Cross-check of the section clip against github.com/paulmach/orb, a
// general-purpose planar geometry library: orb/clip clips the polygon by an
// axis-aligned bound (after rotating the section so the waterline is
// horizontal) and orb/planar gives the area and centroid of what is left.

import (
	"math"
	"math/rand"
	"sort"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/clip"
	"github.com/paulmach/orb/planar"
)

// refStarPolygon returns a simple, counter-clockwise, generally non-convex
// polygon: n ≥ 4 vertices at increasing angles about (cy, cz), no two more
// than 0.95π apart (so the polygon winds once about the centre, which it
// is star-shaped from), each at a random radius between 0.2r and r.
func refStarPolygon(rng *rand.Rand, n int, cy, cz, r float64) []Point {
	if n < 4 {
		panic("engine: refStarPolygon needs at least 4 vertices")
	}
	p := make([]Point, n)
	for i := range p {
		a := (float64(i) + 0.9*rng.Float64()) * 2 * math.Pi / float64(n)
		rad := r * (0.2 + 0.8*rng.Float64())
		p[i] = Point{cy + rad*math.Cos(a), cz + rad*math.Sin(a)}
	}
	return p
}

// refOrbBelow clips polygon p to its part below the line z = h + tan(φ)·y
// with orb: rotating by −φ takes the line to v = h·cos φ, below which an
// axis-aligned bound keeps the polygon; orb/planar then gives area and
// centroid, rotated back.
func refOrbBelow(p []Point, phi, h float64) (area, yc, zc float64) {
	cs, sn := math.Cos(phi), math.Sin(phi)
	ring := make(orb.Ring, 0, len(p)+1)
	b := orb.Bound{Min: orb.Point{math.Inf(1), math.Inf(1)}, Max: orb.Point{math.Inf(-1), math.Inf(-1)}}
	for _, q := range p {
		pt := orb.Point{q.Y*cs + q.Z*sn, -q.Y*sn + q.Z*cs}
		ring = append(ring, pt)
		b = b.Extend(pt)
	}
	ring = append(ring, ring[0])
	top := h * cs
	if top <= b.Min[1] {
		return 0, 0, 0
	}
	bound := orb.Bound{Min: orb.Point{b.Min[0] - 1, b.Min[1] - 1}, Max: orb.Point{b.Max[0] + 1, math.Min(top, b.Max[1]+1)}}
	clipped := clip.Polygon(bound, orb.Polygon{ring})
	if clipped == nil {
		return 0, 0, 0
	}
	c, a := planar.CentroidArea(clipped)
	if a == 0 {
		return 0, 0, 0
	}
	return a, c[0]*cs - c[1]*sn, c[0]*sn + c[1]*cs
}

// refChords returns ∫dy, ∫y dy and ∫y² dy over the chords that the line
// z = h + c·y cuts from polygon p, found by intersecting every edge with
// the line, sorting the crossings along it and pairing them in and out.
func refChords(p []Point, c, h float64) (w, wy, wyy float64) {
	var ys []float64
	n := len(p)
	for k := 0; k < n; k++ {
		a, b := p[(k+n-1)%n], p[k]
		da, db := a.Z-c*a.Y-h, b.Z-c*b.Y-h
		if (da < 0) != (db < 0) {
			t := da / (da - db)
			ys = append(ys, a.Y+t*(b.Y-a.Y))
		}
	}
	sort.Float64s(ys)
	for i := 0; i+1 < len(ys); i += 2 {
		y0, y1 := ys[i], ys[i+1]
		w += y1 - y0
		wy += (y1*y1 - y0*y0) / 2
		wyy += (y1*y1*y1 - y0*y0*y0) / 3
	}
	return w, wy, wyy
}

// TestClipAgainstOrb compares clipBelow's area, centroid and chords with
// orb's and the test's own chords on seeded random polygons and lines. The
// polygons are given as p0 + s·dp, as the slabs use them, with random dp.
func TestClipAgainstOrb(t *testing.T) {
	const (
		cases   = 3000
		areaTol = 1e-11 // relative to the whole polygon's area
		ctrTol  = 1e-9  // relative to the polygon's size
		wTol    = 1e-9  // relative to size, size², size³
		fdTol   = 1e-6  // finite-difference check of the chords against orb's area
	)
	rng := rand.New(rand.NewSource(7))
	var worstA, worstC, worstW, worstFD float64
	for i := 0; i < cases; i++ {
		n := 4 + rng.Intn(20)
		r := 0.5 + 20*rng.Float64()
		target := refStarPolygon(rng, n, (rng.Float64()*2-1)*r, (rng.Float64()*2-1)*r, r)
		// Write the polygon as p0 + s·dp.
		s := rng.Float64() * 5
		p0, dp := make([]Point, n), make([]Point, n)
		for k := range target {
			dp[k] = Point{rng.NormFloat64(), rng.NormFloat64()}
			p0[k] = Point{target[k].Y - s*dp[k].Y, target[k].Z - s*dp[k].Z}
		}
		phi := (rng.Float64()*2 - 1) * 80 * math.Pi / 180
		c := math.Tan(phi)
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, q := range target {
			lo, hi = math.Min(lo, q.Z-c*q.Y), math.Max(hi, q.Z-c*q.Y)
		}
		h := lo - 0.05*(hi-lo) + 1.1*(hi-lo)*rng.Float64()

		m := clipBelow(p0, dp, s, c, h)
		whole := polygonMoments(target).A
		a, yc, zc := refOrbBelow(target, phi, h) // orb/clip + orb/planar
		if e := math.Abs(m.A-a) / whole; !(e <= areaTol) {
			t.Errorf("case %d: area %.15g, orb %.15g", i, m.A, a)
		} else {
			worstA = math.Max(worstA, e)
		}
		if a > 1e-6*whole {
			ey := math.Abs(m.SY/m.A-yc) / r
			ez := math.Abs(m.SZ/m.A-zc) / r
			if !(ey <= ctrTol && ez <= ctrTol) {
				t.Errorf("case %d: centroid (%.12g, %.12g), orb (%.12g, %.12g)", i, m.SY/m.A, m.SZ/m.A, yc, zc)
			} else {
				worstC = math.Max(worstC, math.Max(ey, ez))
			}
		}
		w, wy, wyy := refChords(target, c, h)
		for _, d := range []struct {
			name      string
			got, want float64
			norm      float64
		}{{"W", m.W, w, r}, {"WY", m.WY, wy, r * r}, {"WYY", m.WYY, wyy, r * r * r}} {
			if e := math.Abs(d.got-d.want) / d.norm; !(e <= wTol) {
				t.Errorf("case %d: %s %.12g, chords %.12g", i, d.name, d.got, d.want)
			} else {
				worstW = math.Max(worstW, e)
			}
		}
		// W = dA/dh and WY = d(∫∫y dA)/dh, from orb by central differences
		// (exact on the piecewise quadratic A(h) when no vertex lies within
		// δ of the line).
		delta := 1e-4 * r
		near := false
		for _, q := range target {
			near = near || math.Abs(q.Z-c*q.Y-h) < 3*delta
		}
		if !near {
			ap, yp, _ := refOrbBelow(target, phi, h+delta)
			am, ym, _ := refOrbBelow(target, phi, h-delta)
			fw := (ap - am) / (2 * delta)
			fwy := (ap*yp - am*ym) / (2 * delta)
			ew := math.Abs(fw-m.W) / r
			ewy := math.Abs(fwy-m.WY) / (r * r)
			if !(ew <= fdTol && ewy <= fdTol) {
				t.Errorf("case %d: W %.9g, WY %.9g; orb differences %.9g, %.9g", i, m.W, m.WY, fw, fwy)
			} else {
				worstFD = math.Max(worstFD, math.Max(ew, ewy))
			}
		}
	}
	t.Logf("%d random polygons: worst area err %.2e, centroid %.2e, chords %.2e, chords vs orb differences %.2e (relative)", cases, worstA, worstC, worstW, worstFD)
}

// TestClipSpecialCases covers the documented special cases of clipBelow.
func TestClipSpecialCases(t *testing.T) {
	sq := []Point{{-1, 0}, {1, 0}, {1, 2}, {-1, 2}}
	zero := make([]Point, len(sq))
	cases := []struct {
		name     string
		p        []Point
		c, h     float64
		a, sy, w float64
	}{
		{"empty polygon", nil, 0, 1, 0, 0, 0},
		{"whole (h = +Inf)", sq, 0.3, math.Inf(1), 4, 0, 0},
		{"below all", sq, 0, -1, 0, 0, 0},
		{"half, level", sq, 0, 1, 2, 0, 2},    // practice: rectangle
		{"diagonal", sq, 1, 1, 2, 2.0 / 3, 2}, // ∫(1+y)dy, ∫y(1+y)dy over −1..1: derived
	}
	for _, c := range cases {
		var dp []Point
		if c.p != nil {
			dp = zero
		}
		m := clipBelow(c.p, dp, 0, c.c, c.h)
		if math.Abs(m.A-c.a) > 1e-12 || math.Abs(m.SY-c.sy) > 1e-12 || math.Abs(m.W-c.w) > 1e-12 {
			t.Errorf("%s: A %g SY %g W %g, want %g %g %g", c.name, m.A, m.SY, m.W, c.a, c.sy, c.w)
		}
		if math.IsNaN(m.A + m.SY + m.SZ + m.W + m.WY + m.WYY) {
			t.Errorf("%s: NaN in %+v", c.name, m)
		}
	}
}
