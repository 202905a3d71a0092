package engine_test

// Holed tanks under the capacity rule of the conventions (issue 10, item
// 2): a tank's capacity is μ × its volume inside the hull, and fill a
// fraction of it.

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// holedTankBarge is a box barge 60 × 12 × 6 m with a wing tank on the
// starboard side in the double bottom, 20 × 4 × 1 m, permeability 0.95,
// holding the liquid given at the fill given.
func holedTankBarge(t *testing.T, liq engine.Liquid) *engine.Vessel {
	t.Helper()
	h, err := engine.NewBoxHull(60, 12, 6)
	if err != nil {
		t.Fatal(err)
	}
	c, err := engine.NewCompartment(h, "DB 2 S", engine.Box{X0: 20, X1: 40, Y0: 2, Y1: 6, Z0: 0, Z1: 1})
	if err != nil {
		t.Fatal(err)
	}
	c.Use, c.Permeability, c.Liquid = "tank", 0.95, &liq
	v, err := engine.NewVessel(engine.Vessel{Name: "holed tank barge (invented)", Hull: h, Compartments: []*engine.Compartment{c},
		Weights: []engine.Weight{{Name: "barge", MassT: 60 * 12 * 2.5 * engine.SeaWaterDensity, LCGM: 29, TCGM: -0.05, VCGM: 3}}})
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// TestFullBallastTankHoledChangesNothing: a tank pressed full of sea water
// and holed wholly below the water loses μ·V of buoyancy and μ·V·ρ of
// weight at the same centre, so drafts, heel and trim stay as they were to
// round-off (the conventions' rule; Archimedes: the sea water inside is
// neutral). Before the rule the contents filled all of V and she listed
// away from the damage.
func TestFullBallastTankHoledChangesNothing(t *testing.T) {
	v := holedTankBarge(t, engine.Liquid{Name: "sea water ballast", Density: engine.SeaWaterDensity, Fill: 1})
	m, _, _, _, _ := v.TankContents(0)
	if want := 0.95 * 20 * 4 * 1 * engine.SeaWaterDensity; math.Abs(m-want) > 1e-9*want {
		t.Fatalf("contents %.6f t, want μ·V·ρ = %.6f t", m, want)
	}
	intact, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	d := v.Intact()
	d[0].Open = true
	a := engine.Assess(v, d)
	if a.Position == nil {
		t.Fatal("no position holed")
	}
	p := a.Position
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"draft aft", p.DraftAftM, intact.DraftAftM},
		{"draft amidships", p.DraftMidM, intact.DraftMidM},
		{"draft forward", p.DraftFwdM, intact.DraftFwdM},
		{"heel", p.HeelDeg, intact.HeelDeg},
		{"trim", p.TrimM, intact.TrimM},
		// GM is per the ship's weight, which no longer holds the ballast
		// (lost buoyancy): the righting moment Δ·GM is what stays
		// (references.md, lost buoyancy vs added weight), here to 1e-7 t·m
		// per tonne.
		{"Δ·GM upright / Δ intact", p.DisplacementT * p.GMUprightM / intact.DisplacementT, intact.GMUprightM},
	} {
		if math.Abs(c.got-c.want) > 1e-7 {
			t.Errorf("%s holed %.9f, intact %.9f", c.what, c.got, c.want)
		}
	}
	if len(a.Spills) != 0 {
		t.Errorf("sea water reported as a spill: %+v", a.Spills)
	}
	// The same as a flooding run: the tank starts full, nothing moves, no
	// stage of a filling that never happens, no level said to rise.
	rep, err := engine.RunFlood(engine.FloodCase{Vessel: v, Compartment: 0, Hole: engine.Hole{AreaM2: 0.05, XM: 30, YM: 6, ZM: 0.5}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if rep.Final.Position == nil || math.Abs(rep.Final.Position.HeelDeg-intact.HeelDeg) > 1e-7 || math.Abs(rep.Final.Position.DraftMidM-intact.DraftMidM) > 1e-7 {
		t.Errorf("flooding run ends %v at %+v", rep.End, rep.Final.Position)
	}
	if len(rep.Stages) != 1 {
		t.Errorf("%d stages shown for a tank that was full from the start; want the end only", len(rep.Stages))
	}
	if strings.Contains(rep.EndReason, "risen") {
		t.Errorf("end reason %q says a level rose", rep.EndReason)
	}
}

// TestHoledFuelTankSpills: a fuel tank holed below the water loses its
// contents by the simpler rule, says so, and reports what may escape with
// a caution to report the pollution.
func TestHoledFuelTankSpills(t *testing.T) {
	v := holedTankBarge(t, engine.Liquid{Name: "heavy fuel oil", Density: 0.95, Fill: 0.8})
	d := v.Intact()
	d[0].Open = true
	a := engine.Assess(v, d)
	want := 0.8 * 0.95 * 20 * 4 * 1 * 0.95
	if len(a.Spills) != 1 || a.Spills[0].Compartment != "DB 2 S" || math.Abs(a.Spills[0].MassT-want) > 1e-9 {
		t.Fatalf("spills %+v; want DB 2 S %.3f t", a.Spills, want)
	}
	found := false
	for _, f := range a.Flags {
		if f.Code == engine.FlagSpill {
			found = true
			if !strings.Contains(f.Message, "Report the pollution") || !strings.Contains(f.Message, "simpler rule") {
				t.Errorf("spill flag %q: want the caution and the rule", f.Message)
			}
		}
	}
	if !found {
		t.Error("no spill flag")
	}
}

// TestHoledBallastSaysTheBasis: the full ballast tank holed, the GM shown
// rises though nothing moves (lost-buoyancy basis), and a note says by how
// much the ship weight fell: exactly the displacement lost, μ·V·ρ. A tank
// of fuel oil holed gives the spill caution instead, and an empty ballast
// tank no note.
func TestHoledBallastSaysTheBasis(t *testing.T) {
	v := holedTankBarge(t, engine.Liquid{Name: "sea water ballast", Density: engine.SeaWaterDensity, Fill: 1})
	intact, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	d := v.Intact()
	d[0].Open = true
	a := engine.Assess(v, d)
	if a.Position == nil {
		t.Fatal("no position holed")
	}
	lost := intact.DisplacementT - a.Position.DisplacementT
	var note *engine.Flag
	for i, f := range a.Flags {
		if f.Code == engine.FlagBallastHoled {
			note = &a.Flags[i]
		}
	}
	if note == nil {
		t.Fatalf("no %s note: %+v", engine.FlagBallastHoled, a.Flags)
	}
	if note.Severity != engine.Info {
		t.Errorf("severity %v, want a note", note.Severity)
	}
	if want := fmt.Sprintf("its %.0f t of sea water ballast left the ship weight", lost); !strings.Contains(note.Message, want) {
		t.Errorf("note %q does not say %q", note.Message, want)
	}
	if !strings.Contains(note.Message, "(Δ·GM unchanged)") {
		t.Errorf("full tank: note %q does not say Δ·GM is unchanged", note.Message)
	}
	half := holedTankBarge(t, engine.Liquid{Name: "sea water ballast", Density: engine.SeaWaterDensity, Fill: 0.5})
	for _, f := range engine.Assess(half, d).Flags {
		if f.Code == engine.FlagBallastHoled && !strings.Contains(f.Message, "without its free surface") {
			t.Errorf("half-full tank: note %q does not say its free surface went with it", f.Message)
		}
	}
	for _, c := range []struct {
		liq  engine.Liquid
		what string
	}{
		{engine.Liquid{Name: "fuel oil", Density: 0.95, Fill: 1}, "fuel oil"},
		{engine.Liquid{Name: "sea water ballast", Density: engine.SeaWaterDensity, Fill: 0}, "empty ballast"},
	} {
		v := holedTankBarge(t, c.liq)
		for _, f := range engine.Assess(v, d).Flags {
			if f.Code == engine.FlagBallastHoled {
				t.Errorf("%s: %s note %q", c.what, engine.FlagBallastHoled, f.Message)
			}
		}
	}
}
