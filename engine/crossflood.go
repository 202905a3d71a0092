package engine

import (
	"fmt"
	"math"
)

// CrossFloodingEstimate is the time a cross-flooding fitting takes to
// equalise in the final state of progressive flooding, by the method of
// IMO Res. MSC.362(92): T = 2W/(S·F·√(2g·H0)), with W the volume of water
// that passes the fitting (what the far side holds at the end), S its
// area, F = 1/√(1+k) its speed reduction and H0 the head at the start of
// cross-flooding (the depth of the fitting under the water on the flooded
// side, the far side dry). The closed form takes the head falling from
// H0 to 0 as the √h law gives it for two equal tanks (derived in
// network_test.go); the run over time (NetworkRun) gives the time for the
// actual ship.
type CrossFloodingEstimate struct {
	Name       string
	Connection int
	HeadM      float64 // H0
	VolumeM3   float64 // W
	AreaM2     float64 // S
	F          float64
	TimeS      float64
	Instant    bool // T ≤ 60 s: counts as instantaneous (MSC.1/Circ.1461 §9.2.2)
	WithinTen  bool // T ≤ 600 s (SOLAS II-1 Reg. 7-2)
	Message    string
}

// CrossFloodingTimes returns an estimate for each cross-flooding fitting
// through which the water spread in sp (none when she does not float at
// the end).
func CrossFloodingTimes(v *Vessel, sp Spread) []CrossFloodingEstimate {
	if sp.Position == nil {
		return nil
	}
	var out []CrossFloodingEstimate
	for _, l := range sp.Links {
		if l.Connection < 0 {
			continue
		}
		c := v.Connections[l.Connection]
		if c.Kind != CrossFloodingKind || !(l.DepthM > 0) {
			continue
		}
		mu := v.Permeability(sp.Damage, l.Compartment)
		w := mu * v.Compartments[l.Compartment].solid.Below(sp.Position.Plane).V
		f := c.SpeedFactor()
		t := 2 * w / (c.AreaM2 * f * math.Sqrt(2*StandardGravity*l.DepthM))
		e := CrossFloodingEstimate{Name: c.Name, Connection: l.Connection, HeadM: l.DepthM, VolumeM3: w, AreaM2: c.AreaM2, F: f, TimeS: t,
			Instant: t <= CrossFloodingInstantS, WithinTen: t <= CrossFloodingLimitS}
		e.Message = fmt.Sprintf("%s equalises in %.0f s, %s (MSC.362(92): W %.1f m³, S %.3f m², F %.2f, H0 %.2f m)",
			c.Name, t, CrossFloodingVerdict(t), w, c.AreaM2, f, l.DepthM)
		out = append(out, e)
	}
	return out
}
