package engine

import (
	"errors"
	"fmt"
	"math"
)

// This file computes the righting-lever (GZ) curve of a condition and what
// is read off it: the equilibrium angle, GZmax, the range, the angle of
// vanishing stability, areas, and the deck-edge and downflooding angles.

const (
	// gzStepDeg is the curve's step in heel.
	gzStepDeg = 1.0
	// gzMinEndDeg is the heel the curve reaches at least, even when GZ has
	// vanished before it (the conventions ask for at least 60°).
	gzMinEndDeg = 60.0
	// uprightDeg: an equilibrium heel smaller than this counts as upright,
	// and the curve is computed towards both sides.
	uprightDeg = 1e-6
	// gzEndDeg is the largest heel the curve reaches: the solver's limit
	// (maxHeel), solved a hair inside it so that round-off cannot put it out.
	gzEndDeg = 89.5
)

// RightingLevers computes the righting-lever curve of problem pr, whose
// free-floating position is eq (from pr.Equilibrium), at free trim and
// constant displacement.
//
// Method: at each heel θ = 0°, 1°, 2°, … draft and trim are solved for
// (the buoyancy of the hull less, for every compartment open to the sea, μ
// times its part below the water at that attitude; floodwater held in
// compartments moves with the attitude) and GZ is the engine's lever,
// positive righting (see lever). With the heel towards the side she lies,
// GZ at 0° is negative for a listed ship: the heeling moment of her
// off-centre weight or lost buoyancy. Each heel starts from the cubic
// Hermite extrapolation of the last two solved planes and their exact rates
// of change with heel, so most heels cost one evaluation (see leverAt).
// When one evaluation is costly (spanMinVertices) the curve is worked in
// spans starting at fixed heels, shared out over the cores, each span's
// first heel started from her own draft and trim (gz_span.go): the same
// curve on any number of cores, and the same as one worked from end to
// end to the solver's tolerance. The curve runs to at least 60° and on to
// the angle of vanishing stability or to 89.5° (the solver's limit),
// whichever is first. Each lever agrees with a solve to the solver's own
// tolerance (pr.AtHeel) to a few 1e-9 m. The angle of vanishing stability starts from the root of the cubic Hermite
// polynomial of GZ and its exact slopes between the samples that bracket
// it, is refined by the Illinois method on solved heels and is added to
// the curve as a sample; GZmax is the maximum of the curve's spline (see
// AreaMRad). The deck-edge and downflooding angles come from the solved
// planes: the first heel at which a deck-edge point at a station (either
// side; the deck edge is straight between stations, so none can immerse
// first between them) or a non-weathertight opening goes below the water,
// found by bisection on planes interpolated (cubic Hermite in heel) between
// the samples.
//
// Side: towards the side of eq.HeelDeg. When she is upright (|heel| <
// 1e-6°) both sides are computed; the curve returned is the worse, the one
// with the smaller area from the equilibrium to the lesser of the angle of
// vanishing stability and the downflooding angle (starboard on a tie), and
// its Other field holds the curve towards the other side. When the whole
// condition is its own mirror image (G on the centreline, flooded spaces in
// mirror pairs) the port curve is the starboard one mirrored, with only the
// openings looked at again.
//
// Errors: a *NoEquilibrium with Outcome NotConverged if draft and trim
// cannot be found at 0° or 1°. If they cannot be found at a larger heel the
// curve ends at the last heel solved and Note says so.
func RightingLevers(pr *Problem, eq Position) (*GZCurve, error) {
	if pr == nil {
		panic("engine: RightingLevers of a nil problem")
	}
	return pr.rightingLevers(eq, nil)
}

// rightingLevers is RightingLevers with help offered to work the curves'
// spans (see spanHelp).
func (pr *Problem) rightingLevers(eq Position, help *spanHelp) (*GZCurve, error) {
	if math.IsNaN(eq.HeelDeg) || math.Abs(eq.HeelDeg) > gzEndDeg {
		return nil, fmt.Errorf("equilibrium heel %v° is not a heel the curve can start from", eq.HeelDeg)
	}
	switch {
	case eq.HeelDeg >= uprightDeg:
		w := pr.leverCurves(eq, []curveAsk{{Starboard, gzStepDeg}}, help)[0]
		return w.c, w.err
	case eq.HeelDeg <= -uprightDeg:
		w := pr.leverCurves(eq, []curveAsk{{Port, gzStepDeg}}, help)[0]
		return w.c, w.err
	}
	var sb, ps *GZCurve
	if pr.symmetric() {
		w := pr.leverCurves(eq, []curveAsk{{Starboard, gzStepDeg}}, help)[0]
		if w.err != nil {
			return nil, w.err
		}
		sb, ps = w.c, pr.mirrored(w.c, w.sol)
	} else {
		ws := pr.leverCurves(eq, []curveAsk{{Starboard, gzStepDeg}, {Port, gzStepDeg}}, help)
		for _, w := range ws {
			if w.err != nil {
				return nil, w.err
			}
		}
		sb, ps = ws[0].c, ws[1].c
	}
	if ps.reserve() < sb.reserve()*(1-1e-9) {
		sb, ps = ps, sb
	}
	sb.Other = ps
	return sb, nil
}

// reserve is the area from the equilibrium to the lesser of the angle of
// vanishing stability and the downflooding angle (m·rad): what RightingLevers
// compares to choose the worse side.
func (c *GZCurve) reserve() float64 {
	return c.AreaMRad(c.EquilibriumDeg, math.Min(c.VanishingDeg, c.DownfloodingDeg))
}

// solvedHeel is one solved sample: the plane and the rates of change of its
// A and B, and of GZ, with heel (per degree, towards the curve's side) from
// the exact Jacobian, by the implicit-function theorem:
// ∂f/∂(A,B)·d(A,B)/dC = −∂f/∂C for the volume and trim residuals, and
// df₂/dC = ∂f₂/∂C + ∂f₂/∂(A,B)·d(A,B)/dC for the heeling moment, V staying
// constant along the curve.
type solvedHeel struct {
	p          Plane
	dA, dB     float64
	dGZ        float64 // dGZ/dθ per degree along the curve
	haveSlopes bool
}

// leverCurve computes the curve towards side, and returns the solved
// samples (index-aligned with the curve's heels).
func (pr *Problem) leverCurve(side Side, eq Position) (*GZCurve, []solvedHeel, error) {
	return pr.leverCurveStep(side, eq, gzStepDeg)
}

// leverCurveStep is leverCurve with samples every stepDeg of heel.
func (pr *Problem) leverCurveStep(side Side, eq Position, stepDeg float64) (*GZCurve, []solvedHeel, error) {
	w := pr.leverCurves(eq, []curveAsk{{side, stepDeg}}, nil)[0]
	return w.c, w.sol, w.err
}

// downflooding sets the curve's downflooding angle and opening from its
// solved samples.
func (pr *Problem) downflooding(c *GZCurve, sol []solvedHeel) {
	pr.downfloodingStep(c, sol, gzStepDeg)
}

// downfloodingStep is downflooding for a curve sampled every stepDeg.
func (pr *Problem) downfloodingStep(c *GZCurve, sol []solvedHeel, stepDeg float64) {
	var open []immersionPoint
	for _, o := range pr.v.Openings {
		if !o.Weathertight && !pr.v.intoFlooded(o, pr.d) {
			open = append(open, immersionPoint{o.X, o.Y, o.Z, o.Name})
		}
	}
	c.DownfloodingDeg, c.Downflooding = pr.firstImmersionStep(float64(c.Toward), c.HeelDeg, sol, open, stepDeg)
}

// mirrored returns the curve towards the other side of a problem that is
// symmetric about the centreline (see symmetric): the same levers at the
// mirrored planes (A, B, −C); only the openings, which need not be
// symmetric, are looked at again.
func (pr *Problem) mirrored(c *GZCurve, sol []solvedHeel) *GZCurve {
	m := *c
	m.Toward = -c.Toward
	m.Other = nil
	m.HeelDeg = append([]float64(nil), c.HeelDeg...)
	m.GZM = append([]float64(nil), c.GZM...)
	m.fit()
	ms := make([]solvedHeel, len(sol))
	for i, s := range sol {
		ms[i] = s
		ms[i].p.C = -s.p.C
	}
	pr.downflooding(&m, ms)
	return &m
}

// symmetric reports whether the problem is its own mirror image about the
// centreline, so that the curve to port is the curve to starboard: the hull
// is symmetric by construction; G must lie on the centreline (to 1e-9 of
// the breadth) and the compartments open to the sea, and those holding
// floodwater, must come in mirror pairs (or straddle the centreline
// symmetrically) with the same permeability and water.
func (pr *Problem) symmetric() bool {
	B := pr.v.Hull.BreadthM
	tol := 1e-9 * B
	if math.Abs(pr.load.TCGM) > tol {
		return false
	}
	mirror := func(a, b Box) bool {
		return math.Abs(a.X0-b.X0) <= tol && math.Abs(a.X1-b.X1) <= tol &&
			math.Abs(a.Z0-b.Z0) <= tol && math.Abs(a.Z1-b.Z1) <= tol &&
			math.Abs(a.Y0+b.Y1) <= tol && math.Abs(a.Y1+b.Y0) <= tol
	}
	type space struct {
		box     Box
		mu, vol float64
	}
	check := func(sp []space) bool {
		used := make([]bool, len(sp))
		for i := range sp {
			if used[i] {
				continue
			}
			ok := false
			for j := i; j < len(sp); j++ {
				if !used[j] && mirror(sp[i].box, sp[j].box) && sp[i].mu == sp[j].mu &&
					math.Abs(sp[i].vol-sp[j].vol) <= 1e-12*(1+sp[i].vol) {
					used[i], used[j], ok = true, true, true
					break
				}
			}
			if !ok {
				return false
			}
		}
		return true
	}
	var open, held []space
	for k, i := range pr.openIx {
		open = append(open, space{pr.v.Compartments[i].Box, pr.open[k].mu, 0})
	}
	for k, i := range pr.heldIx {
		held = append(held, space{pr.v.Compartments[i].Box, pr.held[k].mu, pr.held[k].vol})
	}
	return check(open) && check(held)
}

// vanishing refines the heel in (aDeg, bDeg) where GZ falls through zero
// (fa > 0 ≥ fb; samples sa and sb) and returns it (degrees), GZ there (≈ 0)
// and the solved sample. The first try is the root of the cubic Hermite
// polynomial of GZ and its exact slopes at the two ends; then the Illinois
// variant of regula falsi on solved heels (leverAt, each started from the
// planes' Hermite interpolation; see illinois). At most 20 solves; it stops when GZ is
// within 1e-10 m of zero or the bracket is under 1e-9°.
func (pr *Problem) vanishing(sgn, aDeg, bDeg, fa, fb float64, sa, sb solvedHeel) (float64, float64, solvedHeel) {
	heels := []float64{aDeg, bDeg}
	pair := []solvedHeel{sa, sb}
	bestDeg, bestGZ, best := bDeg, fb, sb
	if fa < -fb {
		bestDeg, bestGZ, best = aDeg, fa, sa
	}
	illinois(aDeg, bDeg, fa, fb, hermiteRoot(aDeg, bDeg, fa, fb, sa, sb), 20, 1e-9, 1e-10, false, func(x float64) (float64, bool) {
		sx, lever, err := pr.leverAt(sgn, x, hermitePlane(heels, pair, 0, x))
		if err != nil {
			return 0, false
		}
		fx := sgn * lever
		if math.Abs(fx) < math.Abs(bestGZ) {
			bestDeg, bestGZ, best = x, fx, sx
		}
		return fx, true
	})
	return bestDeg, bestGZ, best
}

// hermiteRoot returns the root in (a, b) of the cubic Hermite polynomial
// with values fa > 0 ≥ fb and the samples' GZ slopes (per degree), by
// bisection; the chord's root where a slope is missing.
func hermiteRoot(a, b, fa, fb float64, sa, sb solvedHeel) float64 {
	if !sa.haveSlopes || !sb.haveSlopes {
		return a + fa/(fa-fb)*(b-a)
	}
	h := b - a
	f := func(u float64) float64 {
		u2, u3 := u*u, u*u*u
		return (2*u3-3*u2+1)*fa + (u3-2*u2+u)*h*sa.dGZ + (3*u2-2*u3)*fb + (u3-u2)*h*sb.dGZ
	}
	lo, hi := 0.0, 1.0
	for i := 0; i < 60; i++ {
		m := (lo + hi) / 2
		if f(m) > 0 {
			lo = m
		} else {
			hi = m
		}
	}
	return a + (lo+hi)/2*h
}

// slopes returns the solved sample at plane p from the evaluation s (at p
// or, one linear step from it, at the point whose Newton iterate p is),
// with f₂ and V the heeling moment and volume at p: the rates of change of
// A, B and GZ per degree of heel towards sgn's side.
func slopes(s state, p Plane, f2, v, sgn float64) solvedHeel {
	sh := solvedHeel{p: p}
	j := s.j
	d, ok := solve2([2][2]float64{{j[0][0], j[0][1]}, {j[1][0], j[1][1]}}, [2]float64{-j[0][2], -j[1][2]})
	if !ok || !(v > 0) {
		return sh
	}
	c2 := 1 + p.C*p.C
	k := c2 * sgn * math.Pi / 180 // dC per degree
	sh.dA, sh.dB, sh.haveSlopes = d[0]*k, d[1]*k, true
	df2 := j[2][2] + j[2][0]*d[0] + j[2][1]*d[1]
	// lever = f₂/(V√(1+C²)); GZ = sgn·lever.
	dl := df2/(v*math.Sqrt(c2)) - f2*p.C/(v*c2*math.Sqrt(c2))
	sh.dGZ = sgn * dl * k
	return sh
}

// hermitePlane returns A and B at deg from the samples i and i+1 (or i
// alone): the cubic Hermite polynomial of their values and slopes, used
// both to extrapolate a starting plane and to interpolate between samples.
// Where a slope is missing the chord stands in for it. C is left zero.
func hermitePlane(heels []float64, sol []solvedHeel, i int, deg float64) Plane {
	a := sol[i]
	if i+1 >= len(sol) {
		t := deg - heels[i]
		if !a.haveSlopes {
			return Plane{A: a.p.A, B: a.p.B}
		}
		return Plane{A: a.p.A + t*a.dA, B: a.p.B + t*a.dB}
	}
	b := sol[i+1]
	h := heels[i+1] - heels[i]
	chA, chB := (b.p.A-a.p.A)/h, (b.p.B-a.p.B)/h
	sa, sb := [2]float64{chA, chB}, [2]float64{chA, chB}
	if a.haveSlopes {
		sa = [2]float64{a.dA, a.dB}
	}
	if b.haveSlopes {
		sb = [2]float64{b.dA, b.dB}
	}
	u := (deg - heels[i]) / h
	u2, u3 := u*u, u*u*u
	h00, h10, h01, h11 := 2*u3-3*u2+1, u3-2*u2+u, 3*u2-2*u3, u3-u2
	return Plane{
		A: h00*a.p.A + h10*h*sa[0] + h01*b.p.A + h11*h*sb[0],
		B: h00*a.p.B + h10*h*sa[1] + h01*b.p.B + h11*h*sb[1],
	}
}

// leverLinearM bounds the last Newton step (in draft, and in trim × length)
// after which leverAt stops: the lever is then taken at the Newton iterate
// by its first-order change, an error of the order of the step squared
// times the curvature of the moments: a few 1e-9 m at most on the tests'
// hulls.
const leverLinearM = 2e-4

// leverAt solves draft and trim at heel deg towards sgn's side from guess
// and returns the solved sample and the engine's lever there (positive when
// buoyancy acts to starboard of G; see lever).
//
// Method: Newton's method on the residuals of volume and of the
// longitudinal moment (pr.eval, exact Jacobian). Once a step is smaller than
// leverLinearM it is taken without a further evaluation: the plane is the
// Newton iterate and the lever its first-order value there,
// [f₂ − ∂f₂/∂(A,B)·Δ] / [(V − ∂V/∂(A,B)·Δ)·√(1+C²)]. So a good guess costs
// one evaluation. A large or singular step, or no convergence in six,
// hands over to pr.atHeel (line-searched Newton to the solver's own
// tolerance).
func (pr *Problem) leverAt(sgn, deg float64, guess Plane) (solvedHeel, float64, error) {
	heelRad := sgn * math.Min(deg*math.Pi/180, maxHeel*(1-1e-13))
	g := guess
	g.C = math.Tan(heelRad)
	L, D := pr.v.Hull.LengthM, pr.v.Hull.DepthM
	for it := 0; it < 6; it++ {
		s := pr.eval(g, true)
		d, ok := solve2([2][2]float64{{s.j[0][0], s.j[0][1]}, {s.j[1][0], s.j[1][1]}}, [2]float64{s.f[0], s.f[1]})
		step := math.Max(math.Abs(d[0]), math.Abs(d[1])*L)
		if !ok || !(step < D/4) {
			break
		}
		if step <= leverLinearM {
			f2 := s.f[2] - s.j[2][0]*d[0] - s.j[2][1]*d[1]
			v := s.e.V - s.j[0][0]*d[0] - s.j[0][1]*d[1]
			if !(v > 0) {
				break
			}
			p := Plane{g.A - d[0], g.B - d[1], g.C}
			return slopes(s, p, f2, v, sgn), f2 / (v * math.Sqrt(1+g.C*g.C)), nil
		}
		g = Plane{g.A - d[0], g.B - d[1], g.C}
	}
	s, err := pr.atHeel(heelRad, guess)
	if err != nil {
		return solvedHeel{p: s.p}, 0, err
	}
	return slopes(s, s.p, s.f[2], s.e.V, sgn), pr.lever(s), nil
}

// immersionPoint is a point that the curve watches go under water.
type immersionPoint struct {
	x, y, z float64
	name    string
}

// firstImmersion returns the first heel (degrees) on the curve at which one
// of pts is below the water, and that point's name: 0 if one is below at the
// first sample, 90 and "" if none goes under by the curve's end or pts is
// empty. Between samples the plane's A and B are the cubic Hermite
// polynomial of the two samples before the crossing (values and slopes in
// heel), C = tan(heel) exact, and the heel is found by bisection to 1e-12°:
// exact while A and B are cubic in heel (a box heeling wall-sided keeps
// them constant), otherwise an error of the order of the step to the
// fourth power.
func firstImmersion(sgn float64, heels []float64, sol []solvedHeel, pts []immersionPoint) (float64, string) {
	if len(pts) == 0 {
		return 90, ""
	}
	// The lowest point's height above the plane: the heights along the
	// normal are the vertical ones over one common factor (Plane.Height),
	// so the least is found on the vertical ones and divided once.
	lowest := func(p Plane) (float64, int) {
		m, im := math.Inf(1), -1
		for i, q := range pts {
			if h := q.z - (p.A + p.B*q.x + p.C*q.y); h < m {
				m, im = h, i
			}
		}
		return m / math.Sqrt(1+p.B*p.B+p.C*p.C), im
	}
	for k := range heels {
		h, i := lowest(sol[k].p)
		if !(h < 0) {
			continue
		}
		if k == 0 {
			return heels[0], pts[i].name
		}
		// The plane from the samples before the crossing only: an
		// immersion that changes the waterplane (the deck edge) is a kink
		// in the planes' path exactly there, which the sample after it
		// would carry back into the interval.
		at := func(deg float64) Plane {
			p := hermitePlane(heels, sol[:k], max(0, k-2), deg)
			p.C = math.Tan(sgn * deg * math.Pi / 180)
			return p
		}
		lo, hi := heels[k-1], heels[k]
		for it := 0; it < 60 && hi-lo > 1e-12; it++ {
			mid := (lo + hi) / 2
			if hm, im := lowest(at(mid)); hm < 0 {
				hi, i = mid, im
			} else {
				lo = mid
			}
		}
		return hi, pts[i].name
	}
	return 90, ""
}

// errShortCurve is the panic message for a malformed curve.
var errShortCurve = errors.New("engine: GZCurve with HeelDeg and GZM of different lengths or heels not ascending")

// fit fits the curve's spline to its samples and keeps it in the curve;
// RightingLevers calls it once, when the samples are complete. The samples
// must not be changed afterwards.
func (c *GZCurve) fit() {
	sp := c.fitted()
	c.sp = &sp
}

// spline returns the curve's interpolating spline in radians of heel: the
// one kept by fit, or, for a curve assembled by hand (not by
// RightingLevers), one fitted now.
func (c *GZCurve) spline() cubicSpline {
	if c.sp != nil && len(c.sp.x) == len(c.HeelDeg) {
		return *c.sp
	}
	return c.fitted()
}

// fitted returns the not-a-knot spline through the curve's samples.
func (c *GZCurve) fitted() cubicSpline {
	if len(c.HeelDeg) != len(c.GZM) {
		panic(errShortCurve)
	}
	x := make([]float64, len(c.HeelDeg))
	for i, d := range c.HeelDeg {
		x[i] = d * math.Pi / 180
		if i > 0 && !(x[i] > x[i-1]) {
			panic(errShortCurve)
		}
	}
	return fitSpline(x, c.GZM)
}

// At returns GZ (m) at heelDeg by the curve's spline (see AreaMRad), the
// heel clamped to the curve's span; 0 for an empty curve.
func (c *GZCurve) At(heelDeg float64) float64 {
	return c.spline().at(heelDeg * math.Pi / 180)
}

// AreaMRad returns the area under the curve from fromDeg to toDeg, in
// metre-radians: ∫ GZ dθ with θ in radians.
//
// The samples are joined by the not-a-knot cubic spline (piecewise cubic,
// twice continuously differentiable, exact for cubics; its error in the
// area is of order h⁴ for a smooth curve, h the step) and the spline is
// integrated exactly, the ends of the range included wherever they fall.
// The range is clipped to the curve's span: nothing is counted beyond its
// last heel. An empty or reversed range gives 0.
func (c *GZCurve) AreaMRad(fromDeg, toDeg float64) float64 {
	if !(toDeg > fromDeg) {
		return 0
	}
	return c.spline().integral(fromDeg*math.Pi/180, toDeg*math.Pi/180)
}

// MaxBetween returns the largest GZ (m) of the curve's spline between
// fromDeg and toDeg (clipped to the curve's span) and the heel where it
// occurs (degrees). For an empty curve or range it returns 0, fromDeg.
func (c *GZCurve) MaxBetween(fromDeg, toDeg float64) (gzM, atDeg float64) {
	sp := c.spline()
	if len(sp.x) == 0 {
		return 0, fromDeg
	}
	a := math.Max(fromDeg*math.Pi/180, sp.x[0])
	b := math.Min(toDeg*math.Pi/180, sp.x[len(sp.x)-1])
	if !(b >= a) {
		return 0, fromDeg
	}
	x, y := sp.max(a, b)
	return y, x * 180 / math.Pi
}
