package report

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// TestGMAndSpillsInEveryFormat: the barge holed in its wing void lies
// heeled; JSON's gm_m is the upright GM and gm_at_rest_m the GZ slope, the
// displacement is said as the ship's weight with the water beside it; a
// holed fuel tank is listed under spills with the caution in text and
// Markdown.
func TestGMAndSpillsInEveryFormat(t *testing.T) {
	v := barge(t)
	h := v.Hull
	fo, err := engine.NewCompartment(h, "FO tank P", engine.Box{X0: 20, X1: 30, Y0: -8, Y1: -4, Z0: 0, Z1: 1.5})
	if err != nil {
		t.Fatal(err)
	}
	fo.Use, fo.Permeability = "tank", 0.95
	fo.Liquid = &engine.Liquid{Name: "heavy fuel oil", Density: 0.95, Fill: 0.6}
	w := *v
	w.Compartments = append(append([]*engine.Compartment(nil), v.Compartments...), fo)
	v2, err := engine.NewVessel(w)
	if err != nil {
		t.Fatal(err)
	}
	d := v2.Intact()
	d[0].Open, d[1].Open = true, true
	a := engine.Assess(v2, d)
	if a.Position == nil {
		t.Fatal("no position")
	}
	r := New(v2, "test", a, made, "test")
	var b bytes.Buffer
	if err := JSON(&b, r); err != nil {
		t.Fatal(err)
	}
	var m map[string]any
	if err := json.Unmarshal(b.Bytes(), &m); err != nil {
		t.Fatal(err)
	}
	eq := m["equilibrium"].(map[string]any)
	if got := eq["gm_m"].(float64); math.Abs(got-a.Position.GMUprightM) > 1e-12 {
		t.Errorf("gm_m %v, upright GM %v", got, a.Position.GMUprightM)
	}
	if got := eq["gm_at_rest_m"].(float64); math.Abs(got-a.Position.GMAtRestM) > 1e-12 || math.Abs(got-a.Position.GMUprightM) < 1e-6 {
		t.Errorf("gm_at_rest_m %v (upright %v): want the GZ slope, not the upright GM", got, a.Position.GMUprightM)
	}
	sp, _ := m["spills"].([]any)
	if len(sp) != 1 || sp[0].(map[string]any)["compartment"] != "FO tank P" || sp[0].(map[string]any)["liquid"] != "heavy fuel oil" {
		t.Errorf("spills %v", m["spills"])
	}
	for name, f := range map[string]func(*bytes.Buffer, Report) error{
		"text":     func(b *bytes.Buffer, r Report) error { return Text(b, r) },
		"markdown": func(b *bytes.Buffer, r Report) error { return Markdown(b, r) },
	} {
		var b bytes.Buffer
		if err := f(&b, r); err != nil {
			t.Fatal(err)
		}
		s := b.String()
		for _, want := range []string{SpillsHeading, "heavy fuel oil", "GM upright", "GM where she lies", "ship's weight, without the", "Report the pollution"} {
			if !strings.Contains(s, want) {
				t.Errorf("%s lacks %q", name, want)
			}
		}
		if strings.Contains(s, "margin line") {
			t.Errorf("%s speaks of a margin line on a cargo ship", name)
		}
	}
}
