package main

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// remedyBargeFile writes a test barge (invented for these tests, not a real
// vessel): a box 80 × 16 × 8 m, one weight of 4592 t at (40, tcg, kg), empty
// sea-water ballast wing tanks 20 × 2 × 7 m against each side on
// double-bottom tanks 40 × 8 × 1 m each side, all inside the shell.
func remedyBargeFile(t *testing.T, tcg, kg float64) string {
	t.Helper()
	src := fmt.Sprintf(`format = 1
name = "Remedy test barge"
about = "Invented box barge for the righting-option tests (not a real vessel)."
criteria = []

[hull]
shape = "box"
length = 80.0
breadth = 16.0
depth = 8.0

[[weight]]
name = "Lightship and cargo"
mass = 4592.0
lcg = 40.0
tcg = %g
vcg = %g
`, tcg, kg)
	for _, tk := range []struct {
		name           string
		y0, y1         float64
		x0, x1, z0, z1 float64
	}{
		{"Wing P", -8, -6, 30, 50, 1, 8}, {"Wing S", 6, 8, 30, 50, 1, 8},
		{"DB P", -8, 0, 20, 60, 0, 1}, {"DB S", 0, 8, 20, 60, 0, 1},
	} {
		src += fmt.Sprintf(`
[[compartment]]
name = %q
use = "tank"
x = [%g, %g]
y = [%g, %g]
z = [%g, %g]
liquid = "sea water ballast"
liquid_density = 1.025
fill = 0.0
`, tk.name, tk.x0, tk.x1, tk.y0, tk.y1, tk.z0, tk.z1)
	}
	path := filepath.Join(t.TempDir(), "remedy-barge.toml")
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// remedyList returns the "remedies" list of a solve JSON document.
func remedyList(t *testing.T, m map[string]any) []map[string]any {
	t.Helper()
	raw, ok := m["remedies"].([]any)
	if !ok {
		t.Fatalf("remedies = %#v, want a list", m["remedies"])
	}
	var out []map[string]any
	for _, r := range raw {
		o, ok := r.(map[string]any)
		if !ok {
			t.Fatalf("remedies holds %#v, want objects", r)
		}
		out = append(out, o)
	}
	return out
}

// TestSolveRemediesJSON checks the keys of the righting options in
// `solve --remedies --format json` (as the README documents them), that they
// are absent without the flag, and the heel after ballasting the high wing
// tank against the wall-sided formula (Barrass & Derrett, Ship Stability
// for Masters and Mates, p.130, found).
func TestSolveRemediesJSON(t *testing.T) {
	_, plain := solveJSON(t, "--open", "Wing tank 2 S")
	for _, k := range []string{"remedies", "remedies_summary", "remedies_loll", "remedies_caution"} {
		if _, ok := plain[k]; ok {
			t.Errorf("%s present without --remedies", k)
		}
	}
	tests := []struct {
		name string
		args []string
	}{
		{"bundled ship, wing tank holed", []string{"--open", "Wing tank 2 S", "--remedies"}},
		{"bundled ship, two spaces holed", []string{"--remedies", "--open", "Wing tank 2 S,DB 2 S"}},
		{"test barge listed", []string{"--vessel", remedyBargeFile(t, 0.08, 5.0), "--remedies"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			code, m := solveJSON(t, tc.args...)
			if code != 0 {
				t.Fatalf("exit status %d", code)
			}
			if s, _ := m["remedies_summary"].(string); !strings.Contains(s, "not orders") {
				t.Errorf("remedies_summary %q does not say the options are not orders", s)
			}
			if l, ok := m["remedies_loll"].(bool); !ok || l {
				t.Errorf("remedies_loll = %#v, want false", m["remedies_loll"])
			}
			list := remedyList(t, m)
			if len(list) == 0 {
				t.Fatal("no options for a listed ship")
			}
			for _, o := range list {
				for _, k := range []string{"action", "note", "kind", "lowest_opening", "no_equilibrium"} {
					if _, ok := o[k].(string); !ok {
						t.Errorf("%s = %#v, want a string", k, o[k])
					}
				}
				numbers(t, "remedies[]", o, "mass_t", "heel_deg", "trim_m", "gm_m", "deck_edge_m", "upright_gm_m", "draft_aft_m", "draft_mid_m", "draft_fwd_m")
				if v, ok := o["lowest_opening_m"]; !ok || (v != nil && !isNumber(v)) {
					t.Errorf("lowest_opening_m = %#v, want a number or null", v)
				}
				for _, k := range []string{"advisable", "to_upright", "deck_edge_immersed", "opening_immersed"} {
					if _, ok := o[k].(bool); !ok {
						t.Errorf("%s = %#v, want a bool", k, o[k])
					}
				}
				if tanks, ok := o["tanks"].([]any); !ok || len(tanks) == 0 {
					t.Errorf("tanks = %#v, want a list of names", o["tanks"])
				}
			}
		})
	}

	// The barge: Wing P filled from the sea to 98 % of its capacity
	// (μ 0.95 × 280 m³, conventions) takes 0.98·0.95·280 m³ at 1.025 t/m³ at
	// y = −7 m, z = 1 + 0.98·7/2 m. By hand: Δ, KG and TCG by
	// moments, T = Δ/(ρLB), KB = T/2, BM = B²/(12T) (practice), and the heel
	// from GM·tanθ + ½BM·tan³θ = TCG, the wall-sided formula.
	_, m := solveJSON(t, "--vessel", remedyBargeFile(t, 0.08, 5.0), "--remedies")
	w := 0.98 * 0.95 * 280 * 1.025
	disp := 4592 + w
	kg := (4592*5.0 + w*(1+0.98*7/2)) / disp
	tcg := (4592*0.08 - w*7) / disp
	T := disp / (1.025 * 80 * 16)
	bm := 16 * 16 / (12 * T)
	gm := T/2 + bm - kg
	lo, hi := -1.0, 1.0
	for i := 0; i < 200; i++ {
		mid := (lo + hi) / 2
		if gm*mid+bm*mid*mid*mid/2-tcg > 0 {
			hi = mid
		} else {
			lo = mid
		}
	}
	want := math.Atan(lo) * 180 / math.Pi
	found := false
	for _, o := range remedyList(t, m) {
		if o["action"] != "fill Wing P from the sea to 98 %" {
			continue
		}
		found = true
		if got := o["heel_deg"].(float64); math.Abs(got-want) > 1e-6 {
			t.Errorf("Wing P full: heel_deg %.9f, wall-sided formula %.9f", got, want)
		}
		if got := o["upright_gm_m"].(float64); math.Abs(got-gm) > 1e-9 {
			t.Errorf("Wing P full: upright_gm_m %.9f, box closed form %.9f", got, gm)
		}
		if got := o["mass_t"].(float64); math.Abs(got-w) > 1e-9 {
			t.Errorf("Wing P full: mass_t %v, want %v", got, w)
		}
	}
	if !found {
		t.Errorf("no option fills Wing P to 98 %%")
	}
}

func isNumber(v any) bool { _, ok := v.(float64); return ok }

// TestSolveRemediesLoll checks a lolling barge (upright GM negative) through
// the command: the options say plainly not to counter-ballast the high side
// and none puts water into a tank on it (common bridge and damage-control
// practice).
func TestSolveRemediesLoll(t *testing.T) {
	file := remedyBargeFile(t, 0, 7.9)
	code, m := solveJSON(t, "--vessel", file, "--remedies")
	if code != 0 {
		t.Fatalf("exit status %d", code)
	}
	if l, _ := m["remedies_loll"].(bool); !l {
		t.Fatalf("remedies_loll = %#v, want true", m["remedies_loll"])
	}
	heel := m["equilibrium"].(map[string]any)["heel_deg"].(float64)
	high := "P"
	if heel < 0 {
		high = "S"
	}
	if s := m["remedies_summary"].(string); !strings.Contains(s, "Do not counter-ballast the high") {
		t.Errorf("summary %q", s)
	}
	list := remedyList(t, m)
	if len(list) == 0 {
		t.Fatal("no option to lower G")
	}
	for _, o := range list {
		if o["kind"] == "transfer" {
			t.Errorf("a transfer is offered in a loll: %v", o["action"])
		}
		for _, n := range o["tanks"].([]any) {
			if o["kind"] == "fill" && strings.HasSuffix(n.(string), " "+high) {
				t.Errorf("ballasts the high side: %v", o["action"])
			}
		}
	}
	_, text, _ := heelwatch(t, "solve", "--vessel", file, "--remedies")
	if !strings.Contains(text, "Do not counter-ballast the high") {
		t.Errorf("text lacks the warning:\n%s", text)
	}
}

// TestSolveRemediesFormats checks that text and Markdown show the options
// with their cautions only when asked, and that a sinking state gives none
// and still exits 3.
func TestSolveRemediesFormats(t *testing.T) {
	for _, format := range []string{"text", "markdown"} {
		_, with, _ := heelwatch(t, "solve", "--open", "Wing tank 2 S", "--remedies", "--format", format)
		_, without, _ := heelwatch(t, "solve", "--open", "Wing tank 2 S", "--format", format)
		for _, want := range []string{"Righting options", "fill Wing tank 2 P from the sea", "not orders", "one tank at a time", "dvisable"} {
			if !strings.Contains(with, want) {
				t.Errorf("%s with --remedies lacks %q", format, want)
			}
		}
		if strings.Contains(without, "Righting options") {
			t.Errorf("%s without --remedies shows the options", format)
		}
	}
	code, out, _ := heelwatch(t, "solve", "--vessel", sinking, "--open", "Main void", "--remedies", "--format", "json")
	if code != exitNoEq {
		t.Errorf("sinking with --remedies: exit %d, want %d", code, exitNoEq)
	}
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	if list, ok := m["remedies"].([]any); !ok || len(list) != 0 {
		t.Errorf("sinking: remedies = %#v, want []", m["remedies"])
	}
	if s, _ := m["remedies_summary"].(string); !strings.Contains(s, "no floating position") {
		t.Errorf("sinking: remedies_summary %q", s)
	}
	_, help, _ := heelwatch(t, "solve", "--help")
	if !strings.Contains(help, "--remedies") {
		t.Errorf("solve --help does not name --remedies:\n%s", help)
	}
}
