package report

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// TestPumpsCannotWords: pumps that do not take the present inflow are said
// plainly not to hold it, with the head where they would balance it and
// when the level gets there; never "can hold it".
func TestPumpsCannotWords(t *testing.T) {
	tr := engine.Trend{PumpsM3h: 120, PumpsHold: "no", InflowNowM3h: 1116, BalanceHeadM: 0.0177, BalanceS: 251}
	s := pumpsCannotWords(tr)
	for _, want := range []string{"cannot hold it", "1116 m³/h", "1.8 cm below the sea", "Torricelli", "4 min"} {
		if !strings.Contains(s, want) {
			t.Errorf("%q lacks %q", s, want)
		}
	}
	tr.BalanceS = math.NaN()
	if s := pumpsCannotWords(tr); !strings.Contains(s, "does not reach") {
		t.Errorf("no time: %q", s)
	}
}
