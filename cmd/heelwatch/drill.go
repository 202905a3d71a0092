package main

import (
	"bytes"
	"flag"
	"fmt"
	"io"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/tui"
	"heelwatch/vessels"
)

const drillHelp = `heelwatch drill: a damage-control exercise from a scenario.

Usage:
  heelwatch drill SCENARIO [--speed N] [--log FILE]      the crew's dashboard
  heelwatch drill SCENARIO --run [--format text|json]    play it with no crew action
  heelwatch drill SCENARIO --debrief                     replay it and print the debrief

SCENARIO is a scenario file, or a bundled scenario's name (%s).
A drill's log is a scenario file too: --run and --debrief replay it.

Flags:
  --run            play the scenario to its end without a screen and print the
                   timeline: one row per event and per minute of scenario time
  --format F       text (default) or json (with --run)
  --debrief        replay the scenario (or a drill's log) and print the Markdown
                   debrief: the truth beside the crew's picture, when the flooded
                   compartments were first marked, each decision's effect and what
                   the best response would have given
  --speed N        dashboard: scenario minutes per real minute at the start
                   (1 = real time, default 10; the instructor changes it)
  --log FILE       dashboard: write the drill's log (a scenario file that replays
                   it) to FILE after every change, and at the end; the debrief
                   is written beside it (FILE.debrief.md, .toml dropped)

Exit status: 0 done; 1 bad scenario or vessel file (file, line and key named);
2 bad usage; 3 she sinks or capsizes in the drill.
`

func runDrill(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch drill", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	runIt := fs.Bool("run", false, "")
	debrief := fs.Bool("debrief", false, "")
	format := fs.String("format", "text", "")
	speed := fs.Float64("speed", 10, "")
	logFile := fs.String("log", "", "")
	help := func(w io.Writer) {
		var names []string
		for _, s := range vessels.BundledScenarios() {
			names = append(names, s.Name)
		}
		fmt.Fprintf(w, drillHelp, joinOr(names))
	}
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "drill", help)
	}
	fail := func(format string, a ...any) int {
		fmt.Fprintf(stderr, "heelwatch drill: "+format+"\n", a...)
		return exitUsage
	}
	switch {
	case len(pos) == 0:
		return fail("name a scenario file or a bundled scenario (see heelwatch drill --help)")
	case len(pos) > 1:
		return fail("one scenario at a time, not %q", pos[1:])
	case *format != "text" && *format != "json":
		return fail("--format %q: use text or json", *format)
	case *runIt && *debrief:
		return fail("--run or --debrief, not both")
	case !(*speed >= 1 && *speed <= 600):
		return fail("--speed %v: scenario minutes per real minute, from 1 (real time) to 600", *speed)
	}
	sc, err := vessels.OpenScenario(pos[0])
	if err != nil {
		fmt.Fprintln(stderr, err)
		return exitFailed
	}
	dr := report.Drill{Scenario: sc.Name, File: sc.File, VesselRef: sc.VesselRef, ConditionRef: sc.ConditionRef, About: sc.About, Seed: sc.Seed,
		Alarms: sc.Alarms, Version: version, AlarmLevel: vessels.AlarmLevelM}
	switch {
	case *runIt:
		d, err := sc.Setup().Play()
		if err != nil {
			fmt.Fprintf(stderr, "heelwatch drill: %v\n", err)
			return exitFailed
		}
		dr.Played = d
		var buf bytes.Buffer
		if *format == "json" {
			err = report.DrillJSON(&buf, dr)
		} else {
			err = report.DrillText(&buf, dr)
		}
		if err == nil {
			_, err = stdout.Write(buf.Bytes())
		}
		if err != nil {
			fmt.Fprintf(stderr, "heelwatch drill: %v\n", err)
			return exitFailed
		}
		if d.Lost() {
			return exitNoEq
		}
		return exitOK
	case *debrief:
		a, err := engine.AnalyseDrill(sc.Setup())
		if err != nil {
			fmt.Fprintf(stderr, "heelwatch drill: %v\n", err)
			return exitFailed
		}
		dr.Played = a.Played
		var buf bytes.Buffer
		if err := report.DrillDebrief(&buf, dr, a); err == nil {
			_, err = stdout.Write(buf.Bytes())
			if err != nil {
				return exitFailed
			}
		}
		return exitOK
	}
	if *logFile != "" {
		if err := tui.CheckLogFile(*logFile); err != nil {
			fmt.Fprintf(stderr, "heelwatch drill: --log %s: %v\n", *logFile, err)
			return exitFailed
		}
	}
	if !interactive(stdout) {
		return fail("the drill's dashboard needs a terminal; --run plays it without one")
	}
	if err := tui.RunDrill(sc, tui.DrillOptions{Speed: *speed, LogFile: *logFile, Version: version}); err != nil {
		fmt.Fprintln(stderr, "heelwatch drill:", err)
		return exitFailed
	}
	return exitOK
}

func joinOr(names []string) string {
	switch len(names) {
	case 0:
		return "none"
	case 1:
		return names[0]
	}
	s := ""
	for i, n := range names {
		switch {
		case i == 0:
		case i == len(names)-1:
			s += " or "
		default:
			s += ", "
		}
		s += n
	}
	return s
}
