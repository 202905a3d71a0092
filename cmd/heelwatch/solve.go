package main

import (
	"flag"
	"fmt"
	"io"
	"strings"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

const solveHelp = `heelwatch solve: where the ship floats with compartments open to the sea.

Usage:
  heelwatch solve [--vessel FILE|NAME] [--open A,B] [--perm NAME=μ,...]
                  [--connection NAME=open|closed] [--remedies] [--format F]

Flags:
  --vessel FILE|NAME  the vessel file, or a bundled vessel's name (default %q)
  --condition FILE    a condition file in place of the vessel file's loading
                      condition (weights; tanks by fill, m³, tonnes or sounding)
  --open A,B          compartments open to the sea (lost buoyancy), by the names
                      in the vessel file (case does not matter); repeat the flag
                      or separate with commas
  --perm NAME=μ,...   permeability of an open compartment for this solve,
                      0 < μ ≤ 1, in place of the file's (e.g. --perm "Hold 2=0.85",
                      "Hold 2=0,85" or "Hold 2=85%%")
` + connectionHelp + `  --remedies          also work out the righting options: ballast into an intact
                      tank on the high side, a low-side tank pumped out, liquid
                      moved to the mirror tank; with negative upright GM (a loll)
                      only options that lower G. Each is solved from the hull
                      geometry at every tenth of its amount and is advisable
                      only if she is safe at each step and ends with positive
                      upright GM; the note says how long it takes at the
                      file's pump rates. Options to weigh, not orders.
  --format F          text (default), json or markdown

Water spreads from the open compartments through every open connection whose
sill is under the water inside and every opening that goes under and leads
into a compartment, to a fixed point; the chain is printed. The answer is the
direct solution from the hull geometry at the actual heel and trim (of that
final state), with the hand method (lost buoyancy, small angles) beside it
where it applies, the flags, and the criteria the vessel is held to.

GM is the upright GM (she brought upright, same displacement, free trim,
free-surface corrected); the GM where she lies, the GZ slope at her heel, is
shown second. A negative upright GM with a heel is a loll. GM and
displacement are per the ship's own weight; the water in flooded spaces is
shown beside it. A tank's capacity is μ × its volume and its fill a fraction
of that; a holed tank loses its contents, and oil lost is listed as spills.
An opening into a space flooded already (leads_to) is no point of
progressive flooding. Within 5° of upright each criterion is judged on the
worse side of the GZ curve. The margin line is shown on passenger ships only.

Exit status: 0 solved; 1 bad vessel file; 2 bad usage (an unknown compartment,
a permeability out of range); 3 no equilibrium (she sinks or capsizes).
`

func runSolve(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch solve", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	vessel := fs.String("vessel", vessels.Default, "")
	condition := fs.String("condition", "", "")
	var open, conns listFlag
	var perm permFlag
	fs.Var(&open, "open", "")
	fs.Var(&conns, "connection", "")
	fs.Var(&perm, "perm", "")
	format := fs.String("format", "text", "")
	remedies := fs.Bool("remedies", false, "")
	help := func(w io.Writer) { fmt.Fprintf(w, solveHelp, vessels.Default) }
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "solve", help)
	}
	if len(pos) > 0 {
		fmt.Fprintf(stderr, "heelwatch solve: unexpected argument %q: name the vessel with --vessel and compartments with --open\n", pos[0])
		return exitUsage
	}
	write, ok := writers[*format]
	if !ok {
		fmt.Fprintf(stderr, "heelwatch solve: --format %q: use text, json or markdown\n", *format)
		return exitUsage
	}

	v, info, status := openShip(*vessel, *condition, stderr)
	if status != exitOK {
		return status
	}
	v, msg := applyConnections(v, conns)
	if msg != "" {
		fmt.Fprintln(stderr, "heelwatch solve:", msg)
		return exitUsage
	}
	d, msg := damageOf(v, open, perm)
	if msg != "" {
		fmt.Fprintln(stderr, "heelwatch solve:", msg)
		return exitUsage
	}
	sp := engine.Progressive(v, d)
	a := engine.Assess(v, sp.Damage)
	r := report.New(v, source(info), a, now(), version)
	r.Spread = &sp
	r.Condition = info.Condition
	r.Open = inOrderGiven(v, open)
	if *remedies {
		rs := engine.FindRemedies(v, sp.Damage)
		r.Remedies = &rs
	}
	if err := write(stdout, r); err != nil {
		fmt.Fprintln(stderr, "heelwatch solve: writing the report:", err)
		return exitFailed
	}
	if a.Position == nil {
		why := "no equilibrium"
		if a.NoEq != nil {
			why = a.NoEq.Error()
		}
		fmt.Fprintf(stderr, "heelwatch solve: %s\n", why)
		return exitNoEq
	}
	return exitOK
}

// writers are the report formats of solve.
var writers = map[string]func(io.Writer, report.Report) error{
	"text":     report.Text,
	"json":     report.JSON,
	"markdown": report.Markdown,
}

// damageOf turns --open and --perm into a damage state of v. It returns a
// message saying what is wrong when a name or a value cannot be used.
func damageOf(v *engine.Vessel, open, perm []string) (engine.Damage, string) {
	index := func(name string) (int, bool) { return compartmentNamed(v, name) } // names ignore case
	d := v.Intact()
	for _, name := range open {
		i, ok := index(name)
		if !ok {
			return nil, unknownName("--open", name, v)
		}
		d[i].Open = true
	}
	for _, item := range perm {
		eq := strings.LastIndexByte(item, '=')
		if eq < 0 {
			example := "Hold 2"
			if len(v.Compartments) > 0 {
				example = v.Compartments[0].Name
			}
			return nil, fmt.Sprintf("--perm %q: write NAME=μ, e.g. --perm %q", item, example+"=0.85")
		}
		name, val := strings.TrimSpace(item[:eq]), strings.TrimSpace(item[eq+1:])
		i, ok := index(name)
		if !ok {
			return nil, unknownName("--perm", name, v)
		}
		// Read as the dashboard reads it (vessels.ParsePermeability),
		// decimal comma included (permFlag keeps it in the item).
		mu, err := vessels.ParsePermeability(val)
		if err != nil {
			return nil, fmt.Sprintf("--perm %q: permeability %v", name, err)
		}
		if !d[i].Open {
			return nil, fmt.Sprintf("--perm %q: that compartment is not open to the sea; add it to --open", name)
		}
		d[i].Permeability = mu
	}
	return d, ""
}

// inOrderGiven returns the names in the order first given, once each,
// spelt as in the vessel file (names ignore case; one not in the file is
// kept as given).
func inOrderGiven(v *engine.Vessel, names []string) []string {
	seen := map[string]bool{}
	var out []string
	for _, n := range names {
		if i, ok := compartmentNamed(v, n); ok {
			n = v.Compartments[i].Name
		}
		if !seen[n] {
			seen[n] = true
			out = append(out, n)
		}
	}
	return out
}

// unknownName refuses a compartment name by name and lists the valid ones.
func unknownName(flagName, name string, v *engine.Vessel) string {
	var b strings.Builder
	fmt.Fprintf(&b, "%s: %q is not a compartment of %s (names ignore case).", flagName, name, v.Name)
	if len(v.Compartments) == 0 {
		b.WriteString(" It has no compartments.")
		return b.String()
	}
	b.WriteString(" The compartments are:")
	for _, c := range v.Compartments {
		fmt.Fprintf(&b, "\n  %s", c.Name)
	}
	return b.String()
}
