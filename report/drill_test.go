package report_test

import (
	"bytes"
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

// TestDrillLogReplays: a drill's log, written as a scenario file with the
// crew's and the instructor's events, reads back and plays the same drill
// row for row (the same events, the same integration).
func TestDrillLogReplays(t *testing.T) {
	sc, err := vessels.OpenScenario("freighter-fog")
	if err != nil {
		t.Fatal(err)
	}
	ix := func(name string) int {
		for i, c := range sc.Vessel.Compartments {
			if c.Name == name {
				return i
			}
		}
		t.Fatalf("no %s", name)
		return -1
	}
	inlet, err := vessels.CounterfloodInlet(sc.Vessel, ix("Wing tank 2 P"), vessels.CounterfloodAreaM2)
	if err != nil {
		t.Fatal(err)
	}
	extra := []engine.DrillEvent{
		{Minutes: 6.25, Kind: engine.DrillMark, By: engine.ByCrew, Compartment: ix("Wing tank 2 S"), Flooded: true},
		{Minutes: 7.5, Kind: engine.DrillPump, By: engine.ByCrew, Compartment: ix("Hold 2"), PumpM3h: 100},
		{Minutes: 11.0 / 3, Kind: engine.DrillCounterflood, By: engine.ByCrew, Compartment: ix("Wing tank 2 P"), Hole: inlet, Open: true},
		{Minutes: 12, Kind: engine.DrillNote, By: engine.ByInstructor, Compartment: -1, Text: `Say "heel" twice \ please`},
	}
	setup := sc.Setup(extra...)
	d, err := setup.Play()
	if err != nil {
		t.Fatal(err)
	}
	dr := report.Drill{Scenario: sc.Name, File: sc.File, VesselRef: sc.VesselRef, About: sc.About, Seed: sc.Seed, Alarms: sc.Alarms, Played: d, Events: setup.Events}
	var b bytes.Buffer
	if err := report.DrillLog(&b, dr); err != nil {
		t.Fatal(err)
	}
	back, err := vessels.ParseScenario("log.toml", b.Bytes(), "")
	if err != nil {
		t.Fatalf("the log does not read back: %v\n%s", err, b.String())
	}
	if back.Seed != sc.Seed || back.Minutes != sc.Minutes || len(back.Alarms) != len(sc.Alarms) || back.About != sc.About {
		t.Errorf("scenario keys lost: %+v", back)
	}
	d2, err := back.Setup().Play()
	if err != nil {
		t.Fatal(err)
	}
	r1, r2 := d.Rows(), d2.Rows()
	if len(r1) != len(r2) {
		t.Fatalf("%d rows, replayed %d", len(r1), len(r2))
	}
	for i := range r1 {
		if r1[i].Event != r2[i].Event || r1[i].Minutes != r2[i].Minutes || r1[i].Position.HeelDeg != r2[i].Position.HeelDeg {
			t.Fatalf("row %d: %q %.3f %v; replayed %q %.3f %v", i, r1[i].Event, r1[i].Minutes, r1[i].Position.HeelDeg, r2[i].Event, r2[i].Minutes, r2[i].Position.HeelDeg)
		}
	}
	// The debrief of the replay names each decision and the crew's mark.
	a, err := engine.AnalyseDrill(back.Setup())
	if err != nil {
		t.Fatal(err)
	}
	var md bytes.Buffer
	if err := report.DrillDebrief(&md, dr, a); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"pump Hold 2 100 m3/h", "counter-flood Wing tank 2 P open", "| Wing tank 2 S | min 2.", "pumps and doors at once"} {
		if !strings.Contains(md.String(), want) {
			t.Errorf("debrief lacks %q", want)
		}
	}
	if len(a.Decisions) != 2 {
		t.Errorf("%d decisions with an effect, want 2 (pump, counter-flood)", len(a.Decisions))
	}
}
