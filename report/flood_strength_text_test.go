package report

import (
	"strings"
	"testing"

	"heelwatch/engine"
)

// The flood text gives the hull girder at each stage: largest moment and
// shear, the largest share of a permissible value and its flag; and says
// why when strength is not worked out.
func TestFloodTextStageStrength(t *testing.T) {
	pt := engine.ReadOutPoint{Name: "Frame 60", XM: 40}
	g := &engine.Strength{
		Points:    []engine.StrengthReading{{ReadOutPoint: pt, ShearKN: 900, MomentKNm: -52000, ShearLimitKN: 3000, MomentLimitKNm: 50000, ShearPct: 30, MomentPct: 104, Level: engine.Danger}},
		MaxShear:  engine.StrengthPeak{XM: 20, Value: 1500},
		MaxMoment: engine.StrengthPeak{XM: 41, Value: -53000},
	}
	var b strings.Builder
	writeStageStrength(&b, []engine.FloodStage{{Fraction: 0.5, Strength: g}, {Fraction: 1}}, "")
	s := b.String()
	for _, want := range []string{"Hull girder at the stages", "permissible values at sea", "50 %", "53000 at x 41.0 m", "sagging",
		"1500 at x 20.0 m", "104 % (moment, Frame 60)", "DANGER", "100 %", "no floating position"} {
		if !strings.Contains(s, want) {
			t.Errorf("lacks %q:\n%s", want, s)
		}
	}
	b.Reset()
	writeStageStrength(&b, []engine.FloodStage{{Fraction: 1}}, "no weight gives its extent (x)")
	if !strings.Contains(b.String(), "not worked out: no weight gives its extent (x)") {
		t.Errorf("without strength: %q", b.String())
	}
}
