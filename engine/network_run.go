package engine

import (
	"errors"
	"fmt"
	"math"
	"sort"
)

// This file runs flooding through the ship over time: the water in each
// compartment the sea can reach is a state; the sea enters through the
// holes and the openings that go under, and water moves between
// compartments through the open connections, each way by the orifice law
// with both levels (pathFlow), at the actual heel and trim, against the
// pumps; the ship is re-solved with all the water held at every
// evaluation.

// Tolerances of the network run's integrator (second order: looser than
// the single compartment's fifth-order run).
const (
	networkRelTol = 1e-5
	networkAbsTol = 1e-5 // of each compartment's capacity
)

// NetEventKind names what happened at a NetEvent.
type NetEventKind int

const (
	NetFirstWater   NetEventKind = iota + 1 // water first enters a compartment
	NetFull                                 // a compartment is full
	NetEqualised                            // nothing more flows in or out of a compartment
	NetDeckEdge                             // the deck edge goes under
	NetOpening                              // an opening that is not weathertight goes under
	NetCrossFlooded                         // a cross-flooding fitting has equalised
	NetEnds                                 // the run ends
)

func (k NetEventKind) String() string {
	switch k {
	case NetFirstWater:
		return "first-water"
	case NetFull:
		return "full"
	case NetEqualised:
		return "equalised"
	case NetDeckEdge:
		return "deck-edge"
	case NetOpening:
		return "opening"
	case NetCrossFlooded:
		return "cross-flooding"
	case NetEnds:
		return "end"
	}
	return "unknown"
}

// NetEvent is one moment of a network run.
type NetEvent struct {
	Kind    NetEventKind
	Name    string // the compartment's, opening's or connection's name; the FloodEnd for NetEnds
	TimeS   float64
	Message string
}

// NetCompartment is one compartment the water can reach, over the run.
type NetCompartment struct {
	Index       int // into Vessel.Compartments
	Name        string
	CapacityM3  float64 // μ × its volume
	StartM3     float64 // water in at the start (a tank's contents as sea water)
	WaterM3     float64 // at the end
	FirstWaterS float64 // when water first came in; 0 if in from the start; NaN if never
	FullS       float64 // when it was full; NaN if never
	EqualisedS  float64 // when nothing more flowed in or out (the last time it came to rest); NaN if never
}

// NetSample is the state at one moment.
type NetSample struct {
	TimeS    float64
	WaterM3  []float64 // index-aligned with NetworkReport.Compartments
	FlowM3h  []float64 // through each path (NetworkReport.Paths), from its first side to its second
	SeaInM3  float64   // through the holes and openings from the start
	PumpedM3 float64   // by the pumps from the start
	Position *Position
	NoEq     *NoEquilibrium
	Event    string
}

// NetPath names one way water moves in the run.
type NetPath struct {
	Kind     string // "hole", "opening", or the connection's kind
	Name     string
	From, To string // "sea" for the sea
}

// CrossFloodingTime is the time a cross-flooding fitting took to
// equalise, against SOLAS II-1 Reg. 7-2 (MSC.1/Circ.1461 §9.2.2): within
// 10 min where such fittings are fitted; within 60 s counts as
// instantaneous.
type CrossFloodingTime struct {
	Name       string
	EqualiseS  float64 // NaN if it did not equalise in the run (or never flowed)
	Flowed     bool
	Instant    bool // ≤ 60 s
	WithinTen  bool // ≤ 600 s
	Message    string
	startHeadM float64
}

// CrossFloodingLimitS and CrossFloodingInstantS are the limits of SOLAS
// II-1 Reg. 7-2 and MSC.1/Circ.1461 §9.2.2 (references.md, found).
const (
	CrossFloodingLimitS   = 600
	CrossFloodingInstantS = 60
)

// NetStage is an intermediate stage: a fraction of the water in at the end.
type NetStage struct {
	Fraction float64
	WaterM3  float64 // sea water taken in by then, all compartments together
	TimeS    float64
	Reached  bool
	Position *Position
	NoEq     *NoEquilibrium
}

// NetworkReport is the outcome of a network run.
type NetworkReport struct {
	Vessel       string
	Compartments []NetCompartment
	Paths        []NetPath
	LimitS       float64

	End       FloodEnd
	EndS      float64
	EndReason string
	EndNoEq   *NoEquilibrium

	Start, Final NetSample
	// Static is the final state of progressive flooding (Progressive) from
	// the holed compartments open to the sea: equalisation through every
	// path must reproduce it. FinalDiffM is the largest difference of the
	// drafts aft, amidships and forward between Final and Static (0 when
	// either is missing).
	Static        *Spread
	StaticFlooded []string // the names of the compartments open in Static
	StaticChain   string   // Static's chain in words (Spread.Chain)
	// StaticCrossFlooding is the MSC.362(92) estimate of each
	// cross-flooding fitting's time in Static (the damaged side flooded at
	// once), beside the run's own CrossFlooding times.
	StaticCrossFlooding []CrossFloodingEstimate
	FinalDiffM          float64

	Events        []NetEvent
	Trace         []NetSample // every accepted step
	Table         []NetSample // round times and events
	Stages        []NetStage
	CrossFlooding []CrossFloodingTime

	SeaInM3, PumpedM3 float64 // totals at the end
	Steps, Rejected   int
	Solves            int
}

// netEval is the state at one set of water volumes.
type netEval struct {
	w      []float64
	pos    Position
	noEq   *NoEquilibrium
	depthA []float64 // per path: depth of its lowest point below the water on side a
	depthB []float64
	q      []float64 // per path, m³/s from a to b
	pumped []float64 // per node, m³/s
	rate   []float64 // dW/dt per node, then sea in, then pumped
}

func (e *netEval) ok() bool { return e.noEq == nil }

// result is the evaluation's floating position (a copy), or why there is
// none.
func (e *netEval) result() (*Position, *NoEquilibrium) {
	if !e.ok() {
		return nil, e.noEq
	}
	p := e.pos
	return &p, nil
}

// NetworkRun is a network flooding run in progress: NewNetworkRun, then
// Step until false, then Report (RunNetwork does all of it).
//
// Integration: the linearly implicit Rosenbrock 2(3) pair on the vector of
// volumes (rosStepper), relative 1e-6 and absolute 1e-6 of each capacity; a step whose solve
// fails is halved, below 0.5 s the failure is the answer. A full
// compartment takes no more in than goes out of it: its inflows are
// scaled down to its outflows and pumps (the water that cannot enter
// stays outside). The pumps take no water that is not there. The run
// stops when every path carries less than it would at 1 mm of head
// (equalised, or pumps holding), when she sinks or capsizes, or at the
// time limit; at most 4000 trial steps.
type NetworkRun struct {
	c      NetworkCase
	v      *Vessel
	nodes  []int
	slot   map[int]int // compartment index → node
	mu     []float64
	cap    []float64
	floor  []float64
	pump   []float64 // m³/s per node
	start  []float64 // water at the start per node
	holed  []bool    // a hole leads into the node, or it holds sea water from the start
	paths  []flowPath
	qTol   []float64 // per path: the flow at 1 mm of head
	st     rosStepper
	guess  Plane
	haveG  bool
	last   netEval
	recs   []vecRec
	evals  []netEval
	solves int

	events   []NetEvent
	comps    []NetCompartment
	cross    []CrossFloodingTime
	crossIx  []int // path index of each cross-flooding fitting
	wasBelow []bool
	end      FloodEnd
	endS     float64
	endWhy   string
	endNoEq  *NoEquilibrium
	report   *NetworkReport
}

// NewNetworkRun checks c and solves the start.
func NewNetworkRun(c NetworkCase) (*NetworkRun, error) {
	if err := checkNetworkCase(&c); err != nil {
		return nil, err
	}
	v := c.Vessel
	r := &NetworkRun{c: c, v: v, slot: map[int]int{}}
	r.nodes = networkNodes(v, c.Base, c.Holes)
	n := len(r.nodes)
	for k, i := range r.nodes {
		r.slot[i] = k
		mu := v.Permeability(c.Base, i)
		r.mu = append(r.mu, mu)
		r.cap = append(r.cap, mu*v.Compartments[i].solid.Volume())
		fl := 0.0
		if v.tanks[i].massT > 0 {
			fl = floodFloorFrac * r.cap[k]
		}
		r.floor = append(r.floor, fl)
	}
	r.pump = make([]float64, n)
	for _, p := range c.Pumps {
		k, ok := r.slot[p.Compartment]
		if !ok {
			return nil, fmt.Errorf("flooding: the pump on %q works on a compartment the water cannot reach", v.Compartments[p.Compartment].Name)
		}
		r.pump[k] += p.CapacityM3h / 3600
	}
	for _, h := range c.Holes {
		r.paths = append(r.paths, flowPath{kind: "hole", name: "hole in " + v.Compartments[h.Compartment].Name, a: -1, b: r.slot[h.Compartment],
			x: h.Hole.XM, y: h.Hole.YM, z: h.Hole.ZM, area: h.Hole.AreaM2, coef: h.Hole.Cd, conn: -1})
	}
	for _, o := range v.Openings {
		j := v.LeadsToIndex(o)
		if j < 0 || o.Weathertight {
			continue
		}
		if k, ok := r.slot[j]; ok {
			r.paths = append(r.paths, flowPath{kind: "opening", name: o.Name, a: -1, b: k, x: o.X, y: o.Y, z: o.Z,
				area: o.flowAreaM2(), coef: DefaultDischargeCoefficient, conn: -1})
		}
	}
	for ci, cn := range v.Connections {
		if !cn.Open {
			continue
		}
		ka, okA := r.slot[cn.From]
		kb, okB := r.slot[cn.To]
		p := flowPath{kind: cn.Kind, name: cn.Name, x: cn.X, y: cn.Y, z: cn.Z, area: cn.AreaM2, height: cn.HeightM, coef: cn.SpeedFactor(), conn: ci}
		switch {
		case okA && okB:
			p.a, p.b = ka, kb
		case okA && c.Base.state(cn.To).Open:
			p.a, p.b, p.seaB, p.seaBIx = ka, -1, true, cn.To
		case okB && c.Base.state(cn.From).Open:
			p.a, p.b, p.seaB, p.seaBIx = kb, -1, true, cn.From
		default:
			continue
		}
		if cn.Kind == CrossFloodingKind {
			r.crossIx = append(r.crossIx, len(r.paths))
			r.cross = append(r.cross, CrossFloodingTime{Name: cn.Name, EqualiseS: math.NaN()})
		}
		r.paths = append(r.paths, p)
	}
	for _, p := range r.paths {
		r.qTol = append(r.qTol, p.coef*p.area*math.Sqrt(2*StandardGravity*FloodHeadTolM))
	}
	y0 := make([]float64, n+2)
	for k, i := range r.nodes {
		w := c.Base.state(i).WaterM3
		if w == 0 && v.tanks[i].massT > 0 {
			// A tank starts with its contents, counted as sea water of
			// the same mass (as FloodRun does).
			w = v.tanks[i].massT / v.WaterDensity
		}
		y0[k] = math.Min(w, r.cap[k])
		r.comps = append(r.comps, NetCompartment{Index: i, Name: v.Compartments[i].Name, CapacityM3: r.cap[k], StartM3: y0[k],
			FirstWaterS: math.NaN(), FullS: math.NaN(), EqualisedS: math.NaN()})
		r.start = append(r.start, y0[k])
		r.holed = append(r.holed, c.Base.state(i).WaterM3 > 0)
	}
	for _, h := range c.Holes {
		r.holed[r.slot[h.Compartment]] = true
	}
	e0 := r.eval(y0)
	r.last = e0
	r.evals = append(r.evals, e0)
	atol := make([]float64, n+2)
	var total float64
	for k := range r.cap {
		atol[k] = networkAbsTol * r.cap[k]
		total += r.cap[k]
	}
	atol[n], atol[n+1] = networkAbsTol*total, networkAbsTol*total
	r.st = rosStepper{f: r.rhs, jac: r.jacobian, y: y0, fy: e0.rate, atol: atol, rtol: networkRelTol, dtMin: 0.5, maxTries: floodMaxTries}
	var in float64
	for _, q := range e0.rate[:n] {
		in += math.Abs(q)
	}
	r.st.dt = math.Min(c.LimitS, math.Max(1, 1e-3*total/math.Max(in, 1e-12)))
	r.wasBelow = make([]bool, len(r.paths))
	if !e0.ok() {
		r.finish(outcomeEnd(e0.noEq.Outcome), 0, "no floating position at the start: "+e0.noEq.Error(), e0.noEq)
		return r, nil
	}
	r.startEvents(e0)
	r.settled(vecRec{}, e0, 0, true)
	return r, nil
}

// damageAt returns the base damage with volumes w in the nodes.
func (r *NetworkRun) damageAt(w []float64) Damage {
	d := append(Damage(nil), r.c.Base...)
	for k, i := range r.nodes {
		if !r.holed[k] && w[k] <= r.start[k]+1e-9*r.cap[k] {
			// No sea water has come in yet: a tank keeps its contents
			// as loaded.
			continue
		}
		s := d[i]
		s.WaterM3 = math.Max(math.Max(0, math.Min(w[k], r.cap[k])), r.floor[k])
		d[i] = s
	}
	return d
}

// eval solves the ship with volumes y and works out every flow.
func (r *NetworkRun) eval(y []float64) netEval {
	n := len(r.nodes)
	e := netEval{w: make([]float64, n)}
	for k := range e.w {
		e.w[k] = math.Max(0, math.Min(y[k], r.cap[k]))
	}
	pos, err := NewProblem(r.v, r.damageAt(e.w)).EquilibriumFrom(r.guess, r.haveG)
	r.solves++
	if err != nil {
		e.noEq = asNoEquilibrium(err)
		return e
	}
	r.guess, r.haveG = pos.Plane, true
	e.pos = pos
	r.flows(&e, pos.Plane)
	return e
}

// flows works out every flow and rate of e (its volumes set) with the sea
// at plane p.
func (r *NetworkRun) flows(e *netEval, p Plane) {
	n := len(r.nodes)
	// The water surface in each node, parallel to the sea's.
	levels := make([]Plane, n)
	for k, i := range r.nodes {
		wm := math.Max(e.w[k], r.floor[k]) / r.mu[k]
		wm = math.Min(wm, r.v.Compartments[i].solid.Volume()*(1-1e-9))
		levels[k], _ = levelForVolume(r.v.Compartments[i].solid, wm, p.B, p.C)
	}
	depth := func(k int, x, yy, z float64) float64 {
		if k < 0 {
			return -p.Height(x, yy, z)
		}
		if e.w[k] <= 0 {
			return math.Inf(-1)
		}
		return -levels[k].Height(x, yy, z)
	}
	np := len(r.paths)
	e.depthA, e.depthB, e.q = make([]float64, np), make([]float64, np), make([]float64, np)
	in := make([]float64, n)  // positive inflows
	out := make([]float64, n) // outflows
	for j := range r.paths {
		pa := &r.paths[j]
		e.depthA[j], e.depthB[j] = depth(pa.a, pa.x, pa.y, pa.z), depth(pa.b, pa.x, pa.y, pa.z)
		e.q[j] = pathFlow(pa, e.depthA[j], e.depthB[j])
		for _, s := range []struct {
			k int
			q float64
		}{{pa.a, -e.q[j]}, {pa.b, e.q[j]}} {
			if s.k < 0 {
				continue
			}
			if s.q > 0 {
				in[s.k] += s.q
			} else {
				out[s.k] -= s.q
			}
		}
	}
	e.pumped = make([]float64, n)
	for k := range r.nodes {
		e.pumped[k] = r.pump[k]
		if e.w[k] <= 0 {
			e.pumped[k] = math.Min(r.pump[k], math.Max(in[k]-out[k], 0))
		}
		// A full compartment takes in no more than leaves it.
		if e.w[k] >= r.cap[k]*(1-1e-12) && in[k] > out[k]+e.pumped[k] && in[k] > 0 {
			f := (out[k] + e.pumped[k]) / in[k]
			for j := range r.paths {
				pa := &r.paths[j]
				if (pa.b == k && e.q[j] > 0) || (pa.a == k && e.q[j] < 0) {
					e.q[j] *= f
				}
			}
		}
	}
	e.rate = make([]float64, n+2)
	for j := range r.paths {
		pa := &r.paths[j]
		if pa.a >= 0 {
			e.rate[pa.a] -= e.q[j]
		} else {
			e.rate[n] += e.q[j]
		}
		if pa.b >= 0 {
			e.rate[pa.b] += e.q[j]
		} else {
			e.rate[n] -= e.q[j] // into a compartment at the sea's level: back to the sea
		}
	}
	for k := range r.nodes {
		e.rate[k] -= e.pumped[k]
		e.rate[n+1] += e.pumped[k]
	}
}

// jacobian returns ∂(dy/dt)/∂y at y by forward differences, one column
// per compartment. A compartment that holds water or has water moving
// through its paths is differenced with the ship solved afresh (the ship's
// trim and heel move every level at once: between two spaces joined by a
// wide door that coupling is as stiff as the door itself); the others with
// the ship held where she was last solved.
func (r *NetworkRun) jacobian(y []float64) [][]float64 {
	n := len(r.nodes)
	m := len(y)
	J := make([][]float64, m)
	for i := range J {
		J[i] = make([]float64, m)
	}
	clamp := func(w []float64) netEval {
		e := netEval{w: make([]float64, n)}
		for k := range e.w {
			e.w[k] = math.Max(0, math.Min(w[k], r.cap[k]))
		}
		return e
	}
	guess := r.guess
	base := clamp(y)
	r.flows(&base, guess)
	// The rates at y itself: the last accepted state's (first same as
	// last), else a solve.
	full := r.evals[len(r.evals)-1]
	for k := 0; k < n; k++ {
		if full.ok() && full.w[k] != math.Max(0, math.Min(y[k], r.cap[k])) {
			full = r.eval(y)
			break
		}
	}
	active := make([]bool, n)
	for j, pa := range r.paths {
		if base.q[j] != 0 {
			for _, k := range []int{pa.a, pa.b} {
				if k >= 0 {
					active[k] = true
				}
			}
		}
	}
	for k := 0; k < n; k++ {
		d := 1e-6 * r.cap[k]
		if y[k]+d > r.cap[k] {
			d = -d
		}
		w := append([]float64(nil), y...)
		w[k] += d
		f0, f1 := base.rate, []float64(nil)
		if (active[k] || base.w[k] > 0) && full.ok() {
			if e := r.eval(w); e.ok() {
				f0, f1 = full.rate, e.rate
			}
		}
		if f1 == nil {
			e := clamp(w)
			r.flows(&e, guess)
			f1 = e.rate
		}
		for i := range f1 {
			J[i][k] = (f1[i] - f0[i]) / d
		}
	}
	r.guess = guess
	return J
}

func (r *NetworkRun) rhs(y []float64) ([]float64, error) {
	e := r.eval(y)
	r.last = e
	if !e.ok() {
		return nil, e.noEq
	}
	return e.rate, nil
}

// Step advances the run by one accepted step; false when it has ended.
func (r *NetworkRun) Step() bool {
	if r.end != FloodRunning {
		return false
	}
	t0 := r.st.t
	prev := r.evals[len(r.evals)-1]
	rec, err := r.st.advance(r.c.LimitS)
	if err != nil {
		var ne *NoEquilibrium
		if errors.As(err, &ne) {
			r.finish(outcomeEnd(ne.Outcome), t0+r.st.dt, fmt.Sprintf("%s: %s", ne.Outcome, ne.Reason), ne)
		} else {
			r.finish(FloodFailed, t0, err.Error(), nil)
		}
		return false
	}
	n := len(r.nodes)
	for k := 0; k < n; k++ {
		rec.y1[k] = math.Max(0, math.Min(rec.y1[k], r.cap[k]))
	}
	e := r.last
	r.recs = append(r.recs, rec)
	r.evals = append(r.evals, e)
	r.crossings(rec, prev, e)
	r.settled(rec, e, rec.t1, false)
	if r.end == FloodRunning && rec.t1 >= r.c.LimitS*(1-1e-12) {
		r.finish(FloodTimeLimit, rec.t1, fmt.Sprintf("the time limit (%.0f s) came first, water still moving", r.c.LimitS), nil)
	}
	return r.end == FloodRunning
}

// resting reports whether path j carries less than at 1 mm of head.
func (r *NetworkRun) resting(e *netEval, j int) bool { return math.Abs(e.q[j]) <= r.qTol[j] }

// met reports whether the levels have met through path j: both sides
// below its lowest point, or both above it with less flow than at 1 mm
// of head (not a path that has only just been wetted on one side).
func (r *NetworkRun) met(e *netEval, j int) bool {
	a, b := e.depthA[j], e.depthB[j]
	return (a <= 0 && b <= 0) || (a > 0 && b > 0 && r.resting(e, j))
}

// restRatio is the largest flow through the paths touching node k as a
// multiple of each path's flow at 1 mm of head: at most 1 when the node is
// at rest.
func (r *NetworkRun) restRatio(e *netEval, k int) float64 {
	var m float64
	for j, pa := range r.paths {
		if pa.a == k || pa.b == k {
			q := math.Abs(e.q[j]) / r.qTol[j]
			if !r.met(e, j) {
				q = math.Max(q, 1+1e-9)
			}
			m = math.Max(m, q)
		}
	}
	return m
}

// restTime places inside the step rec the first moment pred holds (it
// holds at the step's end): bisection on the step's interpolated volumes,
// the flows worked out with the ship as last solved (she moves little in
// a step; no solves).
func (r *NetworkRun) restTime(rec vecRec, pred func(e *netEval) bool) float64 {
	if len(rec.y0) == 0 {
		return rec.t1
	}
	n := len(r.nodes)
	th := r.bisect(rec, func(th float64) bool {
		y := rec.state(th)
		e := netEval{w: make([]float64, n)}
		for k := range e.w {
			e.w[k] = math.Max(0, math.Min(y[k], r.cap[k]))
		}
		r.flows(&e, r.guess)
		return pred(&e)
	})
	return rec.t0 + th*(rec.t1-rec.t0)
}

// settled records the compartments that came to rest in the step from
// prev (t0) to e (t1) and ends the run when all are.
func (r *NetworkRun) settled(rec vecRec, e netEval, t1 float64, start bool) {
	all := true
	for j := range r.paths {
		if !r.met(&e, j) {
			all = false
		}
	}
	for k := range r.nodes {
		r1 := r.restRatio(&e, k)
		c := &r.comps[k]
		switch {
		case r1 <= 1 && !math.IsNaN(c.FirstWaterS) && math.IsNaN(c.EqualisedS) && !start:
			k := k
			c.EqualisedS = r.restTime(rec, func(e *netEval) bool { return r.restRatio(e, k) <= 1 })
			r.events = append(r.events, NetEvent{NetEqualised, c.Name, c.EqualisedS, fmt.Sprintf("%s comes to rest with %.1f m³ in", c.Name, e.w[k])})
		case r1 > 1:
			c.EqualisedS = math.NaN()
		}
	}
	var moving, pumps float64
	qMin := math.Inf(1)
	for k := range r.nodes {
		moving = math.Max(moving, math.Abs(e.rate[k]))
		pumps += r.pump[k]
	}
	for _, q := range r.qTol {
		qMin = math.Min(qMin, q)
	}
	switch {
	case all && start:
		r.finish(FloodNoInflow, t1, "nothing flows: every hole, opening and connection is clear of the water or level on both sides", nil)
	case all:
		r.finish(FloodEqualised, t1, fmt.Sprintf("the water has come to rest: the levels meet through every open path (%.1f m³ came in)", sum(e.w)-sum(r.start)), nil)
	case !start && pumps > 0 && moving <= qMin:
		r.finish(FloodPumpsHold, t1, fmt.Sprintf("the pumps hold the levels: the water in each compartment changes by less than %.1f m³/h", qMin*3600), nil)
	}
}

func sum(xs []float64) float64 {
	var s float64
	for _, x := range xs {
		s += x
	}
	return s
}

func (r *NetworkRun) finish(end FloodEnd, t float64, why string, ne *NoEquilibrium) {
	r.end, r.endS, r.endWhy, r.endNoEq = end, t, why, ne
	r.events = append(r.events, NetEvent{NetEnds, end.String(), t, why})
}

func (r *NetworkRun) startEvents(e netEval) {
	p := e.pos
	if p.DeckEdge.HeightM <= 0 {
		r.events = append(r.events, NetEvent{NetDeckEdge, "", 0, "the deck edge is under water from the start"})
	}
	for _, o := range p.Openings {
		if !o.Weathertight && o.HeightM <= 0 {
			r.events = append(r.events, NetEvent{NetOpening, o.Name, 0, o.Name + " is under water from the start"})
		}
	}
	for j := range r.paths {
		r.wasBelow[j] = !r.resting(&e, j)
	}
	for x, j := range r.crossIx {
		r.cross[x].startHeadM = math.Abs(math.Max(e.depthA[j], 0) - math.Max(e.depthB[j], 0))
	}
}

// crossings finds the events inside the step rec from e0 to e1.
func (r *NetworkRun) crossings(rec vecRec, e0, e1 netEval) {
	var found []NetEvent
	for k := range r.nodes {
		c := &r.comps[k]
		above := r.start[k] + math.Max(r.floor[k], 1e-9*r.cap[k])
		if math.IsNaN(c.FirstWaterS) && e1.w[k] > above {
			th := r.bisect(rec, func(th float64) bool { return rec.at(k, th) > above })
			if th < 1e-6 {
				th = 0 // water was coming in at the step's start
			}
			c.FirstWaterS = rec.t0 + th*(rec.t1-rec.t0)
			found = append(found, NetEvent{NetFirstWater, c.Name, c.FirstWaterS, "water first enters " + c.Name})
		}
		if math.IsNaN(c.FullS) && e1.w[k] >= r.cap[k]*(1-1e-9) {
			th := r.bisect(rec, func(th float64) bool { return rec.at(k, th) >= r.cap[k]*(1-1e-9) })
			c.FullS = rec.t0 + th*(rec.t1-rec.t0)
			found = append(found, NetEvent{NetFull, c.Name, c.FullS, fmt.Sprintf("%s is full (%.1f m³)", c.Name, r.cap[k])})
		}
	}
	if e0.ok() && e1.ok() {
		if g0, g1 := e0.pos.DeckEdge.HeightM, e1.pos.DeckEdge.HeightM; g0 > 0 && g1 <= 0 {
			t, p := r.locate(rec, g0, g1, func(p *Position) float64 { return p.DeckEdge.HeightM })
			found = append(found, NetEvent{NetDeckEdge, "", t, fmt.Sprintf("the deck edge goes under (%s side, x %.1f m)", p.DeckEdge.Side, p.DeckEdge.XM)})
		}
		for i, o := range r.v.Openings {
			if o.Weathertight || i >= len(e0.pos.Openings) {
				continue
			}
			if g0, g1 := e0.pos.Openings[i].HeightM, e1.pos.Openings[i].HeightM; g0 > 0 && g1 <= 0 {
				i := i
				t, _ := r.locate(rec, g0, g1, func(p *Position) float64 { return p.Openings[i].HeightM })
				msg := o.Name + " goes under: water can spread through it"
				if o.LeadsTo != "" {
					msg = o.Name + " goes under: water comes in through it to " + o.LeadsTo
				}
				found = append(found, NetEvent{NetOpening, o.Name, t, msg})
			}
		}
	}
	for x, j := range r.crossIx {
		cf := &r.cross[x]
		if !r.resting(&e1, j) {
			cf.Flowed = true
			cf.EqualiseS = math.NaN()
			continue
		}
		if !cf.Flowed || !math.IsNaN(cf.EqualiseS) {
			continue
		}
		// The flow falls linearly in time near the end (the √h law):
		// the time of 1 mm of head inside the step.
		j := j
		t := r.restTime(rec, func(e *netEval) bool { return r.resting(e, j) })
		cf.EqualiseS = t
		found = append(found, NetEvent{NetCrossFlooded, cf.Name, t, fmt.Sprintf("%s has equalised, %s", cf.Name, CrossFloodingVerdict(t))})
	}
	sort.SliceStable(found, func(a, b int) bool { return found[a].TimeS < found[b].TimeS })
	r.events = append(r.events, found...)
}

// CrossFloodingVerdict says a cross-flooding time of t seconds against
// the limits of SOLAS II-1 Reg. 7-2 and MSC.1/Circ.1461 §9.2.2.
func CrossFloodingVerdict(t float64) string {
	switch {
	case t <= CrossFloodingInstantS:
		return "within 60 s: counts as instantaneous (MSC.1/Circ.1461)"
	case t <= CrossFloodingLimitS:
		return "within the 10 min limit (SOLAS II-1 Reg. 7-2)"
	}
	return "BEYOND the 10 min limit (SOLAS II-1 Reg. 7-2)"
}

// bisect returns the least θ in (0, 1] where pred holds (pred(1) holds).
func (r *NetworkRun) bisect(rec vecRec, pred func(th float64) bool) float64 {
	a, b := 0.0, 1.0
	for i := 0; i < 50; i++ {
		m := (a + b) / 2
		if pred(m) {
			b = m
		} else {
			a = m
		}
	}
	return b
}

// locate places the zero of g inside rec (g0 > 0 ≥ g1) by the engine's
// Illinois root-finder (illinois.go) on the step fraction, each g from a
// solve at the interpolated volumes; at most 12 solves. The time returned
// is on the far side of the zero (g ≤ 0 there).
func (r *NetworkRun) locate(rec vecRec, g0, g1 float64, g func(p *Position) float64) (float64, Position) {
	best := r.evals[len(r.evals)-1].pos
	bestT := rec.t1
	illinois(0, 1, g0, g1, math.NaN(), 12, 1e-6, 1e-7*math.Max(g0, -g1), true, func(th float64) (float64, bool) {
		e := r.eval(rec.state(th))
		if !e.ok() {
			return 0, false
		}
		gt := g(&e.pos)
		if gt <= 0 {
			best, bestT = e.pos, rec.t0+th*(rec.t1-rec.t0)
		}
		return gt, true
	})
	return bestT, best
}

// Progress returns where the run is, for a screen.
func (r *NetworkRun) Progress() FloodProgress {
	e := r.evals[len(r.evals)-1]
	var total float64
	for _, c := range r.cap {
		total += c
	}
	return FloodProgress{TimeS: r.st.t, LimitS: r.c.LimitS, WaterM3: sum(e.w), TargetM3: total, Steps: len(r.recs), Done: r.end != FloodRunning}
}

func (r *NetworkRun) sample(t float64, e netEval, y []float64) NetSample {
	n := len(r.nodes)
	s := NetSample{TimeS: t, WaterM3: append([]float64(nil), e.w...), SeaInM3: y[n], PumpedM3: y[n+1]}
	for _, q := range e.q {
		s.FlowM3h = append(s.FlowM3h, q*3600)
	}
	s.Position, s.NoEq = e.result()
	return s
}

// Report runs the run to its end if need be and returns its outcome.
func (r *NetworkRun) Report() NetworkReport {
	for r.Step() {
	}
	if r.report != nil {
		return *r.report
	}
	n := len(r.nodes)
	rep := NetworkReport{Vessel: r.v.Name, LimitS: r.c.LimitS, End: r.end, EndS: r.endS, EndReason: r.endWhy, EndNoEq: r.endNoEq,
		Events: append([]NetEvent(nil), r.events...), Steps: len(r.recs), Rejected: r.st.tries - len(r.recs)}
	sort.SliceStable(rep.Events, func(a, b int) bool {
		ea, eb := rep.Events[a], rep.Events[b]
		if (ea.Kind == NetEnds) != (eb.Kind == NetEnds) {
			return eb.Kind == NetEnds
		}
		return ea.TimeS < eb.TimeS
	})
	for _, pa := range r.paths {
		np := NetPath{Kind: pa.kind, Name: pa.name, From: "sea", To: "sea"}
		if pa.a >= 0 {
			np.From = r.comps[pa.a].Name
		}
		if pa.b >= 0 {
			np.To = r.comps[pa.b].Name
		} else if pa.seaB {
			np.To = r.v.Compartments[pa.seaBIx].Name + " (open to the sea)"
		}
		rep.Paths = append(rep.Paths, np)
	}
	y := r.st.y
	for i, e := range r.evals {
		t, yy := 0.0, y
		if i > 0 {
			t, yy = r.recs[i-1].t1, r.recs[i-1].y1
		} else if len(r.recs) > 0 {
			yy = r.recs[0].y0
		}
		rep.Trace = append(rep.Trace, r.sample(t, e, yy))
	}
	rep.Start, rep.Final = rep.Trace[0], rep.Trace[len(rep.Trace)-1]
	rep.SeaInM3, rep.PumpedM3 = rep.Final.SeaInM3, rep.Final.PumpedM3
	for k := range r.comps {
		r.comps[k].WaterM3 = rep.Final.WaterM3[k]
	}
	rep.Compartments = append([]NetCompartment(nil), r.comps...)
	rep.CrossFlooding = append([]CrossFloodingTime(nil), r.cross...)
	for k := range rep.CrossFlooding {
		cf := &rep.CrossFlooding[k]
		if !math.IsNaN(cf.EqualiseS) {
			cf.Instant, cf.WithinTen = cf.EqualiseS <= CrossFloodingInstantS, cf.EqualiseS <= CrossFloodingLimitS
			cf.Message = fmt.Sprintf("%s equalises in %.0f s, %s", cf.Name, cf.EqualiseS, CrossFloodingVerdict(cf.EqualiseS))
		} else if cf.Flowed {
			cf.Message = cf.Name + " had not equalised when the run ended"
		} else {
			cf.Message = cf.Name + " carried no water in this run"
		}
	}
	// The static final state from the holed compartments open.
	d := append(Damage(nil), r.c.Base...)
	for _, h := range r.c.Holes {
		d[h.Compartment] = SpaceState{Open: true, Permeability: d[h.Compartment].Permeability}
	}
	sp := Progressive(r.v, d)
	rep.Static = &sp
	for _, i := range sp.Flooded {
		rep.StaticFlooded = append(rep.StaticFlooded, r.v.Compartments[i].Name)
	}
	rep.StaticCrossFlooding = CrossFloodingTimes(r.v, sp)
	rep.StaticChain = sp.Chain(r.v)
	if f, s := rep.Final.Position, sp.Position; f != nil && s != nil && r.end != FloodTimeLimit {
		rep.FinalDiffM = math.Max(math.Abs(f.DraftAftM-s.DraftAftM), math.Max(math.Abs(f.DraftMidM-s.DraftMidM), math.Abs(f.DraftFwdM-s.DraftFwdM)))
	}
	r.endGMs(&rep, &sp)
	rep.Table = r.table()
	final := sum(rep.Final.WaterM3)
	start := sum(rep.Start.WaterM3)
	for _, f := range stageFractions {
		rep.Stages = append(rep.Stages, r.stage(f, start, final))
	}
	rep.Solves = r.solves
	_ = n
	r.report = &rep
	return rep
}

// stateAt returns the volumes at time t from the steps' interpolants.
func (r *NetworkRun) stateAt(t float64) ([]float64, int, float64) {
	if len(r.recs) == 0 || t <= 0 {
		return r.st.y, -1, 0
	}
	i := sort.Search(len(r.recs), func(i int) bool { return r.recs[i].t1 >= t })
	if i >= len(r.recs) {
		return r.recs[len(r.recs)-1].y1, len(r.recs) - 1, 1
	}
	rec := r.recs[i]
	th := (t - rec.t0) / (rec.t1 - rec.t0)
	return rec.state(th), i, th
}

// table makes rows at round times (about a dozen) and at each event.
func (r *NetworkRun) table() []NetSample {
	end := r.endS
	var rows []NetSample
	dt := roundInterval(end)
	type at struct {
		t     float64
		label string
	}
	var times []at
	for k := 0; dt > 0 && float64(k)*dt < end*(1-1e-9) && k < 100; k++ {
		times = append(times, at{float64(k) * dt, ""})
	}
	for _, ev := range r.events {
		if ev.Kind != NetEnds && ev.TimeS <= end && ev.TimeS > 0 {
			times = append(times, at{ev.TimeS, ev.Kind.String() + nameSuffix(ev.Name)})
		}
	}
	sort.SliceStable(times, func(a, b int) bool { return times[a].t < times[b].t })
	for i, x := range times {
		if i > 0 && x.t-times[i-1].t < 0.5 {
			continue // one row for moments within half a second
		}
		y, _, _ := r.stateAt(x.t)
		if x.t <= 0 && len(r.recs) > 0 {
			y = r.recs[0].y0
		}
		s := r.sample(x.t, r.eval(y), y)
		s.Event = x.label
		rows = append(rows, s)
	}
	fin := r.sample(end, r.evals[len(r.evals)-1], r.st.y)
	if r.endNoEq != nil {
		fin.Position, fin.NoEq = nil, r.endNoEq
	}
	fin.Event = NetEnds.String() + " " + r.end.String()
	return append(rows, fin)
}

// stage solves the state when the water in the ship had risen by the
// fraction f of its rise over the run.
func (r *NetworkRun) stage(f, start, final float64) NetStage {
	target := start + f*(final-start)
	st := NetStage{Fraction: f, WaterM3: f * (final - start)}
	n := len(r.nodes)
	for _, rec := range r.recs {
		s0, s1 := sum(rec.y0[:n]), sum(rec.y1[:n])
		if !(s0 < target && s1 >= target) {
			continue
		}
		th := r.bisect(rec, func(th float64) bool { return sum(rec.state(th)[:n]) >= target })
		e := r.eval(rec.state(th))
		st.TimeS, st.Reached = rec.t0+th*(rec.t1-rec.t0), true
		st.Position, st.NoEq = e.result()
		return st
	}
	if f == 1 {
		e := r.evals[len(r.evals)-1]
		st.TimeS, st.Reached = r.endS, true
		st.Position, st.NoEq = e.result()
	}
	return st
}

// RunNetwork runs case c to its end and returns the report.
func RunNetwork(c NetworkCase, progress func(FloodProgress)) (NetworkReport, error) {
	r, err := NewNetworkRun(c)
	if err != nil {
		return NetworkReport{}, err
	}
	for r.Step() {
		if progress != nil {
			progress(r.Progress())
		}
	}
	return r.Report(), nil
}
