package main

import (
	"fmt"
	"math"

	"heelwatch/engine"
)

// exampleName is a compartment name for an example in a message: the
// vessel's first, or a made-up one when it has none.
func exampleName(v *engine.Vessel) string {
	if len(v.Compartments) > 0 {
		return v.Compartments[0].Name
	}
	return "Hold 1"
}

// finiteNumbers returns a message when a number written after a name on the
// command line ("X:nan", "X:0.1:inf") is not finite: strconv reads "nan"
// and "inf" as numbers, and a NaN would otherwise pass for "not given".
func finiteNumbers(flagName, arg string, nums []float64) string {
	for _, f := range nums {
		if math.IsNaN(f) || math.IsInf(f, 0) {
			return fmt.Sprintf("%s %q: %v is not a number of metres or square metres: write NAME[:AREA[:Z]] with finite numbers, e.g. %s \"Hold 1:0.05:1.2\"", flagName, arg, f, flagName)
		}
	}
	return ""
}
