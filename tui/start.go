package tui

import (
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
)

// startWith selects, in the list, the first compartment the damage state
// given on the command line (--open, --perm) opens; the state itself is
// put on the dashboard by startCase once the intact condition is known.
func (m model) startWith(d engine.Damage) model {
	for i, s := range d {
		if s.Open {
			m.sel = i
			m.ensureVisible()
			break
		}
	}
	return m
}

// startCase makes the damage state given on the command line the
// dashboard's first change, once the intact condition has come: shown as
// soon as it is worked out, logged after the intact start, and undone with
// the undo key back to all intact. Nothing when none was given, or when a
// change was made before the intact condition came (the log says so).
func (m model) startCase() (model, tea.Cmd) {
	d := m.opts.Start
	if len(d) != len(m.v.Compartments) || allZero(d) {
		return m, nil
	}
	if m.seq > 0 {
		return m, m.addLog(m.now(), "the case from the command line was not applied: a change came first")
	}
	var open []string
	for i, s := range d {
		if s.Open {
			open = append(open, m.v.Compartments[i].Name+" (μ "+muText(m.mu(d, i))+")")
		}
	}
	mm, cmd := m.apply(cloneDamage(d), "from the command line: "+strings.Join(open, ", ")+" open to sea")
	return mm.(model), cmd
}
