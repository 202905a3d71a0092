package engine_test

import (
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestHandStepNumbers: the figures put into the working's formulas are
// written at a sensible precision. On the freighter her G lies on the
// centreline (a TCG of round-off size): it is written 0, not 0.000000 or
// (−0.000000), and no formula carries six decimals of nothing.
func TestHandStepNumbers(t *testing.T) {
	v, _, err := vessels.Open("freighter")
	if err != nil {
		t.Fatal(err)
	}
	for _, name := range []string{"Wing tank 2 S", "Engine room"} {
		d := v.Intact()
		for i, c := range v.Compartments {
			if c.Name == name {
				d[i].Open = true
			}
		}
		hw, err := engine.HandMethod(v, d)
		if err != nil {
			t.Fatal(err)
		}
		for _, s := range hw.Steps {
			if strings.Contains(s.Formula, "0.000000") {
				t.Errorf("%s: %s: %q", name, s.Label, s.Formula)
			}
			if s.Label == "list lever" && !strings.HasPrefix(s.Formula, "TCG − TCB = 0 − ") {
				t.Errorf("%s: list lever %q: want TCG written 0", name, s.Formula)
			}
		}
	}
}
