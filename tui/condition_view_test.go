package tui

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// condRowOf moves the panel's choice to the row named.
func condRowOf(t *testing.T, m model, name string) model {
	t.Helper()
	for k, r := range m.cond.rows() {
		n := ""
		if r.tank >= 0 {
			n = m.v.Compartments[r.tank].Name
		} else {
			n = m.cond.cond.Weights[r.weight].Name
		}
		if n == name {
			m.cond.sel = k
			return m
		}
	}
	t.Fatalf("no row %q in the condition panel", name)
	return m
}

// typed types text into the panel's field as one paste, then Enter.
func typed(t *testing.T, m model, text string) model {
	t.Helper()
	m.cond.field.SetValue("")
	m = drive(t, m, tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(text), Paste: true})
	return press(t, m, "enter")
}

// The panel's changes load the ship as the condition says: the figures
// shown are those of engine.Solve on the vessel file's ship with the same
// tank filled and the same weight added, worked out apart from the
// dashboard.
func TestConditionPanelChangesTheShip(t *testing.T) {
	m := testModel(t, 120, 40)
	m = press(t, m, "L")
	if !m.cond.show {
		t.Fatal("L did not open the condition panel")
	}
	m = condRowOf(t, m, "Wing tank 2 P")
	m = press(t, m, "+", "+")
	m = press(t, m, "n")
	m = typed(t, m, "Deck cargo; 80; 40; 2.5; 9")
	if m.cond.typing != condNone {
		t.Fatalf("still typing: %s", m.cond.note)
	}
	// Apart from the dashboard: the same changes to the vessel file's ship.
	v, _ := ship(t)
	c := vessels.ConditionOf(v, "")
	i := -1
	for k, cp := range v.Compartments {
		if cp.Name == "Wing tank 2 P" {
			i = k
		}
	}
	for k := range c.Tanks {
		if c.Tanks[k].Compartment == i {
			c.Tanks[k].Liquid.Fill = 0.10
		}
	}
	c.Weights = append(c.Weights, engine.Weight{Name: "Deck cargo", MassT: 80, LCGM: 40, TCGM: 2.5, VCGM: 9})
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	want, err := engine.Solve(nv, nv.Intact())
	if err != nil {
		t.Fatal(err)
	}
	got := m.cur.Position
	if got == nil || math.Abs(got.HeelDeg-want.HeelDeg) > 1e-9 || math.Abs(got.DraftAftM-want.DraftAftM) > 1e-9 {
		t.Fatalf("shown %+v, want %+v", got, want)
	}
	if m.base == nil || m.base.Position.HeelDeg != want.HeelDeg {
		t.Error("the intact reference was not worked out again for the new condition")
	}
	// Removed again: she is back as the vessel file has her, but with the tank.
	m = condRowOf(t, m, "Deck cargo")
	m = press(t, m, "x")
	if len(m.v.Weights) != len(v.Weights) {
		t.Errorf("%d weights after removing, want %d", len(m.v.Weights), len(v.Weights))
	}
	// A fill beyond the tank's capacity is refused with the reason.
	m = condRowOf(t, m, "Wing tank 2 P")
	m = press(t, m, "e")
	m = typed(t, m, "5000t")
	if !strings.Contains(m.cond.note, "is more than Wing tank 2 P holds") {
		t.Errorf("overfill: %q", m.cond.note)
	}
	m = press(t, m, "esc")
	for _, line := range strings.Split(m.View(), "\n") {
		if lipgloss.Width(line) > 120 {
			t.Errorf("line wider than the screen: %q", line)
		}
	}
}

// The whole state saved and taken up again gives the same screen's
// figures: condition, damage and readings.
func TestConditionPanelSavesAndResumes(t *testing.T) {
	dir := t.TempDir()
	m := testModel(t, 80, 24)
	m = openSpaces(t, m, "Wing tank 2 S")
	m = press(t, m, "L")
	m = condRowOf(t, m, "Fuel oil tank P")
	m = press(t, m, "-", "-")
	path := filepath.Join(dir, "state.toml")
	os.WriteFile(path, []byte("what was there"), 0o644)
	m = press(t, m, "S")
	m = typed(t, m, path)
	if !strings.Contains(m.cond.note, "state saved to") {
		t.Fatalf("save: %q", m.cond.note)
	}
	if es, _ := os.ReadDir(dir); len(es) != 1 {
		t.Errorf("left in the directory: %v", es)
	}
	shown := *m.cur.Position

	v, info := ship(t)
	s, err := vessels.LoadState(path, v, info)
	if err != nil {
		t.Fatal(err)
	}
	nv, err := s.Condition.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	r := newModel(nv, info, Options{Palette: "day", Base: v, Condition: s.Condition, Resume: s, Start: s.Damage})
	r.now = fixedClock()
	r.animate = false
	r = drive(t, r, tea.WindowSizeMsg{Width: 80, Height: 24})
	r = drive(t, r, nil, r.Init())
	if r.cur == nil || r.cur.Position == nil {
		t.Fatal("nothing shown after taking up the state")
	}
	if got := *r.cur.Position; math.Abs(got.HeelDeg-shown.HeelDeg) > 1e-9 || math.Abs(got.DraftFwdM-shown.DraftFwdM) > 1e-9 {
		t.Errorf("taken up: heel %.6f°, draft fwd %.6f m; saved: %.6f°, %.6f m", got.HeelDeg, got.DraftFwdM, shown.HeelDeg, shown.DraftFwdM)
	}
	if !r.damage[indexOf(t, r, "Wing tank 2 S")].Open {
		t.Error("the damage was not taken up")
	}
}

// The best advisable righting option, taken into the condition, is where
// she lies after: the dashboard carries on from it.
func TestConditionPanelTakesARightingOption(t *testing.T) {
	m := testModel(t, 120, 40)
	m = press(t, m, "L", "n")
	m = typed(t, m, "Deck cargo; 150; 40; 5; 9")
	heeled := m.cur.Position.HeelDeg
	m = press(t, m, "A")
	if !strings.Contains(m.cond.note, "work out the righting options first") {
		t.Errorf("A before the options: %q", m.cond.note)
	}
	m = press(t, m, "o") // the options worked out (the panel gives way)
	if m.cond.show || m.rem.set == nil {
		t.Fatal("the righting options were not worked out")
	}
	var best *engine.Remedy
	for k := range m.rem.set.Options {
		if m.rem.set.Options[k].Advisable {
			best = &m.rem.set.Options[k]
			break
		}
	}
	if best == nil {
		t.Skip("no advisable option for this list")
	}
	m = press(t, m, "L", "A")
	got := m.cur.Position.HeelDeg
	if !(math.Abs(got) < math.Abs(heeled)) || math.Abs(got-best.Position.HeelDeg) > 0.05 {
		t.Errorf("heel %.3f° after the option (was %.3f°; the option said %.3f°)", got, heeled, best.Position.HeelDeg)
	}
	for k, i := range best.Tanks {
		if f := m.v.Compartments[i].Liquid.Fill; math.Abs(f-best.FillAfter[k]) > 1e-12 {
			t.Errorf("%s at %g, the option says %g", best.TankNames[k], f, best.FillAfter[k])
		}
	}
}

// A sounding typed on the panel is read where she lies: on the box barge
// the ballast tank is a rectangular prism sounded at its middle, so while
// the surface cuts all four walls the liquid is μ · L · B · s whatever the
// trim (the mean depth of a plane over a rectangle is its depth at the
// centre; derived) — a fill of s over the tank's 1 m height.
func TestConditionPanelSounding(t *testing.T) {
	v, info, err := vessels.Open("barge")
	if err != nil {
		t.Fatal(err)
	}
	m := newModel(v, info, Options{Palette: "day"})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: 120, Height: 40})
	m = drive(t, m, nil, m.Init())
	if math.Abs(m.cur.Position.TrimM) < 0.01 {
		t.Fatal("she floats on an even keel: the test shows nothing of the trim")
	}
	m = press(t, m, "L")
	m = condRowOf(t, m, "DB ballast aft")
	m = press(t, m, "e")
	m = typed(t, m, "0.4m")
	i := indexOf(t, m, "DB ballast aft")
	if f := m.v.Compartments[i].Liquid.Fill; math.Abs(f-0.4) > 1e-9 {
		t.Errorf("fill %.12f after sounding 0.4 m, prism 0.4 (%s)", f, m.cond.note)
	}
	if !strings.Contains(m.cond.note, "sounded 0.40 m at heel") {
		t.Errorf("note %q", m.cond.note)
	}
	m = press(t, m, "e")
	m = typed(t, m, "1.5m")
	if !strings.Contains(m.cond.note, "above the tank's top") {
		t.Errorf("a sounding above the top: %q", m.cond.note)
	}
}

// A sounding typed on the panel is read where she lies once it is in:
// the fill kept is the fixed point of vessels.Condition.Apply (the same
// sounding in a condition file gives the same tonnes), and read again at
// the heel and trim she then lies at, it gives that same fill. Before, it
// was read once at the heel she lay at before the change.
func TestConditionPanelSoundingFixedPoint(t *testing.T) {
	m := testModel(t, 120, 40)
	m = press(t, m, "L")
	m = condRowOf(t, m, "DB 2 S")
	m = press(t, m, "e")
	m = typed(t, m, "0.6m")
	if m.cond.typing != condNone {
		t.Fatalf("still typing: %q", m.cond.note)
	}
	i := indexOf(t, m, "DB 2 S")
	got := m.v.Compartments[i].Liquid.Fill

	v, info := ship(t)
	pipe := v.Compartments[i].DefaultSoundingPipe()
	if sp := info.Compartments[i].SoundingPipe; sp != nil {
		pipe = *sp
	}
	c := vessels.ConditionOf(v, "")
	for k := range c.Tanks {
		if c.Tanks[k].Compartment == i {
			c.Tanks[k].SoundingM, c.Tanks[k].Pipe = 0.6, pipe
		}
	}
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	if want := nv.Compartments[i].Liquid.Fill; math.Abs(got-want) > 1e-9 {
		t.Errorf("fill %.9f on the panel, %.9f from Apply", got, want)
	}
	pos := m.cur.Position
	if math.Abs(pos.HeelDeg) < 1 {
		t.Fatalf("heel %.2f°: the sounding does not move her, the test shows nothing", pos.HeelDeg)
	}
	vol, err := v.Compartments[i].SoundingVolumeM3(pipe, 0.6, pos.Plane)
	if err != nil {
		t.Fatal(err)
	}
	if again := vol / v.Compartments[i].CapacityM3(); math.Abs(again-got) > 1e-6 {
		t.Errorf("read again at heel %.3f° it gives %.6f, kept %.6f", pos.HeelDeg, again, got)
	}
	if m.cond.cond.Tanks[m.cond.tankFill(i)].BySounding() {
		t.Error("the panel keeps the sounding: later changes would read it again")
	}
}
