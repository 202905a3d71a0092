package engine

import "math"

// This file works the two sides of the GZ curve of a ship lying near
// upright at the same time, on two goroutines, so that a keystroke uses
// both cores. Each side is worked on its own copy of the problem (the arc
// hints carried from one evaluation to the next are per problem and are
// written as it goes); the hints only choose where the search for a
// slab's arc under the water starts, never its result, so the curves are
// exactly those worked one after the other.

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
// withOtherSide gives it), the other side worked on a forked problem
// beside the curve towards her own side.
func (pr *Problem) leversBothSides(eq Position) (*GZCurve, error) {
	h := math.Abs(eq.HeelDeg)
	if !(h >= uprightDeg && h < NearUprightDeg) {
		gz, err := RightingLevers(pr, eq)
		if err != nil {
			return nil, err
		}
		return pr.withOtherSide(gz, eq), nil
	}
	return pr.leversBeside(eq)
}

// leversBeside is leversBothSides for a ship heeled within
// NearUprightDeg (kept apart so that only this path pays for the
// goroutine).
func (pr *Problem) leversBeside(eq Position) (*GZCurve, error) {
	toward := Starboard
	if eq.HeelDeg < 0 {
		toward = Port
	}
	type result struct {
		c   *GZCurve
		err error
	}
	done := make(chan result, 1)
	f := pr.fork()
	go func() {
		c, _, err := f.leverCurveStep(-toward, eq, otherSideStepDeg)
		done <- result{c, err}
	}()
	gz, err := RightingLevers(pr, eq)
	other := <-done
	if err != nil {
		return nil, err
	}
	if gz == nil || gz.Other != nil || other.err != nil {
		return gz, nil
	}
	cc := *gz
	cc.Other = other.c
	return &cc, nil
}
