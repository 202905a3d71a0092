package main

import (
	"encoding/json"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// TestVerifyTextSummary: the text ends with the count of values checked,
// passed and failed, and the failing values listed together; every value's
// tolerance carries its unit and basis (MSC.1/Circ.1229: KMT 1 % / 5 cm,
// displacement 2 %, LCF 1 % / 50 cm, volume 2 %; references.md).
func TestVerifyTextSummary(t *testing.T) {
	dir := filepath.Join("..", "..", "testdata", "verify")
	code, out, errOut := heelwatch(t, "verify", "--vessel", "freighter",
		"--hydrostatics", filepath.Join(dir, "freighter-hydrostatics-corrupted.csv"), "--tanks", filepath.Join(dir, "freighter-tanks-corrupted.csv"))
	if code != exitVerifyFail {
		t.Fatalf("exit %d %s", code, errOut)
	}
	i := strings.Index(out, "\n188 values checked: 184 within tolerance, 4 beyond:\n")
	if i < 0 {
		t.Fatalf("no summary of 188 values, 4 failing:\n%s", out)
	}
	tail := strings.Split(strings.TrimSpace(out[i:]), "\n")
	want := []*regexp.Regexp{
		regexp.MustCompile(`^hydrostatics +2\.000 m +kmt_m +booklet 8\.2744 m +model 8\.1844 +deviation \+0\.0900 +beyond ±0\.0500 \(5 cm cap\)$`),
		regexp.MustCompile(`^hydrostatics +3\.000 m +displacement_t +booklet 2786\.0641 t .* beyond ±55\.7213 \(2 % of Δ\)$`),
		regexp.MustCompile(`^hydrostatics +5\.000 m +lcf_m .*deviation -0\.6000 +beyond ±0\.4203 \(1 % of LCF\)$`),
		regexp.MustCompile(`^tanks +Fore peak tank +volume_m3 +booklet 67\.3558 m³ .* \(2 % of volume\)$`),
	}
	if len(tail) < 1+len(want) {
		t.Fatalf("summary too short:\n%s", out[i:])
	}
	for k, re := range want {
		if l := strings.TrimSpace(tail[1+k]); !re.MatchString(l) {
			t.Errorf("failure %d: %q does not match %s", k+1, l, re)
		}
	}
	if strings.Contains(out, "-0.0000") {
		t.Errorf("a zero printed as -0.0000")
	}
	row := regexp.MustCompile(`(?m)^tanks +Fore peak tank +tcg_m +m +0\.0000 +0\.0000 +\+0\.0000 +±0\.0500 +5 cm cap$`)
	if !row.MatchString(out) {
		t.Errorf("TCG row (0.5 %% of B = 7.2 cm, capped at 5 cm) not as expected:\n%s", out)
	}
}

// TestVerifyJSONKeys: the rows keep conventions' keys (key: the draft, a
// number, for hydrostatics; the tank's name, a string, for tanks) and add
// unit and tolerance_basis; passed and failed count the values.
func TestVerifyJSONKeys(t *testing.T) {
	dir := filepath.Join("..", "..", "testdata", "verify")
	_, out, _ := heelwatch(t, "verify", "--vessel", "freighter", "--format", "json",
		"--hydrostatics", filepath.Join(dir, "freighter-hydrostatics-corrupted.csv"), "--tanks", filepath.Join(dir, "freighter-tanks-corrupted.csv"))
	var doc struct {
		Rows           []map[string]any
		Pass           bool
		Passed, Failed int
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if doc.Pass || doc.Passed != 184 || doc.Failed != 4 {
		t.Errorf("pass %v passed %d failed %d, want false 184 4", doc.Pass, doc.Passed, doc.Failed)
	}
	units := map[string]string{"displacement_t": "t", "tpc_t": "t/cm", "mct_tm": "t·m/cm", "kmt_m": "m", "volume_m3": "m³"}
	for _, r := range doc.Rows {
		for _, k := range []string{"table", "key", "quantity", "booklet", "model", "deviation", "tolerance", "pass", "unit", "tolerance_basis"} {
			if _, ok := r[k]; !ok {
				t.Fatalf("row %v lacks %q", r, k)
			}
		}
		switch r["table"] {
		case "hydrostatics":
			if _, ok := r["key"].(float64); !ok {
				t.Errorf("hydrostatics key %v is not a number", r["key"])
			}
		case "tanks":
			if _, ok := r["key"].(string); !ok {
				t.Errorf("tanks key %v is not a string", r["key"])
			}
		}
		if u, ok := units[r["quantity"].(string)]; ok && r["unit"] != u {
			t.Errorf("%v: unit %v, want %s", r["quantity"], r["unit"], u)
		}
	}
}
