package main

import (
	"fmt"
	"io"
	"os"

	"github.com/charmbracelet/x/term"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/tui"
	"heelwatch/vessels"
)

// dashboardOptions are the top-level flags that only the dashboard uses.
type dashboardOptions struct {
	logFile   string
	palette   string
	reportDir string
	open      listFlag // compartments open to the sea at start
	perm      permFlag // their permeabilities
	condition string   // --condition FILE
	resume    string   // --resume FILE: a state saved from the dashboard
}

// interactive reports whether the dashboard can run: standard input and
// output are both terminals. Tests and pipes get the printed condition.
var interactive = func(stdout io.Writer) bool {
	if g, ok := stdout.(*outputGuard); ok {
		stdout = g.file()
	}
	f, ok := stdout.(*os.File)
	return ok && term.IsTerminal(f.Fd()) && term.IsTerminal(os.Stdin.Fd())
}

// runDashboard opens the dashboard on the vessel. Where there is no
// terminal to draw on, it prints the solved intact condition instead.
func runDashboard(vessel string, o dashboardOptions, stdout, stderr io.Writer) int {
	switch o.palette {
	case "", "day", "night", "mono":
	default:
		fmt.Fprintf(stderr, "heelwatch: --palette %q: use day, night or mono\n", o.palette)
		return exitUsage
	}
	if o.logFile != "" {
		// Refused here, terminal or not, before anything is shown.
		if err := tui.CheckLogFile(o.logFile); err != nil {
			fmt.Fprintf(stderr, "heelwatch: --log %s: %v\n", o.logFile, err)
			return exitFailed
		}
	}
	if o.reportDir != "" {
		// Refused at start, as --log is: a folder that is not there is
		// otherwise found only when the first report or save fails. A
		// folder that is not there is a usage error (exit 2); a log that
		// cannot be written is a failed write (exit 1), as for every
		// output.
		if err := tui.CheckReportDir(o.reportDir); err != nil {
			fmt.Fprintf(stderr, "heelwatch: --reports %s: %v\n", o.reportDir, err)
			return exitUsage
		}
	}
	if o.resume != "" && (o.condition != "" || len(o.open) > 0) {
		fmt.Fprintln(stderr, "heelwatch: --resume takes up a saved state with its own condition and damage: give --resume alone, or --condition and --open")
		return exitUsage
	}
	if o.resume != "" && vessel == "" {
		var err error
		if vessel, err = vessels.StateVessel(o.resume); err != nil {
			fmt.Fprintln(stderr, "heelwatch:", err)
			return exitInput
		}
	}
	base, info, status := openVessel(vessel, stderr)
	if status != exitOK {
		return status
	}
	v, cond, status := withCondition(base, info, o.condition, stderr)
	if status != exitOK {
		return status
	}
	var resume *vessels.State
	if o.resume != "" {
		if v, resume, status = resumeState(base, info, o.resume, stderr); status != exitOK {
			return status
		}
		cond = resume.Condition
	}
	start, msg := damageOf(v, o.open, o.perm)
	if msg != "" {
		fmt.Fprintln(stderr, "heelwatch:", msg)
		return exitUsage
	}
	if resume != nil {
		start = resume.Damage
	}
	if interactive(stdout) {
		err := tui.Run(v, info, tui.Options{LogFile: o.logFile, Palette: o.palette,
			VesselFile: source(info), ReportDir: o.reportDir, Version: version, Start: start,
			Base: base, Condition: cond, Resume: resume})
		if err != nil {
			fmt.Fprintln(stderr, "heelwatch:", err)
			return exitFailed
		}
		return exitOK
	}
	a := engine.Assess(v, start)
	r := report.New(v, source(info), a, now(), version)
	r.Condition = info.Condition
	r.Open = inOrderGiven(v, o.open)
	if resume != nil {
		r.Open = openIn(v, start)
	}
	if err := report.Text(stdout, r); err != nil {
		return exitFailed
	}
	if resume != nil {
		fmt.Fprintln(stdout, "\nNot a terminal, so no dashboard: this is the state taken up with --resume.")
	} else if len(o.open) > 0 {
		fmt.Fprintln(stdout, "\nNot a terminal, so no dashboard: this is the damage case given with --open.")
	} else {
		fmt.Fprintln(stdout, "\nNot a terminal, so no dashboard: this is the intact condition. 'heelwatch solve --open NAME' solves a damage case.")
	}
	if a.Position == nil {
		return exitNoEq
	}
	return exitOK
}
