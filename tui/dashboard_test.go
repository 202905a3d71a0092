package tui

import (
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// updating reports whether -update was given. The flag itself is defined
// by teatest's golden package, which this test binary links in.
func updating() bool {
	f := flag.Lookup("update")
	return f != nil && f.Value.String() == "true"
}

func init() {
	// Goldens hold the text of the screen, not the terminal's colour codes.
	lipgloss.SetColorProfile(termenv.Ascii)
}

// ship returns the bundled default vessel.
func ship(t testing.TB) (*engine.Vessel, *vessels.Info) {
	t.Helper()
	v, info, err := vessels.Open(vessels.Default)
	if err != nil {
		t.Fatalf("opening the bundled vessel %q: %v", vessels.Default, err)
	}
	return v, info
}

// fixedClock returns a clock that starts at a fixed time and moves one
// second at each reading, so that goldens and logs are stable.
func fixedClock() func() time.Time {
	t0 := time.Date(2025, 3, 14, 2, 30, 0, 0, time.UTC)
	n := 0
	return func() time.Time {
		n++
		return t0.Add(time.Duration(n) * time.Second)
	}
}

// testModel is the dashboard for tests: fixed clock, no spinner ticks,
// sized, with the intact condition computed.
func testModel(t testing.TB, w, h int) model {
	t.Helper()
	v, info := ship(t)
	m := newModel(v, info, Options{Palette: "day"})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	return drive(t, m, nil, m.Init())
}

// drive feeds msg to the model and then runs every Cmd that comes back
// synchronously, feeding its message back in, until none is left. Spinner
// ticks are animation only and are dropped.
func drive(t testing.TB, m model, msg tea.Msg, cmds ...tea.Cmd) model {
	t.Helper()
	if msg != nil {
		var cmd tea.Cmd
		mm, cmd := m.Update(msg)
		m = mm.(model)
		cmds = append(cmds, cmd)
	}
	m, _ = driveUntil(t, m, cmds, func(tea.Msg) bool { return false })
	return m
}

func keyMsg(k string) tea.Msg {
	switch k {
	case "down":
		return tea.KeyMsg{Type: tea.KeyDown}
	case "up":
		return tea.KeyMsg{Type: tea.KeyUp}
	case "space":
		return tea.KeyMsg{Type: tea.KeySpace, Runes: []rune{' '}}
	case "enter":
		return tea.KeyMsg{Type: tea.KeyEnter}
	case "esc":
		return tea.KeyMsg{Type: tea.KeyEsc}
	case "tab":
		return tea.KeyMsg{Type: tea.KeyTab}
	case "home":
		return tea.KeyMsg{Type: tea.KeyHome}
	}
	return tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(k)}
}

// press sends keys one after another, each computed to the end.
func press(t testing.TB, m model, keys ...string) model {
	t.Helper()
	for _, k := range keys {
		m = drive(t, m, keyMsg(k))
	}
	return m
}

// selectSpace moves the cursor to the named compartment with the arrow keys.
func selectSpace(t testing.TB, m model, name string) model {
	t.Helper()
	m = press(t, m, "home")
	for i := 0; i < len(m.v.Compartments)+1; i++ {
		if m.v.Compartments[m.sel].Name == name {
			return m
		}
		m = press(t, m, "down")
	}
	t.Fatalf("compartment %q not reached in the list", name)
	return m
}

// openSpaces opens the named compartments to the sea.
func openSpaces(t testing.TB, m model, names ...string) model {
	t.Helper()
	for _, n := range names {
		m = selectSpace(t, m, n)
		m = press(t, m, "space")
		if !m.damage[m.sel].Open {
			t.Fatalf("%s did not open", n)
		}
	}
	return m
}

// The two compartments opened in the damaged goldens: a hold and the wing
// tank beside it on one side, so that she heels.
var goldenOpen = []string{"Hold 2", "Wing tank 2 S"}

func checkGolden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join("testdata", name+".golden")
	if updating() {
		if err := os.MkdirAll("testdata", 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test ./tui -update to write it)", err)
	}
	if string(want) != got {
		g, w := strings.Split(got, "\n"), strings.Split(string(want), "\n")
		var diff []string
		for i := 0; i < max(len(g), len(w)); i++ {
			var gl, wl string
			if i < len(g) {
				gl = g[i]
			}
			if i < len(w) {
				wl = w[i]
			}
			if gl != wl {
				diff = append(diff, fmt.Sprintf("line %d\n  got:  %s\n  want: %s", i+1, gl, wl))
			}
		}
		t.Errorf("View() differs from %s (go test ./tui -update rewrites it after a deliberate change):\n%s", path, strings.Join(diff, "\n"))
	}
}

// TestViewGolden draws the bundled ship intact and with two compartments
// open at the smallest supported size and at a large one.
func TestViewGolden(t *testing.T) {
	for _, tc := range []struct {
		name string
		w, h int
		open []string
	}{
		{"intact_80x24", 80, 24, nil},
		{"open_80x24", 80, 24, goldenOpen},
		{"intact_120x40", 120, 40, nil},
		{"open_120x40", 120, 40, goldenOpen},
	} {
		t.Run(tc.name, func(t *testing.T) {
			m := testModel(t, tc.w, tc.h)
			m = openSpaces(t, m, tc.open...)
			view := m.View()
			lines := strings.Split(view, "\n")
			if len(lines) != tc.h {
				t.Errorf("view has %d lines, want %d", len(lines), tc.h)
			}
			for i, l := range lines {
				if w := lipgloss.Width(l); w != tc.w {
					t.Errorf("line %d is %d wide, want %d: %q", i+1, w, tc.w, l)
				}
			}
			checkGolden(t, tc.name, view)
		})
	}
}

// figureOnScreen reads the first number after label on a line of the
// view that starts with it.
func figureOnScreen(t *testing.T, view, label string) (float64, string) {
	t.Helper()
	re := regexp.MustCompile(`(?m)` + regexp.QuoteMeta(label) + `\s+(-?[0-9]+(?:\.[0-9]+)?)(.*)$`)
	sub := re.FindStringSubmatch(view)
	if sub == nil {
		t.Fatalf("no %q figure on screen:\n%s", label, view)
	}
	v, err := strconv.ParseFloat(sub[1], 64)
	if err != nil {
		t.Fatal(err)
	}
	return v, sub[2]
}

// TestFiguresAreTheEngines checks that each figure on the screen is the
// engine's own figure for that damage state, computed here directly with
// engine.Assess, to the decimals shown.
func TestFiguresAreTheEngines(t *testing.T) {
	for _, tc := range []struct {
		name string
		open []string
	}{
		{"intact", nil},
		{"hold and wing", goldenOpen},
		{"engine room", []string{"Engine room"}},
		{"port wing", []string{"Wing tank 2 P"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			m := testModel(t, 100, 30)
			m = openSpaces(t, m, tc.open...)
			d := m.v.Intact()
			for _, n := range tc.open {
				for i, c := range m.v.Compartments {
					if c.Name == n {
						d[i].Open = true
					}
				}
			}
			a := engine.Assess(m.v, d)
			if a.Position == nil {
				t.Fatalf("engine finds no equilibrium: %v", a.NoEq)
			}
			p := a.Position
			view := m.View()
			for _, f := range []struct {
				label string
				want  float64
				half  float64 // half a unit of the last decimal shown
			}{
				{"Draft aft", p.DraftAftM, 0.005},
				{"Draft mid", p.DraftMidM, 0.005},
				{"Draft fwd", p.DraftFwdM, 0.005},
				{"Heel", math.Abs(p.HeelDeg), 0.05},
				{"Trim", math.Abs(p.TrimM), 0.005},
				{"GM upright", p.GMUprightM, 0.005},
				{dispLabel(p), p.DisplacementT - p.HeldWaterT, 0.5},
				{"Deck edge", p.DeckEdge.HeightM, 0.005},
			} {
				got, rest := figureOnScreen(t, view, f.label)
				if math.Abs(got-f.want) > f.half+1e-9 {
					t.Errorf("%s: screen %v, engine %v", f.label, got, f.want)
				}
				if f.label == "Heel" {
					side := "upright"
					if math.Abs(p.HeelDeg) >= 0.05 {
						side = "to " + map[bool]string{true: "starboard", false: "port"}[p.HeelDeg > 0]
					}
					if !strings.Contains(rest, side) {
						t.Errorf("heel %v: screen says %q, want %q", p.HeelDeg, rest, side)
					}
				}
			}
		})
	}
}

// TestStaleResultDropped makes two changes and delivers the first one's
// result last: the screen must keep the second's figures, and the log must
// still list both changes in the order they were made.
func TestStaleResultDropped(t *testing.T) {
	m := testModel(t, 100, 30)
	m = selectSpace(t, m, "Hold 2")
	mm, cmd1 := m.Update(keyMsg("space"))
	m = mm.(model)
	msg1 := runFirst(cmd1) // computed before the second change is made
	m = selectSpace(t, m, "Wing tank 2 S")
	mm, cmd2 := m.Update(keyMsg("space"))
	m = mm.(model)
	msg2 := runFirst(cmd2)
	if !m.pending() {
		t.Fatal("no computation pending after two changes")
	}
	if !strings.Contains(m.View(), "computing") {
		t.Error("no computing mark while a result is pending")
	}
	mm, _ = m.Update(msg2)
	m = mm.(model)
	second := *m.cur.Position
	mm, _ = m.Update(msg1)
	m = mm.(model)
	if m.cur.Position.Plane != second.Plane || m.shown != m.seq {
		t.Fatalf("the older result replaced the newer one: heel %v, want %v", m.cur.Position.HeelDeg, second.HeelDeg)
	}
	if m.pending() || strings.Contains(m.View(), "computing") {
		t.Error("still pending after the newest result came")
	}
	// Both changes are in the log, in order.
	var got []string
	for _, l := range m.log {
		if strings.Contains(l, "opened to sea") {
			got = append(got, l)
		}
	}
	if len(got) != 2 || !strings.Contains(got[0], "Hold 2") || !strings.Contains(got[1], "Wing tank 2 S") {
		t.Errorf("log of the two changes: %q", got)
	}
	// A result computed for a change already superseded is not computed at
	// all (the Cmd looks at the newest number before it starts).
	stale := recompute(m.v, m.damage, 1, m.latest)().(resultMsg)
	if !stale.skipped {
		t.Error("a superseded change was computed")
	}
}

// runFirst runs a Cmd (or the Cmds of a batch) and returns the first
// result message.
func runFirst(cmd tea.Cmd) tea.Msg {
	if cmd == nil {
		return nil
	}
	switch msg := cmd().(type) {
	case tea.BatchMsg:
		for _, c := range msg {
			if r := runFirst(c); r != nil {
				if _, ok := r.(resultMsg); ok {
					return r
				}
			}
		}
		return nil
	default:
		return msg
	}
}

// TestTinySizes: no panic and no line wider than the screen at any small
// size; below the minimum the screen says what it needs.
func TestTinySizes(t *testing.T) {
	m := testModel(t, 100, 30)
	m = openSpaces(t, m, goldenOpen...)
	for _, sz := range [][2]int{{20, 5}, {0, 0}, {1, 1}, {5, 20}, {79, 24}, {80, 23}, {80, 24}, {81, 25}, {119, 40}, {120, 33}, {200, 60}} {
		mm, _ := m.Update(tea.WindowSizeMsg{Width: sz[0], Height: sz[1]})
		v := mm.(model).View()
		lines := strings.Split(v, "\n")
		if sz[1] > 0 && len(lines) > sz[1] {
			t.Errorf("%dx%d: %d lines", sz[0], sz[1], len(lines))
		}
		for i, l := range lines {
			if w := lipgloss.Width(l); w > sz[0] {
				t.Errorf("%dx%d: line %d is %d wide", sz[0], sz[1], i+1, w)
			}
		}
		small := sz[0] < minWidth || sz[1] < minHeight
		if small && sz[0] >= 20 && !strings.Contains(strings.ReplaceAll(v, "\n", " "), "80×24") {
			t.Errorf("%dx%d: does not say the size it needs:\n%s", sz[0], sz[1], v)
		}
		if !small && !strings.Contains(v, "FLOATING POSITION") {
			t.Errorf("%dx%d: no floating position on screen", sz[0], sz[1])
		}
	}
	// Every key at the smallest size.
	mm, _ := m.Update(tea.WindowSizeMsg{Width: 20, Height: 5})
	m = mm.(model)
	m = press(t, m, "down", "space", "+", "-", "m", "esc", "u", "R", "tab", "h", "c", "?")
	_ = m.View()
}

// TestRunesArrivingTogether: keys typed faster than the terminal is read
// come as one message ("jj"); each must count, as if typed one by one.
func TestRunesArrivingTogether(t *testing.T) {
	one := testModel(t, 100, 30)
	for range 2 {
		next, _ := one.Update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{'j'}})
		one = next.(model)
	}
	both := testModel(t, 100, 30)
	next, _ := both.Update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{'j', 'j'}})
	both = next.(model)
	if both.sel != one.sel || one.sel == testModel(t, 100, 30).sel {
		t.Errorf("\"jj\" left the selection at %d; j then j at %d", both.sel, one.sel)
	}
}

// checkFits resizes m to w×h, checks that its view fits the screen and
// shows no non-finite number, and returns the view.
func checkFits(t *testing.T, name string, m model, w, h int) string {
	t.Helper()
	m2, _ := m.Update(tea.WindowSizeMsg{Width: w, Height: h})
	v := m2.(model).View()
	lines := strings.Split(v, "\n")
	if h > 0 && len(lines) > h {
		t.Errorf("%s %dx%d: %d lines", name, w, h, len(lines))
	}
	for i, l := range lines {
		if lw := lipgloss.Width(l); lw > w {
			t.Errorf("%s %dx%d: line %d is %d wide", name, w, h, i+1, lw)
		}
	}
	if bad := nonFinite.FindString(v); bad != "" {
		t.Errorf("%s %dx%d: %q on screen", name, w, h, bad)
	}
	return v
}

// dispLabel is the displacement figure's label: "Ship weight" when sea
// water stands in flooded spaces (the lost-buoyancy basis), else
// "Displacement".
func dispLabel(p *engine.Position) string {
	if p.OpenWaterT+p.HeldWaterT > 0 {
		return "Ship weight"
	}
	return "Displacement"
}

// viewLines is a child panel's view as lines: none for an empty view.
func viewLines(view string) []string {
	if view == "" {
		return nil
	}
	return strings.Split(view, "\n")
}
