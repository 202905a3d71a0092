package engine

import "math"

// This file holds the not-a-knot cubic spline that joins the samples of a
// righting-lever curve: fitted once when the curve is made (GZCurve.fit),
// then evaluated, integrated and maximised exactly, piece by piece.

// cubicSpline is a piecewise cubic in Hermite form: values y and slopes s
// at the knots x (ascending).
type cubicSpline struct {
	x, y, s []float64
}

// fitSpline returns the not-a-knot cubic spline through (x, y): the cubic
// pieces of the first two and of the last two intervals are one cubic each
// (de Boor, A Practical Guide to Splines, ch. IV). The slopes solve the
// tridiagonal system of continuity of the second derivative:
// hᵢ sᵢ₋₁ + 2(hᵢ₋₁+hᵢ) sᵢ + hᵢ₋₁ sᵢ₊₁ = 3(hᵢ δᵢ₋₁ + hᵢ₋₁ δᵢ), with end rows
// h₁ s₀ + (h₀+h₁) s₁ = [h₁(2h₁+3h₀)δ₀ + h₀² δ₁]/(h₀+h₁) and its mirror.
// Two points give the chord, three the parabola.
func fitSpline(x, y []float64) cubicSpline {
	n := len(x)
	sp := cubicSpline{x: x, y: y, s: make([]float64, n)}
	switch n {
	case 0, 1:
		return sp
	case 2:
		d := (y[1] - y[0]) / (x[1] - x[0])
		sp.s[0], sp.s[1] = d, d
		return sp
	case 3:
		// The parabola through three points: slopes from divided differences.
		h0, h1 := x[1]-x[0], x[2]-x[1]
		d0, d1 := (y[1]-y[0])/h0, (y[2]-y[1])/h1
		c2 := (d1 - d0) / (h0 + h1)
		sp.s[0] = d0 - c2*h0
		sp.s[1] = d0 + c2*h0
		sp.s[2] = d1 + c2*h1
		return sp
	}
	h := make([]float64, n-1)
	d := make([]float64, n-1)
	for i := range h {
		h[i] = x[i+1] - x[i]
		d[i] = (y[i+1] - y[i]) / h[i]
	}
	lo := make([]float64, n) // sub-diagonal (row i, column i−1)
	di := make([]float64, n)
	up := make([]float64, n) // super-diagonal (row i, column i+1)
	r := make([]float64, n)
	di[0], up[0] = h[1], h[0]+h[1]
	r[0] = (h[1]*(2*h[1]+3*h[0])*d[0] + h[0]*h[0]*d[1]) / (h[0] + h[1])
	for i := 1; i < n-1; i++ {
		lo[i], di[i], up[i] = h[i], 2*(h[i-1]+h[i]), h[i-1]
		r[i] = 3 * (h[i]*d[i-1] + h[i-1]*d[i])
	}
	p, q := h[n-3], h[n-2]
	lo[n-1], di[n-1] = p+q, p
	r[n-1] = (p*(2*p+3*q)*d[n-2] + q*q*d[n-3]) / (p + q)
	// Thomas algorithm.
	for i := 1; i < n; i++ {
		m := lo[i] / di[i-1]
		di[i] -= m * up[i-1]
		r[i] -= m * r[i-1]
	}
	sp.s[n-1] = r[n-1] / di[n-1]
	for i := n - 2; i >= 0; i-- {
		sp.s[i] = (r[i] - up[i]*sp.s[i+1]) / di[i]
	}
	return sp
}

// interval returns the index i of the piece [x[i], x[i+1]] that holds t.
func (sp cubicSpline) interval(t float64) int {
	lo, hi := 0, len(sp.x)-2
	for lo < hi {
		m := (lo + hi + 1) / 2
		if sp.x[m] <= t {
			lo = m
		} else {
			hi = m - 1
		}
	}
	return lo
}

// piece evaluates piece i at local u ∈ [0, 1]: value and derivative in x.
func (sp cubicSpline) piece(i int, u float64) (float64, float64) {
	h := sp.x[i+1] - sp.x[i]
	y0, y1, s0, s1 := sp.y[i], sp.y[i+1], sp.s[i]*h, sp.s[i+1]*h
	u2, u3 := u*u, u*u*u
	v := y0*(2*u3-3*u2+1) + s0*(u3-2*u2+u) + y1*(3*u2-2*u3) + s1*(u3-u2)
	dv := y0*(6*u2-6*u) + s0*(3*u2-4*u+1) + y1*(6*u-6*u2) + s1*(3*u2-2*u)
	return v, dv / h
}

// pieceIntegral is ∫ from x[i] to x[i] + u·h of piece i.
func (sp cubicSpline) pieceIntegral(i int, u float64) float64 {
	h := sp.x[i+1] - sp.x[i]
	y0, y1, s0, s1 := sp.y[i], sp.y[i+1], sp.s[i]*h, sp.s[i+1]*h
	u2, u3, u4 := u*u, u*u*u, u*u*u*u
	return h * (y0*(u4/2-u3+u) + s0*(u4/4-2*u3/3+u2/2) + y1*(u3-u4/2) + s1*(u4/4-u3/3))
}

func (sp cubicSpline) at(t float64) float64 {
	switch len(sp.x) {
	case 0:
		return 0
	case 1:
		return sp.y[0]
	}
	t = math.Max(sp.x[0], math.Min(t, sp.x[len(sp.x)-1]))
	i := sp.interval(t)
	v, _ := sp.piece(i, (t-sp.x[i])/(sp.x[i+1]-sp.x[i]))
	return v
}

// integral is ∫ₐᵇ of the spline, the range clipped to the knots.
func (sp cubicSpline) integral(a, b float64) float64 {
	if len(sp.x) < 2 {
		return 0
	}
	a = math.Max(a, sp.x[0])
	b = math.Min(b, sp.x[len(sp.x)-1])
	if !(b > a) {
		return 0
	}
	prim := func(t float64) float64 { // ∫ from x[i] to t, and the index
		i := sp.interval(t)
		return sp.pieceIntegral(i, (t-sp.x[i])/(sp.x[i+1]-sp.x[i]))
	}
	ia, ib := sp.interval(a), sp.interval(b)
	if ia == ib {
		return prim(b) - prim(a)
	}
	sum := sp.pieceIntegral(ia, 1) - prim(a)
	for i := ia + 1; i < ib; i++ {
		sum += sp.pieceIntegral(i, 1)
	}
	return sum + prim(b)
}

// max returns where on [a, b] (inside the knots) the spline is largest:
// the ends and every interior root of each piece's derivative (a quadratic
// in u) are compared.
func (sp cubicSpline) max(a, b float64) (float64, float64) {
	if len(sp.x) == 1 {
		return sp.x[0], sp.y[0]
	}
	bx, by := a, sp.at(a)
	try := func(t float64) {
		if t >= a && t <= b {
			if v := sp.at(t); v > by {
				bx, by = t, v
			}
		}
	}
	try(b)
	for i := sp.interval(a); i <= sp.interval(b) && i < len(sp.x)-1; i++ {
		try(sp.x[i])
		h := sp.x[i+1] - sp.x[i]
		y0, y1, s0, s1 := sp.y[i], sp.y[i+1], sp.s[i]*h, sp.s[i+1]*h
		// d/du of the piece: qa u² + qb u + qc.
		qa := 6*y0 + 3*s0 - 6*y1 + 3*s1
		qb := -6*y0 - 4*s0 + 6*y1 - 2*s1
		qc := s0
		for _, u := range quadRoots(qa, qb, qc) {
			if u > 0 && u < 1 {
				try(sp.x[i] + u*h)
			}
		}
	}
	return bx, by
}

// quadRoots returns the real roots of a u² + b u + c (a linear or constant
// equation when a = 0), computed without cancellation.
func quadRoots(a, b, c float64) []float64 {
	if a == 0 {
		if b == 0 {
			return nil
		}
		return []float64{-c / b}
	}
	disc := b*b - 4*a*c
	if disc < 0 {
		return nil
	}
	q := -(b + math.Copysign(math.Sqrt(disc), b)) / 2
	out := []float64{q / a}
	if q != 0 {
		out = append(out, c/q)
	}
	return out
}
