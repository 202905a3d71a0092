package engine_test

import (
	"strings"
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

// TestWeathertightIntoFloodedSpace: the same air pipe fitted with a
// weathertight head and leading into the tank already open to the sea:
// were the head to give way the sea would reach only water, so it is a
// note (opening-into-flooded), not a caution to check the closure.
func TestWeathertightIntoFloodedSpace(t *testing.T) {
	v, d := leadsBarge(t, "Wing tank S")
	v.Openings[0].Weathertight = true
	a := engine.Assess(v, d)
	if a.Position == nil || !a.Position.Openings[0].Immersed() {
		t.Fatal("the pipe is not under water: the test wants it under")
	}
	var codes []string
	for _, f := range a.Flags {
		codes = append(codes, f.Code)
		if f.Code == engine.FlagClosure {
			t.Errorf("closure caution for a closure into a flooded space: %s", f.Message)
		}
	}
	found := false
	for _, c := range codes {
		found = found || c == engine.FlagOpeningIntoFlooded
	}
	if !found {
		t.Errorf("no %s note: %v", engine.FlagOpeningIntoFlooded, codes)
	}
}

// TestIntactSinksNamesNoInflow: a box barge loaded beyond what her hull
// floats, nothing flooded: the will-sink flag must not speak of an inflow
// there is none of.
func TestIntactSinksNamesNoInflow(t *testing.T) {
	h, err := engine.NewBoxHull(60, 12, 5)
	if err != nil {
		t.Fatal(err)
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "overloaded barge (invented)", Hull: h,
		Weights: []engine.Weight{{Name: "cargo", MassT: 60 * 12 * 5.2 * engine.SeaWaterDensity, LCGM: 30, VCGM: 3}}})
	if err != nil {
		t.Fatal(err)
	}
	a := engine.Assess(v, v.Intact())
	for _, f := range a.Flags {
		if f.Code == engine.FlagWillSink {
			if strings.Contains(f.Message, "inflow") || !strings.Contains(f.Message, "shedding weight") {
				t.Errorf("intact will-sink: %s", f.Message)
			}
			return
		}
	}
	t.Errorf("no %s flag: %+v", engine.FlagWillSink, a.Flags)
}
