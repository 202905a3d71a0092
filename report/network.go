package report

import (
	"fmt"
	"io"
	"math"
	"strings"

	"heelwatch/engine"
)

// This file says a flooding run through the ship (engine.NetworkReport):
// its JSON form (the flood command's `compartments` and `network` keys)
// and its text.

// NetCompDoc is one compartment that took water during a run: the
// conventions' `compartments` entry.
type NetCompDoc struct {
	Name        string `json:"name"`
	WaterM3     Num    `json:"water_m3"`      // at the end
	FirstWaterS *Num   `json:"first_water_s"` // null if never
	FullS       *Num   `json:"full_s"`        // null if never
	EqualisedS  *Num   `json:"equalised_s"`   // null if never
	CapacityM3  Num    `json:"capacity_m3"`
	StartM3     Num    `json:"start_m3"`
}

// NetworkDoc is a network run.
type NetworkDoc struct {
	End           string        `json:"end"`
	EndS          Num           `json:"end_s"`
	EndReason     string        `json:"end_reason"`
	Final         *Equilibrium  `json:"final"` // the end position, shaped as solve's equilibrium; null if she does not float
	Static        *Equilibrium  `json:"static"`
	StaticChain   string        `json:"static_chain"`
	FinalDiffM    Num           `json:"final_difference_m"` // largest draft difference between final and static
	Paths         []NetPathDoc  `json:"paths"`
	CrossFlooding []NetCrossDoc `json:"cross_flooding"`
	// StaticCrossFlooding: MSC.362(92)'s estimate with the damaged side
	// flooded at once, as solve gives it.
	StaticCrossFlooding []CrossDoc     `json:"static_cross_flooding"`
	Events              []NetEventDoc  `json:"events"`
	Trace               []NetSampleDoc `json:"trace"`
	Stages              []NetStageDoc  `json:"stages"` // 25, 50, 75 and 100 % of the water the ship took in the run
	SeaInM3             Num            `json:"sea_in_m3"`
	PumpedM3            Num            `json:"pumped_m3"`
	Steps               int            `json:"steps"`
	Solves              int            `json:"solves"`
}

// NetStageDoc is an intermediate stage of the run through the ship.
type NetStageDoc struct {
	Fraction Num          `json:"fraction"`
	WaterM3  Num          `json:"water_m3"` // sea water taken in by then, all compartments together
	TimeS    *Num         `json:"time_s"`   // null if the run did not come to it
	Position *Equilibrium `json:"position"` // null without a floating position
}

// NetPathDoc is one way the water moved.
type NetPathDoc struct {
	Kind string `json:"kind"`
	Name string `json:"name"`
	From string `json:"from"`
	To   string `json:"to"`
}

// NetCrossDoc is a cross-flooding fitting's time to equalise in the run.
type NetCrossDoc struct {
	Name          string `json:"name"`
	TimeS         Num    `json:"time_s"` // null if it did not equalise
	LimitS        Num    `json:"limit_s"`
	InstantS      Num    `json:"instant_s"`
	WithinLimit   bool   `json:"within_limit"`
	Instantaneous bool   `json:"instantaneous"`
	Message       string `json:"message"`
}

// NetEventDoc is one event of the run.
type NetEventDoc struct {
	Kind    string `json:"kind"`
	Name    string `json:"name"`
	TimeS   Num    `json:"time_s"`
	Message string `json:"message"`
}

// NetSampleDoc is the water in each compartment (NetworkDoc's order of
// `compartments`) at one time.
type NetSampleDoc struct {
	TimeS   Num   `json:"time_s"`
	WaterM3 []Num `json:"water_m3"`
	HeelDeg Num   `json:"heel_deg"` // null without a floating position
}

func optNum(x float64) *Num {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return nil
	}
	n := Num(x)
	return &n
}

// NetCompartmentDocs returns the `compartments` of a network run.
func NetCompartmentDocs(rep engine.NetworkReport) []NetCompDoc {
	out := []NetCompDoc{}
	for _, c := range rep.Compartments {
		if math.IsNaN(c.FirstWaterS) {
			continue
		}
		out = append(out, NetCompDoc{Name: c.Name, WaterM3: Num(c.WaterM3), FirstWaterS: optNum(c.FirstWaterS), FullS: optNum(c.FullS),
			EqualisedS: optNum(c.EqualisedS), CapacityM3: Num(c.CapacityM3), StartM3: Num(c.StartM3)})
	}
	return out
}

// EquilibriumOf returns p in the shape of solve's `equilibrium`; nil for nil.
func EquilibriumOf(p *engine.Position) *Equilibrium {
	if p == nil {
		return nil
	}
	return buildEquilibrium(p)
}

// BuildNetwork returns the JSON form of a network run.
func BuildNetwork(rep engine.NetworkReport) NetworkDoc {
	d := NetworkDoc{End: rep.End.String(), EndS: Num(rep.EndS), EndReason: rep.EndReason, Final: EquilibriumOf(rep.Final.Position),
		FinalDiffM: Num(rep.FinalDiffM), Paths: []NetPathDoc{}, CrossFlooding: []NetCrossDoc{}, Events: []NetEventDoc{}, Trace: []NetSampleDoc{},
		SeaInM3: Num(rep.SeaInM3), PumpedM3: Num(rep.PumpedM3), Steps: rep.Steps, Solves: rep.Solves}
	if rep.Static != nil {
		d.Static = EquilibriumOf(rep.Static.Position)
	}
	d.StaticCrossFlooding = crossDocsOf(rep.StaticCrossFlooding)
	d.StaticChain = rep.StaticChain
	for _, p := range rep.Paths {
		d.Paths = append(d.Paths, NetPathDoc{p.Kind, p.Name, p.From, p.To})
	}
	for _, c := range rep.CrossFlooding {
		d.CrossFlooding = append(d.CrossFlooding, NetCrossDoc{Name: c.Name, TimeS: Num(c.EqualiseS), LimitS: engine.CrossFloodingLimitS,
			InstantS: engine.CrossFloodingInstantS, WithinLimit: c.WithinTen, Instantaneous: c.Instant, Message: c.Message})
	}
	for _, e := range rep.Events {
		d.Events = append(d.Events, NetEventDoc{e.Kind.String(), e.Name, Num(e.TimeS), e.Message})
	}
	d.Stages = []NetStageDoc{}
	for _, st := range rep.Stages {
		sd := NetStageDoc{Fraction: Num(st.Fraction), WaterM3: Num(st.WaterM3), Position: EquilibriumOf(st.Position)}
		if st.Reached {
			sd.TimeS = optNum(st.TimeS)
		}
		d.Stages = append(d.Stages, sd)
	}
	keep := keptCompartments(rep)
	for _, s := range rep.Trace {
		row := NetSampleDoc{TimeS: Num(s.TimeS), HeelDeg: Num(math.NaN()), WaterM3: []Num{}}
		for _, k := range keep {
			row.WaterM3 = append(row.WaterM3, Num(s.WaterM3[k]))
		}
		if s.Position != nil {
			row.HeelDeg = Num(s.Position.HeelDeg)
		}
		d.Trace = append(d.Trace, row)
	}
	return d
}

// keptCompartments are the indices of the compartments that took water.
func keptCompartments(rep engine.NetworkReport) []int {
	var keep []int
	for k, c := range rep.Compartments {
		if !math.IsNaN(c.FirstWaterS) {
			keep = append(keep, k)
		}
	}
	return keep
}

func durationOrDash(s float64) string {
	if math.IsNaN(s) {
		return "—"
	}
	return Duration(s)
}

// heelDraftCells are a position's heel, draft aft and draft forward as
// table cells, dashes when there is no floating position.
func heelDraftCells(p *engine.Position) []string {
	if p == nil {
		return []string{"—", "—", "—"}
	}
	return []string{num(p.HeelDeg, 2, ""), num(p.DraftAftM, 3, ""), num(p.DraftFwdM, 3, "")}
}

// NetworkText writes the run for a person: the paths, the outcome, each
// compartment's times, the cross-flooding times against the limits, the
// events, the water in each compartment against time and the end beside
// the static spread.
func NetworkText(w io.Writer, rep engine.NetworkReport) error {
	e := &errWriter{w: w}
	e.line()
	e.line("Water spreading through the ship")
	e.line("  (the run above follows the holed compartment alone, as if every connection were shut; here the sea")
	e.line("  comes in through the hole and goes on through the open connections and the openings that go under)")
	if len(rep.Paths) > 0 {
		// The paths the run follows, not the water's: an opening carries
		// water only while it is under (the events say when one does).
		e.line("  Paths it follows (an opening only while it is under water; the events say which carried water):")
	}
	for _, p := range rep.Paths {
		e.line("    ", p.Name, " (", p.Kind, "): ", p.From, " → ", p.To)
	}
	e.line("Outcome: ", FloodHeadline(rep.End), " after ", Duration(rep.EndS), ". ", sentence(rep.EndReason), ".")
	t := table{right: []bool{false, true, true, true, true, true}}
	t.add("compartment", "capacity m³", "first water", "full", "at rest", "water at end m³")
	for _, k := range keptCompartments(rep) {
		c := rep.Compartments[k]
		t.add(c.Name, num(c.CapacityM3, 1, ""), durationOrDash(c.FirstWaterS), durationOrDash(c.FullS), durationOrDash(c.EqualisedS), num(c.WaterM3, 1, ""))
	}
	writeLines(e, t.lines("  "))
	for _, c := range rep.CrossFlooding {
		if math.IsNaN(c.EqualiseS) {
			e.line("  Cross-flooding in this run: ", c.Message, ".")
			continue
		}
		e.line("  Cross-flooding in this run: ", c.Name, " equalises in ", Duration(c.EqualiseS), ", ", engine.CrossFloodingVerdict(c.EqualiseS),
			" (60 s or less counts as instantaneous, MSC.1/Circ.1461).")
	}
	for _, c := range rep.StaticCrossFlooding {
		e.line("  With the damaged side flooded at once: ", CrossFloodingWords(c), ".")
	}
	e.line("Events")
	for _, ev := range rep.Events {
		e.line("  ", Duration(ev.TimeS), "  ", ev.Message)
	}
	e.line("Water against time (m³)")
	keep := keptCompartments(rep)
	t = table{}
	head := []string{"time"}
	for _, k := range keep {
		head = append(head, rep.Compartments[k].Name)
	}
	t.add(append(head, "heel °", "T aft m", "T fwd m")...)
	t.right = make([]bool, len(head)+3)
	for i := range t.right {
		t.right[i] = i > 0
	}
	for _, s := range rep.Table {
		row := []string{Duration(s.TimeS)}
		for _, k := range keep {
			row = append(row, num(s.WaterM3[k], 1, ""))
		}
		t.add(append(row, heelDraftCells(s.Position)...)...)
	}
	writeLines(e, t.lines("  "))
	e.line("Stages (of the water the ship took in)")
	t = table{right: []bool{true, true, true, true, true, true}}
	t.add("stage", "taken in m³", "reached", "heel °", "T aft m", "T fwd m")
	for _, sg := range rep.Stages {
		row := []string{num(100*sg.Fraction, 0, "%"), num(sg.WaterM3, 1, ""), "—"}
		if sg.Reached {
			row[2] = Duration(sg.TimeS)
		}
		t.add(append(row, heelDraftCells(sg.Position)...)...)
	}
	writeLines(e, t.lines("  "))
	if st := rep.Static; st != nil && st.Position != nil && rep.Final.Position != nil {
		f, s := rep.Final.Position, st.Position
		verdict := "within"
		if rep.FinalDiffM > 0.005 {
			verdict = "NOT within"
		}
		e.line("End beside the static spread (", strings.Join(staticNames(rep), ", "), " open to the sea): drafts aft ",
			num(f.DraftAftM, 3, ""), " / ", num(s.DraftAftM, 3, ""), " m, forward ", num(f.DraftFwdM, 3, ""), " / ", num(s.DraftFwdM, 3, ""),
			" m; largest difference ", num(1000*rep.FinalDiffM, 1, "mm"), ", ", verdict, " 5 mm.")
	}
	e.line("  Sea in through holes and openings ", num(rep.SeaInM3, 1, "m³"), ", pumped out ", num(rep.PumpedM3, 1, "m³"), ".")
	return e.err
}

// staticNames names the compartments open in the static spread.
func staticNames(rep engine.NetworkReport) []string { return rep.StaticFlooded }

// singleCompartments is the `compartments` key of a run through one
// compartment only.
func singleCompartments(r engine.FloodReport) []NetCompDoc {
	c := NetCompDoc{Name: r.Compartment, WaterM3: Num(r.FinalWaterM3), CapacityM3: Num(r.CapacityM3), StartM3: Num(r.Start.WaterM3)}
	if r.FinalWaterM3 > r.Start.WaterM3 || r.Start.WaterM3 > 0 {
		c.FirstWaterS = numPtr(0)
	}
	if r.End == engine.FloodFull {
		c.FullS = numPtr(r.EndS)
	}
	if r.End == engine.FloodEqualised {
		c.EqualisedS = optNum(r.EqualiseS)
	}
	return []NetCompDoc{c}
}

// networkKeys returns the flood JSON's `compartments` and `network` keys.
func networkKeys(f Flood) ([]NetCompDoc, *NetworkDoc) {
	if f.Network == nil {
		return singleCompartments(f.Run), nil
	}
	n := BuildNetwork(*f.Network)
	return NetCompartmentDocs(*f.Network), &n
}

// CrossFloodingWords says an MSC.362(92) estimate: the fitting, its time
// beside the limits, and the figures that went in.
func CrossFloodingWords(c engine.CrossFloodingEstimate) string {
	return fmt.Sprintf("%s equalises in %s, %s (MSC.362(92): T = 2W/(S·F·√(2g·H0)), W %.1f m³, S %.3f m², F %.2f, H0 %.2f m)",
		c.Name, Duration(c.TimeS), engine.CrossFloodingVerdict(c.TimeS), c.VolumeM3, c.AreaM2, c.F, c.HeadM)
}
