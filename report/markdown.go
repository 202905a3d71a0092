package report

import (
	"io"
	"strings"
	"unicode"
)

// Markdown writes r as a Markdown report that an officer can print or
// paste into the log: the vessel and condition, the compartments open, the
// floating position, freeboards, openings, flags, criteria, the hand
// method's working, the cautions and the time it was made.
func Markdown(w io.Writer, r Report) error {
	e := &errWriter{w: w}
	a := r.Assessment
	doc := Build(r)

	e.line("# Flooding assessment: ", md(orDash(r.VesselName)))
	e.line()
	e.line("| | |")
	e.line("|---|---|")
	e.line("| Vessel | ", md(orDash(r.VesselName)), " |")
	if r.VesselFile != "" {
		e.line("| Vessel file | `", strings.ReplaceAll(r.VesselFile, "`", "'"), "` |")
	}
	e.line("| Made | ", madeWords(r.Made), " |")
	e.line("| Computed by | heelwatch ", md(orDash(r.Version)), " |")
	outcome := "floats"
	if a.Position == nil {
		outcome = "**no equilibrium: " + r.Outcome() + "**"
	}
	e.line("| Outcome | ", outcome, " |")
	e.line("| Highest flag | ", r.Severity(), " |")
	e.line("| Highest flag about the ship | ", r.ShipSeverity(), " (the hand method's caveats left out) |")
	e.line()

	markdownCondition(e, r, doc)
	markdownPosition(e, r)
	p := a.Position

	e.line("## Flags")
	e.line()
	fl := r.Flags()
	if len(fl) == 0 {
		e.line("None.")
	} else {
		e.line("| Severity | Code | What it means |")
		e.line("|---|---|---|")
		for _, f := range fl {
			sev := f.Severity.String()
			if sev == "danger" {
				sev = "**danger**"
			}
			msg := md(f.Message)
			if f.AboutHandMethod() {
				msg = "About the hand method, not the ship: " + msg
			}
			e.line("| ", sev, " | `", f.Code, "` | ", msg, " |")
		}
	}
	e.line()
	markdownSpills(e, a.Spills)

	if r.Remedies != nil {
		markdownRemedies(e, r.Remedies)
	}

	if g := a.GZ; g != nil && len(g.HeelDeg) > 0 {
		e.line("## Righting levers")
		e.line()
		e.line("Free trim, constant displacement, heeled to ", g.Toward.String(), ".")
		e.line()
		df := num(g.DownfloodingDeg, 1, "°")
		if g.Downflooding != "" {
			df += " (" + md(g.Downflooding) + ")"
		}
		e.line("- Equilibrium: ", num(g.EquilibriumDeg, 1, "°"), "; GZ max ", num(g.GZMaxM, 3, "m"), " at ", num(g.GZMaxDeg, 1, "°"))
		e.line("- Vanishing stability: ", num(g.VanishingDeg, 1, "°"), "; range beyond equilibrium ", num(g.RangeDeg, 1, "°"))
		e.line("- Deck edge immerses at ", num(g.DeckEdgeDeg, 1, "°"), "; downflooding at ", df)
		e.line()
		e.line("| Heel | GZ |")
		e.line("|--:|--:|")
		for _, i := range gzRows(g, 5) {
			e.line("| ", num(g.HeelDeg[i], 1, "°"), " | ", num(g.GZM[i], 3, "m"), " |")
		}
		e.line()
	}

	e.line("## Criteria")
	e.line()
	if len(a.Criteria) == 0 {
		sets := "none"
		if r.Vessel != nil && len(r.Vessel.CriteriaSets) > 0 {
			sets = strings.Join(r.Vessel.CriteriaSets, ", ")
		}
		e.line("No criterion applies to this state (the vessel's criteria sets: ", md(sets), ").")
	} else {
		for _, c := range a.Criteria {
			if c.Indicator {
				e.line("A result of \"read\" is an indicator: a figure to read, not a limit she is held to.")
				e.line()
				break
			}
		}
		e.line("| Result | Set | Requirement | Required | Actual | Margin | Source |")
		e.line("|---|---|---|--:|--:|--:|---|")
		for _, c := range a.Criteria {
			res := strings.ToLower(verdict(c))
			if res == "fail" {
				res = "**FAIL**"
			}
			p := precision(c.Unit)
			e.line("| ", res, " | ", md(c.Set), " | ", md(requirementWords(c)), " | ", num(c.Required, p, c.Unit), " | ", num(c.Actual, p, c.Unit), " | ", signed(c.Margin, p, c.Unit), " | ", md(c.Source), " |")
		}
	}
	e.line()

	markdownStrength(e, r)

	e.line("## Hand method")
	e.line()
	if h := a.Hand; h == nil {
		why := a.HandWhy
		if why == "" {
			why = "not worked for this state"
		}
		e.line("The small-angle lost-buoyancy method was not applied: ", md(why), ".")
	} else {
		e.line("Small-angle lost-buoyancy method for a box-shaped vessel, step by step:")
		e.line()
		e.line("| Step | Working | Result |")
		e.line("|---|---|--:|")
		for _, s := range h.Steps {
			e.line("| ", md(s.Label), " | ", md(s.Formula), " | ", num(s.Value, precision(s.Unit), s.Unit), " |")
		}
		e.line()
		e.line("| | Hand method | Direct solution |")
		e.line("|---|--:|--:|")
		dash := func(f func() string) string {
			if p == nil {
				return "—"
			}
			return f()
		}
		e.line("| Mean draft after sinkage | ", num(h.DraftM, 3, "m"), " | ", dash(func() string { return num(p.DraftMidM, 3, "m") + " (amidships)" }), " |")
		e.line("| Draft aft | ", num(h.DraftAftM, 3, "m"), " | ", dash(func() string { return num(p.DraftAftM, 3, "m") }), " |")
		e.line("| Draft amidships | ", num(h.DraftMidM, 3, "m"), " | ", dash(func() string { return num(p.DraftMidM, 3, "m") }), " |")
		e.line("| Draft forward | ", num(h.DraftFwdM, 3, "m"), " | ", dash(func() string { return num(p.DraftFwdM, 3, "m") }), " |")
		e.line("| Trim | ", TrimWords(h.TrimM), " | ", dash(func() string { return TrimWords(p.TrimM) }), " |")
		e.line("| Heel | ", HeelWords(h.HeelDeg), " | ", dash(func() string { return HeelWords(p.HeelDeg) }), " |")
		e.line("| GM upright | ", num(h.GMM, 3, "m"), " | ", dash(func() string { return num(p.GMUprightM, 3, "m") }), " |")
	}
	e.line()

	if len(a.Notes) > 0 {
		e.line("## Notes")
		e.line()
		for _, n := range a.Notes {
			e.line("- ", md(n))
		}
		e.line()
	}

	e.line("## Cautions")
	e.line()
	for _, c := range Cautions() {
		e.line("- ", c)
	}
	e.line()
	e.line("*Made ", madeWords(r.Made), " by heelwatch ", md(orDash(r.Version)), ".*")
	return e.err
}

// markdownCondition writes the condition: the loading condition and the
// compartments open to the sea or holding water.
func markdownCondition(e *errWriter, r Report, doc Document) {
	e.line("## Condition")
	e.line()
	if r.Condition != "" {
		e.line("Loading condition: ", md(r.Condition), ".")
		e.line()
	}
	held := r.heldWater()
	if len(r.Open) == 0 && len(held) == 0 {
		e.line("No compartment is open to the sea: this is the intact loading condition.")
	} else if len(r.Open) == 0 {
		e.line("No compartment is open to the sea; the compartments below are flooded to a level (a stage of flooding).")
	} else {
		e.line("Compartments open to the sea (lost buoyancy, each with its permeability μ):")
		e.line()
		e.line("| Compartment | Use | μ | Volume |")
		e.line("|---|---|--:|--:|")
		for _, o := range doc.OpenCompartments {
			e.line("| ", md(o.Name), " | ", md(orDash(o.Use)), " | ", Permeability(float64(o.Permeability)), " | ", num(float64(o.VolumeM3), 1, "m³"), " |")
		}
	}
	if len(held) > 0 {
		e.line()
		e.line("Compartments flooded to a level (a stage of flooding: water held, the added-weight method):")
		e.line()
		e.line("| Compartment | Water held |")
		e.line("|---|--:|")
		for _, h := range held {
			e.line("| ", md(h.Name), " | ", num(float64(h.WaterM3), 1, "m³"), " |")
		}
	}
	markdownSpread(e, r)
	e.line()
}

// markdownPosition writes the floating position, the freeboards, the
// draft marks and the openings, or why there is no floating position.
func markdownPosition(e *errWriter, r Report) {
	a := r.Assessment
	e.line("## Floating position")
	e.line()
	p := a.Position
	if p == nil {
		e.line("**No floating position exists: she ", r.Outcome(), ".**")
		if a.NoEq != nil && a.NoEq.Reason != "" {
			e.line()
			e.line(md(sentence(a.NoEq.Reason)), ".")
		}
		e.line()
	} else {
		e.line("Direct solution from the hull geometry, at the actual heel and trim.")
		e.line()
		e.line("| Figure | Value |")
		e.line("|---|--:|")
		rows := [][2]string{
			{"Draft aft (AP)", num(p.DraftAftM, 3, "m")},
			{"Draft amidships", num(p.DraftMidM, 3, "m")},
			{"Draft forward (FP)", num(p.DraftFwdM, 3, "m")},
			{"Trim", TrimWords(p.TrimM)},
			{"Heel", HeelWords(p.HeelDeg)},
			{"GM upright (free-surface corrected)", GMUprightWords(p)},
			{"GM where she lies", GMAtRestWords(p)},
			{"KM upright", num(kmUpright(p), 3, "m")},
			{"KG", num(p.KGM, 3, "m")},
			{"Free-surface correction", num(p.FSCM, 3, "m")},
			{"GM longitudinal", num(p.GMLM, 1, "m")},
		}
		for _, row := range displacementRows(p) {
			rows = append(rows, [2]string{sentence(row[0]), row[1]})
		}
		rows = append(rows, [2]string{"Buoyant volume", num(p.VolumeM3, 1, "m³")})
		for _, row := range rows {
			e.line("| ", row[0], " | ", row[1], " |")
		}
		e.line()

		e.line("## Freeboard")
		e.line()
		for _, row := range deckLineRows(p, r.Vessel) {
			e.line("- Least clearance of the ", row[0], ": ", row[1])
		}
		if len(p.Freeboards) > 0 {
			e.line()
			e.line("| Station x | Deck at side | Port | Starboard |")
			e.line("|--:|--:|--:|--:|")
			for _, f := range p.Freeboards {
				e.line("| ", num(f.XM, 1, "m"), " | ", num(f.DeckZM, 2, "m"), " | ", num(f.PortM, 3, "m"), " | ", num(f.StarboardM, 3, "m"), " |")
			}
		}
		e.line()
		markdownMarks(e, r)

		e.line("## Openings")
		e.line()
		if len(p.Openings) == 0 {
			e.line("The vessel file lists no openings.")
		} else {
			e.line("Nearest the water first; a negative height is under water.")
			e.line()
			e.line("| Opening | Kind | x | y | z | Height above water | State |")
			e.line("|---|---|--:|--:|--:|--:|---|")
			for _, o := range openingsByHeight(p) {
				state := "clear"
				if o.Immersed() {
					state = "**immersed**"
				}
				if o.Weathertight {
					state += ", weathertight"
				}
				if o.IntoFlooded {
					state += ", into " + md(o.LeadsTo) + " (flooded already)"
				}
				e.line("| ", md(o.Name), " | ", md(orDash(o.Kind)), " | ", num(o.X, 1, "m"), " | ", num(o.Y, 1, "m"), " | ", num(o.Z, 1, "m"), " | ", num(o.HeightM, 3, "m"), " | ", state, " |")
			}
		}
		e.line()
	}
}

// md escapes text for a Markdown table cell or line. An underscore inside
// a word (I_T, s_final) cannot start emphasis and is left as it is.
func md(s string) string {
	var b strings.Builder
	rs := []rune(s)
	word := func(i int) bool {
		return i >= 0 && i < len(rs) && (unicode.IsLetter(rs[i]) || unicode.IsDigit(rs[i]))
	}
	for i, r := range rs {
		switch r {
		case '|', '*', '\\':
			b.WriteRune('\\')
			b.WriteRune(r)
		case '_':
			if !word(i-1) || !word(i+1) {
				b.WriteRune('\\')
			}
			b.WriteRune(r)
		case '`':
			b.WriteRune('\'')
		case '\n', '\r':
			b.WriteRune(' ')
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}
