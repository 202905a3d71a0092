package tui

import (
	"strings"
	"testing"
)

// A value refused on the condition panel says why at once, under the
// field, which stays open with the value for correcting; a good value
// then is taken.
func TestConditionRefusalShownAtOnce(t *testing.T) {
	for _, size := range [][2]int{{80, 24}, {120, 40}} {
		m := testModel(t, size[0], size[1])
		m = press(t, m, "L")
		m = condRowOf(t, m, m.cond.cond.Weights[0].Name)
		for _, c := range []struct{ typed, why string }{
			{"50 42 -3", "write four numbers"},
			{"50 42 30 5", "tcg 30 m is beyond her side"},
		} {
			m = press(t, m, "e")
			m = typed(t, m, c.typed)
			if m.cond.typing == condNone {
				t.Fatalf("%v: %q: the field closed", size, c.typed)
			}
			flat := strings.Join(strings.Fields(m.View()), " ")
			if !strings.Contains(flat, c.why) {
				t.Errorf("%v: %q: the reason %q is not on screen:\n%s", size, c.typed, c.why, m.View())
			}
			if m.cond.field.Value() != c.typed {
				t.Errorf("%v: the value typed is gone: %q", size, m.cond.field.Value())
			}
			m = press(t, m, "esc")
		}
	}
}
