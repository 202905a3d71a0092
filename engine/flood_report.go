package engine

import (
	"math"
	"sort"
)

// This file makes the outcome of a flooding run: its progress while it
// runs, and, at the end, the report with its table at round times and at
// the events, the trace of every step and the intermediate stages.

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
	Strength *Strength // the hull girder at this stage (strength.go); nil without weight extents
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
	Permeability   float64 // μ of the flooded compartment, as used (Vessel.Permeability of the base state)
	CapacityM3     float64 // μ × the compartment's volume
	ContentsM3     float64 // a tank's contents at the start, as sea water of the same mass; 0 for a dry space
	// Spills is the holed tank's contents when they are not water (oil,
	// cargo liquid): what may escape to the sea (see spill.go); nil else.
	Spills []Spill

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
	Stages []FloodStage  // 25, 50, 75 and 100 % of StagesOfM3; only those the water goes through (and the end)
	// StagesOfM3 is the volume the stages are fractions of: the water at
	// the end when the run settled (equalised, pumps hold, full) or when she
	// sank or capsized (the last floating state: the stages lead up to the
	// loss); at the time limit the lost-buoyancy water (what equalisation
	// would let in), or the capacity when she does not float so.
	StagesOfM3 float64

	Steps, Rejected, Solves int
}

// stageFractions are the intermediate stages reported, with the final.
var stageFractions = [...]float64{0.25, 0.5, 0.75, 1}

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
		Permeability:   r.mu, CapacityM3: r.capacity, ContentsM3: r.contentsM3, Spills: r.spills(), LostBuoyancy: r.lb, LostBuoyancyNoEq: r.lbNoEq, LostBuoyancyWaterM3: r.lbWater,
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
		r.fillUprightAt(rep.Final.WaterM3, p)
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
	for _, f := range stageFractions {
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
			r.fillUprightAt(e.water, &p)
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
		r.fillUprightAt(e.water, &p)
		if r.c.Criteria != nil {
			st.Criteria = r.c.Criteria(r.v, r.damageAt(e.water), p)
		}
		st.Strength, _ = GirderStrength(r.v, r.damageAt(e.water), &p)
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

// roundInterval picks a round interval giving at most a dozen rows over end.
func roundInterval(end float64) float64 {
	for _, d := range []float64{10, 30, 60, 120, 300, 600, 900, 1200, 1800, 3600, 7200, 10800, 21600, 43200} {
		if end/d <= 12 {
			return d
		}
	}
	return 86400
}
