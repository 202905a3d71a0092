package main

import (
	"flag"
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

const checkHelp = `heelwatch check: validate vessel files and summarise each on one screen.

Usage:
  heelwatch check [FILE|NAME ...]

With no argument it checks --vessel, or the bundled %q. Every problem in a
file is listed with its line and key. For a good file it prints the hull's
dimensions, the loading condition, the intact floating position and the
compartments with their volume, use, permeability and contents; and a
second look at the model, with WARNING where it finds something to mend:
the intact criteria (pass or FAIL, figure and margin), the hull volume
below the deck that no compartment holds (a warning above 1 %%), and holes
that are not on the shell (more than 0.05 m from it) or not in their
compartment; and the openings that lead to no compartment (no leads_to).
With --condition FILE each ship is checked loaded to that condition file.

Exit status: 0 every file is good and floats intact; 1 a file has problems;
2 bad usage; 3 a good file whose loading condition does not float intact.
`

func runCheck(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch check", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	vessel := fs.String("vessel", "", "")
	condition := fs.String("condition", "", "")
	help := func(w io.Writer) { fmt.Fprintf(w, checkHelp, vessels.Default) }
	files, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "check", help)
	}
	if len(files) == 0 {
		files = []string{*vessel}
	}
	worst := exitOK
	for i, f := range files {
		if i > 0 {
			fmt.Fprintln(stdout)
		}
		v, info, status := openVessel(f, stderr)
		if status == exitOK {
			v, _, status = withCondition(v, info, *condition, stderr)
		}
		if status == exitOK {
			status = summarise(stdout, v, info)
		}
		// Bad input outranks no equilibrium: it is the first thing to fix.
		if status == exitInput || (status == exitNoEq && worst == exitOK) {
			worst = status
		}
	}
	return worst
}

// summarise prints one screen about a good vessel file and returns exitNoEq
// when its loading condition does not float intact.
func summarise(w io.Writer, v *engine.Vessel, info *vessels.Info) int {
	h := v.Hull
	fmt.Fprintf(w, "%s — %s: no errors (the warnings below, if any, are things to mend)\n", v.Name, source(info))
	if info.Description != "" {
		fmt.Fprintf(w, "  %s\n", firstLine(info.Description))
	}
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	shape := "box"
	if !h.Box {
		shape = fmt.Sprintf("sections, %d stations", len(h.Stations()))
	}
	fmt.Fprintf(tw, "  hull\t%s; length %.2f m, breadth %.2f m, depth %.2f m\n", shape, h.LengthM, h.BreadthM, h.DepthM)
	fmt.Fprintf(tw, "  water\t%.3f t/m³\n", v.WaterDensity)

	var fixed, tanks float64
	for _, wt := range v.Weights {
		fixed += wt.MassT
	}
	for i := range v.Compartments {
		m, _, _, _, _ := v.TankContents(i)
		tanks += m
	}
	if info.Condition != "" {
		fmt.Fprintf(tw, "  condition\t%s\n", info.Condition)
	}
	fmt.Fprintf(tw, "  %s\t%s %.1f t + tank contents %.1f t = %.1f t\n", "weights", plural(len(v.Weights), "weight"), fixed, tanks, fixed+tanks)
	pos, err := engine.Solve(v, v.Intact())
	status := exitOK
	if err != nil {
		if ne, ok := err.(*engine.NoEquilibrium); ok {
			fmt.Fprintf(tw, "  intact\tNO FLOATING POSITION: %s (%s)\n", ne.Outcome.Plain(), ne.Reason)
		} else {
			fmt.Fprintf(tw, "  intact\tNO FLOATING POSITION: %v\n", err)
		}
		status = exitNoEq
	} else {
		fmt.Fprintf(tw, "  intact\tdisplacement %.1f t; drafts aft %.3f m, amidships %.3f m, forward %.3f m\n", pos.DisplacementT, pos.DraftAftM, pos.DraftMidM, pos.DraftFwdM)
		fmt.Fprintf(tw, "  \ttrim %s; heel %s; GM upright %.3f m, where she lies %.3f m (KG %.3f m, FSC %.3f m)\n", report.TrimWords(pos.TrimM), report.HeelWords(pos.HeelDeg), pos.GMUprightM, pos.GMAtRestM, pos.KGM, pos.FSCM)
		fmt.Fprintf(tw, "  freeboard\tleast to deck edge %.3f m at x %.1f m, %s\n", pos.DeckEdge.HeightM, pos.DeckEdge.XM, pos.DeckEdge.Side)
		// Not a fault of the file's form, but worth a second look: an
		// opening under water with the ship intact is most often a typing
		// slip in its position.
		for _, o := range pos.Openings {
			if o.Immersed() {
				what := "not weathertight"
				if o.Weathertight {
					what = "closed weathertight"
				}
				fmt.Fprintf(tw, "  WARNING\topening %q (%s) is %.2f m under water intact: check its position (x %.2f, y %.2f, z %.2f m)\n", o.Name, what, -o.HeightM, o.X, o.Y, o.Z)
			}
		}
	}
	wt := 0
	for _, o := range v.Openings {
		if o.Weathertight {
			wt++
		}
	}
	margin := "" // a passenger-ship notion: the ferry's, not a cargo ship's
	if v.Passenger() {
		margin = fmt.Sprintf("; margin line %.3f m below the deck at side", v.MarginLineM)
	}
	fmt.Fprintf(tw, "  openings\t%d (%d closed weathertight)%s\n", len(v.Openings), wt, margin)
	crit := "none"
	if len(v.CriteriaSets) > 0 {
		crit = strings.Join(v.CriteriaSets, ", ")
	}
	fmt.Fprintf(tw, "  criteria\t%s\n", crit)
	fmt.Fprintf(tw, "  strength\t%s\n", strengthWords(v))
	tw.Flush()
	practice(w, v, info)

	fmt.Fprintf(w, "\n  %s\n", plural(len(v.Compartments), "compartment"))
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  name\tuse\tμ\tvolume m³\tcontents")
	var total float64
	for i, c := range v.Compartments {
		vol := c.Volume()
		total += vol
		mu := report.Permeability(c.Permeability)
		if i < len(info.Compartments) && info.Compartments[i].DefaultPermeabilityFromUse {
			mu += "*"
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%9.1f\t%s\n", c.Name, dash(c.Use), mu, vol, contents(v, i))
	}
	fmt.Fprintf(tw, "  total\t\t\t%9.1f\t\n", total)
	tw.Flush()
	fmt.Fprintln(w, "  * permeability from the compartment's use")
	return status
}

// contents says what a tank holds: liquid, fill and mass.
func contents(v *engine.Vessel, i int) string {
	c := v.Compartments[i]
	if c.Liquid == nil || c.Liquid.Fill <= 0 {
		return "—"
	}
	m, _, _, _, fsm := v.TankContents(i)
	s := fmt.Sprintf("%s %.0f %% %.1f t", dash(c.Liquid.Name), 100*c.Liquid.Fill, m)
	if fsm > 0 {
		s += fmt.Sprintf(", FSM %.1f t·m", fsm)
	}
	return s
}

func dash(s string) string {
	if s == "" {
		return "—"
	}
	return s
}

func firstLine(s string) string {
	s = strings.TrimSpace(s)
	if i := strings.IndexByte(s, '\n'); i >= 0 {
		s = s[:i]
	}
	return s
}
