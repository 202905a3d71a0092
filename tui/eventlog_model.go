package tui

import (
	"fmt"
	"time"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
)

// Messages of the event log file.
type (
	// logStatusMsg follows every sync of the file: the model shows what the
	// file has to say and schedules a retry while writing fails.
	logStatusMsg struct{}
	// logRetryMsg is the retry's time.
	logRetryMsg struct{}
)

// logRetryEvery is how often lines held back are tried again.
const logRetryEvery = 3 * time.Second

// screenLog puts a line in the event log on screen.
func (m *model) screenLog(at time.Time, line string) {
	m.log = append(m.log, at.Format("15:04:05")+" "+line)
	if len(m.log) > 200 {
		m.log = m.log[len(m.log)-200:]
	}
}

// fileLine writes line, stamped with at, to the log file at once and
// returns the Cmd that syncs it; nil without a file.
func (m *model) fileLine(at time.Time, line string) tea.Cmd {
	if m.file == nil {
		return nil
	}
	m.file.add(at.Format(time.RFC3339) + "  " + line) // a failure is kept and shown by takeLogNotes
	m.takeLogNotes()
	return m.syncLog()
}

// logChange writes change seq to the file as it is made, before its
// computation: its result follows on a line of its own (addLogResult).
func (m *model) logChange(seq int, ch change) tea.Cmd {
	return m.fileLine(ch.at, fmt.Sprintf("change %d: %s", seq, ch.what))
}

// addLogResult logs the result of change seq: on screen the change with its
// result, in the file a line of its own, stamped when the result came.
func (m *model) addLogResult(seq int, ch change, res [2]string) tea.Cmd {
	m.screenLog(ch.at, ch.what+" → "+res[0])
	if m.file == nil {
		return nil // and no reading of the clock, which tests count
	}
	return m.fileLine(m.now(), fmt.Sprintf("result %d: %s → %s", seq, ch.what, res[1]))
}

func (m model) syncLog() tea.Cmd {
	f := m.file
	if f == nil {
		return nil
	}
	return func() tea.Msg {
		f.sync() // a failure is kept in f and shown by takeLogStatus
		return logStatusMsg{}
	}
}

// takeLogNotes moves what the file has to say to the screen's event log.
func (m *model) takeLogNotes() {
	if m.file == nil {
		return
	}
	for _, n := range m.file.takeNotes() {
		m.screenLog(m.now(), n)
	}
}

// takeLogStatus shows the file's notes and, while writing fails, schedules
// one retry (tests, which do not animate, retry by hand).
func (m model) takeLogStatus() (tea.Model, tea.Cmd) {
	m.takeLogNotes()
	if m.file == nil || !m.animate {
		return m, nil
	}
	if err, _ := m.file.failing(); err != nil && m.file.retrying.CompareAndSwap(false, true) {
		return m, tea.Tick(logRetryEvery, func(time.Time) tea.Msg { return logRetryMsg{} })
	}
	return m, nil
}

func (m model) retryLog() (tea.Model, tea.Cmd) {
	if m.file == nil {
		return m, nil
	}
	m.file.retrying.Store(false)
	return m, m.syncLog()
}

// logWarning is the header's lasting warning while the log file cannot be
// written ("" while it can), followed by a gap; on a narrow screen it is
// shorter, so that the heel and GM beside it still fit.
func (m model) logWarning() string {
	if m.file == nil {
		return ""
	}
	err, since := m.file.failing()
	if err == nil {
		return ""
	}
	text := "LOG FAILING"
	if m.width >= 100 {
		text = "LOG NOT WRITTEN since " + since.Format("15:04")
	}
	return m.st.Danger.Render(text) + "  "
}

// smallScreenKey handles a key while the screen is too small for the
// dashboard: only quitting works; nothing else changes the state or the
// log, since nothing of it can be seen.
func (m model) smallScreenKey(msg tea.KeyMsg) (tea.Model, tea.Cmd) {
	if key.Matches(msg, m.keys.Quit) {
		return m, tea.Quit
	}
	return m, nil
}
