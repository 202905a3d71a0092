package main

import (
	"math"
	"testing"
)

// TestFloodJSONEndIsTheRunsEnd: with the network run made (the barge's
// duct open), the top-level end_s and final describe its end: no
// compartment equalises after end_s, and final is the network's end
// position; the compartment's own run keeps its figures under `single`.
// The end is also solve --open of both within 5 mm (equalisation reaches
// the lost-buoyancy state: Barrass & Derrett, bilging chapter — memory).
func TestFloodJSONEndIsTheRunsEnd(t *testing.T) {
	code, m, errOut := floodJSON(t, "--vessel", "barge", "--hole", "2 wing void S", "--pump", "2 wing void S:0",
		"--criteria=false", "--connection", "Cross-flooding duct 2=open")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	net := m["network"].(map[string]any)
	end := floodNum(t, m, "end_s")
	if got := floodNum(t, net, "end_s"); got != end || m["end"] != net["end"] {
		t.Errorf("end %v at %v s; network %v at %v s", m["end"], end, net["end"], got)
	}
	for _, c := range m["compartments"].([]any) {
		c := c.(map[string]any)
		if e, ok := c["equalised_s"].(float64); ok && e > end+1e-6 {
			t.Errorf("%v equalises at %.0f s, after end_s %.0f s", c["name"], e, end)
		}
	}
	fin := m["final"].(map[string]any)
	if floodNum(t, fin, "time_s") != end {
		t.Errorf("final.time_s %v, end_s %v", fin["time_s"], end)
	}
	code, s := solveJSON(t, "--vessel", "barge", "--open", "2 wing void S,2 wing void P")
	if code != 0 {
		t.Fatal(code)
	}
	eqDrafts(t, "final against solve --open both", fin, s["equilibrium"].(map[string]any))
	single, ok := m["single"].(map[string]any)
	if !ok {
		t.Fatalf("single %v", m["single"])
	}
	if se := floodNum(t, single, "end_s"); !(se < end) || math.IsNaN(se) {
		t.Errorf("single.end_s %v, end_s %v", se, end)
	}
	if _, ok := single["final"].(map[string]any); !ok {
		t.Errorf("single.final %v", single["final"])
	}
}
