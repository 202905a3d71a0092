package engine

import (
	"errors"
	"fmt"
	"math"
)

// Outcome says why no floating position exists.
type Outcome int

const (
	// Sinks: the weight exceeds all the buoyancy the hull has left.
	Sinks Outcome = iota + 1
	// Capsizes: there is no position of stable equilibrium on either side
	// short of 90° of heel.
	Capsizes
	// NotConverged: the solver stopped without an answer within its bounds.
	NotConverged
)

func (o Outcome) String() string {
	switch o {
	case Sinks:
		return "sinks"
	case Capsizes:
		return "capsizes"
	case NotConverged:
		return "not converged"
	}
	return "unknown"
}

// Plain says the outcome as a sentence's subject and verb: "she sinks",
// "she capsizes", or that no position was found.
func (o Outcome) Plain() string {
	switch o {
	case Sinks:
		return "she sinks"
	case Capsizes:
		return "she capsizes"
	}
	return "heelwatch could not find where she floats"
}

// asNoEquilibrium returns err as a *NoEquilibrium: itself when it is one
// (wrapped or not), else a not-converged one carrying its message.
func asNoEquilibrium(err error) *NoEquilibrium {
	var ne *NoEquilibrium
	if errors.As(err, &ne) {
		return ne
	}
	return &NoEquilibrium{NotConverged, err.Error()}
}

// NoEquilibrium is the error returned when the vessel does not float.
type NoEquilibrium struct {
	Outcome Outcome
	Reason  string
}

func (e *NoEquilibrium) Error() string {
	return "no equilibrium: vessel " + e.Outcome.String() + ": " + e.Reason
}

// openSpace is a compartment open to the sea (lost buoyancy).
type openSpace struct {
	solid *Solid
	mu    float64
	hints []arc // guesses of its slabs' arcs under the water, from the last evaluation
}

// heldWater is floodwater held in a compartment not open to the sea (added
// weight): its free surface is level with the sea's attitude, its height set
// by its volume.
type heldWater struct {
	solid *Solid
	mu    float64
	vol   float64 // m³ of water (≤ μ × compartment volume)
}

// Problem is a vessel under a damage state, ready to be solved at any
// attitude. Make it with NewProblem; it is not safe for concurrent use.
type Problem struct {
	v      *Vessel
	d      Damage
	load   Load
	open   []openSpace
	held   []heldWater
	heldIx []int
	openIx []int
	rho    float64
	massT  float64 // total, floodwater held included
	vmax   float64 // largest volume of buoyancy left
	scale  [3]float64
	hints  []arc // the hull's slabs' arcs under the water at the last evaluation (convex_cut.go)
}

// NewProblem prepares v under d.
func NewProblem(v *Vessel, d Damage) *Problem {
	pr := &Problem{v: v, d: d, load: v.Loading(d), rho: v.WaterDensity}
	pr.massT = pr.load.MassT
	pr.vmax = v.Hull.solid.Volume()
	pr.hints = v.Hull.solid.newArcHints()
	for i, c := range v.Compartments {
		s := d.state(i)
		mu := v.Permeability(d, i)
		switch {
		case s.Open:
			pr.open = append(pr.open, openSpace{c.solid, mu, c.solid.newArcHints()})
			pr.openIx = append(pr.openIx, i)
			pr.vmax -= mu * c.solid.Volume()
		case s.WaterM3 > 0:
			vol := math.Min(s.WaterM3, mu*c.solid.Volume())
			pr.held = append(pr.held, heldWater{c.solid, mu, vol})
			pr.heldIx = append(pr.heldIx, i)
			pr.massT += pr.rho * vol
		}
	}
	vol := pr.massT / pr.rho
	pr.scale = [3]float64{vol, vol * v.Hull.LengthM, vol * v.Hull.BreadthM}
	return pr
}

// Vessel returns the problem's vessel.
func (pr *Problem) Vessel() *Vessel { return pr.v }

// Damage returns the problem's damage state.
func (pr *Problem) Damage() Damage { return pr.d }

// MassT returns the total mass afloat, floodwater held included (t).
func (pr *Problem) MassT() float64 { return pr.massT }

// state is everything known at one attitude.
type state struct {
	p      Plane
	e      Immersion  // effective buoyant body: hull − Σ μ·open
	gx     [3]float64 // centre of gravity (solid)
	fsm    float64    // Σ free-surface moments used as a virtual rise of G
	f      [3]float64 // residuals
	j      [3][3]float64
	heldIm []Immersion // held water at its own level, scaled by μ
	heldPl []Plane     // the held water's surface in each compartment
	jac    bool        // j was computed
}

// eval computes the residuals of equilibrium and their exact Jacobian with
// respect to (A, B, C) at plane p.
//
// Residuals: f0 = V − W/ρ (buoyancy balances weight); f1 = (MX − xG·V) +
// B·(MZ − zG·V) and f2 = (MY − yG·V) + C·(MZ − zG·V), which vanish when B − G
// is parallel to the water's normal (−B, −C, 1). zG carries the virtual rise
// ΣFSM/Δ of the tanks' free surfaces; floodwater held moves with the
// attitude instead.
//
// Derivatives: dV/d(A,B,C) = (AW, SX, SY); dMX = (SX, IXX, IXY); dMY = (SY,
// IXY, IYY); dMZ = (A·AW + B·SX + C·SY, A·SX + B·IXX + C·IXY, A·SY + B·IXY +
// C·IYY): the waterplane moments (Leibniz's rule on the moving plane).
func (pr *Problem) eval(p Plane, withJac bool) state {
	var s state
	s.p = p
	s.e = pr.v.Hull.solid.belowHinted(p, pr.hints)
	for _, o := range pr.open {
		s.e.add(o.solid.belowHinted(p, o.hints), -o.mu)
	}
	W := pr.massT
	l := pr.load
	mx, my, mz := l.MassT*l.LCGM, l.MassT*l.TCGM, l.MassT*l.VCGM
	var dg [3][3]float64 // d(G·W)/d(A,B,C) from held water
	for _, h := range pr.held {
		pin, im := levelForVolume(h.solid, h.vol/h.mu, p.B, p.C)
		scaled := Immersion{}
		scaled.add(im, h.mu)
		s.heldIm = append(s.heldIm, scaled)
		s.heldPl = append(s.heldPl, pin)
		m := pr.rho * h.mu
		mx += m * im.MX
		my += m * im.MY
		mz += m * im.MZ
		if withJac && im.AW > 0 {
			// The inner level moves to keep the volume: dA_in = −(SX dB + SY dC)/AW.
			dab, dac := -im.SX/im.AW, -im.SY/im.AW
			dMX, dMY, dMZ := momentRates(im, pin)
			for r, d := range [3][3]float64{dMX, dMY, dMZ} {
				dg[r][1] += m * (d[1] + d[0]*dab)
				dg[r][2] += m * (d[2] + d[0]*dac)
			}
		}
	}
	s.gx = [3]float64{mx / W, my / W, mz / W}
	s.fsm = l.FSMTm
	xg, yg, zg := s.gx[0], s.gx[1], s.gx[2]+l.FSMTm/W
	e := s.e
	s.f[0] = e.V - W/pr.rho
	s.f[1] = (e.MX - xg*e.V) + p.B*(e.MZ-zg*e.V)
	s.f[2] = (e.MY - yg*e.V) + p.C*(e.MZ-zg*e.V)
	if !withJac {
		return s
	}
	s.jac = true
	dV := [3]float64{e.AW, e.SX, e.SY}
	dMX, dMY, dMZ := momentRates(e, p)
	for q := 0; q < 3; q++ {
		dxg, dyg, dzg := dg[0][q]/W, dg[1][q]/W, dg[2][q]/W
		s.j[0][q] = dV[q]
		s.j[1][q] = dMX[q] - xg*dV[q] - e.V*dxg + p.B*(dMZ[q]-zg*dV[q]-e.V*dzg)
		s.j[2][q] = dMY[q] - yg*dV[q] - e.V*dyg + p.C*(dMZ[q]-zg*dV[q]-e.V*dzg)
	}
	s.j[1][1] += e.MZ - zg*e.V
	s.j[2][2] += e.MZ - zg*e.V
	return s
}

// momentRates returns the rates of change of the moments MX, MY and MZ of
// the part of a solid below plane p with p's A, B and C: the waterplane's
// first and second moments (a plane z = A + B·x + C·y moves the water by
// dA + x·dB + y·dC at (x, y)), and for MZ the same weighted by the
// plane's height there.
func momentRates(im Immersion, p Plane) (dMX, dMY, dMZ [3]float64) {
	dMX = [3]float64{im.SX, im.IXX, im.IXY}
	dMY = [3]float64{im.SY, im.IXY, im.IYY}
	dMZ = [3]float64{
		p.A*im.AW + p.B*im.SX + p.C*im.SY,
		p.A*im.SX + p.B*im.IXX + p.C*im.IXY,
		p.A*im.SY + p.B*im.IXY + p.C*im.IYY,
	}
	return dMX, dMY, dMZ
}

// merit is the scaled squared residual norm.
func (pr *Problem) merit(s state, n int) float64 {
	var m float64
	for i := 0; i < n; i++ {
		r := s.f[i] / pr.scale[i]
		m += r * r
	}
	return m
}

// tolerance on each scaled residual: volume to 1e-11 of the displaced
// volume and moment balance to 1e-11 of volume × length (or breadth).
const residualTol = 1e-11

func (pr *Problem) converged(s state, n int) bool {
	for i := 0; i < n; i++ {
		if !(math.Abs(s.f[i]/pr.scale[i]) <= residualTol) {
			return false
		}
	}
	return true
}

// maxHeel bounds the heel the solver will consider.
const maxHeel = 89.5 * math.Pi / 180

// newton solves for the plane from p. With fixedHeel it solves only for A
// and B (draft and trim at the given heel: two equations f0, f1). Each step
// is limited (heel by 10°, trim by a tenth of the length, draft by half the
// depth) and backtracked until the merit falls. At most 60 steps.
func (pr *Problem) newton(p Plane, fixedHeel bool) (state, int, bool) {
	n := 3
	if fixedHeel {
		n = 2
	}
	D := pr.v.Hull.DepthM
	s := pr.eval(p, true)
	m := pr.merit(s, n)
	for it := 0; it < 60; it++ {
		if pr.converged(s, n) {
			return s, it, true
		}
		var dx [3]float64
		var ok bool
		if n == 3 {
			dx, ok = solve3(s.j, s.f)
		} else {
			var d2 [2]float64
			d2, ok = solve2([2][2]float64{{s.j[0][0], s.j[0][1]}, {s.j[1][0], s.j[1][1]}}, [2]float64{s.f[0], s.f[1]})
			dx = [3]float64{d2[0], d2[1], 0}
		}
		if !ok {
			// Singular Jacobian: fall back to a draft-only step.
			if s.j[0][0] == 0 {
				return s, it, false
			}
			dx = [3]float64{s.f[0] / s.j[0][0], 0, 0}
		}
		// Limit the step.
		f := 1.0
		if a := math.Abs(dx[0]); a > D/2 {
			f = math.Min(f, D/2/a)
		}
		if b := math.Abs(dx[1]); b > 0.1 {
			f = math.Min(f, 0.1/b)
		}
		heel := math.Atan(p.C)
		if n == 3 {
			nh := math.Atan(p.C - dx[2])
			if dh := math.Abs(nh - heel); dh > 10*math.Pi/180 {
				f = math.Min(f, 10*math.Pi/180/dh)
			}
		}
		improved := false
		for ls := 0; ls < 30; ls++ {
			q := Plane{p.A - f*dx[0], p.B - f*dx[1], p.C - f*dx[2]}
			if math.Abs(math.Atan(q.C)) > maxHeel {
				f /= 2
				continue
			}
			t := pr.eval(q, true)
			tm := pr.merit(t, n)
			if tm < m || pr.converged(t, n) {
				p, s, m = q, t, tm
				improved = true
				break
			}
			f /= 2
		}
		if !improved {
			return s, it, pr.converged(s, n)
		}

	}
	return s, 60, pr.converged(s, n)
}

func solve3(a [3][3]float64, b [3]float64) ([3]float64, bool) {
	det := a[0][0]*(a[1][1]*a[2][2]-a[1][2]*a[2][1]) -
		a[0][1]*(a[1][0]*a[2][2]-a[1][2]*a[2][0]) +
		a[0][2]*(a[1][0]*a[2][1]-a[1][1]*a[2][0])
	if det == 0 || math.IsNaN(det) || math.IsInf(det, 0) {
		return [3]float64{}, false
	}
	var x [3]float64
	for c := 0; c < 3; c++ {
		m := a
		for r := 0; r < 3; r++ {
			m[r][c] = b[r]
		}
		x[c] = (m[0][0]*(m[1][1]*m[2][2]-m[1][2]*m[2][1]) -
			m[0][1]*(m[1][0]*m[2][2]-m[1][2]*m[2][0]) +
			m[0][2]*(m[1][0]*m[2][1]-m[1][1]*m[2][0])) / det
	}
	return x, true
}

func solve2(a [2][2]float64, b [2]float64) ([2]float64, bool) {
	det := a[0][0]*a[1][1] - a[0][1]*a[1][0]
	if det == 0 || math.IsNaN(det) || math.IsInf(det, 0) {
		return [2]float64{}, false
	}
	return [2]float64{(b[0]*a[1][1] - a[0][1]*b[1]) / det, (a[0][0]*b[1] - a[1][0]*b[0]) / det}, true
}

// upright returns the level, upright plane that displaces the weight.
func (pr *Problem) upright() Plane {
	target := pr.massT / pr.rho
	// Newton on A for the effective body, from the hull's own table (the
	// lost volume moves it only a little). This is a start for the solver,
	// so 1e-10 of the volume is enough; at most 30 steps.
	p := Plane{A: pr.v.Hull.levelGuess(target + pr.v.Hull.solid.Volume() - pr.vmax)}
	for it := 0; it < 30; it++ {
		s := pr.eval(p, false)
		e := s.e
		f := e.V - target
		if math.Abs(f) <= 1e-10*target || e.AW <= 0 {
			break
		}
		p.A -= f / e.AW
	}
	return p
}

// AtHeel finds draft and trim at a fixed heel (free trim, constant
// displacement) starting from guess, and returns the plane and the
// righting lever GZ (m): the horizontal distance, square to the ship's
// length, from G to the line of action of buoyancy, positive when it turns
// the ship back towards upright.
// G carries the free-surface virtual rise. At zero heel the sign is that of a
// lever turning her to port.
func (pr *Problem) AtHeel(heelRad float64, guess Plane) (Plane, float64, error) {
	if math.IsNaN(heelRad) || math.Abs(heelRad) > maxHeel {
		return Plane{}, 0, fmt.Errorf("engine: heel %v rad out of range", heelRad)
	}
	s, err := pr.atHeel(heelRad, guess)
	if err != nil {
		return s.p, 0, err
	}
	r := pr.lever(s)
	if heelRad < 0 {
		r = -r
	}
	return s.p, r, nil
}

// Solve finds where v floats under damage d: the free-floating equilibrium
// at the actual heel and trim. It returns a *NoEquilibrium error when the
// vessel sinks or capsizes.
//
// The position's upright GM (GMUprightM) is filled in.
func Solve(v *Vessel, d Damage) (Position, error) {
	pr := NewProblem(v, d)
	pos, err := pr.Equilibrium()
	if err != nil {
		return pos, err
	}
	if math.IsNaN(pos.GMUprightM) {
		if pl, _, err := pr.AtHeel(0, Plane{A: pos.Plane.A, B: pos.Plane.B}); err == nil {
			pos.GMUprightM = pr.uprightAt(pl)
		}
	}
	return pos, nil
}

// Equilibrium finds the free-floating position.
//
// Method: a sinking check against the buoyancy left; Newton's method in
// (A, B, C) from the level upright position; if that lands on an unstable
// position (negative GM, as with an angle of loll) or fails, a march in
// heel of 1° to each side solving draft and trim at each heel, taking the
// nearest heel where GZ passes from negative to positive, refined by Newton.
// Bounded: at most a few hundred evaluations.
func (pr *Problem) Equilibrium() (Position, error) {
	return pr.EquilibriumFrom(Plane{}, false)
}

// EquilibriumFrom is Equilibrium with Newton started from guess when warm is
// true (a nearby solved plane, as in a flooding run): fewer steps, same
// answer and the same fallbacks.
func (pr *Problem) EquilibriumFrom(guess Plane, warm bool) (Position, error) {
	need := pr.massT / pr.rho
	if !(pr.vmax > 0) || need >= pr.vmax*(1-1e-9) {
		return Position{}, &NoEquilibrium{Sinks, fmt.Sprintf("she weighs %.0f t but the hull left intact can float at most %.0f t", pr.massT, math.Max(pr.vmax, 0)*pr.rho)}
	}
	start := pr.upright()
	if warm && !math.IsNaN(guess.A+guess.B+guess.C) && math.Abs(math.Atan(guess.C)) < maxHeel {
		if s, it, ok := pr.newton(guess, false); ok {
			if pos := pr.position(s, it); pos.GMM > 0 {
				return pos, nil
			}
		}
	}
	s, it, ok := pr.newton(start, false)
	var pos Position
	if ok {
		pos = pr.position(s, it)
		if pos.GMM > 0 && math.Abs(pos.HeelDeg) <= 1 {
			return pos, nil
		}
	}
	// Which way does she go from upright? The lever at zero heel: positive
	// (buoyancy to starboard of G) turns her to port (fallSide). The level upright
	// start tells the side well enough to accept a converged position.
	side := pr.fallSide(pr.lever(pr.eval(start, false)))
	if ok && pos.GMM > 0 && pos.HeelDeg*side > 0 {
		return pos, nil
	}
	st0, err := pr.atHeel(0, start)
	if err != nil {
		return Position{}, err // already a *NoEquilibrium saying where
	}
	side = pr.fallSide(pr.lever(st0))
	// March in heel from upright towards that side, 1° at a time, to the
	// first heel where the lever turns her back: the position she comes to
	// rest in (an angle of loll when GM is negative). With no lever at all
	// upright (a symmetric condition with negative GM) she is taken to go to
	// starboard; she could as well go to port.
	type cand struct {
		lo, hi   float64 // heels bracketing the crossing, lo nearer upright
		plo, phi Plane
		rlo, rhi float64
	}
	var best *cand
	tol := fallTol * pr.v.Hull.BreadthM
	prev, prevR := st0.p, pr.lever(st0)
	for deg := 1; deg <= 89; deg++ {
		h := side * float64(deg) * math.Pi / 180
		st, err := pr.atHeel(h, prev)
		if err != nil {
			break
		}
		r := pr.lever(st)
		// A lever within round-off of zero (fallSide's tolerance) counts as
		// none: upright with no lever and turned back at 1° is a rest near
		// upright, on either side.
		if side > 0 && prevR <= tol && r > 0 || side < 0 && prevR >= -tol && r < 0 {
			best = &cand{h - side*math.Pi/180, h, prev, st.p, prevR, r}
			break
		}
		prev, prevR = st.p, r
	}
	if best == nil {
		return Position{}, &NoEquilibrium{Capsizes, fmt.Sprintf("heeling to %s, no angle short of 90° has a righting lever that brings her to rest", Side(side).String())}
	}
	// Refine: secant guess, then full Newton; fall back to bisection in heel.
	t := best.rlo / (best.rlo - best.rhi)
	guess = Plane{best.plo.A + t*(best.phi.A-best.plo.A), best.plo.B + t*(best.phi.B-best.plo.B), 0}
	guess.C = math.Tan(best.lo + t*(best.hi-best.lo))
	lo, hi := math.Min(best.lo, best.hi), math.Max(best.lo, best.hi)
	if s, it, ok := pr.newton(guess, false); ok {
		if h := math.Atan(s.p.C); h >= lo-1e-9 && h <= hi+1e-9 {
			return pr.position(s, it), nil
		}
	}
	a, b, ra := best.lo, best.hi, best.rlo
	p := best.plo
	last, err := pr.atHeel(a, p)
	if err != nil {
		return Position{}, err // already a *NoEquilibrium saying where
	}
	for i := 0; i < 60 && math.Abs(b-a) > 1e-12; i++ {
		mid := (a + b) / 2
		st, err := pr.atHeel(mid, p)
		if err != nil {
			break
		}
		last = st
		if r := pr.lever(st); (r < 0) == (ra < 0) {
			a, ra, p = mid, r, st.p
		} else {
			b = mid
		}
	}
	return pr.position(last, 60), nil
}

// atHeel solves draft and trim at a fixed heel.
func (pr *Problem) atHeel(heelRad float64, guess Plane) (state, error) {
	guess.C = math.Tan(heelRad)
	s, _, ok := pr.newton(guess, true)
	if !ok && heelRad == 0 {
		// Upright, Newton can stall where the moment of trim has a minimum
		// that is not zero (the deck going under at one end): scan the trim
		// for a change of sign instead.
		if ts, found, end := pr.trimScan(guess); found {
			return ts, nil
		} else if end != "" {
			return ts, &NoEquilibrium{Sinks, fmt.Sprintf("she founders by the %s: no trim up to %.0f° either way brings her centre of buoyancy under her centre of gravity", end, trimScanMaxDeg)}
		}
	}
	if !ok {
		// Upright, a search that ran away to a steep trim means no trim
		// brings her centre of buoyancy under G: she founders by that end.
		if heelRad == 0 && math.Abs(s.p.B) > foundersSlope {
			end := "head"
			if s.p.B < 0 {
				end = "stern"
			}
			return s, &NoEquilibrium{Sinks, fmt.Sprintf("she founders by the %s: no trim short of %.0f° brings her centre of buoyancy under her centre of gravity", end, math.Atan(math.Abs(s.p.B))*180/math.Pi)}
		}
		return s, &NoEquilibrium{NotConverged, fmt.Sprintf("no draft and trim found at %.1f° heel", heelRad*180/math.Pi)}
	}
	return s, nil
}

// trimScanMaxDeg bounds the trim angles trimScan looks at.
const trimScanMaxDeg = 60.0

// trimScan looks for the upright trim at which buoyancy and weight line up
// (f1 = 0) by stepping the trim angle 1° at a time out to ±trimScanMaxDeg
// from level, the draft solved for the displacement at each, and bisecting
// the first change of sign. found is false when there is none; then end
// names the end she goes down by ("head" or "stern", from the sign of the
// moment), or is "" when the scan itself failed. Bounded: at most about
// 120 draft solves and 60 bisection steps.
func (pr *Problem) trimScan(guess Plane) (state, bool, string) {
	f1 := func(deg float64, a float64) (state, bool) {
		return pr.draftAt(Plane{A: a, B: -math.Tan(deg * math.Pi / 180)})
	}
	s0, ok := f1(0, guess.A)
	if !ok {
		return s0, false, ""
	}
	r0 := s0.f[1]
	for _, dir := range []float64{1, -1} {
		prev, prevA := 0.0, s0.p.A
		prevR := r0
		for deg := 1.0; deg <= trimScanMaxDeg; deg++ {
			st, ok := f1(dir*deg, prevA)
			if !ok {
				break
			}
			if r := st.f[1]; (r < 0) != (prevR < 0) {
				lo, hi, rlo := prev, dir*deg, prevR
				a := prevA
				best := st
				for i := 0; i < 60 && math.Abs(hi-lo) > 1e-10; i++ {
					mid := (lo + hi) / 2
					sm, ok := f1(mid, a)
					if !ok {
						break
					}
					best = sm
					if (sm.f[1] < 0) == (rlo < 0) {
						lo, rlo, a = mid, sm.f[1], sm.p.A
					} else {
						hi = mid
					}
				}
				// Polish draft and trim together from the bracket.
				if ns, _, ok := pr.newton(best.p, true); ok {
					return ns, true, ""
				}
				return pr.eval(best.p, true), true, ""
			}
			prev, prevA, prevR = dir*deg, st.p.A, st.f[1]
		}
	}
	// f1 = (MX − xG·V) + B(…): negative means buoyancy acts aft of G, so she
	// goes down by the head.
	if r0 < 0 {
		return s0, false, "head"
	}
	return s0, false, "stern"
}

// draftAt solves the draft for the displacement at the slopes of p (trim
// and heel fixed), from p.A: Newton safeguarded by a bracket, at most 80
// steps.
func (pr *Problem) draftAt(p Plane) (state, bool) {
	target := pr.massT / pr.rho
	_, _, zmin, zmax := pr.v.Hull.solid.Extent()
	span := math.Abs(p.B)*pr.v.Hull.LengthM*2 + math.Abs(p.C)*pr.v.Hull.BreadthM + 1
	lo, hi := zmin-span-math.Abs(p.B)*math.Abs(pr.v.Hull.solid.xmin), zmax+span+math.Abs(p.B)*math.Abs(pr.v.Hull.solid.xmax)
	if !(p.A > lo && p.A < hi) {
		p.A = (lo + hi) / 2
	}
	for it := 0; it < 80; it++ {
		s := pr.eval(p, true)
		f := s.f[0]
		if math.Abs(f) <= 1e-11*target {
			return s, true
		}
		if f > 0 {
			hi = p.A
		} else {
			lo = p.A
		}
		next := p.A - f/s.e.AW
		if !(s.e.AW > 0) || !(next > lo && next < hi) {
			next = (lo + hi) / 2
		}
		if hi-lo < 1e-12 {
			return s, true
		}
		p.A = next
	}
	return pr.eval(p, true), false
}

// foundersSlope is the trim slope (tan 20°) past which a failed upright trim
// search is taken as foundering by the head or stern.
const foundersSlope = 0.364

// lever returns the horizontal transverse distance from G (with its
// free-surface virtual rise) to the line of action of buoyancy, positive
// when buoyancy acts to starboard of G: [(yB − yG) + C(zB − zG)]/√(1 + C²).
func (pr *Problem) lever(s state) float64 {
	if s.e.V <= 0 {
		return 0
	}
	return s.f[2] / (s.e.V * math.Sqrt(1+s.p.C*s.p.C))
}

// fallTol is how small a lever at zero heel is taken as none, as a
// fraction of the breadth (round-off of the sums over the hull).
const fallTol = 1e-9

// fallSide returns the side a ship upright with lever r (m, lever at zero
// heel; positive: buoyancy to starboard of G) goes to: +1 starboard, −1
// port. A lever within round-off of zero (1e-9 of the breadth: a
// condition symmetric about the centreline) is taken as none, and she is
// taken to go to starboard, so that the side does not turn on the last
// bit of a sum (the same rule whichever way the sums were added).
func (pr *Problem) fallSide(r float64) float64 {
	if r > fallTol*pr.v.Hull.BreadthM {
		return -1
	}
	return 1
}
