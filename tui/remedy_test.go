package tui

import (
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"
	"github.com/muesli/termenv"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

// lollRaiseM is how far every weight of the bundled demo barge (an invented
// vessel) is raised to make her loll: upright GM about −0.14 m, lying
// about 11.5° to one side with nothing off the centreline.
const lollRaiseM = 2.5

// lollModel is the dashboard on the bundled barge with every weight raised
// lollRaiseM, as engine/remedy_test.go makes a loll by raising KG.
func lollModel(t testing.TB, w, h int) model {
	t.Helper()
	v, info, err := vessels.Open("barge")
	if err != nil {
		t.Fatal(err)
	}
	raised := *v
	raised.Weights = append([]engine.Weight(nil), v.Weights...)
	for i := range raised.Weights {
		raised.Weights[i].VCGM += lollRaiseM
	}
	lv, err := engine.NewVessel(raised)
	if err != nil {
		t.Fatal(err)
	}
	m := newModel(lv, info, Options{Palette: "day"})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	return drive(t, m, nil, m.Init())
}

// listModel is the bundled ship with Wing tank 2 S open and the righting
// options worked out and shown.
func listModel(t testing.TB, w, h int) model {
	t.Helper()
	m := testModel(t, w, h)
	m = openSpaces(t, m, "Wing tank 2 S")
	return press(t, m, "o")
}

// checkScreen checks that a view is exactly w × h.
func checkScreen(t *testing.T, view string, w, h int) {
	t.Helper()
	lines := strings.Split(view, "\n")
	if len(lines) != h {
		t.Errorf("view has %d lines, want %d", len(lines), h)
	}
	for i, l := range lines {
		if lw := lipgloss.Width(l); lw != w {
			t.Errorf("line %d is %d wide, want %d: %q", i+1, lw, w, l)
		}
	}
}

// TestRemedyPanelGolden draws the righting options at the smallest size
// and a large one: a list (the bundled ship holed in Wing tank 2 S) and a
// loll (the bundled barge with its weights raised), whose warning not to
// ballast the high side is on screen in capitals.
func TestRemedyPanelGolden(t *testing.T) {
	for _, sz := range [][2]int{{80, 24}, {120, 40}} {
		m := listModel(t, sz[0], sz[1])
		if m.rem.set == nil || m.rem.set.Loll || len(m.rem.set.Options) == 0 {
			t.Fatalf("want a list with options: %+v", m.rem.set)
		}
		view := m.View()
		checkScreen(t, view, sz[0], sz[1])
		for _, want := range []string{"LIST, not a loll", "fill Wing tank 2 P from the sea to 65 %", remedyCautionShort[:20]} {
			if sz[1] >= 30 && want == remedyCautionShort[:20] {
				want = remedyCautionLead
			}
			if !strings.Contains(view, want) {
				t.Errorf("%dx%d: %q not on screen", sz[0], sz[1], want)
			}
		}
		checkGolden(t, "remedy_list_"+sizeName(sz), view)

		l := lollModel(t, sz[0], sz[1])
		l = press(t, l, "o")
		rs := l.rem.set
		if rs == nil || !rs.Loll || !(rs.UprightGMM < 0) {
			t.Fatalf("want a loll: %+v", rs)
		}
		view = l.View()
		checkScreen(t, view, sz[0], sz[1])
		high := "PORT"
		if rs.HeelDeg < 0 {
			high = "STARBOARD"
		}
		if !strings.Contains(view, "‼ DO NOT COUNTER-BALLAST THE HIGH ("+high+") SIDE") || !strings.Contains(view, "‼ LOLL, not a list") {
			t.Errorf("%dx%d: the loll warning is not on screen:\n%s", sz[0], sz[1], view)
		}
		checkGolden(t, "remedy_loll_"+sizeName(sz), view)
	}
}

// TestRemedyLollDangerStyle: in a loll the warning lines are drawn in the
// danger style, which carries a colour of its own in the day palette.
func TestRemedyLollDangerStyle(t *testing.T) {
	m := lollModel(t, 80, 24)
	m = press(t, m, "o")
	r := lipgloss.NewRenderer(io.Discard)
	r.SetColorProfile(termenv.TrueColor)
	r.SetHasDarkBackground(true)
	m.rend = r
	m.setStyles()
	found := 0
	for _, l := range m.rem.with(m).lead(m.rem.set, 80) {
		plain := ansi.Strip(l)
		if l != m.st.Danger.Render(plain) || l == plain {
			t.Errorf("not in the danger style: %q", l)
		}
		if strings.Contains(plain, "COUNTER-BALLAST") {
			found++
		}
	}
	if found == 0 {
		t.Error("no line says not to counter-ballast the high side")
	}
}

// TestRemedyFiguresAreTheEngines: the panel's options are
// engine.FindRemedies's for the same vessel and damage state, figure for
// figure, and each is on screen as the engine has it.
func TestRemedyFiguresAreTheEngines(t *testing.T) {
	cases := []struct {
		name string
		m    func(t *testing.T) model
	}{
		{"list", func(t *testing.T) model { return listModel(t, 120, 40) }},
		{"loll", func(t *testing.T) model { return press(t, lollModel(t, 120, 40), "o") }},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m := c.m(t)
			got := m.rem.set
			if got == nil {
				t.Fatal("no options")
			}
			want := engine.FindRemedies(m.v, m.damage)
			if got.Loll != want.Loll || got.Needed != want.Needed || got.HeelDeg != want.HeelDeg ||
				got.UprightGMM != want.UprightGMM || got.Summary != want.Summary || len(got.Options) != len(want.Options) {
				t.Fatalf("panel: loll %v, heel %v, GM₀ %v, %d options; engine: loll %v, heel %v, GM₀ %v, %d options",
					got.Loll, got.HeelDeg, got.UprightGMM, len(got.Options), want.Loll, want.HeelDeg, want.UprightGMM, len(want.Options))
			}
			view := m.View()
			// The notes at the foot of the table may need the panel
			// scrolled on (the wide table's headings, clearer since, take
			// the action's column a little narrower).
			scrolledOn := press(t, m, "]", "]", "]").View()
			for i, w := range want.Options {
				g := got.Options[i]
				if g.Action != w.Action || g.MassT != w.MassT || g.Advisable != w.Advisable || g.Note != w.Note ||
					g.UprightGMM != w.UprightGMM || g.Position.HeelDeg != w.Position.HeelDeg ||
					g.Position.GMM != w.Position.GMM || g.Position.DeckEdge.HeightM != w.Position.DeckEdge.HeightM {
					t.Errorf("option %d: panel %q %v t, engine %q %v t", i+1, g.Action, g.MassT, w.Action, w.MassT)
				}
				cols := remedyColumns(m.width)
				start := padLeft(strconv.Itoa(i+1), 2) + " " + wrapKeep(w.Action, cols.actionW)[0]
				line := lineStarting(view, start)
				adv := "yes"
				if !w.Advisable {
					adv = "NO"
				}
				for _, fig := range []string{massText(w.MassT), heelShort(w.Position.HeelDeg), num(w.Position.GMAtRestM, 2),
					num(w.Position.DeckEdge.HeightM, 2), num(w.UprightGMM, 2), num(w.LowestOpeningM, 2), adv} {
					if !strings.Contains(line, " "+fig) {
						t.Errorf("option %d: %q not in its row %q", i+1, fig, line)
					}
				}
				note := padLeft(strconv.Itoa(i+1), 2) + " " + wrap(w.Note, m.width-3)[0]
				if lineStarting(view, note) == "" && lineStarting(scrolledOn, note) == "" {
					t.Errorf("option %d: its note %q is not on screen", i+1, note)
				}
			}
		})
	}
}

// lineStarting returns the first line of view that starts with s.
func lineStarting(view, s string) string {
	for _, l := range strings.Split(view, "\n") {
		if strings.HasPrefix(l, s) {
			return l
		}
	}
	return ""
}

// TestRemedyStale: an older request's options never replace a newer
// one's, whether its Cmd starts after the newer request (it does nothing)
// or had started before (its message is dropped); options that arrive for
// a state changed since are marked out of date and none is shown, and an
// undo back to their state shows them again.
func TestRemedyStale(t *testing.T) {
	m := testModel(t, 80, 24)
	m = openSpaces(t, m, "Wing tank 2 S")
	dA := cloneDamage(m.damage)
	mm, cmdA := m.Update(keyMsg("o"))
	m = mm.(model)
	seqA := m.rem.seq
	if !m.rem.running || !strings.Contains(m.View(), "computing") || !strings.Contains(m.View(), "Working out the righting options") {
		t.Fatalf("no computing mark while the options are worked out:\n%s", m.View())
	}
	// A newer state and a newer request, computed to the end.
	m = openSpaces(t, m, "Hold 2")
	if !strings.Contains(m.View(), "OUT OF DATE") {
		t.Errorf("a request for an earlier state is not marked out of date:\n%s", m.View())
	}
	m = press(t, m, "o")
	dB := cloneDamage(m.damage)
	if m.rem.set == nil || !sameDamage(m.rem.set.Damage, dB) {
		t.Fatal("the newer request's options are not shown")
	}
	nB := len(m.rem.set.Options)
	// The older Cmd, started now, does nothing.
	m = drive(t, m, nil, cmdA)
	if !sameDamage(m.rem.set.Damage, dB) {
		t.Error("the older request replaced the newer one's options")
	}
	// The older request's options, had it started first, are dropped.
	m = drive(t, m, remedyMsg{seq: seqA, set: engine.FindRemedies(m.v, dA)})
	if !sameDamage(m.rem.set.Damage, dB) || len(m.rem.set.Options) != nB {
		t.Error("the older request's message was taken")
	}

	// Options for a state changed while they were worked out.
	mm, cmd := m.Update(keyMsg("u")) // Hold 2 closed again: the state of A
	m = drive(t, mm.(model), nil, cmd)
	mm, cmd = m.Update(keyMsg("o"))
	m = mm.(model)
	m = openSpaces(t, m, "DB 2 P")
	m = drive(t, m, nil, cmd)
	if m.rem.set == nil || !sameDamage(m.rem.set.Damage, dA) {
		t.Fatal("the newest request's options were not kept")
	}
	view := m.View()
	if !strings.Contains(view, "OUT OF DATE") || strings.Contains(view, "fill Wing tank 2 P") {
		t.Errorf("options for an earlier state are not cleared and marked out of date:\n%s", view)
	}
	m = press(t, m, "u")
	if view := m.View(); strings.Contains(view, "OUT OF DATE") || !strings.Contains(view, "fill Wing tank 2 P") {
		t.Errorf("back at their state the options are not shown again:\n%s", view)
	}
	// o on current options hides the panel; again it shows them without
	// working them out again.
	seq := m.rem.seq
	m = press(t, m, "o")
	if m.rem.show || strings.Contains(m.View(), "RIGHTING OPTIONS") {
		t.Error("o did not hide the panel")
	}
	m = press(t, m, "o")
	if !m.rem.show || m.rem.seq != seq {
		t.Errorf("o showed the panel again with request %d (was %d)", m.rem.seq, seq)
	}
	// An engine failure is said, not shown as options.
	m = openSpaces(t, m, "Hold 2")
	mm, _ = m.Update(keyMsg("o"))
	m = drive(t, mm.(model), remedyMsg{seq: mm.(model).rem.seq, err: "engine: test failure"})
	if v := m.View(); !strings.Contains(v, "could not be worked out") || m.rem.running {
		t.Errorf("a failure is not on screen:\n%s", v)
	}
}

// TestRemedyInReport: the report key's Markdown carries the righting
// options as report renders them when they are current, waits for them
// while they are being worked out for the state shown, and leaves them out
// once the state has changed.
func TestRemedyInReport(t *testing.T) {
	read := func(t *testing.T, dir string, n int) string {
		t.Helper()
		files, _ := filepath.Glob(filepath.Join(dir, "*.md"))
		if len(files) != n {
			t.Fatalf("%d report files, want %d", len(files), n)
		}
		data, err := os.ReadFile(files[n-1])
		if err != nil {
			t.Fatal(err)
		}
		return string(data)
	}
	m := listModel(t, 100, 30)
	m.opts.ReportDir = t.TempDir()
	m = press(t, m, "w")
	md := read(t, m.opts.ReportDir, 1)
	for _, want := range []string{"## " + report.RemediesHeading, m.rem.set.Options[0].Action, report.RemediesCaution} {
		if !strings.Contains(md, want) {
			t.Errorf("report lacks %q", want)
		}
	}

	// Asked for while the options are being worked out: written once they
	// are in, with them.
	w := testModel(t, 100, 30)
	w.opts.ReportDir = t.TempDir()
	w = openSpaces(t, w, "Wing tank 2 S")
	mm, cmd := w.Update(keyMsg("o"))
	w = press(t, mm.(model), "w")
	if files, _ := filepath.Glob(filepath.Join(w.opts.ReportDir, "*.md")); len(files) != 0 || !w.wantRep {
		t.Fatal("the report did not wait for the options")
	}
	w = drive(t, w, nil, cmd)
	if md := read(t, w.opts.ReportDir, 1); !strings.Contains(md, "## "+report.RemediesHeading) {
		t.Error("the report written after the options came in lacks them")
	}

	// Out of date: left out.
	m = openSpaces(t, m, "Hold 2")
	m = press(t, m, "w")
	if md := read(t, m.opts.ReportDir, 2); strings.Contains(md, report.RemediesHeading) {
		t.Error("options for an earlier state went into the report")
	}
}

// TestRemedySmallSizes: the panel in every state at sizes down to nothing
// never panics, never overflows the screen and never shows NaN.
func TestRemedySmallSizes(t *testing.T) {
	list := listModel(t, 100, 30)
	loll := press(t, lollModel(t, 100, 30), "o")
	mm, _ := testModel(t, 100, 30).Update(keyMsg("o"))
	running := mm.(model)
	stale := openSpaces(t, list, "Hold 2")
	helpOpen := press(t, list, "?")
	for name, m := range map[string]model{"list": list, "loll": loll, "running": running, "out of date": stale, "full help": helpOpen} {
		for _, sz := range [][2]int{{20, 5}, {0, 0}, {1, 1}, {79, 24}, {80, 24}, {81, 25}, {100, 30}, {109, 40}, {120, 40}, {200, 60}} {
			v := checkFits(t, name, m, sz[0], sz[1])
			if sz[0] >= minWidth && sz[1] >= minHeight && !strings.Contains(v, "RIGHTING OPTIONS") {
				t.Errorf("%s %dx%d: the panel is not on screen", name, sz[0], sz[1])
			}
		}
		for w := 0; w <= 60; w += 5 {
			for h := 0; h <= 20; h += 3 {
				part := viewLines(m.rem.with(m).view(w, h))
				if len(part) != h {
					t.Errorf("%s: panel of %dx%d has %d lines", name, w, h, len(part))
				}
				for _, l := range part {
					if lw := lipgloss.Width(l); lw > w {
						t.Errorf("%s: panel of %dx%d has a line %d wide", name, w, h, lw)
					}
				}
			}
		}
		// Scrolling past either end stays within the panel.
		s := press(t, m, "]", "]", "]", "]", "]", "]", "]", "]", "]", "]")
		if most := s.rem.with(s).scrollMax(); s.rem.scroll > most {
			t.Errorf("%s: scrolled to %d, past %d", name, s.rem.scroll, most)
		}
		s = press(t, s, "[", "[", "[", "[", "[", "[", "[", "[", "[", "[", "[")
		if s.rem.scroll != 0 {
			t.Errorf("%s: scrolled back to %d", name, s.rem.scroll)
		}
	}
	// Every palette draws it.
	for p := 0; p < len(paletteNames); p++ {
		list = press(t, list, "c")
		if v := list.View(); strings.Contains(v, "%!") || !strings.Contains(v, "RIGHTING OPTIONS") {
			t.Errorf("palette %s: the panel is not drawn right", list.st.Palette)
		}
	}
}

// TestRemedyAndRunPanel: the run's panel and the righting options take
// turns: t brings the run's panel in their place, o puts them back.
func TestRemedyAndRunPanel(t *testing.T) {
	m := listModel(t, 80, 24)
	m = press(t, m, "t")
	if m.rem.show || !m.flood.show || !strings.Contains(m.View(), "FLOODING RUN") {
		t.Fatal("t did not bring the run's panel")
	}
	m = press(t, m, "o")
	if !m.rem.show || !strings.Contains(m.View(), "RIGHTING OPTIONS") {
		t.Fatal("o did not bring the options back")
	}
	m = selectSpace(t, m, "Wing tank 2 P")
	m = press(t, m, "f", "enter")
	if m.rem.show || !strings.Contains(m.View(), "FLOODING RUN") {
		t.Error("a run started does not show its panel")
	}
}
