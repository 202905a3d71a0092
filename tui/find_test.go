package tui

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
)

// typeText sends each rune of s as a key.
func typeText(t testing.TB, m model, s string) model {
	t.Helper()
	for _, r := range s {
		m = drive(t, m, tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{r}})
	}
	return m
}

func selName(m model) string { return m.v.Compartments[m.sel].Name }

func TestFindSelectsByPartOfAName(t *testing.T) {
	m := testModel(t, 100, 30)
	m = press(t, m, "/")
	if !m.find.on {
		t.Fatal("/ does not open the finder")
	}
	m = typeText(t, m, "WING TANK 2 s")
	if selName(m) != "Wing tank 2 S" {
		t.Errorf("selected %q, want Wing tank 2 S (case ignored)", selName(m))
	}
	screen := m.View()
	if !strings.Contains(screen, "find a compartment") || !strings.Contains(screen, "▸■ Wing tank 2 S") && !strings.Contains(screen, "▸  Wing tank 2 S") {
		t.Errorf("the screen does not show the finder with the match selected:\n%s", screen)
	}
	m = press(t, m, "enter")
	if m.find.on || selName(m) != "Wing tank 2 S" {
		t.Errorf("after enter: finder on %v, selected %q", m.find.on, selName(m))
	}
	// Keys act on the list again: space opens the compartment found.
	m = press(t, m, "space")
	if !m.damage[m.sel].Open {
		t.Error("space after a find does not open the compartment found")
	}
}

func TestFindStepsAndCancels(t *testing.T) {
	m := testModel(t, 80, 24)
	start := selName(m)
	m = press(t, m, "/")
	m = typeText(t, m, "hold")
	first := selName(m)
	if first != "Hold 2" {
		t.Errorf("first match %q, want Hold 2 (the list's order)", first)
	}
	m = press(t, m, "down")
	if selName(m) != "Hold 1" {
		t.Errorf("next match %q, want Hold 1", selName(m))
	}
	m = typeText(t, m, "zz")
	if !strings.Contains(m.View(), "no compartment's name holds") {
		t.Error("no match is not said")
	}
	m = press(t, m, "esc")
	if m.find.on || selName(m) != start {
		t.Errorf("esc: finder on %v, selected %q, want back at %q", m.find.on, selName(m), start)
	}
	// Names are matched inside too: "thruster" finds the bow thruster room.
	m = press(t, m, "/")
	m = typeText(t, m, "thruster")
	if selName(m) != "Bow thruster room" {
		t.Errorf("selected %q, want Bow thruster room", selName(m))
	}
}

func TestPageKeysPageTheList(t *testing.T) {
	m := testModel(t, 80, 24)
	m = press(t, m, "home")
	top := m.sel
	m = drive(t, m, tea.KeyMsg{Type: tea.KeyPgDown})
	var order []int
	for _, r := range m.rows {
		if r.idx >= 0 {
			order = append(order, r.idx)
		}
	}
	pos := func(i int) int {
		for k, j := range order {
			if j == i {
				return k
			}
		}
		return -1
	}
	step := pos(m.sel) - pos(top)
	if step < 5 || pos(m.sel) == len(order)-1 {
		t.Errorf("pgdn moved %d compartments (to %q): want a page, not the end", step, selName(m))
	}
	m = drive(t, m, tea.KeyMsg{Type: tea.KeyPgUp})
	if m.sel != top {
		t.Errorf("pgup from one page down selects %q, want the first again", selName(m))
	}
}

// The full help shows the find and page keys and still every column at 80
// columns.
func TestFullHelpShowsFindAndPage(t *testing.T) {
	m := press(t, testModel(t, 80, 24), "?")
	screen := m.View()
	for _, want := range []string{"find by name", "page down", "page up", "quit (also ctrl+c)", "write report"} {
		if !strings.Contains(screen, want) {
			t.Errorf("the full help lacks %q:\n%s", want, screen)
		}
	}
}
