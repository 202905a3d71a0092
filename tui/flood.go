package tui

import (
	"fmt"
	"strings"
	"sync/atomic"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/progress"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

// This file runs a flooding run (engine.FloodRun) for the dashboard: one
// compartment filling through a hole against its pumps, step by step in
// Cmds, with the rest of the dashboard's damage state as its base.
//
// The run is not safe for concurrent use, so it is only ever held by one
// Cmd at a time: each Cmd takes one step and hands the run back in its
// message, and Update (which never calls the run) issues the next Cmd with
// it. Every request gets a sequence number; a message whose number is not
// the newest is dropped and its run abandoned, so a newer request, or
// hiding the panel, stops an older run at its next step.

// floodRequest is what the form asked for: the compartment, its hole and
// pumps, and the base damage state, resolved into the run's case by
// vessels.ResolveFlood (the same rules as the command line's).
type floodRequest struct {
	ci      int
	areaM2  float64
	zM      float64
	cd      float64
	pumpM3h float64
	// base is the dashboard's damage state when the run was asked for,
	// with the flooded compartment not open (its permeability and any water
	// already held kept: that water is in at time zero).
	base    engine.Damage
	wasOpen bool // it was open to the sea on the dashboard (the run starts it dry)
	// flood is the case to run and where its values came from.
	flood vessels.FloodResolved
}

// floodPoint is one moment of a run in progress, for the plot.
type floodPoint struct{ timeS, waterM3 float64 }

// floodPanel is the flooding run and its panel: a child of the dashboard
// with its own update (the run-panel and stage keys, a run asked for by the
// form, and the run's messages) and view (flood_view.go). It is given what
// it works and draws with by with.
type floodPanel struct {
	show      bool // the panel is on screen
	seq       int  // the newest request's number
	latest    *atomic.Int64
	running   bool // steps are being taken
	finishing bool // the steps are done; the report is being worked out
	req       floodRequest
	hole      engine.Hole // as used, once the run has started
	prog      engine.FloodProgress
	track     []floodPoint // the progress so far
	rep       *engine.FloodReport
	err       string
	stage     int                   // the stage the stage key shows next
	net       *engine.NetworkReport // the run through the ship, once it has ended (flood_network.go); nil if none

	// What the panel works and draws with, given by with before each use.
	v       *engine.Vessel
	sel     int
	damage  engine.Damage
	st      *Styles
	inks    map[ink]lipgloss.Style
	bar     progress.Model
	pics    *pictureCache // the plot, drawn again only when it changed
	plotKey pictureKey    // the plot's key but for the run and the size
}

// Messages of a flooding run.
type (
	// floodStepMsg is a run after one more step (or after its start).
	floodStepMsg struct {
		seq     int
		run     *engine.FloodRun // handed on to the next Cmd, never called in Update
		prog    engine.FloodProgress
		hole    engine.Hole
		started bool // the run's first message
		more    bool // the run has not ended
		stale   bool // a newer request was made before this step: nothing done
		err     string
	}
	// floodDoneMsg is a run's report.
	floodDoneMsg struct {
		seq   int
		rep   engine.FloodReport
		stale bool
		err   string
	}
)

// floodStartCmd places the hole and sets the run up (the start and the
// lost-buoyancy solution are solved here).
func floodStartCmd(c engine.FloodCase, seq int, latest *atomic.Int64) tea.Cmd {
	return newest(seq, latest, floodStale(seq), floodFailed(seq), func() tea.Msg {
		r, err := engine.NewFloodRun(c)
		if err != nil {
			return floodStepMsg{seq: seq, err: err.Error()}
		}
		p := r.Progress()
		return floodStepMsg{seq: seq, run: r, prog: p, hole: c.Hole, started: true, more: !p.Done}
	})
}

// floodStepCmd takes one step of run r.
func floodStepCmd(r *engine.FloodRun, seq int, latest *atomic.Int64) tea.Cmd {
	return newest(seq, latest, floodStale(seq), floodFailed(seq), func() tea.Msg {
		more := r.Step()
		return floodStepMsg{seq: seq, run: r, prog: r.Progress(), more: more}
	})
}

// floodReportCmd works out the report of an ended run: its table and its
// stages (some tens of solves, with their criteria).
func floodReportCmd(r *engine.FloodRun, seq int, latest *atomic.Int64) tea.Cmd {
	return newest(seq, latest,
		func() tea.Msg { return floodDoneMsg{seq: seq, stale: true} },
		func(why string) tea.Msg { return floodDoneMsg{seq: seq, err: "engine failure: " + why} },
		func() tea.Msg { return floodDoneMsg{seq: seq, rep: r.Report()} })
}

// floodStale and floodFailed are a step's messages when a newer request
// came first and when the engine failed.
func floodStale(seq int) func() tea.Msg {
	return func() tea.Msg { return floodStepMsg{seq: seq, stale: true} }
}

func floodFailed(seq int) func(string) tea.Msg {
	return func(why string) tea.Msg { return floodStepMsg{seq: seq, err: "engine failure: " + why} }
}

// with returns the panel for m's vessel, selection, damage state and
// styles.
func (f floodPanel) with(m model) floodPanel {
	f.v, f.sel, f.damage, f.st, f.inks, f.bar = m.v, m.sel, m.damage, m.st, m.inks, m.bar
	f.pics, f.plotKey = m.pics, m.pictureKey(picFloodPlot)
	return f
}

// update takes a run asked for by the form (a floodRequest), the run's
// messages, and the panel's keys: the run-panel key shows the panel or
// hides it (stopping a run in progress), the stage key puts the run's next
// stage on the dashboard. What the dashboard does besides (the log, a
// change of the damage state) it asks of h.
func (f floodPanel) update(msg tea.Msg, h host) (floodPanel, tea.Cmd) {
	switch msg := msg.(type) {
	case floodRequest:
		return f.start(msg, h)
	case floodStepMsg:
		return f.takeStep(msg, h)
	case floodDoneMsg:
		return f.takeReport(msg, h)
	case netDoneMsg:
		return f.takeNet(msg, h)
	case tea.KeyMsg:
		k := h.bindings()
		switch {
		case key.Matches(msg, k.RunPanel) && f.show:
			f.show = false
			return f.stop(h)
		case key.Matches(msg, k.RunPanel):
			f.show = true
		case key.Matches(msg, k.RunStage):
			return f.nextStage(h)
		}
	}
	return f, nil
}

// hasStages reports whether the run shown has stages for the stage key.
func (f floodPanel) hasStages() bool { return f.rep != nil && len(f.rep.Stages) > 0 }

// updateFlood passes msg to the flooding run's panel; the stage key
// answers only while the run shown has stages.
func (m model) updateFlood(msg tea.Msg) (tea.Model, tea.Cmd) {
	var cmd tea.Cmd
	m.flood, cmd = m.flood.with(m).update(msg, &m)
	m.keys.RunStage.SetEnabled(m.flood.hasStages())
	return m, cmd
}

// start starts a run for q, cancelling any older one.
func (f floodPanel) start(q floodRequest, h host) (floodPanel, tea.Cmd) {
	f.seq++
	f.latest.Store(int64(f.seq))
	f.show, f.running, f.finishing = true, true, false
	f.req, f.hole, f.prog, f.track, f.rep, f.err, f.stage, f.net = q, engine.Hole{}, engine.FloodProgress{}, nil, nil, "", 0, nil
	name := f.v.Compartments[q.ci].Name
	what := fmt.Sprintf("flooding run: %s through %s m² at z %s m, C_d %s, pumps %s m³/h",
		name, num(q.areaM2, 3), num(q.zM, 2), num(q.cd, 2), num(q.pumpM3h, 0))
	if q.wasOpen {
		what += " (open on the dashboard: the run starts it dry)"
	} else if w := q.base[q.ci].WaterM3; w > 0 {
		what += fmt.Sprintf(" (%s m³ in at the start)", num(w, 1))
	}
	log := h.say(what)
	return f, tea.Batch(floodStartCmd(q.flood.Case, f.seq, f.latest), log)
}

// stop abandons a run in progress; a finished run's report stays.
func (f floodPanel) stop(h host) (floodPanel, tea.Cmd) {
	if !f.running {
		return f, nil
	}
	f.seq++
	f.latest.Store(int64(f.seq))
	f.running, f.finishing = false, false
	return f, h.say("flooding run of " + f.v.Compartments[f.req.ci].Name + " stopped before its end")
}

// takeStep handles a step's message: the newest run's progress is kept
// and its next step issued; any other is dropped.
func (f floodPanel) takeStep(msg floodStepMsg, h host) (floodPanel, tea.Cmd) {
	if msg.stale || msg.seq != f.seq || !f.running {
		return f, nil
	}
	if msg.err != "" {
		f.running, f.finishing, f.err = false, false, msg.err
		return f, h.say("flooding run of " + f.v.Compartments[f.req.ci].Name + " could not go on: " + msg.err)
	}
	if msg.started {
		f.hole = msg.hole
	}
	f.prog = msg.prog
	if n := len(f.track); n == 0 || f.track[n-1].timeS < msg.prog.TimeS || f.track[n-1].waterM3 != msg.prog.WaterM3 {
		f.track = append(f.track, floodPoint{msg.prog.TimeS, msg.prog.WaterM3})
	}
	if msg.more {
		return f, floodStepCmd(msg.run, f.seq, f.latest)
	}
	f.finishing = true
	return f, floodReportCmd(msg.run, f.seq, f.latest)
}

// takeReport handles a finished run's report.
func (f floodPanel) takeReport(msg floodDoneMsg, h host) (floodPanel, tea.Cmd) {
	if msg.stale || msg.seq != f.seq || !f.running {
		return f, nil
	}
	f.running, f.finishing = false, false
	name := f.v.Compartments[f.req.ci].Name
	if msg.err != "" {
		f.err = msg.err
		return f, h.say("flooding run of " + name + " failed: " + msg.err)
	}
	rep := msg.rep
	f.rep = &rep
	f.hole = rep.Hole
	return f, tea.Batch(h.say("flooding run of "+name+" → "+outcomeText(rep)), netCmd(f.req.flood.Case, rep, f.seq, f.latest))
}

// nextStage puts the run's next stage on the dashboard: the flooded
// compartment holding that stage's water (added weight), the rest as the
// dashboard has it; the end of a run whose levels met puts the space open
// to the sea. It is an ordinary change, undone by undo.
func (f floodPanel) nextStage(h host) (floodPanel, tea.Cmd) {
	if !f.hasStages() {
		return f, nil
	}
	n := len(f.rep.Stages)
	var st engine.FloodStage
	found := false
	for k := 0; k < n; k++ {
		st = f.rep.Stages[(f.stage+k)%n]
		if st.WaterM3 > 0 {
			f.stage = (f.stage + k + 1) % n
			found = true
			break
		}
	}
	if !found {
		return f, h.say("the run's stages hold no water: nothing to show")
	}
	ci := f.req.ci
	d := cloneDamage(f.damage)
	d[ci] = engine.SpaceState{Permeability: f.req.base[ci].Permeability, WaterM3: st.WaterM3}
	what := fmt.Sprintf("%s flooded to a level: %s stage of the flooding run, %s m³ held",
		f.v.Compartments[ci].Name, stageName(st.Fraction), num(st.WaterM3, 1))
	if st.Fraction >= 1 && f.rep.End == engine.FloodEqualised {
		// Once the levels have met, the space is open to the sea: the water
		// in it rises and falls with her as she heels (lost buoyancy), not a
		// weight of fixed volume.
		d[ci] = engine.SpaceState{Open: true, Permeability: f.req.base[ci].Permeability}
		what = fmt.Sprintf("%s open to the sea: the levels have met at the end of the flooding run", f.v.Compartments[ci].Name)
	}
	return f, h.change(d, what)
}

// stageName names a stage: "25 %", …, "end" for the final one.
func stageName(f float64) string {
	if f >= 1 {
		return "end"
	}
	return num(100*f, 0) + " %"
}

// baseChanged reports whether the dashboard's damage state d differs from
// the run's base in any compartment but the flooded one (whose water a
// stage may have set).
func (f floodPanel) baseChanged(d engine.Damage) bool {
	b := f.req.base
	if len(b) != len(d) {
		return true
	}
	for i := range d {
		if i == f.req.ci {
			if d[i].Permeability != b[i].Permeability {
				return true
			}
			continue
		}
		if d[i] != b[i] {
			return true
		}
	}
	return false
}

// outcomeText is a run's end in a sentence, its first words in capitals,
// for the panel and the log (report.FloodOutcome).
func outcomeText(r engine.FloodReport) string {
	head, rest := report.FloodOutcome(r)
	return strings.ToUpper(head) + rest
}
