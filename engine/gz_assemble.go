package engine

import (
	"fmt"
	"math"
)

// This file joins the spans of a GZ curve (gz_span.go) into the curve, by
// the rules of a curve worked from one end to the other: samples in heel
// order; the first fall of GZ through zero beyond the equilibrium refined
// (by the span that holds both samples, or here when they lie on either
// side of a span's start) and added as a sample; the end at the first heel
// of at least gzMinEndDeg after it, or at gzEndDeg; the first heel that
// cannot be solved ends the curve, with a note. Work a span did beyond the
// end is left out.

// errSpanCut is the panic message for a curve whose spans were cut short
// before its end: a fault of curveWork.limit's bound.
const errSpanCut = "engine: a GZ span was cut short before the curve's end"

// assemble joins w's worked spans into the curve and returns it with its
// solved samples (index-aligned with its heels), or the error of a curve
// that fails at its first or second heel. pr solves the fall of GZ through
// zero when it lies across a span's start, and the samples the deck-edge
// and downflooding angles of a coarse curve need (firstImmersionStep).
func (pr *Problem) assemble(w *curveWork) (*GZCurve, []solvedHeel, error) {
	sgn := float64(w.side)
	c := &GZCurve{Toward: w.side, EquilibriumDeg: w.eqDeg}
	var sol []solvedHeel
	if len(w.spans) == 1 {
		// One span: the curve is its samples, in the same order, so they
		// are kept where they are (each is written over itself).
		s := &w.spans[0]
		c.HeelDeg, c.GZM, sol = s.heels[:0], s.gz[:0], s.sol[:0]
	} else {
		c.HeelDeg, c.GZM, sol = make([]float64, 0, 96), make([]float64, 0, 96), make([]solvedHeel, 0, 96)
	}
	push := func(deg, gz float64, sh solvedHeel) {
		c.HeelDeg = append(c.HeelDeg, deg)
		c.GZM = append(c.GZM, gz)
		sol = append(sol, sh)
	}
	found := false
	ended := false
	for si := 0; si < len(w.spans) && !ended; si++ {
		s := &w.spans[si]
		for i := 0; i < len(s.heels) && !ended; i++ {
			if i == s.vanIx {
				continue // added below with its fall through zero, if that is the curve's first
			}
			deg, gz, sh := s.heels[i], s.gz[i], s.sol[i]
			n := len(c.HeelDeg)
			if !found && n > 0 && c.GZM[n-1] > 0 && gz <= 0 && c.HeelDeg[n-1] >= c.EquilibriumDeg-1e-9 {
				found = true
				c.Vanishes = true
				v := s.van
				if i != s.cross {
					// The two samples lie across the span's start (a
					// fall within the span would be its first, s.cross).
					if i != 0 {
						panic("engine: a GZ span missed the fall of GZ through zero")
					}
					v.deg, v.gz, v.sh = pr.vanishing(sgn, c.HeelDeg[n-1], deg, c.GZM[n-1], gz, sol[n-1], sh)
				}
				c.VanishingDeg = v.deg
				if v.deg-c.HeelDeg[n-1] > 1e-3 && deg-v.deg > 1e-3 {
					push(v.deg, v.gz, v.sh)
				}
			}
			push(deg, gz, sh)
			if s.k0 == 0 && i == 0 {
				c.upright, c.hasUpright = sh.p, true
			}
			ended = deg >= gzEndDeg || found && deg >= gzMinEndDeg
		}
		if ended {
			break
		}
		if s.failed() {
			if len(c.HeelDeg) < 2 {
				if s.failErr != nil {
					return nil, nil, s.failErr
				}
				return nil, nil, &NoEquilibrium{NotConverged, fmt.Sprintf("no righting lever found at %.1f° of heel", s.failDeg)}
			}
			what := "no draft and trim found"
			if s.failErr == nil {
				what = "no righting lever found"
			}
			c.Note = fmt.Sprintf("%s at %.1f° of heel: the curve ends at %.1f°", what, s.failDeg, c.HeelDeg[len(c.HeelDeg)-1])
			break
		}
		if s.cut {
			panic(errSpanCut)
		}
	}
	if len(c.HeelDeg) == 0 {
		panic(errSpanCut)
	}
	last := c.HeelDeg[len(c.HeelDeg)-1]
	if !found {
		c.VanishingDeg = last
	}
	c.RangeDeg = math.Max(0, c.VanishingDeg-c.EquilibriumDeg)
	c.fit()
	c.GZMaxM, c.GZMaxDeg = c.MaxBetween(0, last)

	h := pr.v.Hull
	var deck []immersionPoint
	for i := range h.stations {
		x, hb, z := h.DeckEdge(i)
		deck = append(deck, immersionPoint{x: x, y: hb, z: z}, immersionPoint{x: x, y: -hb, z: z})
	}
	c.DeckEdgeDeg, _ = pr.firstImmersionStep(sgn, c.HeelDeg, sol, deck, w.step)
	pr.downfloodingStep(c, sol, w.step)
	return c, sol, nil
}
