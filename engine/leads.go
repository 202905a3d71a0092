package engine

import (
	"fmt"
	"strings"
)

// This file resolves where an opening leads (Opening.LeadsTo) and whether
// it is a point of progressive flooding in a damage state: an opening into
// a compartment already flooded is not; one into a space not modelled is.

// LeadsToIndex returns the index in v.Compartments of the compartment
// opening o leads into, or −1 for a space not modelled.
func (v *Vessel) LeadsToIndex(o Opening) int {
	if o.LeadsTo == "" {
		return -1
	}
	for i, c := range v.Compartments {
		if strings.EqualFold(c.Name, o.LeadsTo) {
			return i
		}
	}
	return -1
}

// intoFlooded reports whether o leads into a compartment flooded under d
// (open to the sea, or holding water).
func (v *Vessel) intoFlooded(o Opening, d Damage) bool {
	i := v.LeadsToIndex(o)
	if i < 0 {
		return false
	}
	s := d.state(i)
	return s.Open || s.WaterM3 > 0
}

// checkLeadsTo returns an error for an opening whose LeadsTo names no
// compartment of v.
func (v *Vessel) checkLeadsTo() error {
	for _, o := range v.Openings {
		if o.LeadsTo != "" && v.LeadsToIndex(o) < 0 {
			return fmt.Errorf("opening %q leads to %q, which is not a compartment of the vessel", o.Name, o.LeadsTo)
		}
	}
	return nil
}
