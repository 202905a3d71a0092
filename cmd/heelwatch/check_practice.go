package main

import (
	"fmt"
	"io"
	"math"
	"strings"
	"text/tabwriter"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// Thresholds of check's second look at a good file (heelwatch's own).
const (
	// unheldWarnPart: a share of the hull below the deck held by no
	// compartment above which check warns.
	unheldWarnPart = 0.01
	// shellTolM: how far a hole may lie from the shell and still count as
	// on it (offsets read to the centimetre, and the hull's sections
	// interpolated between stations).
	shellTolM = 0.05
)

// practice prints check's second look at a good vessel file: what makes it
// a sound model beyond its form. The intact condition against the criteria
// she is held to (a ship that fails them opens the dashboard in danger);
// the hull volume below the deck that no compartment holds (buoyancy that
// nothing can flood); holes that are not on the shell (the sea reaches an
// inner bulkhead only through another space); openings that name no
// compartment they lead to (each counts as a point of downflooding, even
// into a space that is flooded already).
func practice(w io.Writer, v *engine.Vessel, info *vessels.Info) {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	defer tw.Flush()
	fmt.Fprintln(tw)

	if len(v.CriteriaSets) > 0 {
		a := engine.Assess(v, v.Intact())
		judged, pass := 0, 0
		for _, c := range a.Criteria {
			if !c.Indicator {
				judged++
				if c.Pass {
					pass++
				}
			}
		}
		switch {
		case a.Position == nil:
			fmt.Fprintf(tw, "  intact criteria\tnot judged: no floating position\n")
		case pass < judged:
			fmt.Fprintf(tw, "  WARNING\tintact criteria: %d of %d fail; the dashboard opens in danger\n", judged-pass, judged)
		default:
			fmt.Fprintf(tw, "  intact criteria\t%d of %d pass\n", pass, judged)
		}
		tw.Flush()
		for _, c := range a.Criteria {
			word := "pass"
			switch {
			case c.Indicator:
				word = "read"
			case !c.Pass:
				word = "FAIL"
			}
			fmt.Fprintf(w, "    %s  %s: %s [%s]\n", word, c.Requirement, criterionFigures(c), c.Set)
		}
	}

	hull, unheld := engine.UnheldVolume(v)
	part := unheld / hull
	line := fmt.Sprintf("%.1f m³ below the deck; %.1f m³ (%.2f %%) held by no compartment", hull, unheld, 100*part)
	if part > unheldWarnPart {
		fmt.Fprintf(tw, "  WARNING\thull %s: buoyancy that nothing floods; raise the compartments' tops to the deck or add the spaces missing\n", line)
	} else {
		fmt.Fprintf(tw, "  hull\t%s\n", line)
	}

	holes, off := 0, 0
	for i, ci := range info.Compartments {
		h := ci.Hole
		if h == nil || i >= len(v.Compartments) {
			continue
		}
		holes++
		c := v.Compartments[i]
		b := c.Box
		outside := h.XM < b.X0-shellTolM || h.XM > b.X1+shellTolM || h.YM < b.Y0-shellTolM ||
			h.YM > b.Y1+shellTolM || h.ZM < b.Z0-shellTolM || h.ZM > b.Z1+shellTolM
		d := v.Hull.ShellDistance(h.XM, h.YM, h.ZM)
		switch {
		case outside:
			off++
			fmt.Fprintf(tw, "  WARNING\tthe hole into %q at x %.2f, y %.2f, z %.2f m is outside that compartment\n", c.Name, h.XM, h.YM, h.ZM)
		case !(d <= shellTolM):
			off++
			fmt.Fprintf(tw, "  WARNING\tthe hole into %q at x %.2f, y %.2f, z %.2f m is %s from the shell: on an inner bulkhead or tank top, which the sea reaches only through another space; put it on the shell\n",
				c.Name, h.XM, h.YM, h.ZM, metres(d))
		}
	}
	switch {
	case holes == 0:
		fmt.Fprintf(tw, "  holes\tnone in the file\n")
	case off == 0 && holes == 1:
		fmt.Fprintf(tw, "  holes\t1 hole, on the shell\n")
	case off == 0:
		fmt.Fprintf(tw, "  holes\t%d holes, all on the shell\n", holes)
	}

	var nowhere []string
	for _, o := range v.Openings {
		if strings.TrimSpace(o.LeadsTo) == "" {
			nowhere = append(nowhere, o.Name)
		}
	}
	switch {
	case len(v.Openings) == 0:
		fmt.Fprintf(tw, "  leads to\tno openings in the file\n")
	case len(nowhere) == 0:
		fmt.Fprintf(tw, "  leads to\tevery opening names the compartment it lets water into\n")
	default:
		fmt.Fprintf(tw, "  leads to\t%d of %d openings lead to no compartment (no leads_to: a space not modelled, a point of downflooding): %s\n",
			len(nowhere), len(v.Openings), strings.Join(nowhere, ", "))
	}
}

// criterionFigures is a criterion's value found and margin, in its unit.
func criterionFigures(c engine.CriterionResult) string {
	prec := 3
	switch c.Unit {
	case "°", "deg":
		prec = 1
	case "m":
		prec = 3
	}
	unit := strings.TrimSpace(c.Unit)
	if unit != "" && unit != "°" {
		unit = " " + unit
	}
	if math.IsNaN(c.Actual) || math.IsInf(c.Actual, 0) {
		return "—"
	}
	if c.Indicator {
		return fmt.Sprintf("%.*f%s", prec, c.Actual, unit)
	}
	return fmt.Sprintf("%.*f%s (margin %+.*f)", prec, c.Actual, unit, prec, c.Margin)
}

// metres is a distance in metres, "—" when it is not finite.
func metres(d float64) string {
	if math.IsInf(d, 0) || math.IsNaN(d) {
		return "— (no hull section there)"
	}
	return fmt.Sprintf("%.2f m", d)
}
