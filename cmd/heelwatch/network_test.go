package main

import (
	"math"
	"strings"
	"testing"
)

func eqDrafts(t *testing.T, what string, a, b map[string]any) {
	t.Helper()
	for _, k := range []string{"draft_aft_m", "draft_mid_m", "draft_fwd_m"} {
		x, y := a[k].(float64), b[k].(float64)
		if math.Abs(x-y) > 0.005 {
			t.Errorf("%s: %s %.4f against %.4f m", what, k, x, y)
		}
	}
}

// The barge's hole into 2 wing void S with the cross-flooding duct to
// 2 wing void P open: the run ends with both equalised and equal to
// `solve --open` of both within 5 mm (equalisation reaches the
// lost-buoyancy state: Barrass & Derrett, bilging chapter — memory). With
// the duct closed (as in the file) only the first floods.
func TestFloodBargeDuct(t *testing.T) {
	code, m, errOut := floodJSON(t, "--vessel", "barge", "--hole", "2 wing void S", "--pump", "2 wing void S:0",
		"--criteria=false", "--connection", "Cross-flooding duct 2=open")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	net, ok := m["network"].(map[string]any)
	if !ok || net["end"] != "equalised" {
		t.Fatalf("network %v", m["network"])
	}
	comps := m["compartments"].([]any)
	if len(comps) != 2 {
		t.Fatalf("compartments %v", comps)
	}
	for _, c := range comps {
		c := c.(map[string]any)
		if c["equalised_s"] == nil || c["first_water_s"] == nil {
			t.Errorf("%v", c)
		}
	}
	code, s := solveJSON(t, "--vessel", "barge", "--open", "2 wing void S,2 wing void P")
	if code != 0 {
		t.Fatal(code)
	}
	eqDrafts(t, "run's end against solve --open both", net["final"].(map[string]any), s["equilibrium"].(map[string]any))

	code, m, _ = floodJSON(t, "--vessel", "barge", "--hole", "2 wing void S", "--pump", "2 wing void S:0", "--criteria=false")
	if code != 0 || m["network"] != nil {
		t.Fatalf("duct closed: exit %d, network %v", code, m["network"])
	}
	if comps := m["compartments"].([]any); len(comps) != 1 || comps[0].(map[string]any)["name"] != "2 wing void S" {
		t.Errorf("duct closed: compartments %v", comps)
	}
}

// The freighter's cross-flooding time is printed beside the 10 min limit,
// from the run and by MSC.362(92) with the damaged side flooded at once.
func TestFloodFreighterCrossFlooding(t *testing.T) {
	code, out, errOut := heelwatch(t, "flood", "--hole", "Wing tank 1 S:0.08:2", "--criteria=false")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	for _, want := range []string{"Cross-flooding in this run: Cross-flooding duct WT 1 equalises in", "10 min limit (SOLAS II-1 Reg. 7-2)", "MSC.362(92)"} {
		if !strings.Contains(out, want) {
			t.Errorf("missing %q in\n%s", want, out)
		}
	}
}

// Opening a door in the static solve gives the state of naming both
// compartments open.
func TestSolveOpenDoor(t *testing.T) {
	_, a := solveJSON(t, "--open", "Engine room", "--connection", "WT door ER/stores=open")
	_, b := solveJSON(t, "--open", "Engine room,Provision store")
	eqDrafts(t, "door open against both open", a["equilibrium"].(map[string]any), b["equilibrium"].(map[string]any))
	fl := a["flooded"].([]any)
	if len(fl) != 2 || a["spread"] == nil {
		t.Errorf("flooded %v, spread %v", fl, a["spread"])
	}
	code, _, errOut := heelwatch(t, "solve", "--connection", "No such door=open")
	if code != exitUsage || !strings.Contains(errOut, "WT door ER/stores") {
		t.Errorf("unknown connection: exit %d, %s", code, errOut)
	}
}
