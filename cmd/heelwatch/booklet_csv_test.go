package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestVerifyEuropeanCSV: a table saved by a spreadsheet in a European
// locale (semicolons, decimal commas, a byte-order mark) is read as the
// same table with commas and points: the box barge's closed forms at 1 m
// and 2 m (Δ = ρLBT = 1312 t per metre, KMT = T/2 + B²/(12T): practice,
// references.md) pass.
func TestVerifyEuropeanCSV(t *testing.T) {
	dir := t.TempDir()
	eu := filepath.Join(dir, "eu.csv")
	os.WriteFile(eu, []byte("\ufeffdraft_m;displacement_t;kmt_m\r\n1,0;1312,0;21,833\r\n2;2624;11,667\r\n"), 0o644)
	code, failed := verifyJSON(t, "--vessel", "barge", "--hydrostatics", eu)
	if code != exitOK || len(failed) != 0 {
		t.Errorf("semicolons and decimal commas: exit %d, failing %v", code, failed)
	}
	// Off by 10 % once read: the decimal comma is not dropped.
	os.WriteFile(eu, []byte("draft_m;kmt_m\n2;12,9\n"), 0o644)
	if code, failed := verifyJSON(t, "--vessel", "barge", "--hydrostatics", eu); code != exitVerifyFail || len(failed) != 1 {
		t.Errorf("KMT 12,9 against 11.667: exit %d, failing %v", code, failed)
	}
}

// TestVerifyCSVProblems: each problem of a booklet table is refused (exit
// 1) with file:line, the column and the row, and what to do; all of one
// file's problems at once.
func TestVerifyCSVProblems(t *testing.T) {
	dir := t.TempDir()
	for _, tc := range []struct {
		name, csv string
		frags     []string
	}{
		{"decimal-comma.csv", "draft_m,kmt_m\n1,21,833\n",
			[]string{":2: 3 fields, the header has 2", "decimal comma", "semicolons"}},
		{"thousands.csv", "draft_m;displacement_t\n1;1.312,0\n",
			[]string{`:2: displacement_t (column 2, the row of draft 1 m): "1.312,0": write the number without a thousands separator`}},
		{"blank.csv", "draft_m,displacement_t,kmt_m\n1,1312,\n2,,11.667\n",
			[]string{":2: kmt_m (column 3, the row of draft 1 m): the cell is empty",
				":3: displacement_t (column 2, the row of draft 2 m): the cell is empty", "leave the column out"}},
		{"twice.csv", "draft_m,kmt_m\n1,21.833\n2,11.667\n1.0,21.833\n",
			[]string{":4: draft_m: 1 m again: line 2 gives the same draft"}},
		{"column.csv", "draft_m,kmt,kmt_m,kmt_m\n1,1,1,1\n",
			[]string{`:1: column "kmt" (column 2) is not one verify reads: did you mean "kmt_m"?`,
				"the columns read are draft_m, displacement_t, lcb_m, vcb_m, lcf_m, tpc_t, mct_tm, kmt_m, kml_m",
				`column "kmt_m" is given twice (columns 3 and 4)`}},
	} {
		p := filepath.Join(dir, tc.name)
		os.WriteFile(p, []byte(tc.csv), 0o644)
		code, out, errOut := heelwatch(t, "verify", "--vessel", "barge", "--hydrostatics", p)
		if code != exitInput || out != "" {
			t.Errorf("%s: exit %d, stdout %q", tc.name, code, out)
		}
		for _, f := range tc.frags {
			if !strings.Contains(errOut, f) {
				t.Errorf("%s: stderr lacks %q:\n%s", tc.name, f, errOut)
			}
		}
	}
	h := filepath.Join("..", "..", "testdata", "verify", "freighter-hydrostatics.csv")
	tanks := filepath.Join(dir, "tanks.csv")
	os.WriteFile(tanks, []byte("name,volume_m3\nHoper 2 S,47.5\nHold 2,100\nhopper 2 p,47.5\nHopper 2 P,47.5\n"), 0o644)
	code, _, errOut := heelwatch(t, "verify", "--vessel", "freighter", "--hydrostatics", h, "--tanks", tanks)
	for _, f := range []string{
		`:2: name: "Hoper 2 S" is not a tank of Aldervik Trader: did you mean "Hopper 2 S"?`,
		`:3: name: "Hold 2" is a compartment of Aldervik Trader with use "dry cargo", not a tank`,
		`:5: name: Hopper 2 P again: line 4 gives the same tank`,
		"her tanks (names ignore case) are: Aft peak tank, ",
	} {
		if code != exitInput || !strings.Contains(errOut, f) {
			t.Errorf("tanks: exit %d, stderr lacks %q:\n%s", code, f, errOut)
		}
	}
}
