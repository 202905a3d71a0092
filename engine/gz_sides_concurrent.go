package engine

import "math"

// This file works the two sides of the GZ curve of a ship lying near
// upright at the same time, their spans shared out over the cores
// (gz_crew.go), so that a keystroke uses them all. Each goroutine works on
// its own copy of the problem (the arc hints carried from one evaluation
// to the next are per problem and are written as it goes); the hints only
// choose where the search for a slab's arc under the water starts, never
// its result, so the curves are exactly those worked one after the other.

// fork returns a copy of pr that may be evaluated beside pr on another
// goroutine: the same condition, with arc hints of its own.
func (pr *Problem) fork() *Problem {
	f := *pr
	f.hints = pr.v.Hull.solid.newArcHints()
	f.open = make([]openSpace, len(pr.open))
	for i, o := range pr.open {
		f.open[i] = openSpace{o.solid, o.mu, o.solid.newArcHints()}
	}
	return &f
}

// leversBothSides returns RightingLevers(pr, eq) with, when she lies
// within NearUprightDeg of upright, the other side's curve in Other (as
// withOtherSide gives it), the other side worked beside the curve towards
// her own side.
func (pr *Problem) leversBothSides(eq Position) (*GZCurve, error) {
	return pr.leversHelped(eq, nil)
}

// leversHelped is leversBothSides with help offered to work the curves'
// spans (see spanHelp).
func (pr *Problem) leversHelped(eq Position, help *spanHelp) (*GZCurve, error) {
	h := math.Abs(eq.HeelDeg)
	if !(h >= uprightDeg && h < NearUprightDeg) {
		gz, err := pr.rightingLevers(eq, help)
		if err != nil {
			return nil, err
		}
		return pr.withOtherSide(gz, eq), nil
	}
	return pr.leversBeside(eq, help)
}

// leversBeside is leversHelped for a ship heeled within NearUprightDeg:
// the two sides' curves worked together (leverCurves).
func (pr *Problem) leversBeside(eq Position, help *spanHelp) (*GZCurve, error) {
	toward := Starboard
	if eq.HeelDeg < 0 {
		toward = Port
	}
	// The other side's curve, one long span, is asked first (spanOrder).
	ws := pr.leverCurves(eq, []curveAsk{{-toward, otherSideStepDeg}, {toward, gzStepDeg}}, help)
	other, own := ws[0], ws[1]
	if own.err != nil {
		return nil, own.err
	}
	if other.err != nil {
		return own.c, nil
	}
	cc := *own.c
	cc.Other = other.c
	return &cc, nil
}
