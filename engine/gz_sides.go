package engine

import (
	"fmt"
	"math"
)

// This file judges the criteria on the worse side of the GZ curve while
// she lies near upright. A ship within a few degrees of upright may come
// to lie on either side with a small change of weight; judging her only
// towards the side she happens to lie would let a tonne moved by a
// centimetre swing a verdict (a downflooding angle from one side's opening
// to the other's). So within NearUprightDeg both sides are worked and each
// criterion takes the worse of the two.

// NearUprightDeg is the heel within which both sides of the GZ curve are
// worked and each criterion is judged on the worse side.
const NearUprightDeg = 5.0

// otherSideStepDeg is the step in heel of the other side's curve. That
// curve is never shown, only read for criteria (areas, GZ max and its
// angle, range, GZ at an angle, downflooding), whose values the spline
// through 3° samples keeps within 1e-4 m·rad and 1 mm of the 1° curve
// (TestOtherSideThinned); the angle of vanishing stability and the
// downflooding angle are solved between the samples as on any curve.
const otherSideStepDeg = 3.0

// withOtherSide returns c with Other set to the curve towards the other
// side when she lies within NearUprightDeg of upright and it is not there
// already (RightingLevers sets it when she is upright). The other side's
// curve starts from upright: the part of the heel between where she lies
// and upright, which would add to its areas and its range, is not
// counted, so it errs on the safe side. It is sampled every
// otherSideStepDeg. A curve that cannot be worked leaves c alone.
func (pr *Problem) withOtherSide(c *GZCurve, eq Position) *GZCurve {
	if c == nil || c.Other != nil || !(math.Abs(eq.HeelDeg) < NearUprightDeg) {
		return c
	}
	other, _, err := pr.leverCurveStep(-c.Toward, eq, otherSideStepDeg)
	if err != nil {
		return c
	}
	cc := *c
	cc.Other = other
	return &cc
}

// JudgeCriteria evaluates the criteria sets of k's vessel on curve c and,
// when c carries the other side's curve (near upright), on that too, and
// keeps for each criterion the worse result (the smaller margin), saying
// so in its note when it is the other side's.
func JudgeCriteria(sets []string, k CriteriaCase) ([]CriterionResult, error) {
	res, err := EvaluateCriteria(sets, k)
	if err != nil || k.Curve == nil || k.Curve.Other == nil {
		return res, err
	}
	ko := k
	ko.Curve = k.Curve.Other
	other, err := EvaluateCriteria(sets, ko)
	if err != nil || len(other) != len(res) {
		return res, nil
	}
	for i := range res {
		o := other[i]
		if o.Code != res[i].Code || !(o.Margin < res[i].Margin-1e-12) {
			continue
		}
		note := fmt.Sprintf("judged heeling to %s, the worse side within %.0f° of upright", ko.Curve.Toward, NearUprightDeg)
		if o.Note != "" {
			note = o.Note + "; " + note
		}
		o.Note = note
		res[i] = o
	}
	return res, nil
}
