package engine_test

import (
	"testing"

	"heelwatch/engine"
)

// leadsBarge is a box barge 60 × 12 × 5 m at 2.5 m draft with a
// starboard wing tank open to the sea and its air pipe at 4.0 m over it;
// the tank's loss and G a little to starboard heel her so that the pipe
// goes under. leads says where the pipe leads.
func leadsBarge(t *testing.T, leads string) (*engine.Vessel, engine.Damage) {
	t.Helper()
	h, err := engine.NewBoxHull(60, 12, 5)
	if err != nil {
		t.Fatal(err)
	}
	c, err := engine.NewCompartment(h, "Wing tank S", engine.Box{X0: 20, X1: 40, Y0: 3, Y1: 6, Z0: 0, Z1: 5})
	if err != nil {
		t.Fatal(err)
	}
	c.Use, c.Permeability = "tank", 0.95
	v, err := engine.NewVessel(engine.Vessel{Name: "leads_to barge (invented)", Hull: h, Compartments: []*engine.Compartment{c},
		CriteriaSets: []string{"marpol-i-28"},
		Openings:     []engine.Opening{{Name: "Wing tank S air pipe", Kind: "air pipe", X: 30, Y: 5.8, Z: 4.0, LeadsTo: leads}},
		Weights:      []engine.Weight{{Name: "barge", MassT: 60 * 12 * 2.5 * engine.SeaWaterDensity, LCGM: 30, TCGM: 0.2, VCGM: 3.5}}})
	if err != nil {
		t.Fatal(err)
	}
	d := v.Intact()
	d[0].Open = true
	return v, d
}

// TestOpeningIntoFloodedSpace: an air pipe of a tank already open to the
// sea lets no water anywhere new, so it is no point of progressive
// flooding (MARPOL Annex I Reg. 28.3 asks for the openings "through which
// progressive flooding may take place"): it does not fail openings-clear,
// is no downflooding point and raises no danger flag. The same pipe left
// without leads_to leads to a space not modelled and counts.
func TestOpeningIntoFloodedSpace(t *testing.T) {
	for _, c := range []struct {
		leads       string
		progressive bool
	}{{"Wing tank S", false}, {"", true}} {
		v, d := leadsBarge(t, c.leads)
		a := engine.Assess(v, d)
		if a.Position == nil || a.GZ == nil {
			t.Fatalf("leads_to %q: no position", c.leads)
		}
		o := a.Position.Openings[0]
		if !o.Immersed() {
			t.Fatalf("leads_to %q: the pipe is %.2f m clear; the test wants it under", c.leads, o.HeightM)
		}
		if o.Progressive() != c.progressive {
			t.Errorf("leads_to %q: progressive %v, want %v", c.leads, o.Progressive(), c.progressive)
		}
		var clear *engine.CriterionResult
		for i := range a.Criteria {
			if a.Criteria[i].Code == "openings-clear" {
				clear = &a.Criteria[i]
			}
		}
		if clear == nil || clear.Pass == c.progressive {
			t.Errorf("leads_to %q: openings-clear %+v; want pass %v", c.leads, clear, !c.progressive)
		}
		danger := false
		for _, f := range a.Flags {
			danger = danger || f.Code == engine.FlagOpening
		}
		if danger != c.progressive {
			t.Errorf("leads_to %q: opening-immersed danger flag %v, want %v", c.leads, danger, c.progressive)
		}
		if (a.GZ.Downflooding != "") != c.progressive {
			t.Errorf("leads_to %q: downflooding angle %.1f° (%q)", c.leads, a.GZ.DownfloodingDeg, a.GZ.Downflooding)
		}
	}
	if _, err := engine.NewVessel(engine.Vessel{Name: "bad", Hull: func() *engine.Hull { h, _ := engine.NewBoxHull(10, 4, 2); return h }(),
		Weights:  []engine.Weight{{Name: "w", MassT: 10, LCGM: 5, VCGM: 1}},
		Openings: []engine.Opening{{Name: "vent", X: 5, Z: 3, LeadsTo: "nowhere"}}}); err == nil {
		t.Error("NewVessel took an opening leading to no compartment")
	}
}
