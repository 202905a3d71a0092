package engine_test

// The trend's hidden truth: a compartment of a bundled ship (invented demo
// vessels) floods through a hole of random size at its lowest point on the
// shell (a flooding run, FloodRun, is the truth); the crew reads the ship
// at three times while it fills (marks ±1 cm written to the centimetre,
// heel ±0.2°, as in the diagnosis harness); the readings are diagnosed and
// the trend estimated. The estimated inflow is compared with the true mean
// inflow between the first and last reading.

import (
	"math"
	"math/rand"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// waterAt interpolates the run's water linearly in its trace.
func waterAt(rep engine.FloodReport, t float64) float64 {
	tr := rep.Trace
	for i := 1; i < len(tr); i++ {
		if tr[i].TimeS >= t {
			a, b := tr[i-1], tr[i]
			return a.WaterM3 + (b.WaterM3-a.WaterM3)*(t-a.TimeS)/(b.TimeS-a.TimeS)
		}
	}
	return tr[len(tr)-1].WaterM3
}

// trendCase runs one case; ok is false when the draw makes no case (the
// compartment cannot flood from its bottom, she is lost at once, …).
func trendCase(t *testing.T, v *engine.Vessel, rng *rand.Rand) (est, truth float64, ok bool) {
	pool := searchable(v)
	ci := pool[rng.Intn(len(pool))]
	mu := 0.6 + 0.38*rng.Float64()
	area := 0.02 + 0.18*rng.Float64()
	hole, err := engine.ShellHole(v, ci, area, math.NaN(), 0.6+0.1*rng.Float64())
	if err != nil {
		return 0, 0, false
	}
	base := v.Intact()
	base[ci] = engine.SpaceState{Permeability: mu}
	rep, err := engine.RunFlood(engine.FloodCase{Vessel: v, Base: base, Compartment: ci, Hole: hole, LimitS: 6 * 3600}, nil)
	if err != nil || rep.End == engine.FloodNoInflow || len(rep.Trace) < 3 {
		return 0, 0, false
	}
	T := rep.EndS
	if rep.End == engine.FloodEqualised && rep.EqualiseS > 0 {
		T = rep.EqualiseS
	}
	times := []float64{0.15 * T, 0.3 * T, 0.45 * T}
	var rs []engine.Reading
	var w []float64
	for _, ts := range times {
		d := append(engine.Damage(nil), base...)
		d[ci].WaterM3 = math.Max(waterAt(rep, ts), 1e-6)
		w = append(w, d[ci].WaterM3)
		pos, err := engine.Solve(v, d)
		if err != nil {
			return 0, 0, false
		}
		rs = append(rs, crewReading(v, pos, (ts-times[0])/60, rng))
	}
	// The marks must see the water come in: 3 cm of mean sinkage at least.
	intact, _ := engine.Solve(v, v.Intact())
	if (w[2]-w[0])*v.WaterDensity/(v.WaterDensity*intact.WaterplaneAreaM2) < 0.03 {
		return 0, 0, false
	}
	dg, err := engine.Diagnose(v, rs, engine.DiagnoseOptions{MaxGroup: 2})
	if err != nil || len(dg.Explanations) == 0 || len(dg.Explanations[0].Spaces) == 0 {
		return 0, 0, false
	}
	tr, err := engine.EstimateTrend(v, rs, dg.Explanations[0], engine.TrendOptions{LimitS: 2 * 3600})
	if err != nil {
		t.Logf("trend: %v", err)
		return 0, 0, false
	}
	truth = (w[2] - w[0]) / (times[2] - times[0]) * 3600
	if testing.Verbose() && math.Abs(tr.InflowM3h/truth-1) > 0.25 {
		t.Logf("%s: inflow %.0f ± %.0f m³/h, truth %.0f m³/h (diagnosed %s)", v.Compartments[ci].Name, tr.InflowM3h, tr.InflowSDM3h, truth, dg.Explanations[0].Names(v))
	}
	return tr.InflowM3h, truth, true
}

// TestTrendHiddenTruth: the inflow must come within 25 % of the truth
// (issue 14) in at least 90 % of the cases.
func TestTrendHiddenTruth(t *testing.T) {
	n := 2
	if *diagnoseCases > 0 {
		n = *diagnoseCases / 2
	} else if testing.Short() {
		n = 1
	}
	var all, within float64
	for _, ship := range []string{"freighter", "barge", "ferry"} {
		v, _, err := vessels.Open(ship)
		if err != nil {
			t.Fatal(err)
		}
		rng := rand.New(rand.NewSource(int64(len(ship))))
		var used, ok25 int
		var worst float64
		for used < n {
			est, truth, ok := trendCase(t, v, rng)
			if !ok {
				continue
			}
			used++
			e := math.Abs(est/truth - 1)
			worst = math.Max(worst, e)
			if e <= 0.25 {
				ok25++
			}
		}
		t.Logf("%s: %d cases, inflow within 25 %% in %d; worst error %.0f %%", ship, used, ok25, 100*worst)
		all += float64(used)
		within += float64(ok25)
	}
	t.Logf("all ships: inflow within 25 %% in %.0f %% of %.0f cases", 100*within/all, all)
	if within/all < 0.9 {
		t.Errorf("inflow within 25 %% in only %.0f %% of the cases", 100*within/all)
	}
}
