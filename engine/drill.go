package engine

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"
)

// This file runs the truth of an exercise in scenario time: the flooding
// run through the ship (NetworkRun: holes, openings that go under,
// connections, pumps) from one event that changes the ship to the next.
// Events come at their minutes; the crew's decisions and the instructor's
// injections come as events too, at the moment they are made, so that a
// drill replays from its log.

// DrillRow is one row of a drill's timeline: the truth at a moment.
type DrillRow struct {
	Minutes  float64
	Event    string    // "" for a row at a whole minute; else the event's label
	Position *Position // nil when she has no floating position
	NoEq     *NoEquilibrium
	WaterM3  []float64 // index-aligned with Vessel.Compartments
	Flooded  []string  // compartments holding sea water, in the vessel's order
}

// Drill is the truth of an exercise in progress. Make it with NewDrill,
// move it on with AdvanceTo, add decisions with Apply.
//
// # Physics
//
// Between two events that change the ship (a breach, a pump started or
// stopped, a connection opened or closed, a sea inlet opened or shut) the
// truth is a flooding run through the ship (NetworkRun: the orifice law
// with both levels through every hole, opening and open connection, the
// pumps, the ship re-solved at every evaluation) from the water held at
// the event. At the next such event the run is stopped there, its water
// carried over, and a new run started with the ship as she now is. A tank
// holed with contents starts with them in, counted as sea water of the
// same mass, as in FloodRun.
//
// Between events the run's own integrator sets the steps (Rosenbrock 2(3),
// relative 1e-5); the state at a whole minute or an event inside a step is
// the step's interpolant, the ship solved there. A drill played from its
// log stops each run exactly at each event, so it gives the same path to
// the integrator's tolerance as the drill played live. When she sinks or
// capsizes the drill ends there.
type Drill struct {
	v      *Vessel // with the connections as the events have set them
	base   Damage
	endMin float64
	events []DrillEvent // scheduled, in time order
	next   int
	log    []DrillEvent // every event applied, in order

	t     float64   // s
	water []float64 // m³ of sea water per compartment (a tank's contents as water once holed)
	wet   []bool    // holed once, or sea water has come in
	holes [][]Hole
	inlet []*Hole   // a sea inlet opened to counter-flood, per compartment
	pumps []float64 // m³/h per compartment

	seg   *NetworkRun // the run since the last physical event; nil: nothing flows
	segT0 float64     // s, when it started

	pos  *Position
	noEq *NoEquilibrium
	rows []DrillRow
	lost bool

	alarmAt float64
	alarmOn map[int]bool // fitted → sounded
	alarms  []DrillAlarm
}

// NewDrill starts a drill of v from the condition base (nil: intact) with
// the scheduled events (sorted here by minutes, stable), lasting endMin
// minutes. It fails on an event it cannot apply.
func NewDrill(v *Vessel, base Damage, events []DrillEvent, endMin float64) (*Drill, error) {
	if v == nil {
		return nil, errors.New("drill: no vessel")
	}
	if !(endMin > 0) || math.IsInf(endMin, 0) {
		return nil, fmt.Errorf("drill: length %v min: must be a positive finite number", endMin)
	}
	n := len(v.Compartments)
	b := make(Damage, n)
	copy(b, base)
	if err := CheckDamage(v, b); err != nil {
		return nil, fmt.Errorf("drill: %w", err)
	}
	ev := append([]DrillEvent(nil), events...)
	sort.SliceStable(ev, func(i, j int) bool { return ev[i].Minutes < ev[j].Minutes })
	for _, e := range ev {
		if err := checkDrillEvent(v, e, endMin); err != nil {
			return nil, err
		}
	}
	w := *v
	w.Connections = append([]Connection(nil), v.Connections...)
	d := &Drill{v: &w, base: b, endMin: endMin, events: ev,
		water: make([]float64, n), wet: make([]bool, n),
		holes: make([][]Hole, n), inlet: make([]*Hole, n), pumps: make([]float64, n)}
	for i, s := range b {
		if s.WaterM3 > 0 {
			d.water[i], d.wet[i] = s.WaterM3, true
		}
	}
	d.restart()
	d.record("")
	d.applyDue()
	return d, nil
}

func checkDrillEvent(v *Vessel, e DrillEvent, endMin float64) error {
	if !(e.Minutes >= 0 && e.Minutes <= endMin) {
		return fmt.Errorf("drill: event %s at %v min: outside the drill's 0…%g min", e.Kind, e.Minutes, endMin)
	}
	needComp := e.Kind == DrillBreach || e.Kind == DrillPump || e.Kind == DrillMark || e.Kind == DrillCounterflood
	if needComp && (e.Compartment < 0 || e.Compartment >= len(v.Compartments)) {
		return fmt.Errorf("drill: event %s at %v min: no compartment %d", e.Kind, e.Minutes, e.Compartment)
	}
	switch e.Kind {
	case DrillBreach, DrillCounterflood:
		if e.Kind == DrillCounterflood && !e.Open {
			break
		}
		h := e.Hole
		if !(h.AreaM2 > 0) || math.IsInf(h.AreaM2, 0) || !(h.Cd > 0 && h.Cd <= 1) {
			return fmt.Errorf("drill: %s at %v min: hole area %v m² and C_d %v must be positive (C_d at most 1)", e.Kind, e.Minutes, h.AreaM2, h.Cd)
		}
	case DrillPump:
		if !(e.PumpM3h >= 0) || math.IsInf(e.PumpM3h, 0) {
			return fmt.Errorf("drill: pump at %v min: capacity %v m³/h must be a finite number, zero or more", e.Minutes, e.PumpM3h)
		}
	case DrillConnection:
		if connectionIndex(v, e.Name) < 0 {
			return fmt.Errorf("drill: connection at %v min: the vessel has no connection %q", e.Minutes, e.Name)
		}
	case DrillNote, DrillReport, DrillMark:
	default:
		return fmt.Errorf("drill: event of unknown kind %d", e.Kind)
	}
	return nil
}

func connectionIndex(v *Vessel, name string) int {
	for i, c := range v.Connections {
		if strings.EqualFold(c.Name, name) {
			return i
		}
	}
	return -1
}

// Vessel returns the drill's vessel, its connections as the events have
// set them.
func (d *Drill) Vessel() *Vessel { return d.v }

// Minutes returns the scenario time now.
func (d *Drill) Minutes() float64 { return d.t / 60 }

// EndMinutes returns the drill's length.
func (d *Drill) EndMinutes() float64 { return d.endMin }

// Over reports whether the drill has reached its end or she is lost.
func (d *Drill) Over() bool { return d.lost || d.t >= d.endMin*60*(1-1e-12) }

// Lost reports whether she sank or capsized (no floating position).
func (d *Drill) Lost() bool { return d.lost }

// Now returns the truth at this moment.
func (d *Drill) Now() DrillRow { return d.row("") }

// Rows returns the timeline so far.
func (d *Drill) Rows() []DrillRow { return d.rows }

// Log returns every event applied so far, scheduled or not, in the order
// applied.
func (d *Drill) Log() []DrillEvent { return append([]DrillEvent(nil), d.log...) }

// Apply applies e now (its Minutes is set to the present): a crew's
// decision or an instructor's injection. A drill that is over takes none.
func (d *Drill) Apply(e DrillEvent) error {
	if d.Over() {
		return errors.New("drill: it is over")
	}
	e.Minutes = d.Minutes()
	if err := checkDrillEvent(d.v, e, d.endMin); err != nil {
		return err
	}
	d.apply(e)
	return nil
}

// AdvanceTo moves the drill on to scenario minute m (at most its end),
// applying the scheduled events at their minutes and recording a row at
// every whole minute and at every event. It stops early if she is lost.
func (d *Drill) AdvanceTo(m float64) {
	target := math.Min(m, d.endMin) * 60
	for !d.lost && d.t < target-1e-9 {
		stop := target
		if d.next < len(d.events) {
			stop = math.Min(stop, d.events[d.next].Minutes*60)
		}
		nextMin := (math.Floor(d.t/60+1e-9) + 1) * 60
		stop = math.Min(stop, nextMin)
		d.moveTo(stop)
		if d.lost {
			return
		}
		if math.Abs(d.t-math.Round(d.t/60)*60) < 1e-6 {
			d.t = math.Round(d.t/60) * 60
			d.record("")
		}
		d.applyDue()
	}
}

// applyDue applies the scheduled events whose minute has come.
func (d *Drill) applyDue() {
	for d.next < len(d.events) && d.events[d.next].Minutes*60 <= d.t+1e-6 {
		d.apply(d.events[d.next])
		d.next++
	}
}

func (d *Drill) apply(e DrillEvent) {
	if e.By == "" {
		e.By = ByScenario
	}
	i := e.Compartment
	switch e.Kind {
	case DrillCounterflood:
		d.inlet[i] = nil
		if e.Open {
			h := e.Hole
			d.inlet[i] = &h
			d.holed(i)
		}
	case DrillBreach:
		d.holes[i] = append(d.holes[i], e.Hole)
		d.holed(i)
	case DrillPump:
		d.pumps[i] = e.PumpM3h
	case DrillConnection:
		if k := connectionIndex(d.v, e.Name); k >= 0 {
			d.v.Connections[k].Open = e.Open
		}
	}
	d.log = append(d.log, e)
	if e.Physical() {
		d.restart()
	}
	d.record(e.Label(d.v))
}

// holed marks compartment i holed: a tank's contents count from now as
// sea water of the same mass (as in FloodRun and NetworkRun).
func (d *Drill) holed(i int) {
	if d.wet[i] {
		return
	}
	d.wet[i] = true
	if m := d.v.tanks[i].massT; m > 0 {
		d.water[i] = math.Min(m/d.v.WaterDensity, d.capacity(i))
	}
}

func (d *Drill) mu(i int) float64       { return d.v.Permeability(d.base, i) }
func (d *Drill) capacity(i int) float64 { return d.mu(i) * d.v.Compartments[i].solid.Volume() }

// restart starts the flooding run anew from the state now (after an event
// that changes the ship), or solves the ship where nothing can flow.
func (d *Drill) restart() {
	if d.lost {
		return
	}
	base := append(Damage(nil), d.base...)
	for i := range base {
		if d.wet[i] {
			base[i].WaterM3 = math.Max(d.water[i], 0)
			if base[i].WaterM3 == 0 {
				// Holed but dry: held as a trace, so that a tank's
				// contents count as sea water (as FloodRun's floor).
				base[i].WaterM3 = floodFloorFrac * d.capacity(i)
			}
		}
	}
	var holes []NetHole
	for i := range d.holes {
		for _, h := range d.holes[i] {
			holes = append(holes, NetHole{Compartment: i, Hole: h})
		}
		if d.inlet[i] != nil {
			holes = append(holes, NetHole{Compartment: i, Hole: *d.inlet[i]})
		}
	}
	d.seg = nil
	if len(holes) > 0 || anyPositive(base) {
		reach := map[int]bool{}
		for _, k := range networkNodes(d.v, base, holes) {
			reach[k] = true
		}
		var pumps []NetPump
		for i, q := range d.pumps {
			if q > 0 && reach[i] {
				pumps = append(pumps, NetPump{Compartment: i, CapacityM3h: q})
			}
		}
		limit := math.Max(d.endMin*60-d.t, 1)
		r, err := NewNetworkRun(NetworkCase{Vessel: d.v, Base: base, Holes: holes, Pumps: pumps, LimitS: limit})
		if err == nil {
			d.seg, d.segT0 = r, d.t
			d.take(r.evals[0], r.start)
			if r.end == FloodSinks || r.end == FloodCapsizes || r.end == FloodFailed {
				d.fail(r.endNoEq)
			}
			return
		}
	}
	pos, err := NewProblem(d.v, base).Equilibrium()
	if err != nil {
		d.fail(asNoEquilibrium(err))
		return
	}
	d.pos, d.noEq = &pos, nil
}

func anyPositive(d Damage) bool {
	for _, s := range d {
		if s.WaterM3 > 0 {
			return true
		}
	}
	return false
}

// take sets the state from an evaluation of the run (its volumes per node;
// start, the volumes the run began with).
func (d *Drill) take(e netEval, start []float64) {
	r := d.seg
	for k, i := range r.nodes {
		d.water[i] = e.w[k]
		if e.w[k] > start[k]+1e-6*r.cap[k] {
			d.wet[i] = true
		}
	}
	if e.ok() {
		p := e.pos
		d.pos, d.noEq = &p, nil
	}
}

// moveTo moves the run on to time stop (s), sounding the alarms at every
// accepted step on the way.
func (d *Drill) moveTo(stop float64) {
	r := d.seg
	if r == nil {
		d.t = stop
		return
	}
	for r.end == FloodRunning && d.segT0+r.st.t < stop-1e-9 {
		r.Step()
		if n := len(r.recs); n > 0 && r.end == FloodRunning {
			if t1 := d.segT0 + r.recs[n-1].t1; t1 <= stop+1e-9 {
				d.t = t1
				d.take(r.evals[len(r.evals)-1], r.start)
				d.sound()
			}
		}
	}
	if r.end == FloodSinks || r.end == FloodCapsizes || r.end == FloodFailed {
		if d.segT0+r.endS <= stop+1e-9 {
			d.t = d.segT0 + r.endS
			d.fail(r.endNoEq)
			return
		}
	}
	y, _, _ := r.stateAt(stop - d.segT0)
	g, hg := r.guess, r.haveG
	e := r.eval(y)
	r.guess, r.haveG = g, hg
	d.t = stop
	if !e.ok() {
		d.fail(e.noEq)
		return
	}
	d.take(e, r.start)
	d.sound()
}

func (d *Drill) fail(ne *NoEquilibrium) {
	if ne == nil {
		ne = &NoEquilibrium{Outcome: NotConverged, Reason: "the flooding run found no answer"}
	}
	d.pos, d.noEq, d.lost = nil, ne, true
	d.record("end " + ne.Outcome.String())
}

// row returns the truth now as a timeline row.
func (d *Drill) row(event string) DrillRow {
	r := DrillRow{Minutes: d.t / 60, Event: event, NoEq: d.noEq, WaterM3: make([]float64, len(d.water))}
	if d.pos != nil {
		p := *d.pos
		r.Position = &p
	}
	for i, w := range d.water {
		if !d.wet[i] {
			continue
		}
		r.WaterM3[i] = w
		if w > 1e-6*d.capacity(i) {
			r.Flooded = append(r.Flooded, d.v.Compartments[i].Name)
		}
	}
	return r
}

func (d *Drill) record(event string) { d.rows = append(d.rows, d.row(event)) }
