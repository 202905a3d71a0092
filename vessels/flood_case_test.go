package vessels

import (
	"math"
	"testing"
)

// TestResolveFlood: where the hole and the pumps come from, and what is
// refused, by the one rule set of the command line and the dashboard
// (the bundled freighter: Wing tank 2 S has a file hole of 0.08 m² at
// z 2.0 m, C_d 0.7, and pump_m3h 120).
func TestResolveFlood(t *testing.T) {
	v, info, err := Open(Default)
	if err != nil {
		t.Fatal(err)
	}
	ci := -1
	for i, c := range v.Compartments {
		if c.Name == "Wing tank 2 S" {
			ci = i
		}
	}
	if ci < 0 || info.Compartments[ci].Hole == nil {
		t.Fatal("the bundled freighter has no Wing tank 2 S with a hole")
	}
	fh := *info.Compartments[ci].Hole
	nan := math.NaN()
	ask := func(area, z, cd float64, pumps []FloodPump) FloodAsk {
		return FloodAsk{Compartment: ci, AreaM2: area, ZM: z, Cd: cd, Pumps: pumps, By: "dashboard"}
	}
	for _, tc := range []struct {
		name      string
		ask       FloodAsk
		holeFrom  string
		pumpsFrom string
		area, z   float64
		cd, pumps float64
	}{
		{"all from the file", ask(nan, nan, nan, nil), "vessel file", "vessel file", fh.AreaM2, fh.ZM, fh.Cd, 120},
		{"the file's hole at its own height", ask(0.2, fh.ZM+0.004, nan, nil), "vessel file's position, area from the dashboard", "vessel file", 0.2, fh.ZM, fh.Cd, 120},
		{"a shell hole elsewhere keeps the file's C_d", ask(0.2, 4.0, nan, []FloodPump{{ci, 0}}), "dashboard", "dashboard", 0.2, 4.0, fh.Cd, 0},
		{"C_d given", ask(0.2, 4.0, 0.65, []FloodPump{{ci, 50}, {ci, 25}}), "dashboard", "dashboard", 0.2, 4.0, 0.65, 75},
	} {
		t.Run(tc.name, func(t *testing.T) {
			got, err := ResolveFlood(v, info, tc.ask)
			if err != nil {
				t.Fatal(err)
			}
			h := got.Case.Hole
			var pumps float64
			for _, p := range got.Case.Pumps {
				pumps += p.CapacityM3h
			}
			if got.HoleFrom != tc.holeFrom || got.PumpsFrom != tc.pumpsFrom || h.AreaM2 != tc.area ||
				math.Abs(h.ZM-tc.z) > 1e-9 || h.Cd != tc.cd || pumps != tc.pumps {
				t.Errorf("hole %+v from %q, pumps %v from %q; want area %v z %v C_d %v from %q, pumps %v from %q",
					h, got.HoleFrom, pumps, got.PumpsFrom, tc.area, tc.z, tc.cd, tc.holeFrom, tc.pumps, tc.pumpsFrom)
			}
		})
	}
	open := v.Intact()
	open[ci].Open = true
	for _, tc := range []struct {
		name  string
		ask   FloodAsk
		field FloodField
	}{
		{"no area", ask(0, nan, nan, nil), FieldArea},
		{"over 100 m²", ask(101, nan, nan, nil), FieldArea},
		{"height outside", ask(0.1, 30, nan, nil), FieldZ},
		{"C_d above 1", ask(0.1, nan, 1.5, nil), FieldCd},
		{"negative pump", ask(0.1, nan, nan, []FloodPump{{ci, -5}}), FieldPumps},
		{"pump on another compartment", ask(0.1, nan, nan, []FloodPump{{0, 5}}), FieldPumps},
		{"open already", FloodAsk{Compartment: ci, AreaM2: nan, ZM: nan, Cd: nan, Base: open}, FieldBase},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := ResolveFlood(v, info, tc.ask)
			if e := AsFloodAskError(err); e == nil || e.Field != tc.field || e.Msg == "" {
				t.Errorf("error %v, want one about field %d", err, tc.field)
			}
		})
	}
}
