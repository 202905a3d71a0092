package tui

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// The undo key undoes the condition panel's changes one by one, newest
// first, with the damage changes between them: after each undo the ship
// lies exactly as engine.Solve puts her with the condition of that moment
// (worked out apart from the dashboard, from the vessel file's ship).
func TestUndoConditionChanges(t *testing.T) {
	m := testModel(t, 120, 40)
	v, _ := ship(t)
	solved := func(m model) engine.Position {
		t.Helper()
		want, err := engine.Solve(m.v, m.damage)
		if err != nil {
			t.Fatal(err)
		}
		return want
	}
	same := func(what string, m model, want engine.Position) {
		t.Helper()
		got := m.cur.Position
		if got == nil || math.Abs(got.HeelDeg-want.HeelDeg) > 1e-9 || math.Abs(got.DraftAftM-want.DraftAftM) > 1e-9 || math.Abs(got.DraftFwdM-want.DraftFwdM) > 1e-9 {
			t.Fatalf("%s: shown %+v, want %+v", what, got, want)
		}
	}
	intact := solved(m)
	m = press(t, m, "L")
	m = condRowOf(t, m, "Wing tank 2 P")
	m = press(t, m, "+", "+") // two changes: 5 % and 10 %
	filled := solved(m)
	m = press(t, m, "n")
	m = typed(t, m, "Deck cargo; 80; 40; 2.5; 9")
	if len(m.v.Weights) != len(v.Weights)+1 {
		t.Fatalf("the weight was not added: %s", m.cond.note)
	}
	m = press(t, m, "L") // the panel closed: the undo key is the dashboard's
	m = press(t, m, "u")
	if len(m.v.Weights) != len(v.Weights) || len(m.cond.cond.Weights) != len(v.Weights) {
		t.Errorf("undo left %d weights (panel %d), want %d", len(m.v.Weights), len(m.cond.cond.Weights), len(v.Weights))
	}
	if !strings.HasPrefix(m.cond.note, "undone: condition: Deck cargo added") {
		t.Errorf("note after undo: %q", m.cond.note)
	}
	same("weight undone", m, filled)
	m = press(t, m, "L", "u") // undo with the panel shown, too
	m = press(t, m, "u")
	same("both fills undone", m, intact)
	for _, tf := range m.cond.cond.Tanks {
		if b := v.Compartments[tf.Compartment].Liquid; b != nil && tf.Liquid.Fill != b.Fill {
			t.Errorf("%s at %.2f after undo, the file has %.2f", v.Compartments[tf.Compartment].Name, tf.Liquid.Fill, b.Fill)
		}
	}
	if m.base == nil || m.base.Position.HeelDeg != intact.HeelDeg {
		t.Error("the intact reference was not worked out again for the condition undone to")
	}
}
