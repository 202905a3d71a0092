package engine

import (
	"fmt"
	"strings"
)

// This file lists what escapes from a holed tank that does not hold water:
// the oil or cargo liquid the sea may carry off, and the caution to report
// the pollution.
//
// The rule heelwatch uses is the simpler one: a tank open to the sea (or
// holding floodwater) has lost all its contents (Vessel.Loading), and sea
// water fills μ of it to the sea's level. The hydrostatic balance of oil
// over sea water (references.md, "oil in a tank holed below the water": the
// oil escapes until its pressure at the hole equals the sea's, so some may
// stay aboard above a hole low in the tank) would keep part of it aboard;
// the rule taken errs towards more lost and says so.

// FlagSpill is the flag code for the contents of a holed tank that may be
// escaping to the sea.
const FlagSpill = "spill"

// SpillRule says in words how a holed tank's contents are counted.
const SpillRule = "all of a holed tank's contents are taken as lost to the sea and sea water in their place (the simpler rule; the balance of oil over sea water would keep some aboard)"

// Spill is the non-water contents of a holed tank that may escape.
type Spill struct {
	Compartment string
	Liquid      string
	MassT       float64 // t, as loaded
}

// IsWater reports whether a liquid named so is water or water ballast
// (not an oil, sludge, bilge water or sewage): what may be pumped to the
// sea and what does not pollute when a tank is holed.
func IsWater(liquid string) bool {
	name := strings.ToLower(liquid)
	oily := strings.Contains(name, "oil") || strings.Contains(name, "sludge") ||
		strings.Contains(name, "bilge") || strings.Contains(name, "sewage")
	return !oily && (strings.Contains(name, "ballast") || strings.Contains(name, "water"))
}

// Spills returns the contents of the tanks holed under d (open to the sea,
// or holding floodwater) that are not water, in the order of
// v.Compartments; nil when there are none.
func Spills(v *Vessel, d Damage) []Spill {
	var out []Spill
	for i, c := range v.Compartments {
		s := d.state(i)
		if !(s.Open || s.WaterM3 > 0) || c.Liquid == nil || IsWater(c.Liquid.Name) {
			continue
		}
		if m, _, _, _, _ := v.TankContents(i); m > 0 {
			out = append(out, Spill{Compartment: c.Name, Liquid: c.Liquid.Name, MassT: m})
		}
	}
	return out
}

// spillFlags returns one caution per spill: what may be escaping, how it
// is counted, and that the pollution is to be reported.
func spillFlags(sp []Spill) []Flag {
	var out []Flag
	for _, s := range sp {
		out = append(out, Flag{Code: FlagSpill, Severity: Caution, Message: fmt.Sprintf(
			"%s is holed: its %.1f t of %s may be escaping to the sea. Report the pollution as the ship's oil pollution emergency plan requires. heelwatch counts %s.",
			s.Compartment, s.MassT, s.Liquid, SpillRule)})
	}
	return out
}

// spills returns the flooding run's holed tank's contents when they are
// not water: the hole lets them out as the sea comes in.
func (r *FloodRun) spills() []Spill {
	d := make(Damage, len(r.v.Compartments))
	d[r.ci].Open = true
	return Spills(r.v, d)
}
