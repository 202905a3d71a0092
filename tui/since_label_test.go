package tui

import (
	"strings"
	"testing"
)

// The change column's heading says what it is against: "since intact"
// while the loading is the one she started with, "since intact, this
// loading" once it was changed on the panel (the reference is then her
// intact in the new loading), on the smallest screen too.
func TestSinceIntactSaysItsReference(t *testing.T) {
	for _, size := range [][2]int{{80, 24}, {120, 40}} {
		m := testModel(t, size[0], size[1])
		if v := m.View(); !strings.Contains(v, "since intact") || strings.Contains(v, "this loading") {
			t.Errorf("%v: before any change:\n%s", size, v)
		}
		m = press(t, m, "L")
		m = condRowOf(t, m, "Wing tank 2 P")
		m = press(t, m, "+", "L")
		if v := m.View(); !strings.Contains(v, "since intact, this loading") {
			t.Errorf("%v: after a change of the loading:\n%s", size, v)
		}
		m = press(t, m, "u")
		if v := m.View(); strings.Contains(v, "this loading") {
			t.Errorf("%v: undone, the heading still speaks of a new loading", size)
		}
	}
}
