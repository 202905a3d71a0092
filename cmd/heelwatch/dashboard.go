package main

import (
	"fmt"
	"io"

	"heelwatch/engine"
	"heelwatch/tui/report"
)

// runDashboard opens the dashboard on the vessel. Until the dashboard is
// built, it prints the solved intact condition instead.
func runDashboard(vessel string, stdout, stderr io.Writer) int {
	v, info, status := openVessel(vessel, stderr)
	if status != exitOK {
		return status
	}
	a := engine.Assess(v, v.Intact())
	r := report.New(v, source(info), a, now(), version)
	r.Condition = info.Condition
	if err := report.Text(stdout, r); err != nil {
		return exitFailed
	}
	fmt.Fprintln(stdout, "\nThe dashboard is coming; meanwhile 'heelwatch solve --open NAME' solves a damage case.")
	if a.Position == nil {
		return exitNoEq
	}
	return exitOK
}
