package main

import (
	"bytes"
	"encoding/json"
	"flag"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"time"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/")

const (
	sinking    = "../../testdata/cli/sinking.toml"
	reportCase = "../../testdata/cli/report-case.toml"
)

func init() {
	// Reports are dated; the goldens need one fixed time.
	now = func() time.Time { return time.Date(2025, 6, 1, 2, 15, 0, 0, time.UTC) }
}

// heelwatch runs the program with args and returns its exit status and output.
func heelwatch(t *testing.T, args ...string) (int, string, string) {
	t.Helper()
	var out, errOut bytes.Buffer
	code := run(args, &out, &errOut)
	return code, out.String(), errOut.String()
}

func solveJSON(t *testing.T, args ...string) (int, map[string]any) {
	t.Helper()
	code, out, errOut := heelwatch(t, append([]string{"solve", "--format", "json"}, args...)...)
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatalf("solve %v: output is not one JSON object: %v\nstdout:\n%s\nstderr:\n%s", args, err, out, errOut)
	}
	return code, m
}

// TestSolveJSONContract checks the keys and types that heelwatch's
// conventions require of `solve --format json`, on bundled vessels.
func TestSolveJSONContract(t *testing.T) {
	tests := []struct {
		name     string
		args     []string
		wantHand bool // the hand method applies: a compartment open to the sea
	}{
		{"barge intact", []string{"--vessel", "barge"}, false},
		{"barge two open", []string{"--vessel", "barge", "--open", "1 wing void S,Hold aft"}, true},
		{"default ship intact", nil, false},
		{"default ship two open", []string{"--open", "Wing tank 2 S,DB 2 S"}, true},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			code, m := solveJSON(t, tc.args...)
			if code != 0 {
				t.Fatalf("exit status %d, want 0", code)
			}
			if _, ok := m["vessel"].(string); !ok {
				t.Errorf("vessel = %#v, want a string", m["vessel"])
			}
			open, ok := m["open"].([]any)
			if !ok {
				t.Fatalf("open = %#v, want a list", m["open"])
			}
			for _, o := range open {
				if _, ok := o.(string); !ok {
					t.Errorf("open holds %#v, want strings", o)
				}
			}
			eq, ok := m["equilibrium"].(map[string]any)
			if !ok {
				t.Fatalf("equilibrium = %#v, want an object", m["equilibrium"])
			}
			numbers(t, "equilibrium", eq, "draft_aft_m", "draft_mid_m", "draft_fwd_m", "trim_m", "heel_deg", "gm_m")
			gz, ok := m["gz"].(map[string]any)
			if !ok {
				t.Fatalf("gz = %#v, want an object", m["gz"])
			}
			heel, ok1 := gz["heel_deg"].([]any)
			lever, ok2 := gz["gz_m"].([]any)
			if !ok1 || !ok2 || len(heel) != len(lever) {
				t.Errorf("gz heel_deg %#v and gz_m %#v: want two lists of one length", gz["heel_deg"], gz["gz_m"])
			}
			for i := range heel {
				_, a := heel[i].(float64)
				_, b := lever[i].(float64)
				if !a || !b {
					t.Fatalf("gz point %d: %#v, %#v: want numbers", i, heel[i], lever[i])
				}
			}
			// The conventions' curve: from 0° in steps of at most 1° to at
			// least 60° or the angle of vanishing stability.
			if len(heel) < 2 || heel[0].(float64) != 0 {
				t.Fatalf("gz heel_deg %v: want a curve from 0°", heel)
			}
			for i := 1; i < len(heel); i++ {
				if step := heel[i].(float64) - heel[i-1].(float64); !(step > 0 && step <= 1+1e-9) {
					t.Errorf("gz step %v° at %v°: want ascending steps of at most 1°", step, heel[i-1])
				}
			}
			last := heel[len(heel)-1].(float64)
			if van, _ := gz["vanishing_deg"].(float64); last < 60-1e-9 && last < van-1e-6 {
				t.Errorf("gz ends at %v°, before 60° and before vanishing at %v°", last, van)
			}
			if h, present := m["hand"]; !present {
				t.Error("hand missing: want an object or null")
			} else if (h != nil) != tc.wantHand {
				t.Errorf("hand = %v, want an object: %v (hand_note %q)", h, tc.wantHand, m["hand_note"])
			} else if h != nil {
				hm, ok := h.(map[string]any)
				if !ok {
					t.Fatalf("hand = %#v, want an object or null", h)
				}
				numbers(t, "hand", hm, "sinkage_m", "draft_m", "cf_shift_m", "kb_m", "bm_m", "km_m", "gm_m",
					"heel_deg", "draft_aft_m", "draft_fwd_m", "trim_m")
			}
			flags, ok := m["flags"].([]any)
			if !ok {
				t.Fatalf("flags = %#v, want a list", m["flags"])
			}
			for _, f := range flags {
				fm, ok := f.(map[string]any)
				_, c := fm["code"].(string)
				_, msg := fm["message"].(string)
				if !ok || !c || !msg {
					t.Errorf("flag %#v: want {code, message} strings", f)
				}
			}
		})
	}
}

func numbers(t *testing.T, where string, m map[string]any, keys ...string) {
	t.Helper()
	for _, k := range keys {
		if _, ok := m[k].(float64); !ok {
			t.Errorf("%s.%s = %#v, want a number", where, k, m[k])
		}
	}
}

// TestSolveBoxClosedForm checks the figures that reach the JSON against the
// box closed forms (practice): upright, the displaced volume is L·B·T at
// the amidships draft, and trim is draft aft − draft forward.
func TestSolveBoxClosedForm(t *testing.T) {
	code, m := solveJSON(t, "--vessel", "barge")
	if code != 0 {
		t.Fatalf("exit status %d", code)
	}
	eq := m["equilibrium"].(map[string]any)
	disp := eq["displacement_t"].(float64)
	mid := eq["draft_mid_m"].(float64)
	// Box 80 × 16 m in sea water of 1.025 t/m³ (Barrass & Derrett, found).
	if want := disp / (1.025 * 80 * 16); math.Abs(mid-want) > 1e-9 {
		t.Errorf("draft_mid_m = %.12f, want Δ/(ρLB) = %.12f", mid, want)
	}
	if got, want := eq["trim_m"].(float64), eq["draft_aft_m"].(float64)-eq["draft_fwd_m"].(float64); math.Abs(got-want) > 1e-12 {
		t.Errorf("trim_m = %v, want draft aft − draft forward = %v", got, want)
	}
}

// TestSolveMirror opens a wing void and its mirror image on the symmetric
// barge: the heels must be equal and opposite, starboard positive (the
// conventions' sign).
func TestSolveMirror(t *testing.T) {
	_, s := solveJSON(t, "--vessel", "barge", "--open", "2 wing void S")
	_, p := solveJSON(t, "--vessel", "barge", "--open", "2 wing void P")
	hs := s["equilibrium"].(map[string]any)["heel_deg"].(float64)
	hp := p["equilibrium"].(map[string]any)["heel_deg"].(float64)
	if !(hs > 0) || math.Abs(hs+hp) > 1e-6 {
		t.Errorf("heel with the starboard void open %v°, port %v°: want equal and opposite, starboard positive", hs, hp)
	}
}

func TestExitStatus(t *testing.T) {
	tests := []struct {
		name string
		args []string
		want int
	}{
		{"solve", []string{"solve", "--vessel", "barge"}, 0},
		{"solve markdown", []string{"solve", "--vessel", "barge", "--open", "Hold aft", "--format", "markdown"}, 0},
		{"top-level vessel", []string{"--vessel", "barge", "solve"}, 0},
		{"check bundled", []string{"check", "barge"}, 0},
		{"check two", []string{"check", "barge", reportCase}, 0},
		{"vessels", []string{"vessels"}, 0},
		{"vessels json", []string{"vessels", "--format", "json"}, 0},
		{"vessels source", []string{"vessels", "barge"}, 0},
		{"version", []string{"--version"}, 0},
		{"help", []string{"--help"}, 0},
		{"help solve", []string{"help", "solve"}, 0},
		{"solve help", []string{"solve", "--help"}, 0},
		{"check help", []string{"check", "-h"}, 0},
		{"no arguments", nil, 0},
		{"dashboard on the barge", []string{"--vessel", "barge", "--palette", "night"}, 0},
		{"bad palette", []string{"--palette", "red"}, 2},
		{"dashboard bad file", []string{"--vessel", "../../testdata/cli/bad/syntax.toml"}, 1},
		{"bad file", []string{"solve", "--vessel", "../../testdata/cli/bad/permeability.toml"}, 1},
		{"check bad file", []string{"check", "../../testdata/cli/bad/syntax.toml"}, 1},
		{"check bad among good", []string{"check", "barge", "../../testdata/cli/bad/breadth.toml", sinking}, 1},
		{"missing file", []string{"solve", "--vessel", "testdata/no-such-file.toml"}, 1},
		{"unknown bundled name", []string{"solve", "--vessel", "nosuchvessel"}, 1},
		{"unknown open", []string{"solve", "--vessel", "barge", "--open", "Hold 9"}, 2},
		{"unknown perm", []string{"solve", "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold 9=0.5"}, 2},
		{"perm not open", []string{"solve", "--vessel", "barge", "--perm", "Hold aft=0.5"}, 2},
		{"perm too big", []string{"solve", "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold aft=1.01"}, 2},
		{"perm zero", []string{"solve", "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold aft=0"}, 2},
		{"perm NaN", []string{"solve", "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold aft=NaN"}, 2},
		{"perm no value", []string{"solve", "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold aft"}, 2},
		{"bad format", []string{"solve", "--format", "yaml"}, 2},
		{"unknown flag", []string{"solve", "--openn", "x"}, 2},
		{"stray argument", []string{"solve", "barge"}, 2},
		{"unknown command", []string{"float"}, 2},
		{"unknown top flag", []string{"--vesel", "barge"}, 2},
		{"vessels unknown", []string{"vessels", "nosuch"}, 2},
		{"sinks", []string{"solve", "--vessel", sinking, "--open", "Main void"}, 3},
		{"sinks json", []string{"solve", "--vessel", sinking, "--open", "Main void", "--format", "json"}, 3},
		{"floats when intact", []string{"solve", "--vessel", sinking}, 0},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			code, out, errOut := heelwatch(t, tc.args...)
			if code != tc.want {
				t.Errorf("heelwatch %q: exit status %d, want %d\nstdout:\n%s\nstderr:\n%s", tc.args, code, tc.want, out, errOut)
			}
			if strings.Contains(out+errOut, "panic") || strings.Contains(out, "NaN") {
				t.Errorf("output holds a panic or NaN:\n%s%s", out, errOut)
			}
			if tc.want == 2 && errOut == "" {
				t.Error("bad usage with nothing on stderr")
			}
		})
	}
}

// With no equilibrium the JSON holds equilibrium: null and a flag says so.
func TestSinkingJSON(t *testing.T) {
	code, m := solveJSON(t, "--vessel", sinking, "--open", "Main void")
	if code != 3 {
		t.Errorf("exit status %d, want 3", code)
	}
	if v, present := m["equilibrium"]; !present || v != nil {
		t.Errorf("equilibrium = %#v, want null", v)
	}
	if m["outcome"] != "sinks" {
		t.Errorf("outcome = %v, want sinks", m["outcome"])
	}
	flags, _ := m["flags"].([]any)
	if len(flags) == 0 {
		t.Fatal("no flag says that she sinks")
	}
	said := false
	for _, f := range flags {
		fm := f.(map[string]any)
		if fm["severity"] == "danger" && strings.Contains(strings.ToLower(fm["message"].(string)), "sink") {
			said = true
		}
	}
	if !said {
		t.Errorf("flags %v: none says she sinks", flags)
	}
}

func TestUnknownOpenRefusedByName(t *testing.T) {
	code, out, errOut := heelwatch(t, "solve", "--vessel", "barge", "--open", "Hold aft,Engine room")
	if code != 2 || out != "" {
		t.Errorf("exit status %d, stdout %q: want 2 and nothing", code, out)
	}
	for _, want := range []string{`"Engine room"`, "Hold fwd", "1 wing void S", "Fore peak void"} {
		if !strings.Contains(errOut, want) {
			t.Errorf("stderr lacks %s:\n%s", want, errOut)
		}
	}
}

func TestPermeabilityOverride(t *testing.T) {
	code, m := solveJSON(t, "--vessel", "barge", "--open", "Hold aft", "--open", "1 wing void S", "--perm", "Hold aft=85%")
	if code != 0 {
		t.Fatalf("exit status %d", code)
	}
	got := map[string]float64{}
	for _, o := range m["open_compartments"].([]any) {
		om := o.(map[string]any)
		got[om["name"].(string)] = om["permeability"].(float64)
	}
	// 0.95 for a void: SOLAS II-1 Reg. 7-3 (found), the barge's default by use.
	if got["Hold aft"] != 0.85 || got["1 wing void S"] != 0.95 {
		t.Errorf("permeabilities %v, want Hold aft 0.85 and 1 wing void S 0.95", got)
	}
	if open := m["open"].([]any); len(open) != 2 || open[0] != "Hold aft" {
		t.Errorf("open = %v, want the names in the order given", open)
	}
	// A larger permeability loses more buoyancy: she sinks deeper.
	_, low := solveJSON(t, "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold aft=0.5")
	_, high := solveJSON(t, "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold aft=0.9")
	dl := low["equilibrium"].(map[string]any)["draft_mid_m"].(float64)
	dh := high["equilibrium"].(map[string]any)["draft_mid_m"].(float64)
	if !(dh > dl) {
		t.Errorf("draft amidships %v m at μ 0.9, %v m at μ 0.5: want deeper at 0.9", dh, dl)
	}
}

// problemLine is a problem as the vessels package prints it: file:line: key: message.
var problemLine = regexp.MustCompile(`^(.+\.toml):(\d+): ([^:]+): (.+)$`)

// TestBadFiles: every bad vessel file is refused with status 1, and every
// problem names the file, the line and the key, by solve and by check alike.
func TestBadFiles(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/cli/bad/*.toml")
	more, _ := filepath.Glob("../../testdata/vessels/bad/*.toml")
	files = append(files, more...)
	if len(files) < 3 {
		t.Fatalf("found %d bad files, want at least the 3 of testdata/cli/bad", len(files))
	}
	for _, f := range files {
		for _, cmd := range [][]string{{"check", f}, {"solve", "--vessel", f, "--format", "json"}} {
			code, out, errOut := heelwatch(t, cmd...)
			if code != 1 {
				t.Errorf("%v: exit status %d, want 1\n%s", cmd, code, errOut)
			}
			if out != "" {
				t.Errorf("%v: printed a result for a bad file:\n%s", cmd, out)
			}
			lines := strings.Split(strings.TrimSpace(errOut), "\n")
			if len(lines) < 2 {
				t.Errorf("%v: stderr %q: want the problems and a closing line", cmd, errOut)
				continue
			}
			for _, l := range lines[:len(lines)-1] {
				if m := problemLine.FindStringSubmatch(l); m == nil || m[1] != f {
					t.Errorf("%v: %q does not read %s:LINE: KEY: MESSAGE", cmd, l, f)
				}
			}
		}
	}
	// The lines and keys of our own bad files, counted in the files.
	want := map[string][]string{
		"permeability.toml": {":42: compartment[2].permeability: "},
		"breadth.toml":      {":11: hull.breadth: ", ":12: hull.beam_note: "},
	}
	for file, parts := range want {
		_, _, errOut := heelwatch(t, "check", "../../testdata/cli/bad/"+file)
		for _, p := range parts {
			if !strings.Contains(errOut, file+p) {
				t.Errorf("check %s: stderr lacks %q:\n%s", file, p, errOut)
			}
		}
	}
}

func TestCheckSummary(t *testing.T) {
	code, out, _ := heelwatch(t, "check", reportCase)
	if code != 0 {
		t.Fatalf("exit status %d", code)
	}
	for _, want := range []string{"no errors (the warnings below", "length 60.00 m, breadth 12.00 m, depth 6.00 m",
		"displacement 1636.8 t", "Wing tank P", "fresh water 40 %", "Hold", "dry cargo", "0.70", "360.0", "GM "} {
		if !strings.Contains(out, want) {
			t.Errorf("summary lacks %q:\n%s", want, out)
		}
	}
	// 1500 t of weights and 0.40 of the capacity 0.95 × 20 × 3 × 6 m³ of
	// fresh water at 1.000 t/m³ (arithmetic of the test file; capacity = μ ×
	// volume, conventions): 1636.8 t.
	if !strings.Contains(out, "tank contents 136.8 t = 1636.8 t") {
		t.Errorf("summary does not add up the loading condition:\n%s", out)
	}
}

func TestVersion(t *testing.T) {
	_, out, _ := heelwatch(t, "--version")
	if out != "heelwatch dev\n" {
		t.Errorf("--version printed %q", out)
	}
}

// TestGolden compares the text and Markdown reports of one fixed case with
// the golden files in testdata/. Refresh them with go test ./cmd/heelwatch -update.
func TestGolden(t *testing.T) {
	tests := []struct {
		golden string
		args   []string
	}{
		{"solve-text.golden", []string{"solve", "--vessel", reportCase, "--open", "Wing void S"}},
		{"solve-markdown.golden", []string{"solve", "--vessel", reportCase, "--open", "Wing void S", "--format", "markdown"}},
		{"solve-intact-text.golden", []string{"solve", "--vessel", reportCase}},
		{"solve-sinking-markdown.golden", []string{"solve", "--vessel", sinking, "--open", "Main void", "--format", "markdown"}},
		{"check.golden", []string{"check", reportCase}},
	}
	for _, tc := range tests {
		t.Run(tc.golden, func(t *testing.T) {
			_, out, _ := heelwatch(t, tc.args...)
			path := filepath.Join("testdata", tc.golden)
			if *update {
				if err := os.WriteFile(path, []byte(out), 0o644); err != nil {
					t.Fatal(err)
				}
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("%v (run go test ./cmd/heelwatch -update to write it)", err)
			}
			if out != string(want) {
				t.Errorf("heelwatch %q differs from %s (go test ./cmd/heelwatch -update rewrites it):\n--- got\n%s\n--- want\n%s", tc.args, path, out, want)
			}
		})
	}
}

// FuzzSolveFlags feeds arbitrary --open and --perm values to solve on the
// bundled barge: never a panic, never NaN in the output, and only the exit
// statuses the conventions allow.
func FuzzSolveFlags(f *testing.F) {
	f.Add("Hold aft", "Hold aft=0.85", "json")
	f.Add("1 wing void S,2 wing void S", "", "text")
	f.Add("Hold aft,Hold fwd,DB ballast aft", "Hold fwd=1", "markdown")
	f.Add(",,", "=", "json")
	f.Add("Hold aft", "Hold aft=1e-300", "text")
	f.Fuzz(func(t *testing.T, open, perm, format string) {
		var out, errOut bytes.Buffer
		code := run([]string{"solve", "--vessel", "barge", "--open", open, "--perm", perm, "--format", format}, &out, &errOut)
		switch code {
		case 0, 3:
			if format == "json" && !json.Valid(out.Bytes()) {
				t.Fatalf("status %d with invalid JSON:\n%s", code, out.String())
			}
		case 2:
			if errOut.Len() == 0 {
				t.Fatal("status 2 with nothing on stderr")
			}
		default:
			t.Fatalf("status %d; stderr:\n%s", code, errOut.String())
		}
		if strings.Contains(out.String(), "NaN") || strings.Contains(out.String(), "Inf") {
			t.Fatalf("NaN or Inf in the output:\n%s", out.String())
		}
	})
}

// TestHandJSONLostBuoyancy checks the hand object of the JSON against the
// lost-buoyancy method worked out here for the test lighter (practice; the
// method as in Barrass & Derrett's bilging chapter, memory). Wing void S is
// x 30–50, y 3–6, full depth, μ 0.95; the lighter is 60 × 12 m of
// 1500 t + 0.40 × 0.95 × 360 m³ × 1.000 t/m³ = 1636.8 t in water of
// 1.025 t/m³ (a tank's capacity is μ × its volume: conventions).
func TestHandJSONLostBuoyancy(t *testing.T) {
	code, m := solveJSON(t, "--vessel", reportCase, "--open", "Wing void S")
	if code != 0 {
		t.Fatalf("exit status %d", code)
	}
	h, ok := m["hand"].(map[string]any)
	if !ok {
		t.Fatalf("hand = %v (hand_note %q), want an object", m["hand"], m["hand_note"])
	}
	V := 1636.8 / 1.025
	T0 := V / (60 * 12)  // intact draft
	a := 0.95 * 20 * 3   // lost waterplane, m²
	v := a * T0          // lost volume below T0, m³
	A := 60*12 - a       // intact waterplane, m²
	s := v / A           // sinkage
	shift := a * 4.5 / A // CF moves away from the lost area's centre (y = 4.5 m)
	tests := []struct {
		key  string
		want float64
		tol  float64
	}{
		{"sinkage_m", s, 1e-9},
		{"draft_m", T0 + s, 1e-9},
		{"cf_shift_m", shift, 1e-9},
	}
	for _, tc := range tests {
		if got, ok := h[tc.key].(float64); !ok || math.Abs(got-tc.want) > tc.tol {
			t.Errorf("hand.%s = %v, want %.9f", tc.key, h[tc.key], tc.want)
		}
	}
	// At this small heel (under 3°) the hand and direct drafts agree
	// within 1 %, as heelwatch expects of the method at small angles.
	eq := m["equilibrium"].(map[string]any)
	if d, hd := eq["draft_mid_m"].(float64), h["draft_m"].(float64); math.Abs(d-hd) > 0.01*d {
		t.Errorf("direct draft amidships %v m, hand mean draft %v m: more than 1 %% apart", d, hd)
	}
}

// TestCheckWarnsOfOpeningUnderWater: an opening under water with the ship
// intact is most often a slip in its position; check says so, and that the
// file is otherwise sound. The test file's vent is moved to z = 1.0 m, below
// the intact draft of 1644 t / (1.025 × 60 × 12) ≈ 2.23 m (box closed form,
// practice).
func TestCheckWarnsOfOpeningUnderWater(t *testing.T) {
	data, err := os.ReadFile(reportCase)
	if err != nil {
		t.Fatal(err)
	}
	moved := strings.Replace(string(data), "z = 6.8", "z = 1.0", 1)
	if moved == string(data) {
		t.Fatal("the test file's vent is not where this test expects it")
	}
	path := filepath.Join(t.TempDir(), "low-vent.toml")
	if err := os.WriteFile(path, []byte(moved), 0o644); err != nil {
		t.Fatal(err)
	}
	_, out, _ := heelwatch(t, "check", path)
	if !strings.Contains(out, "no errors (the warnings below") || !strings.Contains(out, `WARNING`) || !strings.Contains(out, `"Wing void S vent"`) {
		t.Errorf("check does not warn of the vent under water:\n%s", out)
	}
	_, out, _ = heelwatch(t, "check", reportCase)
	if strings.Contains(out, "under water intact") {
		t.Errorf("check warns of an opening under water in the test file as it is:\n%s", out)
	}
}
