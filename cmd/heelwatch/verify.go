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
given; a tank's TCG: 0.5 % of the breadth, at most 5 cm). TPC has no figure
of its own there: it is held to displacement's 2 %. Each tolerance is shown
in the quantity's unit with its basis ("2 % of Δ", "5 cm cap"); the text
ends with the count of values within and beyond tolerance and the failing
ones listed together.

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
// booklet's value (of the breadth B for a tank's TCG), at most capM metres
// (0: no cap) (MSC.1/Circ.1229, references.md). of names what the
// percentage is taken of, for the reader.
type tolerance struct {
	pct, capM float64
	of        string
}

// at returns the tolerance for booklet value ref (B for a TCG) and its
// basis as an officer reads it: "2 % of Δ", "5 cm cap".
func (t tolerance) at(ref float64) (float64, string) {
	v := t.pct / 100 * math.Abs(ref)
	basis := fmt.Sprintf("%g %% of %s", t.pct, t.of)
	if t.capM > 0 && v > t.capM {
		v = t.capM
		basis = fmt.Sprintf("%g cm cap", t.capM*100)
	}
	return v, basis
}

// hydroTolerances are the tolerances of the hydrostatic table's columns.
var hydroTolerances = map[string]tolerance{
	"displacement_t": {2, 0, "Δ"},
	"lcb_m":          {1, 0.5, "LCB"},
	"vcb_m":          {1, 0.05, "KB"},
	"lcf_m":          {1, 0.5, "LCF"},
	"tpc_t":          {2, 0, "TPC (as Δ)"}, // practice: Circ.1229 gives TPC no figure of its own
	"mct_tm":         {2, 0, "MCTC"},
	"kmt_m":          {1, 0.05, "KMT"},
	"kml_m":          {1, 0.5, "KML"},
}

// tankTolerances are the tolerances of the table of tanks full.
var tankTolerances = map[string]tolerance{
	"volume_m3": {2, 0, "volume"},
	"lcg_m":     {1, 0.5, "LCG"},
	"tcg_m":     {0.5, 0.05, "B"}, // of the ship's breadth, not of the TCG
	"vcg_m":     {1, 0.05, "VCG"},
}

// quantityUnits are the units of verify's columns, as the booklet gives them.
var quantityUnits = map[string]string{
	"displacement_t": "t", "tpc_t": "t/cm", "mct_tm": "t·m/cm", "volume_m3": "m³",
}

// unitOf returns the unit of column q.
func unitOf(q string) string {
	if u, ok := quantityUnits[q]; ok {
		return u
	}
	return "m"
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
	Unit      string   `json:"unit"`            // of booklet, model, deviation and tolerance
	Basis     string   `json:"tolerance_basis"` // "2 % of Δ", "5 cm cap"
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
			tl, basis := hydroTolerances[q].at(b)
			out = append(out, verifyRow{Table: "hydrostatics", Key: T, Quantity: q, Booklet: b, Model: &m, Deviation: &d,
				Tolerance: tl, Pass: math.Abs(d) <= tl, Unit: unitOf(q), Basis: basis})
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
			ref := b
			if q == "tcg_m" {
				ref = v.Hull.BreadthM
			}
			tl, basis := tankTolerances[q].at(ref)
			m := model[q]
			d := b - m
			out = append(out, verifyRow{Table: "tanks", Key: f.Name, Quantity: q, Booklet: b, Model: &m, Deviation: &d,
				Tolerance: tl, Pass: math.Abs(d) <= tl, Unit: unitOf(q), Basis: basis})
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
	sum := summariseVerify(rows)
	if *format == "json" {
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		err = enc.Encode(struct {
			Vessel string      `json:"vessel"`
			Rows   []verifyRow `json:"rows"`
			Pass   bool        `json:"pass"`
			Passed int         `json:"passed"`
			Failed int         `json:"failed"`
		}{v.Name, rows, sum.pass(), sum.passed, len(sum.failed)})
	} else {
		against := *hydro
		if *tanks != "" {
			against += " and " + *tanks
		}
		err = writeVerifyText(stdout, fmt.Sprintf("%s — %s against %s", v.Name, source(info), against), rows, sum)
	}
	if err != nil {
		fmt.Fprintln(stderr, "heelwatch verify: writing the result:", err)
		return exitFailed
	}
	if !sum.pass() {
		return exitVerifyFail
	}
	return exitOK
}
