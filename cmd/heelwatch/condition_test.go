package main

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

const departure = "../../testdata/conditions/freighter-ballast-departure.toml"

func TestConditionOnEveryCommand(t *testing.T) {
	_, plain := solveJSON(t, "--vessel", "freighter")
	code, loaded := solveJSON(t, "--vessel", "freighter", "--condition", departure)
	if code != exitOK {
		t.Fatalf("exit %d", code)
	}
	d0 := plain["equilibrium"].(map[string]any)["draft_fwd_m"].(float64)
	d1 := loaded["equilibrium"].(map[string]any)["draft_fwd_m"].(float64)
	if d0 == d1 {
		t.Error("the condition changed nothing")
	}
	// Given before the command, as the dashboard's flag, it reaches the command.
	_, early, _ := heelwatch(t, "--vessel", "freighter", "--condition", departure, "solve", "--format", "json")
	if !strings.Contains(early, strconv.FormatFloat(d1, 'g', -1, 64)) {
		t.Error("--condition before the command was not passed on")
	}
	for _, args := range [][]string{
		{"check", "freighter", "--condition", departure},
		{"flood", "--vessel", "freighter", "--condition", departure, "--hole", "Wing tank 2 S", "--limit", "10m", "--criteria=false"},
	} {
		code, out, errs := heelwatch(t, args...)
		if code != exitOK || !strings.Contains(out, "Ballast departure") && args[0] == "check" {
			t.Errorf("%v: exit %d\n%s\n%s", args, code, out, errs)
		}
	}
}

func TestConditionRefusedWithFileLineKey(t *testing.T) {
	bad := filepath.Join(t.TempDir(), "bad.toml")
	os.WriteFile(bad, []byte("format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nvolume_m3 = 9000.0\n"), 0o644)
	code, _, errs := heelwatch(t, "solve", "--vessel", "barge", "--condition", bad)
	if code != exitInput || !strings.Contains(errs, bad+":5: tank[1].volume_m3: 9000 m³ is more than \"DB ballast aft\" holds") {
		t.Errorf("exit %d, stderr:\n%s", code, errs)
	}
	code, _, errs = heelwatch(t, "solve", "--vessel", "barge", "--condition", filepath.Join(t.TempDir(), "none.toml"))
	if code != exitInput || !strings.Contains(errs, "condition file") {
		t.Errorf("missing file: exit %d, stderr:\n%s", code, errs)
	}
}

// --resume without a terminal prints the state taken up: its condition
// and its damage; with --condition it is refused as bad usage.
func TestResumeWithoutTerminal(t *testing.T) {
	src := "format = 1\nvessel = \"freighter\"\nname = \"Saved at noon\"\n" +
		"keep = [\"Lightship: hull steel\", \"Lightship: main engine and machinery\", \"Lightship: deckhouse and aft outfit\", \"Lightship: hatch covers and forward outfit\"]\n" +
		"[[tank]]\nname = \"DB 2 P\"\nfill = 1.0\n[[space]]\nname = \"Wing tank 2 S\"\nopen = true\n"
	p := filepath.Join(t.TempDir(), "state.toml")
	os.WriteFile(p, []byte(src), 0o644)
	code, out, errs := heelwatch(t, "--resume", p)
	if code != exitOK || !strings.Contains(out, "Saved at noon") || !strings.Contains(out, "Open to the sea: 1 compartment\n  Wing tank 2 S") {
		t.Errorf("exit %d\n%s\n%s", code, out, errs)
	}
	code, _, errs = heelwatch(t, "--resume", p, "--condition", departure)
	if code != exitUsage || !strings.Contains(errs, "--resume alone") {
		t.Errorf("both: exit %d, %s", code, errs)
	}
}
