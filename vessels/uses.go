package vessels

import (
	"heelwatch/engine"
	"sort"
	"strings"
)

// useSpec is what a compartment's use implies.
type useSpec struct {
	permeability float64 // default μ
	group        string  // default group
	source       string  // where μ comes from
}

// uses are the accepted values of a compartment's use key. The default
// permeabilities are SOLAS II-1 Reg. 7-3's (the same values for the first
// five in 46 CFR 172.240); a space for liquids is taken at 0.95, the more
// severe of 0 and 0.95 when it is open to the sea. Cargo spaces take the
// value at the deepest subdivision draught.
var uses = map[string]useSpec{
	"stores":        {0.60, "stores", "SOLAS II-1 Reg. 7-3; 46 CFR 172.240 (found)"},
	"accommodation": {0.95, "accommodation", "SOLAS II-1 Reg. 7-3; 46 CFR 172.240 (found)"},
	"machinery":     {0.85, "machinery", "SOLAS II-1 Reg. 7-3; 46 CFR 172.240 (found)"},
	"void":          {0.95, "voids", "SOLAS II-1 Reg. 7-3; 46 CFR 172.240 (found)"},
	"tank":          {0.95, "tanks", "SOLAS II-1 Reg. 7-3: 0 or 0.95, whichever is more severe (found)"},
	"dry cargo":     {0.70, "holds", "SOLAS II-1 Reg. 7-3, at the deepest subdivision draught (memory)"},
	"containers":    {0.70, "holds", "SOLAS II-1 Reg. 7-3, at the deepest subdivision draught (memory)"},
	"vehicles":      {0.90, "holds", "SOLAS II-1 Reg. 7-3, ro-ro spaces at the deepest subdivision draught (memory)"},
}

// openingKinds are the accepted values of an opening's kind key.
var openingKinds = []string{"air pipe", "vent", "door", "hatch", "manhole", "scuttle", "window", "pipe", "other"}

// criteriaSets are the accepted names in the criteria key: the engine's.
var criteriaSets = engine.CriteriaSetIDs()

// shipTypes are the accepted values of ship_type.
var shipTypes = []string{"cargo", "passenger"}

// DefaultCriteria returns the criteria list of a file without a criteria
// key: the IMO 2008 IS Code Part A 2.2 intact criteria. Each call returns a
// new slice.
func DefaultCriteria() []string { return []string{"is-code-2008"} }

// DefaultCd is the discharge coefficient of a hole when the file gives none
// (sharp-edged orifice, practice): the engine's.
const DefaultCd = engine.DefaultDischargeCoefficient

// UsePermeability returns the default permeability of a compartment use and
// whether the use is known.
func UsePermeability(use string) (float64, bool) {
	u, ok := uses[use]
	return u.permeability, ok
}

// Uses returns the accepted compartment uses, sorted.
func Uses() []string {
	out := make([]string, 0, len(uses))
	for k := range uses {
		out = append(out, k)
	}
	sort.Strings(out)
	return out
}

// useNames is Uses, worked out once for the reader.
var useNames = Uses()

func quotedList(vals []string) string {
	q := make([]string, len(vals))
	for i, v := range vals {
		q[i] = `"` + v + `"`
	}
	return strings.Join(q, ", ")
}

func contains(vals []string, v string) bool {
	for _, x := range vals {
		if x == v {
			return true
		}
	}
	return false
}

// Closest returns the candidate nearest to s by edit distance (ignoring
// case) when it is near enough to be a likely typing slip, else "": the
// did-you-mean of every name heelwatch refuses.
func Closest(s string, candidates []string) string { return closest(s, candidates) }

// closest returns the candidate nearest to s by edit distance when it is
// near enough to be a likely typing slip, else "".
func closest(s string, candidates []string) string {
	best, bestD := "", 1<<30
	for _, c := range candidates {
		if d := editDistance(strings.ToLower(s), strings.ToLower(c)); d < bestD {
			best, bestD = c, d
		}
	}
	if bestD <= 2 || bestD*3 <= len(s) {
		return best
	}
	return ""
}

// editDistance is the Levenshtein distance between a and b (bytes).
func editDistance(a, b string) int {
	if len(a) > 64 || len(b) > 64 {
		return 1 << 20
	}
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			c := 1
			if a[i-1] == b[j-1] {
				c = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+c)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}
