package tui

import (
	"math"
	"testing"
)

// TestTankFillTypedAfresh: e on a tank opens an empty field (the fill now
// as its placeholder), so that typing 55 sets 55 %, not 7055 (officer
// trial: the field opened holding "70").
func TestTankFillTypedAfresh(t *testing.T) {
	m := testModel(t, 120, 40)
	m = press(t, m, "L")
	m = condRowOf(t, m, "Wing tank 2 P")
	m = press(t, m, "e")
	if m.cond.field.Value() != "" {
		t.Fatalf("the field opened holding %q", m.cond.field.Value())
	}
	m = press(t, m, "5", "5", "enter")
	i := m.cond.rows()[m.cond.sel].tank
	if l := m.v.Compartments[i].Liquid; l == nil || math.Abs(l.Fill-0.55) > 1e-12 {
		t.Errorf("fill after typing 55: %+v (note %q)", l, m.cond.note)
	}
}

// TestTankFillDecimalComma: "55,5" is 55.5 %, as a permeability or a
// booklet figure may be typed with a decimal comma.
func TestTankFillDecimalComma(t *testing.T) {
	m := testModel(t, 120, 40)
	m = press(t, m, "L")
	m = condRowOf(t, m, "Wing tank 2 P")
	m = press(t, m, "e")
	m = typed(t, m, "55,5")
	i := m.cond.rows()[m.cond.sel].tank
	if l := m.v.Compartments[i].Liquid; l == nil || math.Abs(l.Fill-0.555) > 1e-12 {
		t.Errorf("fill after typing 55,5: %+v (note %q)", l, m.cond.note)
	}
}

// TestConditionPanelKeysAnswer: home and end move the panel's own list
// (not the compartments behind it), and ←→ on a tank says what moves
// instead of doing nothing silently (officer trial).
func TestConditionPanelKeysAnswer(t *testing.T) {
	m := testModel(t, 120, 40)
	m = press(t, m, "L")
	sel := m.sel
	m = press(t, m, "end")
	if last := len(m.cond.rows()) - 1; m.cond.sel != last || m.sel != sel {
		t.Errorf("end: panel row %d (want %d), list %d (was %d)", m.cond.sel, last, m.sel, sel)
	}
	m = press(t, m, "home")
	if m.cond.sel != 0 {
		t.Errorf("home: panel row %d", m.cond.sel)
	}
	if m.cond.rows()[0].tank < 0 {
		t.Skip("the first row is not a tank")
	}
	m = press(t, m, "right")
	if m.cond.note == "" {
		t.Error("→ on a tank said nothing")
	}
}
