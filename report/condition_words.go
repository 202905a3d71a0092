package report

import (
	"math"

	"heelwatch/engine"
)

// This file says the headline figures of a floating position the same way
// in every format: the upright GM (and a loll), the GM where she lies, the
// displacement on the lost-buoyancy basis and the line along the ship's
// side that is watched (deck edge, or margin line on a passenger ship).

// GMUprightWords says the upright GM: "1.000 m", or, when it is negative
// and she lies heeled, "−0.570 m: LOLL (not a list)" — a loll is corrected by
// lowering G, never by moving weight to the high side.
func GMUprightWords(p *engine.Position) string {
	s := num(p.GMUprightM, 3, "m")
	switch {
	case p.IsLoll():
		s += ": LOLL, not a list (lower G; do not shift weight to the high side)"
	case p.GMUprightM < 0:
		s += ": NEGATIVE, unstable upright"
	}
	return s
}

// GMAtRestWords says the GM where she lies: the GZ curve's slope at her
// heel, "1.077 m/rad at 11.9° heel"; upright it equals the upright GM.
func GMAtRestWords(p *engine.Position) string {
	s := num(p.GMAtRestM, 3, "m/rad")
	if math.Abs(p.HeelDeg) < 0.05 {
		return s + " (upright: the same)"
	}
	return s + " at " + num(math.Abs(p.HeelDeg), 1, "°") + " heel (GZ slope)"
}

// Labels of the position's figures.
const (
	LabelGMUpright = "GM upright"
	LabelGMAtRest  = "GM where she lies"
)

// displacementRows returns the displacement's label and value. On the
// lost-buoyancy basis it is the ship's weight without the sea water in
// flooded spaces (open to the sea, or held as in a flooding stage): said
// so, with that water beside it.
func displacementRows(p *engine.Position) [][2]string {
	w := p.OpenWaterT + p.HeldWaterT
	if !(w > 0) {
		return [][2]string{{"displacement", num(p.DisplacementT, 1, "t")}}
	}
	return [][2]string{{"displacement", num(p.DisplacementT-p.HeldWaterT, 1, "t") +
		" ship's weight, without the " + num(w, 1, "t") + " of sea water in flooded spaces"}}
}

// deckLineRows returns the rows for the lines along the side: the deck
// edge (the bulkhead deck at side) always, the margin line only on a
// passenger ship (SOLAS 1974 II-1 definitions; a cargo ship has none).
func deckLineRows(p *engine.Position, v *engine.Vessel) [][2]string {
	if v != nil && !v.Passenger() {
		return [][2]string{{"deck edge (bulkhead deck)", clearanceWords(p.DeckEdge)}}
	}
	return [][2]string{{"deck edge", clearanceWords(p.DeckEdge)}, {"margin line", clearanceWords(p.MarginLine)}}
}

// kmUpright is the KM that goes with the upright GM: KG + FSC + GM upright
// (the basis of GMUprightM: with floodwater held the GM is per the ship's
// weight, so this KM is the one that gives it).
func kmUpright(p *engine.Position) float64 { return p.KGM + p.FSCM + p.GMUprightM }
