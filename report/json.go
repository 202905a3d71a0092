package report

import (
	"encoding/json"
	"io"
	"math"
	"strconv"
	"time"

	"heelwatch/engine"
)

// Num is a number in the JSON output. JSON cannot hold NaN or infinities:
// a non-finite Num is written as null, and −0 as 0.
type Num float64

// MarshalJSON writes x in the shortest form that reads back exactly, or null.
func (x Num) MarshalJSON() ([]byte, error) {
	f := float64(x)
	if !finite(f) {
		return []byte("null"), nil
	}
	if f == 0 {
		f = 0
	}
	return strconv.AppendFloat(nil, f, 'g', -1, 64), nil
}

// Document is the JSON object printed by `heelwatch solve --format json`.
// The first keys are those fixed by heelwatch's conventions (vessel, open,
// equilibrium, gz, hand, flags); the rest are heelwatch's own and are
// described in the README.
type Document struct {
	Vessel      string       `json:"vessel"`
	Open        []string     `json:"open"`
	Equilibrium *Equilibrium `json:"equilibrium"`
	GZ          GZ           `json:"gz"`
	Hand        *Hand        `json:"hand"`
	Flags       []FlagDoc    `json:"flags"`
	Flooded     []string     `json:"flooded"`          // every compartment holding sea water in the final state
	Spread      *SpreadDoc   `json:"spread,omitempty"` // how it spread through connections and openings
	Spills      []SpillDoc   `json:"spills"`           // non-water contents of holed tanks that may escape
	DraftMarks  []MarkDoc    `json:"draft_marks"`
	// MarksSurvey: the marks carried to the perpendiculars (draftmarks.go).
	MarksSurvey *SurveyDoc   `json:"marks_to_perpendiculars"`
	Strength    *StrengthDoc `json:"strength"` // null: not worked out (strength_note says why)

	Outcome          string         `json:"outcome"`           // floats | sinks | capsizes | not converged
	Reason           string         `json:"reason"`            // why there is no equilibrium, "" when she floats
	Severity         string         `json:"severity"`          // highest flag severity: none | info | caution | danger
	ShipSeverity     string         `json:"ship_severity"`     // the same without the hand method's caveats (engine.Flag.AboutHandMethod): the ship's own state
	OpenCompartments []OpenDoc      `json:"open_compartments"` // each open compartment with its permeability
	HeldWater        []HeldDoc      `json:"partly_flooded"`    // compartments holding floodwater, not open to the sea
	Freeboards       []Freeboard    `json:"freeboards"`
	Openings         []OpeningDoc   `json:"openings"`
	HandNote         string         `json:"hand_note"`     // why the hand method is not applied, "" when it is
	StrengthNote     string         `json:"strength_note"` // why strength is null, "" when it is worked out
	Criteria         []CriterionDoc `json:"criteria"`
	Notes            []string       `json:"notes"` // what could not be computed, and why
	VesselFile       string         `json:"vessel_file"`
	Condition        string         `json:"condition"` // the loading condition's name
	Made             string         `json:"made"`      // RFC 3339, UTC
	Version          string         `json:"heelwatch_version"`

	// Present only when the righting options were asked for (Report.Remedies).
	Remedies        *[]RemedyDoc `json:"remedies,omitempty"`         // ranked, best first
	RemediesSummary string       `json:"remedies_summary,omitempty"` // what kind of heel it is and the rule that follows
	RemediesLoll    *bool        `json:"remedies_loll,omitempty"`    // upright GM negative: only options that lower G
	RemediesCaution string       `json:"remedies_caution,omitempty"` // options to weigh, not orders
}

// Equilibrium is the free-floating position found from the hull geometry.
type Equilibrium struct {
	DraftAftM Num `json:"draft_aft_m"`
	DraftMidM Num `json:"draft_mid_m"`
	DraftFwdM Num `json:"draft_fwd_m"`
	TrimM     Num `json:"trim_m"`
	HeelDeg   Num `json:"heel_deg"`
	GMM       Num `json:"gm_m"`         // upright GM of the condition as solved
	GMAtRestM Num `json:"gm_at_rest_m"` // GZ slope at the equilibrium heel, m/rad

	DisplacementT    Num       `json:"displacement_t"` // lost-buoyancy basis: the ship's weight without the water in open spaces
	OpenWaterT       Num       `json:"open_water_t"`   // sea water standing in the compartments open to the sea
	Loll             bool      `json:"loll"`           // heeled with a negative upright GM
	VolumeM3         Num       `json:"volume_m3"`
	LCBM             Num       `json:"lcb_m"`
	TCBM             Num       `json:"tcb_m"`
	VCBM             Num       `json:"vcb_m"`
	LCGM             Num       `json:"lcg_m"`
	TCGM             Num       `json:"tcg_m"`
	KGM              Num       `json:"kg_m"`
	FSCM             Num       `json:"fsc_m"`
	WaterplaneAreaM2 Num       `json:"waterplane_area_m2"`
	LCFM             Num       `json:"lcf_m"`
	TCFM             Num       `json:"tcf_m"`
	BMTM             Num       `json:"bmt_m"`
	BMLM             Num       `json:"bml_m"`
	KMTM             Num       `json:"kmt_m"`
	GMLM             Num       `json:"gml_m"`
	DeckEdge         Clearance `json:"deck_edge"`
	MarginLine       Clearance `json:"margin_line"`
	Iterations       int       `json:"iterations"`
}

// Clearance is the least height of a line along the ship above the water.
type Clearance struct {
	HeightM Num    `json:"height_m"` // negative: immersed
	XM      Num    `json:"x_m"`
	Side    string `json:"side"` // port | starboard
}

// Freeboard is the freeboard to the deck at side at one station.
type Freeboard struct {
	XM           Num `json:"x_m"`
	DeckZM       Num `json:"deck_z_m"`
	HalfBreadthM Num `json:"half_breadth_m"`
	PortM        Num `json:"port_m"`
	StarboardM   Num `json:"starboard_m"`
}

// OpeningDoc is an opening and its height above the water.
type OpeningDoc struct {
	Name         string `json:"name"`
	Kind         string `json:"kind"`
	XM           Num    `json:"x_m"`
	YM           Num    `json:"y_m"`
	ZM           Num    `json:"z_m"`
	Weathertight bool   `json:"weathertight"`
	HeightM      Num    `json:"height_m"` // negative: immersed
	Immersed     bool   `json:"immersed"`
	LeadsTo      string `json:"leads_to"`    // the compartment it lets water into; "" a space not modelled
	Progressive  bool   `json:"progressive"` // a point of progressive flooding: not weathertight, not into a space flooded already
}

// OpenDoc is a compartment open to the sea.
// HeldDoc is a compartment partly flooded: not open to the sea, holding
// water_m3 of sea water as an added weight.
type HeldDoc struct {
	Name    string `json:"name"`
	WaterM3 Num    `json:"water_m3"`
}

type OpenDoc struct {
	Name         string `json:"name"`
	Use          string `json:"use"`
	Permeability Num    `json:"permeability"`
	VolumeM3     Num    `json:"volume_m3"` // moulded volume of the space, null if unknown
}

// GZ is the righting-lever curve and the figures read from it. With no
// curve, the arrays are empty and the figures null.
type GZ struct {
	HeelDeg []Num `json:"heel_deg"`
	GZM     []Num `json:"gz_m"`

	Toward              string `json:"toward"` // port | starboard, "" with no curve
	EquilibriumDeg      Num    `json:"equilibrium_deg"`
	GZMaxM              Num    `json:"gz_max_m"`
	GZMaxDeg            Num    `json:"gz_max_deg"`
	VanishingDeg        Num    `json:"vanishing_deg"`
	RangeDeg            Num    `json:"range_deg"`
	DeckEdgeDeg         Num    `json:"deck_edge_deg"`
	DownfloodingDeg     Num    `json:"downflooding_deg"`
	DownfloodingOpening string `json:"downflooding_opening"`
}

// Hand is the small-angle lost-buoyancy method's result and working.
type Hand struct {
	SinkageM  Num `json:"sinkage_m"`
	DraftM    Num `json:"draft_m"`
	CFShiftM  Num `json:"cf_shift_m"`
	KBM       Num `json:"kb_m"`
	BMM       Num `json:"bm_m"`
	KMM       Num `json:"km_m"`
	GMM       Num `json:"gm_m"`
	HeelDeg   Num `json:"heel_deg"`
	DraftAftM Num `json:"draft_aft_m"`
	DraftFwdM Num `json:"draft_fwd_m"`
	TrimM     Num `json:"trim_m"`

	DraftMidM        Num `json:"draft_mid_m"`
	LostVolumeM3     Num `json:"lost_volume_m3"`
	LostAreaM2       Num `json:"lost_area_m2"`
	WaterplaneAreaM2 Num `json:"waterplane_area_m2"`
	LCFM             Num `json:"lcf_m"`
	TCFM             Num `json:"tcf_m"`
	GMLM             Num `json:"gml_m"`
	// Usable is false when the hand answer is beyond the method's range
	// (engine.HandWorking.Unusable): its heel and drafts are then kept for
	// the record only, and NotUsableBecause says why ("" when usable).
	Usable           bool      `json:"usable"`
	NotUsableBecause string    `json:"not_usable_because"`
	Steps            []StepDoc `json:"steps"`
}

// StepDoc is one line of the hand method's working.
type StepDoc struct {
	Label   string `json:"label"`
	Formula string `json:"formula"`
	Value   Num    `json:"value"`
	Unit    string `json:"unit"`
}

// FlagDoc is a flag: a short code, its severity and a plain sentence.
type FlagDoc struct {
	Code     string `json:"code"`
	Severity string `json:"severity"` // info | caution | danger
	Message  string `json:"message"`
}

// CriterionDoc is one stability criterion applied to the state.
type CriterionDoc struct {
	Set         string `json:"set"`
	Code        string `json:"code"`
	Requirement string `json:"requirement"`
	Required    Num    `json:"required"`
	Actual      Num    `json:"actual"`
	Unit        string `json:"unit"`
	Pass        bool   `json:"pass"`
	AtMost      bool   `json:"at_most"` // the actual must not exceed the limit
	Margin      Num    `json:"margin"`  // signed so that zero or more passes
	Source      string `json:"source"`
	Indicator   bool   `json:"indicator"` // a figure to read, not a criterion the ship is held to
	Note        string `json:"note"`      // how the actual was taken, "" if nothing to say
}

// Build returns the JSON document of r. Slices are never nil, so that
// empty lists print as [] rather than null.
func Build(r Report) Document {
	a := r.Assessment
	d := Document{
		Vessel:           r.VesselName,
		Open:             append([]string{}, r.Open...),
		Flags:            []FlagDoc{},
		Spills:           buildSpills(a.Spills),
		Outcome:          r.Outcome(),
		Severity:         r.Severity(),
		ShipSeverity:     r.ShipSeverity(),
		OpenCompartments: []OpenDoc{},
		HeldWater:        append([]HeldDoc{}, r.heldWater()...),
		Freeboards:       []Freeboard{},
		Openings:         []OpeningDoc{},
		HandNote:         a.HandWhy,
		StrengthNote:     a.StrengthWhy,
		Criteria:         []CriterionDoc{},
		Notes:            append([]string{}, a.Notes...),
		VesselFile:       r.VesselFile,
		Condition:        r.Condition,
		Version:          r.Version,
		GZ:               buildGZ(a.GZ),
		Strength:         StrengthJSON(a.Strength, r.IntactStrength),
	}
	if md := MarkDrafts(r.Vessel, a.Position); md != nil {
		d.DraftMarks, d.MarksSurvey = MarkDocs(md), Survey(r.Vessel.Hull.LengthM, a.Position.Plane.C, md)
	} else {
		d.DraftMarks = []MarkDoc{}
	}
	if !r.Made.IsZero() {
		d.Made = r.Made.UTC().Format(time.RFC3339)
	}
	if a.NoEq != nil && a.Position == nil {
		d.Reason = a.NoEq.Reason
	}
	for _, name := range r.Open {
		o := OpenDoc{Name: name, Permeability: Num(math.NaN()), VolumeM3: Num(math.NaN())}
		if mu, ok := r.Permeabilities[name]; ok {
			o.Permeability = Num(mu)
		}
		if c := r.compartment(name); c != nil {
			o.Use = c.Use
			o.VolumeM3 = Num(c.Volume())
			if _, ok := r.Permeabilities[name]; !ok {
				o.Permeability = Num(c.Permeability)
			}
		}
		d.OpenCompartments = append(d.OpenCompartments, o)
	}
	if p := a.Position; p != nil {
		d.Equilibrium = buildEquilibrium(p)
		for _, f := range p.Freeboards {
			d.Freeboards = append(d.Freeboards, Freeboard{Num(f.XM), Num(f.DeckZM), Num(f.HalfBreadthM), Num(f.PortM), Num(f.StarboardM)})
		}
		for _, o := range p.Openings {
			d.Openings = append(d.Openings, OpeningDoc{Name: o.Name, Kind: o.Kind,
				XM: Num(o.X), YM: Num(o.Y), ZM: Num(o.Z), Weathertight: o.Weathertight,
				HeightM: Num(o.HeightM), Immersed: o.Immersed(), LeadsTo: o.LeadsTo, Progressive: o.Progressive()})
		}
	}
	if h := a.Hand; h != nil {
		d.Hand = &Hand{SinkageM: Num(h.SinkageM), DraftM: Num(h.DraftM), CFShiftM: Num(h.CFShiftM),
			KBM: Num(h.KBM), BMM: Num(h.BMM), KMM: Num(h.KMM), GMM: Num(h.GMM), HeelDeg: Num(h.HeelDeg),
			DraftAftM: Num(h.DraftAftM), DraftFwdM: Num(h.DraftFwdM), TrimM: Num(h.TrimM),
			DraftMidM: Num(h.DraftMidM), LostVolumeM3: Num(h.LostVolumeM3), LostAreaM2: Num(h.LostAreaM2),
			WaterplaneAreaM2: Num(h.WaterplaneM2), LCFM: Num(h.LCFM), TCFM: Num(h.TCFM), GMLM: Num(h.GMLM),
			Usable: h.Usable(), NotUsableBecause: h.Unusable(),
			Steps: []StepDoc{}}
		for _, s := range h.Steps {
			d.Hand.Steps = append(d.Hand.Steps, StepDoc{s.Label, s.Formula, Num(s.Value), s.Unit})
		}
	}
	for _, f := range r.Flags() {
		d.Flags = append(d.Flags, FlagDoc{f.Code, f.Severity.String(), f.Message})
	}
	if rs := r.Remedies; rs != nil {
		list := buildRemedies(rs)
		loll := rs.Loll
		d.Remedies, d.RemediesSummary, d.RemediesLoll, d.RemediesCaution = &list, rs.Summary, &loll, RemediesCaution
	}
	d.Criteria = append(d.Criteria, CriterionDocs(a.Criteria)...)
	d.Flooded, d.Spread = flooded(r), buildSpread(r)
	return d
}

// CriterionDocs returns the JSON form of criteria results; never nil.
func CriterionDocs(cs []engine.CriterionResult) []CriterionDoc {
	out := []CriterionDoc{}
	for _, c := range cs {
		out = append(out, CriterionDoc{Set: c.Set, Code: c.Code, Requirement: c.Requirement,
			Required: Num(c.Required), Actual: Num(c.Actual), Unit: c.Unit, Pass: c.Pass, AtMost: c.AtMost,
			Margin: Num(c.Margin), Source: c.Source, Indicator: c.Indicator, Note: c.Note})
	}
	return out
}

func buildEquilibrium(p *engine.Position) *Equilibrium {
	cl := func(c engine.Clearance) Clearance {
		return Clearance{Num(c.HeightM), Num(c.XM), c.Side.String()}
	}
	return &Equilibrium{
		DraftAftM: Num(p.DraftAftM), DraftMidM: Num(p.DraftMidM), DraftFwdM: Num(p.DraftFwdM),
		TrimM: Num(p.TrimM), HeelDeg: Num(p.HeelDeg), GMM: Num(p.GMUprightM), GMAtRestM: Num(p.GMAtRestM),
		DisplacementT: Num(p.DisplacementT), OpenWaterT: Num(p.OpenWaterT), Loll: p.IsLoll(), VolumeM3: Num(p.VolumeM3),
		LCBM: Num(p.LCBM), TCBM: Num(p.TCBM), VCBM: Num(p.VCBM),
		LCGM: Num(p.LCGM), TCGM: Num(p.TCGM), KGM: Num(p.KGM), FSCM: Num(p.FSCM),
		WaterplaneAreaM2: Num(p.WaterplaneAreaM2), LCFM: Num(p.LCFM), TCFM: Num(p.TCFM),
		BMTM: Num(p.BMTM), BMLM: Num(p.BMLM), KMTM: Num(p.KMTM), GMLM: Num(p.GMLM),
		DeckEdge: cl(p.DeckEdge), MarginLine: cl(p.MarginLine), Iterations: p.Iterations,
	}
}

func buildGZ(g *engine.GZCurve) GZ {
	nan := Num(math.NaN())
	out := GZ{HeelDeg: []Num{}, GZM: []Num{}, EquilibriumDeg: nan, GZMaxM: nan, GZMaxDeg: nan,
		VanishingDeg: nan, RangeDeg: nan, DeckEdgeDeg: nan, DownfloodingDeg: nan}
	if g == nil {
		return out
	}
	n := min(len(g.HeelDeg), len(g.GZM))
	for i := 0; i < n; i++ {
		out.HeelDeg = append(out.HeelDeg, Num(g.HeelDeg[i]))
		out.GZM = append(out.GZM, Num(g.GZM[i]))
	}
	out.Toward = g.Toward.String()
	out.EquilibriumDeg = Num(g.EquilibriumDeg)
	out.GZMaxM, out.GZMaxDeg = Num(g.GZMaxM), Num(g.GZMaxDeg)
	out.VanishingDeg, out.RangeDeg = Num(g.VanishingDeg), Num(g.RangeDeg)
	out.DeckEdgeDeg, out.DownfloodingDeg = Num(g.DeckEdgeDeg), Num(g.DownfloodingDeg)
	out.DownfloodingOpening = g.Downflooding
	return out
}

// JSON writes r as one indented JSON object (see Document) and a newline.
func JSON(w io.Writer, r Report) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(Build(r))
}
