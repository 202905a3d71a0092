package report

import (
	"math"
	"strings"

	"heelwatch/engine"
)

// floodSingleDoc is the end of the compartment's own run (every connection
// shut), kept under `single` when the run through the ship is made and the
// top-level end keys describe that run's end instead.
type floodSingleDoc struct {
	End          string        `json:"end"`
	EndS         Num           `json:"end_s"`
	EndReason    string        `json:"end_reason"`
	EqualiseS    *Num          `json:"equalise_s"`
	FinalWaterM3 Num           `json:"final_water_m3"`
	Final        floodFinalDoc `json:"final"`
}

// networkEnd makes the top-level end keys of doc (end, end_s, end_reason,
// equalise_s, final_water_m3, final) describe the end of the run through
// the ship when f has one, moving the compartment's own run's to `single`.
// The final row then has the holed compartment's water, and the flows of
// the single hole (inflow, pumped, head, sounding) are null: the network's
// paths are in `network`.
func networkEnd(doc *floodDoc, f Flood) {
	n := f.Network
	if n == nil {
		return
	}
	doc.Single = &floodSingleDoc{End: doc.End, EndS: doc.EndS, EndReason: doc.EndReason, EqualiseS: doc.EqualiseS,
		FinalWaterM3: doc.FinalWaterM3, Final: doc.Final}
	doc.End, doc.EndS, doc.EndReason = n.End.String(), Num(n.EndS), n.EndReason
	doc.EqualiseS = nil
	if n.End == engine.FloodEqualised {
		doc.EqualiseS = numPtr(n.EndS)
	}
	water := math.NaN()
	for i, c := range n.Compartments {
		if strings.EqualFold(c.Name, f.Run.Compartment) && i < len(n.Final.WaterM3) {
			water = n.Final.WaterM3[i]
		}
	}
	doc.FinalWaterM3 = Num(water)
	nan := Num(math.NaN())
	row := floodRowDoc{TimeS: Num(n.Final.TimeS), WaterM3: Num(water), InflowM3h: nan, PumpedM3h: nan, HeadM: nan, SoundingM: nan,
		Event: "end " + n.End.String(), Position: posDoc(n.Final.Position)}
	if n.Final.NoEq != nil {
		row.NoEq = n.Final.NoEq.Error()
	}
	doc.Final = floodFinalDoc{row, EquilibriumOf(n.Final.Position)}
}
