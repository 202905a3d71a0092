package vessels

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// permeabilitySteps is the one rounding of a permeability typed by a
// person: to the nearest 1/1000 (a tenth of a per cent).
const permeabilitySteps = 1000

// ParsePermeability reads a permeability μ as a person types it, on the
// command line (--perm) and in the dashboard alike:
//
//   - a fraction: "0.85", ".6", "1";
//   - the same with a decimal comma: "0,85";
//   - a percentage: "85%", "100 %", "0.5%" (0.005);
//   - a whole number from 2 to 100 without the sign, taken as a percentage:
//     "85" is 0.85. A number above 1 with decimals ("1.01") is refused: it
//     is more likely a mistyped fraction than a percentage.
//
// The value is rounded to the nearest 0.001 and must then lie in 0 < μ ≤ 1.
// Anything else is an error that says why; nothing is replaced silently.
//
// Special cases: "" and "NaN", "Inf" or any other non-number are errors; a
// value that rounds to 0 ("0.0004") is an error.
func ParsePermeability(s string) (float64, error) {
	t := strings.TrimSpace(strings.ReplaceAll(s, ",", "."))
	pct := strings.HasSuffix(t, "%")
	t = strings.TrimSpace(strings.TrimSuffix(t, "%"))
	if t == "" {
		return 0, fmt.Errorf("no permeability given: write a fraction such as 0.85 or a percentage such as 85%%")
	}
	v, err := strconv.ParseFloat(t, 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, fmt.Errorf("%q is not a number: write a fraction such as 0.85 or a percentage such as 85%%", strings.TrimSpace(s))
	}
	if !pct && v > 1 && v <= 100 && v == math.Trunc(v) && !strings.ContainsAny(t, ".eE") {
		pct = true
	}
	if pct {
		v /= 100
	}
	v = math.Round(v*permeabilitySteps) / permeabilitySteps
	if !(v > 0 && v <= 1) {
		return 0, fmt.Errorf("%q is outside 0 < μ ≤ 1 (the fraction of the space that water can fill): write e.g. 0.85 or 85%%", strings.TrimSpace(s))
	}
	return v, nil
}
