package engine

// This file follows a compartment filling through a hole over time, against
// its pumps: the inflow by Torricelli's law, the ship re-solved with the
// water as an added weight at every evaluation, and where it ends (levels
// equal, pumps holding, compartment full, sinking, capsizing, time limit).
// The case it is given is in flood_case.go, the integrator in
// dormand_prince.go, the events on the way in flood_events.go, how it ends
// in flood_end.go and its report and intermediate stages in
// flood_report.go.

import (
	"errors"
	"fmt"
	"math"
)

// Bounds that keep a run finite.
const (
	floodMaxTries  = 4000 // trial steps of the integrator, accepted or not
	floodLocateIts = 16   // solves to place one event inside a step
	floodRelTol    = 1e-8 // integrator: relative error per step on the water volume
	floodAbsTol    = 1e-8 // … and absolute, as a fraction of the compartment's capacity
	floodFloorFrac = 1e-9 // least water held, as a fraction of the capacity (see FloodRun)
)

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
	warm    warmStart
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
	if err := CheckDamage(v, base); err != nil {
		return nil, fmt.Errorf("flooding: base damage state: %w", err)
	}
	c.Base = base
	c.Hole = h
	c.LimitS = limit

	r := &FloodRun{c: c, v: v, ci: c.Compartment, comp: comp, cd: h.Cd, limit: limit, zmin: zmin}
	r.mu = v.Permeability(base, r.ci)
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
	pos, noEq := r.warm.solve(r.v, r.damageAt(w))
	r.solves++
	if noEq != nil {
		e.noEq = noEq
		return e
	}
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
		r.finish(FloodTimeLimit, rec.t1, fmt.Sprintf("the time limit came first: %.1f m³ in, head %.3f m", e.water, e.head), nil)
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
		r.finish(FloodEqualised, t, fmt.Sprintf("the level inside has %s the sea's: %.1f m³ in", r.levelWent(e.water), e.water), nil)
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
		pr := NewProblem(v, d)
		curve, err := pr.leversBothSides(pos)
		if err != nil {
			return nil
		}
		res, err := JudgeCriteria(v.CriteriaSets, CriteriaCase{Curve: curve, Eq: pos, Damaged: IsDamaged(d), ShipType: shipType})
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
