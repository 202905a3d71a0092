package main

import (
	"encoding/csv"
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"
	"text/tabwriter"

	"heelwatch/engine"
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

// csvTable is a CSV file read: its header and rows, with their lines.
type csvTable struct {
	file   string
	header []string
	rows   [][]string
	lines  []int
}

func readCSV(path string) (*csvTable, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	r := csv.NewReader(f)
	r.FieldsPerRecord = -1
	r.TrimLeadingSpace = true
	t := &csvTable{file: path}
	for {
		rec, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return nil, fmt.Errorf("%s: %v", path, err)
		}
		line, _ := r.FieldPos(0)
		if t.header == nil {
			for _, h := range rec {
				t.header = append(t.header, strings.TrimSpace(h))
			}
			continue
		}
		if len(rec) == 1 && strings.TrimSpace(rec[0]) == "" {
			continue
		}
		if len(rec) != len(t.header) {
			return nil, fmt.Errorf("%s:%d: %d fields, the header has %d", path, line, len(rec), len(t.header))
		}
		t.rows = append(t.rows, rec)
		t.lines = append(t.lines, line)
	}
	if t.header == nil {
		return nil, fmt.Errorf("%s: empty: give a header row and one row per value", path)
	}
	return t, nil
}

// columns checks the header: first must come first, the rest be known.
func (t *csvTable) columns(first string, known map[string]tolerance, extra ...string) error {
	if len(t.header) == 0 || t.header[0] != first {
		return fmt.Errorf("%s:1: the first column must be %s", t.file, first)
	}
	seen := map[string]bool{}
	for _, h := range t.header[1:] {
		_, ok := known[h]
		for _, e := range extra {
			ok = ok || h == e
		}
		if !ok || seen[h] {
			return fmt.Errorf("%s:1: column %q is unknown or repeated", t.file, h)
		}
		seen[h] = true
	}
	return nil
}

func (t *csvTable) number(i, j int) (float64, error) {
	x, err := strconv.ParseFloat(strings.TrimSpace(t.rows[i][j]), 64)
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
		return 0, fmt.Errorf("%s:%d: %s: %q is not a number", t.file, t.lines[i], t.header[j], t.rows[i][j])
	}
	return x, nil
}

func verifyHydrostatics(v *engine.Vessel, t *csvTable) ([]verifyRow, error) {
	if err := t.columns("draft_m", hydroTolerances); err != nil {
		return nil, err
	}
	hr := hydroRangeOf(v.Hull)
	var out []verifyRow
	var outside []error
	for i := range t.rows {
		T, err := t.number(i, 0)
		if err != nil {
			return nil, err
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
			b, err := t.number(i, j+1)
			if err != nil {
				return nil, err
			}
			m := model[q]
			d := b - m
			tl := hydroTolerances[q].of(b)
			out = append(out, verifyRow{Table: "hydrostatics", Key: T, Quantity: q, Booklet: b, Model: &m, Deviation: &d, Tolerance: tl, Pass: math.Abs(d) <= tl})
		}
	}
	if len(outside) > 0 {
		outside = append(outside, fmt.Errorf("%s: heelwatch works %s's hydrostatics at drafts %s; leave out the rows beyond (heelwatch tables prints this range)", t.file, v.Name, hr.why()))
		return nil, errors.Join(outside...)
	}
	return out, nil
}

func verifyTanks(v *engine.Vessel, t *csvTable) ([]verifyRow, error) {
	tol := map[string]tolerance{}
	for k, x := range tankTolerances {
		tol[k] = x
	}
	if err := t.columns("name", tol, "tcg_m"); err != nil {
		return nil, err
	}
	tcg := math.Min(0.005*v.Hull.BreadthM, 0.05)
	full := map[string]tankFull{}
	for _, f := range fullTanks(v) {
		full[strings.ToLower(f.Name)] = f
	}
	var out []verifyRow
	for i, rec := range t.rows {
		name := strings.TrimSpace(rec[0])
		f, ok := full[strings.ToLower(name)]
		if !ok {
			return nil, fmt.Errorf("%s:%d: name: %q is not a tank of %s (a compartment with use \"tank\")", t.file, t.lines[i], name, v.Name)
		}
		model := map[string]float64{"volume_m3": f.VolumeM3, "lcg_m": f.LCGM, "tcg_m": f.TCGM, "vcg_m": f.VCGM}
		for j, q := range t.header[1:] {
			b, err := t.number(i, j+1)
			if err != nil {
				return nil, err
			}
			tl := tcg
			if q != "tcg_m" {
				tl = tol[q].of(b)
			}
			m := model[q]
			d := b - m
			out = append(out, verifyRow{Table: "tanks", Key: f.Name, Quantity: q, Booklet: b, Model: &m, Deviation: &d, Tolerance: tl, Pass: math.Abs(d) <= tl})
		}
	}
	return out, nil
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
	ht, err := readCSV(*hydro)
	if err == nil {
		rows, err = verifyHydrostatics(v, ht)
	}
	if err == nil && *tanks != "" {
		var tt *csvTable
		var tr []verifyRow
		if tt, err = readCSV(*tanks); err == nil {
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
