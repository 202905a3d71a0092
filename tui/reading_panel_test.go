package tui

import (
	"strings"
	"testing"

	"heelwatch/engine"
)

// typeReading fills the reading form's fields in order (minutes, each
// mark, heel, levels) and takes it with enter.
func typeReading(t *testing.T, m model, values ...string) model {
	t.Helper()
	m = press(t, m, "n")
	if !m.rd.form.on {
		t.Fatal("n did not open the reading form")
	}
	for k, v := range values {
		for m.rd.form.focus != k {
			m = press(t, m, "tab")
		}
		m.rd.form.fields[k].SetValue("")
		for _, r := range v {
			m = press(t, m, string(r))
		}
	}
	return press(t, m, "enter")
}

// TestReadingPanel: the panel shows the engine's draft at each mark of the
// state shown; a reading taken by hand is logged and diagnosed (the
// freighter's known case of testdata/diagnose: Wing tank 2 S), the
// best explanation shown; a mark above the deck is refused with the
// reason and the form stays open. At 80×24 and 120×40.
func TestReadingPanel(t *testing.T) {
	for _, sz := range [][2]int{{80, 24}, {120, 40}} {
		m := bundledModel(t, "freighter", sz[0], sz[1])
		m = press(t, m, "r")
		view := checkFits(t, "marks", m, sz[0], sz[1])
		md := engine.MarkDrafts(m.v.Hull, m.cur.Position.Plane, m.v.DraftMarks)
		for _, d := range md {
			if line := lineWith(view, d.Name+" "); !strings.Contains(line, num(d.DraftM, 2)) {
				t.Errorf("%v: mark %s reads %s on the screen line %q", sz, d.Name, num(d.DraftM, 2), line)
			}
		}
		// A mark above the deck cannot be read.
		bad := typeReading(t, m, "0", "9")
		if !bad.rd.form.on || !strings.Contains(bad.rd.form.err, "above the deck") {
			t.Errorf("%v: a draft of 9 m at Aft P: form on %v, %q", sz, bad.rd.form.on, bad.rd.form.err)
		}
		m = typeReading(t, m, "0", "4.87", "5.86", "4.04", "6.31", "4.81", "5.25", "8.8")
		if m.rd.form.on || len(m.rd.readings) != 1 {
			t.Fatalf("%v: reading not taken: %q", sz, m.rd.form.err)
		}
		if m.rd.running || m.rd.result == nil {
			t.Fatalf("%v: diagnosis not done: %q", sz, m.rd.failure)
		}
		view = checkFits(t, "diagnosis", m, sz[0], sz[1])
		if !strings.Contains(view, "Best explanation: Wing tank 2 S") {
			t.Errorf("%v: diagnosis not shown:\n%s", sz, view)
		}
		if log := strings.Join(m.log, "\n"); !strings.Contains(log, "reading at 0.0 min: Aft P 4.87") || !strings.Contains(log, "diagnosis: Best explanation: Wing tank 2 S") {
			t.Errorf("%v: the log holds:\n%s", sz, log)
		}
		// The best explanation onto the dashboard.
		m = press(t, m, "a")
		if m.cur == nil || m.cur.Position == nil || m.damage[indexOf(t, m, "Wing tank 2 S")].WaterM3 < 100 {
			t.Errorf("%v: a did not put the water in Wing tank 2 S", sz)
		}
	}
}

func indexOf(t *testing.T, m model, name string) int {
	t.Helper()
	for i, c := range m.v.Compartments {
		if c.Name == name {
			return i
		}
	}
	t.Fatalf("no compartment %q", name)
	return -1
}
