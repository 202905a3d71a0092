package engine

// outlineCursor answers outlineAt for one half outline at heights asked in
// ascending order, in amortised constant time per height: the two segment
// indices it keeps only ever move up the outline, so resampling two
// stations at the union of their heights (matchStations) takes time linear
// in their points, where calling outlineAt for each height, which scans
// the outline from the keel, took time proportional to their product.
//
// For a height z strictly between keel and deck, the segments (o[k-1],
// o[k]) that contain z are those from lo, the first with o[lo].Z ≥ z, to
// hi, the last with o[hi-1].Z ≤ z (the heights never descend); the first
// point is taken on segment lo and the last on segment hi, exactly as
// outlineAt's scan takes them. Heights must be asked in ascending order.
type outlineCursor struct {
	o      []Point
	lo, hi int
	keel   int // the last index of the run of points at the keel's height
	deck   int // the first index of the run of points at the deck's height
}

func newOutlineCursor(o []Point) *outlineCursor {
	c := &outlineCursor{o: o, lo: 1, hi: 1, deck: len(o) - 1}
	for c.keel+1 < len(o) && o[c.keel+1].Z == o[0].Z {
		c.keel++
	}
	for c.deck > 0 && o[c.deck-1].Z == o[len(o)-1].Z {
		c.deck--
	}
	return c
}

// at returns what outlineAt(o, z) returns.
func (c *outlineCursor) at(z float64) (Point, Point) {
	o := c.o
	n := len(o)
	switch {
	case z < o[0].Z:
		return Point{0, o[0].Z}, Point{0, o[0].Z}
	case z == o[0].Z:
		return o[0], o[c.keel]
	case z > o[n-1].Z:
		return o[n-1], o[n-1]
	case z == o[n-1].Z:
		return o[c.deck], o[n-1]
	}
	for c.lo < n-1 && o[c.lo].Z < z {
		c.lo++
	}
	c.hi = max(c.hi, c.lo)
	for c.hi < n-1 && o[c.hi].Z <= z {
		c.hi++
	}
	return pointAtHeight(o[c.lo-1], o[c.lo], z), pointAtHeight(o[c.hi-1], o[c.hi], z)
}

// pointAtHeight is the point at height z on the segment p–q, which holds
// it (p.Z ≤ z ≤ q.Z): an end point when z is its height, else the linear
// interpolation.
func pointAtHeight(p, q Point, z float64) Point {
	switch {
	case p.Z == z:
		return p
	case q.Z == z:
		return q
	}
	t := (z - p.Z) / (q.Z - p.Z)
	return Point{p.Y + t*(q.Y-p.Y), z}
}
