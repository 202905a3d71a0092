package engine_test

// Righting options judged while they are carried out (issue 10, item 3):
// an option is advisable only if she floats, with nothing new under water,
// at every stage between before and after. The check here re-solves each
// advisable option on a grid of its own (thirteen steps, not the engine's
// ten), so it does not share the engine's sampling.

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// lollBarge opens the bundled barge (an invented demo vessel) with its
// weights raised by dz and the two mirrored wing voids named open.
func lollBarge(t *testing.T, dz float64) (*engine.Vessel, engine.Damage) {
	t.Helper()
	v0, _, err := vessels.Open("barge")
	if err != nil {
		t.Fatal(err)
	}
	w := *v0
	w.Weights = append([]engine.Weight(nil), v0.Weights...)
	for i := range w.Weights {
		w.Weights[i].VCGM += dz
	}
	v, err := engine.NewVessel(w)
	if err != nil {
		t.Fatal(err)
	}
	d := v.Intact()
	for i, c := range v.Compartments {
		if c.Name == "2 wing void P" || c.Name == "2 wing void S" {
			d[i].Open = true
		}
	}
	return v, d
}

// withFills returns v with the tanks' fills (fractions of capacity) set;
// sea water taken on mixes with what the tank holds by volume.
func withFills(t *testing.T, v *engine.Vessel, tanks []int, fills []float64) *engine.Vessel {
	t.Helper()
	w := *v
	w.Compartments = append([]*engine.Compartment(nil), v.Compartments...)
	for k, i := range tanks {
		c := *v.Compartments[i]
		l := *c.Liquid
		l.Fill = fills[k]
		c.Liquid = &l
		w.Compartments[i] = &c
	}
	nv, err := engine.NewVessel(w)
	if err != nil {
		t.Fatal(err)
	}
	return nv
}

// TestRemedyAdvisableOnlyIfSafeOnTheWay: the bundled barge lolling with
// both second wing voids open. Every option called advisable is solved
// again at thirteen equal steps of its fills: she must float at each (no
// capsize, no sinking) with the deck edge no deeper under than before.
// And at least one option offered must fail on the way, or the check
// would not be seen to bite: the loll cases tried are those of the issue
// (G raised until both open voids make her loll).
func TestRemedyAdvisableOnlyIfSafeOnTheWay(t *testing.T) {
	bit := false
	for _, dz := range []float64{1.0, 1.3, 1.6, 1.9} {
		v, d := lollBarge(t, dz)
		rs := engine.FindRemedies(v, d)
		if rs.Position == nil {
			continue
		}
		t.Logf("KG raised %.1f m: heel %.2f°, upright GM %.3f m, loll %v, %d options, %d solves", dz, rs.HeelDeg, rs.UprightGMM, rs.Loll, len(rs.Options), rs.Solves)
		if rs.Solves > engine.RemedyMaxSolves {
			t.Errorf("%d solves, bound %d", rs.Solves, engine.RemedyMaxSolves)
		}
		for _, o := range rs.Options {
			if o.StageFail != "" {
				bit = true
				if o.Advisable || !strings.Contains(o.Note, "not safe while it is carried out") {
					t.Errorf("%s: fails on the way (%s) but advisable %v, note %q", o.Action, o.StageFail, o.Advisable, o.Note)
				}
			}
			t.Logf("  %-50s advisable %-5v stages %2d %s", o.Action, o.Advisable, o.StagesChecked, o.StageFail)
			if !o.Advisable {
				continue
			}
			if o.StagesChecked < 10 {
				t.Errorf("%s: advisable after %d stages", o.Action, o.StagesChecked)
			}
			deckNow := rs.Position.DeckEdge.HeightM
			for k := 1; k <= 13; k++ {
				f := float64(k) / 13
				fills := make([]float64, len(o.Tanks))
				for j := range o.Tanks {
					fills[j] = o.FillBefore[j] + f*(o.FillAfter[j]-o.FillBefore[j])
				}
				w := withFills(t, v, o.Tanks, fills)
				p, err := engine.Solve(w, d)
				if err != nil {
					t.Errorf("%s: advisable, but at %d/13 of it (fills %v) %v", o.Action, k, fills, err)
					continue
				}
				if p.DeckEdge.HeightM < 0 && p.DeckEdge.HeightM < deckNow-1e-6 {
					t.Errorf("%s: advisable, but at %d/13 the deck edge is %.3f m under", o.Action, k, -p.DeckEdge.HeightM)
				}
			}
			if !(o.UprightGMM > 0) {
				t.Errorf("%s: advisable with upright GM %.3f m after", o.Action, o.UprightGMM)
			}
		}
	}
	if !bit {
		t.Error("no option failed on the way in any case tried: the staged check is not exercised")
	}
}

// TestRemedyTimeAtPumpRate: an option's note says how long it takes at the
// pump rate the file gives the tank (DB ballast fwd, 150 m³/h on the
// bundled barge): volume ÷ rate.
func TestRemedyTimeAtPumpRate(t *testing.T) {
	v, d := lollBarge(t, 1.6)
	rs := engine.FindRemedies(v, d)
	found := false
	for _, o := range rs.Options {
		if o.Kind != engine.RemedyFill || o.TankNames[0] != "DB ballast fwd" {
			continue
		}
		found = true
		want := o.MassT / v.WaterDensity / 150 * 3600
		if math.Abs(o.DurationS-want) > 1e-6 || o.PumpM3h != 150 {
			t.Errorf("%s: %.1f s at %v m³/h, want %.1f s at 150", o.Action, o.DurationS, o.PumpM3h, want)
		}
		if !strings.Contains(o.Note, fmt.Sprintf("Takes about %d h %02d min", int(math.Round(want/60))/60, int(math.Round(want/60))%60)) {
			t.Errorf("note %q does not say the time", o.Note)
		}
	}
	if !found {
		t.Skip("no option fills DB ballast fwd in this case")
	}
}
