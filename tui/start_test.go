package tui

import (
	"math"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
)

// The dashboard opens with the case given by --open and --perm applied, as
// its first change after the intact start, and undo brings her back intact.
func TestDashboardStartsWithTheCaseGiven(t *testing.T) {
	v, info := ship(t)
	d := v.Intact()
	w2s := v.CompartmentIndex("wing tank 2 s")
	db2s := v.CompartmentIndex("DB 2 S")
	d[w2s].Open, d[db2s].Open = true, true
	d[db2s].Permeability = 0.9
	m := newModel(v, info, Options{Palette: "day", Start: d})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: 100, Height: 30})
	m = drive(t, m, nil, m.Init())
	if m.cur == nil || m.cur.Position == nil {
		t.Fatal("no figures for the case given at start")
	}
	if !(m.cur.Position.HeelDeg > 5) {
		t.Errorf("heel %.2f°: the wing tank open on starboard should list her to starboard", m.cur.Position.HeelDeg)
	}
	if !m.damage[w2s].Open || !m.damage[db2s].Open || m.mu(m.damage, db2s) != 0.9 {
		t.Errorf("damage state %+v: not the one given", m.damage)
	}
	if m.sel != w2s && m.sel != db2s {
		t.Errorf("selected %q, want one of the compartments opened", v.Compartments[m.sel].Name)
	}
	if len(m.log) < 2 || !strings.Contains(m.log[0], "all intact") || !strings.Contains(m.log[1], "from the command line") {
		t.Errorf("log out of order:\n%s", strings.Join(m.log, "\n"))
	}
	m = press(t, m, "u")
	if !allZero(m.damage) || math.Abs(m.cur.Position.HeelDeg) > 0.01 {
		t.Errorf("undo leaves %+v, heel %.2f°: want all intact", m.damage, m.cur.Position.HeelDeg)
	}
}
