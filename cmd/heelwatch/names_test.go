package main

import (
	"strings"
	"testing"
)

// Names ignore case everywhere (conventions, "Names"): the command line
// takes a compartment in any case and reports it as the vessel file spells it.
func TestOpenIgnoresCase(t *testing.T) {
	code, m := solveJSON(t, "--vessel", "barge", "--open", "hold AFT", "--perm", "HOLD aft=0.9")
	if code != 0 {
		t.Fatalf("exit status %d", code)
	}
	open := m["open"].([]any)
	if len(open) != 1 || open[0] != "Hold aft" {
		t.Errorf("open %v, want [Hold aft] as the file spells it", open)
	}
	for _, o := range m["open_compartments"].([]any) {
		om := o.(map[string]any)
		if om["name"] == "Hold aft" && om["permeability"].(float64) != 0.9 {
			t.Errorf("Hold aft μ %v, want 0.9 from --perm in another case", om["permeability"])
		}
	}
	// The same compartment in two cases is one compartment.
	_, m2 := solveJSON(t, "--vessel", "barge", "--open", "Hold aft,hold aft")
	if got := m2["open"].([]any); len(got) != 1 {
		t.Errorf("open %v: one compartment named twice in two cases is listed twice", got)
	}
}

func TestFloodNamesIgnoreCase(t *testing.T) {
	code, out, errOut := heelwatch(t, "flood", "--vessel", "barge", "--hole", "2 WING VOID S", "--pump", "2 wing void s:50", "--limit", "10m", "--format", "json")
	if code != 0 {
		t.Fatalf("exit status %d: %s", code, errOut)
	}
	if !strings.Contains(out, `"compartment": "2 wing void S"`) {
		t.Errorf("the flooding run does not name the compartment as the file does:\n%.400s", out)
	}
}

// Without a terminal the dashboard prints its starting state: with --open,
// the damage case given, in any case of the names.
func TestDashboardOpenWithoutTerminal(t *testing.T) {
	code, out, errOut := heelwatch(t, "--vessel", "barge", "--open", "2 WING VOID s")
	if code != 0 {
		t.Fatalf("exit status %d: %s", code, errOut)
	}
	if !strings.Contains(out, "2 wing void S") || !strings.Contains(out, "damage case given with --open") {
		t.Errorf("the printed state is not the case given:\n%s", out)
	}
	if code, _, errOut := heelwatch(t, "--open", "Nowhere"); code != 2 || !strings.Contains(errOut, "Nowhere") {
		t.Errorf("an unknown name: exit %d, %q; want 2 naming it", code, errOut)
	}
	if code, _, _ := heelwatch(t, "--open", "Hold 2", "solve"); code != 2 {
		t.Errorf("--open before a command: exit %d, want 2", code)
	}
}

// --perm takes a decimal comma as the dashboard does, in one item or among
// several; what cannot be read is refused, never replaced.
func TestPermDecimalComma(t *testing.T) {
	for _, perm := range []string{"Hold 2=0,85", "hold 2=0,85,DB 2 S=0,9", "Hold 2=85%,DB 2 S=90"} {
		code, m := solveJSON(t, "--open", "Hold 2,DB 2 S", "--perm", perm)
		if code != 0 {
			t.Fatalf("--perm %q: exit %d", perm, code)
		}
		got := map[string]float64{}
		for _, o := range m["open_compartments"].([]any) {
			om := o.(map[string]any)
			got[om["name"].(string)] = om["permeability"].(float64)
		}
		if got["Hold 2"] != 0.85 {
			t.Errorf("--perm %q: Hold 2 μ %v, want 0.85", perm, got["Hold 2"])
		}
		if strings.Contains(perm, "DB") && got["DB 2 S"] != 0.9 {
			t.Errorf("--perm %q: DB 2 S μ %v, want 0.9", perm, got["DB 2 S"])
		}
	}
	for _, bad := range []string{"Hold 2=0,8,5", "Hold 2=1,5", "Hold 2=0,0"} {
		if code, _, _ := heelwatch(t, "solve", "--open", "Hold 2", "--perm", bad); code != 2 {
			t.Errorf("--perm %q: exit %d, want 2 (refused)", bad, code)
		}
	}
}
