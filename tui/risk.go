package tui

import (
	"math"

	"heelwatch/engine"
)

// derived is what the screen needs of a result beyond the engine's figures,
// worked out once when the result arrives (never in View).
type derived struct {
	// via[i] is the opening through which water would reach compartment i
	// first, -1 if none leads into it; height[i] that opening's height above
	// the water (m, negative immersed).
	via    []int
	height []float64
	next   int // the intact compartment next at risk, -1 if none
	// nearest is the index in Position.Openings of the unprotected opening
	// nearest to immersion (-1 if none); nearestAll counts weathertight ones too.
	nearest    int
	nearestAll int
	flags      []engine.Flag // about the ship: danger, caution, notes
	hand       []engine.Flag // the hand method's caveats, shown with its working
}

// leadsInto returns, for each opening of v, the compartment it leads into:
// the one its leads_to names (engine.Opening.LeadsTo) where the file says.
// Where it does not, the screen's "next at risk" falls back on heelwatch's
// own rule: of the compartments whose plan (x, y) holds the opening and
// whose bottom is below it, the one whose top is highest (the space
// directly under a vent or behind a door); -1 when none is under it. The
// criteria and flags never guess: without leads_to an opening leads to a
// space not modelled.
func leadsInto(v *engine.Vessel) []int {
	out := make([]int, len(v.Openings))
	for k, o := range v.Openings {
		out[k] = -1
		if o.LeadsTo != "" {
			// The file says where it leads (leads_to): no guessing.
			out[k] = v.LeadsToIndex(o)
			continue
		}
		best := math.Inf(-1)
		for i, c := range v.Compartments {
			b := c.Box
			if o.X < b.X0 || o.X > b.X1 || o.Y < b.Y0 || o.Y > b.Y1 || o.Z < b.Z0 {
				continue
			}
			if b.Z1 > best {
				best, out[k] = b.Z1, i
			}
		}
	}
	return out
}

// derive works out the risk marks and the order of the flags of a result.
func derive(v *engine.Vessel, into []int, a *engine.Assessment) derived {
	n := len(v.Compartments)
	d := derived{via: make([]int, n), height: make([]float64, n), next: -1, nearest: -1, nearestAll: -1}
	for i := range d.via {
		d.via[i] = -1
		d.height[i] = math.Inf(1)
	}
	if a == nil {
		return d
	}
	d.flags, d.hand = splitFlags(a.Flags)
	p := a.Position
	if p == nil {
		return d
	}
	for k, oc := range p.Openings {
		if !finite(oc.HeightM) {
			continue
		}
		if d.nearestAll < 0 || oc.HeightM < p.Openings[d.nearestAll].HeightM {
			d.nearestAll = k
		}
		if !oc.Progressive() {
			continue // closed weathertight, or into a space flooded already
		}
		if d.nearest < 0 || oc.HeightM < p.Openings[d.nearest].HeightM {
			d.nearest = k
		}
		if k < len(into) && into[k] >= 0 {
			i := into[k]
			if oc.HeightM < d.height[i] {
				d.height[i], d.via[i] = oc.HeightM, k
			}
		}
	}
	best := math.Inf(1)
	for i := 0; i < n; i++ {
		if i < len(a.Damage) && (a.Damage[i].Open || a.Damage[i].WaterM3 > 0) {
			continue
		}
		if d.via[i] >= 0 && d.height[i] < best {
			best, d.next = d.height[i], i
		}
	}
	return d
}
