package main

import (
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"time"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

const floodHelp = `heelwatch flood: a compartment filling through a hole over time, against its pumps.

Usage:
  heelwatch flood [--vessel FILE|NAME] --hole NAME[:AREA[:Z]] [--pump NAME:M3H ...]
                  [--open A,B] [--cd C] [--limit D] [--criteria=false] [--format F]

Flags:
  --vessel FILE|NAME   the vessel file, or a bundled vessel's name (default %q)
  --condition FILE     a condition file in place of the vessel file's loading
                       condition (weights; tanks by fill, m³, tonnes or sounding)
  --hole NAME[:AREA[:Z]]
                       the compartment that floods and its hole: AREA in m², Z the
                       height of its centre above the baseline in m. The hole is in
                       the shell at the middle of the compartment's length. Without
                       Z: the vessel file's hole position for that compartment if it
                       has one, else the compartment's lowest point; a Z equal to the
                       file hole's height is the file's hole. NAME alone: the vessel
                       file's hole. AREA is at most 100 m². Without --hole: the one compartment named
                       by --pump, or the only one with a hole in the vessel file.
  --pump NAME:M3H      pumping capacity on the flooded compartment, m³/h; repeat to
                       add pumps; "NAME:0" for none. Default: the vessel file's
                       pump_m3h for that compartment.
  --open A,B           other compartments open to the sea from the start
  --cd C               discharge coefficient of the hole, 0 < C ≤ 1 (default: the
                       vessel file's, else 0.6 for a sharp-edged hole; a ragged hull
                       hole is nearer 0.7)
  --limit D            time limit, e.g. 90m, 6h (default 24h)
  --criteria=false     do not judge the vessel's criteria along the way (about four
                       times quicker; no criterion events, no criteria at the stages)
  --format F           text (default) or json

Inflow by Torricelli's law, Q = C_d·A·√(2 g h), h the head across the hole at
the current heel and trim; the ship is solved afresh at every step with the
water held as an added weight. The run stops when the levels inside and
outside meet, when the pumps hold the level, when the compartment is full,
when she sinks or capsizes, or at the limit. It prints the events (deck edge,
margin line, openings, criteria), the state against time, the intermediate
stages at 25, 50 and 75 %% of the final flooded volume, and the final state
beside the lost-buoyancy solution.

Exit status: 0 done; 1 bad vessel file; 2 bad usage; 3 she sinks or capsizes
on the way (or no floating position could be found).
`

// pumpFlag collects --pump NAME:M3H.
type pumpFlag []string

func (p *pumpFlag) String() string     { return strings.Join(*p, ";") }
func (p *pumpFlag) Set(s string) error { *p = append(*p, s); return nil }

func runFlood(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch flood", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	vessel := fs.String("vessel", vessels.Default, "")
	condition := fs.String("condition", "", "")
	var holes, pumps pumpFlag
	fs.Var(&holes, "hole", "")
	fs.Var(&pumps, "pump", "")
	var open, conns listFlag
	fs.Var(&open, "open", "")
	fs.Var(&conns, "connection", "")
	cdText := fs.String("cd", "", "")
	limit := fs.Duration("limit", 24*time.Hour, "")
	criteria := fs.Bool("criteria", true, "")
	format := fs.String("format", "text", "")
	help := func(w io.Writer) { fmt.Fprintf(w, floodHelp, vessels.Default) }
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "flood", help)
	}
	fail := func(format string, a ...any) int {
		fmt.Fprintf(stderr, "heelwatch flood: "+format+"\n", a...)
		return exitUsage
	}
	if len(pos) > 0 {
		return fail("unexpected argument %q: name the compartment with --hole NAME[:AREA[:Z]]", pos[0])
	}
	if *format != "text" && *format != "json" {
		return fail("--format %q: use text or json", *format)
	}
	if len(holes) > 1 {
		return fail("one --hole at a time: the run follows one compartment filling")
	}
	if !(*limit > 0) {
		return fail("--limit %v: give a positive duration such as 90m or 6h", *limit)
	}
	cd := math.NaN()
	if *cdText != "" {
		c, err := strconv.ParseFloat(*cdText, 64)
		if err != nil {
			return fail("--cd %q: a discharge coefficient is a number with 0 < C ≤ 1 (about 0.6 for a sharp-edged hole, 0.7 for a ragged one)", *cdText)
		}
		cd = c
	}

	v, info, status := openShip(*vessel, *condition, stderr)
	if status != exitOK {
		return status
	}
	v, msg := applyConnections(v, conns)
	if msg != "" {
		return fail("%s", msg)
	}
	index := func(name string) (int, bool) { return compartmentNamed(v, name) } // names ignore case
	ask := vessels.FloodAsk{Compartment: -1, AreaM2: math.NaN(), ZM: math.NaN(), Cd: cd,
		LimitS: limit.Seconds(), Criteria: *criteria, By: "command line"}
	for _, p := range pumps {
		name, nums := splitNumbers(p, 1)
		if len(nums) != 1 {
			return fail("--pump %q: write NAME:M3H, the capacity in m³/h, e.g. --pump %q", p, exampleName(v)+":120")
		}
		i, ok := index(name)
		if !ok {
			return fail("%s", unknownName("--pump", name, v))
		}
		ask.Pumps = append(ask.Pumps, vessels.FloodPump{Compartment: i, M3h: nums[0]})
	}
	holeName := ""
	if len(holes) == 1 {
		name, nums := splitNumbers(holes[0], 2)
		if msg := finiteNumbers("--hole", holes[0], nums); msg != "" {
			return fail("%s", msg)
		}
		i, ok := index(name)
		if !ok {
			msg := unknownName("--hole", name, v)
			if strings.Contains(holes[0], ":") {
				msg += "\n(write --hole NAME[:AREA[:Z]], AREA in m² and Z in m above the baseline)"
			}
			return fail("%s", msg)
		}
		ask.Compartment, holeName = i, name
		if len(nums) > 0 {
			ask.AreaM2 = nums[0]
		}
		if len(nums) > 1 {
			ask.ZM = nums[1]
		}
	}
	base, msg := damageOf(v, open, nil)
	if msg != "" {
		return fail("%s", msg)
	}
	ask.Base = base
	fc, err := vessels.ResolveFlood(v, info, ask)
	if err != nil {
		return fail("%s", floodAskWords(err, holeName, !math.IsNaN(ask.AreaM2), *cdText))
	}
	c := fc.Case
	rep, err := engine.RunFlood(c, nil)
	if err != nil {
		return fail("%v", err)
	}
	fr := report.Flood{Run: rep, VesselFile: source(info), Open: inOrderGiven(v, open), HoleFrom: fc.HoleFrom, PumpsFrom: fc.PumpsFrom, Version: version, Passenger: v.Passenger(), StrengthWhy: engine.StrengthMissing(v)}
	if fr.Network, err = floodNetwork(c, rep); err != nil {
		return fail("%v", err)
	}
	if *format == "json" {
		err = report.FloodJSON(stdout, fr)
	} else {
		err = report.FloodText(stdout, fr)
	}
	if err != nil {
		fmt.Fprintln(stderr, "heelwatch flood: writing the report:", err)
		return exitFailed
	}
	return floodExit(fr, stderr)
}

// floodAskWords says what is wrong with the flooding case asked, naming the
// flag it came from (vessels.ResolveFlood decides; this only words it).
func floodAskWords(err error, holeName string, areaGiven bool, cdText string) string {
	e := vessels.AsFloodAskError(err)
	switch {
	case e == nil:
		return err.Error()
	case e.Field == vessels.FieldArea && holeName != "" && areaGiven:
		return fmt.Sprintf("--hole %q: %s", holeName, e.Msg)
	case e.Field == vessels.FieldZ:
		return "--hole: " + e.Msg
	case e.Field == vessels.FieldCd:
		return fmt.Sprintf("--cd %q: %s", cdText, e.Msg)
	case e.Field == vessels.FieldPumps:
		return "--pump: " + e.Msg
	case e.Field == vessels.FieldBase:
		return "--open: " + e.Msg + "; leave it out of --open"
	}
	return err.Error()
}

// floodExit is the exit status of a finished run, with why on stderr when
// she sinks or capsizes (3) or the run failed.
func floodExit(fr report.Flood, stderr io.Writer) int {
	rep := fr.Run
	if n := fr.Network; n != nil && (n.End == engine.FloodSinks || n.End == engine.FloodCapsizes) {
		fmt.Fprintf(stderr, "heelwatch flood: through the ship: %s\n", n.EndReason)
		return exitNoEq
	}
	switch rep.End {
	case engine.FloodSinks, engine.FloodCapsizes:
		fmt.Fprintf(stderr, "heelwatch flood: %s\n", rep.EndReason)
		return exitNoEq
	case engine.FloodFailed:
		fmt.Fprintf(stderr, "heelwatch flood: %s\n", rep.EndReason)
		if rep.Final.NoEq != nil || rep.EndNoEq != nil {
			return exitNoEq
		}
		return exitFailed
	}
	return exitOK
}

// splitNumbers splits "NAME:1:2" into the name and up to max trailing
// numbers (the name itself may hold colons).
func splitNumbers(s string, max int) (string, []float64) {
	parts := strings.Split(s, ":")
	var nums []float64
	for len(parts) > 1 && len(nums) < max {
		f, err := strconv.ParseFloat(strings.TrimSpace(parts[len(parts)-1]), 64)
		if err != nil {
			break
		}
		nums = append([]float64{f}, nums...)
		parts = parts[:len(parts)-1]
	}
	return strings.TrimSpace(strings.Join(parts, ":")), nums
}
