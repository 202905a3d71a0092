package engine

// One basis for the GM of a flooded space (issue 10, item 4): the flooding
// run's end state (floodwater held as an added weight, level with the sea)
// and the same space open to the sea (lost buoyancy) are one position and
// must show one GM.

import (
	"math"
	"testing"
)

// TestFloodEndGMOnLostBuoyancyBasis: a void on the centreline of a box
// barge floods through a hole in its bottom until the level inside is the
// sea's. Lost buoyancy and added weight give the same waterline, and
// Δ·GM, the moment of statical stability, is the same on both bases
// (Barrass & Derrett, Ship Stability for Masters and Mates, bilging;
// references.md "lost buoyancy vs added weight", memory): exactly so for a
// compartment symmetric about the centreline, whose free surface (μ·i)
// is all that separates the two second moments. The GM shown for the run's
// end is on the lost-buoyancy basis and so equals the open-to-sea one.
func TestFloodEndGMOnLostBuoyancyBasis(t *testing.T) {
	b := flBox{L: 100, B: 20, D: 10, T: 5, KG: 6, comps: []flComp{{"centre void", Box{45, 55, -4, 4, 0, 10}, 0.9}}}
	v := b.vessel(t)
	rep, err := RunFlood(FloodCase{Vessel: v, Compartment: 0, Hole: Hole{AreaM2: 0.2, XM: 50, ZM: 0, Cd: 0.6}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if rep.End != FloodEqualised || rep.Final.Position == nil || rep.LostBuoyancy == nil {
		t.Fatalf("run ended %v; want equalised with both positions", rep.End)
	}
	f, l := rep.Final.Position, rep.LostBuoyancy
	if rep.FinalDiffM > 1e-3 {
		t.Fatalf("drafts differ by %.4f m", rep.FinalDiffM)
	}
	// Δ·GM on both bases, as each method works it (upright, raw).
	aw := f.DisplacementT * f.GMM
	lb := l.DisplacementT * l.GMM
	if math.Abs(aw-lb) > 1e-3*math.Abs(lb) {
		t.Errorf("Δ·GM: added weight %.2f t·m (Δ %.1f t, GM %.4f m), lost buoyancy %.2f t·m (Δ %.1f t, GM %.4f m)", aw, f.DisplacementT, f.GMM, lb, l.DisplacementT, l.GMM)
	}
	if math.Abs(f.GMUprightM-l.GMUprightM) > 1e-3 {
		t.Errorf("GM shown: run's end %.4f m, open to the sea %.4f m; want one basis", f.GMUprightM, l.GMUprightM)
	}
	if math.Abs(f.GMM-l.GMM) < 0.01 {
		t.Errorf("the two raw GMs (%.4f, %.4f m) should differ: the test would not see a wrong basis", f.GMM, l.GMM)
	}
	t.Logf("added weight Δ %.1f t GM %.4f m; lost buoyancy Δ %.1f t GM %.4f m; shown %.4f / %.4f m", f.DisplacementT, f.GMM, l.DisplacementT, l.GMM, f.GMUprightM, l.GMUprightM)
}
