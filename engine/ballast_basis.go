package engine

import "fmt"

// This file says, when a holed tank held water ballast, on what basis the
// GM shown is worked, so that an officer is not surprised by a GM that
// rises when nothing about her has moved.
//
// With the lost-buoyancy method a compartment open to the sea is no part of
// the ship: the sea water in it belongs to the sea, and the ballast it held
// (Vessel.Loading drops a holed tank's contents, spill.go) leaves the
// ship's weight. A full sea-water ballast tank holed under water therefore
// changes nothing in how she floats — drafts, heel and trim stay — but the
// displacement Δ she is worked with falls by the ballast's mass and her GM
// rises in the same proportion: the righting moment Δ·GM at small angles is
// the same on either basis (the added-weight method keeps the water in Δ
// and gives the lower GM). The flag states the mass and the basis.

// FlagBallastHoled is the flag code for a holed tank that held water.
const FlagBallastHoled = "ballast-holed"

// ballastBasisFlags returns one note per tank open to the sea under d that
// held water (IsWater) with some mass: the mass that left the ship's
// weight and the basis of the GM shown. The note is kept to about two
// lines of the dashboard's figures column.
func ballastBasisFlags(v *Vessel, d Damage) []Flag {
	var out []Flag
	for i, c := range v.Compartments {
		if !d.state(i).Open || c.Liquid == nil || !IsWater(c.Liquid.Name) {
			continue
		}
		m, _, _, _, _ := v.TankContents(i)
		if !(m > 0.05) {
			continue
		}
		// Pressed full, the water stays where it was: the righting moment
		// Δ·GM is the same on either basis. Part full, its free surface
		// no longer counts either (the space is the sea's).
		tail := " (Δ·GM unchanged)"
		if _, _, _, _, fsm := v.TankContents(i); fsm > 0 {
			tail = ", without its free surface"
		}
		out = append(out, Flag{Code: FlagBallastHoled, Severity: Info, Message: fmt.Sprintf(
			"%s is holed: its %.0f t of %s left the ship weight; GM is of the lighter ship%s.",
			c.Name, m, c.Liquid.Name, tail)})
	}
	return out
}
