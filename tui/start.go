package tui

import (
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
)

// startWith makes d, the damage state given on the command line (--open,
// --perm), the dashboard's first change: shown as soon as it is worked out,
// logged, and undone with the undo key back to all intact. An intact d
// changes nothing. The Cmd that works it out is started by Init.
func (m model) startWith(d engine.Damage) model {
	if len(d) != len(m.v.Compartments) || allZero(d) {
		return m
	}
	var open []string
	first := true
	for i, s := range d {
		if s.Open && first {
			// The list shows the first of them selected.
			m.sel, first = i, false
			m.ensureVisible()
		}
		if s.Open {
			open = append(open, m.v.Compartments[i].Name+" (μ "+muText(m.mu(d, i))+")")
		}
	}
	what := "from the command line: " + strings.Join(open, ", ") + " open to sea"
	mm, _ := m.apply(cloneDamage(d), what) // its Cmd is startCmd's to give
	return mm.(model)
}

// startSpin is what Init adds for a damage state given at start: the
// spinner, while its figures are awaited.
func (m model) startSpin() tea.Cmd {
	if !m.spinning {
		return nil
	}
	return m.spin.Tick
}

// startCmd works out the damage state given at start, change 1, once the
// intact condition is known, so that the log reads in order: the intact
// start, then the case from the command line. Nil when none was given; a
// change made since skips it (recompute sees a newer number).
func (m model) startCmd() tea.Cmd {
	if len(m.opts.Start) == 0 || allZero(m.opts.Start) || m.seq == 0 {
		return nil
	}
	return recompute(m.v, cloneDamage(m.damage), 1, m.latest)
}
