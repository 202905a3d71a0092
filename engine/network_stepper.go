package engine

import (
	"errors"
	"math"
)

// This file holds the integrator of a flooding run through the ship: the
// modified Rosenbrock pair of order 2(3) of Shampine & Reichelt (The
// MATLAB ODE Suite, SIAM J. Sci. Comput. 18 (1997) 1–22, the formula of
// ode23s), linearly implicit, so that a door between a small space and a
// large one (levels that meet in seconds while the ship settles over
// hours) does not force steps of a second. Its second-order solution holds
// for any approximation of the Jacobian (a W-method), which lets the
// Jacobian be taken with the ship held where she was last solved.

// vecRec is one accepted step: from (t0, y0) with slope f0 to (t1, y1)
// with slope f1.
type vecRec struct {
	t0, t1         float64
	y0, y1, f0, f1 []float64
}

// at returns the cubic Hermite interpolant of component i at fraction θ.
func (s vecRec) at(i int, th float64) float64 {
	return stepRec{t0: s.t0, t1: s.t1, y0: s.y0[i], y1: s.y1[i], f0: s.f0[i], f1: s.f1[i]}.at(th)
}

// state returns every component at fraction θ.
func (s vecRec) state(th float64) []float64 {
	out := make([]float64, len(s.y0))
	for i := range out {
		out[i] = s.at(i, th)
	}
	return out
}

// rosStepper integrates the autonomous system dy/dt = f(y).
type rosStepper struct {
	f        func(y []float64) ([]float64, error)
	jac      func(y []float64) [][]float64
	t        float64
	y, fy    []float64
	dt       float64
	atol     []float64 // per component
	rtol     float64
	dtMin    float64
	tries    int
	maxTries int

	jm     [][]float64 // the Jacobian in use
	jAge   int         // accepted steps since it was taken
	jFresh bool        // taken at the current y
}

// jacobianEvery is how many accepted steps one Jacobian serves (a
// W-method keeps its order with a stale one). On the bundled freighter's
// doors a fresh one each step costs fewer solves in all (1246 against
// 1507 with one every 3 steps): the steps it saves outweigh it.
const jacobianEvery = 1

var errNotFinite = errors.New("the flooding calculation met a value that is not a number; the figures end where it stopped")

// advance takes one accepted step, not past tEnd. A trial whose f fails is
// halved; when the step would fall below dtMin the failure is returned.
//
// With d = 1/(2+√2), W = I − h·d·J:
//
//	k1 = W⁻¹·f(y), F1 = f(y + h/2·k1), k2 = W⁻¹·(F1 − k1) + k1,
//	y1 = y + h·k2, F2 = f(y1),
//	k3 = W⁻¹·(F2 − (6+√2)·(k2 − F1) − 2·(k1 − f(y))),
//	error ≈ h/6·(k1 − 2·k2 + k3).
func (s *rosStepper) advance(tEnd float64) (vecRec, error) {
	n := len(s.y)
	d := 1 / (2 + math.Sqrt2)
	e32 := 6 + math.Sqrt2
	if s.jm == nil || s.jAge >= jacobianEvery {
		s.jm, s.jAge, s.jFresh = s.jac(s.y), 0, true
	}
	for {
		J := s.jm
		if s.tries >= s.maxTries {
			return vecRec{}, errStepBound
		}
		s.tries++
		h := math.Min(s.dt, tEnd-s.t)
		if !(h > 0) {
			return vecRec{}, errStepBound
		}
		W := make([][]float64, n)
		for i := range W {
			W[i] = make([]float64, n)
			for j := range W[i] {
				W[i][j] = -h * d * J[i][j]
			}
			W[i][i]++
		}
		lu, ok := luFactor(W)
		if !ok {
			s.dt = h / 2
			if s.dt < s.dtMin {
				return vecRec{}, errNotFinite
			}
			continue
		}
		k1 := lu.solve(s.fy)
		y := make([]float64, n)
		for i := range y {
			y[i] = s.y[i] + h/2*k1[i]
		}
		F1, err := s.f(y)
		var F2, k2, y1 []float64
		if err == nil {
			r := make([]float64, n)
			for i := range r {
				r[i] = F1[i] - k1[i]
			}
			k2 = lu.solve(r)
			y1 = make([]float64, n)
			for i := range k2 {
				k2[i] += k1[i]
				y1[i] = s.y[i] + h*k2[i]
			}
			F2, err = s.f(y1)
		}
		if err != nil {
			if h/2 < s.dtMin {
				s.dt = h
				return vecRec{}, err
			}
			s.dt = h / 2
			continue
		}
		r := make([]float64, n)
		for i := range r {
			r[i] = F2[i] - e32*(k2[i]-F1[i]) - 2*(k1[i]-s.fy[i])
		}
		k3 := lu.solve(r)
		ratio := 0.0
		for i := 0; i < n; i++ {
			e := h / 6 * (k1[i] - 2*k2[i] + k3[i])
			sc := s.atol[i] + s.rtol*math.Max(math.Abs(s.y[i]), math.Abs(y1[i]))
			ratio = math.Max(ratio, math.Abs(e)/sc)
		}
		if math.IsNaN(ratio) || math.IsInf(ratio, 0) {
			if h/2 < s.dtMin {
				return vecRec{}, errNotFinite
			}
			s.dt = h / 2
			continue
		}
		grow := 5.0
		if ratio > 0 {
			grow = math.Max(0.2, math.Min(5, 0.8*math.Pow(ratio, -1.0/3)))
		}
		if ratio > 1 && h > s.dtMin {
			s.dt = math.Max(h*grow, s.dtMin)
			if !s.jFresh {
				s.jm, s.jAge, s.jFresh = s.jac(s.y), 0, true
			}
			continue
		}
		s.jAge++
		s.jFresh = false
		rec := vecRec{t0: s.t, t1: s.t + h, y0: s.y, y1: y1, f0: s.fy, f1: F2}
		if h == tEnd-s.t {
			rec.t1 = tEnd
		}
		s.t, s.y, s.fy = rec.t1, rec.y1, rec.f1
		s.dt = h * grow
		return rec, nil
	}
}

// luDec is an LU factorisation with partial pivoting of a small matrix.
type luDec struct {
	a   [][]float64
	piv []int
}

// luFactor factors a (overwritten); false when it is singular.
func luFactor(a [][]float64) (luDec, bool) {
	n := len(a)
	piv := make([]int, n)
	for i := range piv {
		piv[i] = i
	}
	for c := 0; c < n; c++ {
		p := c
		for r := c + 1; r < n; r++ {
			if math.Abs(a[r][c]) > math.Abs(a[p][c]) {
				p = r
			}
		}
		if !(math.Abs(a[p][c]) > 0) {
			return luDec{}, false
		}
		a[c], a[p] = a[p], a[c]
		piv[c], piv[p] = piv[p], piv[c]
		for r := c + 1; r < n; r++ {
			f := a[r][c] / a[c][c]
			a[r][c] = f
			for k := c + 1; k < n; k++ {
				a[r][k] -= f * a[c][k]
			}
		}
	}
	return luDec{a, piv}, true
}

// solve returns x with A·x = b.
func (l luDec) solve(b []float64) []float64 {
	n := len(b)
	x := make([]float64, n)
	for i := range x {
		x[i] = b[l.piv[i]]
	}
	for i := 0; i < n; i++ {
		for k := 0; k < i; k++ {
			x[i] -= l.a[i][k] * x[k]
		}
	}
	for i := n - 1; i >= 0; i-- {
		for k := i + 1; k < n; k++ {
			x[i] -= l.a[i][k] * x[k]
		}
		x[i] /= l.a[i][i]
	}
	return x
}
