package report

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"heelwatch/engine"
)

// This file writes a flooding run (heelwatch flood) for a person: the case,
// the outcome, the events, the state against time, the intermediate stages
// and the final state beside the lost-buoyancy solution. Its JSON is in
// flood_json.go.

// Flood is a finished flooding run with what the reports say about its
// inputs.
type Flood struct {
	Run        engine.FloodReport
	VesselFile string   // where the vessel came from (a file, or the bundled vessel's name)
	Open       []string // the other compartments open to the sea, in the order given
	HoleFrom   string   // where the hole came from: "command line", "vessel file", …
	PumpsFrom  string   // where the pumps came from: "command line", "vessel file" or "none"
	Version    string   // heelwatch's version
	// Network is the run through the ship (network.go), nil when the water
	// goes nowhere beyond the holed compartment.
	Network *engine.NetworkReport
	// Passenger: the vessel is a passenger ship, whose margin line is
	// watched; on a cargo ship the line is the deck edge alone.
	Passenger bool
	// StrengthWhy says why the hull girder is not worked out
	// (engine.StrengthMissing); "" when it is.
	StrengthWhy string
}

func lowestOpening(p *engine.Position) (engine.OpeningClearance, bool) {
	var best engine.OpeningClearance
	found := false
	for _, o := range p.Openings {
		if !o.Progressive() {
			continue
		}
		if !found || o.HeightM < best.HeightM {
			best, found = o, true
		}
	}
	return best, found
}

func eventWords(e engine.FloodEvent) string {
	if e.Kind == engine.RunEnds {
		return "end: " + e.Message
	}
	return e.Message
}

// FloodText prints the run for a person: the case, the outcome, the
// events, the state against time, the stages and the final state beside
// the lost-buoyancy solution.
func FloodText(w io.Writer, f Flood) error {
	r := f.Run
	var b strings.Builder
	fmt.Fprintf(&b, "Flooding through a hole — %s (%s)\n\n", r.Vessel, f.VesselFile)
	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintf(tw, "  compartment\t%s: μ %s, capacity %s m³\n", r.Compartment, Permeability(r.Permeability), num(r.CapacityM3, 1, ""))
	fmt.Fprintf(tw, "  hole\t%s m² at x %s, y %s, z %s m, Cd %s (%s)\n", num(r.Hole.AreaM2, 3, ""), num(r.Hole.XM, 2, ""), num(r.Hole.YM, 2, ""), num(r.Hole.ZM, 2, ""), num(r.Hole.Cd, 2, ""), f.HoleFrom)
	pumps := "none"
	if r.PumpM3h > 0 {
		pumps = num(r.PumpM3h, 0, "") + " m³/h (" + f.PumpsFrom + ")"
		if r.SteadyHeadM > 0 {
			pumps += fmt.Sprintf("; they match the inflow at a head of %s m", num(r.SteadyHeadM, 3, ""))
		}
	}
	fmt.Fprintf(tw, "  pumps\t%s\n", pumps)
	also := "—"
	if len(f.Open) > 0 {
		also = strings.Join(f.Open, ", ")
	}
	fmt.Fprintf(tw, "  also open to the sea\t%s\n", also)
	fmt.Fprintf(tw, "  time limit\t%s\n", Duration(r.LimitS))
	tw.Flush()

	head, rest := FloodOutcome(r)
	fmt.Fprintf(&b, "\n%s: %s%s.\n", outcomeLabel(f), head, rest)
	switch r.End {
	case engine.FloodSinks, engine.FloodCapsizes, engine.FloodFailed:
		// The outcome has said why already.
	default:
		fmt.Fprintf(&b, "  %s\n", sentenceCase(r.EndReason))
	}
	for _, s := range r.Spills {
		fmt.Fprintf(&b, "  %s held %s of %s, which may escape to the sea: report the pollution. Counted so: %s.\n",
			s.Compartment, num(s.MassT, 1, "t"), s.Liquid, engine.SpillRule)
	}
	if r.End == engine.FloodEqualised {
		fmt.Fprintf(&b, "  Time to equalise: %s (%s s), %s m³ in. The run stops at 1 mm of head (%s);\n  the last millimetre follows the √h law.\n",
			Duration(r.EqualiseS), num(r.EqualiseS, 0, ""), num(r.FinalWaterM3, 1, ""), Duration(r.EndS))
	}
	networkEndLine(&b, f)

	b.WriteString("\nEvents\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  time\twater m³\t")
	for _, e := range r.Events {
		fmt.Fprintf(tw, "  %s\t%s\t%s\n", Duration(e.TimeS), num(e.WaterM3, 1, ""), eventWords(e))
	}
	tw.Flush()
	for _, k := range []struct {
		kind engine.FloodEventKind
		what string
	}{{engine.DeckEdgeReached, "deck edge"}, {engine.MarginLineReached, "margin line"}} {
		if k.kind == engine.MarginLineReached && !f.Passenger {
			continue // a cargo ship has no margin line: the deck edge is the line
		}
		seen := false
		for _, e := range r.Events {
			seen = seen || e.Kind == k.kind
		}
		if !seen {
			fmt.Fprintf(&b, "  The %s stays clear of the water.\n", k.what)
		}
	}

	b.WriteString("\nAgainst time\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "  time\twater m³\tin m³/h\tpumped m³/h\thead m\tsounding m\theel °\tT aft m\tT mid m\tT fwd m\tdeck edge m\tGM m\t")
	for _, s := range r.Table {
		row := []string{Duration(s.TimeS), num(s.WaterM3, 1, ""), num(s.InflowM3h, 0, ""), num(s.PumpedM3h, 0, ""), num(s.HeadM, 3, ""), num(s.SoundingM, 2, "")}
		if p := s.Position; p != nil {
			row = append(row, num(p.HeelDeg, 2, ""), num(p.DraftAftM, 3, ""), num(p.DraftMidM, 3, ""), num(p.DraftFwdM, 3, ""), num(p.DeckEdge.HeightM, 3, ""), num(p.GMUprightM, 3, ""))
		} else {
			// No floating position: the flows and levels are not known either.
			row = append(row[:2], "—", "—", "—", "—", "—", "—", "—", "—", "—", "—")
		}
		fmt.Fprintf(tw, "  %s\t%s\n", strings.Join(row, "\t"), tableEvent(s))
	}
	tw.Flush()
	b.WriteString("  (heel + starboard down; deck edge: least height of the deck at side above the water;\n" +
		"   GM: upright, per the ship's own weight, the floodwater's Δ·GM kept: one basis with the lost-buoyancy solution;\n" +
		"   below the sea's level the water is a held weight; once the levels meet it rises and falls with the sea\n" +
		"   as she heels (free communication), which costs an off-centre space GM: the end row is the open-to-sea GM)\n")

	fmt.Fprintf(&b, "\nIntermediate stages (of %s m³", num(r.StagesOfM3, 1, ""))
	switch r.End {
	case engine.FloodEqualised:
		b.WriteString(", the water at equalisation")
	case engine.FloodPumpsHold:
		b.WriteString(", the water the pumps hold")
	case engine.FloodFull:
		b.WriteString(", the compartment full")
	case engine.FloodSinks, engine.FloodCapsizes, engine.FloodFailed:
		b.WriteString(", the water in her last floating state")
	default:
		if r.LostBuoyancy != nil {
			b.WriteString(", the water at equalisation by lost buoyancy")
		} else {
			b.WriteString(", the compartment's capacity")
		}
	}
	b.WriteString("; water held as an added weight, free surface level with the sea)\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "  stage\twater m³\treached\theel °\tT aft m\tT mid m\tT fwd m\tGM m\tdeck edge m\tlowest opening m\t")
	for _, s := range r.Stages {
		reached := "not reached"
		if s.Reached {
			reached = Duration(s.TimeS)
		}
		row := []string{num(100*s.Fraction, 0, "") + " %", num(s.WaterM3, 1, ""), reached}
		if p := s.Position; p != nil {
			low := "—"
			if o, ok := lowestOpening(p); ok {
				low = num(o.HeightM, 2, "")
			}
			row = append(row, num(p.HeelDeg, 2, ""), num(p.DraftAftM, 3, ""), num(p.DraftMidM, 3, ""), num(p.DraftFwdM, 3, ""), num(p.GMUprightM, 3, ""), num(p.DeckEdge.HeightM, 3, ""), low)
		} else {
			why := "no equilibrium"
			if s.NoEq != nil {
				why = s.NoEq.Outcome.String()
			}
			row = append(row, why, "", "", "", "", "", "")
		}
		fmt.Fprintf(tw, "  %s\t\n", strings.Join(row, "\t"))
	}
	tw.Flush()
	writeStageCriteria(&b, r.Stages)
	writeStageStrength(&b, r.Stages, f.StrengthWhy)

	b.WriteString("\nFinal state beside the lost-buoyancy solution (the compartment open to the sea)\n")
	if r.LostBuoyancy == nil {
		why := "no floating position"
		if r.LostBuoyancyNoEq != nil {
			why = r.LostBuoyancyNoEq.Error()
		}
		fmt.Fprintf(&b, "  Lost buoyancy: %s.\n", why)
	}
	if f := r.Final.Position; f != nil && r.LostBuoyancy != nil {
		l := r.LostBuoyancy
		tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintln(tw, "  \trun's last state\tlost buoyancy\tdifference\t")
		for _, q := range []struct {
			what string
			a, b float64
			prec int
			unit string
		}{
			{"draft aft m", f.DraftAftM, l.DraftAftM, 3, "mm"},
			{"draft mid m", f.DraftMidM, l.DraftMidM, 3, "mm"},
			{"draft fwd m", f.DraftFwdM, l.DraftFwdM, 3, "mm"},
			{"heel °", f.HeelDeg, l.HeelDeg, 2, "°"},
			{"GM upright m", f.GMUprightM, l.GMUprightM, 3, "m"},
			{"water m³", r.FinalWaterM3, r.LostBuoyancyWaterM3, 1, "m³"},
		} {
			d := q.a - q.b
			diff := num(d, 3, "") + " " + q.unit
			if q.unit == "mm" {
				diff = num(1000*d, 1, "") + " mm"
			}
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t\n", q.what, num(q.a, q.prec, ""), num(q.b, q.prec, ""), diff)
		}
		tw.Flush()
		if r.End == engine.FloodEqualised {
			verdict := "within"
			if r.FinalDiffM > 0.005 {
				verdict = "NOT within"
			}
			fmt.Fprintf(&b, "  Largest draft difference %s mm: %s 5 mm. (GM on one basis: per the ship's own weight, Δ·GM kept.)\n", num(1000*r.FinalDiffM, 2, ""), verdict)
		} else {
			b.WriteString("  The run did not equalise: the two differ by the water not let in.\n")
		}
	}
	fmt.Fprintf(&b, "\n%d steps (%d rejected), %d solves. Decision support only: the ship's approved stability information governs.\n", r.Steps, r.Rejected, r.Solves)
	if _, err := io.WriteString(w, b.String()); err != nil || f.Network == nil {
		return err
	}
	return NetworkText(w, *f.Network)
}

func tableEvent(s engine.FloodSample) string {
	if s.Event == "" {
		return ""
	}
	return "  ← " + s.Event
}

func sentenceCase(s string) string {
	if s == "" {
		return s
	}
	s = strings.ToUpper(s[:1]) + s[1:]
	if !strings.HasSuffix(s, ".") {
		s += "."
	}
	return s
}

// writeStageCriteria prints one row per criterion, one column per stage.
func writeStageCriteria(b *strings.Builder, stages []engine.FloodStage) {
	var codes []string
	req := map[string]string{}
	for _, s := range stages {
		for _, c := range s.Criteria {
			if _, ok := req[c.Code]; !ok {
				codes = append(codes, c.Code)
				req[c.Code] = c.Requirement
			}
		}
	}
	if len(codes) == 0 {
		return
	}
	b.WriteString("\n  Criteria at the stages (value, and pass or FAIL; indicators have no verdict)\n")
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	head := []string{"  criterion"}
	for _, s := range stages {
		head = append(head, num(100*s.Fraction, 0, "")+" %")
	}
	fmt.Fprintln(tw, strings.Join(head, "\t")+"\t")
	for _, code := range codes {
		row := []string{"  " + code}
		for _, s := range stages {
			cell := "—"
			for _, c := range s.Criteria {
				if c.Code != code {
					continue
				}
				cell = num(c.Actual, 3, "")
				if c.Unit != "" {
					cell += " " + c.Unit
				}
				switch {
				case c.Indicator:
				case c.Pass:
					cell += " pass"
				default:
					cell += " FAIL"
				}
			}
			row = append(row, cell)
		}
		fmt.Fprintln(tw, strings.Join(row, "\t")+"\t")
	}
	tw.Flush()
}
