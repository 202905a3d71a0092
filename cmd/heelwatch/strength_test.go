package main

import (
	"encoding/json"
	"math"
	"testing"
)

// strengthOf returns the solve JSON's strength object, failing when null.
func strengthOf(t *testing.T, m map[string]any) map[string]any {
	t.Helper()
	s, ok := m["strength"].(map[string]any)
	if !ok {
		t.Fatalf("strength is %v (note %q), want an object", m["strength"], m["strength_note"])
	}
	for _, k := range []string{"x_m", "shear_kn", "moment_knm"} {
		if _, ok := s[k].([]any); !ok {
			t.Errorf("strength.%s is %T, want an array", k, s[k])
		}
	}
	return s
}

// The barge with a midship block load: the bending moment amidships
// against the closed form −(m_c·g/4)(L/2 − a) (Tupper, Introduction to
// Naval Architecture, ch. 7; derived in engine/strength_test.go), within
// 0.1 % (issue 15).
func TestSolveStrengthBlockClosedForm(t *testing.T) {
	code, m := solveJSON(t, "--vessel", "../../testdata/cli/strength-block.toml")
	if code != 0 {
		t.Fatalf("exit %d", code)
	}
	s := strengthOf(t, m)
	want := -(1500 * 9.80665 / 4) * (40 - 8)
	x, bm := s["x_m"].([]any), s["moment_knm"].([]any)
	if len(x) != 1 || x[0].(float64) != 40 {
		t.Fatalf("x_m %v, want [40]", x)
	}
	got := bm[0].(float64)
	if rel := math.Abs(got-want) / math.Abs(want); rel > 1e-3 {
		t.Errorf("BM amidships %g kN·m, closed form %g (off by %.3g %%)", got, want, 100*rel)
	}
	p := s["points"].([]any)[0].(map[string]any)
	if lim := p["moment_limit_knm"].(float64); lim != 125000 {
		t.Errorf("moment limit %v, want the sagging value 125000", lim)
	}
}

// The freighter with hold 1 open to the sea: the moments and shears at
// each read-out point against the permissible values at sea, the intact
// ship's beside them, and the danger flag at the bulkhead whose shear force
// passes its permissible value (invented demo values, vessels/bundled).
func TestSolveStrengthFreighterHoldFlooded(t *testing.T) {
	code, m := solveJSON(t, "--vessel", "freighter", "--open", "Hold 1")
	if code != 0 {
		t.Fatalf("exit %d", code)
	}
	s := strengthOf(t, m)
	if s["limits"] != "sea" {
		t.Errorf("limits %v", s["limits"])
	}
	pts := s["points"].([]any)
	if len(pts) != 6 {
		t.Fatalf("%d read-out points, want 6", len(pts))
	}
	danger := false
	for _, e := range pts {
		p := e.(map[string]any)
		if _, ok := p["moment_pct"].(float64); !ok {
			t.Errorf("%v: moment_pct %v, want a number", p["name"], p["moment_pct"])
		}
		if p["level"] == "danger" {
			danger = true
		}
	}
	if !danger {
		t.Error("no read-out point past its permissible value")
	}
	if _, ok := s["intact"].(map[string]any); !ok {
		t.Error("no intact strength beside the damaged")
	}
	found := false
	for _, f := range m["flags"].([]any) {
		if f.(map[string]any)["code"] == "girder-over-limit" {
			found = true
		}
	}
	if !found {
		t.Error("no girder-over-limit flag")
	}
}

// A vessel file without weight extents: strength is null and says why.
func TestSolveStrengthNullWithoutExtents(t *testing.T) {
	_, m := solveJSON(t, "--vessel", reportCase)
	if m["strength"] != nil {
		t.Errorf("strength %v, want null", m["strength"])
	}
	if n, _ := m["strength_note"].(string); n == "" {
		t.Error("strength_note is empty")
	}
}

// Each stage of a flooding run carries the hull girder.
func TestFloodStagesCarryStrength(t *testing.T) {
	code, out, errOut := heelwatch(t, "flood", "--vessel", "freighter", "--hole", "Hold 1:0.3", "--criteria=false", "--format", "json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	stages := m["stages"].([]any)
	if len(stages) == 0 {
		t.Fatal("no stages")
	}
	for _, e := range stages {
		st := e.(map[string]any)
		if st["position"] == nil {
			continue
		}
		s, ok := st["strength"].(map[string]any)
		if !ok {
			t.Errorf("stage %v: strength %v", st["fraction"], st["strength"])
			continue
		}
		if len(s["moment_knm"].([]any)) != 6 {
			t.Errorf("stage %v: %d moments, want 6", st["fraction"], len(s["moment_knm"].([]any)))
		}
	}
}
