package main

import (
	"flag"
	"fmt"
	"io"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

const diagnoseHelp = `heelwatch diagnose: what is flooding, from what the crew reads.

Usage:
  heelwatch diagnose --readings FILE [--vessel FILE|NAME] [--format text|json]

Flags:
  --vessel FILE|NAME  the vessel file, or a bundled vessel's name (default %q)
  --condition FILE    a condition file in place of the vessel file's loading
                      condition (weights; tanks by fill, m³, tonnes or sounding)
  --readings FILE     the readings: drafts at the marks, heel, soundings, each
                      [[reading]] at its minutes (see README, "Draft marks,
                      readings and diagnosis")
  --format F          text (default) or json

The latest reading is explained: every single compartment, every pair of
neighbours and every connected triple is fitted (the water in each, by least
squares on the readings), and the best few are shown with their misfit and
the sounding that would tell them apart. With readings at two or more times,
the trend: the inflow, the equivalent hole by Torricelli, and when the deck
edge and the first opening go under if nothing is done. A reading that
disagrees with the others is named. When nothing fits, it says so.

Exit status: 0 done; 1 bad vessel or readings file; 2 bad usage.
`

func runDiagnose(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch diagnose", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	vessel := fs.String("vessel", vessels.Default, "")
	condition := fs.String("condition", "", "")
	readings := fs.String("readings", "", "")
	format := fs.String("format", "text", "")
	help := func(w io.Writer) { fmt.Fprintf(w, diagnoseHelp, vessels.Default) }
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "diagnose", help)
	}
	if len(pos) > 0 {
		fmt.Fprintf(stderr, "heelwatch diagnose: unexpected argument %q: give the readings with --readings FILE\n", pos[0])
		return exitUsage
	}
	if *readings == "" {
		fmt.Fprintln(stderr, "heelwatch diagnose: --readings FILE is required (see heelwatch diagnose --help)")
		return exitUsage
	}
	write := map[string]func(io.Writer, report.Diagnosis) error{"text": report.DiagnosisText, "json": report.DiagnosisJSON}[*format]
	if write == nil {
		fmt.Fprintf(stderr, "heelwatch diagnose: --format %q: use text or json\n", *format)
		return exitUsage
	}
	v, info, status := openShip(*vessel, *condition, stderr)
	if status != exitOK {
		return status
	}
	rs, err := vessels.LoadReadings(*readings, v)
	if err != nil {
		return refuse(stderr, "heelwatch diagnose", *readings, "nothing was diagnosed", err, "")
	}
	d, err := diagnose(v, info, rs)
	if err != nil {
		fmt.Fprintln(stderr, "heelwatch diagnose:", err)
		return exitInput
	}
	d.VesselFile, d.Made, d.Version = source(info), now(), version
	if err := write(stdout, d); err != nil {
		fmt.Fprintln(stderr, "heelwatch diagnose: writing the diagnosis:", err)
		return exitFailed
	}
	return exitOK
}

// diagnose runs the diagnosis and, with readings at two or more times, the
// trend of its best explanation.
func diagnose(v *engine.Vessel, info *vessels.Info, rs []engine.Reading) (report.Diagnosis, error) {
	res, err := engine.Diagnose(v, rs, engine.DiagnoseOptions{})
	if err != nil {
		return report.Diagnosis{}, err
	}
	d := report.Diagnosis{VesselName: v.Name, Vessel: v, Readings: rs, Result: res}
	switch {
	case len(rs) < 2:
		d.TrendNote = "needs readings at two or more times"
	case len(res.Explanations) == 0 || len(res.Explanations[0].Spaces) == 0:
		d.TrendNote = "the best explanation floods nothing"
	case !res.Fits:
		d.TrendNote = "nothing fits the latest reading, so there is no rate to trust"
	default:
		t, err := engine.EstimateTrend(v, rs, res.Explanations[0], info.TrendOptions())
		if err != nil {
			d.TrendNote = err.Error()
		} else {
			d.Trend = &t
		}
	}
	return d, nil
}
