package tui

import (
	"fmt"
	"sync/atomic"

	tea "github.com/charmbracelet/bubbletea"
)

// This file holds the one way the dashboard runs long work: in a Cmd, for a
// numbered request, where only the newest request's answer is taken.
//
// Every request of one kind (a change of the damage state, a flooding run,
// the righting options) gets the next number, stored in an atomic the Cmds
// read. A Cmd that starts after a newer request was made does nothing and
// says so (its answer could never be shown); one that panics inside the
// engine says so instead of taking the screen down. Update drops every
// message whose number is not the newest.

// newest returns the Cmd that runs work for request seq: stale() when
// latest has moved past seq before it starts, failed(reason) when the work
// panics, else work's message.
func newest(seq int, latest *atomic.Int64, stale func() tea.Msg, failed func(reason string) tea.Msg, work func() tea.Msg) tea.Cmd {
	return func() (msg tea.Msg) {
		if latest != nil && latest.Load() != int64(seq) {
			return stale()
		}
		defer func() {
			if r := recover(); r != nil {
				msg = failed(fmt.Sprint(r))
			}
		}()
		return work()
	}
}
