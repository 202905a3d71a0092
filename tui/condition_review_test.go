package tui

import (
	"fmt"
	"regexp"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"

	"heelwatch/engine"
	"heelwatch/vessels"
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

// TestResumeLogSaysWhence: a state taken up with --resume is logged as the
// saved state's, with the water held in a space named too (the log said
// "from the command line: … open to sea", with a held space not named).
func TestResumeLogSaysWhence(t *testing.T) {
	v, info := ship(t)
	d := v.Intact()
	d[indexOfVessel(t, v, "Wing tank 2 S")] = engine.SpaceState{Open: true}
	d[indexOfVessel(t, v, "Hold 2")] = engine.SpaceState{WaterM3: 120}
	s := &vessels.State{Damage: d}
	r := newModel(v, info, Options{Palette: "day", Resume: s, Start: d})
	r.now = fixedClock()
	r.animate = false
	r = drive(t, r, tea.WindowSizeMsg{Width: 80, Height: 24})
	r = drive(t, r, nil, r.Init())
	log := strings.Join(r.log, "\n")
	if !strings.Contains(log, "from the saved state: Wing tank 2 S (μ 0.95) open to sea; water in Hold 2 (120 m³ held)") {
		t.Errorf("the log reads:\n%s", log)
	}
}

func indexOfVessel(t *testing.T, v *engine.Vessel, name string) int {
	t.Helper()
	for i, c := range v.Compartments {
		if c.Name == name {
			return i
		}
	}
	t.Fatalf("no compartment %q", name)
	return -1
}

// TestPanelHelpBarWhileTyping: while a value or a reading is typed the
// help bar gives the keys that answer then (q is typed, not quit).
func TestPanelHelpBarWhileTyping(t *testing.T) {
	m := bundledModel(t, "freighter", 80, 24)
	m = press(t, m, "L", "e")
	if bar := ansi.Strip(strings.Join(m.helpLines(), " ")); !strings.Contains(bar, "enter take it") || strings.Contains(bar, "q quit") {
		t.Errorf("typing a tank's contents, the help bar reads %q", bar)
	}
	m = press(t, m, "esc", "r", "n")
	if bar := ansi.Strip(strings.Join(m.helpLines(), " ")); !strings.Contains(bar, "enter take the reading") || strings.Contains(bar, "q quit") {
		t.Errorf("typing a reading, the help bar reads %q", bar)
	}
}
