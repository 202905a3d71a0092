package report

import (
	"bytes"
	"encoding/json"
	"strings"
	"testing"

	"heelwatch/engine"
)

// A reading without a permissible value shows no percentage: null in JSON,
// "—" in text; one past its limit is marked DANGER.
func TestStrengthShown(t *testing.T) {
	s := &engine.Strength{
		XM: []float64{0, 40, 80}, ShearKN: []float64{0, 10, 0}, MomentKNm: []float64{0, -2000, 0},
		Points: []engine.StrengthReading{
			{ReadOutPoint: engine.ReadOutPoint{Name: "Free", XM: 20}, ShearKN: 5, MomentKNm: -1000},
			{ReadOutPoint: engine.ReadOutPoint{Name: "Mid", XM: 40, Sea: engine.Permissible{SagKNm: 1500}},
				MomentKNm: -2000, MomentLimitKNm: 1500, MomentPct: 133.3, Level: engine.Danger},
		},
		MaxMoment: engine.StrengthPeak{XM: 40, Value: -2000},
	}
	r := Report{VesselName: "t", Assessment: engine.Assessment{Strength: s}}
	var b bytes.Buffer
	if err := JSON(&b, r); err != nil {
		t.Fatal(err)
	}
	var m struct {
		Strength struct {
			XM     []float64 `json:"x_m"`
			Points []struct {
				MomentPct *float64 `json:"moment_pct"`
				Level     string   `json:"level"`
			} `json:"points"`
		} `json:"strength"`
	}
	if err := json.Unmarshal(b.Bytes(), &m); err != nil {
		t.Fatal(err)
	}
	if len(m.Strength.XM) != 2 || m.Strength.Points[0].MomentPct != nil || m.Strength.Points[1].Level != "danger" {
		t.Errorf("JSON strength %+v", m.Strength)
	}
	b.Reset()
	if err := Text(&b, r); err != nil {
		t.Fatal(err)
	}
	out := b.String()
	for _, want := range []string{"Hull girder", "DANGER", "133 %", "2000 kN·m sagging"} {
		if !strings.Contains(out, want) {
			t.Errorf("text lacks %q:\n%s", want, out)
		}
	}
}
