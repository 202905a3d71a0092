package main

import (
	"strings"
	"testing"
)

// TestHandCaveatsApartFromShip: with the freighter's Wing tank 2 S open
// the only flags are the hand method's caveats (past-small-angles,
// not-wall-sided). JSON keeps severity as the highest flag's (caution) and
// says ship_severity "none", as the dashboard's header does; the text
// lists the caveats under their own heading after the ship's flags.
func TestHandCaveatsApartFromShip(t *testing.T) {
	args := []string{"--vessel", "freighter", "--open", "Wing tank 2 S"}
	_, m := solveJSON(t, args...)
	if m["severity"] != "caution" || m["ship_severity"] != "none" {
		t.Errorf("severity %v, ship_severity %v: want caution and none", m["severity"], m["ship_severity"])
	}
	if h, _ := m["hand"].(map[string]any); h == nil || h["usable"] != true || h["not_usable_because"] != "" {
		t.Errorf("hand %v: want usable, no reason", h)
	}
	_, out, _ := heelwatch(t, append([]string{"solve"}, args...)...)
	flags := strings.Index(out, "Flags: none")
	method := strings.Index(out, "About the hand method (its caveats, not flags of the ship)")
	if flags < 0 || method < flags {
		t.Fatalf("want \"Flags: none\" then the hand method's caveats:\n%s", out)
	}
	for _, code := range []string{"past-small-angles", "not-wall-sided"} {
		if i := strings.Index(out, code); i < method {
			t.Errorf("%s is not under the hand method's heading", code)
		}
	}
}
