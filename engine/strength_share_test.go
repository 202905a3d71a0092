package engine_test

import (
	"strings"
	"testing"

	"heelwatch/engine"
)

// A share of a permissible value is shown in whole per cent, and the
// figure shown never contradicts the flag beside it: a value past the
// limit (danger past 100 %) never reads "100 %", one short of the caution
// threshold (90 %) never reads "90 %".
func TestShareShownKeepsItsLevel(t *testing.T) {
	for _, c := range []struct{ pct, want float64 }{
		{0, 0}, {55.66, 56}, {89.4, 89}, {89.6, 89}, {89.99, 89}, {90, 90}, {90.4, 90},
		{99.6, 100}, {100, 100}, {100.07, 101}, {100.5, 101}, {101.2, 101}, {140.5, 141},
	} {
		if got := engine.ShareShown(c.pct); got != c.want {
			t.Errorf("ShareShown(%g) = %g, want %g", c.pct, got, c.want)
		}
	}
}

// The girder flag names the share it shows: a value just past the limit
// is a danger and says more than 100 %.
func TestStrengthFlagShareAgreesWithLevel(t *testing.T) {
	s := &engine.Strength{Points: []engine.StrengthReading{{
		ReadOutPoint: engine.ReadOutPoint{Name: "bulkhead", XM: 40},
		ShearKN:      4503, ShearLimitKN: 4500, ShearPct: 100.07, Level: engine.Danger,
	}}}
	f := engine.StrengthFlags(s)
	if len(f) != 1 || f[0].Severity != engine.Danger {
		t.Fatalf("flags %+v, want one danger", f)
	}
	if want := "101 %"; !strings.Contains(f[0].Message, want) {
		t.Errorf("flag %q does not say %q", f[0].Message, want)
	}
}
