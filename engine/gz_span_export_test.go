package engine

// CurvesSplitAndWhole returns, for v under d lying at pos, the curves a
// keystroke works (towards her own side every 1°, and near upright the
// other side's every 3°, in that order), worked in spans as Assess works
// them and each in one span from 0°, and the number of spans of the curve
// towards her own side.
func CurvesSplitAndWhole(v *Vessel, d Damage, pos Position) (split, whole []*GZCurve, spans int, err error) {
	toward := Starboard
	if pos.HeelDeg < 0 {
		toward = Port
	}
	asks := []curveAsk{{toward, gzStepDeg}, {-toward, otherSideStepDeg}}
	pr := NewProblem(v, d)
	for _, starts := range []func(float64) []float64{pr.spanStarts, wholeStarts} {
		ws := pr.leverCurvesFrom(pos, asks, starts, nil)
		var cs []*GZCurve
		for _, w := range ws {
			if w.err != nil {
				return nil, nil, 0, w.err
			}
			cs = append(cs, w.c)
		}
		if split == nil {
			split, spans = cs, len(ws[0].spans)
		} else {
			whole = cs
		}
	}
	return split, whole, spans, nil
}

// wholeStarts is the span table of curves worked from one end to the
// other.
func wholeStarts(float64) []float64 { return []float64{0} }

// SameCurve says how curve split differs from whole beyond the solver's
// tolerance (see sameCurve); "" when it does not.
func SameCurve(split, whole *GZCurve) string { return sameCurve(split, whole) }
