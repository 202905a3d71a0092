package engine

import (
	"errors"
	"fmt"
	"math"
)

// This file holds the flooding case of water spreading through the ship
// over time and the flow through each way water can go: holes in the
// shell, connections between compartments and openings that lead into
// them. The run itself is in network_run.go.

// NetHole is a hole in the shell into one compartment.
type NetHole struct {
	Compartment int
	Hole        Hole
}

// NetPump is pumping capacity on one compartment.
type NetPump struct {
	Compartment int
	CapacityM3h float64
}

// NetworkCase is a flooding run through the ship: the sea comes in through
// Holes and spreads through the vessel's open connections and the openings
// that lead into compartments, against Pumps.
type NetworkCase struct {
	Vessel *Vessel
	// Base is the state of every compartment at time zero (nil: intact).
	// A compartment Open in it stands at the sea's level all along; water
	// a compartment holds in it (WaterM3) is where the run starts.
	Base   Damage
	Holes  []NetHole
	Pumps  []NetPump
	LimitS float64 // s; 0 means DefaultFloodLimitS
}

// flowPath is one way water moves: a hole or an opening from the sea
// (a = −1), or a connection between two compartments. A side that is
// open to the sea in the base state stands at the sea's level.
type flowPath struct {
	kind    string // "hole", "opening", or the connection's kind
	name    string
	a, b    int // node indices (−1: the sea)
	x, y, z float64
	area    float64 // m²
	height  float64 // m above z; 0: a small hole at the point
	coef    float64 // Cd for a hole or opening, F = 1/√(1+k) for a connection
	conn    int     // index into Vessel.Connections, −1 otherwise
	seaB    bool    // b is a compartment open to the sea (its level is the sea's)
	seaBIx  int     // that compartment's index when seaB
}

// pathFlow returns the flow from side a to side b, m³/s (negative: from b
// to a), given the depth of the path's lowest point below the water on
// each side (negative: the water is below it), by the orifice law with
// both levels, Q = c·A·√(2g·Δh), and a weir law while the opening is
// partly wetted.
//
// For a path of height H > 0 (a rectangle of width w = A/H standing on its
// sill) with the upper side's water Hu above the sill and the lower side's
// Hd (Hu > Hd), the speed at a height z above the sill is √(2g·(Hu − z))
// where the lower side is dry there and √(2g·(Hu − Hd)) where it is wet
// (Bernoulli along each streamline; the quasi-static room-to-room model of
// Braidotti & Mauro 2020, method only), so
//
//	Q = c·w·√(2g)·[ √(Hu−Hd)·min(Hd⁺, H) + ⅔·((Hu − max(Hd⁺, 0))^{3/2} − (Hu − min(Hu, H))^{3/2}) ]
//
// with Hd⁺ = max(Hd, 0) and the second term only where min(Hu, H) > Hd⁺.
// Fully submerged (Hd ≥ H) this is c·A·√(2g(Hu−Hd)); with the lower side
// dry and Hu ≤ H it is the weir law ⅔·c·w·√(2g)·Hu^{3/2}. A small hole
// (H = 0) is the orifice law at its point with Δh = Hu⁺ − Hd⁺.
//
// Below 1 mm of head (FloodHeadTolM, where the run calls the levels met)
// the √Δh is taken linear in Δh, through the same value at 1 mm: the
// orifice law's infinite slope at Δh = 0 would otherwise hold the
// integrator to steps of a second while two levels tied by a wide door
// creep together.
func pathFlow(p *flowPath, da, db float64) float64 {
	sign := 1.0
	hu, hd := da, db
	if db > da {
		sign, hu, hd = -1, db, da
	}
	if !(hu > 0) {
		return 0
	}
	g2 := math.Sqrt(2 * StandardGravity)
	if p.height <= 0 {
		dh := hu - math.Max(hd, 0)
		return sign * p.coef * p.area * g2 * rootHead(dh)
	}
	H := p.height
	w := p.area / H
	hdp := math.Max(hd, 0)
	var q float64
	if hdp > 0 {
		q = rootHead(hu-hd) * math.Min(hdp, H)
	}
	if top := math.Min(hu, H); top > hdp {
		q += 2.0 / 3 * (math.Pow(hu-hdp, 1.5) - math.Pow(hu-top, 1.5))
	}
	return sign * p.coef * w * g2 * q
}

// rootHead is √h for h ≥ 1 mm and h/√(1 mm) below (see pathFlow).
func rootHead(h float64) float64 {
	if h >= FloodHeadTolM {
		return math.Sqrt(h)
	}
	return math.Max(h, 0) / math.Sqrt(FloodHeadTolM)
}

// networkNodes returns the compartments the water can reach from the
// holes: the holed ones, every compartment an opening leads into, and all
// that an open connection joins to one of those; and those holding water
// at the start (not those open to the
// sea in the base state, which stand at the sea's level).
func networkNodes(v *Vessel, base Damage, holes []NetHole) []int {
	var start []int
	for _, h := range holes {
		start = append(start, h.Compartment)
	}
	for _, o := range v.Openings {
		if j := v.LeadsToIndex(o); j >= 0 && !o.Weathertight {
			start = append(start, j)
		}
	}
	for i := range v.Compartments {
		if base.state(i).WaterM3 > 0 {
			start = append(start, i)
		}
	}
	var keep []int
	for _, i := range start {
		if !base.state(i).Open {
			keep = append(keep, i)
		}
	}
	return networkNodesFrom(v, base, keep)
}

// checkNetworkCase checks c and fills in the defaults.
func checkNetworkCase(c *NetworkCase) error {
	v := c.Vessel
	if v == nil {
		return errors.New("flooding: no vessel")
	}
	n := len(v.Compartments)
	if err := CheckDamage(v, c.Base); err != nil {
		return fmt.Errorf("flooding: %v", err)
	}
	water := false
	for _, s := range c.Base {
		water = water || s.WaterM3 > 0
	}
	if len(c.Holes) == 0 && !water {
		return errors.New("flooding: no hole and no water inside: nothing to flood")
	}
	for k := range c.Holes {
		h := &c.Holes[k]
		if h.Compartment < 0 || h.Compartment >= n {
			return fmt.Errorf("flooding: compartment index %d out of range (the vessel has %d)", h.Compartment, n)
		}
		name := v.Compartments[h.Compartment].Name
		if !(h.Hole.AreaM2 > 0) || math.IsInf(h.Hole.AreaM2, 0) {
			return fmt.Errorf("flooding %q: hole area %v: must be a positive finite number of m²", name, h.Hole.AreaM2)
		}
		for _, q := range []float64{h.Hole.XM, h.Hole.YM, h.Hole.ZM} {
			if math.IsNaN(q) || math.IsInf(q, 0) {
				return fmt.Errorf("flooding %q: hole position: not finite", name)
			}
		}
		if h.Hole.Cd == 0 {
			h.Hole.Cd = DefaultDischargeCoefficient
		}
		if !(h.Hole.Cd > 0 && h.Hole.Cd <= 1) {
			return fmt.Errorf("flooding %q: discharge coefficient %v is outside (0, 1]", name, h.Hole.Cd)
		}
		if c.Base.state(h.Compartment).Open {
			return fmt.Errorf("flooding %q: the compartment is already open to the sea in the base damage state", name)
		}
	}
	for _, p := range c.Pumps {
		if p.Compartment < 0 || p.Compartment >= n {
			return fmt.Errorf("flooding: pump on compartment index %d out of range", p.Compartment)
		}
		if !(p.CapacityM3h >= 0) || math.IsInf(p.CapacityM3h, 0) {
			return fmt.Errorf("flooding %q: pump capacity %v m³/h: must be a finite number, zero or more", v.Compartments[p.Compartment].Name, p.CapacityM3h)
		}
	}
	if c.LimitS == 0 {
		c.LimitS = DefaultFloodLimitS
	}
	if !(c.LimitS > 0) || math.IsInf(c.LimitS, 0) {
		return fmt.Errorf("flooding: time limit %v s: must be a positive finite number", c.LimitS)
	}
	base := make(Damage, n)
	copy(base, c.Base)
	c.Base = base
	return nil
}

// ConnectedTo returns the compartments joined to compartment ci through
// open connections, directly or through others (ci itself left out, and
// those open to the sea in base: they stand at the sea's level).
func ConnectedTo(v *Vessel, base Damage, ci int) []int {
	nodes := networkNodesFrom(v, base, []int{ci})
	return nodes[1:]
}

// networkNodesFrom is the closure of start through open connections.
func networkNodesFrom(v *Vessel, base Damage, start []int) []int {
	in := map[int]bool{}
	var nodes []int
	for _, i := range start {
		if !in[i] {
			in[i] = true
			nodes = append(nodes, i)
		}
	}
	for changed := true; changed; {
		changed = false
		for _, c := range v.Connections {
			if !c.Open {
				continue
			}
			for _, e := range [][2]int{{c.From, c.To}, {c.To, c.From}} {
				if in[e[0]] && !in[e[1]] && !base.state(e[1]).Open {
					in[e[1]] = true
					nodes = append(nodes, e[1])
					changed = true
				}
			}
		}
	}
	return nodes
}
