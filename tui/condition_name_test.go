package tui

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// A condition changed on the dashboard says so, with the time of the
// change, in the header, the panel's title and the file saved; undone, it
// has its name back.
func TestConditionChangedIsMarked(t *testing.T) {
	m := testModel(t, 160, 40) // room in the header for the whole name
	name := m.condition
	if name == "" {
		t.Fatal("the bundled ship's condition has no name: the test shows nothing")
	}
	m = press(t, m, "L")
	m = condRowOf(t, m, "Wing tank 2 P")
	m = press(t, m, "+")
	m = press(t, m, "n")
	m = typed(t, m, "Deck cargo; 80; 40; 2.5; 9")
	want := name + " (changed 02:30)" // the test clock's time
	view := strings.Split(m.View(), "\n")
	if !strings.Contains(view[0], want) {
		t.Errorf("header %q: want %q", view[0], want)
	}
	// The mark first in the panel's title, where a name cut to the width
	// cannot take it with it.
	if !strings.Contains(m.View(), "LOADING CONDITION (changed 02:30): "+name) {
		t.Errorf("the panel's title does not say it was changed:\n%s", m.View())
	}
	path := filepath.Join(t.TempDir(), "c.toml")
	m = press(t, m, "W")
	m = typed(t, m, path)
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (%s)", err, m.cond.note)
	}
	if !strings.Contains(string(data), want) {
		t.Errorf("the saved file keeps the old name:\n%s", data)
	}
	m = press(t, m, "L", "u", "u")
	if m.condition != name || m.cond.cond.Name != name {
		t.Errorf("undone to the start, the name is %q / %q, want %q", m.condition, m.cond.cond.Name, name)
	}
	// On a narrower screen, where the name has no room, the mark has.
	m = testModel(t, 100, 30)
	m = press(t, m, "L")
	m = condRowOf(t, m, "Wing tank 2 P")
	m = press(t, m, "+")
	if head := strings.Split(m.View(), "\n")[0]; !strings.Contains(head, "(changed 02:30)") {
		t.Errorf("100 columns: header %q", head)
	}
}

func TestUnchangedName(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"Departure (changed 14:05)", "Departure"}, {"condition (changed 09:00)", ""},
		{"Departure", "Departure"}, {"", ""}, {"Arrival (changed at noon)", "Arrival (changed at noon)"},
	} {
		if got := unchangedName(c.in); got != c.want {
			t.Errorf("unchangedName(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}
