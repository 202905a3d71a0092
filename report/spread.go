package report

import (
	"heelwatch/engine"
)

// This file says how flooding spread through the ship in the final state
// (engine.Progressive): the `flooded` list of the solve JSON, the `spread`
// object and the chain in the text report.

// SpreadDoc is the spread of flooding through connections and openings.
type SpreadDoc struct {
	Chain   string      `json:"chain"` // the whole spread in plain words
	Links   []LinkDoc   `json:"links"`
	LostBy  *LinkDoc    `json:"lost_by"` // the link after which she no longer floats; null if she floats or is lost without it
	Savings []SavingDoc `json:"savings"` // what closing each link would keep (only when lost_by is set)
	// CrossFlooding is the time each cross-flooding fitting the water
	// passed takes to equalise (MSC.362(92)), against the limits.
	CrossFlooding []CrossDoc `json:"cross_flooding"`
}

// CrossDoc is one cross-flooding fitting's time to equalise.
type CrossDoc struct {
	Name          string `json:"name"`
	TimeS         Num    `json:"time_s"`
	LimitS        Num    `json:"limit_s"`   // 600: SOLAS II-1 Reg. 7-2
	InstantS      Num    `json:"instant_s"` // 60: MSC.1/Circ.1461 §9.2.2
	WithinLimit   bool   `json:"within_limit"`
	Instantaneous bool   `json:"instantaneous"`
	HeadM         Num    `json:"head_m"`    // H0
	VolumeM3      Num    `json:"volume_m3"` // W
	Method        string `json:"method"`
	Message       string `json:"message"`
}

func crossDocs(v *engine.Vessel, sp engine.Spread) []CrossDoc {
	return crossDocsOf(engine.CrossFloodingTimes(v, sp))
}

func crossDocsOf(es []engine.CrossFloodingEstimate) []CrossDoc {
	out := []CrossDoc{}
	for _, e := range es {
		out = append(out, CrossDoc{Name: e.Name, TimeS: Num(e.TimeS), LimitS: engine.CrossFloodingLimitS, InstantS: engine.CrossFloodingInstantS,
			WithinLimit: e.WithinTen, Instantaneous: e.Instant, HeadM: Num(e.HeadM), VolumeM3: Num(e.VolumeM3),
			Method: "T = 2W/(S·F·√(2g·H0)), IMO Res. MSC.362(92)", Message: CrossFloodingWords(e)})
	}
	return out
}

// LinkDoc is one way the water went further.
type LinkDoc struct {
	Compartment string `json:"compartment"` // that floods
	From        string `json:"from"`        // the compartment the water comes from; "sea" through an opening
	Via         string `json:"via"`         // the connection's or opening's name
	Kind        string `json:"kind"`
	DepthM      Num    `json:"depth_m"`  // how far under the water its sill (or the opening) is
	HeelDeg     Num    `json:"heel_deg"` // the heel of the stage at which it was found under
	Message     string `json:"message"`
}

// SavingDoc is what closing one link would keep.
type SavingDoc struct {
	Via     string `json:"via"`
	Floats  bool   `json:"floats"`
	Message string `json:"message"`
}

// flooded lists every compartment holding sea water in the assessed state:
// open to the sea or holding water.
func flooded(r Report) []string {
	out := []string{}
	if r.Vessel == nil {
		return append(out, r.Open...)
	}
	d := r.Assessment.Damage
	for i, c := range r.Vessel.Compartments {
		if i < len(d) && (d[i].Open || d[i].WaterM3 > 0) {
			out = append(out, c.Name)
		}
	}
	return out
}

func linkDoc(v *engine.Vessel, l engine.SpreadLink) LinkDoc {
	from := "sea"
	if l.From >= 0 {
		from = v.Compartments[l.From].Name
	}
	return LinkDoc{Compartment: v.Compartments[l.Compartment].Name, From: from, Via: l.Via, Kind: l.Kind,
		DepthM: Num(l.DepthM), HeelDeg: Num(l.HeelDeg), Message: l.Message}
}

// buildSpread returns the spread's JSON form; nil when nothing spread.
func buildSpread(r Report) *SpreadDoc {
	sp := r.Spread
	if sp == nil || r.Vessel == nil || len(sp.Links) == 0 {
		return nil
	}
	d := &SpreadDoc{Chain: sp.Chain(r.Vessel), Links: []LinkDoc{}, Savings: []SavingDoc{}, CrossFlooding: crossDocs(r.Vessel, *sp)}
	for _, l := range sp.Links {
		d.Links = append(d.Links, linkDoc(r.Vessel, l))
	}
	if sp.LostBy != nil {
		l := linkDoc(r.Vessel, *sp.LostBy)
		d.LostBy = &l
	}
	for _, s := range sp.Savings {
		d.Savings = append(d.Savings, SavingDoc{Via: s.Link.Via, Floats: s.Position != nil, Message: s.Message})
	}
	return d
}

// writeSpread prints the chain, and when she is lost through it, what
// does it and what closing would save.
func writeSpread(e *errWriter, r Report) {
	sp := r.Spread
	if sp == nil || r.Vessel == nil || len(sp.Links) == 0 {
		return
	}
	e.line("Water spreads: ", plural(len(sp.Links), "compartment"), " beyond those open to the sea")
	for _, l := range sp.Links {
		e.line("  ", sentence(l.Message), ".")
	}
	for _, c := range engine.CrossFloodingTimes(r.Vessel, *sp) {
		e.line("  Cross-flooding: ", CrossFloodingWords(c), ".")
	}
	if sp.LostBy != nil {
		e.line("  She floats with the compartments opened but is LOST through progressive flooding: ", sp.LostBy.Message, ".")
		for _, s := range sp.Savings {
			e.line("  ", sentence(s.Message), ".")
		}
	}
}

// markdownSpread writes how the water spread, for the Markdown report.
func markdownSpread(e *errWriter, r Report) {
	sp := r.Spread
	if sp == nil || r.Vessel == nil || len(sp.Links) == 0 {
		return
	}
	e.line()
	e.line("Water spreads beyond the compartments opened (progressive flooding, to a fixed point):")
	e.line()
	for _, l := range sp.Links {
		e.line("- ", md(sentence(l.Message)), ".")
	}
	for _, c := range engine.CrossFloodingTimes(r.Vessel, *sp) {
		e.line("- Cross-flooding: ", md(CrossFloodingWords(c)), ".")
	}
	if sp.LostBy != nil {
		e.line("- **She floats with the compartments opened but is lost through progressive flooding:** ", md(sp.LostBy.Message), ".")
		for _, s := range sp.Savings {
			e.line("- ", md(sentence(s.Message)), ".")
		}
	}
}
