package report

import (
	"io"
	"strings"

	"heelwatch/engine"
)

// Text writes r as a compact plain-text report for the terminal: aligned
// columns, a unit on every figure, nothing but ASCII and a few common
// symbols (°, μ, ³, —).
func Text(w io.Writer, r Report) error {
	e := &errWriter{w: w}
	a := r.Assessment
	head := "heelwatch " + orDash(r.Version) + " · " + orDash(r.VesselName)
	if r.VesselFile != "" {
		head += " · " + r.VesselFile
	}
	e.line(head)
	e.line("made ", madeWords(r.Made))
	if r.Condition != "" {
		e.line("loading condition: ", r.Condition)
	}
	e.line()

	held := r.heldWater()
	if len(r.Open) == 0 && len(held) == 0 {
		e.line("Open to the sea: none (intact)")
	} else if len(r.Open) == 0 {
		e.line("Open to the sea: none")
	} else {
		e.line("Open to the sea: ", plural(len(r.Open), "compartment"))
		t := table{right: []bool{false, false, true, true}}
		for _, o := range Build(r).OpenCompartments {
			t.add(o.Name, orDash(o.Use), "μ "+Permeability(float64(o.Permeability)), num(float64(o.VolumeM3), 1, "m³"))
		}
		writeLines(e, t.lines("  "))
	}
	if len(held) > 0 {
		e.line("Flooded to a level (a stage of flooding, water held as added weight): ", plural(len(held), "compartment"))
		t := table{right: []bool{false, true}}
		for _, h := range held {
			t.add(h.Name, num(float64(h.WaterM3), 1, "m³"))
		}
		writeLines(e, t.lines("  "))
	}
	writeSpread(e, r)
	e.line()

	p := a.Position
	if p == nil {
		if a.NoEq != nil {
			e.line("Floating position: NONE — ", a.NoEq.Outcome.Plain())
			e.line("  ", sentence(a.NoEq.Reason), ".")
		} else {
			e.line("Floating position: NONE")
		}
	} else {
		e.line("Floating position (direct, from the hull geometry)")
		t := table{}
		t.add("draft aft", num(p.DraftAftM, 3, "m"))
		t.add("draft amidships", num(p.DraftMidM, 3, "m"))
		t.add("draft forward", num(p.DraftFwdM, 3, "m"))
		t.add("trim", TrimWords(p.TrimM))
		t.add("heel", HeelWords(p.HeelDeg))
		t.add(LabelGMUpright, GMUprightWords(p))
		t.add(LabelGMAtRest, GMAtRestWords(p))
		t.add("KM upright", num(kmUpright(p), 3, "m"))
		t.add("KG", num(p.KGM, 3, "m"))
		t.add("free-surface corr.", num(p.FSCM, 3, "m"))
		for _, row := range displacementRows(p) {
			t.add(row[0], row[1])
		}
		for _, row := range deckLineRows(p, r.Vessel) {
			t.add(row[0], row[1])
		}
		writeLines(e, t.lines("  "))
		if ml := markLines(r); len(ml) > 0 {
			e.line()
			writeLines(e, ml)
		}
		if len(p.Openings) > 0 {
			e.line()
			e.line("Openings, nearest the water first (height above water)")
			t := table{right: []bool{false, false, true, false}}
			for _, o := range openingsByHeight(p) {
				note := ""
				if o.Immersed() {
					note = "IMMERSED"
				}
				if o.Weathertight {
					note = strings.TrimSpace(note + " weathertight")
				}
				if o.IntoFlooded {
					note = strings.TrimSpace(note + " into " + o.LeadsTo + ", flooded already")
				}
				t.add(o.Name, orDash(o.Kind), num(o.HeightM, 3, "m"), note)
			}
			writeLines(e, t.lines("  "))
		}
	}

	if g := a.GZ; g != nil && len(g.HeelDeg) > 0 {
		e.line()
		e.line("Righting levers, heeled to ", g.Toward.String())
		t := table{right: []bool{false, true, false, true}}
		t.add("GZ max", num(g.GZMaxM, 3, "m")+" at "+num(g.GZMaxDeg, 1, "°"), "vanishing", num(g.VanishingDeg, 1, "°"))
		t.add("equilibrium", num(g.EquilibriumDeg, 1, "°"), "range", num(g.RangeDeg, 1, "°"))
		df := num(g.DownfloodingDeg, 1, "°")
		if g.Downflooding != "" {
			df += " (" + g.Downflooding + ")"
		}
		t.add("deck edge", num(g.DeckEdgeDeg, 1, "°"), "downflooding", df)
		writeLines(e, t.lines("  "))
		rows := gzRows(g, 10)
		heel, gz := []string{"heel °"}, []string{"GZ m"}
		for _, i := range rows {
			heel = append(heel, num(g.HeelDeg[i], 0, ""))
			gz = append(gz, num(g.GZM[i], 3, ""))
		}
		c := table{right: make([]bool, len(heel))}
		for i := 1; i < len(heel); i++ {
			c.right[i] = true
		}
		c.add(heel...)
		c.add(gz...)
		writeLines(e, c.lines("  "))
	}

	if len(a.Criteria) > 0 {
		e.line()
		e.line("Criteria")
		t := table{right: []bool{false, true, true, false}}
		t.add("", "actual", "margin", "requirement")
		for _, c := range a.Criteria {
			p := precision(c.Unit)
			t.add(verdict(c), num(c.Actual, p, c.Unit), signed(c.Margin, p, c.Unit), requirementWords(c)+" ["+c.Set+"]")
		}
		writeLines(e, t.lines("  "))
	}

	textStrength(e, r)

	e.line()
	textHand(e, a.Hand, a.HandWhy, p)
	e.line()
	textFlags(e, r.Flags())
	textSpills(e, a.Spills)
	if r.Remedies != nil {
		e.line()
		textRemedies(e, r.Remedies)
	}
	if len(a.Notes) > 0 {
		e.line()
		e.line("Notes")
		for _, n := range a.Notes {
			e.line("  ", n)
		}
	}
	e.line()
	for _, c := range Cautions() {
		e.line(c)
	}
	return e.err
}

// textHand writes the hand method's working and its answers beside the
// direct ones (p, nil when she does not float), or why it was not worked.
func textHand(e *errWriter, h *engine.HandWorking, handWhy string, p *engine.Position) {
	if h != nil {
		e.line("Hand method (lost buoyancy, small angles)")
		t := table{right: []bool{false, true, false}}
		for _, s := range h.Steps {
			t.add(s.Label, num(s.Value, precision(s.Unit), s.Unit), s.Formula)
		}
		writeLines(e, t.lines("  "))
		c := table{right: []bool{false, true, true}}
		// A hand answer beyond the method's range is shown for the record,
		// each of its positions marked.
		mark := func(s string) string { return s }
		if !h.Usable() {
			c.add("", "hand (NOT USABLE)", "direct")
			mark = func(s string) string { return s + " *" }
		} else {
			c.add("", "hand", "direct")
		}
		direct := func(f func() string) string {
			if p == nil {
				return "—"
			}
			return f()
		}
		c.add("draft aft", mark(num(h.DraftAftM, 3, "m")), direct(func() string { return num(p.DraftAftM, 3, "m") }))
		c.add("draft amidships", mark(num(h.DraftMidM, 3, "m")), direct(func() string { return num(p.DraftMidM, 3, "m") }))
		c.add("draft forward", mark(num(h.DraftFwdM, 3, "m")), direct(func() string { return num(p.DraftFwdM, 3, "m") }))
		c.add("trim", TrimWords(h.TrimM), direct(func() string { return TrimWords(p.TrimM) }))
		c.add("heel", mark(HeelWords(h.HeelDeg)), direct(func() string { return HeelWords(p.HeelDeg) }))
		c.add("GM upright", num(h.GMM, 3, "m"), direct(func() string { return num(p.GMUprightM, 3, "m") }))
		writeLines(e, c.lines("  "))
		if !h.Usable() {
			e.line("  * not usable: beyond the hand method's range (past-small-angles, below); read the direct answer")
		}
	} else {
		why := handWhy
		if why == "" {
			why = "not worked for this state"
		}
		e.line("Hand method: ", why)
	}

}

// textFlags writes the ship's flags, then the hand method's caveats under
// their own heading: they say how far to trust the method, not how the
// ship is.
func textFlags(e *errWriter, flags []engine.Flag) {
	var ship, method []engine.Flag
	for _, f := range flags {
		if f.AboutHandMethod() {
			method = append(method, f)
		} else {
			ship = append(ship, f)
		}
	}
	if len(ship) == 0 {
		e.line("Flags: none")
	} else {
		e.line("Flags")
		t := table{}
		for _, f := range ship {
			t.add(strings.ToUpper(f.Severity.String()), f.Code, f.Message)
		}
		writeLines(e, t.lines("  "))
	}
	if len(method) > 0 {
		e.line()
		e.line("About the hand method (its caveats, not flags of the ship)")
		t := table{}
		for _, f := range method {
			t.add(strings.ToUpper(f.Severity.String()), f.Code, f.Message)
		}
		writeLines(e, t.lines("  "))
	}
}

func writeLines(e *errWriter, lines []string) {
	for _, l := range lines {
		e.line(l)
	}
}

func orDash(s string) string {
	if s == "" {
		return "—"
	}
	return s
}

func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return num(float64(n), 0, "") + " " + word + "s"
}

// precision is the number of decimals shown for a value in unit.
func precision(unit string) int {
	switch unit {
	case "°", "deg":
		return 2
	case "m·rad":
		return 4
	case "m²", "m³", "t", "t·m":
		return 1
	case "m⁴":
		return 0
	}
	return 3
}
