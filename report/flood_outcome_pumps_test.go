package report

import (
	"strings"
	"testing"

	"heelwatch/engine"
)

// Pumps that hold the level only millimetres below the sea do not save the
// space: the headline must not read "pumps hold" when the space takes
// nearly all the water it would take open to the sea (the freighter's
// Hold 1 at 100 m³/h: held 0.004 m below the sea, 1199 of 1200 m³).
func TestFloodOutcomePumpsBarelyHold(t *testing.T) {
	r := engine.FloodReport{End: engine.FloodPumpsHold, SteadyHeadM: 0.004, EndS: 3017,
		FinalWaterM3: 1199, LostBuoyancyWaterM3: 1200}
	head, rest := FloodOutcome(r)
	if strings.Contains(head, "pumps hold") {
		t.Errorf("headline %q%s: says the pumps hold for a space that fills to 0.004 m below the sea", head, rest)
	}
	if !strings.Contains(rest, "0.004 m below the sea") || !strings.Contains(rest, "1199 m³") {
		t.Errorf("outcome %q%s: lacks the level held and the water in", head, rest)
	}
	// Pumps that keep most of the space dry do hold it.
	r.SteadyHeadM, r.FinalWaterM3 = 2.5, 300
	if head, rest := FloodOutcome(r); head != "pumps hold" {
		t.Errorf("pumps that keep 3/4 of the space dry: %q%s, want pumps hold", head, rest)
	}
}
