package engine

import (
	"errors"
	"fmt"
	"math"
	"sort"
)

// This file runs the truth of an exercise in scenario time: the water in
// every compartment the sea reaches through the holes the events make,
// against the pumps the events start and stop, with the ship re-solved at
// every evaluation. Events come at their minutes; the crew's decisions and
// the instructor's injections come as events too, at the moment they are
// made, so that a drill replays exactly from its log.

// Tolerances of the drill's integrator (Bogacki–Shampine 3(2), error
// control on every compartment's water).
const (
	drillRelTol = 1e-7
	drillAbsTol = 1e-7 // of each compartment's capacity
	drillMaxDtS = 30.0 // s: the longest step, so that a minute holds at least two
	drillMinDtS = 0.5  // s: a step whose solve fails below this is the answer
)

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
// Each compartment holds a volume of sea water W_i. Each hole into it
// lets water in by Torricelli's law as in FloodRun, Q = C_d·a·√(2g|h|)·sign(h),
// h = max(d_sea, 0) − max(d_in, 0) at the hole along the true vertical; the
// pumps on it take out their capacity, never water that is not there; W_i
// stays in [0, μ·V_i]. The ship is solved with every W_i held as an added
// weight (free surface level with the sea's attitude), warm-started.
//
// A compartment whose every hole has come within 1 mm of head
// (FloodHeadTolM) with no pump running is equalised: from then on it is
// open to the sea (lost buoyancy, its permeability), which is the state
// equalisation reaches and follows the sea as the ship moves. When a pump
// is started on it again, its water is taken as μ × its volume below the
// sea at that moment and it is followed as a volume once more.
//
// A tank holed with contents starts with them in, counted as sea water of
// the same mass, as in FloodRun.
//
// # Integration
//
// Bogacki–Shampine 3(2) with error control (relative 1e-7, absolute 1e-7
// of each compartment's capacity), steps of at most 30 s, landing exactly
// on every event and every whole minute. A step whose solve fails is
// halved; below 0.5 s the failure is the answer (she sinks or capsizes)
// and the drill ends there. Deterministic: the same events give the same
// timeline.
type Drill struct {
	v      *Vessel
	base   Damage
	endMin float64
	events []DrillEvent // scheduled, in time order
	next   int
	log    []DrillEvent // every event applied, in order

	t      float64   // s
	water  []float64 // m³ per compartment
	inPlay []bool    // holed once, or holding water
	open   []bool    // equalised: open to the sea
	holes  [][]Hole
	pumps  []float64 // m³/s per compartment
	conns  map[string]bool

	warm warmStart
	pos  *Position
	noEq *NoEquilibrium
	dt   float64
	rows []DrillRow
	lost bool

	equalisedAny bool // set by equalise: the state changed, the slope must be taken anew

	alarmAt float64
	alarmOn map[int]bool // fitted → sounded
	alarms  []DrillAlarm
}

// NewDrill starts a drill of v from the intact condition base (nil:
// intact) with the scheduled events (sorted here by minutes, stable),
// lasting endMin minutes. It fails on an event it cannot apply.
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
	d := &Drill{v: v, base: b, endMin: endMin, events: ev,
		water: make([]float64, n), inPlay: make([]bool, n), open: make([]bool, n),
		holes: make([][]Hole, n), pumps: make([]float64, n), conns: map[string]bool{}, dt: 5}
	for i, s := range b {
		if s.WaterM3 > 0 {
			d.water[i], d.inPlay[i] = s.WaterM3, true
		}
	}
	d.resolve()
	d.record("")
	d.applyDue()
	return d, nil
}

func checkDrillEvent(v *Vessel, e DrillEvent, endMin float64) error {
	if !(e.Minutes >= 0 && e.Minutes <= endMin) {
		return fmt.Errorf("drill: event %s at %v min: outside the drill's 0…%g min", e.Kind, e.Minutes, endMin)
	}
	needComp := e.Kind == DrillBreach || e.Kind == DrillPump || e.Kind == DrillMark
	if needComp && (e.Compartment < 0 || e.Compartment >= len(v.Compartments)) {
		return fmt.Errorf("drill: event %s at %v min: no compartment %d", e.Kind, e.Minutes, e.Compartment)
	}
	switch e.Kind {
	case DrillBreach:
		h := e.Hole
		if !(h.AreaM2 > 0) || math.IsInf(h.AreaM2, 0) || !(h.Cd > 0 && h.Cd <= 1) {
			return fmt.Errorf("drill: breach at %v min: hole area %v m² and C_d %v must be positive (C_d at most 1)", e.Minutes, h.AreaM2, h.Cd)
		}
	case DrillPump:
		if !(e.PumpM3h >= 0) || math.IsInf(e.PumpM3h, 0) {
			return fmt.Errorf("drill: pump at %v min: capacity %v m³/h must be a finite number, zero or more", e.Minutes, e.PumpM3h)
		}
	case DrillConnection, DrillNote, DrillReport, DrillMark:
	default:
		return fmt.Errorf("drill: event of unknown kind %d", e.Kind)
	}
	return nil
}

// Vessel returns the drill's vessel.
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
		d.integrate(stop)
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
	case DrillBreach:
		d.holes[i] = append(d.holes[i], e.Hole)
		if !d.inPlay[i] {
			d.inPlay[i] = true
			if m := d.v.tanks[i].massT; m > 0 && d.water[i] == 0 {
				d.water[i] = math.Min(m/d.v.WaterDensity, d.capacity(i))
			}
		}
	case DrillPump:
		d.pumps[i] = e.PumpM3h / 3600
		if d.open[i] && d.pumps[i] > 0 {
			d.open[i] = false
			if d.pos != nil {
				d.water[i] = d.mu(i) * d.v.Compartments[i].solid.Below(d.pos.Plane).V
			}
		}
	case DrillConnection:
		d.conns[e.Name] = e.Open
	}
	d.log = append(d.log, e)
	if e.Physical() {
		d.resolve()
	}
	d.record(e.Label(d.v))
}

func (d *Drill) mu(i int) float64       { return d.v.Permeability(d.base, i) }
func (d *Drill) capacity(i int) float64 { return d.mu(i) * d.v.Compartments[i].solid.Volume() }

// damage returns the state with water w.
func (d *Drill) damage(w []float64) Damage {
	dm := append(Damage(nil), d.base...)
	for i := range dm {
		switch {
		case d.open[i]:
			dm[i].Open, dm[i].WaterM3 = true, 0
		case d.inPlay[i]:
			dm[i].WaterM3 = math.Max(w[i], floodFloorFrac*d.capacity(i))
		}
	}
	return dm
}

// drillEval is the state at one set of volumes.
type drillEval struct {
	pos   Position
	noEq  *NoEquilibrium
	rate  []float64 // dW/dt, m³/s
	heads [][]float64
}

func (d *Drill) eval(w []float64) drillEval {
	n := len(w)
	e := drillEval{rate: make([]float64, n), heads: make([][]float64, n)}
	pos, noEq := d.warm.solve(d.v, d.damage(w))
	if noEq != nil {
		e.noEq = noEq
		return e
	}
	e.pos = pos
	p := pos.Plane
	for i := range w {
		if d.open[i] || !d.inPlay[i] {
			continue
		}
		c := d.v.Compartments[i]
		wi := math.Max(0, math.Min(w[i], d.capacity(i)))
		wm := math.Min(math.Max(wi, floodFloorFrac*d.capacity(i))/d.mu(i), c.solid.Volume()*(1-1e-9))
		pin, _ := levelForVolume(c.solid, wm, p.B, p.C)
		var q float64
		for _, h := range d.holes[i] {
			dSea := -p.Height(h.XM, h.YM, h.ZM)
			dIn := -pin.Height(h.XM, h.YM, h.ZM)
			if wi <= 0 {
				dIn = math.Min(dIn, 0)
			}
			head := math.Max(dSea, 0) - math.Max(dIn, 0)
			e.heads[i] = append(e.heads[i], head)
			qi := math.Copysign(h.Cd*h.AreaM2*math.Sqrt(2*StandardGravity*math.Abs(head)), head)
			if wi <= 0 && qi < 0 {
				qi = 0
			}
			q += qi
		}
		r := q - d.pumps[i]
		if wi <= 0 && r < 0 {
			r = 0
		}
		if wi >= d.capacity(i) && r > 0 {
			r = 0
		}
		e.rate[i] = r
	}
	return e
}

// resolve solves the ship as she is now.
func (d *Drill) resolve() {
	e := d.eval(d.water)
	if e.ok() {
		p := e.pos
		d.pos, d.noEq = &p, nil
	} else {
		d.pos, d.noEq = nil, e.noEq
		d.lost = true
		d.record("end " + e.noEq.Outcome.String())
	}
}

func (e *drillEval) ok() bool { return e.noEq == nil }

// Bogacki–Shampine 3(2) (Bogacki & Shampine 1989).
var (
	bsA = [4][3]float64{{}, {1.0 / 2}, {0, 3.0 / 4}, {2.0 / 9, 1.0 / 3, 4.0 / 9}}
	// bsE is the third-order weights minus the second-order ones.
	bsE = [4]float64{2.0/9 - 7.0/24, 1.0/3 - 1.0/4, 4.0/9 - 1.0/3, -1.0 / 8}
)

// integrate moves the water on from d.t to stop (s).
func (d *Drill) integrate(stop float64) {
	n := len(d.water)
	active := false
	for i := range d.water {
		active = active || (d.inPlay[i] && !d.open[i])
	}
	if !active {
		d.t = stop
		return
	}
	e0 := d.eval(d.water)
	if !e0.ok() {
		d.fail(e0.noEq)
		return
	}
	for d.t < stop-1e-9 {
		h := math.Min(math.Min(d.dt, drillMaxDtS), stop-d.t)
		k := [4][]float64{e0.rate}
		var e drillEval
		y := make([]float64, n)
		bad := false
		for s := 1; s < 4 && !bad; s++ {
			for i := range y {
				y[i] = d.water[i]
				for j := 0; j < s; j++ {
					y[i] += h * bsA[s][j] * k[j][i]
				}
				y[i] = math.Max(0, math.Min(y[i], d.capacity(i)))
			}
			e = d.eval(y)
			if !e.ok() {
				bad = true
				break
			}
			k[s] = e.rate
		}
		if bad {
			if h <= drillMinDtS {
				d.t += h
				d.fail(e.noEq)
				return
			}
			d.dt = h / 2
			continue
		}
		errN := 0.0
		for i := range y {
			if !d.inPlay[i] || d.open[i] {
				continue
			}
			var est float64
			for s := 0; s < 4; s++ {
				est += h * bsE[s] * k[s][i]
			}
			sc := drillAbsTol*d.capacity(i) + drillRelTol*math.Abs(y[i])
			errN = math.Max(errN, math.Abs(est)/sc)
		}
		if errN > 1 && h > drillMinDtS {
			d.dt = h * math.Max(0.2, 0.9*math.Pow(errN, -1.0/3))
			continue
		}
		copy(d.water, y)
		d.t += h
		if errN > 0 {
			d.dt = h * math.Min(5, 0.9*math.Pow(errN, -1.0/3))
		} else {
			d.dt = h * 5
		}
		p := e.pos
		d.pos, d.noEq = &p, nil
		d.equalise(e)
		d.sound()
		e0 = e
		if d.equalisedAny {
			d.equalisedAny = false
			e0 = d.eval(d.water)
			if !e0.ok() {
				d.fail(e0.noEq)
				return
			}
		}
	}
}

// equalise marks compartments whose holes are all within 1 mm of head,
// with no pump running, as open to the sea.
func (d *Drill) equalise(e drillEval) {
	for i := range d.water {
		if !d.inPlay[i] || d.open[i] || d.pumps[i] > 0 || len(d.holes[i]) == 0 {
			continue
		}
		ok := true
		wet := false
		for _, h := range e.heads[i] {
			ok = ok && math.Abs(h) <= FloodHeadTolM
		}
		for _, h := range d.holes[i] {
			wet = wet || -e.pos.Plane.Height(h.XM, h.YM, h.ZM) > 0
		}
		if ok && wet && d.water[i] > 0 {
			d.open[i] = true
			d.equalisedAny = true
		}
	}
}

func (d *Drill) fail(ne *NoEquilibrium) {
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
	for i := range d.water {
		w := d.water[i]
		if d.open[i] && d.pos != nil {
			w = d.mu(i) * d.v.Compartments[i].solid.Below(d.pos.Plane).V
		}
		if !d.inPlay[i] && !d.open[i] {
			w = 0
		}
		r.WaterM3[i] = w
		if (d.inPlay[i] && w > 0) || d.open[i] {
			r.Flooded = append(r.Flooded, d.v.Compartments[i].Name)
		}
	}
	return r
}

func (d *Drill) record(event string) { d.rows = append(d.rows, d.row(event)) }
