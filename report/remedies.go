package report

// The righting options (engine.FindRemedies) in the three formats. They are
// shown only when asked for (Report.Remedies set), always with the words
// that they are options to weigh, not orders.

import (
	"math"
	"strconv"
	"strings"

	"heelwatch/engine"
)

// RemediesHeading heads the righting options in text and Markdown.
const RemediesHeading = "Righting options"

// RemediesCaution goes with the options in every format.
const RemediesCaution = "Each option is worked out on its own from the hull geometry in the vessel file; two taken together do not simply add up. Take any of them one tank at a time, watching the heel, and solve the new condition before the next."

// RemedyDoc is one righting option in the JSON output. The first keys are
// those the README documents as the option's core; the rest add detail.
type RemedyDoc struct {
	Action         string   `json:"action"`
	Tanks          []string `json:"tanks"` // the tank filled or pumped out; for a transfer the tank emptied, then the tank filled
	MassT          Num      `json:"mass_t"`
	HeelDeg        Num      `json:"heel_deg"` // after it; null when she would not float
	TrimM          Num      `json:"trim_m"`
	GMM            Num      `json:"gm_m"`             // upright GM after it (as upright_gm_m)
	GMAtRestM      Num      `json:"gm_at_rest_m"`     // GZ slope where she comes to rest, m/rad
	DeckEdgeM      Num      `json:"deck_edge_m"`      // least freeboard to the deck edge; negative: under water
	LowestOpeningM Num      `json:"lowest_opening_m"` // the unprotected opening nearest the water; null if none
	Advisable      bool     `json:"advisable"`
	Note           string   `json:"note"`

	Kind             string `json:"kind"`       // fill | pump out | transfer
	ToUpright        bool   `json:"to_upright"` // a smaller amount, found to bring her nearest upright
	FillsBefore      []Num  `json:"fills_before"`
	FillsAfter       []Num  `json:"fills_after"`
	DraftAftM        Num    `json:"draft_aft_m"`
	DraftMidM        Num    `json:"draft_mid_m"`
	DraftFwdM        Num    `json:"draft_fwd_m"`
	UprightGMM       Num    `json:"upright_gm_m"`
	LowestOpening    string `json:"lowest_opening"` // its name, "" if none
	DeckEdgeImmersed bool   `json:"deck_edge_immersed"`
	OpeningImmersed  bool   `json:"opening_immersed"`
	NoEquilibrium    string `json:"no_equilibrium"` // "" when she floats, else why not

	StagesChecked int    `json:"stages_checked"` // steps of carrying it out solved and passed (of stages_of)
	StagesOf      int    `json:"stages_of"`      // the steps it is solved at, the last being the option itself
	StageFail     string `json:"stage_fail"`     // the first step at which it is unsafe, and why; "" if none
	DurationS     Num    `json:"duration_s"`     // how long it takes at pump_m3h; null when the file gives no rate
	PumpM3h       Num    `json:"pump_m3h"`       // the rate used, m³/h; null when none
	PumpTank      string `json:"pump_tank"`      // the tank whose rate it is
}

// buildRemedies returns the JSON options of rs, never nil.
func buildRemedies(rs *engine.RemedySet) []RemedyDoc {
	out := []RemedyDoc{}
	for _, o := range rs.Options {
		nan := Num(math.NaN())
		d := RemedyDoc{Action: o.Action, Tanks: append([]string{}, o.TankNames...), MassT: Num(o.MassT),
			HeelDeg: nan, TrimM: nan, GMM: Num(o.UprightGMM), GMAtRestM: nan, DeckEdgeM: nan, LowestOpeningM: Num(o.LowestOpeningM),
			Advisable: o.Advisable, Note: o.Note, Kind: o.Kind.String(), ToUpright: o.ToUpright,
			FillsBefore: []Num{}, FillsAfter: []Num{}, DraftAftM: nan, DraftMidM: nan, DraftFwdM: nan,
			UprightGMM: Num(o.UprightGMM), LowestOpening: o.LowestOpening,
			DeckEdgeImmersed: o.DeckEdgeImmersed, OpeningImmersed: o.OpeningImmersed,
			StagesChecked: o.StagesChecked, StagesOf: engine.RemedyStages, StageFail: o.StageFail,
			DurationS: Num(o.DurationS), PumpM3h: nan, PumpTank: o.PumpName}
		if o.PumpM3h > 0 {
			d.PumpM3h = Num(o.PumpM3h)
		}
		for _, f := range o.FillBefore {
			d.FillsBefore = append(d.FillsBefore, Num(f))
		}
		for _, f := range o.FillAfter {
			d.FillsAfter = append(d.FillsAfter, Num(f))
		}
		if p := o.Position; p != nil {
			d.HeelDeg, d.TrimM, d.GMAtRestM, d.DeckEdgeM = Num(p.HeelDeg), Num(p.TrimM), Num(p.GMAtRestM), Num(p.DeckEdge.HeightM)
			d.DraftAftM, d.DraftMidM, d.DraftFwdM = Num(p.DraftAftM), Num(p.DraftMidM), Num(p.DraftFwdM)
		} else {
			d.LowestOpeningM = nan
			if o.NoEq != nil {
				d.NoEquilibrium = o.NoEq.Error()
			} else {
				d.NoEquilibrium = "not solved"
			}
		}
		out = append(out, d)
	}
	return out
}

// advisableWord is yes or NO.
func advisableWord(o engine.Remedy) string {
	if o.Advisable {
		return "yes"
	}
	return "NO"
}

// clearWords is a height above the water with "under" when negative.
func clearWords(h float64) string {
	if !finite(h) {
		return "—"
	}
	s := num(h, 2, "m")
	if h < 0 {
		s += " under"
	}
	return s
}

// remedyCells are one option's figures as the text and Markdown tables show
// them: mass, heel, trim, upright GM, GM at rest, deck edge, lowest opening.
func remedyCells(o engine.Remedy) []string {
	p := o.Position
	if p == nil {
		why := "does not float"
		if o.NoEq != nil && o.NoEq.Outcome != engine.NotConverged {
			why = o.NoEq.Outcome.String()
		}
		return []string{num(o.MassT, 1, "t"), why, "—", "—", "—", "—", "—"}
	}
	return []string{num(o.MassT, 1, "t"), HeelWords(p.HeelDeg), TrimWords(p.TrimM), num(o.UprightGMM, 2, "m"),
		num(p.GMAtRestM, 2, "m"), clearWords(p.DeckEdge.HeightM), clearWords(o.LowestOpeningM)}
}

// textRemedies writes the options as aligned text.
func textRemedies(e *errWriter, rs *engine.RemedySet) {
	e.line(RemediesHeading)
	e.line("  ", rs.Summary)
	if len(rs.Options) > 0 {
		t := table{right: []bool{true, false, true, false, false, true, true, true, true, false}}
		t.add("#", "action", "mass", "heel after", "trim after", "GM upright", "GM at rest", "deck edge", "lowest opening", "advisable")
		for i, o := range rs.Options {
			t.add(append(append([]string{strconv.Itoa(i + 1), o.Action}, remedyCells(o)...), advisableWord(o))...)
		}
		writeLines(e, t.lines("  "))
		n := table{right: []bool{true, false}}
		for i, o := range rs.Options {
			n.add(strconv.Itoa(i+1), o.Note)
		}
		e.line("  Notes")
		writeLines(e, n.lines("  "))
	}
	e.line("  ", RemediesCaution)
}

// markdownRemedies writes the options as a Markdown section.
func markdownRemedies(e *errWriter, rs *engine.RemedySet) {
	e.line("## ", RemediesHeading)
	e.line()
	e.line(md(rs.Summary))
	e.line()
	if len(rs.Options) > 0 {
		e.line("| # | Action | Mass | Heel after | Trim after | GM upright | GM at rest | Deck edge | Lowest opening | Advisable | Note |")
		e.line("|--:|---|--:|---|---|--:|--:|--:|--:|---|---|")
		for i, o := range rs.Options {
			adv := advisableWord(o)
			if !o.Advisable {
				adv = "**no**"
			}
			cells := append([]string{strconv.Itoa(i + 1), md(o.Action)}, remedyCells(o)...)
			cells = append(cells, adv, md(o.Note))
			e.line("| ", strings.Join(cells, " | "), " |")
		}
		e.line()
	}
	e.line("*", RemediesCaution, "*")
	e.line()
}
