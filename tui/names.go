package tui

import (
	"heelwatch/engine"
	"heelwatch/report/plaintext"
	"heelwatch/vessels"
)

// plainNames returns a copy of v whose every name (the vessel's, its
// weights', compartments', liquids', openings' and draft marks') has been
// through plaintext.Name, the one sanitiser: the second guard behind the
// vessel reader, which refuses such names, for a vessel built some other
// way. The dashboard shows, logs and reports only the copy, so no name can
// reach the terminal or the log file raw. The geometry is shared, not
// copied; v is not changed.
func plainNames(v *engine.Vessel) *engine.Vessel {
	c := *v
	c.Name = plaintext.Name(v.Name)
	c.Weights = append([]engine.Weight(nil), v.Weights...)
	for i := range c.Weights {
		c.Weights[i].Name = plaintext.Name(c.Weights[i].Name)
	}
	c.Openings = append([]engine.Opening(nil), v.Openings...)
	for i := range c.Openings {
		c.Openings[i].Name = plaintext.Name(c.Openings[i].Name)
		c.Openings[i].Kind = plaintext.Name(c.Openings[i].Kind)
	}
	c.DraftMarks = append([]engine.DraftMark(nil), v.DraftMarks...)
	for i := range c.DraftMarks {
		c.DraftMarks[i].Name = plaintext.Name(c.DraftMarks[i].Name)
	}
	c.Compartments = make([]*engine.Compartment, len(v.Compartments))
	for i, comp := range v.Compartments {
		cc := *comp
		cc.Name = plaintext.Name(comp.Name)
		cc.Use = plaintext.Name(comp.Use)
		if comp.Liquid != nil {
			l := *comp.Liquid
			l.Name = plaintext.Name(l.Name)
			cc.Liquid = &l
		}
		c.Compartments[i] = &cc
	}
	return &c
}

// plainInfo returns info with its free text through the sanitiser (nil
// stays nil).
func plainInfo(info *vessels.Info) *vessels.Info {
	if info == nil {
		return nil
	}
	c := *info
	c.Condition = plaintext.Name(info.Condition)
	c.Description = plaintext.Text(info.Description)
	c.Compartments = append([]vessels.CompartmentInfo(nil), info.Compartments...)
	for i := range c.Compartments {
		c.Compartments[i].Group = plaintext.Name(c.Compartments[i].Group)
		c.Compartments[i].Use = plaintext.Name(c.Compartments[i].Use)
	}
	return &c
}

// plainOptions returns opts with the names it carries through the
// sanitiser (a file name from the command line may hold anything).
func plainOptions(o Options) Options {
	o.VesselName = plaintext.Name(o.VesselName)
	o.VesselFile = plaintext.Name(o.VesselFile)
	return o
}
