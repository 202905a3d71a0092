package tui

import (
	"fmt"
	"regexp"
	"strings"
	"testing"

	"github.com/charmbracelet/x/ansi"
)

var nameCol = regexp.MustCompile(`^(.*?)\s+-?\d+\.\d`)

// TestConditionPanelNarrowNames: at 80×24 every tank and weight of the
// condition panel can be told apart and read whole where it matters: the
// freighter's port and starboard fuel tanks were both "ER DB fuel oi…",
// and a weight's vcg (what moves G) fell off the end of its line.
func TestConditionPanelNarrowNames(t *testing.T) {
	m := bundledModel(t, "freighter", 80, 24)
	m = press(t, m, "L")
	rows := m.cond.rows()
	seen := map[string]string{}
	for k, r := range rows {
		m.cond.sel = k
		lines := m.conditionLines(44, 20)
		var line string
		for _, l := range lines {
			if strings.HasPrefix(ansi.Strip(l), "▸ ") {
				line = strings.TrimPrefix(ansi.Strip(l), "▸ ")
			}
		}
		if line == "" {
			t.Fatalf("row %d not drawn:\n%s", k, strings.Join(lines, "\n"))
		}
		var name string
		if r.tank >= 0 {
			name = m.v.Compartments[r.tank].Name
		} else {
			wt := m.cond.cond.Weights[r.weight]
			name = wt.Name
			if want := fmt.Sprintf("%.1f", wt.VCGM); !strings.HasSuffix(strings.TrimSpace(line), want) {
				t.Errorf("weight %s: vcg %s m not at the end of %q", name, want, line)
			}
		}
		shown := nameCol.FindStringSubmatch(line)[1]
		if other, ok := seen[shown]; ok {
			t.Errorf("%q and %q both show as %q", other, name, shown)
		}
		seen[shown] = name
	}
}

// TestPanelHelpBar: while the loading condition or the readings panel is
// shown, the help bar gives that panel's keys (it said "+/− μ" while +
// filled a tank); r from the loading condition opens the readings panel
// at the first press.
func TestPanelHelpBar(t *testing.T) {
	m := bundledModel(t, "freighter", 80, 24)
	m = press(t, m, "L")
	if bar := ansi.Strip(strings.Join(m.helpLines(), " ")); !strings.Contains(bar, "fill 5 %") || strings.Contains(bar, "μ") {
		t.Errorf("loading condition shown, the help bar reads %q", bar)
	}
	m = press(t, m, "r")
	if m.cond.show || !m.rd.show {
		t.Errorf("r from the loading condition: condition shown %v, readings shown %v", m.cond.show, m.rd.show)
	}
	if bar := ansi.Strip(strings.Join(m.helpLines(), " ")); !strings.Contains(bar, "new reading") {
		t.Errorf("readings shown, the help bar reads %q", bar)
	}
	m = press(t, m, "r")
	if bar := ansi.Strip(strings.Join(m.helpLines(), " ")); !strings.Contains(bar, "μ") {
		t.Errorf("no panel, the help bar reads %q", bar)
	}
}
