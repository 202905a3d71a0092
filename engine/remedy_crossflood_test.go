package engine_test

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// The barge listing with 2 wing void S open and its cross-flooding duct to
// 2 wing void P shut: the righting options name the duct, the fitting
// built for exactly this, and what opening it gives (both voids flooded:
// upright, as solve --open of both says, by symmetry).
func TestRemedyNamesShutCrossFlooding(t *testing.T) {
	v, _, err := vessels.Open("barge")
	if err != nil {
		t.Fatal(err)
	}
	s, p := v.CompartmentIndex("2 wing void S"), v.CompartmentIndex("2 wing void P")
	d := v.Intact()
	d[s].Open = true
	rs := engine.FindRemedies(v, d)
	if !rs.Needed || rs.Loll {
		t.Fatalf("needed %v loll %v: the case should be a list", rs.Needed, rs.Loll)
	}
	both := v.Intact()
	both[s].Open, both[p].Open = true, true
	want, err := engine.Solve(v, both)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(want.HeelDeg) > 0.05 {
		t.Fatalf("both voids open heel %.2f°: want upright by symmetry", want.HeelDeg)
	}
	if !strings.Contains(rs.Summary, "Cross-flooding duct 2") || !strings.Contains(rs.Summary, "upright") {
		t.Errorf("summary does not name the shut cross-flooding duct and what it gives:\n%s", rs.Summary)
	}
}
