package tui

import (
	"fmt"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
)

// doorsPanel lists the vessel's connections (doors, hatches, ducts, pipes,
// cross-flooding valves) with their state and how the water spreads
// through them now. The root model holds it and opens it with the doors
// key; while it is shown it answers ↑↓ (choose) and space (open or shut),
// and a switch comes back to the root as a doorMsg, which recomputes the
// state with the connection changed.
type doorsPanel struct {
	show bool
	sel  int
}

// doorsKey opens or closes the panel.
var doorsKey = key.NewBinding(key.WithKeys("d"), key.WithHelp("d", "doors & valves"))

// doorMsg asks the root to set connection i open or shut.
type doorMsg struct {
	i    int
	open bool
}

// handles reports whether the panel answers msg.
func (p doorsPanel) handles(msg tea.KeyMsg) bool {
	return p.show && (msg.String() == "up" || msg.String() == "down" || msg.String() == "k" || msg.String() == "j" ||
		msg.String() == " " || msg.String() == "enter")
}

// update answers the panel's keys; conns are the vessel's connections now.
func (p doorsPanel) update(msg tea.KeyMsg, conns []engine.Connection) (doorsPanel, tea.Cmd) {
	if len(conns) == 0 {
		return p, nil
	}
	switch msg.String() {
	case "up", "k":
		p.sel = max(0, p.sel-1)
	case "down", "j":
		p.sel = min(len(conns)-1, p.sel+1)
	case " ", "enter":
		i, open := p.sel, !conns[p.sel].Open
		return p, func() tea.Msg { return doorMsg{i, open} }
	}
	return p, nil
}

// view draws the panel: each connection and what it joins, then the spread.
func (p doorsPanel) view(v *engine.Vessel, a *engine.Assessment, st *Styles, w, h int) string {
	lines := []string{st.Heading.Render(titleFit(w, "DOORS AND VALVES", "↑↓ choose", "space open/shut", "d closes"))}
	if len(v.Connections) == 0 {
		lines = append(lines, st.Dim.Render("The vessel file has no [[connection]] tables."))
	}
	for i, c := range v.Connections {
		state := "shut"
		if c.Open {
			state = "OPEN"
		}
		mark := "  "
		if i == p.sel {
			mark = "▸ "
		}
		// Two lines each: the fitting, then what it joins in full,
		// wrapped rather than cut (the officer must read both spaces).
		entry := []string{fitLine(fmt.Sprintf("%s%-5s %s (%s)", mark, state, c.Name, c.Kind), w)}
		for _, l := range wrap(v.Compartments[c.From].Name+" ↔ "+v.Compartments[c.To].Name, w-8) {
			entry = append(entry, fitLine("        "+l, w))
		}
		for _, line := range entry {
			switch {
			case i == p.sel:
				line = st.Selected.Render(line)
			case c.Open:
				line = st.Open.Render(line)
			}
			lines = append(lines, line)
		}
	}
	lines = append(lines, "")
	spread := false
	if a != nil {
		for _, f := range a.Flags {
			switch f.Code {
			case "water-spreads", "lost-through-spread", "closing-saves", "cross-flooding-time":
				for _, l := range wrap(f.Message, w-2) {
					lines = append(lines, "  "+st.Danger.Render(l))
				}
				spread = true
			}
		}
	}
	if !spread {
		for _, l := range wrap("The water goes no further than the compartments opened.", w) {
			lines = append(lines, st.Dim.Render(l))
		}
	}
	return strings.Join(fit(lines, w, h), "\n")
}

// doorsLines is the panel drawn for the root model.
func (m model) doorsLines(w, h int) []string {
	return strings.Split(m.doors.view(m.v, m.cur, m.st, w, h), "\n")
}

// doorsToggle opens or closes the panel; the other right-hand panels give
// way to it.
func (m model) doorsToggle() (tea.Model, tea.Cmd) {
	m.doors.show = !m.doors.show
	if m.doors.show {
		m.rem.show, m.girder.show, m.flood.show = false, false, false
	}
	return m, nil
}

// takeDoor sets a connection open or shut and recomputes the state.
func (m model) takeDoor(msg doorMsg) (tea.Model, tea.Cmd) {
	c := m.v.Connections[msg.i]
	m.v = m.v.WithConnection(msg.i, msg.open)
	what := c.Name + " shut"
	if msg.open {
		what = c.Name + " opened"
	}
	return m.commit(cloneDamage(m.damage), what)
}

// assessSpread is what one keystroke computes: the spread through the
// connections and openings to a fixed point, then everything Assess
// works out for that final state, the spread said first among the flags.
func assessSpread(v *engine.Vessel, d engine.Damage) engine.Assessment {
	sp := engine.Progressive(v, d)
	a := engine.Assess(v, sp.Damage)
	a.Flags = append(engine.SpreadFlags(v, sp), a.Flags...)
	return a
}

// spreadState marks a compartment the water reached through a connection
// or an opening (open to the sea in the assessed state a, not in the
// officer's d): "SPREAD" and its mark; "" for any other.
func spreadState(a *engine.Assessment, d engine.Damage, i int) (word, mark string) {
	if a == nil || i >= len(a.Damage) || !a.Damage[i].Open || (i < len(d) && d[i].Open) {
		return "", ""
	}
	return "SPREAD", "≈"
}

// openNow reports whether compartment i is open to the sea in the state
// whose figures are shown: the officer's, and those the water reached
// through connections and openings (the pictures shade them all). (A
// pointer receiver: the model is too large to copy once per compartment.)
func (m *model) openNow(i int) bool {
	if m.cur != nil && i < len(m.cur.Damage) {
		return m.cur.Damage[i].Open
	}
	return i < len(m.damage) && m.damage[i].Open
}
