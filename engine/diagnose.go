package engine

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"
)

// DiagnoseOptions tunes Diagnose. The zero value is the default.
type DiagnoseOptions struct {
	MaxGroup int // most compartments in one explanation, 1 to 3; 0 means 3
	Keep     int // explanations returned; 0 means 5
	// Joined lists more compartments that water can pass between, searched
	// together like neighbours; the vessel's own Connections always are.
	Joined [][2]int
	// Progress, when set, is told how many candidate sets are done of how
	// many (the last call has done == total).
	Progress func(done, total int)

	noRecheck bool // the diagnosis without the readings that disagree is not run again
}

// FloodedSpace is the water one explanation puts in one compartment.
type FloodedSpace struct {
	Compartment  int     // into Vessel.Compartments
	WaterM3      float64 // sea water in it
	LevelM       float64 // its sounding: the water's height above the compartment's lowest point, at its middle
	BelowSeaM    float64 // how far the water inside stands below the sea outside, at the compartment's middle (0 or less: level with it or above)
	Open         bool    // level with the sea (within OpenToSeaM): the hole is below the water and the space has filled to the sea's level
	Full         bool    // no room left
	Permeability float64 // μ used: the file's, or more where the water found needs more room
}

// OpenToSeaM is how close the water inside must stand to the sea outside
// for a space to be called open to the sea.
const OpenToSeaM = 0.05

// Explanation is one flooding state that accounts for a reading, and how
// well: the misfit is Σ (error/σ)² over the marks (σ DraftErrorM), the heel
// (σ HeelErrorDeg) and the soundings (σ LevelErrorM) of the reading.
type Explanation struct {
	Spaces     []FloodedSpace // none: the ship intact
	Position   *Position
	Marks      []MarkDraft // predicted at the marks that were read, in the reading's order
	DraftRMSM  float64     // root mean square of read − predicted at the marks; NaN with no marks read
	HeelErrDeg float64     // read − predicted heel; NaN with no heel read
	LevelRMSM  float64     // root mean square of read − predicted soundings; NaN with none read
	Misfit     float64
	// FitPermeability is the one permeability fitted to the group's spaces
	// (singles and pairs); 0 where each keeps its own. The readings know it
	// only roughly: it moves where the water stands, and so the heel.
	FitPermeability float64
	// Score ranks explanations: the misfit plus GroupPenalty for each
	// compartment, so that a larger group must explain clearly more than a
	// smaller one to rank above it.
	Score float64
}

// GroupPenalty is what each compartment of an explanation adds to its
// score. An extra free volume absorbs about one unit of χ² of pure reading
// noise; four units keeps noise from promoting a larger group (the same
// reasoning as Akaike's criterion, at twice its weight).
const GroupPenalty = 4.0

// Names returns the explanation's compartments' names, "intact" if none.
func (e Explanation) Names(v *Vessel) string {
	if len(e.Spaces) == 0 {
		return "intact"
	}
	var n []string
	for _, s := range e.Spaces {
		n = append(n, v.Compartments[s.Compartment].Name)
	}
	return strings.Join(n, " + ")
}

// Diagnosis is the ranked explanations of the latest reading.
type Diagnosis struct {
	Reading       int           // index of the reading explained: the latest
	Explanations  []Explanation // best first
	Fits          bool          // the best explains the reading within its errors
	Verdict       string        // a plain sentence
	Tellers       []string      // what would tell the best from the next ones
	Disagreements []Disagreement
	// Without is the best explanation of the latest reading without its
	// readings that disagree with the rest, when nothing fits with them and
	// something does without; nil otherwise. The verdict says so.
	Without     *Explanation
	Searched    int   // candidate sets fitted
	NotSearched []int // compartments left out: tanks pressed full of sea water, which a hole below the water does not change
}

// Diagnose finds the flooding states that best explain the latest of the
// readings rs (in time order) of vessel v in its loading condition.
//
// Method: the water surface the marks and inclinometer imply is fitted
// first (ObservedPlane). Every single compartment, every pair of
// neighbours (or compartments joined by a connection) and every connected triple is a
// candidate; in each the volume of sea water (0 to the space's moulded
// volume) is chosen so that the ship, with that water as added weight,
// would float at the observed plane (mass and the two moments, with the
// water's centroid at its own free surface), by bounded least squares;
// that state is solved freely and its misfit at the readings taken. The
// best candidates are then refined by bounded least squares on the
// readings themselves, each trial a free solve. An open compartment at
// equilibrium holds the water a level with the sea gives it, so "open to
// the sea" is found as a level that stands at the sea's.
func Diagnose(v *Vessel, rs []Reading, o DiagnoseOptions) (Diagnosis, error) {
	if len(rs) == 0 {
		return Diagnosis{}, errors.New("diagnosis: no readings")
	}
	if o.MaxGroup <= 0 || o.MaxGroup > 3 {
		o.MaxGroup = 3
	}
	if o.Keep <= 0 {
		o.Keep = 5
	}
	ri := len(rs) - 1
	r := rs[ri]
	if len(r.Drafts) == 0 && !r.HasHeel && len(r.Levels) == 0 {
		return Diagnosis{}, errors.New("diagnosis: the latest reading holds nothing read")
	}
	f, err := newDiagFitter(v, r)
	if err != nil {
		return Diagnosis{}, err
	}
	dg := Diagnosis{Reading: ri, Disagreements: Disagreements(v, rs)}
	var pool []int
	for i, c := range v.Compartments {
		if l := c.Liquid; l != nil && l.Fill >= PressedFullFill && math.Abs(l.Density-v.WaterDensity) < 0.01 {
			dg.NotSearched = append(dg.NotSearched, i)
			continue
		}
		pool = append(pool, i)
	}
	sets := candidateSets(v, pool, o)
	singles := 0
	for _, s := range sets {
		if len(s) == 1 {
			singles++
		}
	}
	total := len(sets) + singles + 2*refineCount
	var cands []*diagCand
	for n, s := range sets {
		c := f.fitToPlane(s)
		if c != nil {
			cands = append(cands, c)
		}
		if o.Progress != nil && n%8 == 0 {
			o.Progress(n, total)
		}
	}
	dg.Searched = len(sets)
	sort.SliceStable(cands, func(i, j int) bool { return cands[i].score < cands[j].score })
	// Refine every single compartment (cheap, and the plane the readings
	// imply can be a poor start: with the marks at one end under water it
	// does not know the trim), the best few groups, and every group close
	// enough to the best that reading noise could have put it behind.
	done := 0
	for i, c := range cands {
		close := i < refineCount || (i < 2*refineCount && c.score <= cands[0].score+refineMargin)
		if len(c.set) > 1 && !close {
			continue
		}
		f.refine(c)
		done++
		if o.Progress != nil {
			o.Progress(min(len(sets)+done, total-1), total)
		}
	}
	if o.Progress != nil {
		o.Progress(total, total)
	}
	sort.SliceStable(cands, func(i, j int) bool { return cands[i].score < cands[j].score })
	var kept []*diagCand
	for _, c := range cands {
		if len(kept) >= o.Keep {
			break
		}
		// A group that ranks below one of its own parts and explains the
		// readings no better says nothing more than that part (often a
		// holed tank whose contents weigh what the sea water that replaced
		// them does).
		if !c.meaningful() || containsPart(kept, c) {
			continue
		}
		kept = append(kept, c)
		dg.Explanations = append(dg.Explanations, f.explain(c))
	}
	nRead := len(r.Drafts) + len(r.Levels)
	if r.HasHeel {
		nRead++
	}
	dg.Fits, dg.Verdict = verdict(v, dg.Explanations, nRead)
	dg.Tellers = tellers(v, dg.Explanations)
	if !dg.Fits && !o.noRecheck {
		dg.recheck(v, rs, o)
	}
	return dg, nil
}

// recheck diagnoses the latest reading once more without the readings of
// it that disagree with the rest, and says what would fit then: the
// officer sees both, and which reading to take again.
func (dg *Diagnosis) recheck(v *Vessel, rs []Reading, o DiagnoseOptions) {
	ri := len(rs) - 1
	r := rs[ri]
	drop := map[string]bool{}
	for _, g := range dg.Disagreements {
		if g.Reading == ri {
			drop[g.What] = true
		}
	}
	if len(drop) == 0 {
		return
	}
	var kept Reading
	kept.Minutes, kept.Levels = r.Minutes, r.Levels
	if r.HasHeel && !drop["heel"] {
		kept.HeelDeg, kept.HasHeel = r.HeelDeg, true
	}
	var left []string
	for _, d := range r.Drafts {
		if n := v.DraftMarks[d.Mark].Name; drop[n] {
			left = append(left, n)
		} else {
			kept.Drafts = append(kept.Drafts, d)
		}
	}
	if drop["heel"] {
		left = append(left, "the inclinometer")
	}
	o.noRecheck, o.Progress = true, nil
	alt, err := Diagnose(v, append(append([]Reading(nil), rs[:ri]...), kept), o)
	if err != nil || !alt.Fits || len(alt.Explanations) == 0 {
		return
	}
	b := alt.Explanations[0]
	dg.Without = &b
	dg.Verdict += fmt.Sprintf(" Leaving out %s, %s fits, off by %s.", strings.Join(left, " and "), b.Names(v), misfitWords(b))
}

// refineCount is how many of the best candidates are refined on the
// readings themselves.
const refineCount = 6

// refineMargin: candidates whose first score lies within this many units
// of χ² of the best are refined too (up to 2 × refineCount).
const refineMargin = 30.0

// candidateSets returns the empty set (intact), the singles of pool, the
// neighbouring or joined pairs and the connected triples, each sorted and
// listed once.
func candidateSets(v *Vessel, pool []int, o DiagnoseOptions) [][]int {
	in := map[int]bool{}
	for _, i := range pool {
		in[i] = true
	}
	nb := Neighbours(v)
	adj := make([]map[int]bool, len(v.Compartments))
	for i := range adj {
		adj[i] = map[int]bool{}
		for _, j := range nb[i] {
			adj[i][j] = true
		}
	}
	// The ship's own connections (doors, ducts, pipes, cross-flooding
	// fittings, open or shut: a shut door may leak) join their ends too.
	joined := append([][2]int(nil), o.Joined...)
	for _, c := range v.Connections {
		joined = append(joined, [2]int{c.From, c.To})
	}
	for _, p := range joined {
		if p[0] >= 0 && p[1] >= 0 && p[0] < len(adj) && p[1] < len(adj) && p[0] != p[1] {
			adj[p[0]][p[1]], adj[p[1]][p[0]] = true, true
		}
	}
	seen := map[string]bool{}
	out := [][]int{{}}
	add := func(s []int) {
		s = append([]int(nil), s...)
		sort.Ints(s)
		k := fmt.Sprint(s)
		if !seen[k] {
			seen[k] = true
			out = append(out, s)
		}
	}
	for _, i := range pool {
		add([]int{i})
	}
	if o.MaxGroup >= 2 {
		for _, i := range pool {
			for j := range adj[i] {
				if in[j] {
					add([]int{i, j})
				}
			}
		}
	}
	if o.MaxGroup >= 3 {
		for _, s := range out {
			if len(s) != 2 {
				continue
			}
			for _, m := range s {
				for j := range adj[m] {
					if in[j] && j != s[0] && j != s[1] {
						add([]int{s[0], s[1], j})
					}
				}
			}
		}
	}
	return out
}

// diagCand is one candidate set and its fit.
type diagCand struct {
	set    []int
	vol    []float64 // m³ of water in each
	mu     float64   // permeability fitted for the group; 0: each its own
	moul   []float64 // moulded volumes
	pos    *Position
	d      Damage
	misfit float64
	score  float64
}

// containsPart reports whether c's set holds the whole set of one of kept
// while its misfit is not lower by at least one unit of χ² (one reading's
// worth of noise).
func containsPart(kept []*diagCand, c *diagCand) bool {
	for _, k := range kept {
		if c.misfit < k.misfit-1 {
			continue
		}
		all := true
		for _, ci := range k.set {
			found := false
			for _, cj := range c.set {
				found = found || ci == cj
			}
			all = all && found
		}
		if all {
			return true
		}
	}
	return false
}

// meaningful reports whether every compartment of the set holds water
// worth the name: a member left nearly dry makes the set a copy of a
// smaller one, which is listed on its own.
func (c *diagCand) meaningful() bool {
	for i, w := range c.vol {
		if w < math.Max(2, 0.01*c.moul[i]) {
			return false
		}
	}
	return c.pos != nil
}

// diagFitter holds what every candidate of one reading shares.
type diagFitter struct {
	v      *Vessel
	r      Reading
	obs    Plane
	hullV  float64
	hullC  [3]float64
	awp    float64
	gmT    float64
	gmL    float64
	shells []markShell // at the marks read, in the reading's order
	levels map[int]float64
}

func newDiagFitter(v *Vessel, r Reading) (*diagFitter, error) {
	f := &diagFitter{v: v, r: r, levels: map[int]float64{}}
	f.obs = FitObservedPlane(v, r).Plane
	im := v.Hull.solid.Below(f.obs)
	f.hullV = im.V
	f.hullC[0], f.hullC[1], f.hullC[2] = im.Centroid()
	f.awp = im.AW
	intact, err := Solve(v, v.Intact())
	if err != nil {
		return nil, fmt.Errorf("diagnosis: the loading condition does not float intact: %w", err)
	}
	if f.awp <= 0 {
		f.awp = intact.WaterplaneAreaM2
	}
	f.gmT = math.Max(intact.GMM, 0.3)
	f.gmL = math.Max(intact.GMLM, v.Hull.LengthM)
	for _, m := range r.Drafts {
		f.shells = append(f.shells, shellAt(v.Hull, v.DraftMarks[m.Mark]))
	}
	for _, l := range r.Levels {
		f.levels[l.Compartment] = l.LevelM
	}
	return f, nil
}

// damage returns the state with vol[i] of sea water in set[i]: the
// compartment's own permeability, raised where the water needs more room
// (never above 1); a holed tank's contents are gone.
//
// mu, when above 0, is the permeability of every member instead of its
// own: the true permeability is not known, and the level the water stands
// at (so its centre, and the heel it gives) depends on it.
func (f *diagFitter) damage(set []int, vol []float64, mu float64) Damage {
	d := f.v.Intact()
	for i, ci := range set {
		c := f.v.Compartments[ci]
		V := c.solid.Volume()
		w := math.Max(vol[i], 1e-9*V)
		m := c.Permeability
		if mu > 0 {
			m = mu
		}
		if w > m*V {
			m = math.Min(1, w/V)
		}
		s := SpaceState{WaterM3: w}
		if m != c.Permeability {
			s.Permeability = m
		}
		d[ci] = s
	}
	return d
}

// planeResiduals says how far the ship with water vol in set is from
// floating at the observed plane, scaled to reading errors: the sinkage
// the mass is out by, and the trim and heel its moments are out by, over
// GM and GML of the intact ship (a scale only: the free solve judges).
func (f *diagFitter) planeResiduals(set []int, vol []float64) []float64 {
	v := f.v
	d := f.damage(set, vol, 0)
	ld := v.Loading(d)
	p := f.obs
	m := ld.MassT
	mx, my, mz := m*ld.LCGM, m*ld.TCGM, m*ld.VCGM
	out := make([]float64, 3, 3+len(set))
	for _, ci := range set {
		c := v.Compartments[ci]
		w := d[ci].WaterM3
		mu := v.Permeability(d, ci)
		pl, im := levelForVolume(c.solid, math.Min(w/mu, c.solid.Volume()*(1-1e-9)), p.B, p.C)
		x, y, z := im.Centroid()
		mw := v.WaterDensity * w
		m += mw
		mx, my, mz = mx+mw*x, my+mw*y, mz+mw*z
		if lv, ok := f.levels[ci]; ok {
			out = append(out, (sounding(c, pl)-lv)/LevelErrorM)
		}
	}
	// G as the solver has it: the intact tanks' free surfaces as a
	// virtual rise (held water moves with its own surface above).
	gx, gy, gz := mx/m, my/m, mz/m+ld.FSMTm/m
	dx, dy, dz := gx-f.hullC[0], gy-f.hullC[1], gz-f.hullC[2]
	out[0] = (v.WaterDensity*f.hullV - m) / (v.WaterDensity * f.awp) / DraftErrorM
	out[1] = (dx + p.B*dz) / f.gmL * v.Hull.LengthM / DraftErrorM
	out[2] = (dy + p.C*dz) / f.gmT * v.Hull.BreadthM / 2 / DraftErrorM
	return out
}

// fitToPlane fits the water of set to the observed plane, then solves the
// ship freely with it and takes the misfit at the readings.
func (f *diagFitter) fitToPlane(set []int) *diagCand {
	c := &diagCand{set: set, vol: make([]float64, len(set)), moul: make([]float64, len(set))}
	if len(set) == 0 {
		f.forward(c)
		return c
	}
	lo, hi, h := make([]float64, len(set)), make([]float64, len(set)), make([]float64, len(set))
	var capSum float64
	for i, ci := range set {
		c.moul[i] = f.v.Compartments[ci].solid.Volume()
		hi[i], h[i] = c.moul[i], math.Max(0.5, 1e-3*c.moul[i])
		capSum += c.moul[i]
	}
	// Start: the water the observed displacement asks for, shared in
	// proportion to the spaces' volumes.
	ld := f.v.Loading(f.damage(set, c.vol, 0))
	need := f.hullV - ld.MassT/f.v.WaterDensity
	for i := range set {
		c.vol[i] = math.Max(0, need) * c.moul[i] / capSum
	}
	// A start, not the answer: within a tenth of a reading's error of
	// the observed plane is enough (the free solve judges).
	x, _, ok := boundedLeastSquares(c.vol, lo, hi, h, 8, 0.01, func(x []float64) ([]float64, bool) {
		return f.planeResiduals(set, x), true
	})
	if ok {
		c.vol = x
	}
	f.forward(c)
	return c
}

// forward solves the ship freely with c's water and scores it.
func (f *diagFitter) forward(c *diagCand) {
	c.d = f.damage(c.set, c.vol, c.mu)
	res, pos, ok := f.readingResiduals(c.d)
	if !ok {
		c.pos, c.misfit, c.score = nil, math.Inf(1), math.Inf(1)
		return
	}
	c.pos = pos
	c.misfit = sumSq(res)
	c.score = c.misfit + GroupPenalty*float64(len(c.set))
}

// readingResiduals solves the ship under d and returns (predicted − read)/σ
// at every mark, the heel and every sounding of the reading.
func (f *diagFitter) readingResiduals(d Damage) ([]float64, *Position, bool) {
	pos, err := NewProblem(f.v, d).EquilibriumFrom(f.obs, true)
	if err != nil {
		return nil, nil, false
	}
	var out []float64
	for k, m := range f.r.Drafts {
		out = append(out, (f.shells[k].draft(pos.Plane).DraftM-m.DraftM)/DraftErrorM)
	}
	if f.r.HasHeel {
		out = append(out, (pos.HeelDeg-f.r.HeelDeg)/HeelErrorDeg)
	}
	for _, l := range f.r.Levels {
		out = append(out, (f.predictedLevel(&pos, l.Compartment)-l.LevelM)/LevelErrorM)
	}
	return out, &pos, true
}

// predictedLevel is the sounding of compartment ci in pos (0 when dry).
func (f *diagFitter) predictedLevel(pos *Position, ci int) float64 {
	for _, h := range pos.Held {
		if h.Index == ci {
			return sounding(f.v.Compartments[ci], h.Surface)
		}
	}
	return 0
}

// refine fits c's water on the readings themselves, each trial a free solve.
func (f *diagFitter) refine(c *diagCand) {
	if len(c.set) == 0 || c.pos == nil {
		return
	}
	k := len(c.set)
	if k == 3 {
		f.refineVolumes(c)
		return
	}
	// Singles and pairs: the part of each space filled, q ∈ [0, 1], and one
	// permeability μ for the group, within the range of the trade's values
	// (SOLAS II-1 Reg. 7-3: 0.60 stores to 0.95, here 0.5 to 1); the water
	// is q·μ·V. So written the misfit has no kink where a space fills up
	// (a space full to its top only says q = 1, whatever μ).
	mu0 := f.v.Compartments[c.set[0]].Permeability
	water := func(x []float64) []float64 {
		w := make([]float64, k)
		for i := range w {
			w[i] = x[i] * x[k] * c.moul[i]
		}
		return w
	}
	x0 := make([]float64, k+1)
	x0[k] = mu0
	for i := range c.set {
		x0[i] = math.Min(1, c.vol[i]/(mu0*c.moul[i]))
	}
	if k == 1 {
		// A coarse look along the space first: the misfit can be flat
		// where the start lies (two effects of the water cancelling at the
		// marks read) and steep elsewhere (the deck edge going under), so
		// a start from the plane alone may stall.
		best := c.misfit
		for _, q := range []float64{0.05, 0.2, 0.4, 0.6, 0.8, 1} {
			x := []float64{q, mu0}
			if res, _, ok := f.readingResiduals(f.damage(c.set, water(x), mu0)); ok && sumSq(res) < best {
				best, x0 = sumSq(res), x
			}
		}
	}
	lo, hi, h := make([]float64, k+1), make([]float64, k+1), make([]float64, k+1)
	for i := 0; i < k; i++ {
		hi[i], h[i] = 1, math.Max(1e-3, 0.5/c.moul[i])
	}
	lo[k], hi[k], h[k] = 0.5, 1, 0.01
	x, _, ok := boundedLeastSquares(x0, lo, hi, h, 10, 0, func(x []float64) ([]float64, bool) {
		res, _, ok := f.readingResiduals(f.damage(c.set, water(x), x[k]))
		return res, ok
	})
	if ok {
		c.vol, c.mu = water(x), x[k]
		f.forward(c)
	}
}

// refineVolumes fits the water of each space of c (triples) on the
// readings, each at its own permeability.
func (f *diagFitter) refineVolumes(c *diagCand) {
	lo, hi, h := make([]float64, len(c.set)), append([]float64(nil), c.moul...), make([]float64, len(c.set))
	for i := range c.set {
		h[i] = math.Max(0.5, 1e-3*c.moul[i])
	}
	x, _, ok := boundedLeastSquares(c.vol, lo, hi, h, 6, 0, func(x []float64) ([]float64, bool) {
		res, _, ok := f.readingResiduals(f.damage(c.set, x, 0))
		return res, ok
	})
	if ok {
		c.vol = x
		f.forward(c)
	}
}

// sounding is the height of the water surface p inside c above c's lowest
// point, at c's middle, along z (as FloodSample.SoundingM); 0 to c's height.
func sounding(c *Compartment, p Plane) float64 {
	xmin, xmax, zmin, zmax := c.solid.Extent()
	l := p.Z((xmin+xmax)/2, (c.Box.Y0+c.Box.Y1)/2) - zmin
	return math.Max(0, math.Min(l, zmax-zmin))
}

// explain turns a fitted candidate into an Explanation.
func (f *diagFitter) explain(c *diagCand) Explanation {
	e := Explanation{Position: c.pos, Misfit: c.misfit, Score: c.score, FitPermeability: c.mu,
		DraftRMSM: math.NaN(), HeelErrDeg: math.NaN(), LevelRMSM: math.NaN()}
	p := c.pos
	for _, ms := range f.shells {
		e.Marks = append(e.Marks, ms.draft(p.Plane))
	}
	if n := len(f.r.Drafts); n > 0 {
		var s float64
		for k, m := range f.r.Drafts {
			s += math.Pow(e.Marks[k].DraftM-m.DraftM, 2)
		}
		e.DraftRMSM = math.Sqrt(s / float64(n))
	}
	if f.r.HasHeel {
		e.HeelErrDeg = f.r.HeelDeg - p.HeelDeg
	}
	if n := len(f.r.Levels); n > 0 {
		var s float64
		for _, l := range f.r.Levels {
			s += math.Pow(f.predictedLevel(p, l.Compartment)-l.LevelM, 2)
		}
		e.LevelRMSM = math.Sqrt(s / float64(n))
	}
	// The readings hardly tell a space's permeability from its level:
	// the level and the sea are given at the file's permeability (or the
	// least that holds the water), the officer's best knowledge of it.
	// A space that was sounded shows at the fitted permeability: the
	// sounding and the water together fix it.
	d0, dFit := f.damage(c.set, c.vol, 0), f.damage(c.set, c.vol, c.mu)
	sea := p.Plane
	for i, ci := range c.set {
		comp := f.v.Compartments[ci]
		fs := FloodedSpace{Compartment: ci, WaterM3: c.vol[i], Permeability: f.v.Permeability(d0, ci)}
		if _, sounded := f.levels[ci]; sounded {
			fs.Permeability = f.v.Permeability(dFit, ci)
		}
		V := comp.solid.Volume()
		in, _ := levelForVolume(comp.solid, math.Min(c.vol[i]/fs.Permeability, V*(1-1e-9)), sea.B, sea.C)
		fs.LevelM = sounding(comp, in)
		xmin, xmax, _, _ := comp.solid.Extent()
		x, y := (xmin+xmax)/2, (comp.Box.Y0+comp.Box.Y1)/2
		fs.BelowSeaM = (sea.Z(x, y) - in.Z(x, y)) / math.Sqrt(1+sea.B*sea.B+sea.C*sea.C)
		fs.Full = c.vol[i] >= 0.995*fs.Permeability*V
		fs.Open = math.Abs(fs.BelowSeaM) <= OpenToSeaM && !fs.Full
		e.Spaces = append(e.Spaces, fs)
	}
	e.Position = f.withUprightGM(e)
	return e
}

// withUprightGM returns e's position with its upright GM filled in (the GM
// every report shows; the fit's free solves leave it out), worked out as
// the flooding run does (FloodRun.uprightDamage): a space whose water
// stands level with the sea is in free communication with it, so brought
// upright it is the space open to the sea (lost buoyancy); a space still
// filling holds its water as an added weight.
func (f *diagFitter) withUprightGM(e Explanation) *Position {
	if e.Position == nil || !math.IsNaN(e.Position.GMUprightM) {
		return e.Position
	}
	up := *e.Position
	d := f.v.Intact()
	for _, s := range e.Spaces {
		if s.Open {
			d[s.Compartment] = SpaceState{Open: true, Permeability: s.Permeability}
		} else {
			d[s.Compartment] = SpaceState{WaterM3: s.WaterM3, Permeability: s.Permeability}
		}
	}
	pr := NewProblem(f.v, d)
	if pl, _, err := pr.AtHeel(0, Plane{A: up.Plane.A, B: up.Plane.B}); err == nil {
		up.GMUprightM = pr.uprightAt(pl)
	}
	return &up
}

// FitLimit is the misfit per reading, in units of χ², beyond which the
// best explanation is said not to fit: every reading off by three of its
// standard deviations.
const FitLimit = 9.0

// verdict says whether the best explanation fits and, plainly, what it is.
func verdict(v *Vessel, es []Explanation, nRead int) (bool, string) {
	if len(es) == 0 {
		return false, "Nothing heelwatch can flood accounts for these readings: no candidate floats at them. A reading may be wrong, a weight may have shifted, or water is where the vessel file has no compartment."
	}
	b := es[0]
	if b.Misfit > FitLimit*math.Max(float64(nRead), 1) {
		return false, fmt.Sprintf("Nothing fits the readings within their errors: the best, %s, is still off by %s. A reading may be wrong, a weight may have shifted (cargo, a tank), or water is where the vessel file has no compartment.",
			b.Names(v), misfitWords(b))
	}
	if len(b.Spaces) == 0 {
		return true, "The readings agree with the ship intact: no flooding that they can show."
	}
	return true, fmt.Sprintf("Best explanation: %s, off by %s.", b.Names(v), misfitWords(b))
}

// misfitWords says how far an explanation is from the reading, in what was
// read: "0.4 cm RMS at the marks", "0.1° of heel", "3 cm RMS in the soundings".
func misfitWords(e Explanation) string {
	var parts []string
	if !math.IsNaN(e.DraftRMSM) {
		parts = append(parts, fmt.Sprintf("%.1f cm RMS at the marks", 100*e.DraftRMSM))
	}
	if !math.IsNaN(e.HeelErrDeg) {
		parts = append(parts, fmt.Sprintf("%.1f° of heel", math.Abs(e.HeelErrDeg)))
	}
	if !math.IsNaN(e.LevelRMSM) {
		parts = append(parts, fmt.Sprintf("%.0f cm RMS in the soundings", 100*e.LevelRMSM))
	}
	if len(parts) > 1 {
		return strings.Join(parts[:len(parts)-1], ", ") + " and " + parts[len(parts)-1]
	}
	return strings.Join(parts, "")
}

// tellers says, for the runners-up, which sounding would tell them from the
// best: the compartment whose level differs most between the two.
func tellers(v *Vessel, es []Explanation) []string {
	if len(es) < 2 {
		return nil
	}
	level := func(e Explanation, ci int) float64 {
		for _, s := range e.Spaces {
			if s.Compartment == ci {
				return s.LevelM
			}
		}
		return 0
	}
	words := func(e Explanation, ci int) string {
		l := level(e, ci)
		flooded := false
		for _, s := range e.Spaces {
			flooded = flooded || s.Compartment == ci
		}
		if liq := v.Compartments[ci].Liquid; !flooded && liq != nil && liq.Fill > 0 {
			return "its " + liq.Name + " as loaded"
		}
		if l < 0.05 {
			return "dry"
		}
		return fmt.Sprintf("sea water about %.2f m deep", l)
	}
	var out []string
	for _, o := range es[1:min(len(es), 3)] {
		best, bestD := -1, 0.0
		for _, e := range []Explanation{es[0], o} {
			for _, s := range e.Spaces {
				if d := math.Abs(level(es[0], s.Compartment) - level(o, s.Compartment)); d > bestD {
					best, bestD = s.Compartment, d
				}
			}
		}
		if best < 0 || bestD < 0.1 {
			out = append(out, fmt.Sprintf("%s and %s look alike at every sounding: read the marks again after a while, the trend tells them apart.", es[0].Names(v), o.Names(v)))
			continue
		}
		out = append(out, fmt.Sprintf("Sound %s: %s if it is %s; %s if it is %s.", v.Compartments[best].Name,
			words(es[0], best), es[0].Names(v), words(o, best), o.Names(v)))
	}
	return out
}
