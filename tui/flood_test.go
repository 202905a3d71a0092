package tui

import (
	"math"
	"strings"
	"testing"

	"github.com/charmbracelet/bubbles/spinner"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

// bundledModel is testModel on the bundled vessel of that name.
func bundledModel(t testing.TB, name string, w, h int) model {
	t.Helper()
	v, info, err := vessels.Open(name)
	if err != nil {
		t.Fatalf("opening the bundled vessel %q: %v", name, err)
	}
	m := newModel(v, info, Options{Palette: "day"})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	return drive(t, m, nil, m.Init())
}

// driveUntil is drive that stops once stop says so of a message it has
// just handled, and returns the Cmds not yet run.
func driveUntil(t testing.TB, m model, cmds []tea.Cmd, stop func(tea.Msg) bool) (model, []tea.Cmd) {
	t.Helper()
	for len(cmds) > 0 {
		c := cmds[0]
		cmds = cmds[1:]
		if c == nil {
			continue
		}
		switch msg := c().(type) {
		case nil, spinner.TickMsg, tea.QuitMsg:
		case tea.BatchMsg:
			cmds = append(cmds, msg...)
		default:
			mm, cmd := m.Update(msg)
			m = mm.(model)
			cmds = append(cmds, cmd)
			if stop(msg) {
				return m, cmds
			}
		}
	}
	return m, cmds
}

// typeField replaces the value of a form field by typing.
func typeField(t testing.TB, m model, field int, text string) model {
	t.Helper()
	for m.form.focus != field {
		m = press(t, m, "tab")
	}
	m.form.fields[field].SetValue("")
	for _, r := range text {
		m = press(t, m, string(r))
	}
	return m
}

// TestFloodPanelGolden draws the panel of a flooding run of Wing tank 2 S
// of the bundled ship, through the vessel file's hole against its pumps,
// at the smallest size and a large one, and the panel while the run is
// computing.
func TestFloodPanelGolden(t *testing.T) {
	check := func(t *testing.T, name string, m model, w, h int) {
		t.Helper()
		view := m.View()
		checkScreen(t, view, w, h)
		checkGolden(t, name, view)
	}
	for _, sz := range [][2]int{{80, 24}, {120, 40}} {
		m := testModel(t, sz[0], sz[1])
		m = selectSpace(t, m, "Wing tank 2 S")
		m = press(t, m, "f", "enter")
		if m.flood.rep == nil {
			t.Fatalf("no report after the run: %q", m.flood.err)
		}
		check(t, "flood_"+sizeName(sz), m, sz[0], sz[1])
	}
	// Part way: five steps taken, the progress bar and the flooding time
	// on screen.
	m := testModel(t, 80, 24)
	m = selectSpace(t, m, "Wing tank 2 S")
	m = press(t, m, "f")
	mm, cmd := m.Update(keyMsg("enter"))
	steps := 0
	m, _ = driveUntil(t, mm.(model), []tea.Cmd{cmd}, func(msg tea.Msg) bool {
		if _, ok := msg.(floodStepMsg); ok {
			steps++
		}
		return steps == 6
	})
	if !m.flood.running || m.flood.prog.Steps != 5 {
		t.Fatalf("not running after five steps: running %v, steps %d", m.flood.running, m.flood.prog.Steps)
	}
	view := m.View()
	if !strings.Contains(view, "flooding time "+report.Duration(m.flood.prog.TimeS)) || !strings.Contains(view, "█") {
		t.Errorf("no progress bar and flooding time on screen:\n%s", view)
	}
	check(t, "flood_running_80x24", m, 80, 24)
}

func sizeName(sz [2]int) string {
	return strings.Join([]string{itoa(sz[0]), itoa(sz[1])}, "x")
}

func itoa(n int) string { return num(float64(n), 0) }

// TestFloodTimesAreTheEngines runs the same case straight through the
// engine (engine.RunFlood, the vessel's criteria) and checks that the
// panel's times, volumes and stages are the engine's FloodReport figures,
// and that each is on screen as the engine has it. The case, Wing tank 2 S
// without pumps with Hold 2 already open, passes a criterion failure and
// the deck edge before the levels meet (the bundled ship is a cargo ship:
// no margin line).
func TestFloodTimesAreTheEngines(t *testing.T) {
	m := testModel(t, 120, 40)
	m = openSpaces(t, m, "Hold 2")
	m = selectSpace(t, m, "Wing tank 2 S")
	m = press(t, m, "f")
	m = typeField(t, m, fieldPump, "0")
	m = press(t, m, "enter")
	got := m.flood.rep
	if got == nil {
		t.Fatalf("no report: %q", m.flood.err)
	}
	ci := m.sel
	d := m.v.Intact()
	for i, c := range m.v.Compartments {
		if c.Name == "Hold 2" {
			d[i].Open = true
		}
	}
	fh := m.spaces[ci].hole
	want, err := engine.RunFlood(engine.FloodCase{Vessel: m.v, Base: d, Compartment: ci,
		Hole:     *fh,
		Criteria: engine.FloodCriteria(vesselShipType(t))}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if got.End != want.End || got.EndS != want.EndS || got.EqualiseS != want.EqualiseS || got.FinalWaterM3 != want.FinalWaterM3 {
		t.Fatalf("end: panel %v at %v s (equalise %v, %v m³), engine %v at %v s (equalise %v, %v m³)",
			got.End, got.EndS, got.EqualiseS, got.FinalWaterM3, want.End, want.EndS, want.EqualiseS, want.FinalWaterM3)
	}
	if len(got.Events) != len(want.Events) || len(want.Events) < 3 {
		t.Fatalf("events: panel %d, engine %d (want at least criterion, deck edge, end)", len(got.Events), len(want.Events))
	}
	view := m.View()
	for i, e := range want.Events {
		g := got.Events[i]
		if g.Kind != e.Kind || g.Name != e.Name || g.TimeS != e.TimeS || g.WaterM3 != e.WaterM3 {
			t.Errorf("event %d: panel %+v, engine %+v", i, g, e)
		}
		ts := e.TimeS
		if e.Kind == engine.RunEnds {
			ts = want.EqualiseS
		}
		line := lineWith(view, eventWords(e, &want))
		if line == "" || !strings.Contains(line, report.Duration(ts)) || !strings.Contains(line, num(e.WaterM3, 0)+" m³") {
			t.Errorf("event %v %q: screen line %q, want %s and %s m³", e.Kind, e.Name, line, report.Duration(ts), num(e.WaterM3, 0))
		}
	}
	if len(got.Stages) != len(want.Stages) {
		t.Fatalf("stages: panel %d, engine %d", len(got.Stages), len(want.Stages))
	}
	for i, s := range want.Stages {
		g := got.Stages[i]
		if g.WaterM3 != s.WaterM3 || g.TimeS != s.TimeS || (g.Position == nil) != (s.Position == nil) ||
			(s.Position != nil && g.Position.HeelDeg != s.Position.HeelDeg) {
			t.Errorf("stage %v: panel %v m³ at %v s, engine %v m³ at %v s", s.Fraction, g.WaterM3, g.TimeS, s.WaterM3, s.TimeS)
		}
		line := lineWith(view, padLeft(stageName(s.Fraction), 4)+" "+padLeft(num(s.WaterM3, 0), 4)+" ")
		if line == "" || !strings.Contains(line, report.Duration(s.TimeS)) ||
			(s.Position != nil && !strings.Contains(line, heelShort(s.Position.HeelDeg))) {
			t.Errorf("stage %v: screen line %q, want %s and heel %s", s.Fraction, line, report.Duration(s.TimeS), heelShort(s.Position.HeelDeg))
		}
	}
	if !strings.Contains(view, "LEVELS EQUAL after "+report.Duration(want.EqualiseS)) {
		t.Errorf("the time to equalise (%s) is not on screen", report.Duration(want.EqualiseS))
	}
}

// vesselShipType is the bundled ship's type from its file.
func vesselShipType(t *testing.T) string {
	t.Helper()
	_, info := ship(t)
	return info.ShipType
}

// lineWith returns the part of the first line of view that holds s, from
// s's panel column on (the text between the separators), or "".
func lineWith(view, s string) string {
	for _, l := range strings.Split(view, "\n") {
		for _, part := range strings.Split(l, "│") {
			if strings.Contains(part, s) {
				return part
			}
		}
	}
	return ""
}

// TestFloodStaleRun: a newer request, or hiding the panel, cancels a run
// in progress: the older run's messages are dropped, take no step and issue
// no Cmd, and the report shown is the newest request's.
func TestFloodStaleRun(t *testing.T) {
	m := bundledModel(t, "barge", 100, 30)
	m = selectSpace(t, m, "2 wing void S")
	// Run A: the file's hole. Its first step is taken, then B is asked for.
	m = press(t, m, "f")
	mm, cmdA := m.Update(keyMsg("enter"))
	m = mm.(model)
	msgA := runFirstOf[floodStepMsg](cmdA)
	if msgA == nil || msgA.run == nil {
		t.Fatal("run A did not start")
	}
	mm, nextA := m.Update(*msgA)
	m = mm.(model)
	if nextA == nil {
		t.Fatal("run A's start issued no step")
	}
	// Run B: a hole twice the size.
	m = press(t, m, "f")
	m = typeField(t, m, fieldArea, "0.1")
	mm, cmdB := m.Update(keyMsg("enter"))
	m = mm.(model)
	// A's next step, issued before B was asked for, now does nothing.
	stale := nextA().(floodStepMsg)
	if !stale.stale || stale.run != nil {
		t.Errorf("a step of the superseded run was taken: %+v", stale)
	}
	// A's messages, even a live-looking one, are dropped with no Cmd.
	before := m.flood
	for _, msg := range []tea.Msg{*msgA, floodDoneMsg{seq: msgA.seq}} {
		mm, cmd := m.Update(msg)
		if cmd != nil {
			t.Errorf("a message of the superseded run issued a Cmd (%T)", msg)
		}
		if mm.(model).flood.prog != before.prog || mm.(model).flood.rep != nil {
			t.Errorf("a message of the superseded run changed the panel (%T)", msg)
		}
	}
	m = drive(t, m, nil, cmdB)
	if m.flood.rep == nil || m.flood.rep.Hole.AreaM2 != 0.1 {
		t.Fatalf("the report is not run B's: %+v", m.flood.rep)
	}

	// Hiding the panel stops a run in progress; its messages are dropped.
	m = press(t, m, "f")
	mm, cmdC := m.Update(keyMsg("enter"))
	m = mm.(model)
	msgC := runFirstOf[floodStepMsg](cmdC)
	m = press(t, m, "t")
	if m.flood.running || m.flood.show {
		t.Fatal("t did not stop the run and hide the panel")
	}
	if mm, cmd := m.Update(*msgC); cmd != nil || mm.(model).flood.running {
		t.Error("a stopped run went on")
	}
	if !strings.Contains(strings.Join(m.log, "\n"), "stopped before its end") {
		t.Error("the log does not say the run was stopped")
	}
}

// runFirstOf runs a Cmd (or the Cmds of a batch) and returns the first
// message of type T.
func runFirstOf[T any](cmd tea.Cmd) *T {
	if cmd == nil {
		return nil
	}
	switch msg := cmd().(type) {
	case tea.BatchMsg:
		for _, c := range msg {
			if r := runFirstOf[T](c); r != nil {
				return r
			}
		}
	case T:
		return &msg
	}
	return nil
}

// TestFloodForm: the defaults come from the vessel file (or a shell hole
// at the compartment's lowest point), a bad field is refused with a
// sentence and the form stays, esc cancels.
func TestFloodForm(t *testing.T) {
	m := testModel(t, 100, 30)
	m = selectSpace(t, m, "Wing tank 2 S")
	m = press(t, m, "f")
	if m.mode != modeForm {
		t.Fatal("f did not open the form")
	}
	vals := func(m model) []string {
		var out []string
		for _, f := range m.form.fields {
			out = append(out, f.Value())
		}
		return out
	}
	// vessels/bundled/freighter.toml: hole = { area = 0.08, z = 2.0, cd = 0.7 }, pump_m3h = 120.
	if got := strings.Join(vals(m), " "); got != "0.08 2 0.7 120" {
		t.Errorf("defaults for Wing tank 2 S: %q, want the vessel file's 0.08 2 0.7 120", got)
	}
	if !strings.Contains(m.View(), "the vessel file's hole") {
		t.Error("the form does not say the hole is the vessel file's")
	}
	for _, tc := range []struct {
		field int
		text  string
		say   string
	}{
		{fieldArea, "0", "hole area"},
		{fieldArea, "big", "not a number"},
		{fieldZ, "30", "outside Wing tank 2 S"},
		{fieldCd, "1.5", "discharge coefficient"},
		{fieldPump, "-5", "pumps"},
		{fieldPump, "", "empty"},
	} {
		mm := typeField(t, m, tc.field, tc.text)
		mm = press(t, mm, "enter")
		if mm.mode != modeForm || mm.flood.seq != 0 || !strings.Contains(mm.form.err, tc.say) {
			t.Errorf("field %d %q: form on %v, run %d, error %q (want it to say %q)", tc.field, tc.text, mm.mode == modeForm, mm.flood.seq, mm.form.err, tc.say)
		}
		if mm.form.focus != tc.field {
			t.Errorf("field %d %q: the cursor is on field %d, not on the bad one", tc.field, tc.text, mm.form.focus)
		}
		if !strings.Contains(mm.View(), tc.say) {
			t.Errorf("field %d %q: the refusal is not on screen", tc.field, tc.text)
		}
	}
	m = press(t, m, "esc")
	if m.mode == modeForm || m.flood.seq != 0 {
		t.Error("esc did not cancel the form")
	}
	// A compartment the file gives no hole: a shell hole of defaultHoleM2
	// at its lowest point, the file's pumps.
	m = selectSpace(t, m, "Hold 2")
	m = press(t, m, "f")
	sp := m.spaces[m.sel]
	if sp.hole != nil {
		t.Fatal("Hold 2 has a hole in the file: pick another compartment for this check")
	}
	want := []string{short(defaultHoleM2, 4), short(sp.shellZ, 2), "0.6", short(sp.pump, 0)}
	if got := vals(m); strings.Join(got, " ") != strings.Join(want, " ") {
		t.Errorf("defaults for Hold 2: %q, want %q", got, want)
	}
	if !(sp.shellZ >= m.v.Compartments[m.sel].Box.Z0) {
		t.Errorf("Hold 2's shell hole at z %v is below the compartment", sp.shellZ)
	}
}

// TestFloodStageOnDashboard: the stage key puts the run's stages on the
// dashboard one after another as water held in the compartment; the
// figures are then the engine's for that stage (the same added-weight
// solve), the list says "part", and the section shades the water.
func TestFloodStageOnDashboard(t *testing.T) {
	m := bundledModel(t, "barge", 100, 30)
	m = selectSpace(t, m, "2 wing void S")
	ci := m.sel
	m = press(t, m, "f", "enter")
	rep := m.flood.rep
	if rep == nil {
		t.Fatalf("no report: %q", m.flood.err)
	}
	m = press(t, m, "t", "s")
	st := rep.Stages[0]
	if m.damage[ci].WaterM3 != st.WaterM3 || m.damage[ci].Open {
		t.Fatalf("after s: %+v, want %v m³ held", m.damage[ci], st.WaterM3)
	}
	p := m.cur.Position
	if p == nil || st.Position == nil {
		t.Fatal("no floating position at the 25 % stage")
	}
	// The engine's stage position (engine.FloodRun.stage) against the
	// dashboard's assessment of the same damage state: one solve of the
	// same equations, to the solver's tolerance.
	for _, f := range []struct {
		what      string
		got, want float64
		tol       float64
	}{
		{"draft aft", p.DraftAftM, st.Position.DraftAftM, 1e-4},
		{"draft fwd", p.DraftFwdM, st.Position.DraftFwdM, 1e-4},
		{"heel", p.HeelDeg, st.Position.HeelDeg, 1e-3},
	} {
		if math.Abs(f.got-f.want) > f.tol {
			t.Errorf("%s at the 25 %% stage: dashboard %v, engine %v", f.what, f.got, f.want)
		}
	}
	held := false
	for _, h := range p.Held {
		held = held || (h.Index == ci && math.Abs(h.VolumeM3-st.WaterM3) < 1e-6)
	}
	if !held {
		t.Errorf("the position holds no water in the compartment: %+v", p.Held)
	}
	if word, _ := spaceState(m.damage, ci); word != "part" {
		t.Errorf("the list says %q, want part", word)
	}
	// The next stage, its water shaded in the section; then undo back.
	m = press(t, m, "s")
	if m.damage[ci].WaterM3 != rep.Stages[1].WaterM3 {
		t.Errorf("second s: %v m³, want the 50 %% stage's %v", m.damage[ci].WaterM3, rep.Stages[1].WaterM3)
	}
	sec := strings.Join(m.sectionView(60, 14), "\n")
	if strings.Count(sec, string(floodShade)) == 0 {
		t.Errorf("no water shaded in the section of the partly flooded compartment:\n%s", sec)
	}
	m = press(t, m, "u")
	if m.damage[ci].WaterM3 != st.WaterM3 {
		t.Errorf("undo: %v m³, want %v", m.damage[ci].WaterM3, st.WaterM3)
	}
	// Closing it up empties it.
	m = press(t, m, "space")
	if m.damage[ci] != (engine.SpaceState{}) {
		t.Errorf("space on a partly flooded compartment: %+v, want intact", m.damage[ci])
	}
}

// TestFloodSmallSizes: no panic and no line wider than the screen with the
// panel shown, the run in progress, or the form open, at any size.
func TestFloodSmallSizes(t *testing.T) {
	m := bundledModel(t, "barge", 100, 30)
	m = selectSpace(t, m, "2 wing void S")
	done := press(t, m, "f", "enter")
	running := press(t, m, "f")
	mm, cmd := running.Update(keyMsg("enter"))
	running, _ = driveUntil(t, mm.(model), []tea.Cmd{cmd}, func(msg tea.Msg) bool { _, ok := msg.(floodStepMsg); return ok })
	form := press(t, m, "f")
	empty := press(t, m, "t")
	for name, mm := range map[string]model{"done": done, "running": running, "form": form, "no run": empty} {
		for _, sz := range [][2]int{{20, 5}, {0, 0}, {1, 1}, {79, 24}, {80, 24}, {81, 25}, {100, 30}, {120, 40}, {119, 45}, {200, 60}} {
			checkFits(t, name, mm, sz[0], sz[1])
		}
		// Every palette (the progress bar takes its colour from it).
		if name != "form" {
			for p := 0; p < len(paletteNames); p++ {
				mm = press(t, mm, "c")
				if v := mm.View(); strings.Contains(v, "%!") {
					t.Errorf("%s, palette %s: a formatting error on screen", name, mm.st.Palette)
				}
			}
		}
		// Panel parts at widths and heights down to nothing.
		for w := 0; w <= 50; w += 5 {
			for h := 0; h <= 20; h += 4 {
				f := mm.flood.with(mm)
				for _, part := range [][]string{viewLines(f.view(w, h)), f.text(w, h, h), f.plot(w, h), viewLines(f.row(w, h, mm.sectionPicture))} {
					for _, l := range part {
						if lw := lipgloss.Width(l); lw > max(w, 0) {
							t.Errorf("%s: a panel part of %dx%d has a line %d wide", name, w, h, lw)
						}
					}
				}
			}
		}
	}
}

// TestFloodCapsizes: the test barge (parts_test.go) flooding its whole
// hull through a shell hole at the keel capsizes on the way; the panel says
// so in capitals with the engine's time and reason, lists what went under
// before, and golden-tests the screen.
func TestFloodCapsizes(t *testing.T) {
	v := testBarge(t, 2.5)
	m := newModel(v, nil, Options{})
	m.now, m.animate = fixedClock(), false
	m = drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24}, m.Init())
	m = selectSpace(t, m, "Whole hull")
	m = press(t, m, "f", "enter")
	got := m.flood.rep
	if got == nil {
		t.Fatalf("no report: %q", m.flood.err)
	}
	h, err := engine.ShellHole(v, m.sel, defaultHoleM2, m.spaces[m.sel].shellZ, engine.DefaultDischargeCoefficient)
	if err != nil {
		t.Fatal(err)
	}
	want, err := engine.RunFlood(engine.FloodCase{Vessel: v, Compartment: m.sel, Hole: h, Criteria: engine.FloodCriteria("")}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if want.End != engine.FloodCapsizes || got.End != want.End || got.EndS != want.EndS {
		t.Fatalf("end: panel %v at %v s, engine %v at %v s (want capsizes)", got.End, got.EndS, want.End, want.EndS)
	}
	view := m.View()
	if !strings.Contains(view, "SHE CAPSIZES after "+report.Duration(want.EndS)) {
		t.Errorf("no capsize verdict with the engine's time %s:\n%s", report.Duration(want.EndS), view)
	}
	for _, e := range want.Events {
		at := eventMark(e.Kind) + " " + padLeft(report.Duration(e.TimeS), 11)
		if line := lineWith(view, at); !strings.Contains(line, num(e.WaterM3, 0)+" m³") {
			t.Errorf("event %v %q: no line %q with %s m³ on screen (%q)", e.Kind, e.Name, at, num(e.WaterM3, 0), line)
		}
	}
	checkGolden(t, "flood_capsizes_80x24", view)
}
