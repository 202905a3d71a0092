package engine

import (
	"math"
	"testing"
)

// TestTrimScan: the upright trim scan that backs up Newton. With the aft
// 25 m of a 60 × 12 × 6 m box at 3 m draft open full depth, the body left
// (x = 25…60 m) must hold 2160 of its 2520 m³, and its centre of buoyancy
// cannot come aft of (2520·42.5 − 360·55)/2160 ≈ 40.4 m, forward of G at
// 30 m (worked by hand): she founders by the stern. With only the aft 5 m
// open she floats, trimmed by the stern, where Solve puts her.
func TestTrimScan(t *testing.T) {
	h, err := NewBoxHull(60, 12, 6)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		hold  float64
		found bool
		end   string
	}{{25, false, "stern"}, {5, true, ""}} {
		comp, err := NewCompartment(h, "hold", Box{X0: 0, X1: c.hold, Y0: -6, Y1: 6, Z0: 0, Z1: 6})
		if err != nil {
			t.Fatal(err)
		}
		v, err := NewVessel(Vessel{Name: "box", Hull: h, Compartments: []*Compartment{comp},
			Weights: []Weight{{Name: "box", MassT: 60 * 12 * 3 * SeaWaterDensity, LCGM: 30, VCGM: 3}}})
		if err != nil {
			t.Fatal(err)
		}
		d := v.Intact()
		d[0].Open = true
		pr := NewProblem(v, d)
		st, found, end := pr.trimScan(pr.upright())
		if found != c.found || end != c.end {
			t.Fatalf("hold %.0f m: found %v, end %q; want %v, %q", c.hold, found, end, c.found, c.end)
		}
		if !found {
			continue
		}
		pos, err := Solve(v, d)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(st.p.A-pos.Plane.A) > 1e-7 || math.Abs(st.p.B-pos.Plane.B) > 1e-9 || pos.TrimM <= 0 {
			t.Errorf("hold %.0f m: scan plane %+v, solve %+v (trim %.4f m)", c.hold, st.p, pos.Plane, pos.TrimM)
		}
	}
}
