package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestDiagnoseKnownCase: readings made from a known case of the bundled
// freighter (an invented demo ship; knownCase makes them) rank the true
// compartment first with about the true water, and the trend's inflow
// comes within 25 % of the truth (issue 14).
func TestDiagnoseKnownCase(t *testing.T) {
	readings := knownReadingsFile
	_, water, inflow := knownCase(t)
	code, out, errOut := heelwatch(t, "diagnose", "--vessel", "freighter", "--readings", readings, "--format", "json")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Explanations []struct {
			Flooded   []string           `json:"flooded"`
			WaterM3   map[string]float64 `json:"water_m3"`
			DraftRMSM *float64           `json:"draft_rms_m"`
			HeelErr   *float64           `json:"heel_error_deg"`
		} `json:"explanations"`
		Trend *struct {
			InflowM3h  float64  `json:"inflow_m3h"`
			HoleAreaM2 float64  `json:"hole_area_m2"`
			DeckS      *float64 `json:"time_to_deck_edge_s"`
			Final      any      `json:"final"`
		} `json:"trend"`
		Fits bool `json:"fits"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, out)
	}
	if len(doc.Explanations) == 0 || strings.Join(doc.Explanations[0].Flooded, ",") != "Wing tank 2 S" || !doc.Fits {
		t.Fatalf("best explanation %+v (fits %v); want Wing tank 2 S", doc.Explanations, doc.Fits)
	}
	if e := doc.Explanations[0]; e.DraftRMSM == nil || e.HeelErr == nil || math.Abs(e.WaterM3["Wing tank 2 S"]-water[2]) > 10 {
		t.Errorf("best: %+v (truth %.1f m³)", e, water[2])
	}
	if doc.Trend == nil || math.Abs(doc.Trend.InflowM3h/inflow-1) > 0.25 {
		t.Fatalf("trend %+v; truth %.0f m³/h", doc.Trend, inflow)
	}
	if doc.Trend.Final == nil {
		t.Error("trend without a final position")
	}
	code, text, _ := heelwatch(t, "diagnose", "--vessel", "freighter", "--readings", readings)
	if code != exitOK || !strings.Contains(text, "Best explanation: Wing tank 2 S") || !strings.Contains(text, "Water comes into Wing tank 2 S") {
		t.Errorf("text output:\n%s", text)
	}
}

// TestDiagnoseBadReadings: a readings file that cannot be true is refused
// with file, line and key, exit 1; a missing --readings is bad usage.
func TestDiagnoseBadReadings(t *testing.T) {
	path := filepath.Join(t.TempDir(), "bad.toml")
	src := "format = 1\n[[reading]]\nminutes = 0\nheel_deg = 120\ndrafts = { \"Fwd P\" = 0.0 }\n"
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	code, _, errOut := heelwatch(t, "diagnose", "--vessel", "freighter", "--readings", path)
	if code != exitInput || !strings.Contains(errOut, path+":4: reading[1].heel_deg:") || !strings.Contains(errOut, "under the keel") {
		t.Errorf("exit %d, stderr:\n%s", code, errOut)
	}
	if code, _, _ := heelwatch(t, "diagnose", "--vessel", "freighter"); code != exitUsage {
		t.Errorf("no --readings: exit %d, want %d", code, exitUsage)
	}
}
