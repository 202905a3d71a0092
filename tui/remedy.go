package tui

import (
	"fmt"
	"sync/atomic"

	"github.com/charmbracelet/bubbles/key"
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

// remedyPanel is the righting options and their panel: a child of the
// dashboard with its own update (the righting-options key, the scroll keys
// while it is shown, and the options' message) and view (remedy_view.go).
// It is given what it works and draws with by with.
type remedyPanel struct {
	show    bool // the panel is on screen
	seq     int  // the newest request's number
	latest  *atomic.Int64
	running bool          // the newest request is being worked out
	asked   engine.Damage // the damage state the newest request is for
	set     *engine.RemedySet
	err     string // the newest request failed (a recovered panic)
	scroll  int    // the first line of the panel's scrolling part shown

	// What the panel works and draws with, given by with before each use.
	v      *engine.Vessel
	damage engine.Damage // the damage state shown
	st     *Styles
	spin   string // the computing mark
	w, h   int    // the body of the screen, which the panel takes
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

// with returns the panel for m's vessel, damage state, styles and screen.
func (r remedyPanel) with(m model) remedyPanel {
	r.v, r.damage, r.st, r.spin = m.v, m.damage, m.st, m.spinView()
	r.w, r.h = m.width, m.lay.bodyH
	return r
}

// handles reports whether key msg is the panel's among the dashboard's
// keys k: the righting-options key, and the scroll keys while the panel is
// shown.
func (r remedyPanel) handles(msg tea.KeyMsg, k keyMap) bool {
	return key.Matches(msg, k.Remedies) || r.show && key.Matches(msg, k.WorkUp, k.WorkDown)
}

// update takes the panel's keys and the options' message; what the
// dashboard does besides (the log, the computing mark) it asks of h.
func (r remedyPanel) update(msg tea.Msg, h host) (remedyPanel, tea.Cmd) {
	switch msg := msg.(type) {
	case remedyMsg:
		return r.take(msg, h)
	case tea.KeyMsg:
		k := h.bindings()
		switch {
		case key.Matches(msg, k.Remedies):
			return r.ask(h)
		case r.show && key.Matches(msg, k.WorkUp, k.WorkDown):
			step := scrollStep
			if key.Matches(msg, k.WorkUp) {
				step = -scrollStep
			}
			head, body, foot := r.parts(r.w, r.h)
			r.scroll = scrolled(r.scroll, body, r.h-len(head)-len(foot), step)
		}
	}
	return r, nil
}

// current reports whether the options held were worked out for damage
// state d.
func (r remedyPanel) current(d engine.Damage) bool {
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

// ask answers the righting-options key: it shows the panel and works the
// options out for the state now when they are not already (or being)
// worked out for it; pressed again on current options, it hides the panel.
func (r remedyPanel) ask(h host) (remedyPanel, tea.Cmd) {
	switch {
	case r.show && r.workingOn(r.damage):
		return r, nil
	case r.show && r.current(r.damage) && !r.running:
		r.show = false
		return r, nil
	case !r.show && (r.current(r.damage) || r.workingOn(r.damage)):
		r.show, r.scroll = true, 0
		return r, nil
	}
	r.show, r.scroll = true, 0
	r.seq++
	r.latest.Store(int64(r.seq))
	r.running, r.err = true, ""
	r.asked = cloneDamage(r.damage)
	return r, tea.Batch(remediesCmd(r.v, cloneDamage(r.damage), r.seq, r.latest), h.busy())
}

// take keeps the newest request's options and logs them; any other
// message is dropped.
func (r remedyPanel) take(msg remedyMsg, h host) (remedyPanel, tea.Cmd) {
	if msg.stale || msg.seq != r.seq || !r.running {
		return r, nil
	}
	r.running = false
	var logged tea.Cmd
	if msg.err != "" {
		r.err = msg.err
		logged = h.say("righting options could not be worked out: engine failure: " + msg.err)
	} else {
		rs := msg.set
		r.set, r.scroll = &rs, 0
		logged = h.say("righting options worked out: " + remedyLogLine(rs))
	}
	return r, logged
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

// workingOn reports whether options are being worked out for damage
// state d.
func (r remedyPanel) workingOn(d engine.Damage) bool {
	return r.running && sameDamage(r.asked, d)
}

// forReport returns the righting options for the report of assessment a:
// those held, when they were worked out for its damage state; nil
// otherwise.
func (r remedyPanel) forReport(a *engine.Assessment) *engine.RemedySet {
	if a == nil || !r.current(a.Damage) {
		return nil
	}
	rs := *r.set
	return &rs
}

// updateRemedies passes msg to the righting options' panel; once their
// options are in, a report the report key left waiting for them is
// written.
func (m model) updateRemedies(msg tea.Msg) (tea.Model, tea.Cmd) {
	was := m.rem.running
	var cmd tea.Cmd
	m.rem, cmd = m.rem.with(m).update(msg, &m)
	if was && !m.rem.running && m.wantRep && m.reportReady() {
		m.wantRep = false
		cmd = tea.Batch(cmd, m.writeReport())
	}
	return m, cmd
}

// reportReady reports whether the report key can write now: the figures
// shown are the newest, and no righting options are still being worked
// out for that state (they go into the report once they are in).
func (m model) reportReady() bool {
	return !m.pending() && !m.rem.workingOn(m.damage)
}
