package engine

import (
	"math"
	"sync/atomic"
)

// This file works one span of a GZ curve: a run of its samples from a
// fixed heel, the first started cold and the rest warm from the ones
// before, so that the spans of a curve can be worked side by side
// (gz_crew.go) and joined afterwards by the curve's own rules
// (gz_assemble.go). The spans start at fixed heels, never chosen by the
// number of cores, so the curve is the same on any machine.

// sampleHeel returns the heel (degrees) of sample k of a curve sampled
// every stepDeg: k·stepDeg, the last one gzEndDeg.
func sampleHeel(k int, stepDeg float64) float64 {
	return math.Min(float64(k)*stepDeg, gzEndDeg)
}

// lastSample returns the index of a curve's last sample, the one at
// gzEndDeg.
func lastSample(stepDeg float64) int {
	return int(math.Ceil(gzEndDeg/stepDeg - 1e-9))
}

// firstSampleFrom returns the index of the first sample at or beyond
// deg (at most lastSample).
func firstSampleFrom(deg, stepDeg float64) int {
	return min(int(math.Ceil(deg/stepDeg-1e-9)), lastSample(stepDeg))
}

// vanishingAt is a refined angle of vanishing stability (see vanishing):
// the heel, GZ there and the solved sample.
type vanishingAt struct {
	deg, gz float64
	sh      solvedHeel
}

// spanRun is what working samples k0 ≤ k < k1 of a curve gave: the
// samples in heel order, the first fall of GZ through zero between two of
// them with its refined angle (added among the samples, as the whole curve
// adds it, unless it lies within 1e-3° of one), and the failure that ended
// it early, if one did.
type spanRun struct {
	k0, k1 int

	heels, gz []float64
	sol       []solvedHeel

	cross int // index of the sample after the first fall of GZ through zero within the span; −1 if none
	van   vanishingAt
	vanIx int // index of van among the samples; −1 when it is not among them

	failDeg  float64 // the heel at which no draft and trim (failErr) or no lever (nanLever) was found
	failErr  error
	nanLever bool

	cut bool // stopped or skipped because the curve ends before what it left out (curveWork.need)
}

// failed reports whether the span ended on a heel it could not solve.
func (s *spanRun) failed() bool { return s.failErr != nil || s.nanLever }

func (s *spanRun) push(deg, gz float64, sh solvedHeel) {
	s.heels = append(s.heels, deg)
	s.gz = append(s.gz, gz)
	s.sol = append(s.sol, sh)
}

// curveWork is one curve being worked in spans: towards side, sampled
// every step, from eq. need is the index of the last sample the curve can
// still need; spans lower it as they find where it must end (never below
// where it does end), so that work beyond is skipped; the curve itself
// does not depend on it.
type curveWork struct {
	side  Side
	step  float64
	eq    Position
	eqDeg float64 // the curve's EquilibriumDeg
	start Plane   // the cold start of a span's first sample
	kMin  int     // the first sample at or beyond gzMinEndDeg
	spans []spanRun
	need  atomic.Int64
	left  atomic.Int32 // spans not yet worked or skipped

	c   *GZCurve
	sol []solvedHeel
	err error
}

// limit records that no sample beyond k is needed.
func (w *curveWork) limit(k int) {
	for {
		n := w.need.Load()
		if int64(k) >= n || w.need.CompareAndSwap(n, int64(k)) {
			return
		}
	}
}

// newCurveWork prepares the curve towards side sampled every stepDeg from
// eq, in spans starting at the heels starts (ascending, the first 0).
// start is the cold start of each span's first sample.
func newCurveWork(side Side, eq Position, stepDeg float64, start Plane, starts []float64) *curveWork {
	w := &curveWork{side: side, step: stepDeg, eq: eq, start: start, kMin: firstSampleFrom(gzMinEndDeg, stepDeg)}
	if eq.HeelDeg*float64(side) > 0 {
		w.eqDeg = math.Abs(eq.HeelDeg)
	}
	last := lastSample(stepDeg)
	w.need.Store(int64(last))
	for i, d := range starts {
		k0 := firstSampleFrom(d, stepDeg)
		if i == 0 {
			k0 = 0
		}
		if n := len(w.spans); n > 0 && k0 <= w.spans[n-1].k0 {
			continue
		}
		if n := len(w.spans); n > 0 {
			w.spans[n-1].k1 = k0
		}
		w.spans = append(w.spans, spanRun{k0: k0, k1: last + 1, cross: -1, vanIx: -1})
	}
	w.left.Store(int32(len(w.spans)))
	return w
}

// workSpan works span s of curve w by the curve's rules (see
// RightingLevers): each sample from the Hermite extrapolation of the two
// before it in the span (the first from w.start), the first fall of GZ
// through zero beyond the equilibrium refined, and a stop at the first
// heel of at least gzMinEndDeg after it, at the first failure, at the
// span's end, or where the curve no longer needs samples (w.need).
func (pr *Problem) workSpan(w *curveWork, s *spanRun) {
	sgn := float64(w.side)
	n := s.k1 - s.k0 + 1 // its samples and an angle of vanishing stability
	s.heels, s.gz, s.sol = make([]float64, 0, n), make([]float64, 0, n), make([]solvedHeel, 0, n)
	for k := s.k0; k < s.k1; k++ {
		if int64(k) > w.need.Load() {
			s.cut = true
			return
		}
		deg := sampleHeel(k, w.step)
		guess := w.start
		if n := len(s.sol); n > 0 {
			guess = hermitePlane(s.heels, s.sol, max(0, n-2), deg)
		}
		sh, lever, err := pr.leverAt(sgn, deg, guess)
		if err != nil {
			s.failDeg, s.failErr = deg, err
			w.limit(k)
			return
		}
		gz := sgn * lever
		if math.IsNaN(gz) || math.IsInf(gz, 0) {
			s.failDeg, s.nanLever = deg, true
			w.limit(k)
			return
		}
		n := len(s.heels)
		if s.cross < 0 && n > 0 && s.gz[n-1] > 0 && gz <= 0 && s.heels[n-1] >= w.eqDeg-1e-9 {
			vd, vgz, vs := pr.vanishing(sgn, s.heels[n-1], deg, s.gz[n-1], gz, s.sol[n-1], sh)
			s.van = vanishingAt{vd, vgz, vs}
			if vd-s.heels[n-1] > 1e-3 && deg-vd > 1e-3 {
				s.vanIx = n
				s.push(vd, vgz, vs)
			}
			s.cross = len(s.heels)
			w.limit(max(k, w.kMin))
		}
		s.push(deg, gz, sh)
		if s.cross >= 0 && deg >= gzMinEndDeg {
			return
		}
	}
}
