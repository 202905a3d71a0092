package tui

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
)

// TestNoDamageCriteriaSaid: a ship whose file names only an intact set
// (IS Code 2008), flooded: no criterion applies, and the sheet must say
// so at once, not "not yet available" as if a result were coming (the
// officer trial on the large generated ship waited 40 s for it).
func TestNoDamageCriteriaSaid(t *testing.T) {
	v := testBarge(t, 1.5)
	v.CriteriaSets = []string{"is-code-2008"}
	m := newModel(v, nil, Options{})
	m.now, m.animate = fixedClock(), false
	m = drive(t, m, tea.WindowSizeMsg{Width: 120, Height: 40}, m.Init())
	m = openSpaces(t, m, "Wing S")
	if len(m.cur.Criteria) != 0 {
		t.Fatalf("criteria judged for the flooded barge: %+v", m.cur.Criteria)
	}
	view := strings.Join(m.criteriaLines(200, false), "\n")
	if strings.Contains(view, "not yet available") || !strings.Contains(view, "judges a flooded ship") {
		t.Errorf("criteria lines: %q", view)
	}
}
