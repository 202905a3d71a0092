package report

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"
	"time"

	"heelwatch/engine"
)

// barge builds a box barge 80 × 16 × 8 m of 4592 t with one wing void, the
// example of heelwatch's conventions.
func barge(t *testing.T) *engine.Vessel {
	t.Helper()
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	c, err := engine.NewCompartment(h, "3 wing void S", engine.Box{X0: 34, X1: 46, Y0: 4, Y1: 8, Z0: 0, Z1: 8})
	if err != nil {
		t.Fatal(err)
	}
	c.Use, c.Permeability = "void", 0.95
	v, err := engine.NewVessel(engine.Vessel{Name: "Test barge", Hull: h,
		Weights:      []engine.Weight{{Name: "all", MassT: 4592, LCGM: 40, VCGM: 5.6}},
		Compartments: []*engine.Compartment{c},
		Openings:     []engine.Opening{{Name: "vent", Kind: "vent", X: 8, Y: -7, Z: 10.5}}})
	if err != nil {
		t.Fatal(err)
	}
	return v
}

var made = time.Date(2025, 3, 1, 4, 30, 0, 0, time.UTC)

func TestJSONIntactBarge(t *testing.T) {
	v := barge(t)
	r := New(v, "test", engine.Assess(v, v.Intact()), made, "test")
	var b bytes.Buffer
	if err := JSON(&b, r); err != nil {
		t.Fatal(err)
	}
	var m map[string]any
	if err := json.Unmarshal(b.Bytes(), &m); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, b.String())
	}
	eq := m["equilibrium"].(map[string]any)
	// Box closed form (practice): draft T = Δ/(ρ·L·B) = 4592/(1.025·80·16) = 3.5 m.
	want := 4592 / (1.025 * 80 * 16)
	for _, k := range []string{"draft_aft_m", "draft_mid_m", "draft_fwd_m"} {
		if got := eq[k].(float64); math.Abs(got-want) > 1e-9 {
			t.Errorf("%s = %v, want %v", k, got, want)
		}
	}
	// Box closed form (practice): GM = KB + BM − KG = T/2 + B²/(12T) − KG.
	gm := want/2 + 16*16/(12*want) - 5.6
	if got := eq["gm_m"].(float64); math.Abs(got-gm) > 1e-9 {
		t.Errorf("gm_m = %v, want %v", got, gm)
	}
	if m["hand"] != nil {
		t.Errorf("hand = %v, want null for the intact state", m["hand"])
	}
	if fl, ok := m["flags"].([]any); !ok {
		t.Errorf("flags = %v, want a list", m["flags"])
	} else if len(fl) != len(r.Assessment.Flags) {
		t.Errorf("flags %v, want the assessment's %v", fl, r.Assessment.Flags)
	}
	if m["made"] != "2025-03-01T04:30:00Z" {
		t.Errorf("made = %v", m["made"])
	}
}

func TestNumNeverNaN(t *testing.T) {
	tests := []struct {
		in   float64
		want string
	}{
		{math.NaN(), "null"},
		{math.Inf(1), "null"},
		{math.Inf(-1), "null"},
		{math.Copysign(0, -1), "0"},
		{1.5, "1.5"},
		{-2.25e-7, "-2.25e-07"},
	}
	for _, tc := range tests {
		b, err := json.Marshal(Num(tc.in))
		if err != nil || string(b) != tc.want {
			t.Errorf("Num(%v) = %s, %v; want %s", tc.in, b, err, tc.want)
		}
	}
}

// A state full of non-finite numbers must still print as valid JSON and as
// text without "NaN" or "Inf".
func TestNonFiniteGuarded(t *testing.T) {
	nan := math.NaN()
	p := &engine.Position{DraftAftM: nan, GMM: math.Inf(1), HeelDeg: nan, TrimM: nan,
		DeckEdge: engine.Clearance{HeightM: math.Inf(1)}, MarginLine: engine.Clearance{HeightM: nan},
		Openings: []engine.OpeningClearance{{Opening: engine.Opening{Name: "o"}, HeightM: nan}}}
	a := engine.Assessment{Position: p,
		GZ:       &engine.GZCurve{HeelDeg: []float64{0, 1}, GZM: []float64{nan, math.Inf(-1)}, GZMaxM: nan},
		Hand:     &engine.HandWorking{GMM: nan, Steps: []engine.HandStep{{Label: "x", Value: nan}}},
		Criteria: []engine.CriterionResult{{Requirement: "r", Actual: nan}}}
	r := Report{VesselName: "n", Assessment: a}
	for name, f := range map[string]func(*bytes.Buffer, Report) error{
		"json":     func(b *bytes.Buffer, r Report) error { return JSON(b, r) },
		"text":     func(b *bytes.Buffer, r Report) error { return Text(b, r) },
		"markdown": func(b *bytes.Buffer, r Report) error { return Markdown(b, r) },
	} {
		var b bytes.Buffer
		if err := f(&b, r); err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		s := b.String()
		if strings.Contains(s, "NaN") || strings.Contains(s, "Inf") {
			t.Errorf("%s output holds NaN or Inf:\n%s", name, s)
		}
		if name == "json" && !json.Valid(b.Bytes()) {
			t.Errorf("json output is not valid JSON:\n%s", s)
		}
	}
}

// With no equilibrium, equilibrium is null and a danger flag says so.
func TestNoEquilibrium(t *testing.T) {
	a := engine.Assessment{NoEq: &engine.NoEquilibrium{Outcome: engine.Sinks, Reason: "weight 9000 t exceeds buoyancy 8000 t"}}
	r := Report{VesselName: "n", Assessment: a}
	d := Build(r)
	if d.Equilibrium != nil || d.Outcome != "sinks" || d.Severity != "danger" {
		t.Errorf("equilibrium %v outcome %q severity %q", d.Equilibrium, d.Outcome, d.Severity)
	}
	if len(d.Flags) != 1 || d.Flags[0].Code != engine.FlagWillSink || !strings.Contains(d.Flags[0].Message, "sinks") {
		t.Errorf("flags %+v", d.Flags)
	}
	// A danger flag from the engine replaces the renderer's own.
	r.Assessment.Flags = []engine.Flag{{Code: "sinks", Severity: engine.Danger, Message: "she sinks"}}
	if d := Build(r); len(d.Flags) != 1 || d.Flags[0].Code != "sinks" {
		t.Errorf("flags %+v, want only the engine's", d.Flags)
	}
	var b bytes.Buffer
	if err := JSON(&b, r); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(b.String(), `"equilibrium": null`) {
		t.Errorf("equilibrium not null:\n%s", b.String())
	}
}

// What the engine fills in appears in every format without changes here.
func TestFilledPartsAppear(t *testing.T) {
	v := barge(t)
	a := engine.Assess(v, engine.Damage{{Open: true}})
	a.Hand = &engine.HandWorking{SinkageM: 0.1, GMM: 1.1, Steps: []engine.HandStep{{Label: "sinkage", Formula: "v ÷ A", Value: 0.1, Unit: "m"}}}
	a.GZ = &engine.GZCurve{Toward: engine.Starboard, HeelDeg: []float64{0, 5, 10, 15}, GZM: []float64{0, 0.1, 0.2, 0.25}, GZMaxM: 0.25, GZMaxDeg: 15}
	a.Criteria = []engine.CriterionResult{{Set: "set A", Code: "c1", Requirement: "GZ max ≥ 0.1 m", Required: 0.1, Actual: 0.25, Unit: "m", Pass: true, Margin: 0.15}}
	a.Flags = []engine.Flag{{Code: "code-x", Severity: engine.Caution, Message: "message x"}}
	r := New(v, "f.toml", a, made, "v9")
	if len(r.Open) != 1 || r.Open[0] != "3 wing void S" || r.Permeabilities["3 wing void S"] != 0.95 {
		t.Fatalf("New: open %v μ %v", r.Open, r.Permeabilities)
	}
	var j, tx, mk bytes.Buffer
	if err := JSON(&j, r); err != nil {
		t.Fatal(err)
	}
	if err := Text(&tx, r); err != nil {
		t.Fatal(err)
	}
	if err := Markdown(&mk, r); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{`"sinkage_m": 0.1`, `"gz_m": [`, `"code": "c1"`, `"code": "code-x"`, `"severity": "caution"`, `"toward": "starboard"`} {
		if !strings.Contains(j.String(), want) {
			t.Errorf("JSON lacks %s", want)
		}
	}
	for _, out := range []string{tx.String(), mk.String()} {
		for _, want := range []string{"sinkage", "GZ max ≥ 0.1 m", "code-x", "message x", "3 wing void S", "0.95", "decision support"} {
			if !strings.Contains(out, want) {
				t.Errorf("output lacks %q:\n%s", want, out)
			}
		}
	}
}

func TestWords(t *testing.T) {
	tests := []struct{ got, want string }{
		{HeelWords(2.345), "2.35° to starboard"},
		{HeelWords(-1), "1.00° to port"},
		{HeelWords(0.001), "0.00° upright"},
		{TrimWords(0.5), "0.500 m by the stern"},
		{TrimWords(-0.25), "0.250 m by the head"},
		{TrimWords(1e-5), "0.000 m even keel"},
		{num(-0.0001, 3, "m"), "0.000 m"},
		{signed(0.15, 3, "m"), "+0.150 m"},
		{signed(-0.15, 3, "m"), "-0.150 m"},
		{num(math.NaN(), 3, "m"), "—"},
	}
	for _, tc := range tests {
		if tc.got != tc.want {
			t.Errorf("got %q, want %q", tc.got, tc.want)
		}
	}
}

// TestPartlyFloodedListed: a compartment holding floodwater (not open to
// the sea) is listed with its water in every format, and the report does
// not call the condition intact.
func TestPartlyFloodedListed(t *testing.T) {
	v := barge(t)
	d := v.Intact()
	d[0].WaterM3 = 84.9
	r := New(v, "test", engine.Assess(v, d), made, "dev")
	var md, txt, js bytes.Buffer
	if err := Markdown(&md, r); err != nil {
		t.Fatal(err)
	}
	if err := Text(&txt, r); err != nil {
		t.Fatal(err)
	}
	if err := JSON(&js, r); err != nil {
		t.Fatal(err)
	}
	for name, out := range map[string]string{"markdown": md.String(), "text": txt.String()} {
		if !strings.Contains(out, "3 wing void S") || !strings.Contains(out, "84.9 m³") || strings.Contains(out, "intact loading condition") {
			t.Errorf("%s does not list the water held:\n%s", name, out)
		}
	}
	var doc struct {
		Held []struct {
			Name    string  `json:"name"`
			WaterM3 float64 `json:"water_m3"`
		} `json:"partly_flooded"`
	}
	if err := json.Unmarshal(js.Bytes(), &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Held) != 1 || doc.Held[0].Name != "3 wing void S" || doc.Held[0].WaterM3 != 84.9 {
		t.Errorf("JSON partly_flooded = %+v", doc.Held)
	}
}
