package engine

import (
	"errors"
	"fmt"
	"math"
	"sort"
)

// Station is one transverse section of a hull given by offsets: the starboard
// half of the outline from the keel up to the deck at side, as (half-breadth,
// height) points with Z non-decreasing. The hull is symmetric about the
// centreline; a first point off the centreline implies a flat bottom out to it.
type Station struct {
	X       float64
	Offsets []Point
}

// Hull is the watertight envelope of a ship up to the deck at side, with the
// deck flat across each section.
type Hull struct {
	LengthM  float64 // between perpendiculars: the forward perpendicular is at x = LengthM
	BreadthM float64 // largest moulded breadth
	DepthM   float64 // largest depth to the deck at side
	Box      bool    // a box-shaped hull (constant rectangular section, vertical sides)

	solid    *Solid
	stations []Station // as given (after implying the centreline point)

	// levelA and levelV tabulate the volume below level, upright planes:
	// a start for the solver's draft, interpolated linearly.
	levelA, levelV []float64
}

// levelGuess returns the height of the level, upright plane below which
// the hull displaces vol, interpolated in the hull's table (exact at the
// tabulated heights, within a few millimetres between them).
func (h *Hull) levelGuess(vol float64) float64 {
	a, v := h.levelA, h.levelV
	if len(a) == 0 {
		return 0
	}
	if vol <= v[0] {
		return a[0]
	}
	for i := 1; i < len(a); i++ {
		if vol <= v[i] {
			if v[i] == v[i-1] {
				return a[i]
			}
			return a[i-1] + (a[i]-a[i-1])*(vol-v[i-1])/(v[i]-v[i-1])
		}
	}
	return a[len(a)-1]
}

// Solid returns the hull's body.
func (h *Hull) Solid() *Solid { return h.solid }

// Stations returns the hull's stations, aft to forward.
func (h *Hull) Stations() []Station { return h.stations }

// NewBoxHull returns a box-shaped hull from x = 0 to length.
func NewBoxHull(length, breadth, depth float64) (*Hull, error) {
	for _, v := range []struct {
		name string
		v    float64
	}{{"length", length}, {"breadth", breadth}, {"depth", depth}} {
		if !(v.v > 0) || math.IsInf(v.v, 0) {
			return nil, fmt.Errorf("box hull %s %v: must be a positive finite number of metres", v.name, v.v)
		}
	}
	off := []Point{{0, 0}, {breadth / 2, 0}, {breadth / 2, depth}}
	h, err := NewSectionHull(length, []Station{{X: 0, Offsets: off}, {X: length, Offsets: off}})
	if err != nil {
		return nil, err
	}
	h.Box = true
	return h, nil
}

// NewSectionHull builds a hull from stations given aft to forward. Between
// two stations each section vertex moves linearly in x; stations with
// different waterlines are matched on the union of their heights.
func NewSectionHull(length float64, stations []Station) (*Hull, error) {
	if !(length > 0) || math.IsInf(length, 0) {
		return nil, fmt.Errorf("hull length %v: must be a positive finite number of metres", length)
	}
	if len(stations) < 2 {
		return nil, errors.New("a hull needs at least two sections")
	}
	h := &Hull{LengthM: length}
	for i, st := range stations {
		if math.IsNaN(st.X) || math.IsInf(st.X, 0) {
			return nil, fmt.Errorf("section %d: x is not a finite number", i+1)
		}
		if i > 0 && !(st.X > stations[i-1].X) {
			return nil, fmt.Errorf("section %d: x = %g is not forward of the section before (x = %g)", i+1, st.X, stations[i-1].X)
		}
		if len(st.Offsets) < 2 {
			return nil, fmt.Errorf("section %d (x = %g): needs at least two offsets", i+1, st.X)
		}
		off := make([]Point, 0, len(st.Offsets)+1)
		for j, p := range st.Offsets {
			if math.IsNaN(p.Y) || math.IsNaN(p.Z) || math.IsInf(p.Y, 0) || math.IsInf(p.Z, 0) {
				return nil, fmt.Errorf("section %d (x = %g) offset %d: not a finite number", i+1, st.X, j+1)
			}
			if p.Y < 0 {
				return nil, fmt.Errorf("section %d (x = %g) offset %d: half-breadth %g is negative", i+1, st.X, j+1, p.Y)
			}
			if p.Z < 0 {
				return nil, fmt.Errorf("section %d (x = %g) offset %d: height %g is below the baseline", i+1, st.X, j+1, p.Z)
			}
			if j > 0 && p.Z < st.Offsets[j-1].Z {
				return nil, fmt.Errorf("section %d (x = %g) offset %d: height %g is below the one before (%g); heights must ascend from keel to deck", i+1, st.X, j+1, p.Z, st.Offsets[j-1].Z)
			}
			if j == 0 && p.Y > 0 {
				off = append(off, Point{0, p.Z})
			}
			off = append(off, p)
		}
		top := off[len(off)-1]
		if !(top.Z > off[0].Z) {
			return nil, fmt.Errorf("section %d (x = %g): the deck is not above the keel", i+1, st.X)
		}
		h.BreadthM = math.Max(h.BreadthM, 2*maxHalfBreadth(off))
		h.DepthM = math.Max(h.DepthM, top.Z)
		h.stations = append(h.stations, Station{X: st.X, Offsets: off})
	}
	// Each slab runs from station aft to station fore. A run of stations
	// with the same offsets (a parallel middle body) is one prismatic
	// slab: the same body, integrated in one piece instead of one per
	// station.
	var aft, fore []int
	for i := 1; i < len(h.stations); i++ {
		j := i
		for j+1 < len(h.stations) && samePoints(h.stations[i-1].Offsets, h.stations[j].Offsets) &&
			samePoints(h.stations[j].Offsets, h.stations[j+1].Offsets) {
			j++
		}
		aft, fore = append(aft, i-1), append(fore, j)
		i = j
	}
	// The slabs are independent of one another: built concurrently, each
	// into its own place.
	slabs := make([]slab, len(aft))
	fanOut(len(slabs), func(k int) {
		sa, sb := h.stations[aft[k]], h.stations[fore[k]]
		a, b := matchStations(sa.Offsets, sb.Offsets)
		slabs[k] = newSlab(sa.X, sb.X, fullSection(a), fullSection(b))
	})
	h.solid = newSolid(slabs)
	if !(h.solid.Volume() > 0) {
		return nil, errors.New("the hull encloses no volume")
	}
	const levels = 48
	_, _, zmin, zmax := h.solid.Extent()
	h.levelA = make([]float64, levels+1)
	h.levelV = make([]float64, levels+1)
	fanOut(levels+1, func(i int) {
		a := zmin + (zmax-zmin)*float64(i)/levels
		h.levelA[i] = a
		h.levelV[i] = h.solid.Below(Plane{A: a}).V
	})
	return h, nil
}

func maxHalfBreadth(off []Point) float64 {
	m := 0.0
	for _, p := range off {
		m = math.Max(m, p.Y)
	}
	return m
}

// fullSection mirrors a starboard half outline (starting on the centreline)
// into a closed counter-clockwise polygon of the whole section.
func fullSection(half []Point) []Point {
	out := make([]Point, 0, 2*len(half))
	out = append(out, half...)
	for k := len(half) - 1; k >= 1; k-- {
		out = append(out, Point{-half[k].Y, half[k].Z})
	}
	return out
}

// matchStations returns the two half outlines resampled at the union of
// their heights so that vertex k of one corresponds to vertex k of the other.
// Each height gives the first and the last point of the outline at that
// height (they differ on a horizontal run such as a flat bottom); a height
// below a station's keel maps to its keel on the centreline, one above its
// deck to its deck at side.
func matchStations(a, b []Point) ([]Point, []Point) {
	var zs []float64
	for _, p := range a {
		zs = append(zs, p.Z)
	}
	for _, p := range b {
		zs = append(zs, p.Z)
	}
	sort.Float64s(zs)
	levels := zs[:0]
	for i, z := range zs {
		if i == 0 || z > levels[len(levels)-1] {
			levels = append(levels, z)
		}
	}
	var ra, rb []Point
	ca, cb := newOutlineCursor(a), newOutlineCursor(b)
	for _, z := range levels {
		a0, a1 := ca.at(z)
		b0, b1 := cb.at(z)
		ra, rb = append(ra, a0), append(rb, b0)
		if a0 != a1 || b0 != b1 {
			ra, rb = append(ra, a1), append(rb, b1)
		}
	}
	return ra, rb
}

// outlineAt returns the first and last points of the half outline at
// height z (equal unless the outline runs horizontally there).
func outlineAt(o []Point, z float64) (Point, Point) {
	if z <= o[0].Z {
		if z < o[0].Z {
			return Point{0, o[0].Z}, Point{0, o[0].Z}
		}
		last := o[0]
		for _, p := range o[1:] {
			if p.Z != o[0].Z {
				break
			}
			last = p
		}
		return o[0], last
	}
	n := len(o)
	if z >= o[n-1].Z {
		first := o[n-1]
		for k := n - 2; k >= 0 && o[k].Z == o[n-1].Z; k-- {
			first = o[k]
		}
		if z > o[n-1].Z {
			return o[n-1], o[n-1]
		}
		return first, o[n-1]
	}
	var first, last Point
	found := false
	for k := 1; k < n; k++ {
		p, q := o[k-1], o[k]
		if q.Z < z || p.Z > z {
			continue
		}
		var pt Point
		switch {
		case p.Z == z:
			pt = p
		case q.Z == z:
			pt = q
		default:
			t := (z - p.Z) / (q.Z - p.Z)
			pt = Point{p.Y + t*(q.Y-p.Y), z}
		}
		if !found {
			first, found = pt, true
		}
		last = pt
	}
	return first, last
}

// DeckEdge returns the deck at side at station i: x, half-breadth and height.
func (h *Hull) DeckEdge(i int) (x, halfBreadth, z float64) {
	st := h.stations[i]
	top := st.Offsets[len(st.Offsets)-1]
	return st.X, top.Y, top.Z
}

// SectionAt returns the hull's section polygon at x, nil outside the hull.
func (h *Hull) SectionAt(x float64) []Point { return h.solid.SectionAt(x) }
