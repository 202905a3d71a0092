package engine

import (
	"math"
	"testing"
)

// TestFloodEndGMOffCentre: as TestFloodEndGMOnLostBuoyancyBasis, with the
// void off the centreline, so she lists as it floods. Once the levels meet
// the void is in free communication with the sea: the water in it rises
// and falls with the sea as she heels, which the added weight's own free
// surface does not see (the free-communication loss ρ·μ·a·d² of Δ·GM,
// d the void's offset — Rawson & Tupper, Basic Ship Theory, on free
// communication, memory). The run's end is then the open-to-sea state
// itself, and its upright GM, at its end, in the stage at 100 % and in the
// final row, is the lost-buoyancy one.
func TestFloodEndGMOffCentre(t *testing.T) {
	b := flBox{L: 100, B: 20, D: 10, T: 5, KG: 6, comps: []flComp{{"wing void", Box{45, 55, 5, 10, 0, 10}, 0.9}}}
	v := b.vessel(t)
	rep, err := RunFlood(FloodCase{Vessel: v, Compartment: 0, Hole: Hole{AreaM2: 0.2, XM: 50, YM: 10, ZM: 0, Cd: 0.6}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if rep.End != FloodEqualised || rep.Final.Position == nil || rep.LostBuoyancy == nil {
		t.Fatalf("run ended %v; want equalised with both positions", rep.End)
	}
	f, l := rep.Final.Position, rep.LostBuoyancy
	if math.Abs(f.HeelDeg) < 1 || rep.FinalDiffM > 5e-3 {
		t.Fatalf("heel %.2f°, drafts differ by %.4f m: the case should list and meet the lost-buoyancy state", f.HeelDeg, rep.FinalDiffM)
	}
	if math.Abs(f.GMUprightM-l.GMUprightM) > 1e-3 {
		t.Errorf("upright GM at the run's end %.4f m, open to the sea %.4f m; want one basis", f.GMUprightM, l.GMUprightM)
	}
	if math.Abs(f.GMAtRestM-l.GMAtRestM) > 1e-3 {
		t.Errorf("GM where she lies at the run's end %.4f m, open to the sea %.4f m; want one basis", f.GMAtRestM, l.GMAtRestM)
	}
	if n := len(rep.Table); n == 0 || rep.Table[n-1].Position == nil || math.Abs(rep.Table[n-1].Position.GMUprightM-l.GMUprightM) > 1e-3 {
		t.Errorf("the table's end row does not carry the open-to-sea upright GM %.4f m", l.GMUprightM)
	}
	for _, st := range rep.Stages {
		if st.Fraction == 1 && (st.Position == nil || math.Abs(st.Position.GMUprightM-l.GMUprightM) > 1e-3) {
			t.Errorf("the 100 %% stage does not carry the open-to-sea upright GM %.4f m: %+v", l.GMUprightM, st.Position)
		}
	}
}
