package engine

// This file lists the righting options an officer weighs once she floats
// with a list or a loll after damage: sea-water ballast taken into an
// intact tank on the high side, an intact tank on the low side pumped out,
// liquid moved from a low-side tank to its mirror tank on the high side;
// and, when her upright GM is negative, only the options that lower G.
// Every option is solved afresh from the hull geometry with the changed
// loading (Solve and UprightGM), one option at a time. The options are
// choices to weigh against the ship's approved stability information, not
// orders, and the words say so.

import (
	"fmt"
	"math"
	"sort"
	"strings"
)

// Bounds and thresholds of the righting options.
const (
	// RemedyUprightDeg is the heel within which a ship with positive
	// upright GM is taken as upright: no righting action is needed, and an
	// option that leaves her within it needs no smaller amount.
	RemedyUprightDeg = 0.5
	// RemedyFillTo is the fill a tank is filled to: pressed full, with no
	// free surface (PressedFullFill, 98 %).
	RemedyFillTo = PressedFullFill
	// RemedyFreeboardLossM is how far an option may lower the least
	// freeboard to the deck edge, or the height of the lowest unprotected
	// opening, before it ranks below the options that do not.
	RemedyFreeboardLossM = 0.10
	// RemedyMaxSolves bounds the work of one call: equilibrium solves and
	// upright-GM solves together, the present state's included.
	RemedyMaxSolves = 240

	remedyMaxCandidates = 8    // candidate actions solved, the most promising first
	remedyEmptyFill     = 5e-3 // a fill below this counts as empty; within it of RemedyFillTo as full
	remedyUprightTries  = 3    // solves spent finding the amount that brings her upright
	remedyUprightTolDeg = 0.1  // … stopping within this of upright
)

// RemedyKind says what an option does with the tanks.
type RemedyKind int

const (
	// RemedyFill takes sea-water ballast from the sea into a tank.
	RemedyFill RemedyKind = iota + 1
	// RemedyDischarge pumps a tank's contents out of the ship.
	RemedyDischarge
	// RemedyTransfer moves liquid from one tank into another.
	RemedyTransfer
)

func (k RemedyKind) String() string {
	switch k {
	case RemedyFill:
		return "fill"
	case RemedyDischarge:
		return "pump out"
	case RemedyTransfer:
		return "transfer"
	}
	return "unknown"
}

// Remedy is one righting option, solved.
type Remedy struct {
	Kind RemedyKind
	// Tanks are the compartments the option works on, indices into
	// Vessel.Compartments: the tank filled or pumped out; for a transfer
	// the tank emptied, then the tank filled. TankNames are their names.
	Tanks     []int
	TankNames []string
	// FillBefore and FillAfter are each tank's fill, as a fraction of its
	// capacity, now and after the option.
	FillBefore, FillAfter []float64
	Action                string  // in words, e.g. "fill Wing tank 2 P from the sea to 98 %"
	MassT                 float64 // mass taken on, pumped out or moved, t (> 0)
	// ToUpright is true for an amount found to bring her nearest upright,
	// less than the whole that the tanks allow (which overshoots).
	ToUpright bool

	Position   *Position      // where she floats after it; nil when she does not
	NoEq       *NoEquilibrium // why not, when Position is nil
	UprightGMM float64        // GM held upright at free trim after it (GM₀); NaN when unknown

	LowestOpening    string  // the unprotected opening nearest the water after it, "" if none
	LowestOpeningM   float64 // its height above the water, m; +Inf when there is none
	DeckEdgeImmersed bool    // the deck edge is under water after it
	OpeningImmersed  bool    // an unprotected opening is under water after it
	// FreeboardLossM is how much it lowers the least of the freeboard to
	// the deck edge and the lowest unprotected opening's height (negative:
	// it raises them).
	FreeboardLossM float64

	// StagesChecked is how many of the RemedyStages equal steps of the
	// amount were solved and passed (the option itself counts as the
	// last); StageFail is the first step that failed and why, "" if none.
	StagesChecked int
	StageFail     string
	// DurationS is how long it takes at PumpM3h, the rate the file gives
	// PumpName, the tank that does the work; NaN when no rate is given.
	DurationS float64
	PumpM3h   float64
	PumpName  string

	Advisable bool   // see FindRemedies for the rule
	Note      string // why, in plain words, with what to watch

	liquid string          // what the tank emptied holds, "" for a fill
	vessel *Vessel         // the changed loading, for a later upright solve
	cand   remedyCandidate // the action, for the staged check
}

// RemedySet is the answer of FindRemedies for one damage state.
type RemedySet struct {
	Damage     Damage
	Position   *Position      // where she floats now; nil when she does not
	NoEq       *NoEquilibrium // why not
	HeelDeg    float64        // her heel now, positive starboard down
	UprightGMM float64        // her GM held upright now (GM₀); NaN when unknown
	Needed     bool           // she lists or lolls: a righting action is worth weighing
	Loll       bool           // upright GM is negative: the heel is a loll, not a list
	Summary    string         // what kind of heel it is and the rule that follows, in plain words
	Options    []Remedy       // ranked, best first (see FindRemedies)
	Solves     int            // solves spent, at most RemedyMaxSolves
}

// FindRemedies lists and solves the righting options for damage state d of
// v. It is on demand, not per keystroke: it spends at most RemedyMaxSolves
// solves (each a full free-floating equilibrium or an upright-GM solve);
// each option is solved at RemedyStages steps of its amount (see below). It
// does not change v, so it may run in a goroutine (a tea.Cmd) while v is
// not being edited; d is copied first. It never fails: a state with no
// floating position gives no options and says why.
//
// Candidates are intact tanks only: a compartment open to the sea or
// holding floodwater is never one, nor is a dry space. Sea-water ballast is
// taken only into a tank whose liquid is named as ballast or sea water;
// only water and ballast are pumped out of the ship (oils, sludge and bilge
// water are moved, never discharged); liquid is moved only between mirror
// tanks (the same box reflected in the centreline) holding the same liquid.
// Every amount stays within the tanks: fills up to RemedyFillTo.
//
// The rule that decides which options are offered is the sign of the
// upright GM (UprightGM):
//
//   - Negative: the heel is a loll. Weight on the high side would make her
//     flop over to that side, perhaps further, so no option puts weight
//     on the high side. Only options that lower G are offered: ballast into
//     a low tank on the low side or across the centreline (its free surface
//     while slack is worked at half the fill and said in the note), and
//     water pumped out of tanks above G that are not on the high side. An
//     option is advisable when it raises the upright GM and puts nothing
//     under water that was clear; they are ranked by the upright GM they
//     leave, highest first.
//   - Positive: the heel is a list. Offered: ballast into a high-side tank,
//     a low-side tank pumped out, and liquid moved from a low-side tank to
//     its mirror on the high side; each as far as the tanks allow and, when
//     that overshoots to the other side, also the smaller amount that brings
//     her nearest upright (regula falsi on the heel, a few solves). An
//     option is advisable when she floats, her GM stays positive both where
//     she lies and upright, the heel is less than now and no deck edge or
//     unprotected opening goes under that was clear (one already under must
//     not go deeper). Advisable options come first, those that lower the
//     least freeboard by more than RemedyFreeboardLossM after the others;
//     within each, the least remaining heel first.
//
// Whatever the sign, an option is advisable only if it is safe while it is
// carried out: it is solved at each of RemedyStages equal steps of its
// amount (remedyStageCheck), and at every one she must float, with no deck
// edge and no unprotected opening going under that was clear (nor deeper),
// and after it her upright GM must be positive. The time it takes at the
// pump rate the file gives (Compartment.PumpM3h) is said in the note.
//
// With positive upright GM and a heel under RemedyUprightDeg no action is
// needed and there are no options.
func FindRemedies(v *Vessel, d Damage) RemedySet {
	if v == nil || v.Hull == nil || len(v.tanks) != len(v.Compartments) {
		panic("engine: FindRemedies needs a vessel made by NewVessel")
	}
	d = append(Damage(nil), d...)
	rs := RemedySet{Damage: d, UprightGMM: math.NaN()}
	pos, err := Solve(v, d)
	rs.Solves++
	if err != nil {
		rs.NoEq = asNoEquilibrium(err)
		rs.Summary = fmt.Sprintf("There is no floating position as set (%s: %s), so no righting option is worked out. Stopping the inflow and shedding weight come first.", rs.NoEq.Outcome.Plain(), rs.NoEq.Reason)
		return rs
	}
	rs.Position = &pos
	rs.HeelDeg = pos.HeelDeg
	if gm, ok := UprightGM(v, d, &pos); ok {
		rs.UprightGMM = gm
	}
	rs.Solves++
	low := Starboard
	if pos.HeelDeg < 0 {
		low = Port
	}
	high := -low
	switch {
	case math.IsNaN(rs.UprightGMM):
		rs.Needed = math.Abs(pos.HeelDeg) >= RemedyUprightDeg
		rs.Summary = "Her GM upright could not be worked out, so heelwatch cannot tell a list from a loll and offers no righting option. Treat the heel as a loll until it is known: do not counter-ballast the high side."
		return rs
	case rs.UprightGMM < 0:
		rs.Needed, rs.Loll = true, true
		rs.Summary = fmt.Sprintf("Upright her GM is %.2f m: she lolls, now %s. Do not counter-ballast the high (%s) side: she would flop over to %s, perhaps further. Lower G first: ballast a low empty tank on the %s side or across the centreline, one tank at a time, minding its free surface while it is slack; or pump out tanks high in the ship. Only such options are worked out below.",
			rs.UprightGMM, heelWords(pos.HeelDeg), high, high, low)
	case math.Abs(pos.HeelDeg) < RemedyUprightDeg:
		where := fmt.Sprintf("within %.1f° of upright (%s)", RemedyUprightDeg, heelWords(pos.HeelDeg))
		if math.Abs(pos.HeelDeg) < 0.005 {
			where = "upright"
		}
		rs.Summary = fmt.Sprintf("She floats %s with positive GM (%.2f m): no righting action is needed for list or loll. These options weigh heel and GM only: trim, freeboard and the hull girder are in the flags.", where, rs.UprightGMM)
		return rs
	default:
		rs.Needed = true
		rs.Summary = fmt.Sprintf("Upright her GM is %.2f m: she lies %s with a list (weight or water off the centreline), not a loll. Weight taken on or moved to the %s side brings her back.",
			rs.UprightGMM, heelWords(pos.HeelDeg), high) + crossFloodingWords(v, d)
	}

	now := remedyMeasure(&pos)
	cands := remedyCandidates(v, d, &pos, low, rs.Loll)
	skipped := 0
	for _, c := range cands {
		if rs.Solves+2 > RemedyMaxSolves {
			skipped++
			continue
		}
		r := remedySolve(v, d, c, c.mass, true, &rs.Solves)
		rs.Options = append(rs.Options, r)
		switch {
		case rs.Loll && c.kind == RemedyFill && r.Position != nil && rs.Solves+2 <= RemedyMaxSolves:
			// The free surface while it fills: the state at half the mass.
			half := remedySolve(v, d, c, c.mass/2, true, &rs.Solves)
			if !math.IsNaN(half.UprightGMM) {
				note := fmt.Sprintf("Halfway (%.0f t of %.0f t in), with the tank slack, her upright GM is %.2f m", half.MassT, c.mass, half.UprightGMM)
				if half.UprightGMM < rs.UprightGMM {
					note += ": worse than now before it helps"
				}
				rs.Options[len(rs.Options)-1].Note = note + "."
			}
		case !rs.Loll && r.Position != nil && r.Position.HeelDeg*pos.HeelDeg < 0 && math.Abs(r.Position.HeelDeg) > RemedyUprightDeg:
			if u, ok := remedyToUpright(v, d, c, pos.HeelDeg, r, &rs.Solves); ok {
				rs.Options = append(rs.Options, u)
			}
		}
	}
	for i := range rs.Options {
		o := &rs.Options[i]
		remedyStageCheck(v, d, o.cand, o, now, &rs.Solves)
		remedyDuration(v, o.cand, o)
		remedyJudge(o, &rs, now)
		o.vessel = nil
	}
	remedyRank(rs.Options, rs.Loll)
	switch {
	case len(rs.Options) == 0:
		rs.Summary += " No intact tank offers such an option in this condition: shifting or shedding other weights is for the officer to weigh."
	case !anyAdvisable(rs.Options):
		rs.Summary += " None of the options worked out is advisable as it stands; the notes say why."
	}
	if skipped > 0 {
		rs.Summary += fmt.Sprintf(" %d more candidate(s) were left unsolved to keep within %d solves.", skipped, RemedyMaxSolves)
	}
	rs.Summary += " They are options to weigh against the ship's approved stability information and the damage found, not orders."
	return rs
}

func anyAdvisable(rs []Remedy) bool {
	for _, r := range rs {
		if r.Advisable {
			return true
		}
	}
	return false
}

// remedyCandidate is one action before it is solved: which tanks, and the
// whole amount the tanks allow.
type remedyCandidate struct {
	kind     RemedyKind
	from, to int     // tank emptied (discharge, transfer) and tank filled (fill, transfer); −1 if none
	mass     float64 // the whole amount, t
	score    float64 // estimated worth, for choosing which to solve
}

// remedyTank is what the candidate search needs of an intact tank.
type remedyTank struct {
	i          int
	vol        float64 // capacity (μ × moulded volume), m³
	yFull      float64 // centroid of the whole tank
	zFull      float64
	side       Side // 0: across the centreline
	fill       float64
	massT      float64 // contents now
	y, z       float64 // their centre
	ballast    bool    // liquid named as ballast or sea water: may be filled from the sea
	discharged bool    // water or ballast: may be pumped out of the ship
}

// remedyTanks returns the intact tanks of v under d: compartments with a
// liquid that are neither open to the sea nor holding floodwater.
func remedyTanks(v *Vessel, d Damage) []remedyTank {
	var out []remedyTank
	tolY := 0.02 * v.Hull.BreadthM
	for i, c := range v.Compartments {
		s := d.state(i)
		if s.Open || s.WaterM3 > 0 || c.Liquid == nil {
			continue
		}
		_, yc, zc := c.solid.whole.Centroid()
		t := remedyTank{i: i, vol: c.CapacityM3(), yFull: yc, zFull: zc, fill: c.Liquid.Fill}
		switch {
		case yc > tolY:
			t.side = Starboard
		case yc < -tolY:
			t.side = Port
		}
		t.massT, _, t.y, t.z, _ = v.TankContents(i)
		name := strings.ToLower(c.Liquid.Name)
		t.discharged = IsWater(name)
		t.ballast = t.discharged && (strings.Contains(name, "ballast") || strings.Contains(name, "sea water"))
		out = append(out, t)
	}
	return out
}

// remedyMirror reports whether compartments a and b are the same box
// reflected in the centreline, within 1 cm.
func remedyMirror(a, b Box) bool {
	const tol = 0.01
	return math.Abs(a.X0-b.X0) <= tol && math.Abs(a.X1-b.X1) <= tol &&
		math.Abs(a.Z0-b.Z0) <= tol && math.Abs(a.Z1-b.Z1) <= tol &&
		math.Abs(a.Y0+b.Y1) <= tol && math.Abs(a.Y1+b.Y0) <= tol
}

// remedyCandidates returns the actions worth solving, the most promising
// first, at most remedyMaxCandidates. The estimate is the transverse moment
// towards the high side for a list, and the fall of G, w·|z − KG′|/Δ′
// (KG′ with the free-surface rise), for a loll.
func remedyCandidates(v *Vessel, d Damage, pos *Position, low Side, loll bool) []remedyCandidate {
	tanks := remedyTanks(v, d)
	rhoSea := v.WaterDensity
	disp := pos.DisplacementT
	kg := pos.KGM + pos.FSCM
	var out []remedyCandidate
	for _, t := range tanks {
		c := v.Compartments[t.i]
		room := (RemedyFillTo - t.fill) * t.vol // m³ that can go in
		if t.ballast && t.fill < RemedyFillTo-remedyEmptyFill {
			m := room * rhoSea
			switch {
			case loll && t.side != -low && t.zFull < kg:
				out = append(out, remedyCandidate{RemedyFill, -1, t.i, m, m * (kg - t.zFull) / (disp + m)})
			case !loll && t.side == -low:
				out = append(out, remedyCandidate{RemedyFill, -1, t.i, m, m * math.Abs(t.yFull)})
			}
		}
		if t.discharged && t.fill > remedyEmptyFill && t.massT > 0 && t.massT < disp {
			switch {
			case loll && t.side != -low && t.z > kg:
				out = append(out, remedyCandidate{RemedyDischarge, t.i, -1, t.massT, t.massT * (t.z - kg) / (disp - t.massT)})
			case !loll && t.side == low:
				out = append(out, remedyCandidate{RemedyDischarge, t.i, -1, t.massT, t.massT * math.Abs(t.y)})
			}
		}
		if loll || t.side != low || t.fill <= remedyEmptyFill {
			continue
		}
		for _, u := range tanks {
			cu := v.Compartments[u.i]
			if u.side != -low || !remedyMirror(c.Box, cu.Box) || cu.Liquid.Name != c.Liquid.Name ||
				u.fill >= RemedyFillTo-remedyEmptyFill {
				continue
			}
			vol := math.Min(t.fill*t.vol, (RemedyFillTo-u.fill)*u.vol)
			m := vol * c.Liquid.Density
			out = append(out, remedyCandidate{RemedyTransfer, t.i, u.i, m, m * (math.Abs(t.y) + math.Abs(u.yFull))})
			break
		}
	}
	sort.SliceStable(out, func(i, j int) bool { return out[i].score > out[j].score })
	if len(out) > remedyMaxCandidates {
		out = out[:remedyMaxCandidates]
	}
	return out
}

// remedyLoading returns the liquids of the tanks after moving mass m (t)
// of candidate c, and the tanks' fills before and after. Sea water taken
// on has the density of the water she floats in, mixed with what the tank
// holds; liquid moved keeps its own.
func remedyLoading(v *Vessel, c remedyCandidate, m float64) (map[int]Liquid, []int, []float64, []float64) {
	changes := map[int]Liquid{}
	var tanks []int
	var before, after []float64
	if c.from >= 0 {
		comp := v.Compartments[c.from]
		l := *comp.Liquid
		vol := comp.CapacityM3()
		before = append(before, l.Fill)
		if m >= c.mass && c.kind == RemedyDischarge || c.kind == RemedyTransfer && m >= c.mass && m >= l.Fill*vol*l.Density*(1-1e-12) {
			l.Fill = 0
		} else {
			l.Fill = math.Max(l.Fill-m/(l.Density*vol), 0)
		}
		changes[c.from] = l
		tanks = append(tanks, c.from)
		after = append(after, l.Fill)
	}
	if c.to >= 0 {
		comp := v.Compartments[c.to]
		l := *comp.Liquid
		vol := comp.CapacityM3()
		before = append(before, l.Fill)
		rho := v.WaterDensity
		if c.kind == RemedyTransfer {
			rho = v.Compartments[c.from].Liquid.Density
		}
		add := m / rho // m³ in
		old := l.Fill * vol
		if old > 0 {
			l.Density = (old*l.Density + add*rho) / (old + add)
		} else {
			l.Density = rho
		}
		l.Fill = math.Min((old+add)/vol, RemedyFillTo)
		if m >= c.mass && (c.kind == RemedyFill || math.Abs(l.Fill-RemedyFillTo) < 1e-9) {
			l.Fill = RemedyFillTo // exactly: pressed full, no free surface
		}
		changes[c.to] = l
		tanks = append(tanks, c.to)
		after = append(after, l.Fill)
	}
	return changes, tanks, before, after
}

// remedyVessel returns a copy of v with the tanks' liquids changed; v and
// its compartments are not touched.
func remedyVessel(v *Vessel, changes map[int]Liquid) (*Vessel, error) {
	w := *v
	w.Compartments = append([]*Compartment(nil), v.Compartments...)
	for i, l := range changes {
		c := *v.Compartments[i]
		c.Liquid = &l
		w.Compartments[i] = &c
	}
	return NewVessel(w)
}

// remedySolve solves candidate c with mass m moved, counting the solves;
// with upright, its upright GM too.
func remedySolve(v *Vessel, d Damage, c remedyCandidate, m float64, upright bool, solves *int) Remedy {
	changes, tanks, before, after := remedyLoading(v, c, m)
	r := Remedy{Kind: c.kind, Tanks: tanks, FillBefore: before, FillAfter: after, MassT: m,
		UprightGMM: math.NaN(), LowestOpeningM: math.Inf(1), DurationS: math.NaN(), cand: c}
	for _, i := range tanks {
		r.TankNames = append(r.TankNames, v.Compartments[i].Name)
	}
	if c.from >= 0 {
		r.liquid = v.Compartments[c.from].Liquid.Name
	}
	r.Action = remedyAction(r)
	w, err := remedyVessel(v, changes)
	if err != nil {
		r.NoEq = &NoEquilibrium{NotConverged, "the changed loading was refused: " + err.Error()}
		return r
	}
	r.vessel = w
	pos, err := Solve(w, d)
	*solves++
	if err != nil {
		r.NoEq = asNoEquilibrium(err)
		return r
	}
	r.Position = &pos
	if upright {
		remedyUpright(&r, d, solves)
	}
	f := remedyMeasure(&pos)
	r.LowestOpening, r.LowestOpeningM = f.opening, f.openingM
	r.DeckEdgeImmersed = pos.DeckEdge.HeightM < 0
	r.OpeningImmersed = f.openingM < 0
	return r
}

// remedyUpright works out r's upright GM, counting the solve.
func remedyUpright(r *Remedy, d Damage, solves *int) {
	if r.Position == nil || r.vessel == nil {
		return
	}
	if gm, ok := UprightGM(r.vessel, d, r.Position); ok {
		r.UprightGMM = gm
	}
	*solves++
}

// remedyToUpright finds the smaller amount of candidate c that brings her
// nearest upright, when the whole amount (full) overshoots to the other
// side: regula falsi (illinois) on the heel between no action (heel0) and
// the whole, at most remedyUprightTries equilibrium solves and one upright
// solve for the amount kept.
func remedyToUpright(v *Vessel, d Damage, c remedyCandidate, heel0 float64, full Remedy, solves *int) (Remedy, bool) {
	var best Remedy
	found := false
	illinois(0, full.MassT, heel0, full.Position.HeelDeg, math.NaN(), remedyUprightTries, 0, remedyUprightTolDeg, false, func(m float64) (float64, bool) {
		if *solves+2 > RemedyMaxSolves {
			return 0, false
		}
		r := remedySolve(v, d, c, m, false, solves)
		if r.Position == nil {
			return 0, false
		}
		h := r.Position.HeelDeg
		if !found || math.Abs(h) < math.Abs(best.Position.HeelDeg) {
			best, found = r, true
		}
		return h, true
	})
	if !found {
		return Remedy{}, false
	}
	remedyUpright(&best, d, solves)
	best.ToUpright = true
	best.Action = remedyAction(best)
	return best, true
}

// remedyAction says what an option does, in words.
func remedyAction(r Remedy) string {
	pct := func(f float64) string { return fmt.Sprintf("%.0f %%", 100*f) }
	last := len(r.FillAfter) - 1
	switch r.Kind {
	case RemedyFill:
		s := fmt.Sprintf("fill %s from the sea to %s", r.TankNames[0], pct(r.FillAfter[0]))
		if r.ToUpright {
			s += " (until nearly upright)"
		}
		return s
	case RemedyDischarge:
		if r.FillAfter[0] == 0 {
			return fmt.Sprintf("pump out %s (%s)", r.TankNames[0], r.liquid)
		}
		return fmt.Sprintf("pump %s (%s) down to %s (until nearly upright)", r.TankNames[0], r.liquid, pct(r.FillAfter[0]))
	case RemedyTransfer:
		s := fmt.Sprintf("transfer %s from %s to %s (%s → %s, %s → %s)", r.liquid,
			r.TankNames[0], r.TankNames[last], pct(r.FillBefore[0]), pct(r.FillAfter[0]), pct(r.FillBefore[last]), pct(r.FillAfter[last]))
		if r.ToUpright {
			s += " until nearly upright"
		}
		return s
	}
	return r.Kind.String()
}

// remedyFigures are the clearances an option is judged by.
type remedyFigures struct {
	deck     float64 // least freeboard to the deck edge
	opening  string  // lowest unprotected opening
	openingM float64 // its height above the water (+Inf: none)
}

func remedyMeasure(p *Position) remedyFigures {
	f := remedyFigures{deck: p.DeckEdge.HeightM, openingM: math.Inf(1)}
	for _, o := range p.Openings {
		if o.Progressive() && o.HeightM < f.openingM {
			f.opening, f.openingM = o.Name, o.HeightM
		}
	}
	return f
}

// remedyJudge decides whether option r is advisable (see FindRemedies) and
// writes its note.
func remedyJudge(r *Remedy, rs *RemedySet, now remedyFigures) {
	var why remedyWords
	if r.Note != "" {
		why = append(why, r.Note)
	}
	defer func() { r.Note = strings.Join(why, " ") }()
	if r.Position == nil {
		r.Advisable = false
		why = append(remedyWords{fmt.Sprintf("Not advisable: she would not float so (%s: %s).", r.NoEq.Outcome, r.NoEq.Reason)}, why...)
		return
	}
	p := r.Position
	after := remedyMeasure(p)
	loss := now.deck - after.deck
	if !math.IsInf(now.openingM, 1) && !math.IsInf(after.openingM, 1) {
		loss = math.Max(loss, now.openingM-after.openingM)
	}
	r.FreeboardLossM = loss
	var against []string
	newDeck := after.deck < 0 && now.deck >= 0
	deeperDeck := after.deck < 0 && now.deck < 0 && after.deck < now.deck
	newOpening := after.openingM < 0 && !(now.openingM < 0)
	deeperOpening := after.openingM < 0 && now.openingM < 0 && after.openingM < now.openingM
	if newDeck || deeperDeck {
		against = append(against, fmt.Sprintf("puts the deck edge under water (%.2f m deep)", -after.deck))
	}
	if newOpening || deeperOpening {
		against = append(against, fmt.Sprintf("puts the unprotected opening %s under water (%.2f m)", after.opening, -after.openingM))
	}
	// Safe while it is carried out (remedy_stages.go), not only once done.
	switch {
	case r.StageFail != "":
		against = append(against, "is not safe while it is carried out: "+r.StageFail)
	case r.StagesChecked < RemedyStages:
		against = append(against, fmt.Sprintf("was solved at only %d of the %d steps of carrying it out (the bound on the work), so it is not known to be safe on the way", r.StagesChecked, RemedyStages))
	}
	if rs.Loll {
		against = remedyJudgeLoll(r, rs, against, &why)
	} else {
		against = remedyJudgeList(r, rs, against, &why)
	}
	if len(against) > 0 {
		why = append(remedyWords{"Not advisable: it " + strings.Join(against, "; it ") + "."}, why...)
	}
	remedyCautions(r, after, loss, newDeck || deeperDeck, newOpening || deeperOpening, &why)
}

// remedyWords are the sentences of an option's note.
type remedyWords []string

func (w *remedyWords) say(format string, a ...any) { *w = append(*w, fmt.Sprintf(format, a...)) }

// remedyJudgeLoll judges option r for a ship at an angle of loll: it must
// raise her upright GM. It returns against with its own objections added
// and sets r.Advisable.
func remedyJudgeLoll(r *Remedy, rs *RemedySet, against []string, why *remedyWords) []string {
	p, up := r.Position, r.UprightGMM
	switch {
	case math.IsNaN(up):
		against = append(against, "its upright GM could not be worked out")
	case !(up > rs.UprightGMM):
		against = append(against, fmt.Sprintf("does not raise her upright GM (%.2f m, now %.2f m)", up, rs.UprightGMM))
	case !(up > 0):
		against = append(against, fmt.Sprintf("lowers G but leaves her upright GM negative (%.2f m, now %.2f m): she would still loll (%s, now %s), and more must be done to bring G down", up, rs.UprightGMM, heelWords(p.HeelDeg), heelWords(rs.HeelDeg)))
	}
	r.Advisable = len(against) == 0
	if r.Advisable {
		why.say("Lowers G: upright GM from %.2f to %.2f m, positive, so she would come to %s (now %s), a list and no longer a loll. Only then may the list that is left be taken out from the high side: solve the new condition first.", rs.UprightGMM, up, heelWords(p.HeelDeg), heelWords(rs.HeelDeg))
	}
	if r.Kind == RemedyFill {
		why.say("Fill one tank at a time and watch the heel while it is slack.")
	}
	return against
}

// remedyJudgeList judges option r for a listed ship: it must keep GM
// positive and reduce the heel. It returns against with its own objections
// added and sets r.Advisable.
func remedyJudgeList(r *Remedy, rs *RemedySet, against []string, why *remedyWords) []string {
	p, up := r.Position, r.UprightGMM
	switch {
	case math.IsNaN(up):
		against = append(against, "its upright GM could not be worked out")
	case !(up > 0):
		against = append(against, fmt.Sprintf("leaves her with negative GM upright (%.2f m): she would loll", up))
	case !(p.GMAtRestM > 0):
		against = append(against, fmt.Sprintf("leaves her with no GM where she lies (%.2f m)", p.GMAtRestM))
	}
	if !(math.Abs(p.HeelDeg) < math.Abs(rs.HeelDeg)) {
		against = append(against, fmt.Sprintf("does not reduce the heel (%s)", heelWords(p.HeelDeg)))
	}
	r.Advisable = len(against) == 0
	if r.Advisable {
		if p.HeelDeg*rs.HeelDeg < 0 && math.Abs(p.HeelDeg) >= RemedyUprightDeg {
			why.say("Overshoots: she would lie %s instead.", heelWords(p.HeelDeg))
		} else {
			why.say("Brings her to %s.", heelWords(p.HeelDeg))
		}
		if up < rs.UprightGMM {
			why.say("Raises G: upright GM from %.2f to %.2f m.", rs.UprightGMM, up)
		}
	}
	if r.ToUpright && r.Kind != RemedyDischarge && len(r.FillAfter) > 0 && r.FillAfter[len(r.FillAfter)-1] < RemedyFillTo {
		why.say("The tank filled stays slack: its free surface is counted.")
	}
	return against
}

// remedyCautions adds what goes with option r whether or not it is
// advisable: the freeboard it costs, what stays under water, what it needs.
// deckWorse and openingWorse: the option itself puts them (deeper) under.
func remedyCautions(r *Remedy, after remedyFigures, loss float64, deckWorse, openingWorse bool, why *remedyWords) {
	if loss > RemedyFreeboardLossM {
		why.say("It lowers the least freeboard by %.2f m.", loss)
	}
	if r.DeckEdgeImmersed && !deckWorse {
		why.say("The deck edge stays under water (%.2f m).", -after.deck)
	}
	if r.OpeningImmersed && !openingWorse {
		why.say("The opening %s stays under water (%.2f m).", after.opening, -after.openingM)
	}
	for _, o := range r.Position.Openings {
		if o.Weathertight && o.Immersed() {
			why.say("The weathertight %s would be under water: check it is secured.", o.Name)
			break
		}
	}
	if r.StagesChecked == RemedyStages && r.StageFail == "" {
		why.say("Safe at each tenth of the way.")
	}
	if tw := remedyTimeWords(r); tw != "" {
		why.say("%s", tw)
	}
	switch r.Kind {
	case RemedyTransfer:
		why.say("Needs a transfer line between the two tanks.")
	case RemedyDischarge:
		if !strings.Contains(strings.ToLower(r.liquid), "ballast") {
			why.say("The %s pumped out is lost to the ship's use.", r.liquid)
		}
	}
}

// remedyRank orders the options best first (see FindRemedies).
func remedyRank(rs []Remedy, loll bool) {
	group := func(r Remedy) int {
		switch {
		case !r.Advisable:
			return 2
		case !loll && r.FreeboardLossM > RemedyFreeboardLossM:
			return 1
		}
		return 0
	}
	heel := func(r Remedy) float64 {
		if r.Position == nil {
			return math.Inf(1)
		}
		return math.Abs(r.Position.HeelDeg)
	}
	sort.SliceStable(rs, func(i, j int) bool {
		a, b := rs[i], rs[j]
		if ga, gb := group(a), group(b); ga != gb {
			return ga < gb
		}
		if loll {
			ua, ub := a.UprightGMM, b.UprightGMM
			if math.IsNaN(ua) {
				ua = math.Inf(-1)
			}
			if math.IsNaN(ub) {
				ub = math.Inf(-1)
			}
			if ua != ub {
				return ua > ub
			}
		}
		if ha, hb := heel(a), heel(b); ha != hb {
			return ha < hb
		}
		return a.MassT < b.MassT
	})
}
