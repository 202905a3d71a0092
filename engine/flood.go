package engine

// This file follows a compartment filling through a hole over time, against
// its pumps: the inflow by Torricelli's law, the ship re-solved with the
// water as an added weight at every evaluation, the events on the way (deck
// edge, margin line, openings, criteria), where it ends (levels equal,
// pumps holding, compartment full, sinking, capsizing, time limit), and the
// intermediate stages of flooding.

import (
	"errors"
	"fmt"
	"math"
	"sort"
)

// StandardGravity is g, 9.80665 m/s² (CGPM standard gravity).
const StandardGravity = 9.80665

// DefaultDischargeCoefficient is C_d of a hole when none is given: 0.6, a
// sharp-edged orifice (hydraulics practice; a ragged hull hole is nearer
// 0.65–0.75).
const DefaultDischargeCoefficient = 0.6

// DefaultFloodLimitS is the time limit of a flooding run when none is
// given: 24 h.
const DefaultFloodLimitS = 24 * 3600

// FloodHeadTolM is how close (m of head) the run must come to its settled
// head before it stops: 1 mm. With no pumps the settled head is zero (the
// levels inside and outside are equal); with pumps it is the head at which
// the inflow equals the pumps' capacity.
const FloodHeadTolM = 1e-3

// Bounds that keep a run finite.
const (
	floodMaxTries  = 4000 // trial steps of the integrator, accepted or not
	floodLocateIts = 16   // solves to place one event inside a step
	floodRelTol    = 1e-8 // integrator: relative error per step on the water volume
	floodAbsTol    = 1e-8 // … and absolute, as a fraction of the compartment's capacity
	floodFloorFrac = 1e-9 // least water held, as a fraction of the capacity (see FloodRun)
)

// Hole is a breach through which the sea reaches one compartment.
type Hole struct {
	AreaM2     float64 // a, m² (> 0)
	XM, YM, ZM float64 // its centre in the ship frame, m
	Cd         float64 // discharge coefficient C_d, 0 < C_d ≤ 1; 0 means DefaultDischargeCoefficient
}

// Pump is one pump working on the flooded compartment.
type Pump struct {
	Name        string
	CapacityM3h float64 // m³/h (≥ 0)
}

// FloodCase is one flooding scenario: a compartment of Vessel, under the
// damage state Base of the others, filling through Hole against Pumps.
type FloodCase struct {
	Vessel *Vessel
	// Base is the state of every compartment (nil: intact). The flooded
	// compartment must not be Open in it; its Permeability applies, and its
	// WaterM3, if any, is the water already in at time zero.
	Base        Damage
	Compartment int // index into Vessel.Compartments
	Hole        Hole
	Pumps       []Pump
	LimitS      float64 // s; 0 means DefaultFloodLimitS

	// Criteria, when set, judges a solved condition: it is called at the
	// end of every accepted step, at each intermediate stage and at each
	// row of the table, and a criterion that passed and then fails is an
	// event placed inside the step (indicators, such as SOLAS s, are shown
	// but make no event). Each call costs what the criteria cost (a GZ
	// curve is some 60–90 solves). The damage d holds the water of that
	// moment as SpaceState.WaterM3 of the flooded compartment. FloodCriteria
	// gives one that applies the vessel's own criteria sets.
	Criteria func(v *Vessel, d Damage, pos Position) []CriterionResult
}

// FloodEnd is how a flooding run ends.
type FloodEnd int

const (
	FloodRunning   FloodEnd = iota // not ended yet
	FloodEqualised                 // the level inside has come to the sea's (risen, or fallen for a tank whose contents stood above it): head zero
	FloodPumpsHold                 // the pumps hold the level where the inflow equals their capacity
	FloodKeptDry                   // the pumps take all that comes in: no water stays
	FloodNoInflow                  // the hole is clear of the water: nothing comes in
	FloodFull                      // the compartment filled to its top while still below the sea
	FloodSinks                     // no floating position: she sinks
	FloodCapsizes                  // no floating position: she capsizes
	FloodTimeLimit                 // the time limit came first
	FloodFailed                    // the solver found no answer (not converged) or the step bound was reached
)

func (e FloodEnd) String() string {
	switch e {
	case FloodRunning:
		return "running"
	case FloodEqualised:
		return "equalised"
	case FloodPumpsHold:
		return "pumps-hold"
	case FloodKeptDry:
		return "kept-dry"
	case FloodNoInflow:
		return "no-inflow"
	case FloodFull:
		return "full"
	case FloodSinks:
		return "sinks"
	case FloodCapsizes:
		return "capsizes"
	case FloodTimeLimit:
		return "time-limit"
	case FloodFailed:
		return "failed"
	}
	return "unknown"
}

// Headline says how the run ended in a few words, for a table or a panel
// title: "levels equal", "SHE SINKS", …
func (e FloodEnd) Headline() string {
	switch e {
	case FloodEqualised:
		return "levels equal"
	case FloodPumpsHold:
		return "pumps hold the level"
	case FloodKeptDry:
		return "pumps keep it dry"
	case FloodNoInflow:
		return "nothing comes in"
	case FloodFull:
		return "compartment full"
	case FloodSinks:
		return "SHE SINKS"
	case FloodCapsizes:
		return "SHE CAPSIZES"
	case FloodTimeLimit:
		return "time limit, still filling"
	}
	return "no answer"
}

// FloodEventKind names what happened at a FloodEvent.
type FloodEventKind int

const (
	DeckEdgeReached   FloodEventKind = iota + 1 // the deck edge at side goes under
	MarginLineReached                           // the margin line goes under
	OpeningReached                              // an opening that is not weathertight goes under
	CriterionFails                              // a criterion that passed fails
	RunEnds                                     // the run ends (see FloodReport.End)
)

func (k FloodEventKind) String() string {
	switch k {
	case DeckEdgeReached:
		return "deck-edge"
	case MarginLineReached:
		return "margin-line"
	case OpeningReached:
		return "opening"
	case CriterionFails:
		return "criterion"
	case RunEnds:
		return "end"
	}
	return "unknown"
}

// FloodEvent is one moment of a run.
type FloodEvent struct {
	Kind    FloodEventKind
	Name    string  // the opening's name, the criterion's code, or the FloodEnd for RunEnds
	TimeS   float64 // s from the start; placed inside the step where it happened
	WaterM3 float64 // water in the compartment then
	Message string  // a plain sentence
}

// FloodSample is the state at one moment of a run.
type FloodSample struct {
	TimeS     float64
	WaterM3   float64 // sea water in the compartment, m³
	InflowM3h float64 // through the hole; negative: out through it
	PumpedM3h float64 // taken out by the pumps
	HeadM     float64 // head across the hole (see FloodRun), m
	// SoundingM is the height of the water surface inside above the
	// compartment's lowest point, at the compartment's middle, along z
	// (zero while the water there has not yet reached that height).
	SoundingM float64
	Event     string    // for a table row placed at an event: its kind and name
	Position  *Position // nil when there is no floating position
	NoEq      *NoEquilibrium
	Criteria  []CriterionResult // when FloodCase.Criteria is set
}

// FloodStage is an intermediate stage of flooding: a fraction of the final
// flooded volume held as an added weight, its free surface level with the
// sea's attitude.
type FloodStage struct {
	Fraction float64 // of FloodReport.StagesOfM3
	WaterM3  float64
	Reached  bool    // the run came to this volume
	TimeS    float64 // when (if Reached)
	Position *Position
	NoEq     *NoEquilibrium
	Criteria []CriterionResult
}

// FloodProgress is what a run can show while it computes.
type FloodProgress struct {
	TimeS, LimitS float64
	WaterM3       float64
	// TargetM3 is the water at equalisation (the lost-buoyancy solution's),
	// or the compartment's capacity when she does not float with it open.
	TargetM3 float64
	HeadM    float64
	Steps    int
	Done     bool
}

// Fraction returns the run's progress in [0, 1]: the larger of the water's
// share of the target and the time's share of the limit.
func (p FloodProgress) Fraction() float64 {
	f := 0.0
	if p.TargetM3 > 0 {
		f = p.WaterM3 / p.TargetM3
	}
	if p.LimitS > 0 {
		f = math.Max(f, p.TimeS/p.LimitS)
	}
	if p.Done {
		f = 1
	}
	return math.Max(0, math.Min(1, f))
}

// FloodReport is the outcome of a run.
type FloodReport struct {
	Vessel      string
	Compartment string
	Hole        Hole // as used (C_d filled in)
	PumpM3h     float64
	LimitS      float64

	End       FloodEnd
	EndS      float64 // when the run stopped
	EndReason string  // a plain sentence
	// EndNoEq is why there was no floating position when the run ended on
	// one (sinks, capsizes, or a solve that failed); nil otherwise.
	EndNoEq *NoEquilibrium

	// EqualiseS is the time to equalise when End is FloodEqualised: the run's
	// last step carried on to zero head by the √h law (exact for a
	// constant effective area), a little after EndS.
	EqualiseS float64
	// SteadyHeadM is the head at which the inflow equals the pumps,
	// (Q_p / (C_d·a))² / (2 g); zero without pumps.
	SteadyHeadM float64
	// PumpsHoldLevel is true when the pumps keep the water from rising to
	// the sea's level (End is FloodPumpsHold or FloodKeptDry).
	PumpsHoldLevel bool
	FinalWaterM3   float64 // water in at the end
	CapacityM3     float64 // μ × the compartment's volume
	ContentsM3     float64 // a tank's contents at the start, as sea water of the same mass; 0 for a dry space

	Start FloodSample // at time zero
	// Final is the last state solved: at EndS, or, when she sinks or
	// capsizes, the last floating state before (EndS is then the failure).
	Final FloodSample

	// LostBuoyancy is the compartment open to the sea (lost buoyancy, same
	// permeability): the final state equalisation must reproduce. Nil when
	// she does not float so. LostBuoyancyWaterM3 is μ × its part below the
	// water there.
	LostBuoyancy        *Position
	LostBuoyancyNoEq    *NoEquilibrium
	LostBuoyancyWaterM3 float64
	// FinalDiffM is the largest difference of the drafts aft, amidships and
	// forward between Final and LostBuoyancy (m); NaN-free: 0 when either
	// is missing.
	FinalDiffM float64

	Events []FloodEvent  // in time order; the last is RunEnds
	Table  []FloodSample // rows at round times and at events
	Trace  []FloodSample // every accepted step, for a plot
	Stages []FloodStage  // 25, 50, 75 and 100 % of StagesOfM3; only those the water passed through (and the end)
	// StagesOfM3 is the volume the stages are fractions of: the water at
	// the end when the run settled (equalised, pumps hold, full) or when she
	// sank or capsized (the last floating state: the stages lead up to the
	// loss); at the time limit the lost-buoyancy water (what equalisation
	// would let in), or the capacity when she does not float so.
	StagesOfM3 float64

	Steps, Rejected, Solves int
}

// StageFractions are the intermediate stages reported, with the final.
var StageFractions = []float64{0.25, 0.5, 0.75, 1}

// floodEval is the state at one water volume.
type floodEval struct {
	water    float64 // m³ held (as solved, after clamping to [0, capacity])
	pos      Position
	noEq     *NoEquilibrium
	dSea     float64 // depth of the hole below the sea (m, along the vertical; negative above)
	dIn      float64 // depth of the hole below the water inside (negative: inside below the hole)
	head     float64 // max(dSea, 0) − max(dIn, 0)
	inflow   float64 // m³/s through the hole, signed
	pumped   float64 // m³/s actually pumped
	rate     float64 // dV/dt used by the integrator, m³/s
	sounding float64
}

func (e *floodEval) ok() bool { return e.noEq == nil }

// FloodRun is a flooding run in progress. Make it with NewFloodRun, call
// Step until it returns false (each call is one accepted step of the
// integrator: a handful of solves, so a screen can show Progress between
// calls), then Report. RunFlood does all of it in one call.
//
// # Physics
//
// Inflow through the hole by Torricelli's law, Q = C_d·a·√(2 g |h|)·sign(h),
// with g = 9.80665 m/s² and h the head across the hole along the true
// vertical: h = max(d_sea, 0) − max(d_in, 0), where d_sea is the depth of
// the hole's centre below the sea surface at the current heel and trim and
// d_in its depth below the water surface inside (that surface is parallel
// to the sea's, its height set by the volume held). While the water inside
// is below the hole the head is the hole's depth below the sea (free
// discharge); once above, it is the difference of the two levels.
//
// Negative head (the water inside above the sea, or above a hole that is
// clear of the sea) gives outflow by the same law: an orifice passes water
// either way, so a tank holed above the waterline drains to the hole. This
// also makes equalisation a stable rest point, so a small overshoot of the
// integrator flows back instead of being clamped into a kink. Air inside is
// taken as vented (no back-pressure) and the hole as small against the
// compartment (quasi-static: the levels are flat).
//
// The water volume V obeys dV/dt = Q − Q_p, Q_p the pumps' total capacity,
// but the pumps cannot take out water that is not there: at V = 0 the rate
// is max(Q − Q_p, 0). V is capped at μ × the compartment's volume (full).
//
// At each evaluation the ship is solved with V as SpaceState.WaterM3 of the
// compartment (added weight, free surface level with the sea's attitude),
// warm-started from the last solved plane. A tank holds its contents when
// the hole is made: the run starts with them in, counted as sea water of the
// same mass (ContentsM3 in the report), and the sea comes in on top; the
// water held is never below 1e-9 of the capacity, so that the solver
// treats the space as flooded.
//
// # Integration and stopping
//
// Dormand–Prince 5(4) with error control on V (relative 1e-8, absolute 1e-8
// of the capacity), first same as last. A step whose solve fails is halved;
// below 0.5 s the failure is the answer (sinks, capsizes, not converged).
// The run stops when |h − h_s| ≤ 1 mm, h_s the settled head (zero without
// pumps, else (Q_p/(C_d·a))²/(2 g) where C_d·a·√(2 g h_s) = Q_p), when the
// compartment is full, when the pumps have taken it dry, when nothing flows,
// or at the time limit. At most 4000 trial steps.
//
// Validity: the √h law near equalisation makes dV/dt non-Lipschitz at h = 0
// (the levels meet in finite time); the run stops 1 mm short and carries
// the last step on by √h linear in time, which is exact for a constant
// effective area. The final state is the added-weight solution at the
// equalised volume, which gives the same waterline as the lost-buoyancy
// solution.
type FloodRun struct {
	c        FloodCase
	v        *Vessel
	ci       int
	comp     *Compartment
	mu       float64
	capacity float64
	floor    float64
	cd       float64
	pumpM3s  float64
	hs       float64 // settled head
	limit    float64
	xc, yc   float64 // the compartment's middle, for the sounding
	zmin     float64

	st      stepper
	last    floodEval // at the step end (FSAL)
	guess   Plane
	haveG   bool
	solves  int
	recs    []stepRec
	evals   []floodEval // at each accepted step end (index-aligned with recs, plus the start at 0)
	events  []FloodEvent
	failed  map[string]bool // criteria codes already failed
	lastCr  []CriterionResult
	end     FloodEnd
	endS    float64
	endWhy  string
	endNoEq *NoEquilibrium
	eqS     float64

	lb         *Position
	lbNoEq     *NoEquilibrium
	lbWater    float64
	contentsM3 float64 // a tank's contents at the start, as sea water of the same mass

	report *FloodReport
}

// NewFloodRun checks c and solves the start. It fails on bad input
// (naming what is wrong); a ship that does not float at the start is not an
// error: the run ends at once with that answer.
func NewFloodRun(c FloodCase) (*FloodRun, error) {
	v := c.Vessel
	if v == nil {
		return nil, errors.New("flooding: no vessel")
	}
	if c.Compartment < 0 || c.Compartment >= len(v.Compartments) {
		return nil, fmt.Errorf("flooding: compartment index %d out of range (the vessel has %d)", c.Compartment, len(v.Compartments))
	}
	comp := v.Compartments[c.Compartment]
	h := c.Hole
	if !(h.AreaM2 > 0) || math.IsInf(h.AreaM2, 0) {
		return nil, fmt.Errorf("flooding %q: hole area %v: must be a positive finite number of m²", comp.Name, h.AreaM2)
	}
	for _, q := range []float64{h.XM, h.YM, h.ZM} {
		if math.IsNaN(q) || math.IsInf(q, 0) {
			return nil, fmt.Errorf("flooding %q: hole position (%v, %v, %v): not finite", comp.Name, h.XM, h.YM, h.ZM)
		}
	}
	if h.Cd == 0 {
		h.Cd = DefaultDischargeCoefficient
	}
	if !(h.Cd > 0 && h.Cd <= 1) {
		return nil, fmt.Errorf("flooding %q: discharge coefficient %v is outside (0, 1]", comp.Name, h.Cd)
	}
	// The hole must lead into the compartment: its centre within the
	// compartment's box (a hair of slack for round-off).
	xmin, xmax, zmin, _ := comp.solid.Extent()
	b := comp.Box
	const slack = 1e-6
	if h.XM < b.X0-slack || h.XM > b.X1+slack || h.YM < b.Y0-slack || h.YM > b.Y1+slack || h.ZM < b.Z0-slack || h.ZM > b.Z1+slack {
		return nil, fmt.Errorf("flooding %q: hole at x %.2f, y %.2f, z %.2f m is outside the compartment (x %.2f…%.2f, y %.2f…%.2f, z %.2f…%.2f m)",
			comp.Name, h.XM, h.YM, h.ZM, b.X0, b.X1, b.Y0, b.Y1, b.Z0, b.Z1)
	}
	var pump float64
	for _, p := range c.Pumps {
		if !(p.CapacityM3h >= 0) || math.IsInf(p.CapacityM3h, 0) {
			return nil, fmt.Errorf("flooding %q: pump %q capacity %v: must be a finite number of m³/h, zero or more", comp.Name, p.Name, p.CapacityM3h)
		}
		pump += p.CapacityM3h
	}
	limit := c.LimitS
	if limit == 0 {
		limit = DefaultFloodLimitS
	}
	if !(limit > 0) || math.IsInf(limit, 0) {
		return nil, fmt.Errorf("flooding %q: time limit %v s: must be a positive finite number", comp.Name, c.LimitS)
	}
	base := append(Damage(nil), c.Base...)
	for len(base) < len(v.Compartments) {
		base = append(base, SpaceState{})
	}
	base = base[:len(v.Compartments)]
	s0 := base[c.Compartment]
	if s0.Open {
		return nil, fmt.Errorf("flooding %q: the compartment is already open to the sea in the base damage state", comp.Name)
	}
	if !(s0.WaterM3 >= 0) || math.IsInf(s0.WaterM3, 0) {
		return nil, fmt.Errorf("flooding %q: water already in %v m³: must be a finite number, zero or more", comp.Name, s0.WaterM3)
	}
	c.Base = base
	c.Hole = h
	c.LimitS = limit

	r := &FloodRun{c: c, v: v, ci: c.Compartment, comp: comp, cd: h.Cd, limit: limit, zmin: zmin}
	r.mu = v.permeability(base, r.ci)
	r.capacity = r.mu * comp.solid.Volume()
	r.floor = floodFloorFrac * r.capacity
	r.pumpM3s = pump / 3600
	q := r.pumpM3s / (h.Cd * h.AreaM2)
	r.hs = q * q / (2 * StandardGravity)
	r.xc = (xmin + xmax) / 2
	r.yc = (comp.Box.Y0 + comp.Box.Y1) / 2
	r.failed = map[string]bool{}

	// The lost-buoyancy solution: the state equalisation must reach.
	lbd := append(Damage(nil), base...)
	lbd[r.ci] = SpaceState{Open: true, Permeability: s0.Permeability}
	if pos, err := Solve(v, lbd); err == nil {
		r.lb = &pos
		r.lbWater = r.mu * comp.solid.Below(pos.Plane).V
	} else {
		r.lbNoEq = asNoEquilibrium(err)
	}
	r.solves++

	v0 := math.Min(s0.WaterM3, r.capacity)
	if v0 == 0 {
		// A holed tank starts with its contents in it, counted as sea water
		// of the same mass: the sea mixes with ballast, and a lighter liquid
		// is pressed up and out through the vent as the water comes in.
		if m := v.tanks[r.ci].massT; m > 0 {
			v0 = math.Min(m/v.WaterDensity, r.capacity)
			r.contentsM3 = v0
		}
	}
	e0 := r.eval(v0)
	r.last = e0
	r.evals = append(r.evals, e0)
	r.st = stepper{
		f:        r.rhs,
		y:        v0,
		fy:       e0.rate,
		atol:     floodAbsTol * r.capacity,
		rtol:     floodRelTol,
		ymin:     0,
		ymax:     r.capacity,
		maxTries: floodMaxTries,
		dtMin:    0.5,
	}
	// First step: a thousandth of the time to fill at the starting rate.
	r.st.dt = math.Min(limit, math.Max(1, 1e-3*r.capacity/math.Max(math.Abs(e0.rate), 1e-12)))

	r.startEvents(e0)
	switch {
	case !e0.ok():
		r.finish(outcomeEnd(e0.noEq.Outcome), 0, "no floating position at the start: "+e0.noEq.Error(), e0.noEq)
	case v0 <= 0 && e0.rate <= 0 && e0.inflow > 0:
		r.finish(FloodKeptDry, 0, fmt.Sprintf("the pumps (%.0f m³/h) take all that the hole lets in (%.0f m³/h): the compartment stays dry", pump, e0.inflow*3600), nil)
	case v0 <= 0 && e0.inflow <= 0 && e0.rate <= 0:
		r.finish(FloodNoInflow, 0, fmt.Sprintf("the hole is %.2f m above the water: nothing comes in", -e0.dSea), nil)
	default:
		r.settled(e0, 0)
	}
	return r, nil
}

func outcomeEnd(o Outcome) FloodEnd {
	switch o {
	case Sinks:
		return FloodSinks
	case Capsizes:
		return FloodCapsizes
	}
	return FloodFailed
}

// damageAt returns the base damage with water w in the flooded compartment.
func (r *FloodRun) damageAt(w float64) Damage {
	d := append(Damage(nil), r.c.Base...)
	s := d[r.ci]
	s.WaterM3 = math.Max(w, r.floor)
	d[r.ci] = s
	return d
}

// eval solves the ship with water w (clamped to [0, capacity]) and works
// out the head, the flows and the rate.
func (r *FloodRun) eval(w float64) floodEval {
	w = math.Max(0, math.Min(w, r.capacity))
	e := floodEval{water: w}
	d := r.damageAt(w)
	pr := NewProblem(r.v, d)
	pos, err := pr.EquilibriumFrom(r.guess, r.haveG)
	r.solves++
	if err != nil {
		e.noEq = asNoEquilibrium(err)
		return e
	}
	r.guess, r.haveG = pos.Plane, true
	e.pos = pos
	p := pos.Plane
	h := r.c.Hole
	e.dSea = -p.Height(h.XM, h.YM, h.ZM)
	// The water inside: a plane parallel to the sea's holding w/μ of the
	// moulded volume (just short of the top when full, so that the level
	// stays the compartment's top rather than the solver's bracket).
	wm := math.Max(w, r.floor) / r.mu
	wm = math.Min(wm, r.comp.solid.Volume()*(1-1e-9))
	pin, _ := levelForVolume(r.comp.solid, wm, p.B, p.C)
	e.dIn = -pin.Height(h.XM, h.YM, h.ZM)
	if w <= 0 {
		e.dIn = math.Min(e.dIn, 0)
	}
	e.sounding = math.Max(0, pin.Z(r.xc, r.yc)-r.zmin)
	e.head = math.Max(e.dSea, 0) - math.Max(e.dIn, 0)
	e.inflow = math.Copysign(r.cd*h.AreaM2*math.Sqrt(2*StandardGravity*math.Abs(e.head)), e.head)
	if w <= 0 && e.inflow < 0 {
		e.inflow = 0
	}
	e.rate = e.inflow - r.pumpM3s
	e.pumped = r.pumpM3s
	if w <= 0 && e.rate < 0 {
		// Dry: the pumps take what comes in and no more. The integrator
		// still sees the signed rate so that it can land on zero.
		e.pumped = math.Max(e.inflow, 0)
	}
	return e
}

// rhs is the integrator's right-hand side: dV/dt at V. Beyond the
// capacity it stays the rate at full (a continuous extension, so that a
// trial step that overshoots is cut back to land on it).
func (r *FloodRun) rhs(w float64) (float64, error) {
	e := r.eval(w)
	r.last = e
	if !e.ok() {
		return 0, e.noEq
	}
	return e.rate, nil
}

// Step advances the run by one accepted step. It returns false when the run
// has ended (then call Report).
func (r *FloodRun) Step() bool {
	if r.end != FloodRunning {
		return false
	}
	t0 := r.st.t
	prev := r.evals[len(r.evals)-1]
	rec, err := r.st.advance(r.limit)
	if err != nil {
		var ne *NoEquilibrium
		switch {
		case errors.As(err, &ne):
			r.finish(outcomeEnd(ne.Outcome), t0+r.st.dt, fmt.Sprintf("%s: %s", ne.Outcome, ne.Reason), ne)
		default:
			r.finish(FloodFailed, t0, err.Error(), nil)
		}
		return false
	}
	e := r.last
	if e.water != rec.y1 && !(rec.y1 >= r.capacity && e.water == r.capacity) && !(rec.y1 <= 0 && e.water == 0) {
		// The last call was not at the accepted end (cannot happen with
		// first-same-as-last; kept as a guard).
		e = r.eval(rec.y1)
	}
	r.recs = append(r.recs, rec)
	r.evals = append(r.evals, e)
	r.crossings(rec, prev, e)
	if r.end == FloodRunning {
		r.settled(e, rec.t1)
	}
	if r.end == FloodRunning && rec.t1 >= r.limit*(1-1e-12) {
		r.finish(FloodTimeLimit, rec.t1, fmt.Sprintf("the time limit (%s) came first: %.1f m³ in, head %.3f m", FormatDuration(r.limit), e.water, e.head), nil)
	}
	return r.end == FloodRunning
}

// settled ends the run if it has come to rest at e (time t).
func (r *FloodRun) settled(e floodEval, t float64) {
	switch {
	case e.water >= r.capacity*(1-1e-9):
		r.finish(FloodFull, t, fmt.Sprintf("the compartment is full (%.1f m³) with its top %.2f m below the sea", r.capacity, e.head), nil)
	case e.water <= 0 && e.rate <= 0 && len(r.recs) > 0:
		r.finish(FloodKeptDry, t, "the pumps have taken the compartment dry and keep it so", nil)
	case math.Abs(e.head-r.hs) <= FloodHeadTolM && r.pumpM3s > 0 && r.hs > FloodHeadTolM:
		r.finish(FloodPumpsHold, t, fmt.Sprintf("the pumps (%.0f m³/h) hold the level %.3f m below the sea at the hole, with %.1f m³ in", r.pumpM3s*3600, r.hs, e.water), nil)
	case math.Abs(e.head-r.hs) <= FloodHeadTolM:
		r.eqS = t
		if n := len(r.recs); n > 0 {
			rec := r.recs[n-1]
			s0, s1 := signedRoot(r.evals[n-1].head), signedRoot(e.head)
			if s0 > s1 {
				r.eqS = rec.t0 + (rec.t1-rec.t0)*s0/(s0-s1)
			}
		}
		r.finish(FloodEqualised, t, fmt.Sprintf("the level inside has %s the sea's: %.1f m³ in after %s", r.levelWent(e.water), e.water, FormatDuration(r.eqS)), nil)
	case e.inflow == 0 && e.rate == 0:
		r.finish(FloodNoInflow, t, "nothing flows: the hole is clear of the water on both sides", nil)
	}
}

func signedRoot(h float64) float64 { return math.Copysign(math.Sqrt(math.Abs(h)), h) }

func (r *FloodRun) finish(end FloodEnd, t float64, why string, ne *NoEquilibrium) {
	r.end, r.endS, r.endWhy, r.endNoEq = end, t, why, ne
	w := r.st.y
	if n := len(r.evals); n > 0 {
		w = r.evals[n-1].water
	}
	r.events = append(r.events, FloodEvent{Kind: RunEnds, Name: end.String(), TimeS: t, WaterM3: w, Message: why})
}

// startEvents records what is already under water at the start.
func (r *FloodRun) startEvents(e floodEval) {
	if !e.ok() {
		return
	}
	p := e.pos
	if p.DeckEdge.HeightM <= 0 {
		r.addEvent(DeckEdgeReached, "", 0, e, fmt.Sprintf("the deck edge is under water from the start (%s side, x %.1f m)", p.DeckEdge.Side, p.DeckEdge.XM))
	}
	if p.MarginLine.HeightM <= 0 && r.v.Passenger() {
		r.addEvent(MarginLineReached, "", 0, e, "the margin line is under water from the start")
	}
	for _, o := range p.Openings {
		if !o.Weathertight && o.HeightM <= 0 {
			r.addEvent(OpeningReached, o.Name, 0, e, fmt.Sprintf("%s is under water from the start", o.Name))
		}
	}
	if r.c.Criteria != nil {
		r.lastCr = r.c.Criteria(r.v, r.damageAt(e.water), e.pos)
		for _, cr := range r.lastCr {
			if !cr.Pass && !cr.Indicator {
				r.failed[cr.Code] = true
				r.addEvent(CriterionFails, cr.Code, 0, e, fmt.Sprintf("%s fails from the start (%s)", cr.Requirement, cr.Set))
			}
		}
	}
}

func (r *FloodRun) addEvent(k FloodEventKind, name string, t float64, e floodEval, msg string) {
	r.events = append(r.events, FloodEvent{Kind: k, Name: name, TimeS: t, WaterM3: e.water, Message: msg})
}

// crossings finds the events inside the step from e0 to e1.
func (r *FloodRun) crossings(rec stepRec, e0, e1 floodEval) {
	if !e0.ok() || !e1.ok() {
		return
	}
	type probe struct {
		kind FloodEventKind
		name string
		g    func(p *Position) float64
		msg  func(p *Position) string
	}
	probes := []probe{
		{DeckEdgeReached, "", func(p *Position) float64 { return p.DeckEdge.HeightM },
			func(p *Position) string {
				return fmt.Sprintf("the deck edge goes under (%s side, x %.1f m)", p.DeckEdge.Side, p.DeckEdge.XM)
			}},
	}
	if r.v.Passenger() {
		probes = append(probes, probe{MarginLineReached, "", func(p *Position) float64 { return p.MarginLine.HeightM },
			func(p *Position) string {
				return fmt.Sprintf("the margin line goes under (%s side, x %.1f m)", p.MarginLine.Side, p.MarginLine.XM)
			}})
	}
	for i, o := range r.v.Openings {
		if o.Weathertight {
			continue
		}
		i, name := i, o.Name
		probes = append(probes, probe{OpeningReached, name,
			func(p *Position) float64 {
				if i < len(p.Openings) {
					return p.Openings[i].HeightM
				}
				return math.Inf(1)
			},
			func(p *Position) string { return fmt.Sprintf("%s goes under: water can spread through it", name) }})
	}
	var found []FloodEvent
	for _, pb := range probes {
		g0, g1 := pb.g(&e0.pos), pb.g(&e1.pos)
		if !(g0 > 0 && g1 <= 0) {
			continue
		}
		t, e := r.locate(rec, g0, g1, func(e *floodEval) float64 { return pb.g(&e.pos) })
		found = append(found, FloodEvent{Kind: pb.kind, Name: pb.name, TimeS: t, WaterM3: e.water, Message: pb.msg(&e.pos)})
	}
	if r.c.Criteria != nil {
		cr1 := r.c.Criteria(r.v, r.damageAt(e1.water), e1.pos)
		before := map[string]CriterionResult{}
		for _, c := range r.lastCr {
			before[c.Code] = c
		}
		for _, c := range cr1 {
			b, had := before[c.Code]
			if c.Pass || c.Indicator || r.failed[c.Code] {
				continue
			}
			r.failed[c.Code] = true
			t, w := rec.t1, e1.water
			if had && b.Pass {
				code := c.Code
				g := func(e *floodEval) float64 {
					for _, x := range r.c.Criteria(r.v, r.damageAt(e.water), e.pos) {
						if x.Code == code {
							if x.Pass {
								return math.Max(x.Margin, 1e-12)
							}
							return math.Min(x.Margin, 0)
						}
					}
					return 0
				}
				var e floodEval
				t, e = r.locate(rec, math.Max(b.Margin, 1e-12), math.Min(c.Margin, 0), g)
				w = e.water
			}
			found = append(found, FloodEvent{Kind: CriterionFails, Name: c.Code, TimeS: t, WaterM3: w,
				Message: fmt.Sprintf("%s fails (%s): %.3g %s against %.3g", c.Requirement, c.Set, c.Actual, c.Unit, c.Required)})
		}
		r.lastCr = cr1
	}
	sort.SliceStable(found, func(i, j int) bool { return found[i].TimeS < found[j].TimeS })
	r.events = append(r.events, found...)
}

// locate places the zero of g inside step rec, where g goes from g0 > 0 to
// g1 ≤ 0, by the Illinois method on the step fraction θ, the volume at θ
// from the step's cubic Hermite interpolant and each g from a solve. At
// most floodLocateIts solves; it stops when |g| is 1e-7 of its larger end
// value or the bracket is a millionth of the step. The time returned is on
// the far side of the zero (g ≤ 0 there).
func (r *FloodRun) locate(rec stepRec, g0, g1 float64, g func(e *floodEval) float64) (float64, floodEval) {
	a, b, ga, gb := 0.0, 1.0, g0, g1
	best := r.evals[len(r.evals)-1]
	bestT := rec.t1
	side := 0
	for i := 0; i < floodLocateIts && b-a > 1e-6; i++ {
		th := (a*gb - b*ga) / (gb - ga)
		if !(th > a && th < b) {
			th = (a + b) / 2
		}
		e := r.eval(rec.at(th))
		if !e.ok() {
			b, gb = th, -math.Abs(ga)
			continue
		}
		gt := g(&e)
		if gt <= 0 {
			best, bestT = e, rec.t0+th*(rec.t1-rec.t0)
			b, gb = th, gt
			if side == -1 {
				ga /= 2
			}
			side = -1
		} else {
			a, ga = th, gt
			if side == 1 {
				gb /= 2
			}
			side = 1
		}
		if math.Abs(gt) <= 1e-7*math.Max(g0, -g1) {
			break
		}
	}
	return bestT, best
}

// Progress returns where the run is.
func (r *FloodRun) Progress() FloodProgress {
	target := r.lbWater
	if r.lb == nil {
		target = r.capacity
	}
	e := r.evals[len(r.evals)-1]
	return FloodProgress{TimeS: r.st.t, LimitS: r.limit, WaterM3: e.water, TargetM3: target,
		HeadM: e.head, Steps: len(r.recs), Done: r.end != FloodRunning}
}

// Report finishes the run if it has not ended (running it to its end) and
// returns its outcome: the events, a table at round times and at the
// events, the trace of every step and the intermediate stages. The table
// and the stages cost some 20–30 further solves (plus their criteria).
func (r *FloodRun) Report() FloodReport {
	for r.Step() {
	}
	if r.report != nil {
		return *r.report
	}
	rep := FloodReport{
		Vessel: r.v.Name, Compartment: r.comp.Name, Hole: r.c.Hole, PumpM3h: r.pumpM3s * 3600, LimitS: r.limit,
		End: r.end, EndS: r.endS, EndReason: r.endWhy, EndNoEq: r.endNoEq, SteadyHeadM: r.hs,
		PumpsHoldLevel: r.end == FloodPumpsHold || r.end == FloodKeptDry,
		CapacityM3:     r.capacity, ContentsM3: r.contentsM3, LostBuoyancy: r.lb, LostBuoyancyNoEq: r.lbNoEq, LostBuoyancyWaterM3: r.lbWater,
		Events: append([]FloodEvent(nil), r.events...),
		Steps:  len(r.recs), Rejected: r.st.tries - len(r.recs),
	}
	if r.end == FloodEqualised {
		rep.EqualiseS = r.eqS
	}
	for i, e := range r.evals {
		t := 0.0
		if i > 0 {
			t = r.recs[i-1].t1
		}
		rep.Trace = append(rep.Trace, r.sample(t, e, false))
	}
	rep.Start = rep.Trace[0]
	rep.Final = r.sample(rep.Trace[len(rep.Trace)-1].TimeS, r.evals[len(r.evals)-1], false)
	if p := rep.Final.Position; p != nil {
		FillUpright(r.v, r.damageAt(rep.Final.WaterM3), p)
	}
	rep.FinalWaterM3 = rep.Final.WaterM3
	if rep.Final.Position != nil && r.lb != nil {
		f, l := rep.Final.Position, r.lb
		rep.FinalDiffM = math.Max(math.Abs(f.DraftAftM-l.DraftAftM), math.Max(math.Abs(f.DraftMidM-l.DraftMidM), math.Abs(f.DraftFwdM-l.DraftFwdM)))
	}
	rep.Table = r.table(rep)
	rep.StagesOfM3 = r.capacity
	switch {
	case r.end == FloodEqualised || r.end == FloodPumpsHold || r.end == FloodFull:
		rep.StagesOfM3 = rep.FinalWaterM3
	case r.endNoEq != nil || r.end == FloodFailed:
		rep.StagesOfM3 = rep.FinalWaterM3
	case r.lb != nil:
		rep.StagesOfM3 = r.lbWater
	}
	for _, f := range StageFractions {
		if f < 1 && !r.stagePassed(f*rep.StagesOfM3, rep.FinalWaterM3) {
			continue // a stage of a filling that never happens
		}
		rep.Stages = append(rep.Stages, r.stage(f, rep.StagesOfM3))
	}
	rep.Solves = r.solves
	r.report = &rep
	return rep
}

func (r *FloodRun) sample(t float64, e floodEval, judge bool) FloodSample {
	s := FloodSample{TimeS: t, WaterM3: e.water, InflowM3h: e.inflow * 3600, PumpedM3h: e.pumped * 3600, HeadM: e.head, SoundingM: e.sounding}
	if e.ok() {
		p := e.pos
		s.Position = &p
		if judge {
			FillUpright(r.v, r.damageAt(e.water), &p)
		}
		if judge && r.c.Criteria != nil {
			s.Criteria = r.c.Criteria(r.v, r.damageAt(e.water), p)
		}
	} else {
		s.NoEq = e.noEq
	}
	return s
}

// table makes rows at round times (about a dozen over the run) and at each
// event, each solved at the volume interpolated in its step.
func (r *FloodRun) table(rep FloodReport) []FloodSample {
	end := r.endS
	if r.endNoEq == nil && len(r.recs) > 0 {
		end = r.recs[len(r.recs)-1].t1
	}
	var times []float64
	var labels []string
	dt := roundInterval(end)
	for k := 0; dt > 0 && float64(k)*dt < end*(1-1e-9) && k < 100; k++ {
		times = append(times, float64(k)*dt)
		labels = append(labels, "")
	}
	if len(times) == 0 {
		times, labels = append(times, 0), append(labels, "")
	}
	for _, ev := range rep.Events {
		if ev.Kind == RunEnds {
			continue
		}
		times = append(times, ev.TimeS)
		labels = append(labels, ev.Kind.String()+nameSuffix(ev.Name))
	}
	idx := make([]int, len(times))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return times[idx[a]] < times[idx[b]] })
	var rows []FloodSample
	for _, i := range idx {
		t := times[i]
		e := r.evalAtTime(t)
		s := r.sample(t, e, true)
		s.Event = labels[i]
		rows = append(rows, s)
	}
	fin := rep.Final
	if r.endNoEq != nil {
		// The step that failed: the row at the end has no floating
		// position; the last good state is the one before it.
		fin = FloodSample{TimeS: r.endS, WaterM3: fin.WaterM3, NoEq: r.endNoEq}
	} else if r.c.Criteria != nil && fin.Position != nil {
		fin.Criteria = r.c.Criteria(r.v, r.damageAt(fin.WaterM3), *fin.Position)
	}
	fin.Event = RunEnds.String() + " " + r.end.String()
	if len(rows) > 0 && rows[len(rows)-1].TimeS == fin.TimeS && rows[len(rows)-1].Event == "" {
		rows = rows[:len(rows)-1]
	}
	return append(rows, fin)
}

func nameSuffix(n string) string {
	if n == "" {
		return ""
	}
	return " " + n
}

// evalAtTime solves at the volume the run had at t.
func (r *FloodRun) evalAtTime(t float64) floodEval {
	if t <= 0 || len(r.recs) == 0 {
		return r.evals[0]
	}
	i := sort.Search(len(r.recs), func(i int) bool { return r.recs[i].t1 >= t })
	if i >= len(r.recs) {
		return r.evals[len(r.evals)-1]
	}
	rec := r.recs[i]
	if t == rec.t1 {
		return r.evals[i+1]
	}
	return r.eval(rec.at((t - rec.t0) / (rec.t1 - rec.t0)))
}

// stage solves the fraction f of volume of, and finds when the run reached it.
func (r *FloodRun) stage(f, of float64) FloodStage {
	st := FloodStage{Fraction: f, WaterM3: f * of}
	var e floodEval
	if f == 1 && of == r.evals[len(r.evals)-1].water {
		e = r.evals[len(r.evals)-1]
	} else {
		e = r.eval(st.WaterM3)
	}
	if e.ok() {
		p := e.pos
		st.Position = &p
		FillUpright(r.v, r.damageAt(e.water), &p)
		if r.c.Criteria != nil {
			st.Criteria = r.c.Criteria(r.v, r.damageAt(e.water), p)
		}
	} else {
		st.NoEq = e.noEq
	}
	st.TimeS, st.Reached = r.timeOfVolume(st.WaterM3)
	return st
}

// timeOfVolume returns the first time the run held volume w (from the
// steps' interpolants; no solves).
func (r *FloodRun) timeOfVolume(w float64) (float64, bool) {
	if len(r.evals) > 0 && math.Abs(r.evals[0].water-w) <= 1e-9*r.capacity {
		return 0, true
	}
	for _, rec := range r.recs {
		lo, hi := math.Min(rec.y0, rec.y1), math.Max(rec.y0, rec.y1)
		tol := 1e-9 * r.capacity
		if w < lo-tol || w > hi+tol {
			continue
		}
		if math.Abs(rec.y1-w) <= tol {
			return rec.t1, true
		}
		a, b := 0.0, 1.0
		up := rec.y1 > rec.y0
		for i := 0; i < 60; i++ {
			m := (a + b) / 2
			if (rec.at(m) < w) == up {
				a = m
			} else {
				b = m
			}
		}
		return rec.t0 + (a+b)/2*(rec.t1-rec.t0), true
	}
	return 0, false
}

// FloodCriteria returns a FloodCase.Criteria that judges each condition by
// the vessel's own criteria sets (Vessel.CriteriaSets): its righting-lever
// curve by RightingLevers, then EvaluateCriteria, the condition counted as
// damaged (water held). shipType is as in CriteriaCase. A condition whose
// curve cannot be computed gets no results (nil), and so no event.
func FloodCriteria(shipType string) func(v *Vessel, d Damage, pos Position) []CriterionResult {
	return func(v *Vessel, d Damage, pos Position) []CriterionResult {
		if len(v.CriteriaSets) == 0 {
			return nil
		}
		curve, err := RightingLevers(NewProblem(v, d), pos)
		if err != nil {
			return nil
		}
		res, err := EvaluateCriteria(v.CriteriaSets, CriteriaCase{Curve: curve, Eq: pos, Damaged: IsDamaged(d), ShipType: shipType})
		if err != nil {
			return nil
		}
		return res
	}
}

// RunFlood runs case c to its end, calling progress (if not nil) after each
// step, and returns the report.
func RunFlood(c FloodCase, progress func(FloodProgress)) (FloodReport, error) {
	r, err := NewFloodRun(c)
	if err != nil {
		return FloodReport{}, err
	}
	for r.Step() {
		if progress != nil {
			progress(r.Progress())
		}
	}
	if progress != nil {
		progress(r.Progress())
	}
	return r.Report(), nil
}

// ShellHole returns a hole of area areaM2 in the shell of compartment ci of
// v: at the middle of the compartment's length, on its outboard side
// (starboard for a compartment that straddles the centreline), at height
// zM; NaN for zM puts it at the compartment's lowest point (the worst
// case: the full head until the levels meet). A height outside the
// compartment is taken to its nearest bound.
func ShellHole(v *Vessel, ci int, areaM2, zM, cd float64) (Hole, error) {
	if v == nil || ci < 0 || ci >= len(v.Compartments) {
		return Hole{}, fmt.Errorf("flooding: no compartment %d", ci)
	}
	c := v.Compartments[ci]
	xmin, xmax, _, _ := c.solid.Extent()
	x := (xmin + xmax) / 2
	poly := c.solid.SectionAt(x)
	if len(poly) < 3 {
		return Hole{}, fmt.Errorf("flooding %q: no section at x %.2f m", c.Name, x)
	}
	side := 1.0
	if mid := (c.Box.Y0 + c.Box.Y1) / 2; mid < -1e-9 {
		side = -1
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, p := range poly {
		lo, hi = math.Min(lo, p.Z), math.Max(hi, p.Z)
	}
	if math.IsNaN(zM) {
		zM = lo
	}
	if math.IsInf(zM, 0) {
		return Hole{}, fmt.Errorf("flooding %q: hole height %v is not finite", c.Name, zM)
	}
	if zM < lo-1e-6 || zM > hi+1e-6 {
		return Hole{}, fmt.Errorf("flooding %q: a hole at height %.2f m is outside the compartment, which runs from z %.2f to %.2f m at mid-length", c.Name, zM, lo, hi)
	}
	zM = math.Max(lo, math.Min(hi, zM))
	// The outboard-most point of the section at that height: crossings of
	// the horizontal line with the edges, and vertices lying on it.
	best := math.Inf(-1)
	for k := range poly {
		a, b := poly[k], poly[(k+1)%len(poly)]
		var y float64
		switch {
		case a.Z == zM:
			y = a.Y
		case (a.Z < zM) != (b.Z < zM):
			y = a.Y + (zM-a.Z)/(b.Z-a.Z)*(b.Y-a.Y)
		default:
			continue
		}
		best = math.Max(best, side*y)
	}
	if math.IsInf(best, -1) {
		return Hole{}, fmt.Errorf("flooding %q: no shell at z %.2f m", c.Name, zM)
	}
	return Hole{AreaM2: areaM2, XM: x, YM: side * best, ZM: zM, Cd: cd}, nil
}

// FormatDuration writes s seconds as "1 h 05 min", "12 min 30 s" or "45 s".
func FormatDuration(s float64) string {
	if math.IsNaN(s) || s < 0 {
		return "—"
	}
	n := int64(math.Round(s))
	h, m, sec := n/3600, n%3600/60, n%60
	switch {
	case h > 0:
		return fmt.Sprintf("%d h %02d min", h, m)
	case m > 0:
		return fmt.Sprintf("%d min %02d s", m, sec)
	}
	return fmt.Sprintf("%d s", sec)
}

// roundInterval picks a round interval giving at most a dozen rows over end.
func roundInterval(end float64) float64 {
	for _, d := range []float64{10, 30, 60, 120, 300, 600, 900, 1200, 1800, 3600, 7200, 10800, 21600, 43200} {
		if end/d <= 12 {
			return d
		}
	}
	return 86400
}

// stepRec is one accepted step: from (t0, y0) with slope f0 to (t1, y1)
// with slope f1.
type stepRec struct {
	t0, t1, y0, y1, f0, f1 float64
}

// at returns the cubic Hermite interpolant of the step at fraction θ.
func (s stepRec) at(th float64) float64 {
	h := s.t1 - s.t0
	t2, t3 := th*th, th*th*th
	return (2*t3-3*t2+1)*s.y0 + (t3-2*t2+th)*h*s.f0 + (-2*t3+3*t2)*s.y1 + (t3-t2)*h*s.f1
}

// stepper integrates the scalar autonomous equation dy/dt = f(y) by the
// Dormand–Prince 5(4) pair with error control, first same as last. The
// solution is kept inside [ymin, ymax]: a trial step that would leave it is
// cut back so as to land on the bound.
type stepper struct {
	f          func(y float64) (float64, error)
	t, y, fy   float64
	dt         float64
	atol, rtol float64
	dtMin      float64
	ymin, ymax float64
	tries      int
	maxTries   int
}

var errStepBound = errors.New("the flooding calculation needed more steps than it is allowed; the figures end where it stopped")

// Dormand–Prince 5(4) tableau (Dormand & Prince 1980). The nodes c are not
// needed: the rate of flooding depends on the water in, not on time.
var (
	dpA = [7][6]float64{
		{},
		{1.0 / 5},
		{3.0 / 40, 9.0 / 40},
		{44.0 / 45, -56.0 / 15, 32.0 / 9},
		{19372.0 / 6561, -25360.0 / 2187, 64448.0 / 6561, -212.0 / 729},
		{9017.0 / 3168, -355.0 / 33, 46732.0 / 5247, 49.0 / 176, -5103.0 / 18656},
		{35.0 / 384, 0, 500.0 / 1113, 125.0 / 192, -2187.0 / 6784, 11.0 / 84},
	}
	// dpE is the fifth-order weights minus the fourth-order ones.
	dpE = [7]float64{71.0 / 57600, 0, -71.0 / 16695, 71.0 / 1920, -17253.0 / 339200, 22.0 / 525, -1.0 / 40}
)

// dpTry takes one trial step of size h from y0 (slope f0) and returns the
// fifth-order y1, the slope there and the error estimate. The last call of
// f is at y1.
func dpTry(f func(float64) (float64, error), y0, f0, h float64) (y1, f1, errEst float64, err error) {
	var k [7]float64
	k[0] = f0
	for i := 1; i < 7; i++ {
		y := y0
		for j := 0; j < i; j++ {
			y += h * dpA[i][j] * k[j]
		}
		if i == 6 {
			y1 = y
		}
		k[i], err = f(y)
		if err != nil {
			return 0, 0, 0, err
		}
	}
	for i := range k {
		errEst += h * dpE[i] * k[i]
	}
	return y1, k[6], errEst, nil
}

// advance takes one accepted step, not past tEnd. A trial whose f fails is
// halved; when the step would fall below dtMin the failure is returned.
func (s *stepper) advance(tEnd float64) (stepRec, error) {
	for {
		if s.tries >= s.maxTries {
			return stepRec{}, errStepBound
		}
		s.tries++
		dt := math.Min(s.dt, tEnd-s.t)
		if !(dt > 0) {
			return stepRec{}, errStepBound
		}
		y1, f1, e, err := dpTry(s.f, s.y, s.fy, dt)
		if err != nil {
			if dt/2 < s.dtMin {
				s.dt = dt
				return stepRec{}, err
			}
			s.dt = dt / 2
			continue
		}
		// Keep inside the bounds: land on the bound the step would cross.
		bound := math.NaN()
		switch {
		case y1 > s.ymax && s.y < s.ymax:
			bound = s.ymax
		case y1 < s.ymin && s.y > s.ymin:
			bound = s.ymin
		}
		if !math.IsNaN(bound) {
			if math.Abs(y1-bound) <= 1e-9*math.Max(s.ymax-s.ymin, 1) {
				y1 = bound
			} else {
				s.dt = dt * math.Max(0.1, math.Min(0.999, (bound-s.y)/(y1-s.y)))
				continue
			}
		}
		sc := s.atol + s.rtol*math.Max(math.Abs(s.y), math.Abs(y1))
		ratio := math.Abs(e) / sc
		if math.IsNaN(ratio) || math.IsInf(ratio, 0) {
			ratio = 1e6
		}
		grow := 5.0
		if ratio > 0 {
			grow = math.Max(0.2, math.Min(5, 0.9*math.Pow(ratio, -0.2)))
		}
		if ratio > 1 && dt > s.dtMin {
			s.dt = math.Max(dt*grow, s.dtMin)
			continue
		}
		rec := stepRec{t0: s.t, t1: s.t + dt, y0: s.y, y1: y1, f0: s.fy, f1: f1}
		if dt == tEnd-s.t {
			rec.t1 = tEnd
		}
		s.t, s.y, s.fy = rec.t1, y1, f1
		s.dt = dt * grow
		return rec, nil
	}
}
