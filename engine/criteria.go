package engine

import (
	"fmt"
	"math"
	"strings"
)

// This file holds the stability criteria as data: named sets of rows, each
// row a requirement and a function that reads the actual value off the
// condition. Adding a set is adding rows. The figures are those of the
// regulations named in each row's Source (values from the project's
// references; where recalled rather than read again the Source says
// "(memory)"). The ship's approved stability booklet governs: these are
// guidance for the officer on watch.

// CriteriaCase is the condition the criteria are applied to.
type CriteriaCase struct {
	Curve    *GZCurve // the righting-lever curve of the condition (RightingLevers)
	Eq       Position // where she floats
	Damaged  bool     // a compartment is open to the sea or holds floodwater (see IsDamaged)
	ShipType string   // "passenger" or "cargo" ("" is cargo): SOLAS s's heel thresholds
	// UprightGMM is GM₀, the fluid GM upright at free trim (UprightGM); nil
	// means unknown, and the GM where she floats is used instead.
	UprightGMM *float64
}

// IsDamaged reports whether d floods any compartment (open to the sea or
// holding water): the intact sets apply when it does not, the damage sets
// when it does.
func IsDamaged(d Damage) bool {
	for _, s := range d {
		if s.Open || s.WaterM3 > 0 {
			return true
		}
	}
	return false
}

// criterion is one row of a criteria set.
type criterion struct {
	code        string
	requirement string // in words, with the limit
	required    float64
	unit        string
	atMost      bool // the actual must not exceed the limit
	indicator   bool
	source      string
	// actual reads the value off the case, with a note on how it was taken
	// ("" if none needed).
	actual func(k *CriteriaCase) (float64, string)
	// limit, when set, replaces required and requirement for this case.
	limit func(k *CriteriaCase) (float64, string)
}

// criteriaSet is a named set of criteria and the conditions it applies to.
type criteriaSet struct {
	id      string
	title   string
	damaged bool // applies to damaged conditions; otherwise to intact ones
	rows    []criterion
}

const (
	isCode    = "IMO 2008 IS Code (MSC.267(85)) Part A "
	marpol28  = "MARPOL Annex I Reg. 28.3"
	solas72   = "SOLAS II-1 Reg. 7-2 (memory)"
	noOpening = "no opening is listed for this vessel: nothing to check"
)

// curveEnd is the last heel of the curve (0 for an empty one).
func curveEnd(c *GZCurve) float64 {
	if len(c.HeelDeg) == 0 {
		return 0
	}
	return c.HeelDeg[len(c.HeelDeg)-1]
}

// areaTo returns the upper limit of an intact area: lim, or the
// downflooding angle when that is less, with a note saying which.
func areaTo(c *GZCurve, lim float64) (float64, string) {
	if c.DownfloodingDeg < lim {
		return c.DownfloodingDeg, fmt.Sprintf("taken to the downflooding angle %.1f° (%s)", c.DownfloodingDeg, c.Downflooding)
	}
	return lim, ""
}

// residualSpan is the MARPOL range beyond the equilibrium: from θe to the
// lesser of θe + 20° and the angle of vanishing stability.
func residualSpan(c *GZCurve) (float64, float64) {
	return c.EquilibriumDeg, math.Min(c.EquilibriumDeg+20, c.VanishingDeg)
}

// criteriaSets is the table of every set heelwatch knows.
var criteriaSets = []criteriaSet{
	{
		id:    "is-code-2008",
		title: "IMO 2008 IS Code, Part A 2.2: general intact criteria",
		rows: []criterion{
			{code: "area-0-30", requirement: "area under GZ from 0° to 30° ≥ 0.055 m·rad", required: 0.055, unit: "m·rad",
				source: isCode + "2.2.1",
				actual: func(k *CriteriaCase) (float64, string) { return k.Curve.AreaMRad(0, 30), "" }},
			{code: "area-0-40", requirement: "area under GZ from 0° to 40° (or to downflooding if less) ≥ 0.090 m·rad", required: 0.090, unit: "m·rad",
				source: isCode + "2.2.1",
				actual: func(k *CriteriaCase) (float64, string) {
					to, note := areaTo(k.Curve, 40)
					return k.Curve.AreaMRad(0, to), note
				}},
			{code: "area-30-40", requirement: "area under GZ from 30° to 40° (or to downflooding if less) ≥ 0.030 m·rad", required: 0.030, unit: "m·rad",
				source: isCode + "2.2.1",
				actual: func(k *CriteriaCase) (float64, string) {
					to, note := areaTo(k.Curve, 40)
					return k.Curve.AreaMRad(30, to), note
				}},
			{code: "gz-30", requirement: "GZ ≥ 0.20 m at a heel of 30° or more", required: 0.20, unit: "m",
				source: isCode + "2.2.2",
				actual: func(k *CriteriaCase) (float64, string) {
					// The curve is credited only up to the downflooding
					// angle: past it water pours in and the curve no longer
					// describes her (practice).
					end := math.Min(curveEnd(k.Curve), k.Curve.DownfloodingDeg)
					if end < 30 {
						return 0, fmt.Sprintf("downflooding at %.1f° comes before 30°: no GZ at 30° or more is credited", k.Curve.DownfloodingDeg)
					}
					gz, at := k.Curve.MaxBetween(30, end)
					if end < curveEnd(k.Curve) {
						return gz, fmt.Sprintf("largest GZ from 30° to downflooding at %.1f°, at %.1f°", end, at)
					}
					return gz, fmt.Sprintf("largest GZ from 30° on, at %.1f°", at)
				}},
			{code: "gzmax-angle", requirement: "maximum GZ at a heel of 25° or more", required: 25, unit: "°",
				source: isCode + "2.2.3",
				actual: func(k *CriteriaCase) (float64, string) { return k.Curve.GZMaxDeg, "" }},
			{code: "gm0", requirement: "initial metacentric height GM₀ ≥ 0.15 m", required: 0.15, unit: "m",
				source: isCode + "2.2.4",
				actual: func(k *CriteriaCase) (float64, string) {
					if k.UprightGMM != nil {
						return *k.UprightGMM, "fluid GM upright at free trim (free-surface corrected)"
					}
					return k.Eq.GMM, "fluid GM at the position she floats in (free-surface corrected); upright GM not found"
				}},
		},
	},
	{
		id:      "marpol-i-28",
		title:   "MARPOL Annex I Reg. 28.3: damage stability, final stage of flooding",
		damaged: true,
		rows: []criterion{
			{code: "openings-clear", requirement: "final waterline below every opening through which progressive flooding may take place", required: 0, unit: "m",
				source: marpol28 + " (weathertight closures counted as openings: memory)",
				actual: func(k *CriteriaCase) (float64, string) {
					if len(k.Eq.Openings) == 0 {
						return 0, noOpening
					}
					low, name := math.Inf(1), ""
					for _, o := range k.Eq.Openings {
						if o.IntoFlooded {
							continue // into a space flooded already: no progressive flooding
						}
						if o.HeightM < low {
							low, name = o.HeightM, o.Name
						}
					}
					if name == "" {
						return 0, "every opening leads into a space flooded already"
					}
					return low, "height above the water of the lowest opening, " + name
				}},
			{code: "heel", required: 25, unit: "°", atMost: true, source: marpol28,
				actual: func(k *CriteriaCase) (float64, string) { return math.Abs(k.Eq.HeelDeg), "" },
				limit: func(k *CriteriaCase) (float64, string) {
					if k.Eq.DeckEdge.HeightM > 0 {
						return 30, "heel ≤ 30° (allowed because the deck edge is not immersed; 25° otherwise)"
					}
					return 25, "heel ≤ 25° (deck edge immersed; 30° only without deck-edge immersion)"
				}},
			{code: "range", requirement: "range of positive residual GZ ≥ 20° beyond the equilibrium", required: 20, unit: "°",
				source: marpol28,
				actual: func(k *CriteriaCase) (float64, string) {
					if !k.Curve.Vanishes {
						return k.Curve.RangeDeg, fmt.Sprintf("GZ still positive at %.1f°, the curve's end", k.Curve.VanishingDeg)
					}
					return k.Curve.RangeDeg, ""
				}},
			{code: "gzmax-range", requirement: "maximum residual GZ ≥ 0.1 m within the 20° range", required: 0.1, unit: "m",
				source: marpol28,
				actual: func(k *CriteriaCase) (float64, string) {
					a, b := residualSpan(k.Curve)
					gz, at := k.Curve.MaxBetween(a, b)
					return gz, fmt.Sprintf("at %.1f°, between %.1f° and %.1f°", at, a, b)
				}},
			{code: "area-range", requirement: "area under residual GZ ≥ 0.0175 m·rad within the 20° range", required: 0.0175, unit: "m·rad",
				source: marpol28,
				actual: func(k *CriteriaCase) (float64, string) {
					a, b := residualSpan(k.Curve)
					return k.Curve.AreaMRad(a, b), fmt.Sprintf("from %.1f° to %.1f°", a, b)
				}},
			{code: "openings-range", requirement: "no unprotected opening immersed within the 20° range", required: 20, unit: "°",
				source: marpol28 + " (memory)",
				actual: func(k *CriteriaCase) (float64, string) {
					c := k.Curve
					if c.Downflooding == "" {
						return math.Max(0, curveEnd(c)-c.EquilibriumDeg), "no unprotected opening immerses on the curve"
					}
					return c.DownfloodingDeg - c.EquilibriumDeg, fmt.Sprintf("heel beyond the equilibrium at which %s immerses", c.Downflooding)
				}},
		},
	},
	{
		id:      "solas-s-factor",
		title:   "SOLAS II-1 Reg. 7-2: survival factor s (an indicator)",
		damaged: true,
		rows: []criterion{
			{code: "s-final", requirement: "survival factor s_final = K·[(GZmax/0.12)·(Range/16)]^¼ (1 = survives this damage in the regulation's sense, 0 = does not)",
				required: 1, unit: "", indicator: true, source: solas72,
				actual: sFinal},
		},
	},
}

// sFinal is SOLAS II-1 Reg. 7-2's survival factor for the final stage of
// flooding (as recalled, see references: "memory"):
//
//	s = K·[(GZmax/0.12)·(Range/16)]^¼, GZmax ≤ 0.12 m, Range ≤ 16°,
//	K = 1 if θe ≤ θmin, 0 if θe ≥ θmax, else √((θmax − θe)/(θmax − θmin)),
//
// θmin/θmax = 7°/15° for a passenger ship and 25°/30° for a cargo ship. The
// range runs from the equilibrium θe to the angle of vanishing stability or
// the downflooding angle, whichever is less (memory), and GZmax is the
// largest GZ within it. No positive range or GZ gives s = 0.
func sFinal(k *CriteriaCase) (float64, string) {
	c := k.Curve
	tmin, tmax, kind := 25.0, 30.0, "cargo ship"
	if k.ShipType == "passenger" {
		tmin, tmax, kind = 7, 15, "passenger ship"
	}
	te := math.Abs(k.Eq.HeelDeg)
	K := 1.0
	switch {
	case te >= tmax:
		K = 0
	case te > tmin:
		K = math.Sqrt((tmax - te) / (tmax - tmin))
	}
	end := math.Min(c.VanishingDeg, c.DownfloodingDeg)
	rng := math.Max(0, end-c.EquilibriumDeg)
	gz := 0.0
	if rng > 0 {
		gz, _ = c.MaxBetween(c.EquilibriumDeg, end)
	}
	gz = math.Max(0, gz)
	s := K * math.Pow(math.Min(gz, 0.12)/0.12*math.Min(rng, 16)/16, 0.25)
	note := fmt.Sprintf("K = %.3f (θe %.1f°, θmin/θmax %g°/%g° for a %s), GZmax %.3f m, range %.1f° (to %.1f°)", K, te, tmin, tmax, kind, gz, rng, end)
	return s, note
}

// CriteriaSetIDs returns the ids of every criteria set heelwatch knows, in
// the order they are evaluated.
func CriteriaSetIDs() []string {
	ids := make([]string, len(criteriaSets))
	for i, s := range criteriaSets {
		ids[i] = s.id
	}
	return ids
}

// CheckCriteriaSets returns an error naming the first id that is not a known
// criteria set (for a vessel file's list).
func CheckCriteriaSets(ids []string) error {
	for _, id := range ids {
		if findCriteriaSet(id) == nil {
			return fmt.Errorf("unknown criteria set %q (known: %s)", id, strings.Join(CriteriaSetIDs(), ", "))
		}
	}
	return nil
}

func findCriteriaSet(id string) *criteriaSet {
	for i := range criteriaSets {
		if criteriaSets[i].id == id {
			return &criteriaSets[i]
		}
	}
	return nil
}

// EvaluateCriteria applies the criteria sets named in sets to case k, in the
// order named, and returns one result per criterion.
//
// Which sets apply: "is-code-2008" (IMO 2008 IS Code Part A 2.2) to intact
// conditions only; "marpol-i-28" (MARPOL Annex I Reg. 28.3) and
// "solas-s-factor" (SOLAS II-1 Reg. 7-2's s, an indicator) to damaged ones
// only. A set that does not apply to the case gives no rows.
//
// How the values are read: areas by the curve's spline (GZCurve.AreaMRad),
// from 0° for the intact criteria, so that for a listed ship the negative
// part of the curve before her equilibrium counts against her; the MARPOL
// range and its GZmax and area from the equilibrium θe to θe + 20° (or to
// the angle of vanishing stability if less); "downflooding" is the first
// non-weathertight opening to immerse (GZCurve.DownfloodingDeg).
//
// The margin is actual − required (required − actual for an upper limit):
// zero or more passes (a value that cannot be read fails with margin
// −Inf). An unknown set name is an error, as is a nil curve.
func EvaluateCriteria(sets []string, k CriteriaCase) ([]CriterionResult, error) {
	if k.Curve == nil {
		return nil, fmt.Errorf("criteria need a GZ curve")
	}
	if err := CheckCriteriaSets(sets); err != nil {
		return nil, err
	}
	switch k.ShipType {
	case "", "cargo", "passenger":
	default:
		return nil, fmt.Errorf("ship type %q: must be \"cargo\" or \"passenger\"", k.ShipType)
	}
	var out []CriterionResult
	for _, id := range sets {
		set := findCriteriaSet(id)
		if set.damaged != k.Damaged {
			continue
		}
		for _, row := range set.rows {
			r := CriterionResult{Set: set.id, Code: row.code, Requirement: row.requirement, Required: row.required,
				Unit: row.unit, AtMost: row.atMost, Source: row.source, Indicator: row.indicator}
			if row.limit != nil {
				r.Required, r.Requirement = row.limit(&k)
			}
			r.Actual, r.Note = row.actual(&k)
			if math.IsNaN(r.Actual) || math.IsInf(r.Actual, 0) {
				// Only a curve with non-finite samples gets here.
				r.Actual, r.Margin, r.Note = 0, math.Inf(-1), "no finite value could be read off the curve"
				out = append(out, r)
				continue
			}
			if row.atMost {
				r.Margin = r.Required - r.Actual
			} else {
				r.Margin = r.Actual - r.Required
			}
			r.Pass = r.Margin >= 0
			out = append(out, r)
		}
	}
	return out, nil
}
