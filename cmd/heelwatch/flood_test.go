package main

// Tests of `heelwatch flood`. The vessels are invented test barges written
// here, or the bundled demo vessels.

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// floodBoxFile writes an invented 100 × 20 × 10 m box barge at 5 m draft
// with a void amidships on the centreline, 10 × 8 m in plan, its hole in
// the bottom, and a wing void to starboard without a hole.
func floodBoxFile(t *testing.T, pumpM3h float64) string {
	t.Helper()
	src := `format = 1
name = "Flood test barge (invented)"

[hull]
shape = "box"
length = 100.0
breadth = 20.0
depth = 10.0

[[weight]]
name = "Barge"
mass = 10250.0
lcg = 50.0
tcg = 0.0
vcg = 4.0

[[compartment]]
name = "Centre void"
use = "void"
permeability = 1.0
x = [45.0, 55.0]
y = [-4.0, 4.0]
z = [0.0, 10.0]
hole = { area = 0.05, x = 50.0, y = 0.0, z = 0.0, cd = 0.6 }
`
	if pumpM3h > 0 {
		src += "pump_m3h = " + strconv.FormatFloat(pumpM3h, 'f', -1, 64) + "\n"
	}
	src += `
[[compartment]]
name = "Wing void S"
use = "void"
x = [20.0, 40.0]
y = [6.0, 10.0]
z = [0.0, 10.0]
`
	path := filepath.Join(t.TempDir(), "flood-barge.toml")
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// floodJSON runs flood --format json and decodes the object.
func floodJSON(t *testing.T, args ...string) (int, map[string]any, string) {
	t.Helper()
	code, out, errOut := heelwatch(t, append([]string{"flood", "--format", "json"}, args...)...)
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatalf("flood %v: output is not one JSON object: %v\nstdout:\n%s\nstderr:\n%s", args, err, out, errOut)
	}
	return code, m, errOut
}

func floodNum(t *testing.T, m map[string]any, key string) float64 {
	t.Helper()
	x, ok := m[key].(float64)
	if !ok {
		t.Fatalf("key %q: %v (%T), want a number", key, m[key], m[key])
	}
	return x
}

// torricelliBox is the time for the centre void of floodBoxFile to fill
// until the head falls from T0 to h1: the barge sinks bodily by V/A_wp and
// the water inside rises by V/A_c, so the head is T0 − V/A_e with
// 1/A_e = 1/A_c − 1/A_wp, and Torricelli's dV/dt = C_d·a·√(2 g h) (practice)
// integrates to t = (2·A_e/(C_d·a·√(2g)))·(√T0 − √h1).
func torricelliBox(h1 float64) (t, ae float64) {
	ae = 1 / (1/80.0 - 1/2000.0)
	return 2 * ae / (0.6 * 0.05 * math.Sqrt(2*9.80665)) * (math.Sqrt(5) - math.Sqrt(h1)), ae
}

// TestFloodJSONClosedForm checks the JSON keys and the answers on the test
// barge against Torricelli's closed form (practice) and, at the end, the
// lost-buoyancy solution (memory: both methods give the same final
// waterline).
func TestFloodJSONClosedForm(t *testing.T) {
	file := floodBoxFile(t, 0)
	code, m, errOut := floodJSON(t, "--vessel", file, "--hole", "Centre void")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	for _, k := range []string{"vessel", "vessel_file", "compartment", "permeability", "capacity_m3", "hole", "pumps_m3h", "pumps_from",
		"open", "limit_s", "end", "end_s", "end_reason", "equalise_s", "steady_head_m", "pumps_hold", "final_water_m3", "events",
		"table", "stages", "stages_of_m3", "final", "lost_buoyancy", "lost_buoyancy_reason", "lost_buoyancy_water_m3",
		"final_difference_m", "trace", "solver", "heelwatch_version"} {
		if _, ok := m[k]; !ok {
			t.Errorf("key %q missing", k)
		}
	}
	if m["end"] != "equalised" || m["compartment"] != "Centre void" {
		t.Fatalf("end %v, compartment %v", m["end"], m["compartment"])
	}
	tEq, ae := torricelliBox(0)
	if got := floodNum(t, m, "equalise_s"); math.Abs(got-tEq) > 0.5 {
		t.Errorf("equalise_s %.3f, closed form %.3f", got, tEq) // Torricelli (practice)
	}
	if got := floodNum(t, m, "final_water_m3"); math.Abs(got-ae*5) > ae*1e-3 {
		t.Errorf("final_water_m3 %.3f, closed form A_e·T0 = %.3f", got, ae*5)
	}
	if d := floodNum(t, m, "final_difference_m"); d > 0.005 {
		t.Errorf("final_difference_m %.4f: more than 5 mm from lost buoyancy", d) // memory
	}
	h := m["hole"].(map[string]any)
	if h["from"] != "vessel file" || floodNum(t, h, "area_m2") != 0.05 || floodNum(t, h, "cd") != 0.6 {
		t.Errorf("hole %v", h)
	}
	stages := m["stages"].([]any)
	if len(stages) != 4 {
		t.Fatalf("%d stages", len(stages))
	}
	prevT, prevD := -1.0, 5.0
	for i, s := range stages {
		st := s.(map[string]any)
		frac := floodNum(t, st, "fraction")
		// The stage at fraction f holds f·A_e·T0 and sits at T0 + f·A_e·T0/A_wp
		// (wall-sided sinkage, practice).
		wantD := 5 + frac*ae*5/2000
		p := st["position"].(map[string]any)
		if d := floodNum(t, p, "draft_mid_m"); math.Abs(d-wantD) > 1e-3 || d <= prevD && i > 0 {
			t.Errorf("stage %v: draft_mid_m %.4f, closed form %.4f", frac, d, wantD)
		}
		ts := floodNum(t, st, "time_s")
		if ts <= prevT {
			t.Errorf("stage %v at %.1f s, not after the one before", frac, ts)
		}
		prevT, prevD = ts, floodNum(t, p, "draft_mid_m")
	}
	rows := m["table"].([]any)
	last := rows[len(rows)-1].(map[string]any)
	if !strings.HasPrefix(last["event"].(string), "end") || last["position"] == nil {
		t.Errorf("last row %v", last)
	}
	events := m["events"].([]any)
	if ev := events[len(events)-1].(map[string]any); ev["kind"] != "end" || ev["name"] != "equalised" {
		t.Errorf("last event %v", ev)
	}
}

// TestFloodPumpsHold: pumps matched to the inflow at head h_s, C_d·a·√(2 g h_s)
// = Q_p (Torricelli, practice), hold the level there, given on the command
// line or in the vessel file.
func TestFloodPumpsHold(t *testing.T) {
	const hs = 1.0
	q := 0.6 * 0.05 * math.Sqrt(2*9.80665*hs) * 3600
	_, ae := torricelliBox(0)
	for _, c := range []struct {
		name string
		file string
		args []string
		from string
	}{
		{"command line", floodBoxFile(t, 0), []string{"--pump", "Centre void:" + strconv.FormatFloat(q, 'f', -1, 64)}, "command line"},
		{"vessel file", floodBoxFile(t, q), nil, "vessel file"},
	} {
		t.Run(c.name, func(t *testing.T) {
			code, m, errOut := floodJSON(t, append([]string{"--vessel", c.file, "--criteria=false"}, c.args...)...)
			if code != 0 {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			if m["end"] != "pumps-hold" || m["pumps_hold"] != true || m["pumps_from"] != c.from {
				t.Fatalf("end %v, pumps_hold %v, pumps_from %v", m["end"], m["pumps_hold"], m["pumps_from"])
			}
			if got := floodNum(t, m, "steady_head_m"); math.Abs(got-hs) > 1e-6 {
				t.Errorf("steady_head_m %.6f, want %.6f", got, hs)
			}
			fin := m["final"].(map[string]any)
			if got := floodNum(t, fin, "head_m"); math.Abs(got-hs) > 1e-3 {
				t.Errorf("final head %.4f, want %.4f within 1 mm", got, hs)
			}
			if got := floodNum(t, m, "final_water_m3"); math.Abs(got-ae*(5-hs)) > ae*1.1e-3 {
				t.Errorf("water held %.3f, closed form A_e·(T0 − h_s) = %.3f", got, ae*(5-hs))
			}
			if m["equalise_s"] != nil {
				t.Errorf("equalise_s %v: the levels never meet", m["equalise_s"])
			}
		})
	}
}

// TestFloodBundledText runs the bundled ship's wing tank through its file
// hole and reads the text report: equalised, and the final state within
// 5 mm of lost buoyancy (memory).
func TestFloodBundledText(t *testing.T) {
	code, out, errOut := heelwatch(t, "flood", "--hole", "Wing tank 2 S", "--pump", "Wing tank 2 S:0")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	for _, want := range []string{"Outcome: levels equal", "Time to equalise", "Intermediate stages", " 25 %", " 50 %", " 75 %",
		"Final state beside the lost-buoyancy solution", "within 5 mm", "Criteria at the stages"} {
		if !strings.Contains(out, want) {
			t.Errorf("text report lacks %q:\n%s", want, out)
		}
	}
	if strings.Contains(out, "NaN") || strings.Contains(out, "Inf") {
		t.Errorf("a number is not a number:\n%s", out)
	}
}

// TestFloodHoleForms: the ways of giving the hole — the file's, the file's
// position with another area, a height on the shell, the lowest point —
// each placed where it says.
func TestFloodHoleForms(t *testing.T) {
	file := floodBoxFile(t, 0)
	cases := []struct {
		hole       string
		x, y, z, a float64
		from       string
	}{
		{"Centre void", 50, 0, 0, 0.05, "vessel file"},
		{"Centre void:0.2", 50, 0, 0, 0.2, "vessel file's position, area from the command line"},
		{"Wing void S:0.1:2.5", 30, 10, 2.5, 0.1, "command line"},
		{"Wing void S:0.1", 30, 10, 0, 0.1, "command line, at the compartment's lowest point"},
	}
	for _, c := range cases {
		t.Run(c.hole, func(t *testing.T) {
			code, m, errOut := floodJSON(t, "--vessel", file, "--hole", c.hole, "--limit", "2m", "--criteria=false")
			if code != 0 {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			h := m["hole"].(map[string]any)
			for _, k := range []struct {
				key  string
				want float64
			}{{"x_m", c.x}, {"y_m", c.y}, {"z_m", c.z}, {"area_m2", c.a}} {
				if got := floodNum(t, h, k.key); math.Abs(got-k.want) > 1e-9 {
					t.Errorf("%s %v, want %v", k.key, got, k.want)
				}
			}
			if h["from"] != c.from {
				t.Errorf("from %q, want %q", h["from"], c.from)
			}
			if m["end"] != "time-limit" || floodNum(t, m, "end_s") != 120 {
				t.Errorf("end %v at %v, want the 2 min limit", m["end"], m["end_s"])
			}
		})
	}
}

// TestFloodUsage: bad command lines are refused with a message naming the
// problem and exit status 2; a ship that sinks on the way exits 3.
func TestFloodUsage(t *testing.T) {
	file := floodBoxFile(t, 0)
	cases := []struct {
		args []string
		code int
		want string
	}{
		{[]string{"--vessel", file, "--hole", "Centre vod"}, 2, `"Centre vod" is not a compartment`},
		{[]string{"--vessel", file, "--hole", "Wing void S"}, 2, "has no hole in the vessel file"},
		{[]string{"--vessel", file, "--hole", "Centre void:-1"}, 2, "must be a positive number"},
		{[]string{"--vessel", file, "--hole", "Centre void", "--cd", "1.3"}, 2, "--cd"},
		{[]string{"--vessel", file, "--hole", "Centre void", "--limit", "-5m"}, 2, "--limit"},
		{[]string{"--vessel", file, "--hole", "Centre void", "--hole", "Wing void S:1"}, 2, "one --hole"},
		{[]string{"--vessel", file, "--hole", "Centre void", "--pump", "Wing void S:100"}, 2, "pumps work on the flooded compartment"},
		{[]string{"--vessel", file, "--hole", "Centre void", "--pump", "Centre void"}, 2, "NAME:M3H"},
		{[]string{"--vessel", file, "--hole", "Centre void", "--open", "Centre void"}, 2, "leave it out of --open"},
		{[]string{"--vessel", file, "--hole", "Centre void", "--format", "xml"}, 2, "--format"},
		{[]string{"--vessel", "freighter"}, 2, "These have a hole in the vessel file"},
		{[]string{"--vessel", file, "stray"}, 2, "unexpected argument"},
	}
	for _, c := range cases {
		t.Run(strings.Join(c.args[2:], " "), func(t *testing.T) {
			code, out, errOut := heelwatch(t, append([]string{"flood"}, c.args...)...)
			if code != c.code || !strings.Contains(errOut, c.want) {
				t.Errorf("exit %d, stderr %q; want exit %d naming %q (stdout %q)", code, errOut, c.code, c.want, out)
			}
		})
	}
	code, out, _ := heelwatch(t, "flood", "--help")
	if code != 0 || !strings.Contains(out, "--hole NAME[:AREA[:Z]]") {
		t.Errorf("--help: exit %d\n%s", code, out)
	}
}

// TestFloodSinksExit: a hold too large for the reserve buoyancy sinks her
// on the way: end "sinks", exit 3, at the time Torricelli's closed form
// gives for the water that brings her mass to ρ·L·B·D (the box's whole
// volume: 100 × 20 × 5.9 m), A_e as in torricelliBox with A_c = 320 m²
// (practice).
func TestFloodSinksExit(t *testing.T) {
	src := `format = 1
name = "Sinking flood barge (invented)"
[hull]
shape = "box"
length = 100.0
breadth = 20.0
depth = 5.9
[[weight]]
name = "Barge"
mass = 10250.0
lcg = 50.0
vcg = 4.0
[[compartment]]
name = "Hold"
use = "void"
permeability = 1.0
x = [42.0, 58.0]
y = [-10.0, 10.0]
z = [0.0, 5.9]
hole = { area = 0.3, x = 50.0, y = 0.0, z = 0.0 }
`
	path := filepath.Join(t.TempDir(), "sink.toml")
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	code, m, errOut := floodJSON(t, "--vessel", path, "--criteria=false")
	if code != 3 || m["end"] != "sinks" || !strings.Contains(errOut, "sinks") {
		t.Fatalf("exit %d, end %v, stderr %q", code, m["end"], errOut)
	}
	ae := 1 / (1/320.0 - 1/2000.0)
	w := 2000 * 0.9
	want := 2 * ae / (0.6 * 0.3 * math.Sqrt(2*9.80665)) * (math.Sqrt(5) - math.Sqrt(5-w/ae))
	if got := floodNum(t, m, "end_s"); math.Abs(got-want) > 1.5 {
		t.Errorf("sinks at %.2f s, closed form %.2f s", got, want)
	}
	rows := m["table"].([]any)
	if last := rows[len(rows)-1].(map[string]any); last["position"] != nil || last["no_equilibrium"] == "" {
		t.Errorf("last row %v: want no position and the reason", last)
	}
}
