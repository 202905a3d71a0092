package tui

import (
	"fmt"
	"sync/atomic"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
)

// This file works out the righting options (engine.FindRemedies) for the
// dashboard's damage state, on request, in a Cmd.
//
// Each request gets a sequence number; the Cmd does nothing when a newer
// request was made before it started, and a message whose number is not
// the newest is dropped, so an older request's options never overwrite a
// newer one's. The options are worked out only when asked for: a change of
// the damage state does not start them again, it makes those on screen out
// of date, and the panel then shows no option, only that they are out of
// date and that the key works them out again. Undoing back to the state
// they were worked out for makes them current again.

// remedyState is the righting options and their panel: a child of the
// dashboard whose view (remedy_view.go) draws with what with gives it.
type remedyState struct {
	show    bool // the panel is on screen
	seq     int  // the newest request's number
	latest  *atomic.Int64
	running bool          // the newest request is being worked out
	asked   engine.Damage // the damage state the newest request is for
	set     *engine.RemedySet
	err     string // the newest request failed (a recovered panic)
	scroll  int    // the first line of the panel's scrolling part shown

	// What the panel draws with, given by with before each use.
	v      *engine.Vessel
	damage engine.Damage // the damage state shown
	st     Styles
	spin   string // the computing mark
}

// remedyMsg carries the righting options of request seq. Stale is set when
// a newer request had been made before the work started, so it was not
// done.
type remedyMsg struct {
	seq   int
	set   engine.RemedySet
	stale bool
	err   string
}

// remediesCmd returns the Cmd that works out the righting options for
// damage state d (a copy the Cmd owns), request number seq. The vessel is
// never edited by the dashboard, so FindRemedies may read it here.
func remediesCmd(v *engine.Vessel, d engine.Damage, seq int, latest *atomic.Int64) tea.Cmd {
	return newest(seq, latest,
		func() tea.Msg { return remedyMsg{seq: seq, stale: true} },
		func(why string) tea.Msg { return remedyMsg{seq: seq, err: why} },
		func() tea.Msg { return remedyMsg{seq: seq, set: engine.FindRemedies(v, d)} })
}

// with returns the panel drawing for m's vessel, damage state and styles.
func (r remedyState) with(m model) remedyState {
	r.v, r.damage, r.st, r.spin = m.v, m.damage, m.st, m.spinView()
	return r
}

// current reports whether the options held were worked out for damage
// state d.
func (r remedyState) current(d engine.Damage) bool {
	return r.set != nil && sameDamage(r.set.Damage, d)
}

// sameDamage reports whether two damage states are the same, compartment
// by compartment.
func sameDamage(a, b engine.Damage) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// remedyKey handles the righting-options key: it shows the panel and works
// the options out for the state now when they are not already (or being)
// worked out for it; pressed again on current options, it hides the panel.
func (m model) remedyKey() (tea.Model, tea.Cmd) {
	r := &m.rem
	switch {
	case r.show && r.running && sameDamage(r.asked, m.damage):
		return m, nil
	case r.show && r.current(m.damage) && !r.running:
		r.show = false
		return m, nil
	case !r.show && (r.current(m.damage) || r.running && sameDamage(r.asked, m.damage)):
		r.show, r.scroll = true, 0
		return m, nil
	}
	r.show, r.scroll = true, 0
	r.seq++
	r.latest.Store(int64(r.seq))
	r.running, r.err = true, ""
	r.asked = cloneDamage(m.damage)
	spin := m.startSpinner() // before m is copied out
	return m, tea.Batch(remediesCmd(m.v, cloneDamage(m.damage), r.seq, r.latest), spin)
}

// takeRemedies keeps the newest request's options and logs them; any
// other message is dropped.
func (m model) takeRemedies(msg remedyMsg) (tea.Model, tea.Cmd) {
	r := &m.rem
	if msg.stale || msg.seq != r.seq || !r.running {
		return m, nil
	}
	r.running = false
	var cmds []tea.Cmd
	if msg.err != "" {
		r.err = msg.err
		cmds = append(cmds, m.addLog(m.now(), "righting options could not be worked out: engine failure: "+msg.err))
	} else {
		rs := msg.set
		r.set, r.scroll = &rs, 0
		cmds = append(cmds, m.addLog(m.now(), "righting options worked out: "+remedyLogLine(rs)))
	}
	if m.wantRep && m.reportReady() {
		m.wantRep = false
		cmds = append(cmds, m.writeReport())
	}
	return m, tea.Batch(cmds...)
}

// remedyLogLine sums the options up in a line for the event log.
func remedyLogLine(rs engine.RemedySet) string {
	adv := 0
	for _, o := range rs.Options {
		if o.Advisable {
			adv++
		}
	}
	var kind string
	switch {
	case rs.Position == nil:
		return "none (no floating position)"
	case rs.Loll:
		kind = "LOLL, upright GM " + num(rs.UprightGMM, 2) + " m"
	case !finite(rs.UprightGMM):
		kind = "upright GM unknown"
	case rs.Needed:
		kind = "list " + heelShort(rs.HeelDeg)
	default:
		return "none needed (" + heelShort(rs.HeelDeg) + ", upright GM " + num(rs.UprightGMM, 2) + " m)"
	}
	s := fmt.Sprintf("%s; %d option(s), %d advisable", kind, len(rs.Options), adv)
	if len(rs.Options) > 0 {
		s += "; first: " + rs.Options[0].Action
	}
	return s
}

// reportReady reports whether the report key can write now: the figures
// shown are the newest, and no righting options are still being worked
// out for that state (they go into the report once they are in).
func (m model) reportReady() bool {
	if m.pending() {
		return false
	}
	return !(m.rem.running && sameDamage(m.rem.asked, m.damage))
}

// reportRemedies returns the righting options for the report of
// assessment a: those held, when they were worked out for its damage
// state; nil otherwise.
func (m model) reportRemedies(a *engine.Assessment) *engine.RemedySet {
	if a == nil || !m.rem.current(a.Damage) {
		return nil
	}
	rs := *m.rem.set
	return &rs
}
