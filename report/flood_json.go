package report

import (
	"encoding/json"
	"io"
	"math"

	"heelwatch/engine"
)

// JSON output of heelwatch flood (keys described in the README).

type floodDoc struct {
	Vessel       string        `json:"vessel"`
	VesselFile   string        `json:"vessel_file"`
	Compartment  string        `json:"compartment"`
	Permeability Num           `json:"permeability"`
	CapacityM3   Num           `json:"capacity_m3"`
	Hole         floodHoleDoc  `json:"hole"`
	PumpM3h      Num           `json:"pumps_m3h"`
	PumpsFrom    string        `json:"pumps_from"`
	Open         []string      `json:"open"`
	LimitS       Num           `json:"limit_s"`
	End          string        `json:"end"`
	EndS         Num           `json:"end_s"`
	EndReason    string        `json:"end_reason"`
	EqualiseS    *Num          `json:"equalise_s"`
	SteadyHeadM  Num           `json:"steady_head_m"`
	PumpsHold    bool          `json:"pumps_hold"`
	FinalWaterM3 Num           `json:"final_water_m3"`
	Spills       []SpillDoc    `json:"spills"` // the holed tank's oil or cargo liquid that may escape
	Events       []floodEvDoc  `json:"events"`
	Table        []floodRowDoc `json:"table"`
	Stages       []floodStDoc  `json:"stages"`
	StagesOfM3   Num           `json:"stages_of_m3"`
	Final        floodFinalDoc `json:"final"`
	LostBuoyancy *floodPosDoc  `json:"lost_buoyancy"`
	LBReason     string        `json:"lost_buoyancy_reason"`
	LBWaterM3    Num           `json:"lost_buoyancy_water_m3"`
	FinalDiffM   *Num          `json:"final_difference_m"`
	Trace        []floodRowDoc `json:"trace"`
	Solver       floodSolver   `json:"solver"`
	Version      string        `json:"heelwatch_version"`
	// Compartments: each compartment that took water (network.go).
	Compartments []NetCompDoc    `json:"compartments"`
	Network      *NetworkDoc     `json:"network"` // the run through the ship; null when the water goes nowhere else
	Single       *floodSingleDoc `json:"single"`  // the compartment's own run's end when the network run is made (flood_json_end.go); else null
}

type floodHoleDoc struct {
	AreaM2 Num    `json:"area_m2"`
	XM     Num    `json:"x_m"`
	YM     Num    `json:"y_m"`
	ZM     Num    `json:"z_m"`
	Cd     Num    `json:"cd"`
	From   string `json:"from"`
}

type floodEvDoc struct {
	Kind    string `json:"kind"`
	Name    string `json:"name"`
	TimeS   Num    `json:"time_s"`
	WaterM3 Num    `json:"water_m3"`
	Message string `json:"message"`
}

// floodPosDoc is a position in the run's JSON: every key of solve's
// equilibrium, in the same shape (Equilibrium), and beside them the
// clearances the run watches as plain numbers.
type floodPosDoc struct {
	Equilibrium
	DeckEdgeM     Num `json:"deck_edge_m"`
	MarginLineM   Num `json:"margin_line_m"`
	LowestOpening *struct {
		Name    string `json:"name"`
		HeightM Num    `json:"height_m"`
	} `json:"lowest_opening"`
}

type floodRowDoc struct {
	TimeS     Num            `json:"time_s"`
	WaterM3   Num            `json:"water_m3"`
	InflowM3h Num            `json:"inflow_m3h"`
	PumpedM3h Num            `json:"pumped_m3h"`
	HeadM     Num            `json:"head_m"`
	SoundingM Num            `json:"sounding_m"`
	Event     string         `json:"event"`
	Position  *floodPosDoc   `json:"position"`
	NoEq      string         `json:"no_equilibrium"`
	Criteria  []CriterionDoc `json:"criteria,omitempty"`
}

// floodFinalDoc is the run's last state: a row of the table, and the end
// position in the shape of solve's `equilibrium` (heelwatch conventions;
// its keys absent when there is no floating position).
type floodFinalDoc struct {
	floodRowDoc
	*Equilibrium
}

type floodStDoc struct {
	Fraction Num            `json:"fraction"`
	WaterM3  Num            `json:"water_m3"`
	Reached  bool           `json:"reached"`
	TimeS    *Num           `json:"time_s"`
	Position *floodPosDoc   `json:"position"`
	NoEq     string         `json:"no_equilibrium"`
	Criteria []CriterionDoc `json:"criteria"`
	Strength *StrengthDoc   `json:"strength"` // the hull girder at the stage; null without weight extents
}

type floodSolver struct {
	Steps    int `json:"steps"`
	Rejected int `json:"rejected"`
	Solves   int `json:"solves"`
}

func posDoc(p *engine.Position) *floodPosDoc {
	if p == nil {
		return nil
	}
	d := &floodPosDoc{Equilibrium: *buildEquilibrium(p), DeckEdgeM: Num(p.DeckEdge.HeightM), MarginLineM: Num(p.MarginLine.HeightM)}
	if o, ok := lowestOpening(p); ok {
		d.LowestOpening = &struct {
			Name    string `json:"name"`
			HeightM Num    `json:"height_m"`
		}{o.Name, Num(o.HeightM)}
	}
	return d
}

func rowDoc(s engine.FloodSample) floodRowDoc {
	d := floodRowDoc{TimeS: Num(s.TimeS), WaterM3: Num(s.WaterM3), InflowM3h: Num(s.InflowM3h),
		PumpedM3h: Num(s.PumpedM3h), HeadM: Num(s.HeadM), SoundingM: Num(s.SoundingM),
		Event: s.Event, Position: posDoc(s.Position)}
	if s.NoEq != nil {
		d.NoEq = s.NoEq.Error()
	}
	if s.Position == nil {
		// No floating position: the flows and levels are not known (null).
		nan := Num(math.NaN())
		d.InflowM3h, d.PumpedM3h, d.HeadM, d.SoundingM = nan, nan, nan, nan
	}
	if len(s.Criteria) > 0 {
		d.Criteria = CriterionDocs(s.Criteria)
	}
	return d
}

func numPtr(x float64) *Num {
	n := Num(x)
	return &n
}

func FloodJSON(w io.Writer, f Flood) error {
	r := f.Run
	doc := floodDoc{
		Vessel: r.Vessel, VesselFile: f.VesselFile, Compartment: r.Compartment, Permeability: Num(r.Permeability),
		CapacityM3: Num(r.CapacityM3),
		Hole: floodHoleDoc{AreaM2: Num(r.Hole.AreaM2), XM: Num(r.Hole.XM), YM: Num(r.Hole.YM),
			ZM: Num(r.Hole.ZM), Cd: Num(r.Hole.Cd), From: f.HoleFrom},
		PumpM3h: Num(r.PumpM3h), PumpsFrom: f.PumpsFrom, Open: append([]string{}, f.Open...), LimitS: Num(r.LimitS),
		End: r.End.String(), EndS: Num(r.EndS), EndReason: r.EndReason, Spills: buildSpills(r.Spills),
		SteadyHeadM: Num(r.SteadyHeadM), PumpsHold: r.PumpsHoldLevel, FinalWaterM3: Num(r.FinalWaterM3),
		Events: []floodEvDoc{}, Table: []floodRowDoc{}, Stages: []floodStDoc{}, Trace: []floodRowDoc{},
		StagesOfM3: Num(r.StagesOfM3), Final: floodFinalDoc{rowDoc(r.Final), EquilibriumOf(r.Final.Position)}, LostBuoyancy: posDoc(r.LostBuoyancy),
		LBWaterM3: Num(r.LostBuoyancyWaterM3),
		Solver:    floodSolver{r.Steps, r.Rejected, r.Solves}, Version: f.Version,
	}
	if r.End == engine.FloodEqualised {
		doc.EqualiseS = numPtr(r.EqualiseS)
	}
	if r.LostBuoyancyNoEq != nil {
		doc.LBReason = r.LostBuoyancyNoEq.Error()
	}
	if r.LostBuoyancy != nil && r.Final.Position != nil {
		doc.FinalDiffM = numPtr(r.FinalDiffM)
	}
	for _, e := range r.Events {
		doc.Events = append(doc.Events, floodEvDoc{Kind: e.Kind.String(), Name: e.Name, TimeS: Num(e.TimeS), WaterM3: Num(e.WaterM3), Message: e.Message})
	}
	for _, s := range r.Table {
		doc.Table = append(doc.Table, rowDoc(s))
	}
	for _, s := range r.Trace {
		doc.Trace = append(doc.Trace, rowDoc(s))
	}
	for _, s := range r.Stages {
		st := floodStDoc{Fraction: Num(s.Fraction), WaterM3: Num(s.WaterM3), Reached: s.Reached,
			Position: posDoc(s.Position), Criteria: CriterionDocs(s.Criteria), Strength: StrengthJSON(s.Strength, nil)}
		if s.Reached {
			st.TimeS = numPtr(s.TimeS)
		}
		if s.NoEq != nil {
			st.NoEq = s.NoEq.Error()
		}
		doc.Stages = append(doc.Stages, st)
	}
	doc.Compartments, doc.Network = networkKeys(f)
	networkEnd(&doc, f)
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(doc)
}
