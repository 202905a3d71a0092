package engine

import "math"

// vecStepper integrates the autonomous system dy/dt = f(y) by the
// Dormand–Prince 5(4) pair (the tableau dpA, dpE of flood.go) with error
// control on every component, first same as last. It is the vector form
// of stepper, for the water of many compartments at once.
type vecStepper struct {
	f        func(y []float64) ([]float64, error)
	t        float64
	y, fy    []float64
	dt       float64
	atol     []float64 // per component
	rtol     float64
	dtMin    float64
	tries    int
	maxTries int
}

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

// advance takes one accepted step, not past tEnd. A trial whose f fails is
// halved; when the step would fall below dtMin the failure is returned.
func (s *vecStepper) advance(tEnd float64) (vecRec, error) {
	n := len(s.y)
	var k [7][]float64
	y := make([]float64, n)
	for {
		if s.tries >= s.maxTries {
			return vecRec{}, errStepBound
		}
		s.tries++
		h := math.Min(s.dt, tEnd-s.t)
		if !(h > 0) {
			return vecRec{}, errStepBound
		}
		k[0] = s.fy
		var err error
		for i := 1; i < 7 && err == nil; i++ {
			for c := 0; c < n; c++ {
				y[c] = s.y[c]
				for j := 0; j < i; j++ {
					y[c] += h * dpA[i][j] * k[j][c]
				}
			}
			k[i], err = s.f(append([]float64(nil), y...))
		}
		if err != nil {
			if h/2 < s.dtMin {
				s.dt = h
				return vecRec{}, err
			}
			s.dt = h / 2
			continue
		}
		ratio := 0.0
		for c := 0; c < n; c++ {
			var e float64
			for i := range k {
				e += h * dpE[i] * k[i][c]
			}
			sc := s.atol[c] + s.rtol*math.Max(math.Abs(s.y[c]), math.Abs(y[c]))
			ratio = math.Max(ratio, math.Abs(e)/sc)
		}
		if math.IsNaN(ratio) || math.IsInf(ratio, 0) {
			ratio = 1e6
		}
		grow := 5.0
		if ratio > 0 {
			grow = math.Max(0.2, math.Min(5, 0.9*math.Pow(ratio, -0.2)))
		}
		if ratio > 1 && h > s.dtMin {
			s.dt = math.Max(h*grow, s.dtMin)
			continue
		}
		rec := vecRec{t0: s.t, t1: s.t + h, y0: s.y, y1: append([]float64(nil), y...), f0: s.fy, f1: k[6]}
		if h == tEnd-s.t {
			rec.t1 = tEnd
		}
		s.t, s.y, s.fy = rec.t1, rec.y1, rec.f1
		s.dt = h * grow
		return rec, nil
	}
}
