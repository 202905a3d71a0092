package main

import (
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"strings"
	"text/tabwriter"

	"heelwatch/engine"
	"heelwatch/vessels"
)

const verifyHelp = `heelwatch verify: the model against the ship's approved tables.

Usage:
  heelwatch verify [--vessel FILE|NAME] --hydrostatics H.csv [--tanks T.csv] [--format F]

  --hydrostatics H.csv  the booklet's hydrostatic table: a header row, then
                        one row per draft at even keel; columns draft_m and
                        any of displacement_t, lcb_m, vcb_m, lcf_m, tpc_t,
                        mct_tm, kmt_m, kml_m (tpc per cm immersion, mct per
                        cm trim)
  --tanks T.csv         the booklet's tanks, full: name and any of
                        volume_m3, lcg_m, tcg_m, vcg_m
  --format F            text (default) or json

The CSV files: commas with decimal points, or semicolons with decimal
commas. Every cell holds a figure (leave a quantity's column out rather
than a cell empty); each draft and tank once.

Each value is compared with heelwatch's own figure; the deviation is
booklet − model and the tolerance that of MSC.1/Circ.1229 for the quantity
(a percentage of the booklet's value, capped by a length where one is
given). TPC has no figure of its own there: it is held to displacement's 2 %.

The model's hydrostatics are compared from the keel to the lowest deck at
side, the range heelwatch tables prints; a row at a draft outside it is
input verify cannot use.

Exit status: 0 every value within tolerance; 4 some are not; 1 bad input
(a table that cannot be read or used: file:line, column and why on
stderr); 2 bad usage.
`

// exitVerifyFail is verify's status when some value is beyond tolerance.
const exitVerifyFail = 4

// tolerance is one quantity's acceptance tolerance: pct percent of the
// reference, at most capM (0: no cap) (MSC.1/Circ.1229, references.md).
type tolerance struct {
	pct, capM float64
	source    string
}

func (t tolerance) of(ref float64) float64 {
	v := t.pct / 100 * math.Abs(ref)
	if t.capM > 0 {
		v = math.Min(v, t.capM)
	}
	return v
}

var hydroTolerances = map[string]tolerance{
	"displacement_t": {2, 0, "MSC.1/Circ.1229: displacement 2 %"},
	"lcb_m":          {1, 0.5, "MSC.1/Circ.1229: LCB 1 % / 50 cm"},
	"vcb_m":          {1, 0.05, "MSC.1/Circ.1229: VCB 1 % / 5 cm"},
	"lcf_m":          {1, 0.5, "MSC.1/Circ.1229: LCF 1 % / 50 cm"},
	"tpc_t":          {2, 0, "as displacement, 2 % (practice: no figure of its own)"},
	"mct_tm":         {2, 0, "MSC.1/Circ.1229: MCT 2 %"},
	"kmt_m":          {1, 0.05, "MSC.1/Circ.1229: KMT 1 % / 5 cm"},
	"kml_m":          {1, 0.5, "MSC.1/Circ.1229: KML 1 % / 50 cm"},
}

var tankTolerances = map[string]tolerance{
	"volume_m3": {2, 0, "MSC.1/Circ.1229: compartment volume 2 %"},
	"lcg_m":     {1, 0.5, "MSC.1/Circ.1229: compartment LCG 1 % / 50 cm"},
	"vcg_m":     {1, 0.05, "MSC.1/Circ.1229: compartment VCG 1 % / 5 cm"},
	// tcg_m: 0.5 % of the breadth, at most 5 cm (set per vessel).
}

// verifyRow is one value checked, as the JSON shows it.
type verifyRow struct {
	Table     string   `json:"table"`
	Key       any      `json:"key"` // the draft (m) or the tank's name
	Quantity  string   `json:"quantity"`
	Booklet   float64  `json:"booklet"`
	Model     *float64 `json:"model"`
	Deviation *float64 `json:"deviation"`
	Tolerance float64  `json:"tolerance"`
	Pass      bool     `json:"pass"`
	Note      string   `json:"note,omitempty"`
}

// tankColumns are the columns of the tanks table verify reads.
var tankColumns = []string{"name", "volume_m3", "lcg_m", "tcg_m", "vcg_m"}

// verifyHydrostatics compares the booklet's hydrostatic table t with the
// model, row by row. Every problem of the table is returned at once.
func verifyHydrostatics(v *engine.Vessel, t *bookletCSV) ([]verifyRow, error) {
	if err := t.columns("draft_m", hydroColumns); err != nil {
		return nil, err
	}
	hr := hydroRangeOf(v.Hull)
	var out []verifyRow
	var problems, outside []error
	lineOf := map[float64]int{}
	for i := range t.rows {
		T, err := t.number(i, 0, fmt.Sprintf("row %d", i+1))
		if err != nil {
			problems = append(problems, err)
			continue
		}
		if l, ok := lineOf[T]; ok {
			problems = append(problems, fmt.Errorf("%s:%d: draft_m: %g m again: line %d gives the same draft; give each draft once", t.file, t.lines[i], T, l))
			continue
		}
		lineOf[T] = t.lines[i]
		row := fmt.Sprintf("the row of draft %g m", T)
		var booklet []float64
		for j := range t.header[1:] {
			b, err := t.number(i, j+1, row)
			if err != nil {
				problems = append(problems, err)
			}
			booklet = append(booklet, b)
		}
		if why := hr.refusal(T); why != "" {
			outside = append(outside, fmt.Errorf("%s:%d: draft_m: %s", t.file, t.lines[i], why))
			continue
		}
		r, herr := hydrostaticsAt(v, hr, T)
		if herr != nil {
			outside = append(outside, fmt.Errorf("%s:%d: draft_m: %g m: %v", t.file, t.lines[i], T, herr))
			continue
		}
		model := map[string]float64{}
		for k, c := range hydroColumns {
			model[c] = hydroValues(r)[k]
		}
		for j, q := range t.header[1:] {
			b, m := booklet[j], model[q]
			d := b - m
			tl := hydroTolerances[q].of(b)
			out = append(out, verifyRow{Table: "hydrostatics", Key: T, Quantity: q, Booklet: b, Model: &m, Deviation: &d, Tolerance: tl, Pass: math.Abs(d) <= tl})
		}
	}
	if len(outside) > 0 {
		outside = append(outside, fmt.Errorf("%s: heelwatch works %s's hydrostatics at drafts %s; leave out the rows beyond (heelwatch tables prints this range)", t.file, v.Name, hr.why()))
	}
	if err := errors.Join(append(problems, outside...)...); err != nil {
		return nil, err
	}
	return out, nil
}

// verifyTanks compares the booklet's table of tanks full t with the model.
// Every problem of the table is returned at once.
func verifyTanks(v *engine.Vessel, t *bookletCSV) ([]verifyRow, error) {
	if err := t.columns("name", tankColumns); err != nil {
		return nil, err
	}
	tcg := math.Min(0.005*v.Hull.BreadthM, 0.05)
	full := map[string]tankFull{}
	var names []string
	for _, f := range fullTanks(v) {
		full[strings.ToLower(f.Name)] = f
		names = append(names, f.Name)
	}
	var out []verifyRow
	var problems []error
	unknown := false
	lineOf := map[string]int{}
	for i, rec := range t.rows {
		name := strings.TrimSpace(rec[0])
		f, ok := full[strings.ToLower(name)]
		if !ok {
			problems = append(problems, fmt.Errorf("%s:%d: name: %s", t.file, t.lines[i], notATank(v, name, names)))
			unknown = true
			continue
		}
		if l, ok := lineOf[strings.ToLower(name)]; ok {
			problems = append(problems, fmt.Errorf("%s:%d: name: %s again: line %d gives the same tank; give each tank once", t.file, t.lines[i], f.Name, l))
			continue
		}
		lineOf[strings.ToLower(name)] = t.lines[i]
		model := map[string]float64{"volume_m3": f.VolumeM3, "lcg_m": f.LCGM, "tcg_m": f.TCGM, "vcg_m": f.VCGM}
		for j, q := range t.header[1:] {
			b, err := t.number(i, j+1, "the row of "+f.Name)
			if err != nil {
				problems = append(problems, err)
				continue
			}
			tl := tcg
			if q != "tcg_m" {
				tl = tankTolerances[q].of(b)
			}
			m := model[q]
			d := b - m
			out = append(out, verifyRow{Table: "tanks", Key: f.Name, Quantity: q, Booklet: b, Model: &m, Deviation: &d, Tolerance: tl, Pass: math.Abs(d) <= tl})
		}
	}
	if unknown {
		list := "she has no tanks (compartments with use \"tank\")"
		if len(names) > 0 {
			list = "her tanks (names ignore case) are: " + strings.Join(names, ", ")
		}
		problems = append(problems, fmt.Errorf("%s: %s", t.file, list))
	}
	if err := errors.Join(problems...); err != nil {
		return nil, err
	}
	return out, nil
}

// notATank says why name is not one of v's tanks, with the nearest tank's
// name when it looks like a typing slip.
func notATank(v *engine.Vessel, name string, tanks []string) string {
	if i, ok := compartmentNamed(v, name); ok {
		return fmt.Sprintf("%q is a compartment of %s with use %q, not a tank (use \"tank\")", v.Compartments[i].Name, v.Name, v.Compartments[i].Use)
	}
	msg := fmt.Sprintf("%q is not a tank of %s", name, v.Name)
	if c := vessels.Closest(name, tanks); c != "" {
		msg += fmt.Sprintf(": did you mean %q?", c)
	}
	return msg
}

func runVerify(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch verify", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	vessel := fs.String("vessel", "", "")
	hydro := fs.String("hydrostatics", "", "")
	tanks := fs.String("tanks", "", "")
	format := fs.String("format", "text", "")
	help := func(w io.Writer) { fmt.Fprint(w, verifyHelp) }
	rest, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "verify", help)
	}
	switch {
	case len(rest) > 0:
		fmt.Fprintf(stderr, "heelwatch verify: unexpected argument %q\n", rest[0])
		return exitUsage
	case *hydro == "":
		fmt.Fprintln(stderr, "heelwatch verify: give the booklet's hydrostatic table: --hydrostatics H.csv")
		return exitUsage
	case *format != "text" && *format != "json":
		fmt.Fprintf(stderr, "heelwatch verify: --format %q: give text or json\n", *format)
		return exitUsage
	}
	v, info, status := openVessel(*vessel, stderr)
	if status != exitOK {
		return status
	}
	var rows []verifyRow
	ht, err := readBookletCSV(*hydro)
	if err == nil {
		rows, err = verifyHydrostatics(v, ht)
	}
	if err == nil && *tanks != "" {
		var tt *bookletCSV
		var tr []verifyRow
		if tt, err = readBookletCSV(*tanks); err == nil {
			tr, err = verifyTanks(v, tt)
			rows = append(rows, tr...)
		}
	}
	if err != nil {
		var pe *os.PathError
		if errors.As(err, &pe) {
			fmt.Fprintf(stderr, "heelwatch verify: %v\n", err)
		} else {
			fmt.Fprintf(stderr, "%v\n", err)
		}
		return exitInput
	}
	pass, failed := true, 0
	for _, r := range rows {
		if !r.Pass {
			pass = false
			failed++
		}
	}
	if *format == "json" {
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		err = enc.Encode(struct {
			Vessel string      `json:"vessel"`
			Rows   []verifyRow `json:"rows"`
			Pass   bool        `json:"pass"`
		}{v.Name, rows, pass})
	} else {
		tw := tabwriter.NewWriter(stdout, 0, 0, 2, ' ', 0)
		fmt.Fprintf(tw, "%s — %s against %s\n", v.Name, source(info), *hydro)
		fmt.Fprintln(tw, "table\tkey\tquantity\tbooklet\tmodel\tdeviation\ttolerance\t")
		for _, r := range rows {
			key := fmt.Sprint(r.Key)
			if T, ok := r.Key.(float64); ok {
				key = fmt.Sprintf("%.3f m", T)
			}
			m, d := "—", "—"
			if r.Model != nil {
				m, d = fmt.Sprintf("%.4f", *r.Model), fmt.Sprintf("%+.4f", *r.Deviation)
			}
			mark := ""
			if !r.Pass {
				mark = "FAIL"
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\t%.4f\t%s\t%s\t%.4f\t%s\n", r.Table, key, r.Quantity, r.Booklet, m, d, r.Tolerance, mark)
		}
		if pass {
			fmt.Fprintf(tw, "all %d values within the MSC.1/Circ.1229 tolerances\n", len(rows))
		} else {
			fmt.Fprintf(tw, "%d of %d values beyond the MSC.1/Circ.1229 tolerances: the model does not agree with the booklet there\n", failed, len(rows))
		}
		err = tw.Flush()
	}
	if err != nil {
		fmt.Fprintln(stderr, "heelwatch verify: writing the result:", err)
		return exitFailed
	}
	if !pass {
		return exitVerifyFail
	}
	return exitOK
}
