package tui

import (
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
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
		m = typeReading(t, m, knownReading(t, m)...)
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
		if log := strings.Join(m.log, "\n"); !strings.Contains(log, "reading at 0.0 min: Aft P ") || !strings.Contains(log, "diagnosis: Best explanation: Wing tank 2 S") {
			t.Errorf("%v: the log holds:\n%s", sz, log)
		}
		// The best explanation onto the dashboard.
		m = press(t, m, "a")
		if m.cur == nil || m.cur.Position == nil || m.damage[indexOf(t, m, "Wing tank 2 S")].WaterM3 < 100 {
			t.Errorf("%v: a did not put the water in Wing tank 2 S", sz)
		}
	}
}

// knownReading is the last reading of the known case of the freighter
// (testdata/diagnose), as the form's fields: minutes 0, the marks, heel.
func knownReading(t *testing.T, m model) []string {
	t.Helper()
	rs, err := vessels.LoadReadings(filepath.Join("..", "testdata", "diagnose", "freighter-wing-tank-2s.toml"), m.v)
	if err != nil {
		t.Fatal(err)
	}
	r := rs[len(rs)-1]
	out := []string{"0"}
	for i := range m.v.DraftMarks {
		v := ""
		for _, d := range r.Drafts {
			if d.Mark == i {
				v = strconv.FormatFloat(d.DraftM, 'f', 2, 64)
			}
		}
		out = append(out, v)
	}
	return append(out, strconv.FormatFloat(r.HeelDeg, 'f', 1, 64))
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
