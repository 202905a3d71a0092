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
	var open, held []string
	for i, s := range d {
		switch {
		case s.Open:
			open = append(open, m.v.Compartments[i].Name+" (μ "+muText(m.mu(d, i))+")")
		case s.WaterM3 > 0:
			held = append(held, m.v.Compartments[i].Name+" ("+num(s.WaterM3, 0)+" m³ held)")
		}
	}
	// Where the case came from: --open/--perm, or a state saved with the
	// loading condition panel and taken up with --resume.
	what := "from the command line: "
	if m.opts.Resume != nil {
		what = "from the saved state: "
	}
	var parts []string
	if len(open) > 0 {
		parts = append(parts, strings.Join(open, ", ")+" open to sea")
	}
	if len(held) > 0 {
		parts = append(parts, "water in "+strings.Join(held, ", "))
	}
	mm, cmd := m.apply(cloneDamage(d), what+strings.Join(parts, "; "))
	return mm.(model), cmd
}
