package tui

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// The doors panel: with the engine room open, opening its door to the
// provision store floods the store too (its sill goes under), the state
// shown is that of both open (the lost-buoyancy method — Barrass &
// Derrett, bilging chapter, memory: two spaces joined below the water are
// one), the list marks the store SPREAD, and shutting the door again
// brings back the engine room alone.
func TestDoorsPanel(t *testing.T) {
	for _, sz := range [][2]int{{80, 24}, {120, 40}} {
		m := testModel(t, sz[0], sz[1])
		m = openSpaces(t, m, "Engine room")
		alone := *m.cur.Position
		m = press(t, m, "d")
		if !m.doors.show {
			t.Fatal("d did not show the panel")
		}
		// The first connection of the freighter is the door ER/stores.
		if c := m.v.Connections[0]; c.Name != "WT door ER/stores" || c.Open {
			t.Fatalf("first connection %+v", c)
		}
		m = press(t, m, "space")
		if !m.v.Connections[0].Open {
			t.Fatal("space did not open the door")
		}
		view := m.View()
		if !strings.Contains(view, "Provision store floods from Engine room") {
			t.Errorf("%v: the spread is not on screen:\n%s", sz, view)
		}
		d := m.v.Intact()
		d[m.v.CompartmentIndex("Engine room")].Open = true
		d[m.v.CompartmentIndex("Provision store")].Open = true
		want, err := engine.Solve(m.v, d)
		if err != nil {
			t.Fatal(err)
		}
		if got := m.cur.Position; got == nil || math.Abs(got.DraftAftM-want.DraftAftM) > 1e-9 || math.Abs(got.HeelDeg-want.HeelDeg) > 1e-9 {
			t.Errorf("%v: shown %+v, both open %v / %v", sz, got, want.DraftAftM, want.HeelDeg)
		}
		if w, _ := spreadState(m.cur, m.damage, m.v.CompartmentIndex("Provision store")); w != "SPREAD" {
			t.Errorf("%v: the store is not marked SPREAD", sz)
		}
		m = press(t, m, "space")
		if m.v.Connections[0].Open || math.Abs(m.cur.Position.DraftAftM-alone.DraftAftM) > 1e-9 {
			t.Errorf("%v: shutting the door did not bring back the engine room alone", sz)
		}
		if log := strings.Join(m.log, "\n"); !strings.Contains(log, "WT door ER/stores opened") || !strings.Contains(log, "WT door ER/stores shut") {
			t.Errorf("%v: the log does not hold the door's changes:\n%s", sz, log)
		}
	}
}
