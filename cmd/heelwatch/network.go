package main

import (
	"math"

	"heelwatch/engine"
	"heelwatch/report"
)

// This file runs the flood command's flooding through the ship: when water
// can go on from the holed compartment (an open connection joins it to
// others, or the run put an opening that leads into a compartment under
// water), the network run follows every compartment it reaches.

// floodNetwork runs the network case of the flood command, or returns nil
// when the water cannot go beyond the holed compartment.
func floodNetwork(v *engine.Vessel, base engine.Damage, ci int, hole engine.Hole, pumps []engine.Pump, limitS float64, single engine.FloodReport) (*engine.NetworkReport, error) {
	spreads := len(engine.ConnectedTo(v, base, ci)) > 0
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
	c := engine.NetworkCase{Vessel: v, Base: base, Holes: []engine.NetHole{{Compartment: ci, Hole: hole}}, LimitS: limitS}
	for _, p := range pumps {
		c.Pumps = append(c.Pumps, engine.NetPump{Compartment: ci, CapacityM3h: p.CapacityM3h})
	}
	rep, err := engine.RunNetwork(c, nil)
	if err != nil {
		return nil, err
	}
	return &rep, nil
}

// singleCompartments is the `compartments` key of a run through one
// compartment only.
func singleCompartments(r engine.FloodReport) []report.NetCompDoc {
	num := func(x float64) *report.Num { n := report.Num(x); return &n }
	c := report.NetCompDoc{Name: r.Compartment, WaterM3: report.Num(r.FinalWaterM3), CapacityM3: report.Num(r.CapacityM3),
		StartM3: report.Num(r.Start.WaterM3)}
	if r.FinalWaterM3 > r.Start.WaterM3 || r.Start.WaterM3 > 0 {
		c.FirstWaterS = num(0)
	}
	if r.End == engine.FloodFull {
		c.FullS = num(r.EndS)
	}
	if r.End == engine.FloodEqualised && !math.IsNaN(r.EqualiseS) {
		c.EqualisedS = num(r.EqualiseS)
	}
	return []report.NetCompDoc{c}
}

// networkKeys fills the flood JSON's `compartments` and `network` keys.
func networkKeys(doc *floodDoc, fr floodRun) {
	if fr.net == nil {
		doc.Compartments = singleCompartments(fr.rep)
		return
	}
	doc.Compartments = report.NetCompartmentDocs(*fr.net)
	n := report.BuildNetwork(*fr.net)
	doc.Network = &n
}
