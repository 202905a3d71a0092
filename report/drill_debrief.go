package report

import (
	"fmt"
	"io"
	"math"
	"strings"

	"heelwatch/engine"
)

// This file writes a drill's debrief in Markdown: the truth beside the
// crew's picture minute by minute, when the flooded compartments were
// first marked, each decision with what it did, and what the best
// response would have given.

// DrillDebrief writes the debrief of the analysed drill a.
func DrillDebrief(w io.Writer, dr Drill, a engine.DrillAnalysis) error {
	d := a.Played
	v := d.Vessel()
	var b strings.Builder
	fmt.Fprintf(&b, "# Drill debrief: %s\n\n", dr.Scenario)
	fmt.Fprintf(&b, "%s, %s min of scenario time, scenario file `%s`. ", v.Name, Fixed(d.EndMinutes(), 0, ""), dr.File)
	b.WriteString("The truth below was hidden from the crew during the drill. ")
	b.WriteString("Decision support for training only: the ship's approved stability information and the master govern.\n\n")
	if dr.About != "" {
		b.WriteString("## The scenario\n\n")
		b.WriteString(strings.TrimSpace(dr.About))
		b.WriteString("\n\n")
	}

	b.WriteString("## How it ended\n\n")
	b.WriteString("| | heel | deck edge above water | sea water in her | deck edge under |\n|---|---|---|---|---|\n")
	outcomeRow(&b, "this drill", a.Actual)
	outcomeRow(&b, "no action by the crew", a.NoAction)
	outcomeRow(&b, "pumps and doors at once (below)", a.Best)
	b.WriteString("\n")
	fmt.Fprintf(&b, "The best response heelwatch plays for comparison: every pump the vessel file gives started on each breached compartment the minute it is breached, and again at once after a pump fails; every watertight door and hatch shut at the first breach, and again at once if one is found open (no counter-flooding, no cross-flooding fittings). ")
	b.WriteString(saved(a.Actual, a.Best))
	b.WriteString("\n\n")

	b.WriteString("## What was flooding, and when the crew marked it\n\n")
	if len(a.Identifications) == 0 {
		b.WriteString("No compartment took water.\n\n")
	} else {
		b.WriteString("| compartment | water from | marked by the crew | after |\n|---|---|---|---|\n")
		for _, id := range a.Identifications {
			marked, after := "never", "—"
			if !math.IsNaN(id.MarkedMin) {
				marked = "min " + Fixed(id.MarkedMin, 1, "")
				after = Duration((id.MarkedMin - id.FloodedMin) * 60)
			}
			fmt.Fprintf(&b, "| %s | min %s | %s | %s |\n", mdCell(v.Compartments[id.Compartment].Name), Fixed(id.FloodedMin, 1, ""), marked, after)
		}
		b.WriteString("\n")
		if math.IsNaN(a.AllRightMin) {
			b.WriteString("The crew's marks never matched the compartments holding water.\n\n")
		} else {
			fmt.Fprintf(&b, "The crew's marks first matched the compartments holding water at minute %s.", Fixed(a.AllRightMin, 1, ""))
			if a.RightAtEnd {
				b.WriteString(" They matched them at the end too.\n\n")
			} else {
				b.WriteString(" They did not match them at the end.\n\n")
			}
		}
	}

	b.WriteString("## Decisions and their effect\n\n")
	if len(a.Decisions) == 0 {
		b.WriteString("The crew took no action that changes the ship (pumps, doors).\n\n")
	} else {
		b.WriteString("Each decision's effect is this drill against the same drill played without that one decision, at the end (the size of the heel; negative: less heel, less water).\n\n")
		b.WriteString("| min | by | decision | heel | deck edge above water | sea water in her | deck edge under: with it / without |\n|---|---|---|---|---|---|---|\n")
		for _, de := range a.Decisions {
			fmt.Fprintf(&b, "| %s | %s | %s | %s | %s | %s | %s / %s |\n", Fixed(de.Event.Minutes, 1, ""), de.Event.By, mdCell(de.Event.Label(v)),
				change(math.Abs(a.Actual.HeelDeg), math.Abs(de.Without.HeelDeg), "°"), change(a.Actual.FreeboardM, de.Without.FreeboardM, "m"),
				change(a.Actual.WaterM3, de.Without.WaterM3, "m³"), underAt(a.Actual), underAt(de.Without))
		}
		b.WriteString("\n")
	}

	b.WriteString("## Timeline: the truth beside the crew's picture\n\n")
	b.WriteString("Crew readings are as read (marks to the centimetre, ±1 cm; inclinometer ±0.2°).\n\n")
	b.WriteString("| min | event | heel | aft | fwd | flooded (truth) | heel read | aft read | fwd read | marked by the crew |\n")
	b.WriteString("|---|---|---|---|---|---|---|---|---|---|\n")
	marks := map[int]bool{}
	log := d.Log()
	li := 0
	for _, r := range d.Rows() {
		for li < len(log) && log[li].Minutes <= r.Minutes+1e-9 {
			if e := log[li]; e.Kind == engine.DrillMark {
				marks[e.Compartment] = e.Flooded
			}
			li++
		}
		heel, aft, fwd := "—", "—", "—"
		rh, ra, rf := "—", "—", "—"
		if p := r.Position; p != nil {
			heel, aft, fwd = HeelShort(p.HeelDeg, 1), Fixed(p.DraftAftM, 2, ""), Fixed(p.DraftFwdM, 2, "")
			if r.Event == "" {
				rd := engine.CrewReading(v, *p, r.Minutes, dr.Seed)
				ra0, rf0 := ReadAftFwd(v, rd)
				rh, ra, rf = HeelShort(rd.HeelDeg, 1), Fixed(ra0, 2, ""), Fixed(rf0, 2, "")
			}
		}
		var marked []string
		for i, c := range v.Compartments {
			if marks[i] {
				marked = append(marked, c.Name)
			}
		}
		fmt.Fprintf(&b, "| %s | %s | %s | %s | %s | %s | %s | %s | %s | %s |\n", Fixed(r.Minutes, 1, ""), mdCell(r.Event), heel, aft, fwd,
			mdCell(strings.Join(r.Flooded, ", ")), rh, ra, rf, mdCell(strings.Join(marked, ", ")))
	}
	b.WriteString("\n## What the crew was told\n\n")
	for _, m := range CrewFeed(d) {
		fmt.Fprintf(&b, "- min %s: %s\n", Fixed(m.Minutes, 1, ""), mdCell(m.Text))
	}
	var own []string
	for _, e := range d.Log() {
		if e.By == engine.ByCrew && e.Text != "" {
			own = append(own, fmt.Sprintf("- min %s: %s\n", Fixed(e.Minutes, 1, ""), mdCell(e.Text)))
		}
	}
	if len(own) > 0 {
		b.WriteString("\n## The crew's own notes and diagnoses\n\n")
		b.WriteString(strings.Join(own, ""))
	}
	b.WriteString("\nThe drill replays from its log: `heelwatch drill LOG.toml --run` gives this timeline again, `--debrief` this debrief.\n")
	_, err := io.WriteString(w, b.String())
	return err
}

// underAt says when the deck edge went under, or that it did not.
func underAt(o engine.DrillOutcome) string {
	if math.IsNaN(o.DeckEdgeMin) {
		return "not in the drill"
	}
	return "min " + Fixed(o.DeckEdgeMin, 1, "")
}

func outcomeRow(b *strings.Builder, what string, o engine.DrillOutcome) {
	if o.Lost {
		fmt.Fprintf(b, "| %s | lost at min %s | — | — | min %s |\n", what, Fixed(o.LostMin, 1, ""), Fixed(o.DeckEdgeMin, 1, ""))
		return
	}
	fmt.Fprintf(b, "| %s | %s | %s | %s | %s |\n", what, Heel(o.HeelDeg, 1), Fixed(o.FreeboardM, 2, "m"), Fixed(o.WaterM3, 0, "m³"), underAt(o))
}

// saved says what the best response would have saved beside this drill,
// judged by the freeboard to the deck edge at the end.
func saved(actual, best engine.DrillOutcome) string {
	switch {
	case actual.Lost && !best.Lost:
		return "She was lost; with pumps and doors at once she would have stayed afloat."
	case actual.Lost && best.Lost:
		return "She is lost even with pumps and doors at once: they cannot hold this damage."
	case best.Lost:
		return "With pumps and doors alone she would have been lost: this drill's response did better."
	}
	gain := best.FreeboardM - actual.FreeboardM
	detail := fmt.Sprintf("%s of freeboard to the deck edge, %s of heel and %s of sea water at the end",
		Signed(gain, 2, "m"), change(math.Abs(best.HeelDeg), math.Abs(actual.HeelDeg), "°"), change(best.WaterM3, actual.WaterM3, "m³"))
	switch {
	case gain > 0.005:
		return "Pumps and doors at once would have saved, beside this drill: " + detail + "."
	case gain < -0.005:
		return "This drill's response did better than pumps and doors at once, which give " + detail + " beside it."
	}
	return "This drill's response did as well as pumps and doors at once."
}

// change writes a − b signed, or "—".
func change(a, b float64, unit string) string {
	if math.IsNaN(a) || math.IsNaN(b) {
		return "—"
	}
	prec := map[string]int{"m³": 0, "°": 1}[unit]
	if unit == "m" {
		prec = 2
	}
	return Signed(a-b, prec, unit)
}

// mdCell makes text safe inside a Markdown table cell.
func mdCell(s string) string {
	return strings.NewReplacer("|", "\\|", "\n", " ").Replace(s)
}
