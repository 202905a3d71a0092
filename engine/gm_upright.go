package engine

import "math"

// This file holds the two GMs every screen shows: the upright GM of a
// condition (what an officer means by GM, and what tells a list from a
// loll) and the GM where she lies (the slope of the GZ curve at her heel).

// gmAtRest returns the slope of the GZ curve (m/rad) at the attitude of
// state s: dGZ/dθ at constant displacement and free trim, from the exact
// Jacobian by the implicit-function theorem (see slopes). For a converged
// equilibrium this is the metacentric height where she lies: BMθ − BG
// measured along the vertical, with the coupling of heel and trim kept
// (Tupper, Introduction to Naval Architecture, on the GZ curve's slope).
// fallback is returned when s carries no Jacobian or the slope is not
// finite.
func gmAtRest(s state, fallback float64) float64 {
	if !s.jac || !(s.e.V > 0) {
		return fallback
	}
	sh := slopes(s, s.p, s.f[2], s.e.V, 1)
	if !sh.haveSlopes {
		return fallback
	}
	g := sh.dGZ * 180 / math.Pi
	if math.IsNaN(g) || math.IsInf(g, 0) {
		return fallback
	}
	return g
}

// uprightAt returns the upright GM at the upright plane p (free trim,
// constant displacement, solved): KM − KG − FSC of the waterplane still
// intact, floodwater held counted with its own free surface.
func (pr *Problem) uprightAt(p Plane) float64 {
	p.C = 0
	return pr.position(pr.eval(p, false), 0).GMUprightM
}

// shipBasis is the factor Δ/(Δ − floodwater held) that puts a GM of the
// whole (ship and floodwater held as added weight) on the lost-buoyancy
// basis, the ship's own weight, keeping the righting moment Δ·GM.
func (pr *Problem) shipBasis() float64 {
	if !(pr.load.MassT > 0) {
		return 1
	}
	return pr.massT / pr.load.MassT
}

// FillUpright sets pos.GMUprightM for damage state d of v when it is not
// set yet (see UprightGM); it stays NaN when she cannot be solved upright.
func FillUpright(v *Vessel, d Damage, pos *Position) {
	if pos == nil || !math.IsNaN(pos.GMUprightM) {
		return
	}
	if gm, ok := UprightGM(v, d, pos); ok {
		pos.GMUprightM = gm
	}
}

// IsLoll reports whether a position is a loll: she lies heeled with a
// negative upright GM (the heel is where GZ has come back to zero, not the
// effect of an off-centre weight).
func (p *Position) IsLoll() bool {
	return p != nil && p.GMUprightM < 0 && math.Abs(p.HeelDeg) >= 1e-6
}

// LollAngleDeg returns the angle of loll of a wall-sided form with upright
// GM gm (< 0) and upright BM bm: tan θ = √(−2 GM / BM) (Barrass & Derrett,
// Ship Stability for Masters and Mates, on the angle of loll). NaN when gm
// is not negative or bm not positive.
func LollAngleDeg(gm, bm float64) float64 {
	if !(gm < 0) || !(bm > 0) {
		return math.NaN()
	}
	return math.Atan(math.Sqrt(-2*gm/bm)) * 180 / math.Pi
}
