package tui

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/exp/teatest"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestNumberGuard: no NaN or Inf ever reaches the screen.
func TestNumberGuard(t *testing.T) {
	for _, tc := range []struct {
		got, want string
	}{
		{num(math.NaN(), 2), blank},
		{num(math.Inf(1), 2), blank},
		{num(math.Inf(-1), 0), blank},
		{num(-0.001, 2), "0.00"},
		{num(-1.234, 2), "-1.23"},
		{signed(0.004, 2), "0.00"},
		{signed(0.3, 2), "+0.30"},
		{signed(-0.3, 2), "-0.30"},
		{signed(math.NaN(), 2), blank},
		{heelText(math.NaN()), blank},
		{heelText(3.21), "3.2° to starboard"},
		{heelText(-0.04), "upright"},
		{heelText(-12.06), "12.1° to port"},
		{trimText(0.41), "0.41 m by the stern"},
		{trimText(-0.12), "0.12 m by the head"},
		{trimText(0.001), "even keel"},
		{trimText(math.Inf(1)), blank},
		{heelShort(math.NaN()), blank},
	} {
		if tc.got != tc.want {
			t.Errorf("got %q, want %q", tc.got, tc.want)
		}
	}

	// A position full of non-finite numbers, injected as if the engine had
	// returned it: the screen shows dashes, never NaN or Inf.
	m := testModel(t, 120, 40)
	bad := *m.cur
	nan := math.NaN()
	pos := *bad.Position
	pos.DraftAftM, pos.DraftMidM, pos.DraftFwdM, pos.HeelDeg, pos.TrimM = nan, math.Inf(1), nan, nan, math.Inf(-1)
	pos.GMM, pos.DisplacementT, pos.KMTM = nan, nan, nan
	pos.Plane = engine.Plane{A: nan, B: nan, C: nan}
	pos.DeckEdge = engine.Clearance{HeightM: nan, XM: nan}
	pos.Openings = append([]engine.OpeningClearance(nil), pos.Openings...)
	for i := range pos.Openings {
		pos.Openings[i].HeightM = nan
	}
	bad.Position = &pos
	bad.GZ = &engine.GZCurve{HeelDeg: []float64{0, 1, 2}, GZM: []float64{0, nan, math.Inf(1)},
		EquilibriumDeg: nan, GZMaxM: nan, GZMaxDeg: nan, VanishingDeg: nan, RangeDeg: nan, DownfloodingDeg: nan}
	bad.Criteria = []engine.CriterionResult{{Set: "test", Requirement: "GM ≥ 0.15 m", Actual: nan, Margin: math.Inf(-1)}}
	bad.Hand = &engine.HandWorking{GMM: nan, HeelDeg: math.Inf(1), Steps: []engine.HandStep{{Label: "sinkage", Formula: "V/A", Value: nan, Unit: "m"}}}
	m = drive(t, m, resultMsg{seq: m.seq, a: bad})
	for _, hand := range []bool{false, true} {
		m.hand.show = hand
		for _, size := range [][2]int{{120, 40}, {80, 24}} {
			mm, _ := m.Update(tea.WindowSizeMsg{Width: size[0], Height: size[1]})
			mv := mm.(model)
			for p := 0; p < numPictures; p++ {
				mv.picture = p
				v := mv.View()
				if w := nonFinite.FindString(v); w != "" {
					t.Fatalf("%q on screen (%dx%d, hand %v, picture %d):\n%s", w, size[0], size[1], hand, p, v)
				}
			}
		}
	}
}

// nonFinite matches what Go prints for NaN and infinities.
var nonFinite = regexp.MustCompile(`(?i)\bnan\b|[+-]?\binf(inity)?\b`)

// testBarge is a box barge (an invented test case) with one compartment
// that is the whole hull, so that opening it takes all her buoyancy, and a
// wing void; vcg sets her centre of gravity.
func testBarge(t testing.TB, vcg float64) *engine.Vessel {
	t.Helper()
	h, err := engine.NewBoxHull(40, 10, 4)
	if err != nil {
		t.Fatal(err)
	}
	whole, err := engine.NewCompartment(h, "Whole hull", engine.Box{X0: 0, X1: 40, Y0: -5, Y1: 5, Z0: 0, Z1: 4})
	if err != nil {
		t.Fatal(err)
	}
	wing, err := engine.NewCompartment(h, "Wing S", engine.Box{X0: 10, X1: 30, Y0: 3, Y1: 5, Z0: 0, Z1: 4})
	if err != nil {
		t.Fatal(err)
	}
	wing.Permeability = 0.95
	v, err := engine.NewVessel(engine.Vessel{Name: "Test barge", Hull: h,
		Weights:      []engine.Weight{{Name: "all", MassT: 800, LCGM: 20, VCGM: vcg}},
		Compartments: []*engine.Compartment{whole, wing},
		Openings:     []engine.Opening{{Name: "vent S", X: 20, Y: 4, Z: 4.5}}})
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// TestNoFloatingPosition: she sinks or capsizes; the screen says so
// plainly, with the engine's reason, and blanks the figures.
func TestNoFloatingPosition(t *testing.T) {
	for _, tc := range []struct {
		name    string
		vcg     float64
		keys    []string
		outcome engine.Outcome
		banner  string
	}{
		// Opening the compartment that is the whole hull: no buoyancy left.
		{"sinks", 2.5, []string{"space"}, engine.Sinks, "SHE SINKS"},
		// G far above any metacentre the box can have: no righting lever
		// at any heel (a closed-form box: KM at most B²/12T + T/2 ≈ 8 m).
		{"capsizes", 30, nil, engine.Capsizes, "SHE CAPSIZES"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			v := testBarge(t, tc.vcg)
			m := newModel(v, nil, Options{})
			m.now, m.animate = fixedClock(), false
			m = drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24}, m.Init())
			m = press(t, m, tc.keys...)
			a := engine.Assess(v, m.damage)
			if a.NoEq == nil || a.NoEq.Outcome != tc.outcome {
				t.Fatalf("the engine does not give %v for the test barge: %+v", tc.outcome, a.NoEq)
			}
			for _, size := range [][2]int{{80, 24}, {120, 40}} {
				mm, _ := m.Update(tea.WindowSizeMsg{Width: size[0], Height: size[1]})
				view := mm.(model).View()
				if !strings.Contains(view, tc.banner) {
					t.Errorf("%v: no %q banner:\n%s", size, tc.banner, view)
				}
				if !strings.Contains(strings.Join(strings.Fields(view), " "), strings.Join(strings.Fields(a.NoEq.Reason), " ")[:30]) {
					t.Errorf("%v: the engine's reason is not on screen", size)
				}
				if got, _ := regexpFind(view, `Draft aft\s+(\S+)`); got != blank {
					t.Errorf("%v: draft aft shows %q, want %q", size, got, blank)
				}
				if size[0] == 80 {
					checkGolden(t, tc.name+"_80x24", view)
				}
			}
			if len(tc.keys) > 0 {
				// Undo brings her back.
				m = press(t, m, "u")
				if m.cur.Position == nil || strings.Contains(m.View(), tc.banner) {
					t.Error("undo did not bring back a floating position")
				}
			}
		})
	}
}

// TestKeys walks the editing keys: permeability steps and limits, typed
// permeability with validation and cancel, undo, reset.
func TestKeys(t *testing.T) {
	m := testModel(t, 100, 30)
	m = selectSpace(t, m, "Hold 2")
	i := m.sel
	own := m.v.Compartments[i].Permeability
	m = press(t, m, "+")
	if got := m.mu(m.damage, i); math.Abs(got-math.Min(1, own+0.05)) > 1e-12 {
		t.Errorf("+: μ %v, want %v", got, own+0.05)
	}
	for k := 0; k < 16; k++ {
		m = press(t, m, "-")
	}
	if got := m.mu(m.damage, i); got != 0.05 {
		t.Errorf("μ after many −: %v, want the floor 0.05", got)
	}
	// Type an exact value: a bad one is refused and the prompt stays.
	m = press(t, m, "m", "1", ".", "5", "enter")
	if m.mode != modeMu || m.inputErr == "" {
		t.Fatalf("μ 1.5 accepted (editing %v, error %q)", m.mode == modeMu, m.inputErr)
	}
	if !strings.Contains(m.View(), "outside") {
		t.Error("the refusal is not on screen")
	}
	m = press(t, m, "esc")
	if m.mode == modeMu || m.mu(m.damage, i) != 0.05 {
		t.Error("esc did not cancel")
	}
	m = press(t, m, "m", "8", "2", "%", "enter")
	if m.mode == modeMu || math.Abs(m.mu(m.damage, i)-0.82) > 1e-12 {
		t.Errorf("82%%: μ %v, editing %v", m.mu(m.damage, i), m.mode == modeMu)
	}
	m = press(t, m, "space")
	if !m.damage[i].Open {
		t.Fatal("space did not open")
	}
	// The figures are those of μ 0.82.
	d := m.v.Intact()
	d[i] = engine.SpaceState{Open: true, Permeability: 0.82}
	want := engine.Assess(m.v, d).Position
	if m.cur.Position.Plane != want.Plane {
		t.Errorf("figures are not those of μ 0.82: %+v vs %+v", m.cur.Position.Plane, want.Plane)
	}
	m = press(t, m, "u")
	if m.damage[i].Open {
		t.Error("undo did not close it again")
	}
	m = press(t, m, "space", "R")
	if !allZero(m.damage) || m.cur.Position.Plane != m.base.Position.Plane {
		t.Error("reset did not bring her back to intact")
	}
	m = press(t, m, "u")
	if !m.damage[i].Open {
		t.Error("undo of the reset did not reopen")
	}
	// Palette cycle and the hand working toggle.
	for _, want := range []string{"night", "mono", "day"} {
		m = press(t, m, "c")
		if m.st.Palette != want {
			t.Errorf("palette %q, want %q", m.st.Palette, want)
		}
	}
	m = press(t, m, "h")
	if !strings.Contains(m.View(), "HAND METHOD") {
		t.Error("h does not show the hand working")
	}
}

func TestParseMu(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want float64
		ok   bool
	}{
		{"0.85", 0.85, true}, {" .6 ", 0.6, true}, {"0,7", 0.7, true}, {"85%", 0.85, true},
		{"100 %", 1, true}, {"1", 1, true}, {"0", 0, false}, {"-0.2", 0, false}, {"1.01", 0, false},
		{"", 0, false}, {"abc", 0, false}, {"NaN", 0, false}, {"Inf", 0, false}, {"0.0004", 0, false},
	} {
		got, err := parseMu(tc.in)
		if (err == nil) != tc.ok || (tc.ok && math.Abs(got-tc.want) > 1e-12) {
			t.Errorf("parseMu(%q) = %v, %v; want %v ok=%v", tc.in, got, err, tc.want, tc.ok)
		}
	}
}

// TestNightPalette: every colour of the night palette is red-dominated
// (bridge practice for keeping dark adaptation) and dim.
func TestNightPalette(t *testing.T) {
	p := nightPalette()
	for _, c := range []lipgloss.TerminalColor{p.text, p.dim, p.heading, p.accent, p.onBand, p.water, p.flood, p.hull, p.good, p.caution, p.danger} {
		col, ok := c.(lipgloss.Color)
		if !ok || len(col) != 7 {
			t.Fatalf("night colour %v is not a #rrggbb colour", c)
		}
		var r, g, b int
		if _, err := fmtSscanf(string(col), &r, &g, &b); err != nil {
			t.Fatal(err)
		}
		if !(r > 2*g && r > 2*b && r <= 0xe8) {
			t.Errorf("night colour %s is not a dim red", col)
		}
	}
	if s := newStyles(lipgloss.DefaultRenderer(), monoPalette()); s.Palette != "mono" {
		t.Error("mono palette misnamed")
	}
}

// TestEventLogFile: each change reaches the file, with its time and the
// resulting heel and drafts, before the next key.
func TestEventLogFile(t *testing.T) {
	m, lg, path := loggedModel(t, 100, 30)
	m = openSpaces(t, m, goldenOpen...)
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(string(data)), "\n")
	var opened []string
	for _, l := range lines {
		if strings.Contains(l, "opened to sea") && strings.Contains(l, "→") { // the results' lines
			opened = append(opened, l)
		}
	}
	if len(opened) != 2 {
		t.Fatalf("log file holds %d openings, want 2:\n%s", len(opened), data)
	}
	p := m.cur.Position
	last := opened[1]
	for _, want := range []string{"Wing tank 2 S", heelShort(p.HeelDeg), num(p.DraftAftM, 2) + "/" + num(p.DraftMidM, 2) + "/" + num(p.DraftFwdM, 2)} {
		if !strings.Contains(last, want) {
			t.Errorf("log line %q lacks %q", last, want)
		}
	}
	if _, err := time.Parse(time.RFC3339, strings.Fields(last)[0]); err != nil {
		t.Errorf("log line does not start with its time: %q", last)
	}
	if err := lg.close(); err != nil {
		t.Fatal(err)
	}
}

// TestReportKey writes the Markdown report of the state shown.
func TestReportKey(t *testing.T) {
	m := testModel(t, 100, 30)
	m.opts.ReportDir = t.TempDir()
	m = openSpaces(t, m, "Hold 2")
	m = press(t, m, "w")
	files, _ := filepath.Glob(filepath.Join(m.opts.ReportDir, "*.md"))
	if len(files) != 1 {
		t.Fatalf("%d report files, want 1", len(files))
	}
	data, _ := os.ReadFile(files[0])
	if !bytes.Contains(data, []byte("Hold 2")) {
		t.Errorf("report does not name the open compartment:\n%s", data)
	}
	if !strings.Contains(strings.Join(m.log, "\n"), "report written to") {
		t.Error("the report is not in the event log")
	}
}

// TestProgram drives the whole program through teatest: open two
// compartments, change a permeability, quit.
func TestProgram(t *testing.T) {
	v, info := ship(t)
	m := newModel(v, info, Options{})
	m.now = fixedClock()
	tm := teatest.NewTestModel(t, m, teatest.WithInitialTermSize(100, 30))
	waitFor := func(what string) {
		t.Helper()
		teatest.WaitFor(t, tm.Output(), func(b []byte) bool { return bytes.Contains(b, []byte(what)) },
			teatest.WithDuration(10*time.Second), teatest.WithCheckInterval(20*time.Millisecond))
	}
	waitFor("start, all intact")
	tm.Send(tea.KeyMsg{Type: tea.KeyDown})
	tm.Send(tea.KeyMsg{Type: tea.KeySpace, Runes: []rune{' '}})
	waitFor("opened to sea")
	for i := 0; i < 12; i++ {
		tm.Send(tea.KeyMsg{Type: tea.KeyDown})
	}
	tm.Send(tea.KeyMsg{Type: tea.KeySpace, Runes: []rune{' '}})
	tm.Type("+")
	waitFor("set 1.00")
	tm.Type("q")
	fm := tm.FinalModel(t, teatest.WithFinalTimeout(10*time.Second)).(model)
	open := 0
	for _, s := range fm.damage {
		if s.Open {
			open++
		}
	}
	if open != 2 {
		t.Errorf("%d compartments open at the end, want 2", open)
	}
	if fm.pending() {
		// The last result may still be on its way when q arrives; what is
		// shown must then be an earlier state, never a later one.
		if fm.shown > fm.seq {
			t.Error("shown a result newer than the newest change")
		}
	}
	want := engine.Assess(fm.v, fm.damage)
	if !fm.pending() && fm.cur.Position.Plane != want.Position.Plane {
		t.Error("final figures are not the engine's for the final state")
	}
}

// BenchmarkView measures one redraw of the dashboard with two compartments
// open (it must stay well inside a 16 ms frame).
func BenchmarkView(b *testing.B) {
	for _, size := range [][2]int{{80, 24}, {120, 40}} {
		b.Run(fmtSize(size), func(b *testing.B) {
			m := testModel(b, size[0], size[1])
			m = openSpaces(b, m, goldenOpen...)
			b.ResetTimer()
			for i := 0; i < b.N; i++ {
				_ = m.View()
			}
		})
	}
}

func regexpFind(s, expr string) (string, bool) {
	sub := regexp.MustCompile(expr).FindStringSubmatch(s)
	if sub == nil {
		return "", false
	}
	return sub[1], true
}

func fmtSscanf(hex string, r, g, b *int) (int, error) {
	return fmt.Sscanf(hex, "#%02x%02x%02x", r, g, b)
}

func fmtSize(s [2]int) string { return fmt.Sprintf("%dx%d", s[0], s[1]) }

// TestHandWorkingShown: on the bundled box barge the hand method applies;
// its answers on screen are the engine's hand answers, beside the direct
// ones, and the working scrolls.
func TestHandWorkingShown(t *testing.T) {
	v, info, err := vessels.Open("barge")
	if err != nil {
		t.Fatal(err)
	}
	for _, size := range [][2]int{{100, 30}, {120, 40}} {
		m := newModel(v, info, Options{})
		m.now, m.animate = fixedClock(), false
		m = drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]}, m.Init())
		m = press(t, m, "down", "down", "space", "h")
		a := engine.Assess(v, m.damage)
		if a.Hand == nil {
			t.Fatalf("no hand working for the barge: %s", a.HandWhy)
		}
		view := m.View()
		for _, f := range []struct {
			label        string
			hand, direct float64
		}{
			{"Draft aft", a.Hand.DraftAftM, a.Position.DraftAftM},
			{"Draft fwd", a.Hand.DraftFwdM, a.Position.DraftFwdM},
			{"GM upright", a.Hand.GMM, a.Position.GMUprightM},
		} {
			// Only the hand table has three numbers in a row after the label.
			re := regexp.MustCompile(f.label + `\s+(-?\d+\.\d+)\s+(-?\d+\.\d+)\s+(\d+\.\d+) m`)
			sub := re.FindStringSubmatch(view)
			if sub == nil {
				t.Errorf("%v: no hand row for %s:\n%s", size, f.label, view)
				continue
			}
			if sub[1] != num(f.hand, 2) || sub[2] != num(f.direct, 2) {
				t.Errorf("%v: %s hand %s direct %s on screen; engine hand %v direct %v", size, f.label, sub[1], sub[2], f.hand, f.direct)
			}
		}
		if !strings.Contains(view, a.Hand.Steps[0].Label) {
			t.Errorf("%v: the first step of the working is not on screen", size)
		}
		top := m.View()
		m = press(t, m, "]")
		if m.hand.scroll == 0 || m.View() == top {
			t.Errorf("%v: ] did not scroll the working", size)
		}
		m = press(t, m, "[")
		if m.hand.scroll != 0 {
			t.Errorf("%v: [ did not scroll back", size)
		}
	}
}

func TestStartPalette(t *testing.T) {
	env := func(v string) func(string) string {
		return func(k string) string {
			if k == "NO_COLOR" {
				return v
			}
			return ""
		}
	}
	for _, tc := range []struct{ asked, noColor, want string }{
		{"", "", "day"}, {"night", "", "night"}, {"mono", "", "mono"}, {"bogus", "", "day"},
		{"night", "1", "mono"}, {"day", "yes", "mono"},
	} {
		if got := startPalette(tc.asked, env(tc.noColor)); got != tc.want {
			t.Errorf("startPalette(%q) with NO_COLOR=%q = %q, want %q", tc.asked, tc.noColor, got, tc.want)
		}
	}
}

// TestNoCompartments: a vessel without compartments still draws and every
// key is harmless.
func TestNoCompartments(t *testing.T) {
	h, err := engine.NewBoxHull(30, 8, 3)
	if err != nil {
		t.Fatal(err)
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "Bare pontoon", Hull: h,
		Weights: []engine.Weight{{Name: "all", MassT: 300, LCGM: 15, VCGM: 1.5}}})
	if err != nil {
		t.Fatal(err)
	}
	m := newModel(v, nil, Options{})
	m.now, m.animate = fixedClock(), false
	m = drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24}, m.Init())
	m = press(t, m, "down", "up", "space", "+", "-", "m", "esc", "u", "R", "tab", "tab", "tab", "h", "]", "[")
	if v := m.View(); !strings.Contains(v, "no compartments") || !strings.Contains(v, "FLOATING POSITION") {
		t.Errorf("bare pontoon:\n%s", v)
	}
}
