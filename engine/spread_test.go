package engine

// Tests of the final state of progressive flooding. The check against
// the outside world is the lost-buoyancy method itself (Barrass & Derrett,
// bilging chapter; Tupper, flooding chapter — memory): once water stands
// at the sea's level in two compartments joined by an open door, the two
// are one space open to the sea, so the spread must give exactly the state
// of naming both open.

import (
	"math"
	"strings"
	"testing"
)

// spBarge is an invented 80 × 16 × 8 m box barge at 4 m draft with two
// full-breadth voids amidships, A (aft) and B, joined at the bulkhead
// x = 40 by a door whose sill is at z.
func spBarge(t testing.TB, sillZ float64, open bool, openings []Opening) *Vessel {
	t.Helper()
	b := flBox{L: 80, B: 16, D: 8, T: 4, KG: 4, openings: openings, comps: []flComp{
		{"Void A", Box{30, 40, -8, 8, 0, 8}, 0.95},
		{"Void B", Box{40, 50, -8, 8, 0, 8}, 0.95},
		{"Void C", Box{50, 60, 0, 8, 0, 8}, 0.95},
	}}
	v := b.vessel(t)
	v.Connections = []Connection{{Name: "WT door A/B", Kind: "door", From: 0, To: 1, AreaM2: 1.6, X: 40, Y: 0, Z: sillZ, HeightM: 2, Open: open}}
	return v
}

func sameState(t *testing.T, what string, a, b *Position) {
	t.Helper()
	if a == nil || b == nil {
		t.Fatalf("%s: no position (%v, %v)", what, a, b)
	}
	for _, q := range [][2]float64{{a.DraftAftM, b.DraftAftM}, {a.DraftFwdM, b.DraftFwdM}, {a.HeelDeg, b.HeelDeg}} {
		if math.Abs(q[0]-q[1]) > 1e-9 {
			t.Errorf("%s: %v against %v", what, q[0], q[1])
		}
	}
}

// An open door whose sill is under the sea's level: A floods, then B
// through the door; the state equals naming A and B open.
func TestSpreadOpenDoorEqualsBothOpen(t *testing.T) {
	v := spBarge(t, 0.5, true, nil)
	d := v.Intact()
	d[0].Open = true
	sp := Progressive(v, d)
	if len(sp.Links) != 1 || sp.Links[0].Compartment != 1 || sp.Links[0].From != 0 {
		t.Fatalf("links %+v", sp.Links)
	}
	both := v.Intact()
	both[0].Open, both[1].Open = true, true
	want, err := Solve(v, both)
	if err != nil {
		t.Fatal(err)
	}
	sameState(t, "door open", sp.Position, &want)
	if got := sp.Chain(v); !strings.Contains(got, "Void B floods from Void A through WT door A/B (door, open)") {
		t.Errorf("chain %q", got)
	}
	// Closed, or with its sill above the water: only A.
	for _, w := range []*Vessel{spBarge(t, 0.5, false, nil), spBarge(t, 7.5, true, nil)} {
		sp := Progressive(w, d)
		one, _ := Solve(w, d)
		if len(sp.Links) != 0 || len(sp.Flooded) != 1 {
			t.Errorf("spread %+v", sp.Links)
		}
		sameState(t, "door shut or high", sp.Position, &one)
	}
}

// An opening leading into C goes under only once A and B are flooded: a
// second round.
func TestSpreadThroughOpening(t *testing.T) {
	// With A and B flooded (20 m of 80 at μ 0.95) the barge sinks about
	// 19/61 of 4 m ≈ 1.25 m: a vent at z 4.8 m goes under, one at 5.6 m not.
	for _, c := range []struct {
		z     float64
		links int
	}{{4.8, 2}, {5.6, 1}} {
		v := spBarge(t, 0.5, true, []Opening{{Name: "Vent C", Kind: "vent", X: 55, Y: 4, Z: c.z, LeadsTo: "void c"}})
		d := v.Intact()
		d[0].Open = true
		sp := Progressive(v, d)
		if len(sp.Links) != c.links {
			t.Fatalf("vent at %v m: links %+v", c.z, sp.Links)
		}
		if c.links == 2 {
			l := sp.Links[1]
			if l.Compartment != 2 || l.From != -1 || l.Round != 2 || l.Opening != 0 {
				t.Errorf("link %+v", l)
			}
			all := v.Intact()
			all[0].Open, all[1].Open, all[2].Open = true, true, true
			want, err := Solve(v, all)
			if err != nil {
				t.Fatal(err)
			}
			sameState(t, "through the vent", sp.Position, &want)
		}
	}
}

// She floats with A open but is lost when the water goes on through the
// door into a long hold: the report names the door and what closing it
// keeps.
func TestSpreadLostThroughDoor(t *testing.T) {
	b := flBox{L: 80, B: 16, D: 8, T: 5, KG: 4, comps: []flComp{
		{"Void A", Box{30, 40, -8, 8, 0, 8}, 0.95},
		{"Hold", Box{40, 80, -8, 8, 0, 8}, 0.95},
	}}
	v := b.vessel(t)
	v.Connections = []Connection{{Name: "Door", Kind: "door", From: 0, To: 1, AreaM2: 1.6, X: 40, Y: 0, Z: 0.5, HeightM: 2, Open: true}}
	d := v.Intact()
	d[0].Open = true
	sp := Progressive(v, d)
	if sp.StartPosition == nil || sp.Position != nil || sp.NoEq == nil || sp.LostBy == nil || sp.LostBy.Via != "Door" {
		t.Fatalf("start %v, end %v, lost by %+v", sp.StartPosition, sp.NoEq, sp.LostBy)
	}
	if len(sp.Savings) != 1 || sp.Savings[0].Position == nil || !strings.Contains(sp.Savings[0].Message, "closing Door keeps her afloat") {
		t.Errorf("savings %+v", sp.Savings)
	}
}
