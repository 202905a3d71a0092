package engine

import (
	"errors"
	"fmt"
	"math"
)

// TrendOptions is what the file knows of holes and pumps.
type TrendOptions struct {
	// Holes are the holes the vessel file places, by compartment; the
	// trend uses the one in the compartment that is filling, and otherwise
	// assumes a hole at that compartment's lowest point on the shell.
	Holes map[int]Hole
	// PumpsM3h is the pumping capacity that can be put on each
	// compartment, m³/h.
	PumpsM3h map[int]float64
	// Cd is the discharge coefficient for an assumed hole; 0 means
	// DefaultDischargeCoefficient.
	Cd float64
	// LimitS bounds the projection; 0 means DefaultFloodLimitS.
	LimitS float64
}

// Trend is how fast the water comes in, through what, and where it ends.
//
// The water in each space of the explanation is fitted to every reading
// (bounded least squares, the spaces fixed), with its standard error from
// the fit's Jacobian (σ = √((JᵀJ)⁻¹) in reading-error units). The inflow is
// the slope of the total water against time by weighted least squares,
// with its standard error; where the readings scatter more than their
// errors allow, the error is widened by √(χ²/dof) (honest about a bad
// reading). The equivalent hole is the area that passes that inflow by
// Torricelli, Q = C_d·A·√(2 g h), with √h averaged over the readings
// (trapezoidal in time), h the head across the hole; its error follows the
// inflow's. The projection is a flooding run (FloodRun) from the latest
// reading with that hole, without pumps: when the deck edge goes under,
// when the first opening does, and whether she is lost; it is repeated
// with the hole one standard error smaller and larger for the range.
type Trend struct {
	Compartment int       // the space that is filling (the one whose water grew most)
	Minutes     []float64 // the readings' times
	WaterM3     []float64 // total water of the explanation at each reading
	WaterSDM3   []float64 // its standard error

	InflowM3h, InflowSDM3h float64 // net inflow (any pumping during the readings included)
	HeadM                  float64 // mean head across the hole over the readings ((mean √h)²), m
	Hole                   Hole    // as used, area the estimate
	HoleAssumed            bool    // no hole in the file: placed at the lowest point of the shell
	HoleAreaSDM2           float64 // standard error of the area
	PumpsM3h               float64 // capacity that can be put on the filling space
	PumpsHold              string  // "yes", "no" or "uncertain": can the pumps take the present inflow
	// InflowNowM3h is the present inflow: the larger of Torricelli's at
	// the latest head and the rise between the last two readings (net of
	// any pumping then); InflowNowSDM3h its standard error.
	InflowNowM3h, InflowNowSDM3h float64
	// BalanceHeadM is the head at which the hole passes just the pumps'
	// capacity, by Torricelli h = (Q/(C_d·A))²/(2 g): the water inside
	// that far below the sea at the hole; NaN with no hole or no pumps.
	BalanceHeadM float64
	// BalanceS is the time from the latest reading, without pumping, until
	// the head falls to BalanceHeadM; NaN if not within the projection.
	BalanceS      float64
	Projection    FloodReport
	DeckEdgeS     float64 // from the latest reading; NaN if not within the projection
	DeckEdgeRange [2]float64
	OpeningS      float64 // first non-weathertight opening under; NaN if none
	Opening       string
	LossS         float64 // she sinks or capsizes; NaN if she does not within the projection
	Final         *Position
	Words         []string // the trend in plain sentences
}

// EstimateTrend works out the trend of explanation e over readings rs (two
// or more, in time order) of v.
func EstimateTrend(v *Vessel, rs []Reading, e Explanation, o TrendOptions) (Trend, error) {
	if len(rs) < 2 {
		return Trend{}, errors.New("trend: needs readings at two or more times")
	}
	if rs[len(rs)-1].Minutes <= rs[0].Minutes {
		return Trend{}, errors.New("trend: the readings span no time")
	}
	if len(e.Spaces) == 0 {
		return Trend{}, errors.New("trend: the best explanation floods nothing")
	}
	set := make([]int, len(e.Spaces))
	for i, s := range e.Spaces {
		set[i] = s.Compartment
	}
	t := Trend{BalanceHeadM: math.NaN(), BalanceS: math.NaN(), DeckEdgeS: math.NaN(), OpeningS: math.NaN(), LossS: math.NaN(), DeckEdgeRange: [2]float64{math.NaN(), math.NaN()}}
	per := make([][]float64, len(rs))
	var positions []*Position
	for i, r := range rs {
		f, err := newDiagFitter(v, r)
		if err != nil {
			return Trend{}, err
		}
		c := f.fitToPlane(set)
		c.mu = e.FitPermeability
		f.refineFixed(c)
		if c.pos == nil {
			return Trend{}, fmt.Errorf("trend: no floating position explains the reading at %s min", fmtMin(r.Minutes))
		}
		sd := f.totalSD(c)
		var tot float64
		for _, w := range c.vol {
			tot += w
		}
		per[i] = c.vol
		positions = append(positions, c.pos)
		t.Minutes = append(t.Minutes, r.Minutes)
		t.WaterM3 = append(t.WaterM3, tot)
		t.WaterSDM3 = append(t.WaterSDM3, sd)
	}
	// The filling space: the one whose water grew most.
	best, grow := 0, math.Inf(-1)
	for k := range set {
		if g := per[len(per)-1][k] - per[0][k]; g > grow {
			best, grow = k, g
		}
	}
	t.Compartment = set[best]
	slope, sd := weightedSlope(t.Minutes, t.WaterM3, t.WaterSDM3)
	t.InflowM3h, t.InflowSDM3h = slope*60, sd*60

	ci := t.Compartment
	cd := o.Cd
	if cd <= 0 {
		cd = DefaultDischargeCoefficient
	}
	if h, ok := o.Holes[ci]; ok {
		t.Hole = h
		if t.Hole.Cd <= 0 {
			t.Hole.Cd = cd
		}
	} else {
		h, err := ShellHole(v, ci, 1, math.NaN(), cd)
		if err != nil {
			return t, err
		}
		t.Hole, t.HoleAssumed = h, true
	}
	// √h over the readings, trapezoidal in time.
	var integ, span float64
	heads := make([]float64, len(rs))
	for i, p := range positions {
		heads[i] = headAcross(v, ci, p, per[i][best], t.Hole)
	}
	for i := 1; i < len(rs); i++ {
		dt := t.Minutes[i] - t.Minutes[i-1]
		integ += dt * (math.Sqrt(heads[i]) + math.Sqrt(heads[i-1])) / 2
		span += dt
	}
	meanRoot := integ / span
	t.HeadM = meanRoot * meanRoot
	t.PumpsM3h = o.PumpsM3h[ci]
	switch {
	case meanRoot <= 0 || t.InflowM3h <= 0:
		t.Hole.AreaM2, t.HoleAreaSDM2 = 0, math.NaN()
	default:
		q := t.InflowM3h / 3600
		t.Hole.AreaM2 = q / (t.Hole.Cd * math.Sqrt(2*StandardGravity) * meanRoot)
		t.HoleAreaSDM2 = t.Hole.AreaM2 * t.InflowSDM3h / t.InflowM3h
	}
	// Can the pumps take it? The inflow now: Torricelli at the latest head,
	// or the rise between the last two readings if that is more (the
	// water seen rising faster than the pumps take it is not held).
	n := len(rs) - 1
	qNow := t.Hole.Cd * t.Hole.AreaM2 * math.Sqrt(2*StandardGravity*heads[n]) * 3600
	qNowSD := qNow * t.InflowSDM3h / math.Max(t.InflowM3h, 1e-9)
	if dt := t.Minutes[n] - t.Minutes[n-1]; dt > 0 {
		rise := (t.WaterM3[n] - t.WaterM3[n-1]) / dt * 60
		riseSD := math.Hypot(t.WaterSDM3[n], t.WaterSDM3[n-1]) / dt * 60
		if rise > qNow {
			qNow, qNowSD = rise, riseSD
		}
	}
	t.InflowNowM3h, t.InflowNowSDM3h = qNow, qNowSD
	switch {
	case t.PumpsM3h <= 0:
		t.PumpsHold = "no"
	case t.PumpsM3h >= qNow+2*qNowSD:
		t.PumpsHold = "yes"
	case t.PumpsM3h < qNow-2*qNowSD:
		t.PumpsHold = "no"
	default:
		t.PumpsHold = "uncertain"
	}
	if t.PumpsM3h > 0 && t.Hole.AreaM2 > 0 {
		q := t.PumpsM3h / 3600 / (t.Hole.Cd * t.Hole.AreaM2)
		t.BalanceHeadM = q * q / (2 * StandardGravity)
	}
	if t.Hole.AreaM2 > 0 {
		base := v.Intact()
		last := len(rs) - 1
		for k, c := range set {
			base[c] = SpaceState{WaterM3: math.Max(per[last][k], 1e-9)}
			if V := v.Compartments[c].solid.Volume(); per[last][k] > v.Compartments[c].Permeability*V {
				base[c].Permeability = math.Min(1, per[last][k]/V)
			}
		}
		run := func(area float64) (FloodReport, error) {
			h := t.Hole
			h.AreaM2 = area
			return RunFlood(FloodCase{Vessel: v, Base: base, Compartment: ci, Hole: h, LimitS: o.LimitS}, nil)
		}
		rep, err := run(t.Hole.AreaM2)
		if err != nil {
			return t, err
		}
		t.Projection = rep
		t.DeckEdgeS, t.OpeningS, t.Opening, t.LossS = projectionTimes(rep)
		t.BalanceS = timeToHead(rep, t.BalanceHeadM)
		if rep.Final.Position != nil {
			t.Final = rep.Final.Position
		}
		for j, f := range []float64{1 + t.HoleAreaSDM2/t.Hole.AreaM2, 1 - t.HoleAreaSDM2/t.Hole.AreaM2} {
			if !(f > 0) {
				continue
			}
			if r2, err := run(t.Hole.AreaM2 * f); err == nil {
				t.DeckEdgeRange[j], _, _, _ = projectionTimes(r2)
			}
		}
	}
	return t, nil
}

// projectionTimes reads a run's events: deck edge, first opening, loss.
func projectionTimes(rep FloodReport) (deck, opening float64, name string, loss float64) {
	deck, opening, loss = math.NaN(), math.NaN(), math.NaN()
	for _, ev := range rep.Events {
		switch ev.Kind {
		case DeckEdgeReached:
			if math.IsNaN(deck) {
				deck = ev.TimeS
			}
		case OpeningReached:
			if math.IsNaN(opening) {
				opening, name = ev.TimeS, ev.Name
			}
		}
	}
	if rep.End == FloodSinks || rep.End == FloodCapsizes {
		loss = rep.EndS
	}
	return deck, opening, name, loss
}

// timeToHead is the first time in run rep at which the head across the hole
// is h or less (linear between samples); NaN if never or h is NaN.
func timeToHead(rep FloodReport, h float64) float64 {
	if math.IsNaN(h) {
		return math.NaN()
	}
	tr := rep.Trace
	for i, s := range tr {
		if s.HeadM > h {
			continue
		}
		if i == 0 {
			return s.TimeS
		}
		a := tr[i-1]
		return a.TimeS + (s.TimeS-a.TimeS)*(a.HeadM-h)/(a.HeadM-s.HeadM)
	}
	return math.NaN()
}

// headAcross is the head across hole h into compartment c holding w m³ of
// water when she floats at pos: the hole's depth below the sea less the
// height of the water inside above it (the same reckoning as a flooding
// run), 0 or more.
func headAcross(v *Vessel, ci int, pos *Position, w float64, h Hole) float64 {
	c := v.Compartments[ci]
	p := pos.Plane
	dSea := -p.Height(h.XM, h.YM, h.ZM)
	// The file's permeability (the officer's best knowledge of it, as the
	// diagnosis gives its levels): the fitted one is known only roughly.
	mu := c.Permeability
	if w > mu*c.solid.Volume() {
		mu = math.Min(1, w/c.solid.Volume())
	}
	in, _ := levelForVolume(c.solid, math.Min(w/mu, c.solid.Volume()*(1-1e-9)), p.B, p.C)
	dIn := -in.Height(h.XM, h.YM, h.ZM)
	return math.Max(0, math.Max(dSea, 0)-math.Max(dIn, 0))
}

// refineFixed fits c's water on the readings at c's permeability (the
// explanation's, fixed: the trend compares volumes).
func (f *diagFitter) refineFixed(c *diagCand) {
	if len(c.set) == 0 || c.pos == nil {
		return
	}
	lo, hi, h := make([]float64, len(c.set)), append([]float64(nil), c.moul...), make([]float64, len(c.set))
	for i := range c.set {
		h[i] = math.Max(0.5, 1e-3*c.moul[i])
	}
	x, _, ok := boundedLeastSquares(c.vol, lo, hi, h, 8, 0, func(x []float64) ([]float64, bool) {
		res, _, ok := f.readingResiduals(f.damage(c.set, x, c.mu))
		return res, ok
	})
	if ok {
		c.vol = x
		f.forward(c)
	}
}

// totalSD is the standard error of c's total water from the fit: with J the
// Jacobian of the scaled residuals, cov = (JᵀJ)⁻¹ and σ² = 1ᵀ·cov·1.
func (f *diagFitter) totalSD(c *diagCand) float64 {
	k := len(c.set)
	r0, _, ok := f.readingResiduals(c.d)
	if !ok || k == 0 {
		return math.NaN()
	}
	J := make([][]float64, len(r0))
	for i := range J {
		J[i] = make([]float64, k)
	}
	for j := 0; j < k; j++ {
		x := append([]float64(nil), c.vol...)
		step := math.Max(0.5, 1e-3*c.moul[j])
		if x[j]+step > c.moul[j] {
			step = -step
		}
		x[j] += step
		r1, _, ok := f.readingResiduals(f.damage(c.set, x, c.mu))
		if !ok {
			return math.NaN()
		}
		for i := range r0 {
			J[i][j] = (r1[i] - r0[i]) / step
		}
	}
	var a [3][3]float64
	for p := 0; p < 3; p++ {
		a[p][p] = 1
	}
	for p := 0; p < k; p++ {
		a[p][p] = 0
		for q := 0; q < k; q++ {
			for i := range J {
				a[p][q] += J[i][p] * J[i][q]
			}
		}
	}
	// 1ᵀ (JᵀJ)⁻¹ 1 = 1ᵀ z with (JᵀJ) z = 1.
	var one [3]float64
	for p := 0; p < k; p++ {
		one[p] = 1
	}
	z, ok := solve3(a, one)
	if !ok {
		return math.NaN()
	}
	var s float64
	for p := 0; p < k; p++ {
		s += z[p]
	}
	return math.Sqrt(math.Max(s, 0))
}

// weightedSlope fits y = a + b·t by least squares with weights 1/σ², and
// returns b and its standard error, widened by √(χ²/dof) when the points
// scatter more than their errors (three or more points).
func weightedSlope(t, y, sd []float64) (b, sb float64) {
	var sw, st, sy float64
	w := make([]float64, len(t))
	for i := range t {
		s := sd[i]
		if !(s > 0) || math.IsNaN(s) {
			s = 1
		}
		w[i] = 1 / (s * s)
		sw += w[i]
		st += w[i] * t[i]
		sy += w[i] * y[i]
	}
	tm, ym := st/sw, sy/sw
	var stt, sty float64
	for i := range t {
		stt += w[i] * (t[i] - tm) * (t[i] - tm)
		sty += w[i] * (t[i] - tm) * (y[i] - ym)
	}
	b = sty / stt
	sb = math.Sqrt(1 / stt)
	if n := len(t); n > 2 {
		var chi float64
		for i := range t {
			r := y[i] - (ym + b*(t[i]-tm))
			chi += w[i] * r * r
		}
		if f := chi / float64(n-2); f > 1 {
			sb *= math.Sqrt(f)
		}
	}
	return b, sb
}
