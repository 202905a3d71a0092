package tui

import (
	"strings"
	"testing"
)

// handBody scrolls the hand panel from its top to its end with ] and
// gives back every line under its heading, in order, as the screen shows
// them (the text right of the last column rule).
func handBody(t *testing.T, m model) []string {
	t.Helper()
	var body []string
	for n := 0; n < 200; n++ {
		hp := m.handShown()
		lines := strings.Split(m.View(), "\n")
		head := -1
		for k, l := range lines {
			if i := strings.LastIndex(l, "│"); i >= 0 {
				lines[k] = l[i+len("│"):]
			}
			if head < 0 && strings.HasPrefix(lines[k], "HAND METHOD") {
				head = k
			}
		}
		if head < 0 {
			t.Fatalf("no hand panel on screen:\n%s", m.View())
		}
		for r := 1; r < hp.h && head+r < len(lines); r++ {
			at := m.hand.scroll + r - 1
			for len(body) <= at {
				body = append(body, "")
			}
			body[at] = strings.TrimRight(lines[head+r], " ")
		}
		before := m.hand.scroll
		m = press(t, m, "]")
		if m.hand.scroll == before {
			return body
		}
	}
	t.Fatal("] never reached the end of the hand panel")
	return nil
}

// flat is s with every run of blanks made one space.
func flat(s string) string { return strings.Join(strings.Fields(s), " ") }

// Every step of the hand working is reached on the smallest screen and on
// a large one, with its result whole beside its label and its formula
// whole; every caveat is whole; the caution about the heel shows the hand
// method's figure as the hand's, never after "=" as if it were the direct
// answer its text points to.
func TestHandWorkingReachedWhole(t *testing.T) {
	for _, size := range [][2]int{{80, 24}, {120, 40}, {100, 30}} {
		m := startModel(t, size[0], size[1], "Wing tank 2 S", "DB 2 S")
		m = press(t, m, "h")
		hw := m.cur.Hand
		if hw == nil {
			t.Fatalf("no hand working: %s", m.cur.HandWhy)
		}
		body := flat(strings.Join(handBody(t, m), "\n"))
		caution := false
		for _, s := range hw.Steps {
			value := withUnit(num(s.Value, precFor(s.Value)), s.Unit)
			if strings.HasPrefix(s.Label, "caution") {
				caution = true
				value = "hand " + value
			}
			if !strings.Contains(body, flat(s.Label+" "+value)) {
				t.Errorf("%v: step %q: its result %q is not beside it", size, s.Label, value)
			}
			if !strings.Contains(body, flat(s.Formula)) {
				t.Errorf("%v: step %q: its formula is not whole: %q", size, s.Label, s.Formula)
			}
		}
		if !caution {
			t.Errorf("%v: no caution among the steps: the case does not test it", size)
		}
		if strings.Contains(body, "read the direct answer =") {
			t.Errorf("%v: the hand figure reads as the direct answer", size)
		}
		if len(m.derived.hand) == 0 {
			t.Errorf("%v: no caveat: the case does not test it", size)
		}
		for _, f := range m.derived.hand {
			if !strings.Contains(body, flat(f.Message)) {
				t.Errorf("%v: the caveat is not whole: %q", size, f.Message)
			}
		}
	}
}
