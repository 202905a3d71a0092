package main

import (
	"encoding/csv"
	"encoding/json"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// TestTablesTextUnits: TPC and MCTC are headed per centimetre, and no
// figure prints as a negative zero (the freighter's centreline tanks have
// a TCG of zero to round-off).
func TestTablesTextUnits(t *testing.T) {
	_, out, _ := heelwatch(t, "tables", "--vessel", "freighter")
	for _, h := range []string{"TPC t/cm", "MCTC t·m/cm", "Capacity: ER DB fresh water, FSM for fresh water of 1.000 t/m³"} {
		if !strings.Contains(out, h) {
			t.Errorf("no %q in the text", h)
		}
	}
	if regexp.MustCompile(`-0\.0+\b`).MatchString(out) {
		t.Errorf("a negative zero printed:\n%s", regexp.MustCompile(`.*-0\.0+\b.*`).FindString(out))
	}
}

// TestTablesCapacityRows: in the CSV each tank's soundings rise strictly
// (no full row twice, as Hopper 2 S had by a step landing a hair below its
// top), the last row holds the tank full (the tanks table's volume), an
// empty row has no centre (blank cells), and every row gives the density
// its FSM is worked at: the freighter's heavy fuel oil, 0.95 t/m³ (her file).
func TestTablesCapacityRows(t *testing.T) {
	for _, step := range []string{"0.25", "0.1", "0.3"} {
		_, out, _ := heelwatch(t, "tables", "--vessel", "freighter", "--format", "csv", "--table", "capacity", "--step", step)
		recs, err := csv.NewReader(strings.NewReader(out)).ReadAll()
		if err != nil {
			t.Fatal(err)
		}
		_, tout, _ := heelwatch(t, "tables", "--vessel", "freighter", "--format", "csv", "--table", "tanks")
		trecs, _ := csv.NewReader(strings.NewReader(tout)).ReadAll()
		full := map[string]string{}
		for _, r := range trecs[1:] {
			full[r[0]] = r[1]
		}
		last := map[string][]string{}
		for _, r := range recs[1:] {
			if p, ok := last[r[0]]; ok && !(r[1] > p[1]) {
				t.Errorf("step %s: %s: sounding %s after %s", step, r[0], r[1], p[1])
			}
			if v, _ := strconv.ParseFloat(r[2], 64); v == 0 && (r[3] != "" || r[4] != "" || r[5] != "") {
				t.Errorf("step %s: %s empty at %s m with a centre %v", step, r[0], r[1], r[3:6])
			}
			if strings.HasPrefix(r[0], "Fuel oil tank") && r[7] != "0.950" {
				t.Errorf("%s: density %q, want 0.950", r[0], r[7])
			}
			last[r[0]] = r
		}
		for name, r := range last {
			if r[2] != full[name] {
				t.Errorf("step %s: %s's last row holds %s m³, full %s", step, name, r[2], full[name])
			}
		}
	}
}

// TestTablesJSONFigures: the JSON's figures are rounded to the CSV's four
// decimals (no 0.30000000000000004, no 3e-18), an empty tank's centre is
// null, and each tank gives the density its FSM is worked at.
func TestTablesJSONFigures(t *testing.T) {
	_, out, _ := heelwatch(t, "tables", "--vessel", "freighter", "--format", "json", "--step", "0.25")
	if m := regexp.MustCompile(`: -?\d+\.\d{5,}|: -?[\d.]+e[-+]?\d+|: -0\b`).FindString(out); m != "" {
		t.Errorf("an unrounded figure %q", m)
	}
	var doc struct {
		Tanks []struct {
			Name     string
			Density  *float64 `json:"density_t_m3"`
			Capacity []struct {
				VolumeM3 float64  `json:"volume_m3"`
				LCGM     *float64 `json:"lcg_m"`
				VCGM     *float64 `json:"vcg_m"`
			}
		}
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	for _, tk := range doc.Tanks {
		if tk.Density == nil || *tk.Density <= 0 {
			t.Errorf("%s: no density", tk.Name)
		}
		for _, r := range tk.Capacity {
			if (r.VolumeM3 == 0) != (r.LCGM == nil || r.VCGM == nil) {
				t.Errorf("%s: volume %g with centre %v %v", tk.Name, r.VolumeM3, r.LCGM, r.VCGM)
			}
		}
	}
}
