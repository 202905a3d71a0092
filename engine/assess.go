package engine

import (
	"math"
	"sort"
)

// This file holds the result types that the screen and the command line
// show, and Assess, which computes all of them for one keystroke.

// HandWorking is the small-angle lost-buoyancy method for a box-shaped
// vessel, every step kept so that it can be shown. The fields named in the
// conventions' "hand" JSON object come first. (Computed in hand.go.)
type HandWorking struct {
	SinkageM  float64 // lost volume ÷ intact waterplane still intact
	DraftM    float64 // mean draft after sinkage
	CFShiftM  float64 // size of the transverse shift of the centre of flotation
	KBM       float64
	BMM       float64 // I about the new centroidal axis ÷ V (intact volume)
	KMM       float64
	GMM       float64 // KM − KG − FSC
	HeelDeg   float64 // list: atan((TCG − TCB of the remaining body) ÷ GM), see hand.go; positive starboard down
	DraftAftM float64
	DraftFwdM float64
	TrimM     float64

	// The rest of the working, for the screen and for checks.
	VolumeM3       float64 // V = Δ/ρ, the displaced volume, unchanged by the damage
	IntactDraftM   float64 // T₀ = V/(L·B)
	LostVolumeM3   float64 // Σ μ × the open spaces' volume below T₀
	LostAreaM2     float64 // Σ μ × plan area of the open spaces cut by the new waterline
	WaterplaneM2   float64 // the waterplane still intact at the new draft
	LCFM, TCFM     float64 // its centroid, the new centre of flotation (TCFM signed)
	ITM4, ILM4     float64 // its second moments about its own centroidal axes
	IXYM4          float64 // its product of inertia about them (neglected by the method)
	LCBM, TCBM     float64 // centre of buoyancy of the remaining body at the new draft, level
	BMLM, GMLM     float64
	KGM, FSCM      float64
	DraftMidM      float64 // centreline draft amidships
	CoupledHeelDeg float64 // heel with I_xy kept (heel and trim solved together)
	CoupledTrimM   float64 // trim likewise
	Waterline      Plane   // the method's final waterline in the ship frame

	Steps []HandStep // the working, in order
}

// HandStep is one line of the hand method's working.
type HandStep struct {
	Label   string  // what is found, in the trade's words
	Formula string  // how, with the numbers put in
	Value   float64 // the result
	Unit    string
}

// Severity orders flags: a Danger flag means the picture has changed for
// the worse (water spreading, no equilibrium); a Caution flag means a figure
// is less to be trusted or a limit is near; Info is for the record.
type Severity int

const (
	Info Severity = iota
	Caution
	Danger
)

func (s Severity) String() string {
	switch s {
	case Danger:
		return "danger"
	case Caution:
		return "caution"
	}
	return "info"
}

// Flag is a condition the officer must know about, with a short code of
// heelwatch's own and a plain sentence. (Raised in flags.go.)
type Flag struct {
	Code     string
	Severity Severity
	Message  string
}

// GZCurve is the righting-lever curve of a condition at free trim and
// constant displacement, heeled towards one side. (Computed in gz.go;
// AreaMRad, At and MaxBetween read it.)
type GZCurve struct {
	Toward  Side      // the side she is heeled towards
	HeelDeg []float64 // heel towards that side, from 0, ascending (always ≥ 0); steps ≤ 1°
	GZM     []float64 // righting lever at each heel, positive righting

	EquilibriumDeg  float64 // heel where she lies (from the solved position; 0 towards the other side of an upright ship)
	GZMaxM          float64 // largest GZ on the curve (spline maximum)
	GZMaxDeg        float64 // the heel where it occurs
	VanishingDeg    float64 // angle of vanishing stability: first fall of GZ through zero beyond the equilibrium; the curve's last heel (89.5) if GZ stays positive
	Vanishes        bool    // GZ falls through zero within the curve (false: VanishingDeg is only the curve's end)
	RangeDeg        float64 // range of positive stability beyond the equilibrium: VanishingDeg − EquilibriumDeg
	DeckEdgeDeg     float64 // heel at which the deck edge first immerses (0 if immersed already; 90 if not by the curve's end)
	DownfloodingDeg float64 // heel at which the first non-weathertight opening immerses (0 if immersed already; 90 if none)
	Downflooding    string  // that opening's name, "" if none

	Note  string   // why the curve ends early, "" when it runs its full span
	Other *GZCurve // within NearUprightDeg of upright (Assess, FloodCriteria): the curve towards the other side (upright: this one is the worse; near upright, sampled every 3°, for criteria only); nil otherwise

	upright    Plane // the solved 0° sample (free trim, same displacement)
	hasUpright bool
	sp         *cubicSpline // the spline through the samples, fitted once (see GZCurve.fit)
}

// CriterionResult is one stability criterion applied to a condition.
// (Evaluated in criteria.go.)
type CriterionResult struct {
	Set         string  // the criteria set's id, e.g. "is-code-2008"
	Code        string  // short code of heelwatch's own, unique within the set
	Requirement string  // the requirement in words, e.g. "area under GZ 0–30° ≥ 0.055 m·rad"
	Required    float64 // the limit
	Actual      float64 // the value found
	Unit        string
	AtMost      bool // the actual must not exceed the limit (otherwise it must reach it)
	Pass        bool
	Margin      float64 // actual − required (required − actual when AtMost): positive or zero passes
	Source      string  // the regulation and, where it is recalled, "(memory)"
	Indicator   bool    // a figure to read, not a criterion the ship is held to (SOLAS s)
	Note        string  // how the actual was taken, where that needs saying; "" otherwise
}

// Assessment is everything one keystroke recomputes for a damage state.
type Assessment struct {
	Damage   Damage
	Position *Position      // nil when there is no equilibrium
	NoEq     *NoEquilibrium // why not, when Position is nil
	Hand     *HandWorking   // nil when the hand method does not apply
	HandWhy  string         // why it does not apply
	GZ       *GZCurve       // nil when there is no equilibrium
	Criteria []CriterionResult
	Flags    []Flag
	Notes    []string // what could not be computed, and why
	Spills   []Spill  // non-water contents of holed tanks that may escape (see spill.go)
	// UprightGMM is GM₀, the GM with her held upright at free trim (nil when
	// unknown), also in Position.GMUprightM: beside Position.GMAtRestM, the
	// GM where she lies, it tells a list from a loll.
	UprightGMM *float64
	// Strength is the hull girder's still-water shear force and bending
	// moment (strength.go); nil with StrengthWhy saying why.
	Strength    *Strength
	StrengthWhy string
}

// Assess computes everything shown for damage state d of v: the floating
// position, the hand method where it applies, the GZ curve, the criteria of
// the vessel's sets (the intact ones for an intact condition, the damage
// ones for a flooded one) and the flags. It never fails: what cannot be
// computed is said in NoEq, HandWhy or Notes.
func Assess(v *Vessel, d Damage) Assessment {
	a := Assessment{Damage: append(Damage(nil), d...)}
	// The hand method needs nothing solved: it is worked on a goroutine
	// of its own, on another core when there is one, which also helps
	// with the GZ curve's spans (started now, its core is awake by the
	// time they are ready: waking an idle one can take a fifth of a
	// millisecond).
	var hw *HandWorking
	var herr error
	var help spanHelp
	var hand beside
	hand.run(func() {
		help.alongside(func() { hw, herr = HandMethod(v, d) })
	})
	pr := NewProblem(v, d)
	pos, err := pr.Equilibrium()
	if err != nil {
		a.NoEq = asNoEquilibrium(err)
	} else {
		a.Position = &pos
	}
	var gz *GZCurve
	var gzErr error
	if a.Position != nil {
		gz, gzErr = pr.leversHelped(pos, &help)
	}
	hand.wait()
	na, notApplicable := herr.(*HandNotApplicable)
	switch {
	case a.NoEq != nil && herr == nil:
		// A small-angle answer beside a ship that sinks or capsizes would
		// be a false comfort.
		a.HandWhy = "not shown: there is no floating position (" + a.NoEq.Outcome.Plain() + "), and the small-angle working would give a false picture of her"
	case notApplicable:
		a.HandWhy = na.Reason
	case a.NoEq != nil:
	case herr == nil:
		a.Hand = hw
	default:
		a.HandWhy = herr.Error()
	}
	up := uprightUnknown
	var upPtr *float64
	if a.Position != nil {
		if gzErr != nil {
			a.Notes = append(a.Notes, "GZ curve not computed: "+gzErr.Error())
		} else {
			a.GZ = gz
		}
		// The upright GM: from the curve's solved 0° sample where there is
		// one (no further solve), else solved upright on its own.
		switch {
		case math.Abs(pos.HeelDeg) < 1e-9:
			up = a.Position.GMUprightM
		case a.GZ != nil && a.GZ.hasUpright:
			up = pr.uprightAt(a.GZ.upright)
		default:
			if gm, ok := UprightGM(v, d, a.Position); ok {
				up = gm
			}
		}
		if !math.IsNaN(up) {
			a.Position.GMUprightM = up
			upPtr = &up
			a.UprightGMM = upPtr
		}
		if a.GZ != nil && len(v.CriteriaSets) > 0 {
			res, err := JudgeCriteria(v.CriteriaSets, CriteriaCase{Curve: a.GZ, Eq: *a.Position, Damaged: IsDamaged(d), ShipType: v.ShipType, UprightGMM: upPtr})
			if err != nil {
				a.Notes = append(a.Notes, "criteria not evaluated: "+err.Error())
			}
			a.Criteria = res
		}
	}
	a.Strength, a.StrengthWhy = GirderStrength(v, d, a.Position)
	a.Flags = flags(v, d, a.Position, a.NoEq, a.Hand, up)
	a.Spills = Spills(v, d)
	more := append(StabilityFlags(v, a.Position, a.GZ, a.Criteria), StrengthFlags(a.Strength)...)
	more = append(more, spillFlags(a.Spills)...)
	more = append(more, ballastBasisFlags(v, d)...)
	if len(more) > 0 {
		a.Flags = append(a.Flags, more...)
		sort.SliceStable(a.Flags, func(i, j int) bool { return a.Flags[i].Severity > a.Flags[j].Severity })
	}
	return a
}
