package engine

// warmStart is the last plane solved in a sequence of nearby conditions (a
// flooding run's or a drill's water rising step by step): each solve starts
// from it (Problem.EquilibriumFrom) and, when it finds a floating position,
// keeps that one for the next.
type warmStart struct {
	plane Plane
	ok    bool
}

// solve finds where v floats under d, started from the last plane solved.
// It returns the position, or why there is none (the last plane is then
// kept).
func (ws *warmStart) solve(v *Vessel, d Damage) (Position, *NoEquilibrium) {
	pos, err := NewProblem(v, d).EquilibriumFrom(ws.plane, ws.ok)
	if err != nil {
		return Position{}, asNoEquilibrium(err)
	}
	ws.plane, ws.ok = pos.Plane, true
	return pos, nil
}
