package tui

import (
	"math"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/charmbracelet/x/ansi"

	"heelwatch/engine"
)

// TestReadingMinutesTyped: the minutes the clock suggests are only the
// field's placeholder, so that an officer who types the minute he read
// the marks gets that minute, not the clock's figure with his digits
// after it (a 3 typed after "2.2" was 2.23 min).
func TestReadingMinutesTyped(t *testing.T) {
	m := bundledModel(t, "freighter", 120, 40)
	m = press(t, m, "r")
	m = typeReading(t, m, knownReading(t, m)...)
	if len(m.rd.readings) != 1 {
		t.Fatalf("first reading not taken: %q", m.rd.form.err)
	}
	later := m.rd.firstAt.Add(130 * time.Second)
	m.now = func() time.Time { return later }
	m = press(t, m, "n")
	if got := m.rd.form.fields[rfMinutes].Value(); got != "" {
		t.Errorf("the minutes field holds %q before anything is typed; want it empty, the clock's minutes as placeholder", got)
	}
	for m.rd.form.focus != rfMinutes {
		m = press(t, m, "up")
	}
	m = press(t, m, "5")
	for m.rd.form.focus != rfMarks {
		m = press(t, m, "tab")
	}
	m = press(t, m, "4", ".", "9", "enter")
	if len(m.rd.readings) != 2 {
		t.Fatalf("second reading not taken: %q", m.rd.form.err)
	}
	if got := m.rd.readings[1].Minutes; got != 5 {
		t.Errorf("typed 5 in the minutes field: the reading is at %g min", got)
	}
	// Left empty, the clock's minutes are taken.
	m = press(t, m, "n")
	m.rd.form.fields[rfMinutes].Placeholder = "7.5"
	m = press(t, m, "4", ".", "9", "enter")
	if len(m.rd.readings) != 3 || m.rd.readings[2].Minutes != 7.5 {
		t.Errorf("minutes left empty: readings %d, the last at %g min; want the placeholder's 7.5", len(m.rd.readings), m.rd.readings[len(m.rd.readings)-1].Minutes)
	}
}

// TestReadingApplyLeavesOutMisread: with one mark misread, nothing fits
// the reading and the diagnosis says what fits without that mark; the
// apply key puts that explanation onto the dashboard (and says so), not
// the best misfit, which floods spaces the true case leaves dry.
func TestReadingApplyLeavesOutMisread(t *testing.T) {
	m := bundledModel(t, "freighter", 80, 24)
	m = press(t, m, "r")
	vals := knownReading(t, m)
	for i, mk := range m.v.DraftMarks {
		if mk.Name == "Fwd S" {
			d, err := strconv.ParseFloat(vals[1+i], 64)
			if err != nil {
				t.Fatal(err)
			}
			vals[1+i] = strconv.FormatFloat(d+0.7, 'f', 2, 64)
		}
	}
	m = typeReading(t, m, vals...)
	res := m.rd.result
	if res == nil || res.Fits || res.Without == nil {
		t.Fatalf("a misread Fwd S: want nothing to fit and a fit without it; got %+v", res)
	}
	if view := m.View(); !strings.Contains(strings.Join(strings.Fields(view), " "), "a: Wing tank 2 S (the fit leaving out Fwd S)") {
		t.Logf("the panel does not name what a applies (it may be below the fold at 80×24):\n%s", view)
	}
	m = press(t, m, "a")
	for i, c := range m.v.Compartments {
		w := m.damage[i].WaterM3
		switch {
		case c.Name == "Wing tank 2 S" && w < 100:
			t.Errorf("a: Wing tank 2 S holds %.0f m³; want the fit without Fwd S (about 150 m³)", w)
		case c.Name != "Wing tank 2 S" && w > 0:
			t.Errorf("a: %s holds %.0f m³; the fit without the misread mark floods Wing tank 2 S alone", c.Name, w)
		}
	}
	if log := strings.Join(m.log, "\n"); !strings.Contains(log, "leaving out Fwd S") {
		t.Errorf("the log does not say the misread mark was left out:\n%s", log)
	}
}

// TestReadingApplyOpenToSea: an explanation whose water stands level with
// the sea goes onto the dashboard as the space open to the sea, so that
// the upright GM shown is that of free communication with the sea (as
// solve --open gives it), not that of the same water held as a weight
// with its own free surface (a third more on the freighter's wing tank).
func TestReadingApplyOpenToSea(t *testing.T) {
	m := bundledModel(t, "freighter", 120, 40)
	wt := indexOf(t, m, "Wing tank 2 S")
	d := m.v.Intact()
	d[wt] = engine.SpaceState{Open: true}
	pos, err := engine.Solve(m.v, d)
	if err != nil {
		t.Fatal(err)
	}
	r := engine.Reading{HeelDeg: pos.HeelDeg, HasHeel: true}
	for i, md := range engine.MarkDrafts(m.v.Hull, pos.Plane, m.v.DraftMarks) {
		r.Drafts = append(r.Drafts, engine.MarkReading{Mark: i, DraftM: md.DraftM})
	}
	dg, err := engine.Diagnose(m.v, []engine.Reading{r}, engine.DiagnoseOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if !dg.Fits || dg.Explanations[0].Names(m.v) != "Wing tank 2 S" || !dg.Explanations[0].Spaces[0].Open {
		t.Fatalf("want Wing tank 2 S open to the sea first; got %q", dg.Verdict)
	}
	m = press(t, m, "r")
	m.rd.readings, m.rd.result = []engine.Reading{r}, &dg
	m = press(t, m, "a")
	if !m.damage[wt].Open {
		t.Errorf("a: Wing tank 2 S is %+v; want it open to the sea", m.damage[wt])
	}
	if gm := m.cur.Position.GMUprightM; math.Abs(gm-pos.GMUprightM) > 0.01 {
		t.Errorf("a: GM upright %.3f m on the dashboard; solve with the tank open gives %.3f m", gm, pos.GMUprightM)
	}
}

// TestReadingPanelScrolls: at 80×24 the diagnosis is longer than the
// panel; it says there is more and ] shows the rest down to the apply
// key's line, [ brings the verdict back. Nothing was shown of the
// ranking's end, the trend or the apply key before.
func TestReadingPanelScrolls(t *testing.T) {
	m := bundledModel(t, "freighter", 80, 24)
	m = press(t, m, "r")
	m = typeReading(t, m, knownReading(t, m)...)
	view := checkFits(t, "diagnosis", m, 80, 24)
	if !strings.Contains(view, "more lines: ] shows them") {
		t.Fatalf("the diagnosis does not say there is more:\n%s", view)
	}
	for i := 0; i < 20 && !strings.Contains(ansi.Strip(m.View()), "a: Wing tank 2 S onto the dashboard"); i++ {
		m = press(t, m, "]")
	}
	view = checkFits(t, "scrolled", m, 80, 24)
	if !strings.Contains(view, "a: Wing tank 2 S onto the dashboard") || !strings.Contains(view, "[ back to the top") {
		t.Errorf("] never showed the apply key's line:\n%s", view)
	}
	for i := 0; i < 20; i++ {
		m = press(t, m, "[")
	}
	if view = checkFits(t, "back", m, 80, 24); !strings.Contains(view, "Best explanation: Wing tank 2 S") {
		t.Errorf("[ did not bring the verdict back:\n%s", view)
	}
}
