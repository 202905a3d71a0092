package engine

import "math"

// This file holds the one root-finder of the engine for functions that cost
// a solve per value: the angle of vanishing stability (gz.go), the moment
// of an event inside a flooding step (flood_events.go, network_run.go) and
// the amount of a righting option that brings her nearest upright
// (remedy.go).

// illinois narrows a bracket [a, b] of a sign change of f (fa and fb of
// opposite signs, f(a) = fa, f(b) = fb) by the Illinois variant of regula
// falsi (Dowell & Jarratt, BIT 11 (1971) 168–174): each try is the chord's
// root, x = a + fa/(fa−fb)·(b−a), and when the same end is kept twice in a
// row the value at the other end is halved, which makes the convergence
// superlinear (order ≈ 1.44) where plain regula falsi stalls on one end.
//
// first, when it lies strictly inside (a, b), is the first try instead of
// the chord's root (a better guess the caller has, e.g. a Hermite root); a
// chord root that is not strictly inside the bracket (round-off) is replaced
// by the midpoint.
//
// f is called at each try and returns the value there and whether it has
// one. The caller keeps whatever it wants of the tries (the best, the last
// beyond the zero) in f itself. The search stops after maxTries calls of f,
// when the bracket is no wider than xTol, when |f(x)| ≤ fTol, or when f has
// no value, unless failBeyond is set: an x without a value is then taken as
// lying beyond the zero (the bracket's b end moves to it, with fb = −fa).
//
// Special cases: NaN or equal-signed fa and fb is a programmer's mistake
// and panics; a bracket already no wider than xTol calls f no time.
func illinois(a, b, fa, fb, first float64, maxTries int, xTol, fTol float64, failBeyond bool, f func(x float64) (float64, bool)) {
	if !(fa > 0 && fb <= 0 || fa <= 0 && fb > 0) {
		panic("engine: illinois without a sign change")
	}
	side := 0 // the end kept last: -1 a, +1 b
	for i := 0; i < maxTries && math.Abs(b-a) > xTol; i++ {
		x := first
		if i > 0 || !(x > math.Min(a, b) && x < math.Max(a, b)) {
			x = a + fa/(fa-fb)*(b-a)
		}
		if !(x > math.Min(a, b) && x < math.Max(a, b)) {
			x = (a + b) / 2
		}
		fx, ok := f(x)
		if !ok {
			if !failBeyond {
				return
			}
			b, fb = x, -fa
			continue
		}
		if (fx > 0) == (fa > 0) {
			a, fa = x, fx
			if side == -1 {
				fb /= 2
			}
			side = -1
		} else {
			b, fb = x, fx
			if side == 1 {
				fa /= 2
			}
			side = 1
		}
		if math.Abs(fx) <= fTol {
			return
		}
	}
}
