package report

import (
	"strings"
	"testing"

	"heelwatch/engine"
)

// A vessel file without permissible values (the barge: read-out at every
// tenth of the length) must not be said to be checked "against permissible
// values at sea".
func TestStrengthWithoutLimitsSaysSo(t *testing.T) {
	none := &engine.Strength{Points: []engine.StrengthReading{{ReadOutPoint: engine.ReadOutPoint{Name: "0.5 L", XM: 40}, MomentKNm: -7e4}}}
	if got := strengthTitle(none); strings.Contains(got, "at sea") || !strings.Contains(got, "no permissible values") {
		t.Errorf("title %q for a file with no permissible values", got)
	}
	some := &engine.Strength{Points: []engine.StrengthReading{{ReadOutPoint: engine.ReadOutPoint{Name: "mid", XM: 40}, MomentKNm: -7e4, MomentLimitKNm: 9e4}}}
	if got := strengthTitle(some); !strings.Contains(got, "permissible values at sea") {
		t.Errorf("title %q for a file with sea values", got)
	}
}
