package tui

import (
	"fmt"
	"math"
	"strings"
	"sync/atomic"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/report"
)

// This file follows the dashboard's flooding run through the ship: once
// the compartment's own run has ended, when water can go on from it (an
// open connection, or an opening that leads into a compartment went
// under), the network run (engine.RunNetwork) follows every compartment
// the water reaches, and the run's plot shows each compartment's water
// against time in place of the one compartment's.

// netDoneMsg is a network run's report.
type netDoneMsg struct {
	seq   int
	rep   engine.NetworkReport
	stale bool
	err   string
}

// netCmd runs the network case of the run c (single is its own report),
// or returns nil when the water can go nowhere beyond the compartment.
func netCmd(c engine.FloodCase, single engine.FloodReport, seq int, latest *atomic.Int64) tea.Cmd {
	spreads := len(engine.ConnectedTo(c.Vessel, c.Base, c.Compartment)) > 0
	for _, e := range single.Events {
		for _, o := range c.Vessel.Openings {
			spreads = spreads || (e.Kind == engine.OpeningReached && o.Name == e.Name && o.LeadsTo != "")
		}
	}
	if !spreads {
		return nil
	}
	nc := engine.NetworkCase{Vessel: c.Vessel, Base: c.Base, Holes: []engine.NetHole{{Compartment: c.Compartment, Hole: c.Hole}}, LimitS: c.LimitS}
	for _, p := range c.Pumps {
		nc.Pumps = append(nc.Pumps, engine.NetPump{Compartment: c.Compartment, CapacityM3h: p.CapacityM3h})
	}
	return newest(seq, latest,
		func() tea.Msg { return netDoneMsg{seq: seq, stale: true} },
		func(why string) tea.Msg { return netDoneMsg{seq: seq, err: "engine failure: " + why} },
		func() tea.Msg {
			rep, err := engine.RunNetwork(nc, nil)
			if err != nil {
				return netDoneMsg{seq: seq, err: err.Error()}
			}
			return netDoneMsg{seq: seq, rep: rep}
		})
}

// takeNet keeps the newest network run and logs how it ended.
func (f floodPanel) takeNet(msg netDoneMsg, h host) (floodPanel, tea.Cmd) {
	if msg.stale || msg.seq != f.seq {
		return f, nil
	}
	if msg.err != "" {
		return f, h.say("flooding run through the ship failed: " + msg.err)
	}
	rep := msg.rep
	f.net = &rep
	var names []string
	for _, c := range rep.Compartments {
		if !math.IsNaN(c.FirstWaterS) {
			names = append(names, c.Name)
		}
	}
	line := fmt.Sprintf("through the ship: %s after %s, water in %s", strings.ToUpper(report.FloodHeadline(rep.End)),
		report.Duration(rep.EndS), strings.Join(names, ", "))
	for _, c := range rep.CrossFlooding {
		if !math.IsNaN(c.EqualiseS) {
			line += fmt.Sprintf("; %s equalises in %s, %s", c.Name, report.Duration(c.EqualiseS), engine.CrossFloodingVerdict(c.EqualiseS))
		}
	}
	return f, h.say(line)
}

// netPlot draws the water in each compartment the run through the ship
// reached against time, one letter per compartment, with the legend.
func (p floodPanel) netPlot(w, h int) []string {
	st := p.st
	r := p.net
	var keep []int
	for k, c := range r.Compartments {
		if !math.IsNaN(c.FirstWaterS) {
			keep = append(keep, k)
		}
	}
	lines := []string{st.Heading.Render(clip("WATER IN EACH COMPARTMENT, THROUGH THE SHIP", w))}
	for n, k := range keep {
		c := r.Compartments[k]
		lines = append(lines, clip(fmt.Sprintf("%c %s %s m³", 'A'+rune(n%26), c.Name, num(c.WaterM3, 1)), w))
	}
	for _, c := range r.CrossFlooding {
		if !math.IsNaN(c.EqualiseS) {
			lines = append(lines, clip(fmt.Sprintf("%s: %s, %s", c.Name, report.Duration(c.EqualiseS), engine.CrossFloodingVerdict(c.EqualiseS)), w))
		}
	}
	cw, ch := w-8, h-len(lines)-1
	if cw < 10 || ch < 3 || len(r.Trace) == 0 {
		return fit(lines, w, h)
	}
	T := math.Max(r.Trace[len(r.Trace)-1].TimeS, 1)
	wmax := 0.0
	for _, s := range r.Trace {
		for _, k := range keep {
			wmax = math.Max(wmax, s.WaterM3[k])
		}
	}
	wmax = math.Max(wmax, 1e-9)
	grid := make([][]rune, ch)
	for y := range grid {
		grid[y] = []rune(strings.Repeat(" ", cw))
	}
	for x := 0; x < cw; x++ {
		t := T * float64(x) / float64(cw-1)
		// The last sample at or before t.
		i := 0
		for i+1 < len(r.Trace) && r.Trace[i+1].TimeS <= t {
			i++
		}
		for n, k := range keep {
			y := ch - 1 - int(math.Round(r.Trace[i].WaterM3[k]/wmax*float64(ch-1)))
			if y >= 0 && y < ch {
				grid[y][x] = 'A' + rune(n%26)
			}
		}
	}
	scale, unit := timeUnit(T)
	for y := range grid {
		label := "      "
		if y == 0 {
			label = fmt.Sprintf("%6s", num(wmax, 0))
		}
		lines = append(lines, st.Dim.Render(label+"│")+string(grid[y]))
	}
	lines = append(lines, st.Dim.Render(clip(fmt.Sprintf("m³    └ 0 … %s %s since the hole was made", num(T/scale, 0), unit), w)))
	return fit(lines, w, h)
}

// spreadBeyond reports whether the run through the ship took water into
// more than the holed space: the single run above it, which keeps every
// connection shut, then ends elsewhere than the ship does.
func (p floodPanel) spreadBeyond() bool {
	if p.net == nil {
		return false
	}
	n := 0
	for _, c := range p.net.Compartments {
		if !math.IsNaN(c.FirstWaterS) {
			n++
		}
	}
	return n > 1
}
