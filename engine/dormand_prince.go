package engine

import (
	"errors"
	"math"
)

// This file holds the integrator of a flooding run: the Dormand–Prince
// 5(4) pair with error control for one scalar autonomous equation, and the
// record of an accepted step with its cubic Hermite interpolant.

// stepRec is one accepted step: from (t0, y0) with slope f0 to (t1, y1)
// with slope f1.
type stepRec struct {
	t0, t1, y0, y1, f0, f1 float64
}

// at returns the cubic Hermite interpolant of the step at fraction θ.
func (s stepRec) at(th float64) float64 {
	h := s.t1 - s.t0
	t2, t3 := th*th, th*th*th
	return (2*t3-3*t2+1)*s.y0 + (t3-2*t2+th)*h*s.f0 + (-2*t3+3*t2)*s.y1 + (t3-t2)*h*s.f1
}

// stepper integrates the scalar autonomous equation dy/dt = f(y) by the
// Dormand–Prince 5(4) pair with error control, first same as last. The
// solution is kept inside [ymin, ymax]: a trial step that would leave it is
// cut back so as to land on the bound.
type stepper struct {
	f          func(y float64) (float64, error)
	t, y, fy   float64
	dt         float64
	atol, rtol float64
	dtMin      float64
	ymin, ymax float64
	tries      int
	maxTries   int
}

var errStepBound = errors.New("the flooding calculation needed more steps than it is allowed; the figures end where it stopped")

// Dormand–Prince 5(4) tableau (Dormand & Prince 1980). The nodes c are not
// needed: the rate of flooding depends on the water in, not on time.
var (
	dpA = [7][6]float64{
		{},
		{1.0 / 5},
		{3.0 / 40, 9.0 / 40},
		{44.0 / 45, -56.0 / 15, 32.0 / 9},
		{19372.0 / 6561, -25360.0 / 2187, 64448.0 / 6561, -212.0 / 729},
		{9017.0 / 3168, -355.0 / 33, 46732.0 / 5247, 49.0 / 176, -5103.0 / 18656},
		{35.0 / 384, 0, 500.0 / 1113, 125.0 / 192, -2187.0 / 6784, 11.0 / 84},
	}
	// dpE is the fifth-order weights minus the fourth-order ones.
	dpE = [7]float64{71.0 / 57600, 0, -71.0 / 16695, 71.0 / 1920, -17253.0 / 339200, 22.0 / 525, -1.0 / 40}
)

// dpTry takes one trial step of size h from y0 (slope f0) and returns the
// fifth-order y1, the slope there and the error estimate. The last call of
// f is at y1.
func dpTry(f func(float64) (float64, error), y0, f0, h float64) (y1, f1, errEst float64, err error) {
	var k [7]float64
	k[0] = f0
	for i := 1; i < 7; i++ {
		y := y0
		for j := 0; j < i; j++ {
			y += h * dpA[i][j] * k[j]
		}
		if i == 6 {
			y1 = y
		}
		k[i], err = f(y)
		if err != nil {
			return 0, 0, 0, err
		}
	}
	for i := range k {
		errEst += h * dpE[i] * k[i]
	}
	return y1, k[6], errEst, nil
}

// advance takes one accepted step, not past tEnd. A trial whose f fails is
// halved; when the step would fall below dtMin the failure is returned.
func (s *stepper) advance(tEnd float64) (stepRec, error) {
	for {
		if s.tries >= s.maxTries {
			return stepRec{}, errStepBound
		}
		s.tries++
		dt := math.Min(s.dt, tEnd-s.t)
		if !(dt > 0) {
			return stepRec{}, errStepBound
		}
		y1, f1, e, err := dpTry(s.f, s.y, s.fy, dt)
		if err != nil {
			if dt/2 < s.dtMin {
				s.dt = dt
				return stepRec{}, err
			}
			s.dt = dt / 2
			continue
		}
		// Keep inside the bounds: land on the bound the step would cross.
		bound := math.NaN()
		switch {
		case y1 > s.ymax && s.y < s.ymax:
			bound = s.ymax
		case y1 < s.ymin && s.y > s.ymin:
			bound = s.ymin
		}
		if !math.IsNaN(bound) {
			if math.Abs(y1-bound) <= 1e-9*math.Max(s.ymax-s.ymin, 1) {
				y1 = bound
			} else {
				s.dt = dt * math.Max(0.1, math.Min(0.999, (bound-s.y)/(y1-s.y)))
				continue
			}
		}
		sc := s.atol + s.rtol*math.Max(math.Abs(s.y), math.Abs(y1))
		ratio := math.Abs(e) / sc
		if math.IsNaN(ratio) || math.IsInf(ratio, 0) {
			ratio = 1e6
		}
		grow := 5.0
		if ratio > 0 {
			grow = math.Max(0.2, math.Min(5, 0.9*math.Pow(ratio, -0.2)))
		}
		if ratio > 1 && dt > s.dtMin {
			s.dt = math.Max(dt*grow, s.dtMin)
			continue
		}
		rec := stepRec{t0: s.t, t1: s.t + dt, y0: s.y, y1: y1, f0: s.fy, f1: f1}
		if dt == tEnd-s.t {
			rec.t1 = tEnd
		}
		s.t, s.y, s.fy = rec.t1, y1, f1
		s.dt = dt * grow
		return rec, nil
	}
}
