package engine

import (
	"math"
	"testing"
)

// The network run's end, equalised, is the static state of both voids open
// to the sea (TestNetworkHoleAndDuct): it must show that state's GMs, not
// none (the upright GM was left unset, null in the JSON) nor the added
// weight's (the free-communication loss unseen: see flood_end_basis.go).
// Both voids lie on the starboard side, so she lists and the two bases
// differ. The reference is the static lost-buoyancy solve, itself held to
// the box's closed forms (box_test.go, wallsided_test.go); added weight and
// lost buoyancy agree in Δ·GM (references.md, Barrass & Derrett, memory),
// so a GM that differs here is a basis mixed up, not the physics.
func TestNetworkEndGMIsTheStaticOne(t *testing.T) {
	v, c := spDuctBarge(t, true)
	rep, err := RunNetwork(c, nil)
	if err != nil {
		t.Fatal(err)
	}
	if rep.End != FloodEqualised || rep.Final.Position == nil {
		t.Fatalf("end %v: %s", rep.End, rep.EndReason)
	}
	both := v.Intact()
	both[0].Open, both[1].Open = true, true
	want, err := Solve(v, both)
	if err != nil {
		t.Fatal(err)
	}
	f := rep.Final.Position
	if math.Abs(want.HeelDeg) < 1 {
		t.Fatalf("heel %.2f°: the case should list", want.HeelDeg)
	}
	if math.IsNaN(f.GMUprightM) || math.Abs(f.GMUprightM-want.GMUprightM) > 1e-3 {
		t.Errorf("upright GM at the end %.4f m, both open %.4f m", f.GMUprightM, want.GMUprightM)
	}
	if math.Abs(f.GMAtRestM-want.GMAtRestM) > 1e-3 {
		t.Errorf("GM where she lies at the end %.4f m, both open %.4f m", f.GMAtRestM, want.GMAtRestM)
	}
}
