package main

import (
	"fmt"
	"math"

	"heelwatch/engine"
)

// hydroRange is the span of even-keel drafts at which heelwatch works and
// compares a hull's hydrostatics: above the keel and up to the lowest deck
// at side. The model's hull is the shell up to the deck edge and nothing
// above it (no bulwark, forecastle or hatch coaming), so above the lowest
// deck at side the deck itself is under water there and the waterplane is
// cut by it: the figures would be the model's, not the ship's, and no
// booklet tabulates them. tables prints this span; verify refuses a draft
// outside it as input it cannot use.
type hydroRange struct {
	KeelM    float64 // the lowest point of the hull above the baseline
	TopM     float64 // the lowest deck at side
	TopXM    float64 // where that deck edge lies, from the aft perpendicular
	DeckMaxM float64 // the highest deck at side (sheer), the hull's top
	FlatDeck bool    // every station has its deck edge at TopM (no sheer)
}

// hydroRangeOf returns h's hydrostatic range.
func hydroRangeOf(h *engine.Hull) hydroRange {
	_, _, zmin, zmax := h.Solid().Extent()
	r := hydroRange{KeelM: zmin, TopM: zmax, DeckMaxM: zmax, FlatDeck: true}
	for i := range h.Stations() {
		x, _, z := h.DeckEdge(i)
		if z < r.TopM {
			r.TopM, r.TopXM = z, x
		}
	}
	for i := range h.Stations() {
		if _, _, z := h.DeckEdge(i); math.Abs(z-r.TopM) > 1e-9 {
			r.FlatDeck = false
		}
	}
	return r
}

// why says where the range ends and why, for a table's heading and the
// note under refused drafts.
func (r hydroRange) why() string {
	if r.FlatDeck {
		return fmt.Sprintf("from the keel (%.3f m) to the deck at side (%.3f m), where the model's hull ends", r.KeelM, r.TopM)
	}
	return fmt.Sprintf("from the keel (%.3f m) to the lowest deck at side (%.3f m, at x = %.1f m): above it the deck is under water there and the model's waterplane is cut by it, for the hull is modelled up to the deck edge only", r.KeelM, r.TopM, r.TopXM)
}

// refusal says why draft T is outside the range ("" when inside).
func (r hydroRange) refusal(T float64) string {
	switch {
	case math.IsNaN(T) || math.IsInf(T, 0):
		return fmt.Sprintf("%g is not a draft", T)
	case !(T > r.KeelM):
		return fmt.Sprintf("%g m is not above the keel (%.3f m)", T, r.KeelM)
	case T > r.DeckMaxM:
		return fmt.Sprintf("%g m is above the hull: its highest deck at side is %.3f m", T, r.DeckMaxM)
	case !r.holds(T):
		return fmt.Sprintf("%g m is above the lowest deck at side (%.3f m, at x = %.1f m)", T, r.TopM, r.TopXM)
	}
	return ""
}

// holds reports whether draft T lies in the range (the top included).
func (r hydroRange) holds(T float64) bool {
	return T > r.KeelM && T <= r.TopM+1e-9
}

// hydrostaticsAt works the hull's hydrostatics at draft T of the range. At
// the hull's very top (a deck with no sheer) the engine has no waterplane
// above the solid, so the figures there are taken one rounding step below:
// the limit from below, which is the deck's own waterplane.
func hydrostaticsAt(v *engine.Vessel, r hydroRange, T float64) (engine.HydroRow, error) {
	at := T
	if at >= r.DeckMaxM {
		at = math.Nextafter(r.DeckMaxM, r.KeelM)
	}
	row, err := engine.Hydrostatics(v.Hull, v.WaterDensity, at)
	row.DraftM = T
	return row, err
}
