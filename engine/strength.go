package engine

import (
	"fmt"
	"math"
	"sort"
)

// This file holds the hull girder's still-water shear force and bending
// moment (Tupper, Introduction to Naval Architecture, ch. 7, pp. 126–129):
// the load per metre q(x) = weight − buoyancy, the shear force
// SF(x) = ∫ q dx and the bending moment BM(x) = ∫ SF dx from the hull's aft
// end, both zero at the ends when weight and buoyancy balance.
//
// Signs: SF(x) is the net downward load on the part of the ship aft of x;
// BM(x) = ∫ (x − ξ) q(ξ) dξ over that part is positive hogging (the ends
// heavier than the middle). Forces in kN and moments in kN·m: tonnes times
// StandardGravity.

// Permissible is one set of a read-out point's permissible still-water
// values, kN and kN·m, all magnitudes (≥ 0). Zero means not given.
type Permissible struct {
	ShearKN float64 // |SF| allowed
	HogKNm  float64 // hogging moment allowed
	SagKNm  float64 // sagging moment allowed (a magnitude)
}

// ReadOutPoint is a place along the ship where a loading instrument reads
// the shear force and bending moment (a bulkhead, the middle of a hold) with
// its permissible values at sea and in harbour (IACS Rec. 48 §4.2).
type ReadOutPoint struct {
	Name    string
	XM      float64
	Sea     Permissible
	Harbour Permissible
}

// GirderLimits is what the vessel says of her hull girder: the read-out
// points and whether the harbour values apply (the sea values otherwise).
// With no points the curve is read at every tenth of the length, without
// permissible values.
type GirderLimits struct {
	Points  []ReadOutPoint
	Harbour bool
}

// CautionPct and DangerPct are the shares of a permissible value at which a
// reading is a caution (90 %) and a danger (past 100 %).
const (
	CautionPct = 90.0
	DangerPct  = 100.0
)

// ShareShown is a share of a permissible value in whole per cent as it is
// to be shown: rounded to the nearest, except that a share past DangerPct
// shows at least DangerPct + 1 and one short of CautionPct at most
// CautionPct − 1, so the figure never contradicts the level beside it
// ("100 %" with a danger mark, "90 %" with none).
func ShareShown(pct float64) float64 {
	r := math.Round(pct)
	switch {
	case pct > DangerPct:
		return math.Max(r, DangerPct+1)
	case pct < CautionPct:
		return math.Min(r, CautionPct-1)
	}
	return r
}

// StrengthReading is the shear force and bending moment at one read-out
// point, against the permissible values of the set in use.
type StrengthReading struct {
	ReadOutPoint
	ShearKN   float64
	MomentKNm float64 // positive hogging
	// ShearLimitKN and MomentLimitKNm are the permissible values applied
	// (the hog or the sag value by the moment's sign); 0 when none is given.
	ShearLimitKN, MomentLimitKNm float64
	// ShearPct and MomentPct are |value| ÷ limit × 100; 0 without a limit.
	ShearPct, MomentPct float64
	Level               Severity // Danger past DangerPct, Caution from CautionPct, else Info
}

// StrengthPeak is the largest magnitude of a curve and where it occurs.
type StrengthPeak struct {
	XM    float64
	Value float64 // signed, kN or kN·m
}

// Strength is the hull girder's still-water shear force and bending moment
// in one floating position.
type Strength struct {
	// The curve, aft to forward, at StrengthIntervals equal steps over the
	// hull and at every read-out point, after the closing error is spread.
	XM, ShearKN, MomentKNm []float64
	Points                 []StrengthReading // at the read-out points, against the set in use
	Harbour                bool              // the harbour values are in use (sea otherwise)
	// MaxShear and MaxMoment are the largest magnitudes among the curve's
	// points (at most a StrengthIntervals-th of the hull apart).
	MaxShear, MaxMoment StrengthPeak
	// ClosingShearKN and ClosingMomentKNm are the curves' values at the
	// forward end before the closing error was spread: what weight and
	// buoyancy fail to balance (solver tolerance, and the moment of weight
	// and buoyancy along a trimmed ship's length, which act on the true
	// vertical, not square to the keel). Each curve is corrected by
	// subtracting its closing value in proportion to the distance from the
	// aft end, as Tupper spreads it.
	ClosingShearKN, ClosingMomentKNm float64
}

// ClosingPct returns the closing errors as percentages of the largest
// shear force and bending moment (0 when the curve is zero everywhere).
func (s *Strength) ClosingPct() (shear, moment float64) {
	if m := math.Abs(s.MaxShear.Value); m > 0 {
		shear = 100 * math.Abs(s.ClosingShearKN) / m
	}
	if m := math.Abs(s.MaxMoment.Value); m > 0 {
		moment = 100 * math.Abs(s.ClosingMomentKNm) / m
	}
	return shear, moment
}

// Worst returns the reading with the largest share of its permissible
// value, and that share; ok is false when no reading has a limit.
func (s *Strength) Worst() (r StrengthReading, pct float64, ok bool) {
	for _, p := range s.Points {
		for _, v := range []float64{p.ShearPct, p.MomentPct} {
			if (p.ShearLimitKN > 0 || p.MomentLimitKNm > 0) && (!ok || v > pct) {
				r, pct, ok = p, v, true
			}
		}
	}
	return r, pct, ok
}

// HasLimits reports whether any read-out point has a permissible value in
// the set in use.
func (s *Strength) HasLimits() bool {
	_, _, ok := s.Worst()
	return ok
}

// Against returns the readings checked against the harbour values
// (harbour) or the sea values.
func (s *Strength) Against(harbour bool) []StrengthReading {
	out := make([]StrengthReading, len(s.Points))
	for i, p := range s.Points {
		out[i] = readAgainst(p.ReadOutPoint, p.ShearKN, p.MomentKNm, harbour)
	}
	return out
}

func readAgainst(pt ReadOutPoint, sf, bm float64, harbour bool) StrengthReading {
	r := StrengthReading{ReadOutPoint: pt, ShearKN: sf, MomentKNm: bm}
	lim := pt.Sea
	if harbour {
		lim = pt.Harbour
	}
	r.ShearLimitKN = lim.ShearKN
	r.MomentLimitKNm = lim.HogKNm
	if bm < 0 {
		r.MomentLimitKNm = lim.SagKNm
	}
	if r.ShearLimitKN > 0 {
		r.ShearPct = 100 * math.Abs(sf) / r.ShearLimitKN
	}
	if r.MomentLimitKNm > 0 {
		r.MomentPct = 100 * math.Abs(bm) / r.MomentLimitKNm
	}
	switch worst := math.Max(r.ShearPct, r.MomentPct); {
	case worst > DangerPct:
		r.Level = Danger
	case worst >= CautionPct:
		r.Level = Caution
	}
	return r
}

// StrengthIntervals is the number of equal steps at which the curve is
// given over the hull's length.
const StrengthIntervals = 80

// lineLoad is a mass per metre varying linearly from w0 at x0 to w1 at x1
// (t/m), zero outside.
type lineLoad struct{ x0, x1, w0, w1 float64 }

// weightSpread spreads w over its extent [a, f] with its centre at its lcg:
// a trapezoid w̄ + s·(x − m) with w̄ = M/l, m = (a + f)/2, l = f − a and
// s = 12·w̄·(lcg − m)/l², which keeps the centroid at lcg and stays
// non-negative while |lcg − m| ≤ l/6. Beyond that the mass is a triangle
// with its height at the end nearer the lcg and its toe at 3 × the lcg's
// distance from that end (a triangle's centroid lies a third of its base
// from its height): at |lcg − m| = l/6 the two shapes are the same.
// Requires a < lcg < f.
func weightSpread(w Weight) lineLoad {
	a, f := w.ExtentM[0], w.ExtentM[1]
	l, m := f-a, (a+f)/2
	switch d := w.LCGM - m; {
	case math.Abs(d) <= l/6:
		wbar := w.MassT / l
		s := 12 * wbar * d / (l * l)
		return lineLoad{a, f, wbar - s*l/2, wbar + s*l/2}
	case d > 0:
		b := 3 * (f - w.LCGM)
		return lineLoad{f - b, f, 0, 2 * w.MassT / b}
	default:
		b := 3 * (w.LCGM - a)
		return lineLoad{a, a + b, 2 * w.MassT / b, 0}
	}
}

func (l lineLoad) at(x float64) float64 {
	if x < l.x0 || x > l.x1 {
		return 0
	}
	return l.w0 + (l.w1-l.w0)*(x-l.x0)/(l.x1-l.x0)
}

// solidLoad is the part of a solid below a plane, as a mass per metre:
// factor × its section area below the plane (t/m³ × m²). The hull's
// buoyancy has a negative factor.
type solidLoad struct {
	s      *Solid
	p      Plane
	factor float64
}

// slabBreaks appends the x inside slab b where a vertex of its section
// crosses the load's plane: the integrand changes form there.
func (l solidLoad) slabBreaks(b *slab, out []float64) []float64 {
	p := l.p
	dx := b.x1 - b.x0
	for k := range b.p0 {
		d0 := b.p0[k].Z - p.C*b.p0[k].Y - p.A - p.B*b.x0
		d1 := b.p1[k].Z - p.C*b.p1[k].Y - p.A - p.B*b.x1
		if (d0 < 0 && d1 > 0) || (d0 > 0 && d1 < 0) {
			out = append(out, b.x0+dx*d0/(d0-d1))
		}
	}
	return out
}

// integrateLoad integrates q over [xa, xb], split at brk (which it sorts
// and returns for reuse) and at the curve's points outs, with two-point
// Gauss–Legendre on each piece, and adds each piece's ∫q and
// ∫(outs[k] − x) q dx into Q[k] and M[k], k the bin (outs[k−1], outs[k])
// that holds it.
func integrateLoad(xa, xb float64, brk, outs []float64, q func(float64) float64, Q, M []float64) []float64 {
	lo := sort.SearchFloat64s(outs, xa)
	for j := lo; j < len(outs) && outs[j] < xb; j++ {
		if outs[j] > xa {
			brk = append(brk, outs[j])
		}
	}
	sort.Float64s(brk)
	for i := 1; i < len(brk); i++ {
		a, b := brk[i-1], brk[i]
		dx := b - a
		if !(dx > 0) {
			continue
		}
		k := sort.SearchFloat64s(outs, (a+b)/2)
		if k == 0 || k == len(outs) {
			continue // outside the hull: checkGirderData keeps loads inside
		}
		end := outs[k]
		for g := range gaussNode {
			x := a + gaussNode[g]*dx
			w := gaussWeight[g] * dx * q(x)
			Q[k] += w
			M[k] += w * (end - x)
		}
	}
	return brk
}

// StrengthMissing says why a vessel's strength cannot be worked out from
// its data, or "" when it can: every weight needs its extent.
func StrengthMissing(v *Vessel) string {
	var missing []string
	for _, w := range v.Weights {
		if !w.HasExtent() {
			missing = append(missing, fmt.Sprintf("%q", w.Name))
		}
	}
	switch {
	case len(missing) == len(v.Weights):
		return "the vessel file gives no weight extents (x = [aft, fwd] on each weight), so the load along the ship is unknown"
	case len(missing) == 1:
		return "weight " + missing[0] + " has no extent (x = [aft, fwd]), so the load along the ship is unknown"
	case len(missing) > 1:
		return fmt.Sprintf("%d weights have no extent (x = [aft, fwd]), among them %s, so the load along the ship is unknown", len(missing), missing[0])
	}
	return ""
}

// GirderStrength works out the still-water shear force and bending moment
// of v under d floating at pos. Mass per metre: each weight spread over its
// extent (weightSpread); each tank's contents over the tank below its level
// (μ of the space there) as loaded, upright (as Loading places them); floodwater held in a
// compartment below its own surface (pos.Held); buoyancy the hull's
// sections below the water at pos's heel and trim, less μ × the part of
// each compartment open to the sea below it (lost buoyancy). It returns nil
// and the reason when the weights have no extents.
//
// The integrals are taken piece by piece between the slab ends, the x where
// a section vertex crosses a water surface, the weights' extents and the
// curve's points, with two-point Gauss–Legendre: on boxes q is then a
// polynomial of degree at most two on each piece and the curves are exact
// to round-off. Validity: still water; the ship treated as a beam.
func GirderStrength(v *Vessel, d Damage, pos *Position) (*Strength, string) {
	if why := StrengthMissing(v); why != "" {
		return nil, why
	}
	if pos == nil {
		return nil, "there is no floating position"
	}
	x0, x1, _, _ := v.Hull.solid.Extent()
	var lines []lineLoad
	for _, w := range v.Weights {
		lines = append(lines, weightSpread(w))
	}
	solids := []solidLoad{{v.Hull.solid, pos.Plane, -v.WaterDensity}}
	for i, c := range v.Compartments {
		s := d.state(i)
		switch {
		case s.Open:
			solids = append(solids, solidLoad{c.solid, pos.Plane, v.WaterDensity * v.Permeability(d, i)})
		case s.WaterM3 > 0:
			// Held water: below its surface in pos.Held.
		case v.tanks[i].massT > 0:
			// ρ_liquid × μ × the space below the level plane (a tank's
			// capacity is μ × its volume, as NewVessel loads it); a full
			// tank's plane lies at or above its top.
			solids = append(solids, solidLoad{c.solid, v.tanks[i].level, c.Liquid.Density * c.Permeability})
		}
	}
	for _, h := range pos.Held {
		solids = append(solids, solidLoad{v.Compartments[h.Index].solid, h.Surface, v.WaterDensity * v.Permeability(d, h.Index)})
	}

	points := v.Girder.Points
	if len(points) == 0 {
		points = tenthPoints(v.Hull.LengthM)
	}
	// Where the curve is given: equal steps over the hull and the points.
	outs := make([]float64, 0, StrengthIntervals+1+len(points))
	for i := 0; i <= StrengthIntervals; i++ {
		outs = append(outs, x0+(x1-x0)*float64(i)/StrengthIntervals)
	}
	for _, p := range points {
		outs = append(outs, p.XM)
	}
	sort.Float64s(outs)
	outs = dedupe(outs, 1e-9*(x1-x0))

	// Each load is integrated on its own pieces (its breaks and the curve's
	// points within its reach) and summed into the bins between the
	// curve's points: per bin k, Q[k] = ∫q and M[k] = ∫(outs[k] − x) q dx.
	n := len(outs)
	Q := make([]float64, n)
	M := make([]float64, n)
	var scratch []float64
	for _, l := range lines {
		scratch = integrateLoad(l.x0, l.x1, append(scratch[:0], l.x0, l.x1), outs, l.at, Q, M)
	}
	for _, sl := range solids {
		for i := range sl.s.slabs {
			b := &sl.s.slabs[i]
			p, f := sl.p, sl.factor
			// The plane's lowest and highest z over the slab's box, as in
			// Solid.Below: a slab wholly above it carries nothing, one
			// wholly below it its whole section, a polynomial in x
			// (the prefix sums of waterline_cut.go).
			zlo, zhi := b.planeSpan(p)
			switch {
			case b.zmin >= zhi:
				continue
			case b.zmax <= zlo:
				whole := &b.pre[len(b.p0)]
				scratch = integrateLoad(b.x0, b.x1, append(scratch[:0], b.x0, b.x1), outs, func(x float64) float64 {
					a, _, _ := whole.eval(x - b.x0)
					return f * a / 2
				}, Q, M)
				continue
			}
			scratch = sl.slabBreaks(b, append(scratch[:0], b.x0, b.x1))
			scratch = integrateLoad(b.x0, b.x1, scratch, outs, func(x float64) float64 {
				return f * clipBelow(b.p0, b.dp, x-b.x0, p.C, p.A+p.B*x).A
			}, Q, M)
		}
	}
	// March along the bins: SF(x_k) = SF(x_{k−1}) + Q[k], BM(x_k) =
	// BM(x_{k−1}) + SF(x_{k−1})·(x_k − x_{k−1}) + M[k]. Tonnes and
	// tonne-metres here.
	sfAt := make([]float64, n)
	bmAt := make([]float64, n)
	var sf, bm float64
	for k := 1; k < n; k++ {
		bm += sf*(outs[k]-outs[k-1]) + M[k]
		sf += Q[k]
		sfAt[k], bmAt[k] = sf, bm
	}
	g := StandardGravity
	st := &Strength{Harbour: v.Girder.Harbour, ClosingShearKN: g * sf, ClosingMomentKNm: g * bm}
	corrected := func(x float64) (float64, float64) {
		j := nearest(outs, x)
		f := (outs[j] - x0) / (x1 - x0)
		return g * (sfAt[j] - f*sf), g * (bmAt[j] - f*bm)
	}
	for _, x := range outs {
		s, m := corrected(x)
		st.XM = append(st.XM, x)
		st.ShearKN = append(st.ShearKN, s)
		st.MomentKNm = append(st.MomentKNm, m)
		if math.Abs(s) > math.Abs(st.MaxShear.Value) {
			st.MaxShear = StrengthPeak{x, s}
		}
		if math.Abs(m) > math.Abs(st.MaxMoment.Value) {
			st.MaxMoment = StrengthPeak{x, m}
		}
	}
	for _, p := range points {
		s, m := corrected(p.XM)
		st.Points = append(st.Points, readAgainst(p, s, m, v.Girder.Harbour))
	}
	return st, ""
}

// tenthPoints are the read-out points used when the vessel gives none:
// every tenth of the length between perpendiculars, without limits.
func tenthPoints(length float64) []ReadOutPoint {
	var out []ReadOutPoint
	for i := 1; i <= 9; i++ {
		out = append(out, ReadOutPoint{Name: fmt.Sprintf("%.1f L", float64(i)/10), XM: length * float64(i) / 10})
	}
	return out
}

// dedupe drops from sorted xs every value within tol of the one kept before.
func dedupe(xs []float64, tol float64) []float64 {
	out := xs[:0]
	for _, x := range xs {
		if len(out) == 0 || x-out[len(out)-1] > tol {
			out = append(out, x)
		}
	}
	return out
}

// nearest returns the index of the value of sorted xs nearest x.
func nearest(xs []float64, x float64) int {
	j := sort.SearchFloat64s(xs, x)
	if j == len(xs) || (j > 0 && x-xs[j-1] < xs[j]-x) {
		j--
	}
	return j
}

// checkGirderData checks the weights' extents and the read-out points
// against the hull: a programmer's value that slipped past the file
// reader's checks is an error, not a panic, as NewVessel's other checks.
func checkGirderData(v *Vessel) error {
	x0, x1, _, _ := v.Hull.solid.Extent()
	const tol = 1e-6
	for i, w := range v.Weights {
		if w.ExtentM == [2]float64{} {
			continue
		}
		a, f := w.ExtentM[0], w.ExtentM[1]
		switch {
		case math.IsNaN(a) || math.IsNaN(f) || math.IsInf(a, 0) || math.IsInf(f, 0):
			return fmt.Errorf("weight %d (%q): extent must be finite numbers", i+1, w.Name)
		case !(f > a):
			return fmt.Errorf("weight %d (%q): extent [%g, %g] must run aft to forward", i+1, w.Name, a, f)
		case a < x0-tol || f > x1+tol:
			return fmt.Errorf("weight %d (%q): extent [%g, %g] reaches beyond the hull (x = %g to %g)", i+1, w.Name, a, f, x0, x1)
		case !(w.LCGM > a && w.LCGM < f):
			return fmt.Errorf("weight %d (%q): lcg %g lies outside its extent [%g, %g]", i+1, w.Name, w.LCGM, a, f)
		}
	}
	for _, p := range v.Girder.Points {
		if !(p.XM >= x0 && p.XM <= x1) {
			return fmt.Errorf("read-out point %q: x = %g lies outside the hull (x = %g to %g)", p.Name, p.XM, x0, x1)
		}
		for _, f := range []float64{p.Sea.ShearKN, p.Sea.HogKNm, p.Sea.SagKNm, p.Harbour.ShearKN, p.Harbour.HogKNm, p.Harbour.SagKNm} {
			if !(f >= 0) || math.IsInf(f, 0) {
				return fmt.Errorf("read-out point %q: permissible values must be finite and not negative", p.Name)
			}
		}
	}
	return nil
}

// StrengthFlags raises a flag for the worst reading at or past CautionPct
// of its permissible value: "girder-over-limit" (danger) past DangerPct,
// "girder-near-limit" (caution) from CautionPct. Nil for a nil s.
func StrengthFlags(s *Strength) []Flag {
	if s == nil {
		return nil
	}
	r, pct, ok := s.Worst()
	if !ok || pct < CautionPct {
		return nil
	}
	set := "at sea"
	if s.Harbour {
		set = "in harbour"
	}
	what := fmt.Sprintf("shear force %.0f kN against %.0f kN", math.Abs(r.ShearKN), r.ShearLimitKN)
	if r.MomentPct >= r.ShearPct {
		sense := "hogging"
		if r.MomentKNm < 0 {
			sense = "sagging"
		}
		what = fmt.Sprintf("bending moment %.0f kN·m %s against %.0f kN·m", math.Abs(r.MomentKNm), sense, r.MomentLimitKNm)
	}
	f := Flag{Code: "girder-near-limit", Severity: Caution}
	if pct > DangerPct {
		f = Flag{Code: "girder-over-limit", Severity: Danger}
	}
	f.Message = fmt.Sprintf("Still-water %s at %s (x = %.1f m): %.0f %% of the permissible value %s.", what, r.Name, r.XM, ShareShown(pct), set)
	return []Flag{f}
}

// IntactStrength returns the hull girder of v intact, to show beside a
// damaged state; nil with the reason when it cannot be worked out.
func IntactStrength(v *Vessel) (*Strength, string) {
	if why := StrengthMissing(v); why != "" {
		return nil, why
	}
	d := v.Intact()
	pos, err := Solve(v, d)
	if err != nil {
		return nil, "intact: " + err.Error()
	}
	return GirderStrength(v, d, &pos)
}
