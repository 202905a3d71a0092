package main

import (
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"
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
  --hole NAME[:AREA[:Z]]
                       the compartment that floods and its hole: AREA in m², Z the
                       height of its centre above the baseline in m. The hole is in
                       the shell at the middle of the compartment's length. Without
                       Z: the vessel file's hole position for that compartment if it
                       has one, else the compartment's lowest point. NAME alone: the
                       vessel file's hole. Without --hole: the one compartment named
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
	var holes, pumps pumpFlag
	fs.Var(&holes, "hole", "")
	fs.Var(&pumps, "pump", "")
	var open listFlag
	fs.Var(&open, "open", "")
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
		if err != nil || !(c > 0 && c <= 1) {
			return fail("--cd %q: a discharge coefficient is a number with 0 < C ≤ 1 (about 0.6 for a sharp-edged hole, 0.7 for a ragged one)", *cdText)
		}
		cd = c
	}

	v, info, status := openVessel(*vessel, stderr)
	if status != exitOK {
		return status
	}
	index := v.CompartmentIndex // names ignore case
	fileHole := func(i int) *engine.Hole {
		if i < len(info.Compartments) {
			return info.Compartments[i].Hole
		}
		return nil
	}

	// The pumps, by compartment.
	type pumpSpec struct {
		name string
		m3h  float64
	}
	var pumpList []pumpSpec
	for _, p := range pumps {
		name, nums := splitNumbers(p, 1)
		if len(nums) != 1 {
			return fail("--pump %q: write NAME:M3H, the capacity in m³/h, e.g. --pump %q", p, exampleName(v)+":120")
		}
		if _, ok := index(name); !ok {
			return fail("%s", unknownName("--pump", name, v))
		}
		if !(nums[0] >= 0) || math.IsInf(nums[0], 0) {
			return fail("--pump %q: capacity %v m³/h must be zero or more", p, nums[0])
		}
		pumpList = append(pumpList, pumpSpec{name, nums[0]})
	}

	// Which compartment floods, and its hole.
	ci := -1
	var area, z float64 = math.NaN(), math.NaN()
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
		ci = i
		if len(nums) > 0 {
			area = nums[0]
		}
		if len(nums) > 1 {
			z = nums[1]
		}
	} else {
		named := map[int]bool{}
		for _, p := range pumpList {
			i, _ := index(p.name)
			named[i] = true
		}
		var withHole []int
		for i := range v.Compartments {
			if fileHole(i) != nil {
				withHole = append(withHole, i)
			}
		}
		switch {
		case len(named) == 1:
			for i := range named {
				ci = i
			}
		case len(withHole) == 1:
			ci = withHole[0]
		default:
			var b strings.Builder
			b.WriteString("name the compartment that floods with --hole NAME[:AREA[:Z]].")
			if len(withHole) > 0 {
				b.WriteString(" These have a hole in the vessel file:")
				for _, i := range withHole {
					fmt.Fprintf(&b, "\n  %s", v.Compartments[i].Name)
				}
			}
			return fail("%s", b.String())
		}
	}
	comp := v.Compartments[ci]
	var hole engine.Hole
	from := "command line"
	fh := fileHole(ci)
	switch {
	case !math.IsNaN(area) && !(area > 0 && !math.IsInf(area, 0)):
		return fail("--hole %q: area %v m² must be a positive number", comp.Name, area)
	case !math.IsNaN(z):
		h, err := engine.ShellHole(v, ci, area, z, 0)
		if err != nil {
			return fail("--hole: %v", err)
		}
		hole = h
	case fh != nil:
		hole = *fh
		from = "vessel file"
		if !math.IsNaN(area) {
			hole.AreaM2 = area
			from = "vessel file's position, area from the command line"
		}
	case !math.IsNaN(area):
		h, err := engine.ShellHole(v, ci, area, math.NaN(), 0)
		if err != nil {
			return fail("--hole: %v", err)
		}
		hole = h
		from = "command line, at the compartment's lowest point"
	default:
		return fail("%q has no hole in the vessel file: give its area, e.g. --hole %q", comp.Name, comp.Name+":0.05")
	}
	if !math.IsNaN(cd) {
		hole.Cd = cd
	} else if fh != nil && hole.Cd == 0 {
		// A hole placed anew keeps the file's discharge coefficient.
		hole.Cd = fh.Cd
	}

	var enginePumps []engine.Pump
	pumpFrom := "command line"
	if len(pumpList) == 0 {
		if ci < len(info.Compartments) && info.Compartments[ci].PumpM3h > 0 {
			enginePumps = []engine.Pump{{Name: "vessel file", CapacityM3h: info.Compartments[ci].PumpM3h}}
			pumpFrom = "vessel file"
		} else {
			pumpFrom = "none"
		}
	}
	for _, p := range pumpList {
		if i, _ := index(p.name); i != ci {
			return fail("--pump %q: pumps work on the flooded compartment, %q", p.name, comp.Name)
		}
		enginePumps = append(enginePumps, engine.Pump{Name: fmt.Sprintf("pump %d", len(enginePumps)+1), CapacityM3h: p.m3h})
	}

	base, msg := damageOf(v, open, nil)
	if msg != "" {
		return fail("%s", msg)
	}
	if base[ci].Open {
		return fail("--open %q: that is the compartment flooding through the hole; leave it out of --open", comp.Name)
	}
	c := engine.FloodCase{Vessel: v, Base: base, Compartment: ci, Hole: hole, Pumps: enginePumps, LimitS: limit.Seconds()}
	if *criteria {
		c.Criteria = engine.FloodCriteria(info.ShipType)
	}
	rep, err := engine.RunFlood(c, nil)
	if err != nil {
		return fail("%v", err)
	}
	fr := floodRun{rep: rep, v: v, source: source(info), open: inOrderGiven(v, open), holeFrom: from, pumpFrom: pumpFrom}
	if *format == "json" {
		err = writeFloodJSON(stdout, fr)
	} else {
		err = writeFloodText(stdout, fr)
	}
	if err != nil {
		fmt.Fprintln(stderr, "heelwatch flood: writing the report:", err)
		return exitFailed
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

// floodRun is a finished run with what the reports say about its inputs.
type floodRun struct {
	rep      engine.FloodReport
	v        *engine.Vessel
	source   string
	open     []string
	holeFrom string
	pumpFrom string
}

// fnum formats x with prec decimals, "—" when not finite.
func fnum(x float64, prec int) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return "—"
	}
	if math.Abs(x) < 0.5*math.Pow(10, -float64(prec)) {
		x = 0
	}
	return strconv.FormatFloat(x, 'f', prec, 64)
}

// lowestOpening returns the unprotected opening nearest the water.
func lowestOpening(p *engine.Position) (engine.OpeningClearance, bool) {
	var best engine.OpeningClearance
	found := false
	for _, o := range p.Openings {
		if o.Weathertight {
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

// writeFloodText prints the run for a person: the case, the outcome, the
// events, the state against time, the stages and the final state beside
// the lost-buoyancy solution.
func writeFloodText(w io.Writer, fr floodRun) error {
	r := fr.rep
	var b strings.Builder
	fmt.Fprintf(&b, "Flooding through a hole — %s (%s)\n\n", r.Vessel, fr.source)
	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintf(tw, "  compartment\t%s: μ %s, capacity %s m³\n", r.Compartment, report.Permeability(r.Permeability), fnum(r.CapacityM3, 1))
	fmt.Fprintf(tw, "  hole\t%s m² at x %s, y %s, z %s m, Cd %s (%s)\n", fnum(r.Hole.AreaM2, 3), fnum(r.Hole.XM, 2), fnum(r.Hole.YM, 2), fnum(r.Hole.ZM, 2), fnum(r.Hole.Cd, 2), fr.holeFrom)
	pumps := "none"
	if r.PumpM3h > 0 {
		pumps = fnum(r.PumpM3h, 0) + " m³/h (" + fr.pumpFrom + ")"
		if r.SteadyHeadM > 0 {
			pumps += fmt.Sprintf("; they match the inflow at a head of %s m", fnum(r.SteadyHeadM, 3))
		}
	}
	fmt.Fprintf(tw, "  pumps\t%s\n", pumps)
	also := "—"
	if len(fr.open) > 0 {
		also = strings.Join(fr.open, ", ")
	}
	fmt.Fprintf(tw, "  also open to the sea\t%s\n", also)
	fmt.Fprintf(tw, "  time limit\t%s\n", engine.FormatDuration(r.LimitS))
	tw.Flush()

	endS := r.EndS
	if r.End == engine.FloodEqualised {
		endS = r.EqualiseS
	}
	fmt.Fprintf(&b, "\nOutcome: %s after %s.\n  %s\n", r.End.Headline(), engine.FormatDuration(endS), sentenceCase(r.EndReason))
	if r.End == engine.FloodEqualised {
		fmt.Fprintf(&b, "  Time to equalise: %s (%s s), %s m³ in. The run stops at 1 mm of head (%s);\n  the last millimetre follows the √h law.\n",
			engine.FormatDuration(r.EqualiseS), fnum(r.EqualiseS, 0), fnum(r.FinalWaterM3, 1), engine.FormatDuration(r.EndS))
	}

	b.WriteString("\nEvents\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  time\twater m³\t")
	for _, e := range r.Events {
		fmt.Fprintf(tw, "  %s\t%s\t%s\n", engine.FormatDuration(e.TimeS), fnum(e.WaterM3, 1), eventWords(e))
	}
	tw.Flush()
	for _, k := range []struct {
		kind engine.FloodEventKind
		what string
	}{{engine.DeckEdgeReached, "deck edge"}, {engine.MarginLineReached, "margin line"}} {
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
		row := []string{engine.FormatDuration(s.TimeS), fnum(s.WaterM3, 1), fnum(s.InflowM3h, 0), fnum(s.PumpedM3h, 0), fnum(s.HeadM, 3), fnum(s.SoundingM, 2)}
		if p := s.Position; p != nil {
			row = append(row, fnum(p.HeelDeg, 2), fnum(p.DraftAftM, 3), fnum(p.DraftMidM, 3), fnum(p.DraftFwdM, 3), fnum(p.DeckEdge.HeightM, 3), fnum(p.GMM, 3))
		} else {
			// No floating position: the flows and levels are not known either.
			row = append(row[:2], "—", "—", "—", "—", "—", "—", "—", "—", "—", "—")
		}
		fmt.Fprintf(tw, "  %s\t%s\n", strings.Join(row, "\t"), tableEvent(s))
	}
	tw.Flush()
	b.WriteString("  (heel + starboard down; deck edge: least height of the deck at side above the water)\n")

	fmt.Fprintf(&b, "\nIntermediate stages (of %s m³", fnum(r.StagesOfM3, 1))
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
			reached = engine.FormatDuration(s.TimeS)
		}
		row := []string{fnum(100*s.Fraction, 0) + " %", fnum(s.WaterM3, 1), reached}
		if p := s.Position; p != nil {
			low := "—"
			if o, ok := lowestOpening(p); ok {
				low = fnum(o.HeightM, 2)
			}
			row = append(row, fnum(p.HeelDeg, 2), fnum(p.DraftAftM, 3), fnum(p.DraftMidM, 3), fnum(p.DraftFwdM, 3), fnum(p.GMM, 3), fnum(p.DeckEdge.HeightM, 3), low)
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
			{"water m³", r.FinalWaterM3, r.LostBuoyancyWaterM3, 1, "m³"},
		} {
			d := q.a - q.b
			diff := fnum(d, 3) + " " + q.unit
			if q.unit == "mm" {
				diff = fnum(1000*d, 1) + " mm"
			}
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t\n", q.what, fnum(q.a, q.prec), fnum(q.b, q.prec), diff)
		}
		tw.Flush()
		if r.End == engine.FloodEqualised {
			verdict := "within"
			if r.FinalDiffM > 0.005 {
				verdict = "NOT within"
			}
			fmt.Fprintf(&b, "  Largest draft difference %s mm: %s 5 mm. (GM differs between the two methods; Δ·GM agrees.)\n", fnum(1000*r.FinalDiffM, 2), verdict)
		} else {
			b.WriteString("  The run did not equalise: the two differ by the water not let in.\n")
		}
	}
	fmt.Fprintf(&b, "\n%d steps (%d rejected), %d solves. Decision support only: the ship's approved stability information governs.\n", r.Steps, r.Rejected, r.Solves)
	_, err := io.WriteString(w, b.String())
	return err
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
		head = append(head, fnum(100*s.Fraction, 0)+" %")
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
				cell = fnum(c.Actual, 3)
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

// JSON output of heelwatch flood (keys described in the README).

type floodDoc struct {
	Vessel       string        `json:"vessel"`
	VesselFile   string        `json:"vessel_file"`
	Compartment  string        `json:"compartment"`
	Permeability report.Num    `json:"permeability"`
	CapacityM3   report.Num    `json:"capacity_m3"`
	Hole         floodHoleDoc  `json:"hole"`
	PumpM3h      report.Num    `json:"pumps_m3h"`
	PumpsFrom    string        `json:"pumps_from"`
	Open         []string      `json:"open"`
	LimitS       report.Num    `json:"limit_s"`
	End          string        `json:"end"`
	EndS         report.Num    `json:"end_s"`
	EndReason    string        `json:"end_reason"`
	EqualiseS    *report.Num   `json:"equalise_s"`
	SteadyHeadM  report.Num    `json:"steady_head_m"`
	PumpsHold    bool          `json:"pumps_hold"`
	FinalWaterM3 report.Num    `json:"final_water_m3"`
	Events       []floodEvDoc  `json:"events"`
	Table        []floodRowDoc `json:"table"`
	Stages       []floodStDoc  `json:"stages"`
	StagesOfM3   report.Num    `json:"stages_of_m3"`
	Final        floodRowDoc   `json:"final"`
	LostBuoyancy *floodPosDoc  `json:"lost_buoyancy"`
	LBReason     string        `json:"lost_buoyancy_reason"`
	LBWaterM3    report.Num    `json:"lost_buoyancy_water_m3"`
	FinalDiffM   *report.Num   `json:"final_difference_m"`
	Trace        []floodRowDoc `json:"trace"`
	Solver       floodSolver   `json:"solver"`
	Version      string        `json:"heelwatch_version"`
}

type floodHoleDoc struct {
	AreaM2 report.Num `json:"area_m2"`
	XM     report.Num `json:"x_m"`
	YM     report.Num `json:"y_m"`
	ZM     report.Num `json:"z_m"`
	Cd     report.Num `json:"cd"`
	From   string     `json:"from"`
}

type floodEvDoc struct {
	Kind    string     `json:"kind"`
	Name    string     `json:"name"`
	TimeS   report.Num `json:"time_s"`
	WaterM3 report.Num `json:"water_m3"`
	Message string     `json:"message"`
}

type floodPosDoc struct {
	HeelDeg       report.Num `json:"heel_deg"`
	DraftAftM     report.Num `json:"draft_aft_m"`
	DraftMidM     report.Num `json:"draft_mid_m"`
	DraftFwdM     report.Num `json:"draft_fwd_m"`
	TrimM         report.Num `json:"trim_m"`
	GMM           report.Num `json:"gm_m"`
	DisplacementT report.Num `json:"displacement_t"`
	DeckEdgeM     report.Num `json:"deck_edge_m"`
	MarginLineM   report.Num `json:"margin_line_m"`
	LowestOpening *struct {
		Name    string     `json:"name"`
		HeightM report.Num `json:"height_m"`
	} `json:"lowest_opening"`
}

type floodRowDoc struct {
	TimeS     report.Num            `json:"time_s"`
	WaterM3   report.Num            `json:"water_m3"`
	InflowM3h report.Num            `json:"inflow_m3h"`
	PumpedM3h report.Num            `json:"pumped_m3h"`
	HeadM     report.Num            `json:"head_m"`
	SoundingM report.Num            `json:"sounding_m"`
	Event     string                `json:"event"`
	Position  *floodPosDoc          `json:"position"`
	NoEq      string                `json:"no_equilibrium"`
	Criteria  []report.CriterionDoc `json:"criteria,omitempty"`
}

type floodStDoc struct {
	Fraction report.Num            `json:"fraction"`
	WaterM3  report.Num            `json:"water_m3"`
	Reached  bool                  `json:"reached"`
	TimeS    *report.Num           `json:"time_s"`
	Position *floodPosDoc          `json:"position"`
	NoEq     string                `json:"no_equilibrium"`
	Criteria []report.CriterionDoc `json:"criteria"`
}

type floodSolver struct {
	Steps    int `json:"steps"`
	Rejected int `json:"rejected"`
	Solves   int `json:"solves"`
}

func posDoc(p *engine.Position) *floodPosDoc {
	if p == nil {
		return nil
	}
	d := &floodPosDoc{HeelDeg: report.Num(p.HeelDeg), DraftAftM: report.Num(p.DraftAftM), DraftMidM: report.Num(p.DraftMidM),
		DraftFwdM: report.Num(p.DraftFwdM), TrimM: report.Num(p.TrimM), GMM: report.Num(p.GMM), DisplacementT: report.Num(p.DisplacementT),
		DeckEdgeM: report.Num(p.DeckEdge.HeightM), MarginLineM: report.Num(p.MarginLine.HeightM)}
	if o, ok := lowestOpening(p); ok {
		d.LowestOpening = &struct {
			Name    string     `json:"name"`
			HeightM report.Num `json:"height_m"`
		}{o.Name, report.Num(o.HeightM)}
	}
	return d
}

func rowDoc(s engine.FloodSample) floodRowDoc {
	d := floodRowDoc{TimeS: report.Num(s.TimeS), WaterM3: report.Num(s.WaterM3), InflowM3h: report.Num(s.InflowM3h),
		PumpedM3h: report.Num(s.PumpedM3h), HeadM: report.Num(s.HeadM), SoundingM: report.Num(s.SoundingM),
		Event: s.Event, Position: posDoc(s.Position)}
	if s.NoEq != nil {
		d.NoEq = s.NoEq.Error()
	}
	if s.Position == nil {
		// No floating position: the flows and levels are not known (null).
		nan := report.Num(math.NaN())
		d.InflowM3h, d.PumpedM3h, d.HeadM, d.SoundingM = nan, nan, nan, nan
	}
	if len(s.Criteria) > 0 {
		d.Criteria = report.CriterionDocs(s.Criteria)
	}
	return d
}

func numPtr(x float64) *report.Num {
	n := report.Num(x)
	return &n
}

func writeFloodJSON(w io.Writer, fr floodRun) error {
	r := fr.rep
	doc := floodDoc{
		Vessel: r.Vessel, VesselFile: fr.source, Compartment: r.Compartment, Permeability: report.Num(r.Permeability),
		CapacityM3: report.Num(r.CapacityM3),
		Hole: floodHoleDoc{AreaM2: report.Num(r.Hole.AreaM2), XM: report.Num(r.Hole.XM), YM: report.Num(r.Hole.YM),
			ZM: report.Num(r.Hole.ZM), Cd: report.Num(r.Hole.Cd), From: fr.holeFrom},
		PumpM3h: report.Num(r.PumpM3h), PumpsFrom: fr.pumpFrom, Open: append([]string{}, fr.open...), LimitS: report.Num(r.LimitS),
		End: r.End.String(), EndS: report.Num(r.EndS), EndReason: r.EndReason,
		SteadyHeadM: report.Num(r.SteadyHeadM), PumpsHold: r.PumpsHoldLevel, FinalWaterM3: report.Num(r.FinalWaterM3),
		Events: []floodEvDoc{}, Table: []floodRowDoc{}, Stages: []floodStDoc{}, Trace: []floodRowDoc{},
		StagesOfM3: report.Num(r.StagesOfM3), Final: rowDoc(r.Final), LostBuoyancy: posDoc(r.LostBuoyancy),
		LBWaterM3: report.Num(r.LostBuoyancyWaterM3),
		Solver:    floodSolver{r.Steps, r.Rejected, r.Solves}, Version: version,
	}
	if r.End == engine.FloodEqualised {
		doc.EqualiseS = numPtr(r.EqualiseS)
	}
	if r.LostBuoyancyNoEq != nil {
		doc.LBReason = r.LostBuoyancyNoEq.Error()
	}
	if r.LostBuoyancy != nil && r.Final.Position != nil {
		doc.FinalDiffM = numPtr(r.FinalDiffM)
	}
	for _, e := range r.Events {
		doc.Events = append(doc.Events, floodEvDoc{Kind: e.Kind.String(), Name: e.Name, TimeS: report.Num(e.TimeS), WaterM3: report.Num(e.WaterM3), Message: e.Message})
	}
	for _, s := range r.Table {
		doc.Table = append(doc.Table, rowDoc(s))
	}
	for _, s := range r.Trace {
		doc.Trace = append(doc.Trace, rowDoc(s))
	}
	for _, s := range r.Stages {
		st := floodStDoc{Fraction: report.Num(s.Fraction), WaterM3: report.Num(s.WaterM3), Reached: s.Reached,
			Position: posDoc(s.Position), Criteria: report.CriterionDocs(s.Criteria)}
		if s.Reached {
			st.TimeS = numPtr(s.TimeS)
		}
		if s.NoEq != nil {
			st.NoEq = s.NoEq.Error()
		}
		doc.Stages = append(doc.Stages, st)
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(doc)
}
