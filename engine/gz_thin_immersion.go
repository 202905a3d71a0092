package engine

import (
	"math"
	"sort"
)

// This file finds where a point first goes under the water on a curve
// sampled more coarsely than gzStepDeg (the other side's curve near
// upright, gz_sides.go) as it would be found on the curve sampled every
// gzStepDeg: the interpolated planes firstImmersion bisects on depend on
// the samples around the crossing, so those samples are solved.

// firstImmersionStep is firstImmersion on the curve's samples (heels, sol)
// taken every stepDeg. When stepDeg is gzStepDeg it is firstImmersion.
// Otherwise the pair of samples that brackets the first immersion is
// found, the heels of the gzStepDeg grid from one step before the
// bracket to its end are solved (each from the samples' Hermite plane),
// and firstImmersion is run on them and the curve's samples within that
// span (the angle of vanishing stability among them): the same samples, to the solver's tolerance, as those the finer
// curve has there. A point that dips under and comes up again between
// two coarse samples is not seen, as between two fine ones.
func (pr *Problem) firstImmersionStep(sgn float64, heels []float64, sol []solvedHeel, pts []immersionPoint, stepDeg float64) (float64, string) {
	if stepDeg == gzStepDeg || len(pts) == 0 {
		return firstImmersion(sgn, heels, sol, pts)
	}
	under := func(p Plane) bool {
		for _, q := range pts {
			if p.Height(q.x, q.y, q.z) < 0 {
				return true
			}
		}
		return false
	}
	k := 0
	for k < len(heels) && !under(sol[k].p) {
		k++
	}
	if k == 0 || k == len(heels) {
		return firstImmersion(sgn, heels, sol, pts)
	}
	lo, hi := heels[k-1], heels[k]
	from := math.Max(0, math.Floor(lo/gzStepDeg+1e-9)-1) * gzStepDeg
	var lh []float64
	var ls []solvedHeel
	for g := from; g < hi-1e-9; g += gzStepDeg {
		if sampleAt(heels, g) >= 0 {
			continue
		}
		i := max(0, min(sampleBefore(heels, g), len(heels)-2))
		sh, _, err := pr.leverAt(sgn, g, hermitePlane(heels, sol, i, g))
		if err != nil {
			return firstImmersion(sgn, heels, sol, pts)
		}
		lh, ls = append(lh, g), append(ls, sh)
	}
	for i := range heels {
		if heels[i] >= from-1e-9 && heels[i] <= hi {
			lh, ls = append(lh, heels[i]), append(ls, sol[i])
		}
	}
	idx := make([]int, len(lh))
	for i := range idx {
		idx[i] = i
	}
	sort.Slice(idx, func(a, b int) bool { return lh[idx[a]] < lh[idx[b]] })
	sh := make([]float64, len(lh))
	ss := make([]solvedHeel, len(lh))
	for i, o := range idx {
		sh[i], ss[i] = lh[o], ls[o]
	}
	// A sample before the bracket that is under already (the point came up
	// again) would be taken as the immersion: start at the bracket then.
	for len(sh) > 1 && sh[0] < lo-1e-9 && under(ss[0].p) {
		sh, ss = sh[1:], ss[1:]
	}
	return firstImmersion(sgn, sh, ss, pts)
}

// sampleAt returns the index of the heel equal to deg (to 1e-9°), or −1.
func sampleAt(heels []float64, deg float64) int {
	for i, h := range heels {
		if math.Abs(h-deg) <= 1e-9 {
			return i
		}
	}
	return -1
}

// sampleBefore returns the index of the last heel below deg, or −1.
func sampleBefore(heels []float64, deg float64) int {
	i := -1
	for k, h := range heels {
		if h < deg {
			i = k
		}
	}
	return i
}
