package engine

// OtherSideBothWays returns, for v under d lying at pos, the curve towards
// the other side from upright sampled as Assess samples it and at every
// 1°: for tests of the thinned curve.
func OtherSideBothWays(v *Vessel, d Damage, pos Position) (thin, full *GZCurve, err error) {
	side := Port
	if pos.HeelDeg < 0 {
		side = Starboard
	}
	if thin, _, err = NewProblem(v, d).leverCurveStep(side, pos, otherSideStepDeg); err != nil {
		return nil, nil, err
	}
	full, _, err = NewProblem(v, d).leverCurve(side, pos)
	return thin, full, err
}
