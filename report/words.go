package report

import (
	"math"
	"strconv"
)

// This file holds the words and numbers every front end uses for the same
// quantity, so that a value reads the same on the screen, in the reports
// and on the command line.

// Permeability writes μ with two decimals ("0.85", "1.00"), or three when
// two would hide the tenth of a per cent a person can type ("0.005" for
// 0.5 %, "0.855"): the value shown is the value used.
//
// Special cases: NaN and ±Inf are "—".
func Permeability(mu float64) string {
	if math.IsNaN(mu) || math.IsInf(mu, 0) {
		return "—"
	}
	prec := 2
	if c := mu * 100; math.Abs(c-math.Round(c)) > 1e-9 {
		prec = 3
	}
	return strconv.FormatFloat(mu, 'f', prec, 64)
}
