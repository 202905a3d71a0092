package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
	"heelwatch/vessels/largeship"
)

// TestOtherSideThinned: the other side's curve near upright is sampled
// every 3° (it is only read for criteria). Its criteria values agree with
// those of the same curve sampled every 1° within 1e-4 m·rad for areas,
// 1 mm for levers and 0.01° for angles (practice: the spline's error goes
// with the step cubed on a smooth curve and stays well under the precision
// to which criteria are read; the openings are found on planes interpolated
// between samples), on the bundled ships intact and with each compartment
// open in turn where she lies within NearUprightDeg, and on the large
// generated ship (invented) with its two compartments open. Each
// criterion's verdict is the same. The deck-edge and downflooding angles
// are found on the same 1° samples as on the finer curve, solved again
// from other guesses: they agree to 1e-4° (the solver's tolerance).
func TestOtherSideThinned(t *testing.T) {
	type ship struct {
		v    *engine.Vessel
		ds   []engine.Damage
		name string
	}
	var ships []ship
	for _, e := range vessels.Bundled() {
		v, _, err := vessels.Open(e.Name)
		if err != nil {
			t.Fatal(err)
		}
		ds := []engine.Damage{v.Intact()}
		for i := range v.Compartments {
			d := v.Intact()
			d[i].Open = true
			ds = append(ds, d)
		}
		ships = append(ships, ship{v, ds, e.Name})
	}
	if !testing.Short() {
		v, _, err := vessels.Parse("large.toml", largeship.TOML(largeship.Standard))
		if err != nil {
			t.Fatal(err)
		}
		d := v.Intact()
		for _, n := range largeship.Standard.OpenSpaces() {
			for i, c := range v.Compartments {
				if c.Name == n {
					d[i].Open = true
				}
			}
		}
		ships = append(ships, ship{v, []engine.Damage{d}, "large"})
	}
	tol := map[string]float64{"m·rad": 1e-4, "m": 1e-3, "°": 0.01}
	worst := map[string]float64{}
	cases := 0
	for _, s := range ships {
		for k, d := range s.ds {
			pos, err := engine.NewProblem(s.v, d).Equilibrium()
			if err != nil || math.Abs(pos.HeelDeg) < 1e-6 || math.Abs(pos.HeelDeg) >= engine.NearUprightDeg {
				continue
			}
			thin, full, err := engine.OtherSideBothWays(s.v, d, pos)
			if err != nil {
				t.Fatalf("%s case %d: %v", s.name, k, err)
			}
			cases++
			kc := engine.CriteriaCase{Eq: pos, Damaged: engine.IsDamaged(d)}
			kc.Curve = thin
			a, err := engine.EvaluateCriteria(s.v.CriteriaSets, kc)
			if err != nil {
				t.Fatal(err)
			}
			kc.Curve = full
			b, err := engine.EvaluateCriteria(s.v.CriteriaSets, kc)
			if err != nil || len(a) != len(b) {
				t.Fatalf("%s case %d: %d and %d criteria (%v)", s.name, k, len(a), len(b), err)
			}
			for i := range a {
				diff := math.Abs(a[i].Actual - b[i].Actual)
				if math.IsNaN(a[i].Actual) && math.IsNaN(b[i].Actual) {
					diff = 0
				}
				worst[a[i].Unit] = math.Max(worst[a[i].Unit], diff)
				lim, ok := tol[a[i].Unit]
				if !ok {
					lim = 1e-3 * math.Max(1, math.Abs(b[i].Actual))
				}
				if !(diff <= lim) || a[i].Pass != b[i].Pass {
					t.Errorf("%s case %d %s: %v (%v) from 3° samples, %v (%v) from 1°", s.name, k, a[i].Code, a[i].Actual, a[i].Pass, b[i].Actual, b[i].Pass)
				}
			}
			for _, q := range [][2]float64{{thin.GZMaxM, full.GZMaxM}, {thin.At(30), full.At(30)}} {
				if math.Abs(q[0]-q[1]) > 1e-3 {
					t.Errorf("%s case %d: GZ %v from 3° samples, %v from 1°", s.name, k, q[0], q[1])
				}
			}
			for _, q := range [][2]float64{{thin.VanishingDeg, full.VanishingDeg}, {thin.DownfloodingDeg, full.DownfloodingDeg}, {thin.DeckEdgeDeg, full.DeckEdgeDeg}} {
				if math.Abs(q[0]-q[1]) > 1e-4 {
					t.Errorf("%s case %d: angle %v from 3° samples, %v from 1°", s.name, k, q[0], q[1])
				}
			}
		}
	}
	if cases < 3 {
		t.Fatalf("only %d cases near upright", cases)
	}
	t.Logf("%d cases; largest differences by unit: %v", cases, worst)
}
