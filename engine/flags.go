package engine

import (
	"fmt"
	"math"
	"sort"
)

// Flag codes. Each is heelwatch's own; the sentence that goes with a flag
// carries the figures (which side, where, which opening, by how much).
//
//	code                  severity         raised when                                   what it tells the officer
//	past-small-angles     caution/danger   the hand and direct answers part: heel by      the quick hand answer no longer describes her
//	                                       more than 0.5° or a centreline draft by more   (the message says what parts: heel, trim or
//	                                       than 1 % of the mean draft; with no hand       mean draft); work from the direct solution.
//	                                       answer, a heel beyond 10°. Danger when the     Danger: the hand heel and drafts are not
//	                                       hand answer is beyond the method's range       usable at all (a caveat of the method, not
//	                                       (HandWorking.Unusable: heel > 20°, dropped     of the ship: Flag.AboutHandMethod)
//	                                       wall-sided term > ¼ GM, or GM < 0.05 m)
//	deck-edge-immersed    danger           the least freeboard to the deck at side is     water on deck (side, place, depth); the righting
//	                                       below zero                                     lever falls off from here
//	margin-line-immersed  danger           the margin line is under water                 past the limit the subdivision was laid out for
//	bilge-emerged         caution          the outer edge of the bottom is out of the     the waterplane narrows on the high side: less
//	                                       water at a station                             stability than the hand method shows
//	keel-emerged          caution          the keel on the centreline is out of the       the forefoot or heel of the hull is clear: the
//	                                       water at a station                             hand method's level picture is gone
//	opening-immersed      danger           an opening that is not weathertight is under   progressive flooding through it: which one, how
//	                                       water                                          deep; the spaces beyond will flood
//	closure-immersed      caution          a weathertight opening is under water          the sea is kept out only while that closure
//	                                                                                      holds: check it is secured
//	space-top-under       info (wholly)/   an open compartment's top is under water,      wholly: it takes buoyancy but nothing from the
//	                      caution (partly) wholly or on one side                          waterplane; partly: its lost waterplane changes
//	                                                                                      as she moves, so the hand method's fixed picture fails
//	space-bottom-clear    info (wholly)/   an open compartment's bottom is out of the     wholly: it takes nothing now but floods if she
//	                      caution (partly) water, wholly or on one side                   settles; partly: water runs out of it as she
//	                                                                                      heels, and the hand picture fails
//	not-wall-sided        caution          between the upright and the heeled waterline   the wall-sided formula and the hand method do not
//	                                       a station's half-breadth changes by more than  hold: trust the direct solution
//	                                       3 % of the ship's half-breadth, or the band
//	                                       reaches the deck or the bottom
//	gm-negative           danger           upright (free trim) the GM in this state is    she lolls: do not counter-ballast the high side;
//	                                       below zero                                     lower G, low tanks on the low side only with care
//	heavy-trim            caution          the trim exceeds 1 % of the length             which end is down and by how much
//	will-sink             danger           no equilibrium: the weight exceeds the         there is no floating position: she sinks
//	                                       buoyancy left
//	will-capsize          danger           no equilibrium: no heel short of 90° brings    there is no position of rest: she capsizes
//	                                       her to rest
//	not-solved            danger           the solver stopped without an answer           the figures on screen are not a floating position
//	criteria-failed       danger           a criterion of the sets she is held to fails   by her own rules she no longer has the
//	                                       (indicators such as SOLAS s excepted)          stability required: which ones, by how much
//	little-stability      danger/caution   beyond where she lies, the range of positive   a gust, a wave or more water can capsize her:
//	                                       GZ is under 10° or its largest GZ under        range, GZ max and where it vanishes
//	                                       0.05 m (danger); under 20° or 0.10 m (caution)
//	deck-edge-near        caution          the deck edge is clear but within 0.30 m of    a little more heel or water puts water on deck
//	                                       the water, or within 5° of further heel        there: how far, and at what heel
//	spill                 caution          a tank holding oil or another liquid that is   what may be escaping, how much, the rule it is
//	                                       not water is holed (spill.go)                  counted by, and to report the pollution
//
// A flag is a pure function of the state: it clears as soon as its cause is
// gone.
const (
	FlagPastSmallAngles = "past-small-angles"
	FlagDeckEdge        = "deck-edge-immersed"
	FlagMarginLine      = "margin-line-immersed"
	FlagBilgeEmerged    = "bilge-emerged"
	FlagKeelEmerged     = "keel-emerged"
	FlagOpening         = "opening-immersed"
	// FlagOpeningIntoFlooded: an immersed opening leads into a compartment
	// already flooded (Opening.LeadsTo): info, no progressive flooding.
	FlagOpeningIntoFlooded = "opening-into-flooded"
	FlagClosure            = "closure-immersed"
	FlagSpaceTopUnder      = "space-top-under"
	FlagSpaceBottomOut     = "space-bottom-clear"
	FlagNotWallSided       = "not-wall-sided"
	FlagGMNegative         = "gm-negative"
	FlagHeavyTrim          = "heavy-trim"
	FlagWillSink           = "will-sink"
	FlagWillCapsize        = "will-capsize"
	FlagNotSolved          = "not-solved"
	FlagCriteriaFailed     = "criteria-failed"
	FlagLittleStability    = "little-stability"
	FlagDeckEdgeNear       = "deck-edge-near"
)

// AboutHandMethod reports whether f is a caveat of the hand method rather
// than a flag about the ship: past-small-angles (the hand answer parts from
// the direct one, or is not usable) and not-wall-sided (the hull is not
// what the hand method and the wall-sided formula assume). They say how far
// to trust a method, not that the ship is worse off, so a word for the
// ship's state (the dashboard's header, `ship_severity` in JSON) leaves
// them out.
func (f Flag) AboutHandMethod() bool {
	return f.Code == FlagPastSmallAngles || f.Code == FlagNotWallSided
}

// Thresholds of the flags.
const (
	// FlagHeelPartDeg and FlagDraftPart are how far the hand and direct
	// answers may part before the heel counts as beyond small angles: 0.5°
	// of heel, or 1 % of the mean draft at the perpendiculars or amidships.
	FlagHeelPartDeg = 0.5
	FlagDraftPart   = 0.01
	// FlagLargeHeelDeg is the fixed heel taken as beyond small angles when
	// there is no hand answer to compare with.
	FlagLargeHeelDeg = 10.0
	// FlagWallSidedPart is the change of half-breadth between the upright
	// and heeled waterlines, as a fraction of the ship's half-breadth, that
	// makes a hull not wall-sided. Measured against the ship's half-breadth
	// (not the station's) so that the fine ends, which matter little to the
	// waterplane, do not raise it on their own.
	FlagWallSidedPart = 0.03
	// FlagTrimPart is the trim, as a fraction of the length, taken as large.
	FlagTrimPart = 0.01
	// The residual stability that raises little-stability: range beyond the
	// equilibrium and the largest GZ in it. The caution figures are MARPOL
	// I/28.3's residual range and GZ, used here as a yardstick for any ship;
	// the danger figures, half of them, are heelwatch's own.
	FlagRangeDangerDeg  = 10.0
	FlagGZDangerM       = 0.05
	FlagRangeCautionDeg = 20.0
	FlagGZCautionM      = 0.10
	// FlagDeckNearM and FlagDeckNearDeg: a deck edge closer to the water
	// than this, or that immerses within this much more heel, is near
	// (heelwatch's own figures).
	FlagDeckNearM   = 0.30
	FlagDeckNearDeg = 5.0
)

// StabilityFlags returns the flags that the righting-lever curve and the
// criteria raise for a floating position: criteria that fail, little
// residual stability, a deck edge near the water. They join the flags of
// Flags in Assess.
func StabilityFlags(v *Vessel, pos *Position, c *GZCurve, crit []CriterionResult) []Flag {
	var out []Flag
	add := func(code string, sev Severity, format string, args ...any) {
		out = append(out, Flag{Code: code, Severity: sev, Message: fmt.Sprintf(format, args...)})
	}
	if pos == nil {
		return nil
	}
	var failed []string
	total := 0
	for _, r := range crit {
		if r.Indicator {
			continue
		}
		total++
		if !r.Pass {
			failed = append(failed, fmt.Sprintf("%s (%s)", r.Requirement, r.Code))
		}
	}
	if len(failed) > 0 {
		list := failed[0]
		for _, f := range failed[1:] {
			list += "; " + f
		}
		add(FlagCriteriaFailed, Danger, "%d of the %d criteria she is held to fail: %s. By her own rules she no longer has the stability required; see the criteria for the figures.", len(failed), total, list)
	}
	if c != nil {
		rng := c.RangeDeg
		from := c.EquilibriumDeg
		to := math.Min(c.VanishingDeg, from+math.Max(rng, 0))
		gzMax, at := c.MaxBetween(from, math.Max(to, from))
		sev := Info
		switch {
		case rng < FlagRangeDangerDeg || gzMax < FlagGZDangerM:
			sev = Danger
		case rng < FlagRangeCautionDeg || gzMax < FlagGZCautionM:
			sev = Caution
		}
		if sev > Info {
			add(FlagLittleStability, sev, "Little stability is left: beyond the %.1f° she lies at, the righting lever stays positive for only %.1f° more (it vanishes at %.1f°) and is at most %.3f m (at %.1f°). A gust, a wave or more water could capsize her: keep weight low, stop the flooding, and avoid turns and seas that heel her further.",
				from, math.Max(rng, 0), c.VanishingDeg, gzMax, at)
		}
	}
	if de := pos.DeckEdge; de.HeightM >= 0 {
		more := math.Inf(1)
		if c != nil && c.DeckEdgeDeg < 90 {
			more = c.DeckEdgeDeg - c.EquilibriumDeg
		}
		if de.HeightM < FlagDeckNearM || more < FlagDeckNearDeg {
			msg := fmt.Sprintf("The deck edge is near the water: %.2f m clear on %s %s", de.HeightM, de.Side.On(), flagWhere(de.XM, v.Hull.LengthM))
			if !math.IsInf(more, 1) {
				msg += fmt.Sprintf(", and it goes under with %.1f° more heel (at %.1f°)", math.Max(more, 0), c.DeckEdgeDeg)
			}
			add(FlagDeckEdgeNear, Caution, "%s. A little more heel or water puts water on deck, and the righting lever falls off from there.", msg)
		}
	}
	return out
}

// Flags returns the flags raised by damage state d of v: pos is the direct
// solution (nil when there is none, then noEq says why) and hand the hand
// method's working (nil where it does not apply). The result is ordered
// danger first, then caution, then info, each in the order of the table
// above.
func Flags(v *Vessel, d Damage, pos *Position, noEq *NoEquilibrium, hand *HandWorking) []Flag {
	up := uprightUnknown
	if pos != nil {
		if gm, ok := UprightGM(v, d, pos); ok {
			up = gm
		}
	}
	return flags(v, d, pos, noEq, hand, up)
}

// uprightUnknown marks an upright GM that could not be found.
var uprightUnknown = math.NaN()

// flags is Flags with the upright GM already known (NaN: unknown).
func flags(v *Vessel, d Damage, pos *Position, noEq *NoEquilibrium, hand *HandWorking, uprightGM float64) []Flag {
	var out []Flag
	add := func(code string, sev Severity, format string, args ...any) {
		out = append(out, Flag{Code: code, Severity: sev, Message: fmt.Sprintf(format, args...)})
	}
	if pos == nil {
		if noEq == nil {
			noEq = &NoEquilibrium{NotConverged, "no floating position was computed"}
		}
		as := "as loaded"
		if IsDamaged(d) {
			as = "with the spaces flooded as set"
		}
		switch noEq.Outcome {
		case Sinks:
			remedy := "Only shedding weight can keep her afloat: she is loaded beyond what her hull can float."
			if IsDamaged(d) {
				remedy = "Only stopping the inflow or shedding weight can keep her afloat."
			}
			add(FlagWillSink, Danger, "There is no floating position: %s she sinks (%s). %s", as, noEq.Reason, remedy)
		case Capsizes:
			remedy := "Lowering G is the remedy"
			if IsDamaged(d) {
				remedy = "Stopping the flooding and lowering G are the remedies"
			}
			add(FlagWillCapsize, Danger, "There is no position of rest: %s she capsizes (%s). %s; shift weight across her only once GM is known to be positive.", as, noEq.Reason, remedy)
		default:
			add(FlagNotSolved, Danger, "heelwatch found no floating position (%s): no figure on screen describes where she floats. Check the damage entered and treat her as in danger.", noEq.Reason)
		}
		return out
	}
	h := v.Hull
	L := h.LengthM
	p := pos.Plane

	// Beyond small angles.
	if hand != nil {
		dh := math.Abs(hand.HeelDeg - pos.HeelDeg)
		mean := math.Max(math.Abs(pos.DraftMidM), 1e-3)
		dd := math.Max(math.Abs(hand.DraftAftM-pos.DraftAftM), math.Max(math.Abs(hand.DraftFwdM-pos.DraftFwdM), math.Abs(hand.DraftMidM-pos.DraftMidM))) / mean
		coupled := math.Abs(hand.CoupledHeelDeg-pos.HeelDeg) <= FlagHeelPartDeg &&
			math.Abs(hand.CoupledTrimM-pos.TrimM) <= FlagDraftPart*mean
		parts, cause := handParts(hand, pos, dh, dd, L)
		switch {
		case !hand.Usable():
			add(FlagPastSmallAngles, Danger, "The hand answer is not usable here: %s. Its heel (%s, against %s direct) and its drafts (aft %.3f m, forward %.3f m, against %.3f m and %.3f m direct) are beyond the method: work from the direct solution.",
				hand.Unusable(), heelWords(hand.HeelDeg), heelWords(pos.HeelDeg), hand.DraftAftM, hand.DraftFwdM, pos.DraftAftM, pos.DraftFwdM)
		case !(dh > FlagHeelPartDeg || dd > FlagDraftPart):
		case coupled && dh > FlagHeelPartDeg:
			// The angles are small; what parts them is the coupling of heel
			// and trim through the waterplane's product of inertia.
			add(FlagPastSmallAngles, Caution, "The hand method and the direct solution part: %s. The damage is off the centreline and off midships together, so heel and trim work on each other, which the plain hand method leaves out; kept in, the hand working gives %s and %.2f m trim, as the direct solution does. Work from the direct solution.",
				parts, heelWords(hand.CoupledHeelDeg), hand.CoupledTrimM)
		default:
			add(FlagPastSmallAngles, Caution, "The hand method and the direct solution part: %s. %s: work from the direct solution.", parts, cause)
		}
	} else if math.Abs(pos.HeelDeg) > FlagLargeHeelDeg {
		add(FlagPastSmallAngles, Caution, "She lies at %s, beyond the %.0f° where small-angle hand methods hold: work from the direct solution and expect the righting lever to change quickly with more heel.",
			heelWords(pos.HeelDeg), FlagLargeHeelDeg)
	}

	// Deck edge and margin line.
	if de := pos.DeckEdge; de.HeightM < 0 {
		add(FlagDeckEdge, Danger, "The deck edge is under water on %s %s, %.2f m deep: water lies on deck there and the righting lever falls off from here.",
			de.Side.On(), flagWhere(de.XM, L), -de.HeightM)
	}
	if ml := pos.MarginLine; ml.HeightM < 0 && v.Passenger() {
		add(FlagMarginLine, Danger, "The margin line is under water on %s %s, by %.2f m: she is past the limit her subdivision was laid out for and water can spread along the bulkhead deck.",
			ml.Side.On(), flagWhere(ml.XM, L), -ml.HeightM)
	}

	// Bottom out of the water.
	if bilge, keel := flagBottomOut(h, p); bilge != nil || keel != nil {
		if bilge != nil {
			add(FlagBilgeEmerged, Caution, "The bilge is out of the water on the %s side %s, %.2f m clear: the waterplane narrows on the high side, so she has less stability than the hand method shows.",
				bilge.Side, flagWhere(bilge.XM, L), bilge.HeightM)
		}
		if keel != nil {
			add(FlagKeelEmerged, Caution, "The keel is out of the water %s, %.2f m clear: that end of the hull no longer floats on a full section, and the hand method's picture of a level sinkage is gone.",
				flagWhere(keel.XM, L), keel.HeightM)
		}
	}

	// Openings.
	for _, o := range pos.Openings {
		if !o.Immersed() {
			continue
		}
		what := "\"" + o.Name + "\""
		if o.Kind != "" {
			what = o.Kind + " " + what
		}
		if o.IntoFlooded {
			// Weathertight or not: were it to give way, it would let the
			// sea only into a space that holds sea water already.
			add(FlagOpeningIntoFlooded, Info, "The %s %s is %.2f m under water, but it leads into %s, which is flooded already: no further flooding through it.",
				what, flagPoint(o.X, o.Y, o.Z, L), -o.HeightM, o.LeadsTo)
			continue
		}
		if o.Weathertight {
			add(FlagClosure, Caution, "The weathertight %s %s is %.2f m under water: the sea is kept out only while its closure holds, and weathertight is not watertight under a standing head of water. Check it is secured and keep watch on it.",
				what, flagPoint(o.X, o.Y, o.Z, L), -o.HeightM)
		} else {
			add(FlagOpening, Danger, "The %s %s is %.2f m under water: water will run through it into the spaces beyond (progressive flooding). Close it if it can be closed; otherwise count those spaces as flooding.",
				what, flagPoint(o.X, o.Y, o.Z, L), -o.HeightM)
		}
	}

	// Open compartments whose top is under, or bottom out of, the water.
	for i, c := range v.Compartments {
		if !d.state(i).Open {
			continue
		}
		top, bottom := flagSpaceFaces(c.solid, p)
		switch {
		case top.hi < 0:
			add(FlagSpaceTopUnder, Info, "Open space \"%s\" is wholly under water (its top, %.2f m above the base, is %.2f m below the waterline at least): it takes buoyancy but nothing from the waterplane.",
				c.Name, c.solid.zmax, -top.hi)
		case top.lo < 0:
			add(FlagSpaceTopUnder, Caution, "The top of open space \"%s\" is under water %s, by up to %.2f m: its lost waterplane changes as she moves, so the hand method's fixed picture of it no longer holds.",
				c.Name, flagWhereOnFace(top.loY, p, true), -top.lo)
		}
		switch {
		case bottom.lo > 0:
			add(FlagSpaceBottomOut, Info, "Open space \"%s\" lies wholly above the water (its bottom, %.2f m above the base, is %.2f m clear at least): it takes no buoyancy now, but will flood if she settles or heels further.",
				c.Name, c.solid.zmin, bottom.lo)
		case bottom.hi > 0:
			add(FlagSpaceBottomOut, Caution, "The bottom of open space \"%s\" is out of the water %s, by up to %.2f m: water runs out of it as she moves, so the hand method's picture of a space open through the waterline no longer holds.",
				c.Name, flagWhereOnFace(bottom.hiY, p, false), bottom.hi)
		}
	}

	// Wall-sidedness between the upright and heeled waterlines.
	if msg := flagWallSided(h, p); msg != "" {
		add(FlagNotWallSided, Caution, "%s", msg)
	}

	// Negative GM upright: loll.
	if gm := uprightGM; gm < 0 {
		add(FlagGMNegative, Danger, "Upright, in this state, her GM is %.2f m: she is unstable upright and lolls to whichever side she falls (now %s). Do not counter-ballast the high side: she would flop over to the other side, perhaps further. The remedy is to lower G: take off or lower weights high up; fill a low tank on the low side only with care, one at a time, as a slack tank adds free surface before it helps.",
			gm, heelWords(pos.HeelDeg))
	}

	// Trim.
	if math.Abs(pos.TrimM) > FlagTrimPart*L {
		end, draft := "by the stern", pos.DraftAftM
		if pos.TrimM < 0 {
			end, draft = "by the head", pos.DraftFwdM
		}
		add(FlagHeavyTrim, Caution, "She trims %.2f m %s, %.1f %% of her length (draft %.2f m at the deeper end): mind the freeboard and openings at that end; the hand method's trim is a small-angle estimate.",
			math.Abs(pos.TrimM), end, 100*math.Abs(pos.TrimM)/L, draft)
	}

	sort.SliceStable(out, func(i, j int) bool { return out[i].Severity > out[j].Severity })
	return out
}

// flagWhere places x along the ship: "at the aft perpendicular (x = 0.0 m)".
func flagWhere(x, L float64) string {
	tol := 1e-6 * (1 + L)
	switch {
	case math.Abs(x) <= tol:
		return fmt.Sprintf("at the aft perpendicular (x = %.1f m)", x)
	case math.Abs(x-L) <= tol:
		return fmt.Sprintf("at the forward perpendicular (x = %.1f m)", x)
	case math.Abs(x-L/2) <= tol:
		return fmt.Sprintf("amidships (x = %.1f m)", x)
	}
	return fmt.Sprintf("at x = %.1f m from the aft perpendicular", x)
}

// flagPoint places a point of the ship: "at x = 8.0 m, 7.0 m to port, 10.5 m
// above the base".
func flagPoint(x, y, z, L float64) string {
	side := "on the centreline"
	switch {
	case y > 0:
		side = fmt.Sprintf("%.1f m to starboard", y)
	case y < 0:
		side = fmt.Sprintf("%.1f m to port", -y)
	}
	return fmt.Sprintf("(x = %.1f m, %s, %.1f m above the base)", x, side, z)
}

// flagWhereOnFace says where on a compartment's face a point lies, for a
// sentence: on a side when she is heeled, at one end when she floats
// upright (trim alone brings the face to the water): the end that is down
// when low, the end that is up otherwise.
func flagWhereOnFace(y float64, p Plane, low bool) string {
	if math.Abs(p.C) < 1e-9 {
		// B < 0: the water stands higher aft, so she is down by the stern.
		if (p.B < 0) == low {
			return "at its after end"
		}
		return "at its forward end"
	}
	return "on the " + sideWords(y) + " side"
}

// flagBottomOut returns the highest point of the bottom above the water,
// if any: the bilge (the outer edge of the flat of bottom, each side) and
// the keel (the bottom on the centreline), at the stations. Between
// stations every hull vertex moves linearly in x, and so does its height
// above the plane, so the stations hold the extremes.
//
// Only stations on the flat of keel count: where the keel is cut up (the
// forefoot, a transom stern) it lies above the water in any normal
// condition, and that is no news.
func flagBottomOut(h *Hull, p Plane) (bilge, keel *Clearance) {
	low := math.Inf(1)
	for _, st := range h.stations {
		low = math.Min(low, st.Offsets[0].Z)
	}
	for _, st := range h.stations {
		o := st.Offsets
		k := o[0]
		if k.Z > low+0.01*h.DepthM {
			continue
		}
		if hk := p.Height(st.X, 0, k.Z); hk > 0 && (keel == nil || hk > keel.HeightM) {
			keel = &Clearance{HeightM: hk, XM: st.X, Side: Starboard}
		}
		edge := k
		for _, q := range o[1:] {
			if q.Z != k.Z {
				break
			}
			edge = q
		}
		if !(edge.Y > 0) {
			continue
		}
		for _, s := range []Side{Port, Starboard} {
			if hb := p.Height(st.X, float64(s)*edge.Y, edge.Z); hb > 0 && (bilge == nil || hb > bilge.HeightM) {
				bilge = &Clearance{HeightM: hb, XM: st.X, Side: s}
			}
		}
	}
	return bilge, keel
}

// flagFace is the range of heights above the water of a compartment's top
// or bottom face, with the y of the lowest and the highest point.
type flagFace struct {
	lo, hi   float64
	loY, hiY float64
}

// flagSpaceFaces returns the heights above plane p of the vertices of the
// solid's top face (those at its greatest height) and bottom face (at its
// least), at both ends of every slab: each vertex moves linearly in x along
// a slab, so the ends hold the extremes.
func flagSpaceFaces(s *Solid, p Plane) (top, bottom flagFace) {
	top = flagFace{lo: math.Inf(1), hi: math.Inf(-1)}
	bottom = top
	tol := 1e-9 * (1 + math.Abs(s.zmax))
	put := func(f *flagFace, y, hgt float64) {
		if hgt < f.lo {
			f.lo, f.loY = hgt, y
		}
		if hgt > f.hi {
			f.hi, f.hiY = hgt, y
		}
	}
	for i := range s.slabs {
		sl := &s.slabs[i]
		for _, x := range [2]float64{sl.x0, sl.x1} {
			for _, q := range sl.section(x) {
				hgt := p.Height(x, q.Y, q.Z)
				if q.Z >= s.zmax-tol {
					put(&top, q.Y, hgt)
				}
				if q.Z <= s.zmin+tol {
					put(&bottom, q.Y, hgt)
				}
			}
		}
	}
	return top, bottom
}

// flagHalfBreadth returns a station's half-breadth at height z (the outer
// point of the outline there).
func flagHalfBreadth(o []Point, z float64) float64 {
	_, last := outlineAt(o, z)
	return last.Y
}

// flagWallSided checks at each station the band between the upright
// waterline at the solved trim, zc = A + B·x on the centreline, and the
// heeled one, which meets the side near zc ± tan θ·y0 (y0 the half-breadth
// at zc). The hull is wall-sided there when the band stays between the
// bottom and the deck and the half-breadth changes across it (at its ends
// and at the offsets inside it: the outline is straight between offsets) by
// no more than FlagWallSidedPart of the ship's half-breadth. It returns a
// sentence for the worst station, or "".
func flagWallSided(h *Hull, p Plane) string {
	half := h.BreadthM / 2
	t := math.Abs(p.C)
	if t == 0 || !(half > 0) {
		return ""
	}
	worst, msg := 0.0, ""
	var band wallBand
	for _, st := range h.stations {
		o := st.Offsets
		zk, zd := o[0].Z, o[len(o)-1].Z
		zc := p.A + p.B*st.X
		if zc <= zk || zc >= zd {
			continue // out of the water or deck under at the centreline: other flags say so
		}
		y0 := flagHalfBreadth(o, zc)
		lo, hi := zc-t*y0, zc+t*y0
		if hi > zd || lo < zk {
			where := flagWhere(st.X, h.LengthM)
			if !math.IsInf(worst, 1) {
				worst = math.Inf(1)
				if hi > zd {
					msg = fmt.Sprintf("Between the upright and the heeled waterline the hull is not wall-sided %s: on the low side the heeled waterline rises to %.2f m, above the deck edge at %.2f m. The hand method and the wall-sided formula do not describe her; trust the direct solution.", where, hi, zd)
				} else {
					msg = fmt.Sprintf("Between the upright and the heeled waterline the hull is not wall-sided %s: on the high side the heeled waterline falls to %.2f m, below the bottom at the bilge (%.2f m). The hand method and the wall-sided formula do not describe her; trust the direct solution.", where, lo, zk)
				}
			}
			continue
		}
		ymin, ymax := y0, y0
		for _, z := range []float64{lo, hi} {
			y := flagHalfBreadth(o, z)
			ymin, ymax = math.Min(ymin, y), math.Max(ymax, y)
		}
		for _, q := range o {
			if q.Z > lo && q.Z < hi {
				ymin, ymax = math.Min(ymin, q.Y), math.Max(ymax, q.Y)
			}
		}
		dev := math.Max(y0-ymin, ymax-y0) / half
		if dev > FlagWallSidedPart && dev > worst {
			worst, band = dev, wallBand{st.X, ymin, ymax}
		}
	}
	if msg == "" && worst > 0 {
		// Worded once, for the worst station.
		msg = fmt.Sprintf("Between the upright and the heeled waterline the hull is not wall-sided %s: the half-breadth runs from %.2f to %.2f m across that band (%.1f %% of the half-breadth). The hand method and the wall-sided formula do not describe her; trust the direct solution.", flagWhere(band.x, h.LengthM), band.ymin, band.ymax, 100*worst)
	}
	return msg
}

// wallBand is a station's half-breadths across the band between the
// upright and the heeled waterline (flagWallSided).
type wallBand struct{ x, ymin, ymax float64 }

// UprightGM returns the GM of damage state d with the ship held upright at
// free trim (GM₀): the GM that decides between a list and a loll, and the
// one the intact criteria ask for. When she floats upright already it is
// the solved position's. ok is false when she cannot be solved upright.
func UprightGM(v *Vessel, d Damage, pos *Position) (gm float64, ok bool) {
	if !math.IsNaN(pos.GMUprightM) && pos.GMUprightM != 0 {
		return pos.GMUprightM, true
	}
	if math.Abs(pos.HeelDeg) < 1e-9 {
		return pos.GMM * NewProblem(v, d).shipBasis(), true
	}
	pr := NewProblem(v, d)
	if !(pr.vmax > 0) || pr.massT/pr.rho >= pr.vmax {
		return 0, false
	}
	// Start from her own draft and trim, brought upright about the centreline.
	pl, _, err := pr.AtHeel(0, Plane{A: pos.Plane.A, B: pos.Plane.B})
	if err != nil {
		return 0, false
	}
	return pr.uprightAt(pl), true
}

// handParts says in words what parts the hand answer from the direct one
// (the heel, the drafts, and whether the drafts part through the trim or
// the mean draft), and the cause that goes with it. dh is the heels'
// difference in degrees, dd the largest draft difference over the mean
// draft; L the length.
func handParts(hand *HandWorking, pos *Position, dh, dd, L float64) (parts, cause string) {
	heel := dh > FlagHeelPartDeg
	var ps []string
	if heel {
		ps = append(ps, fmt.Sprintf("the heel by %.2f° (%s by hand against %s direct)", dh, heelWords(hand.HeelDeg), heelWords(pos.HeelDeg)))
	}
	// An end draft moves by up to half the trim difference and all of the
	// mean draft difference: the larger names the cause.
	byTrim := math.Abs(hand.TrimM-pos.TrimM)/2 >= math.Abs(hand.DraftMidM-pos.DraftMidM)
	if dd > FlagDraftPart {
		d := fmt.Sprintf("the drafts by up to %.1f %% of the mean draft", 100*dd)
		if byTrim {
			d += fmt.Sprintf(" (trim %s by hand against %s direct)", trimWords(hand.TrimM), trimWords(pos.TrimM))
		} else {
			d += fmt.Sprintf(" (mean draft %.3f m by hand against %.3f m direct)", hand.DraftMidM, pos.DraftMidM)
		}
		ps = append(ps, d)
	}
	if !heel {
		if a, b := heelWords(hand.HeelDeg), heelWords(pos.HeelDeg); a == b {
			ps = append(ps, fmt.Sprintf("the heel agrees (%s, both)", a))
		} else {
			ps = append(ps, fmt.Sprintf("the heel agrees (%s by hand, %s direct)", a, b))
		}
	}
	parts = ps[0]
	for i, p := range ps[1:] {
		if i == len(ps)-2 {
			parts += " and " + p
		} else {
			parts += ", " + p
		}
	}
	switch {
	case heel:
		cause = "She is beyond the small angles the hand method assumes"
	case byTrim:
		cause = fmt.Sprintf("The hand method takes the trim as a small angle, from the MCTC of the level waterplane; at a trim of %.1f %% of her length the waterplane she floats on is another", 100*math.Abs(pos.TrimM)/L)
	default:
		cause = "The hand method sinks her parallel over one waterplane, but her sides are not parallel over that sinkage"
	}
	return parts, cause
}
