package report

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

// remedySetForTest is a hand-made set of options: one that floats, one
// whose figures are not finite, and one that capsizes.
func remedySetForTest() *engine.RemedySet {
	nan := math.NaN()
	return &engine.RemedySet{Needed: true, HeelDeg: 5, UprightGMM: 0.8,
		Summary: "Summary words, not orders.",
		Options: []engine.Remedy{
			{Kind: engine.RemedyFill, Tanks: []int{0}, TankNames: []string{"WB 2 P"}, FillBefore: []float64{0}, FillAfter: []float64{0.98},
				Action: "fill WB 2 P from the sea to 98 %", MassT: 120, UprightGMM: 0.75, LowestOpening: "vent", LowestOpeningM: 2.5,
				Position:  &engine.Position{HeelDeg: -0.4, TrimM: 0.2, GMM: 0.77, GMUprightM: 0.75, GMAtRestM: 0.77, DeckEdge: engine.Clearance{HeightM: 1.9}},
				Advisable: true, Note: "Brings her to 0.40° to port."},
			{Kind: engine.RemedyDischarge, Tanks: []int{1}, TankNames: []string{"FW S"}, FillBefore: []float64{0.5}, FillAfter: []float64{0},
				Action: "pump out FW S (fresh water)", MassT: nan, UprightGMM: nan, LowestOpeningM: math.Inf(1),
				Position: &engine.Position{HeelDeg: nan, TrimM: math.Inf(1), GMM: nan, DeckEdge: engine.Clearance{HeightM: math.Inf(-1)}},
				Note:     "odd figures"},
			{Kind: engine.RemedyTransfer, Tanks: []int{1, 0}, TankNames: []string{"FW S", "FW P"}, FillBefore: []float64{0.5, 0.1}, FillAfter: []float64{0.0, 0.6},
				Action: "transfer fresh water from FW S to FW P", MassT: 40, UprightGMM: nan, LowestOpeningM: math.Inf(1),
				NoEq: &engine.NoEquilibrium{Outcome: engine.Capsizes, Reason: "no rest"}, Note: "Not advisable: she would not float so."},
		}}
}

// TestRemediesRendered checks that the options appear in every format with
// their cautions when set, never with NaN or Inf, and as the documented
// JSON keys; and that they are absent when not set.
func TestRemediesRendered(t *testing.T) {
	v := barge(t)
	base := New(v, "test", engine.Assess(v, v.Intact()), made, "test")
	with := base
	with.Remedies = remedySetForTest()
	render := map[string]func(*bytes.Buffer, Report) error{
		"json":     func(b *bytes.Buffer, r Report) error { return JSON(b, r) },
		"text":     func(b *bytes.Buffer, r Report) error { return Text(b, r) },
		"markdown": func(b *bytes.Buffer, r Report) error { return Markdown(b, r) },
	}
	for name, f := range render {
		var b, plain bytes.Buffer
		if err := f(&b, with); err != nil {
			t.Fatal(err)
		}
		if err := f(&plain, base); err != nil {
			t.Fatal(err)
		}
		s := b.String()
		if strings.Contains(s, "NaN") || strings.Contains(s, "Inf") {
			t.Errorf("%s holds NaN or Inf:\n%s", name, s)
		}
		for _, want := range []string{"fill WB 2 P from the sea to 98 %", "Summary words, not orders.", RemediesCaution, "capsizes"} {
			if name == "json" && want == "capsizes" {
				want = "no equilibrium: vessel capsizes"
			}
			if !strings.Contains(s, want) {
				t.Errorf("%s lacks %q:\n%s", name, want, s)
			}
		}
		if strings.Contains(plain.String(), "remedies") || strings.Contains(plain.String(), RemediesHeading) {
			t.Errorf("%s shows options that were not asked for", name)
		}
	}
	var b bytes.Buffer
	if err := JSON(&b, with); err != nil {
		t.Fatal(err)
	}
	var m map[string]any
	if err := json.Unmarshal(b.Bytes(), &m); err != nil {
		t.Fatalf("not JSON: %v", err)
	}
	list := m["remedies"].([]any)
	if len(list) != 3 {
		t.Fatalf("remedies %v", list)
	}
	first := list[0].(map[string]any)
	for k, want := range map[string]any{"action": "fill WB 2 P from the sea to 98 %", "mass_t": 120.0, "heel_deg": -0.4,
		"trim_m": 0.2, "gm_m": 0.75, "deck_edge_m": 1.9, "lowest_opening_m": 2.5, "advisable": true, "kind": "fill", "lowest_opening": "vent"} {
		if first[k] != want {
			t.Errorf("remedies[0].%s = %#v, want %#v", k, first[k], want)
		}
	}
	if tanks := first["tanks"].([]any); len(tanks) != 1 || tanks[0] != "WB 2 P" {
		t.Errorf("tanks %v", tanks)
	}
	third := list[2].(map[string]any)
	if third["heel_deg"] != nil || third["lowest_opening_m"] != nil || third["advisable"] != false {
		t.Errorf("a capsizing option: heel_deg %v, lowest_opening_m %v, advisable %v; want null, null, false", third["heel_deg"], third["lowest_opening_m"], third["advisable"])
	}
	if m["remedies_loll"] != false || m["remedies_summary"] != "Summary words, not orders." {
		t.Errorf("remedies_loll %v, remedies_summary %v", m["remedies_loll"], m["remedies_summary"])
	}

	// None needed: an empty list, not a missing key.
	with.Remedies = &engine.RemedySet{Summary: "no righting action is needed"}
	b.Reset()
	if err := JSON(&b, with); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(b.String(), `"remedies": []`) {
		t.Errorf("no options should print as []:\n%s", b.String())
	}
}
