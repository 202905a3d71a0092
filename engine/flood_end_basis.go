package engine

import "math"

// uprightDamage is the damage state whose upright GM the run shows at water
// w. While the water inside is below the sea's level it is held as an added
// weight (damageAt). Once the levels have met (the run ended equalised and w
// is its end volume) the compartment is in free communication with the sea:
// as she is brought upright the water in it follows the sea's level, which
// the added weight's own free surface does not see (the free-communication
// loss of GM, ρ·μ·a·d²/Δ for a space of waterplane a whose centre is d off
// the centreline). That state is the compartment open to the sea, so its
// upright GM is worked out as the lost-buoyancy solution's: one GM wherever
// the one position appears (on a centreline space the two agree anyway).
func (r *FloodRun) uprightDamage(w float64) Damage {
	d := r.damageAt(w)
	if r.end != FloodEqualised || len(r.evals) == 0 || w < r.evals[len(r.evals)-1].water*(1-1e-9) {
		return d
	}
	d[r.ci] = SpaceState{Open: true, Permeability: d[r.ci].Permeability}
	return d
}

// fillUprightAt sets p's upright GM for the run's state at water w (see
// uprightDamage); at the levels' meeting it sets both GMs (upright and
// where she lies) as open to the sea, in place of the added weight's.
func (r *FloodRun) fillUprightAt(w float64, p *Position) {
	d := r.uprightDamage(w)
	if !d[r.ci].Open {
		FillUpright(r.v, d, p)
		return
	}
	openBasisGMs(r.v, d, p)
}

// openBasisGMs sets both GMs of p (upright, and where she lies) as worked
// out for damage state d with its flooded spaces open to the sea, at p's own
// plane: for a run's end that has become that state (the levels met), in
// place of the added weight's. As UprightGM, from her own draft and trim
// brought upright, but always solved: the position's own GM is the added
// weight's. The slope is taken at p's plane, the lost-buoyancy equilibrium
// to within the run's tolerance.
func openBasisGMs(v *Vessel, d Damage, p *Position) {
	pr := NewProblem(v, d)
	if pl, _, err := pr.AtHeel(0, Plane{A: p.Plane.A, B: p.Plane.B}); err == nil {
		p.GMUprightM = pr.uprightAt(pl)
	}
	p.GMAtRestM = gmAtRest(pr.eval(p.Plane, true), p.GMAtRestM) * pr.shipBasis()
	if math.Abs(p.HeelDeg) < 1e-9 && !math.IsNaN(p.GMUprightM) {
		p.GMAtRestM = p.GMUprightM
	}
}
