package main

import (
	"heelwatch/engine"
)

// This file runs the flood command's flooding through the ship: when water
// can go on from the holed compartment (an open connection joins it to
// others, or the run put an opening that leads into a compartment under
// water), the network run follows every compartment it reaches.

// floodNetwork runs case c through the ship, or returns nil when the
// water cannot go beyond the holed compartment (single is c's own run).
func floodNetwork(c engine.FloodCase, single engine.FloodReport) (*engine.NetworkReport, error) {
	v := c.Vessel
	spreads := len(engine.ConnectedTo(v, c.Base, c.Compartment)) > 0
	for _, e := range single.Events {
		if e.Kind != engine.OpeningReached {
			continue
		}
		for _, o := range v.Openings {
			if o.Name == e.Name && o.LeadsTo != "" {
				spreads = true
			}
		}
	}
	if !spreads {
		return nil, nil
	}
	nc := engine.NetworkCase{Vessel: v, Base: c.Base, Holes: []engine.NetHole{{Compartment: c.Compartment, Hole: c.Hole}}, LimitS: c.LimitS}
	for _, p := range c.Pumps {
		nc.Pumps = append(nc.Pumps, engine.NetPump{Compartment: c.Compartment, CapacityM3h: p.CapacityM3h})
	}
	rep, err := engine.RunNetwork(nc, nil)
	if err != nil {
		return nil, err
	}
	return &rep, nil
}
