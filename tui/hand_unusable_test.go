package tui

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestHandNotUsableShown: the freighter made top-heavy (800 t at 7.0 m,
// her tanks empty) with Wing tank 2 S open: the hand heel runs far past
// the small angles (engine.HandWorking.Unusable says why). The hand panel
// must say, before its working and at every size, that the hand heel and
// drafts are not to be worked from, and the header's word must still come
// from the ship's flags only.
func TestHandNotUsableShown(t *testing.T) {
	v, info := ship(t)
	c := vessels.ConditionOf(v, "top-heavy (test)")
	c.Tanks = nil
	c.Weights = append(c.Weights, engine.Weight{Name: "Deck load", MassT: 800, LCGM: 45, VCGM: 7.0})
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	d := nv.Intact()
	for i, cp := range nv.Compartments {
		if cp.Name == "Wing tank 2 S" {
			d[i].Open = true
		}
	}
	a := engine.Assess(nv, d)
	if a.Hand == nil || a.Hand.Usable() {
		t.Fatalf("the case should give a hand answer that is not usable: %+v", a.Hand)
	}
	for _, size := range [][2]int{{80, 24}, {100, 30}, {120, 40}} {
		m := newModel(nv, info, Options{Palette: "day"})
		m.now, m.animate = fixedClock(), false
		m = drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]}, m.Init())
		mm, cmd := m.apply(d, "Wing tank 2 S opened (test)")
		m = drive(t, mm.(model), nil, cmd)
		m = press(t, m, "h")
		view := m.View()
		// Every heading of the hand answers says so (at 120×40 they stand
		// under the figures, apart from the working).
		for _, l := range strings.Split(view, "\n") {
			if strings.Contains(l, "HAND METHOD") && !strings.Contains(l, "✗") && !strings.Contains(l, "NOT USABLE") {
				t.Errorf("%v: a hand heading without the mark: %q", size, l)
			}
		}
		if !strings.Contains(view, "NOT USABLE") && !strings.Contains(view, "HAND METHOD ✗") {
			t.Errorf("%v: the hand panel does not say the hand answer is not usable:\n%s", size, view)
		}
		if !strings.Contains(view, "✗ NOT USABLE: the hand heel") {
			t.Errorf("%v: the reason is not shown:\n%s", size, view)
		}
		for _, f := range m.derived.flags {
			if f.AboutHandMethod() {
				t.Errorf("%v: the method's flag %s counted among the ship's", size, f.Code)
			}
		}
	}
}

// TestHandCaveatsSaidToBeTheMethods: with the hand working shown, the
// method's caveats (Wing tank 2 S open: past-small-angles, not-wall-sided)
// stand under a line saying they are about the method, since "no flags
// raised" may stand just above them (officer trial at 80×24).
func TestHandCaveatsSaidToBeTheMethods(t *testing.T) {
	m := testModel(t, 80, 24)
	m = openSpaces(t, m, "Wing tank 2 S")
	m = press(t, m, "h")
	if len(m.derived.hand) == 0 {
		t.Skip("no caveat of the hand method in this state")
	}
	view := m.View()
	if !strings.Contains(view, "the hand method's caveats") {
		t.Errorf("the caveats are not said to be the method's:\n%s", view)
	}
	// Her trim is by the stern: said so in the hand table, not by a sign.
	if line := lineWith(view, "Trim "); !strings.Contains(line, " st") || strings.Contains(line, "-") {
		t.Errorf("hand table's trim row: %q", line)
	}
}
