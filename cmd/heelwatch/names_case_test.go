package main

import (
	"strings"
	"testing"
)

// Names are matched ignoring case everywhere (conventions, "Names"): the
// command line takes "hold aft" for "Hold aft", and reports the name as the
// vessel file spells it.
func TestCommandLineNamesIgnoreCase(t *testing.T) {
	code, m := solveJSON(t, "--vessel", "barge", "--open", "hold AFT", "--perm", "HOLD aft=0.85")
	if code != 0 {
		t.Fatalf("solve --open \"hold AFT\": exit status %d", code)
	}
	if open := m["open"].([]any); len(open) != 1 || open[0] != "Hold aft" {
		t.Errorf("open = %v, want [Hold aft] as the file spells it", open)
	}
	oc := m["open_compartments"].([]any)
	if len(oc) != 1 || oc[0].(map[string]any)["permeability"].(float64) != 0.85 {
		t.Errorf("open_compartments = %v, want Hold aft at μ 0.85", oc)
	}
	// The same compartment named twice in two spellings is opened once.
	_, twice := solveJSON(t, "--vessel", "barge", "--open", "Hold aft,hold aft")
	if open := twice["open"].([]any); len(open) != 1 {
		t.Errorf("open = %v, want one compartment", open)
	}
	code, out, errOut := heelwatch(t, "flood", "--vessel", "barge", "--hole", "1 WING VOID s:0.05", "--pump", "1 wing void S:0", "--limit", "10m")
	if code != 0 || strings.Contains(errOut, "not a compartment") {
		t.Errorf("flood --hole in another case: exit %d\n%s%s", code, out, errOut)
	}
}
