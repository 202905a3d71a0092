package tui

import (
	"fmt"
	"strings"
	"testing"
)

// A tank open to the sea is no part of the ship's weight (lost buoyancy:
// its contents are the sea's, engine.Vessel.Loading leaves them out). The
// panel marks it so, refuses a change of its fill with the reason, and its
// totals are those of the floating position: Δ is the ship weight shown
// (displacement less held floodwater) and the tanks' FSM is Loading's less
// the weights' own.
func TestConditionPanelOpenTank(t *testing.T) {
	m := testModel(t, 120, 40)
	m = press(t, m, "L")
	m = condRowOf(t, m, "Wing tank 2 S")
	m = press(t, m, "e")
	m = typed(t, m, "50") // some ballast in it, so that it counts
	m = press(t, m, "L")
	m = openSpaces(t, m, "Wing tank 2 S")
	i := indexOf(t, m, "Wing tank 2 S")
	m = press(t, m, "L")
	m = condRowOf(t, m, "Wing tank 2 S")
	p := m.cur.Position
	load := m.v.Loading(m.damage)
	weightsFSM := 0.0
	for _, w := range m.v.Weights {
		weightsFSM += w.FSMTm
	}
	view := m.View()
	want := fmt.Sprintf("Δ %.1f t · tanks' FSM %.0f t·m", p.DisplacementT-p.HeldWaterT, load.FSMTm-weightsFSM)
	if !strings.Contains(view, want) {
		t.Errorf("the panel's totals disagree with the floating position: want %q in\n%s", want, view)
	}
	row := ""
	for _, l := range strings.Split(view, "\n") {
		if strings.Contains(l, "▸ Wing tank 2 S") {
			row = l
		}
	}
	if !strings.Contains(row, "open to the sea") || strings.Contains(row, "50.0 %") {
		t.Errorf("the open tank's row: %q", row)
	}
	fill := m.v.Compartments[i].Liquid.Fill
	heel := p.HeelDeg
	for _, k := range []string{"+", "-", "e"} {
		m = press(t, m, k)
		if m.cond.typing != condNone || m.v.Compartments[i].Liquid.Fill != fill || m.cur.Position.HeelDeg != heel {
			t.Errorf("%s changed the open tank (typing %v, fill %g)", k, m.cond.typing, m.v.Compartments[i].Liquid.Fill)
		}
		if !strings.Contains(m.cond.note, "Wing tank 2 S is open to the sea: its contents are the sea's") {
			t.Errorf("%s: no reason given: %q", k, m.cond.note)
		}
		m = press(t, m, "esc")
	}
}
