package engine

import (
	"fmt"
	"math"
	"sort"
)

// This file finds the events of a flooding run: what is under water at the
// start, and each crossing inside a step (deck edge, margin line, openings,
// a criterion that fails), placed by the Illinois root-finder (illinois.go)
// on the step's interpolant.

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
		if o.Progressive() && o.HeightM <= 0 {
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
	if r.v.Passenger() { // a cargo ship has no margin line: the deck edge is the line
		probes = append(probes, probe{MarginLineReached, "", func(p *Position) float64 { return p.MarginLine.HeightM },
			func(p *Position) string {
				return fmt.Sprintf("the margin line goes under (%s side, x %.1f m)", p.MarginLine.Side, p.MarginLine.XM)
			}})
	}
	for i, o := range r.v.Openings {
		if o.Weathertight || r.v.LeadsToIndex(o) == r.ci {
			continue // closed, or into the compartment flooding already
		}
		i, name := i, o.Name
		probes = append(probes, probe{OpeningReached, name,
			func(p *Position) float64 {
				if i < len(p.Openings) && !p.Openings[i].IntoFlooded {
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
// g1 ≤ 0, by the Illinois method (illinois) on the step fraction θ, the volume at θ
// from the step's cubic Hermite interpolant and each g from a solve. At
// most floodLocateIts solves; it stops when |g| is 1e-7 of its larger end
// value or the bracket is a millionth of the step. The time returned is on
// the far side of the zero (g ≤ 0 there).
func (r *FloodRun) locate(rec stepRec, g0, g1 float64, g func(e *floodEval) float64) (float64, floodEval) {
	best := r.evals[len(r.evals)-1]
	bestT := rec.t1
	illinois(0, 1, g0, g1, math.NaN(), floodLocateIts, 1e-6, 1e-7*math.Max(g0, -g1), true, func(th float64) (float64, bool) {
		e := r.eval(rec.at(th))
		if !e.ok() {
			return 0, false
		}
		gt := g(&e)
		if gt <= 0 {
			best, bestT = e, rec.t0+th*(rec.t1-rec.t0)
		}
		return gt, true
	})
	return bestT, best
}
