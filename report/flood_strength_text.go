package report

import (
	"math"
	"strings"

	"heelwatch/engine"
)

// writeStageStrength writes the hull girder at each stage of a flooding
// run, one short line a stage: the largest bending moment and shear force
// along the hull, the largest share of a permissible value at the
// read-out points, and the flag (ok, CAUTION past engine.CautionPct,
// DANGER past engine.DangerPct). why says why strength is not worked out
// when no stage has it (engine.StrengthMissing).
func writeStageStrength(b *strings.Builder, stages []engine.FloodStage, why string) {
	var any *engine.Strength
	for _, s := range stages {
		if s.Strength != nil {
			any = s.Strength
			break
		}
	}
	if any == nil {
		if why == "" {
			why = "no floating position at any stage"
		}
		b.WriteString("\n  Hull girder at the stages: not worked out: " + why + "\n")
		return
	}
	b.WriteString("\n  Hull girder at the stages (still water, hogging +; " + LimitsWords(any) + ")\n")
	t := table{right: []bool{true, true, false, true, false, false}}
	t.add("stage", "largest moment kN·m", "", "largest shear kN", "most of a permissible value", "")
	for _, s := range stages {
		st := num(100*s.Fraction, 0, "") + " %"
		g := s.Strength
		if g == nil {
			t.add(st, "—", "", "—", "no floating position", "")
			continue
		}
		share, flag := "—", ""
		if w, pct, ok := g.Worst(); ok {
			what := "moment"
			if w.ShearPct > w.MomentPct {
				what = "shear"
			}
			share = num(engine.ShareShown(pct), 0, "%") + " (" + what + ", " + w.Name + ")"
			flag = levelWord(w.Level)
			if w.Level != engine.Info {
				flag = StrengthLevelMark(w.Level)
			}
		}
		t.add(st, num(math.Abs(g.MaxMoment.Value), 0, "")+" at x "+num(g.MaxMoment.XM, 1, "m"), SenseWords(g.MaxMoment.Value),
			num(math.Abs(g.MaxShear.Value), 0, "")+" at x "+num(g.MaxShear.XM, 1, "m"), share, flag)
	}
	for _, l := range t.lines("  ") {
		b.WriteString(l + "\n")
	}
}
