package tui

import (
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
)

// host is what a child panel may ask of the dashboard while it takes a
// message (the flooding run's and the righting options' update): the
// dashboard's own concerns, done at once and in order, so that the log
// and its file read as if the root had done them itself. A panel holds its
// host only during its update, and the host does not see the panel's new
// state until the update has returned it.
type host interface {
	// say puts a line in the event log, stamped now, and returns the Cmd
	// that syncs the log file.
	say(line string) tea.Cmd
	// change makes d the damage state, described by what: logged, worked
	// out in a Cmd and undone with the undo key.
	change(d engine.Damage, what string) tea.Cmd
	// busy starts the computing mark (the spinner) if it is not turning.
	busy() tea.Cmd
	// bindings is the dashboard's keys, which the panels' keys are among.
	bindings() keyMap
}

// The root model is the children's host.
var _ host = (*model)(nil)

func (m *model) say(line string) tea.Cmd { return m.addLog(m.now(), line) }

func (m *model) change(d engine.Damage, what string) tea.Cmd {
	next, cmd := m.apply(d, what)
	*m = next.(model)
	return cmd
}

func (m *model) busy() tea.Cmd { return m.startSpinner() }

func (m *model) bindings() keyMap { return m.keys }
