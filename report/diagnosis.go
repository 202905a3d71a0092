package report

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strings"
	"time"

	"heelwatch/engine"
)

// Diagnosis is a diagnosis of readings with what a record needs: the
// vessel, the readings, when and by which version. Trend is nil with a
// single reading (TrendNote says why there is none).
type Diagnosis struct {
	VesselName string
	VesselFile string
	Vessel     *engine.Vessel
	Readings   []engine.Reading
	Result     engine.Diagnosis
	Trend      *engine.Trend
	TrendNote  string
	Made       time.Time
	Version    string
}

// DiagnosisDoc is the JSON object of `heelwatch diagnose`. explanations and
// trend are fixed by heelwatch's conventions; the rest is heelwatch's own
// (README, "Readings and diagnosis").
type DiagnosisDoc struct {
	Vessel       string           `json:"vessel"`
	Explanations []ExplanationDoc `json:"explanations"`
	Trend        *TrendDoc        `json:"trend"`

	Fits          bool              `json:"fits"`
	Verdict       string            `json:"verdict"`
	Tellers       []string          `json:"tell_apart"`
	Disagreements []DisagreementDoc `json:"disagreements"`
	Readings      int               `json:"readings"`
	Explained     Num               `json:"explained_minutes"`       // the reading explained: the latest
	MarksSurvey   *SurveyDoc        `json:"marks_to_perpendiculars"` // the latest reading's marks carried to the perpendiculars; null if they cannot be
	Without       *ExplanationDoc   `json:"without_disagreeing"`     // the best without the readings that disagree, when nothing fits with them; null otherwise
	Searched      int               `json:"searched"`
	NotSearched   []string          `json:"not_searched"`
	TrendNote     string            `json:"trend_note"`
	VesselFile    string            `json:"vessel_file"`
	Made          string            `json:"made"`
	Version       string            `json:"heelwatch_version"`
}

// ExplanationDoc is one explanation.
type ExplanationDoc struct {
	Flooded      []string       `json:"flooded"`
	WaterM3      map[string]Num `json:"water_m3"`
	DraftRMSM    Num            `json:"draft_rms_m"`
	HeelErrorDeg Num            `json:"heel_error_deg"` // read − predicted

	LevelRMSM    Num            `json:"level_rms_m"`
	LevelsM      map[string]Num `json:"levels_m"`    // soundings the explanation predicts
	OpenToSea    []string       `json:"open_to_sea"` // level with the sea outside
	Full         []string       `json:"full"`
	Misfit       Num            `json:"misfit"` // Σ (error/σ)²
	Score        Num            `json:"score"`  // misfit + 4 per compartment
	Permeability Num            `json:"fitted_permeability"`
	Equilibrium  *Equilibrium   `json:"equilibrium"`
	DraftMarks   []MarkDoc      `json:"draft_marks"` // predicted at the marks read
}

// DisagreementDoc is a reading that disagrees with the others of its moment.
type DisagreementDoc struct {
	Minutes  Num    `json:"minutes"`
	What     string `json:"what"`
	Read     Num    `json:"read"`
	Expected Num    `json:"expected"`
	Message  string `json:"message"`
}

// TrendDoc is the trend: inflow, equivalent hole and projection.
type TrendDoc struct {
	InflowM3h     Num          `json:"inflow_m3h"`
	HoleAreaM2    Num          `json:"hole_area_m2"`
	TimeToDeckS   Num          `json:"time_to_deck_edge_s"` // null if never
	Final         *Equilibrium `json:"final"`
	InflowSDM3h   Num          `json:"inflow_sd_m3h"`
	HoleAreaSDM2  Num          `json:"hole_area_sd_m2"`
	Compartment   string       `json:"compartment"`
	HoleAssumed   bool         `json:"hole_assumed"` // at the lowest point of the shell
	HoleXM        Num          `json:"hole_x_m"`
	HoleYM        Num          `json:"hole_y_m"`
	HoleZM        Num          `json:"hole_z_m"`
	Cd            Num          `json:"cd"`
	HeadM         Num          `json:"head_m"`
	Minutes       []Num        `json:"minutes"`
	WaterM3       []Num        `json:"water_m3"`
	WaterSDM3     []Num        `json:"water_sd_m3"`
	DeckRangeS    [2]Num       `json:"time_to_deck_edge_range_s"` // with the hole one standard error larger, smaller
	TimeToOpening Num          `json:"time_to_opening_s"`
	Opening       string       `json:"opening"`
	TimeToLossS   Num          `json:"time_to_loss_s"`
	Outcome       string       `json:"projection_end"`
	PumpsM3h      Num          `json:"pumps_m3h"`
	PumpsHold     string       `json:"pumps_hold"`        // yes | no | uncertain
	InflowNowM3h  Num          `json:"inflow_now_m3h"`    // the present inflow the pumps are weighed against
	BalanceHeadM  Num          `json:"balance_head_m"`    // Torricelli head at which the hole passes just the pumps' capacity
	TimeToBalance Num          `json:"time_to_balance_s"` // until the level gets there without pumping; null: not within the projection
	Words         []string     `json:"words"`
}

// BuildDiagnosis returns the JSON document of d; slices are never nil.
func BuildDiagnosis(d Diagnosis) DiagnosisDoc {
	v, res := d.Vessel, d.Result
	doc := DiagnosisDoc{Vessel: d.VesselName, Explanations: []ExplanationDoc{}, Fits: res.Fits, Verdict: res.Verdict,
		Tellers: append([]string{}, res.Tellers...), Disagreements: []DisagreementDoc{}, Readings: len(d.Readings),
		Explained: Num(math.NaN()), Searched: res.Searched, NotSearched: []string{}, TrendNote: d.TrendNote,
		VesselFile: d.VesselFile, Version: d.Version}
	if !d.Made.IsZero() {
		doc.Made = d.Made.UTC().Format(time.RFC3339)
	}
	if res.Reading < len(d.Readings) {
		r := d.Readings[res.Reading]
		doc.Explained = Num(r.Minutes)
		if s, err := engine.SurveyReading(v, r); err == nil {
			doc.MarksSurvey = &SurveyDoc{Num(s.AftM), Num(s.MidM), Num(s.FwdM), Num(s.TrimM), Num(s.DeflectionM)}
		}
	}
	for _, ci := range res.NotSearched {
		doc.NotSearched = append(doc.NotSearched, v.Compartments[ci].Name)
	}
	for _, g := range res.Disagreements {
		m := math.NaN()
		if g.Reading < len(d.Readings) {
			m = d.Readings[g.Reading].Minutes
		}
		doc.Disagreements = append(doc.Disagreements, DisagreementDoc{Num(m), g.What, Num(g.ReadM), Num(g.Expect), g.Message})
	}
	for _, e := range res.Explanations {
		doc.Explanations = append(doc.Explanations, explanationDoc(v, e))
	}
	if res.Without != nil {
		w := explanationDoc(v, *res.Without)
		doc.Without = &w
	}
	if t := d.Trend; t != nil {
		td := &TrendDoc{InflowM3h: Num(t.InflowM3h), HoleAreaM2: Num(t.Hole.AreaM2), TimeToDeckS: Num(t.DeckEdgeS),
			InflowSDM3h: Num(t.InflowSDM3h), HoleAreaSDM2: Num(t.HoleAreaSDM2), Compartment: v.Compartments[t.Compartment].Name,
			HoleAssumed: t.HoleAssumed, HoleXM: Num(t.Hole.XM), HoleYM: Num(t.Hole.YM), HoleZM: Num(t.Hole.ZM), Cd: Num(t.Hole.Cd),
			HeadM: Num(t.HeadM), Minutes: []Num{}, WaterM3: []Num{}, WaterSDM3: []Num{},
			DeckRangeS:    [2]Num{Num(t.DeckEdgeRange[0]), Num(t.DeckEdgeRange[1])},
			TimeToOpening: Num(t.OpeningS), Opening: t.Opening, TimeToLossS: Num(t.LossS),
			Outcome: t.Projection.End.String(), PumpsM3h: Num(t.PumpsM3h), PumpsHold: t.PumpsHold,
			InflowNowM3h: Num(t.InflowNowM3h), BalanceHeadM: Num(t.BalanceHeadM), TimeToBalance: Num(t.BalanceS),
			Words: TrendWords(v, *t)}
		for i := range t.Minutes {
			td.Minutes = append(td.Minutes, Num(t.Minutes[i]))
			td.WaterM3 = append(td.WaterM3, Num(t.WaterM3[i]))
			td.WaterSDM3 = append(td.WaterSDM3, Num(t.WaterSDM3[i]))
		}
		if t.Final != nil {
			td.Final = buildEquilibrium(t.Final)
		}
		doc.Trend = td
	}
	return doc
}

// explanationDoc is the JSON form of one explanation.
func explanationDoc(v *engine.Vessel, e engine.Explanation) ExplanationDoc {
	x := ExplanationDoc{Flooded: []string{}, WaterM3: map[string]Num{}, DraftRMSM: Num(e.DraftRMSM),
		HeelErrorDeg: Num(e.HeelErrDeg), LevelRMSM: Num(e.LevelRMSM), LevelsM: map[string]Num{},
		OpenToSea: []string{}, Full: []string{}, Misfit: Num(e.Misfit), Score: Num(e.Score),
		Permeability: Num(math.NaN()), DraftMarks: MarkDocs(e.Marks)}
	if e.FitPermeability > 0 {
		x.Permeability = Num(e.FitPermeability)
	}
	for _, s := range e.Spaces {
		n := v.Compartments[s.Compartment].Name
		x.Flooded = append(x.Flooded, n)
		x.WaterM3[n] = Num(s.WaterM3)
		x.LevelsM[n] = Num(s.LevelM)
		if s.Open {
			x.OpenToSea = append(x.OpenToSea, n)
		}
		if s.Full {
			x.Full = append(x.Full, n)
		}
	}
	if e.Position != nil {
		x.Equilibrium = buildEquilibrium(e.Position)
	}
	return x
}

// DiagnosisJSON writes d as one indented JSON object and a newline.
func DiagnosisJSON(w io.Writer, d Diagnosis) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(BuildDiagnosis(d))
}

// SpaceWords says the state of one flooded space: "open to the sea",
// "full", or how far its water stands below the sea.
func SpaceWords(s engine.FloodedSpace) string {
	switch {
	case s.Full:
		return "full"
	case s.Open:
		return "level with the sea: open to it"
	case s.BelowSeaM > 0:
		return num(s.BelowSeaM, 2, "m") + " below the sea"
	}
	return num(-s.BelowSeaM, 2, "m") + " above the sea"
}

// ErrorWords writes a misfit: "1.2 cm" at the marks and "+0.1°" of heel.
func ErrorWords(e engine.Explanation) (marks, heel string) {
	marks, heel = "—", "—"
	if finite(e.DraftRMSM) {
		marks = num(100*e.DraftRMSM, 1, "cm")
	}
	if finite(e.HeelErrDeg) {
		heel = signed(e.HeelErrDeg, 1, "°")
	}
	return marks, heel
}

// DiagnosisText writes d as plain text for the terminal.
func DiagnosisText(w io.Writer, d Diagnosis) error {
	e := &errWriter{w: w}
	v, res := d.Vessel, d.Result
	head := "heelwatch " + orDash(d.Version) + " · " + orDash(d.VesselName)
	if d.VesselFile != "" {
		head += " · " + d.VesselFile
	}
	e.line(head)
	e.line("made ", madeWords(d.Made))
	if n := len(d.Readings); n > 0 {
		e.line(plural(n, "reading"), ", explained: the one at ", num(d.Readings[res.Reading].Minutes, 1, "min"))
	}
	e.line()
	e.line(res.Verdict)
	if len(res.Explanations) > 0 {
		e.line()
		t := table{right: []bool{true, false, true, true, false, true, true}}
		t.add("#", "flooded", "water", "level", "state", "marks RMS", "heel err")
		for i, x := range res.Explanations {
			mk, hl := ErrorWords(x)
			if len(x.Spaces) == 0 {
				t.add(num(float64(i+1), 0, ""), "nothing (intact)", "—", "—", "", mk, hl)
				continue
			}
			for j, s := range x.Spaces {
				rank, m, h := "", "", ""
				if j == 0 {
					rank, m, h = num(float64(i+1), 0, ""), mk, hl
				}
				t.add(rank, v.Compartments[s.Compartment].Name, num(s.WaterM3, 0, "m³"), num(s.LevelM, 2, "m"), SpaceWords(s), m, h)
			}
		}
		writeLines(e, t.lines("  "))
	}
	if len(res.Tellers) > 0 {
		e.line()
		e.line("To tell them apart")
		for _, s := range res.Tellers {
			e.line("  ", s)
		}
	}
	if len(res.Disagreements) > 0 {
		e.line()
		e.line("Readings that disagree with the rest (not averaged away)")
		for _, g := range res.Disagreements {
			e.line("  ", g.Message)
		}
	}
	if len(res.Explanations) > 0 && len(d.Readings) > 0 {
		best := res.Explanations[0]
		r := d.Readings[res.Reading]
		if len(r.Drafts) > 0 {
			e.line()
			e.line("Drafts at the marks: read, and as the best explanation has them")
			t := table{right: []bool{false, true, true, true}}
			for k, m := range r.Drafts {
				name := v.DraftMarks[m.Mark].Name
				pred := math.NaN()
				if k < len(best.Marks) {
					pred = best.Marks[k].DraftM
				}
				t.add(name, num(m.DraftM, 2, "m"), num(pred, 2, "m"), signed(100*(m.DraftM-pred), 1, "cm"))
			}
			writeLines(e, t.lines("  "))
			if s, err := engine.SurveyReading(v, r); err == nil {
				e.line("  read, to the perpendiculars: aft ", num(s.AftM, 2, "m"), ", amidships ", num(s.MidM, 2, "m"),
					", forward ", num(s.FwdM, 2, "m"), "; hog/sag ", HogSagWords(s.DeflectionM))
			}
		}
	}
	e.line()
	if t := d.Trend; t != nil {
		var mins []string
		for _, m := range t.Minutes {
			mins = append(mins, num(m, 1, ""))
		}
		e.line("Trend (readings at ", strings.Join(mins, ", "), " min)")
		for _, s := range TrendWords(v, *t) {
			e.line("  ", s)
		}
	} else if d.TrendNote != "" {
		e.line("Trend: ", d.TrendNote)
	}
	e.line()
	for _, c := range Cautions() {
		e.line(c)
	}
	return e.err
}

// TrendWords says the trend in plain sentences.
func TrendWords(v *engine.Vessel, t engine.Trend) []string {
	name := v.Compartments[t.Compartment].Name
	var out []string
	if t.InflowM3h <= t.InflowSDM3h {
		out = append(out, fmt.Sprintf("The water in %s is not rising beyond what the readings can tell (%.0f ± %.0f m³/h).", name, t.InflowM3h, t.InflowSDM3h))
	} else {
		where := "at the hole the vessel file gives"
		if t.HoleAssumed {
			where = "if the hole is at its lowest point"
		}
		out = append(out, fmt.Sprintf("Water comes into %s at %.0f ± %.0f m³/h: a hole of about %.3f ± %.3f m² %s (Torricelli, C_d %.2f, head %.1f m).",
			name, t.InflowM3h, t.InflowSDM3h, t.Hole.AreaM2, t.HoleAreaSDM2, where, t.Hole.Cd, t.HeadM))
	}
	switch t.PumpsHold {
	case "yes":
		out = append(out, fmt.Sprintf("The pumps on it (%.0f m³/h) can hold it: they take more than the present inflow (%.0f ± %.0f m³/h).", t.PumpsM3h, t.InflowNowM3h, t.InflowNowSDM3h))
	case "uncertain":
		out = append(out, fmt.Sprintf("The pumps on it (%.0f m³/h) may or may not hold it: the inflow is too uncertain to say.", t.PumpsM3h))
	default:
		if t.PumpsM3h > 0 {
			out = append(out, pumpsCannotWords(t))
		} else {
			out = append(out, "The vessel file puts no pumps on it.")
		}
	}
	if t.Hole.AreaM2 > 0 {
		deck := "the deck edge stays clear"
		if !math.IsNaN(t.DeckEdgeS) {
			deck = "the deck edge goes under in " + Duration(t.DeckEdgeS)
			if a, b := t.DeckEdgeRange[0], t.DeckEdgeRange[1]; !math.IsNaN(a) && !math.IsNaN(b) {
				deck += " (" + Duration(a) + " to " + Duration(b) + ")"
			}
		}
		open := "no opening goes under"
		if !math.IsNaN(t.OpeningS) {
			open = "the first opening" + openingName(t.Opening) + " goes under in " + Duration(t.OpeningS)
		}
		out = append(out, "Left as it is, without pumping: "+deck+"; "+open+"; "+lossWords(t)+".")
	}
	return out
}

// pumpsCannotWords says plainly that the pumps cannot hold the present
// inflow, and where they would only balance it (Torricelli).
func pumpsCannotWords(t engine.Trend) string {
	s := fmt.Sprintf("The pumps on it (%.0f m³/h) cannot hold it: the present inflow is about %.0f m³/h.", t.PumpsM3h, t.InflowNowM3h)
	if math.IsNaN(t.BalanceHeadM) {
		return s
	}
	s += fmt.Sprintf(" They would only balance it when the water inside is %s below the sea at the hole (Torricelli head %.3f m)", num(t.BalanceHeadM*100, 1, "cm"), t.BalanceHeadM)
	if math.IsNaN(t.BalanceS) {
		return s + ", which the level does not reach within the projection."
	}
	return s + ", which the level reaches in about " + Duration(t.BalanceS) + " if nothing is done."
}

func openingName(n string) string {
	if n == "" {
		return ""
	}
	return " (" + n + ")"
}

func lossWords(t engine.Trend) string {
	if !math.IsNaN(t.LossS) {
		return "she is lost in " + Duration(t.LossS) + " (" + t.Projection.End.String() + ")"
	}
	return "she is not lost within the projection (" + t.Projection.End.String() + ")"
}
