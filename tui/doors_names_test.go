package tui

import (
	"strings"
	"testing"
)

// The doors panel says in full what each connection joins, at every size
// from the smallest up: an officer choosing which door to shut must read
// both spaces, not "Engine room ↔ Provision sto…".
func TestDoorsPanelShowsBothSpaces(t *testing.T) {
	for _, sz := range [][2]int{{80, 24}, {100, 30}, {120, 40}} {
		m := testModel(t, sz[0], sz[1])
		m = press(t, m, "d")
		view := m.View()
		for _, c := range m.v.Connections {
			want := m.v.Compartments[c.From].Name + " ↔ " + m.v.Compartments[c.To].Name
			if !strings.Contains(view, want) {
				t.Errorf("%dx%d: the panel does not show %q in full:\n%s", sz[0], sz[1], want, view)
			}
		}
		checkFits(t, "doors panel", m, sz[0], sz[1])
	}
}
