package vessels

import (
	"heelwatch/engine"
)

// This file reads what a vessel file says for the hull girder's strength:
// a weight's extent x = [aft, fwd] and the [strength] table of read-out
// points with their permissible values at sea and in harbour (FORMAT.md,
// "Hull girder strength").

// strengthLimits are the accepted values of [strength] limits.
var strengthLimits = []string{"sea", "harbour"}

// weightExtent reads a weight's optional x = [aft, fwd]: it must lie within
// the hull and hold the weight's lcg strictly inside (the mass is spread
// over it with its centre at the lcg). Zero when absent or refused.
func (r *reader) weightExtent(t *table, lcg float64, lcgOK bool, hull *engine.Hull) [2]float64 {
	if _, present := t.get("x"); !present { // asked, so that x is among the keys a message lists
		return [2]float64{}
	}
	x, ok := t.bounds("x", "aft and forward ends of the stretch the mass is spread over")
	if !ok {
		return [2]float64{}
	}
	if hull != nil {
		if x0, x1 := hullSpan(hull); x[0] < x0-1e-6 || x[1] > x1+1e-6 {
			r.addf(t.keyPath("x"), "[%g, %g] reaches beyond the hull, which runs from x = %g to %g m", x[0], x[1], x0, x1)
			return [2]float64{}
		}
	}
	if lcgOK && !(lcg > x[0] && lcg < x[1]) {
		r.addf(t.keyPath("x"), "[%g, %g] does not hold the weight's lcg %g m: the mass is spread over x with its centre at lcg, so lcg must lie strictly inside", x[0], x[1], lcg)
		return [2]float64{}
	}
	return x
}

// hullSpan returns the hull's aft and forward ends (its first and last
// stations).
func hullSpan(h *engine.Hull) (float64, float64) {
	st := h.Stations()
	return st[0].X, st[len(st)-1].X
}

// girder reads the optional [strength] table: limits = "sea" | "harbour"
// and [[strength.point]] entries, each with name, x and the permissible
// values shear_sea, hog_sea, sag_sea, shear_harbour, hog_harbour,
// sag_harbour (kN and kN·m, magnitudes, each optional).
func (r *reader) girder(root *table, hull *engine.Hull) engine.GirderLimits {
	var g engine.GirderLimits
	t, ok := root.sub("strength", false, "the hull girder's read-out points and permissible values")
	if !ok {
		return g
	}
	defer t.finish()
	if s, ok := t.choice("limits", false, strengthLimits); ok {
		g.Harbour = s == "harbour"
	}
	names := map[string]string{}
	for _, pt := range t.entries("point", "a read-out point: name, x and permissible values") {
		var p engine.ReadOutPoint
		p.Name, _ = r.name(pt, names, "read-out point")
		x, xOK := pt.num("x", "m from the aft perpendicular", true)
		p.XM = x
		if xOK && hull != nil {
			if x0, x1 := hullSpan(hull); x < x0 || x > x1 {
				r.addf(pt.keyPath("x"), "%g m lies outside the hull, which runs from x = %g to %g m", x, x0, x1)
			}
		}
		p.Sea.ShearKN = r.permissible(pt, "shear_sea", "kN")
		p.Sea.HogKNm = r.permissible(pt, "hog_sea", "kN·m")
		p.Sea.SagKNm = r.permissible(pt, "sag_sea", "kN·m")
		p.Harbour.ShearKN = r.permissible(pt, "shear_harbour", "kN")
		p.Harbour.HogKNm = r.permissible(pt, "hog_harbour", "kN·m")
		p.Harbour.SagKNm = r.permissible(pt, "sag_harbour", "kN·m")
		pt.finish()
		g.Points = append(g.Points, p)
	}
	return g
}

// permissible reads one optional permissible value: a magnitude above zero.
func (r *reader) permissible(t *table, key, unit string) float64 {
	f, ok := t.positive(key, unit+", a magnitude", false)
	if !ok {
		return 0
	}
	return f
}
