package engine

import (
	"math"
	"strings"
)

// This file works out what a debrief says of a drill: how it ended, what
// each decision did (the drill played again without it), what the best
// response would have given, and when the crew first had the flooded
// compartments right. Each is a replay of the log, so it is exactly
// repeatable.

// DrillSetup is everything a drill is played from: its log is Events.
type DrillSetup struct {
	Vessel     *Vessel
	Base       Damage
	Events     []DrillEvent // scenario, crew and instructor events, in time order
	EndMin     float64
	Alarms     []int
	AlarmLevel float64
	// PumpM3h is the pumping capacity that can be put on each compartment
	// (index-aligned with Vessel.Compartments; the vessel file's), for the
	// best response.
	PumpM3h []float64
}

// Play runs the drill of s to its end.
func (s DrillSetup) Play() (*Drill, error) {
	d, err := NewDrill(s.Vessel, s.Base, s.Events, s.EndMin)
	if err != nil {
		return nil, err
	}
	if len(s.Alarms) > 0 {
		d.SetAlarms(s.Alarms, s.AlarmLevel)
	}
	d.AdvanceTo(s.EndMin)
	return d, nil
}

// DrillOutcome is how a drill ends.
type DrillOutcome struct {
	Lost        bool    // she sank or capsized
	LostMin     float64 // when (NaN if not lost)
	HeelDeg     float64 // at the end (NaN if lost)
	FreeboardM  float64 // least height of the deck edge above the water at the end (NaN if lost)
	WaterM3     float64 // sea water in the ship at the end
	DeckEdgeMin float64 // when the deck edge first went under (NaN: never in the drill)
}

// OutcomeOf reads the outcome of a played drill.
func OutcomeOf(d *Drill) DrillOutcome {
	o := DrillOutcome{LostMin: math.NaN(), HeelDeg: math.NaN(), FreeboardM: math.NaN(), DeckEdgeMin: math.NaN()}
	rows := d.Rows()
	for _, r := range rows {
		if r.Position == nil {
			continue
		}
		if math.IsNaN(o.DeckEdgeMin) && r.Position.DeckEdge.HeightM <= 0 {
			o.DeckEdgeMin = r.Minutes
		}
	}
	last := rows[len(rows)-1]
	if d.Lost() {
		o.Lost, o.LostMin = true, last.Minutes
		if math.IsNaN(o.DeckEdgeMin) {
			o.DeckEdgeMin = last.Minutes
		}
	}
	if last.Position != nil {
		o.HeelDeg = last.Position.HeelDeg
		o.FreeboardM = last.Position.DeckEdge.HeightM
	}
	for _, w := range last.WaterM3 {
		o.WaterM3 += w
	}
	return o
}

// DecisionEffect is one decision of the crew (or injection of the
// instructor) and the drill played without it.
type DecisionEffect struct {
	Event   DrillEvent
	Without DrillOutcome
}

// Identification is when the crew first marked a flooded compartment.
type Identification struct {
	Compartment int
	FloodedMin  float64 // when it first held water
	MarkedMin   float64 // when the crew first marked it flooded after that (NaN: never)
}

// DrillAnalysis is what the debrief reports.
type DrillAnalysis struct {
	Played   *Drill
	Actual   DrillOutcome
	NoAction DrillOutcome // the scenario's events only
	Best     DrillOutcome // the scenario's events and the best response
	// BestEvents is the best response: every pump the vessel file gives
	// started on each breached compartment the minute it is breached (and
	// again after a pump fails, at once), and every door and hatch shut at
	// the first breach and whenever the scenario opens one after it.
	BestEvents []DrillEvent
	Decisions  []DecisionEffect
	// AllRightMin is when the crew's marks first equalled the compartments
	// holding water (NaN: never).
	AllRightMin     float64
	Identifications []Identification
	// RightAtEnd says the crew's marks equalled the compartments holding
	// water at the end of the drill.
	RightAtEnd bool
}

// AnalyseDrill plays s and the drills the debrief compares it with.
func AnalyseDrill(s DrillSetup) (DrillAnalysis, error) {
	var a DrillAnalysis
	d, err := s.Play()
	if err != nil {
		return a, err
	}
	a.Played, a.Actual = d, OutcomeOf(d)
	var scenario []DrillEvent
	for _, e := range s.Events {
		if e.By == "" || e.By == ByScenario {
			scenario = append(scenario, e)
		}
	}
	play := func(ev []DrillEvent) DrillOutcome {
		t := s
		t.Events = ev
		pd, err := t.Play()
		if err != nil {
			return DrillOutcome{LostMin: math.NaN(), HeelDeg: math.NaN(), FreeboardM: math.NaN(), DeckEdgeMin: math.NaN(), WaterM3: math.NaN()}
		}
		return OutcomeOf(pd)
	}
	a.NoAction = play(scenario)
	a.BestEvents = bestResponse(s.Vessel, scenario, s.PumpM3h)
	a.Best = play(a.BestEvents)
	for k, e := range s.Events {
		if e.By != ByCrew && e.By != ByInstructor || !e.Physical() {
			continue
		}
		without := append(append([]DrillEvent(nil), s.Events[:k]...), s.Events[k+1:]...)
		a.Decisions = append(a.Decisions, DecisionEffect{Event: e, Without: play(without)})
	}
	a.AllRightMin, a.Identifications, a.RightAtEnd = identified(d)
	return a, nil
}

// bestResponse adds to the scenario's events every pump the vessel file
// gives on each breached compartment, started when it is breached and
// again whenever the scenario stops it; and shuts every door and hatch
// (never a cross-flooding fitting, a duct or a pipe) at the first breach
// and again at once whenever the scenario opens one after it.
func bestResponse(v *Vessel, scenario []DrillEvent, pumps []float64) []DrillEvent {
	var out []DrillEvent
	breached := false
	shut := func(m float64, name string) {
		out = append(out, DrillEvent{Minutes: m, Kind: DrillConnection, By: ByCrew, Compartment: -1, Name: name, Open: false})
	}
	open := map[string]bool{}
	for _, c := range v.Connections {
		open[c.Name] = c.Open
	}
	for _, e := range scenario {
		out = append(out, e)
		if e.Kind == DrillConnection {
			open[e.Name] = e.Open
			if breached && e.Open && isDoor(v, e.Name) {
				shut(e.Minutes, e.Name)
				open[e.Name] = false
			}
		}
		if e.Kind == DrillBreach && !breached {
			breached = true
			for _, c := range v.Connections {
				if open[c.Name] && isDoor(v, c.Name) {
					shut(e.Minutes, c.Name)
					open[c.Name] = false
				}
			}
		}
		i := e.Compartment
		if i < 0 || i >= len(pumps) || pumps[i] <= 0 {
			continue
		}
		if e.Kind == DrillBreach || (e.Kind == DrillPump && e.PumpM3h == 0) {
			out = append(out, DrillEvent{Minutes: e.Minutes, Kind: DrillPump, By: ByCrew, Compartment: i, PumpM3h: pumps[i]})
		}
	}
	return out
}

// isDoor reports whether the connection called name is a door or a hatch.
func isDoor(v *Vessel, name string) bool {
	k := connectionIndex(v, name)
	return k >= 0 && (v.Connections[k].Kind == "door" || v.Connections[k].Kind == "hatch")
}

// identified compares the crew's marks with the truth along the drill.
func identified(d *Drill) (float64, []Identification, bool) {
	v := d.Vessel()
	marks := map[int]bool{}
	log := d.Log()
	li := 0
	allRight := math.NaN()
	ids := map[int]*Identification{}
	var order []int
	same := false
	for _, r := range d.Rows() {
		for li < len(log) && log[li].Minutes <= r.Minutes+1e-9 {
			if e := log[li]; e.Kind == DrillMark {
				marks[e.Compartment] = e.Flooded
			}
			li++
		}
		truth := map[int]bool{}
		for _, n := range r.Flooded {
			for i, c := range v.Compartments {
				if strings.EqualFold(c.Name, n) {
					truth[i] = true
					if ids[i] == nil {
						ids[i] = &Identification{Compartment: i, FloodedMin: r.Minutes, MarkedMin: math.NaN()}
						order = append(order, i)
					}
				}
			}
		}
		for i, id := range ids {
			if math.IsNaN(id.MarkedMin) && marks[i] {
				id.MarkedMin = r.Minutes
			}
		}
		same = true
		for i := range v.Compartments {
			same = same && truth[i] == marks[i]
		}
		if math.IsNaN(allRight) && len(truth) > 0 && same {
			allRight = r.Minutes
		}
	}
	var out []Identification
	for _, i := range order {
		out = append(out, *ids[i])
	}
	return allRight, out, same
}
