package engine

import "math"

// boundedLeastSquares minimises Σ r(x)² over lo ≤ x ≤ hi (at most three
// unknowns) by Levenberg–Marquardt with a forward-difference Jacobian
// (steps h) and each trial step clipped to the bounds (projected). res
// returns ok = false where the model has no answer (the ship does not
// float): such a trial is refused and the damping raised. It returns the
// best x found and its residuals; ok is false if x0 itself has no answer.
//
// The method is the textbook one (Levenberg 1944, Marquardt 1963); the
// damping is scaled by the diagonal of JᵀJ, and a variable at a bound that
// the gradient pushes outward is held there for the step (an active set).
//
// It stops early once Σ r² falls to enough (0: only at convergence).
func boundedLeastSquares(x0, lo, hi, h []float64, maxIt int, enough float64, res func(x []float64) ([]float64, bool)) ([]float64, []float64, bool) {
	k := len(x0)
	x := append([]float64(nil), x0...)
	clipTo(x, lo, hi)
	r, ok := res(x)
	if !ok {
		return x, nil, false
	}
	cost := sumSq(r)
	lambda := 1e-3
	for it := 0; it < maxIt && cost > enough; it++ {
		// Jacobian by forward differences, stepping inward at a bound.
		J := make([][]float64, len(r))
		for i := range J {
			J[i] = make([]float64, k)
		}
		for j := 0; j < k; j++ {
			xp := append([]float64(nil), x...)
			step := h[j]
			if xp[j]+step > hi[j] {
				step = -step
			}
			xp[j] += step
			rp, ok := res(xp)
			if !ok {
				// The other way, if it stays within the bounds (the first
				// step may already have been turned inward at a bound).
				step = -step
				xp[j] = x[j] + step
				if xp[j] < lo[j] || xp[j] > hi[j] {
					return x, r, true
				}
				if rp, ok = res(xp); !ok {
					return x, r, true
				}
			}
			for i := range r {
				J[i][j] = (rp[i] - r[i]) / step
			}
		}
		var a [3][3]float64
		var g [3]float64
		for i := range r {
			for p := 0; p < k; p++ {
				g[p] += J[i][p] * r[i]
				for q := 0; q < k; q++ {
					a[p][q] += J[i][p] * J[i][q]
				}
			}
		}
		// A variable at a bound that the descent would push further out
		// is held there (the active set), so that the others can move.
		var held [3]bool
		for p := 0; p < k; p++ {
			held[p] = (x[p] <= lo[p] && g[p] > 0) || (x[p] >= hi[p] && g[p] < 0)
		}
		improved := false
		for try := 0; try < 8; try++ {
			var m [3][3]float64
			var b [3]float64
			for p := 0; p < k; p++ {
				if held[p] {
					m[p][p] = 1
					continue
				}
				for q := 0; q < k; q++ {
					if !held[q] {
						m[p][q] = a[p][q]
					}
				}
				m[p][p] += lambda * math.Max(a[p][p], 1e-12)
				b[p] = -g[p]
			}
			for p := k; p < 3; p++ {
				m[p][p] = 1
			}
			dx, ok := solve3(m, b)
			if !ok {
				lambda *= 10
				continue
			}
			xn := append([]float64(nil), x...)
			for p := 0; p < k; p++ {
				xn[p] += dx[p]
			}
			clipTo(xn, lo, hi)
			rn, ok := res(xn)
			if cn := sumSq(rn); ok && cn < cost {
				// Converged: the step is a small part of the difference
				// step and the misfit hardly fell.
				small := cost-cn <= 1e-4*cost
				for p := 0; p < k; p++ {
					if math.Abs(xn[p]-x[p]) > 1e-3*h[p] {
						small = false
					}
				}
				x, r, cost = xn, rn, cn
				lambda = math.Max(lambda/10, 1e-9)
				improved = true
				if small {
					return x, r, true
				}
				break
			}
			lambda *= 10
		}
		if !improved {
			break
		}
	}
	return x, r, true
}

func clipTo(x, lo, hi []float64) {
	for i := range x {
		x[i] = math.Max(lo[i], math.Min(hi[i], x[i]))
	}
}

func sumSq(r []float64) float64 {
	var s float64
	for _, v := range r {
		s += v * v
	}
	return s
}
