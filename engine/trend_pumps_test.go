package engine_test

import (
	"math"
	"math/rand"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestTrendPumpsHoldOnlyAtPresentInflow: Wing tank 2 S of the bundled demo
// freighter (invented) floods through its file's hole; the crew reads at
// 0, 3 and 6 min from 90 s and from 300 s after the breach, when the water
// still rises at several hundred m³/h (from 300 s the old test of the
// inflow at the latest head alone said "uncertain" at 420 m³/h). The file's pumps (120 m³/h) can hold it only if
// they take at least the present inflow; by Torricelli, Q = C_d·A·√(2 g h),
// they balance a 0.08 m², C_d 0.7 hole only at h = (Q/(C_d·A))²/(2 g),
// about 2 cm. The trend must say "no", give that head, and when the level
// gets there.
func TestTrendPumpsHoldOnlyAtPresentInflow(t *testing.T) {
	for _, t0 := range []float64{90, 300} {
		v, info, err := vessels.Open("freighter")
		if err != nil {
			t.Fatal(err)
		}
		ci := -1
		for i, c := range v.Compartments {
			if c.Name == "Wing tank 2 S" {
				ci = i
			}
		}
		hole := *info.Compartments[ci].Hole
		rep, err := engine.RunFlood(engine.FloodCase{Vessel: v, Base: v.Intact(), Compartment: ci, Hole: hole}, nil)
		if err != nil {
			t.Fatal(err)
		}
		rng := rand.New(rand.NewSource(3))
		var rs []engine.Reading
		var water []float64
		for _, m := range []float64{0, 3, 6} {
			w := waterAt(rep, t0+60*m)
			water = append(water, w)
			d := v.Intact()
			d[ci].WaterM3 = w
			pos, err := engine.Solve(v, d)
			if err != nil {
				t.Fatal(err)
			}
			rs = append(rs, crewReading(v, pos, m, rng))
		}
		res, err := engine.Diagnose(v, rs, engine.DiagnoseOptions{})
		if err != nil || len(res.Explanations) == 0 {
			t.Fatal(err)
		}
		o := info.TrendOptions()
		tr, err := engine.EstimateTrend(v, rs, res.Explanations[0], o)
		if err != nil {
			t.Fatal(err)
		}
		lastRate := (water[2] - water[1]) / 3 * 60
		t.Logf("t0 %.0f s: truth last interval %.0f m³/h; estimate %.0f, now %.0f m³/h, pumps %.0f, hold %q, balance head %.4f m in %.0f s",
			t0, lastRate, tr.InflowM3h, tr.InflowNowM3h, tr.PumpsM3h, tr.PumpsHold, tr.BalanceHeadM, tr.BalanceS)
		if lastRate > 2*tr.PumpsM3h && tr.PumpsHold != "no" {
			t.Errorf("t0 %.0f s: water rising at %.0f m³/h, pumps %.0f m³/h: said %q", t0, lastRate, tr.PumpsM3h, tr.PumpsHold)
		}
		// Torricelli: the head at which C_d·A·√(2 g h) is the pumps' capacity.
		q := tr.PumpsM3h / 3600
		want := math.Pow(q/(tr.Hole.Cd*tr.Hole.AreaM2), 2) / (2 * engine.StandardGravity)
		if math.Abs(tr.BalanceHeadM-want) > 1e-9 || !(tr.BalanceHeadM < 0.05) {
			t.Errorf("balance head %.4f m, Torricelli gives %.4f m", tr.BalanceHeadM, want)
		}
		if !(tr.BalanceS > 0) {
			t.Errorf("time to the balance head %v, want > 0", tr.BalanceS)
		}
	}
}
