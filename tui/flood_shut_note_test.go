package tui

import (
	"strings"
	"testing"
)

// With the barge's cross-flooding duct open, a run of 2 wing void S
// shows the holed space alone (ending 11° to starboard) above the run
// through the ship (both voids, near upright): the panel must say that
// the part above keeps every connection shut, or the officer reads a list
// that opening the duct has taken away.
func TestFloodPanelSaysTheSingleRunKeepsConnectionsShut(t *testing.T) {
	m := bundledModel(t, "barge", 120, 40)
	m = press(t, m, "d", " ", "d")
	if !m.v.Connections[0].Open {
		t.Fatal("the duct did not open")
	}
	m = selectSpace(t, m, "2 wing void S")
	m = press(t, m, "f", "enter")
	if m.flood.rep == nil || m.flood.net == nil {
		t.Fatalf("no run through the ship: %q", m.flood.err)
	}
	if view := m.View(); !strings.Contains(view, "connections shut") {
		t.Errorf("the panel does not say its first part keeps the connections shut:\n%s", view)
	}
}
