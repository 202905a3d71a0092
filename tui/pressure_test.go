package tui

import (
	"regexp"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
)

// startModel is the dashboard on the bundled ship opened with the named
// compartments open to the sea, at w × h, computed.
func startModel(t testing.TB, w, h int, open ...string) model {
	t.Helper()
	v, info := ship(t)
	d := v.Intact()
	for _, n := range open {
		i := v.CompartmentIndex(n)
		ok := i >= 0
		if !ok {
			t.Fatalf("no compartment %q", n)
		}
		d[i].Open = true
	}
	m := newModel(v, info, Options{Palette: "day", Start: d})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	return drive(t, m, nil, m.Init())
}

// At 100×30, with her lying 14° to starboard and the deck edge 0.22 m
// clear, every key figure is on the screen whole: the deck-edge flag's
// sentence, the nearest opening's name, the upright GM; and the hand
// method's caveats are not, until its working is shown.
func TestKeyFiguresWholeAt100x30(t *testing.T) {
	m := startModel(t, 100, 30, "Wing tank 2 S", "DB 2 S")
	screen := m.View()
	flat := strings.Join(strings.Fields(screen), " ")
	for _, want := range []string{
		`0\.22 m clear`, `goes under with \d\.\d° more heel`, // the deck-edge flag whole
		`Accommodation door S -\d\.\d\d`,           // the opening nearest the water, and its change
		`GM upright \d\.\d\d m at rest \d\.\d\d m`, // the upright GM, and where she lies
		`! CAUTION`, // the worst severity in the header
	} {
		if !regexp.MustCompile(want).MatchString(flat) {
			t.Errorf("the screen lacks %s:\n%s", want, screen)
		}
	}
	for _, not := range []string{"more flags", "small-angle hand methods", "not wall-sided"} {
		if strings.Contains(flat, not) {
			t.Errorf("the screen shows %q:\n%s", not, screen)
		}
	}
	m = press(t, m, "h")
	flat = strings.Join(strings.Fields(m.View()), " ")
	// The caveat: beyond small angles, or (where the hand working exists,
	// as it does on a ship since issue 17) where it parts from the direct.
	if !strings.Contains(flat, "small-angle hand methods hold") && !strings.Contains(flat, "and the direct solution part") {
		t.Errorf("with the hand working shown, its caveat is not:\n%s", m.View())
	}
}

// The header says the worst severity in a word.
func TestHeaderSaysWorstSeverity(t *testing.T) {
	m := testModel(t, 80, 24)
	if head := strings.Split(m.View(), "\n")[0]; !strings.Contains(head, "no flags") {
		t.Errorf("intact header %q: want \"no flags\"", head)
	}
	m = startModel(t, 80, 24, "Hold 2", "Wing tank 2 S")
	if head := strings.Split(m.View(), "\n")[0]; !strings.Contains(head, "‼ DANGER") {
		t.Errorf("header %q: the deck edge is under water, want ‼ DANGER", head)
	}
}

func TestFlagsDangerCautionNotes(t *testing.T) {
	in := []engine.Flag{
		{Code: "space-top-under", Severity: engine.Info},
		{Code: engine.FlagPastSmallAngles, Severity: engine.Caution},
		{Code: "deck-edge-near", Severity: engine.Caution},
		{Code: "criteria-failed", Severity: engine.Danger},
		{Code: engine.FlagNotWallSided, Severity: engine.Caution},
		{Code: "heavy-trim", Severity: engine.Caution},
	}
	ship, hand := splitFlags(in)
	var got []string
	for _, f := range ship {
		got = append(got, f.Code)
	}
	if want := "criteria-failed deck-edge-near heavy-trim space-top-under"; strings.Join(got, " ") != want {
		t.Errorf("flags about the ship %v, want %s", got, want)
	}
	if len(hand) != 2 {
		t.Errorf("hand caveats %v, want past-small-angles and not-wall-sided", hand)
	}
}

// In the night palette danger and headings are both red: danger must be
// told by more than colour. So in mono, where there is no colour.
func TestDangerToldFromHeadingsWithoutColour(t *testing.T) {
	r := lipgloss.NewRenderer(nil)
	for _, name := range []string{"night", "mono"} {
		st := newStyles(r, paletteFor(name))
		attrs := func(s lipgloss.Style) [3]bool { return [3]bool{s.GetReverse(), s.GetUnderline(), s.GetBold()} }
		if attrs(st.Danger) == attrs(st.Heading) {
			t.Errorf("%s: danger %v and headings %v differ in colour only", name, attrs(st.Danger), attrs(st.Heading))
		}
		if attrs(st.Caution) == attrs(st.Heading) {
			t.Errorf("%s: caution and headings differ in colour only", name)
		}
	}
}

// At 120×40 too the nearest opening's name and the upright GM are whole.
func TestKeyFiguresWholeAt120x40(t *testing.T) {
	m := startModel(t, 120, 40, "Wing tank 2 S", "DB 2 S")
	flat := strings.Join(strings.Fields(m.View()), " ")
	for _, want := range []string{`Accommodation door S -\d\.\d\d`, `GM upright \d\.\d\d m at rest \d\.\d\d m`, `0\.22 m clear`, `! CAUTION`} {
		if !regexp.MustCompile(want).MatchString(flat) {
			t.Errorf("the screen lacks %s:\n%s", want, m.View())
		}
	}
}

// With a danger flag at 100×30 every danger flag is whole: the picture
// gives way to the words.
func TestDangerFlagsWholeAt100x30(t *testing.T) {
	m := startModel(t, 100, 30, "Hold 2", "Wing tank 2 S")
	flat := strings.Join(strings.Fields(m.View()), " ")
	for _, want := range []string{`\d\.\d\d m deep`, `\(openings-range\)`} {
		if !regexp.MustCompile(want).MatchString(flat) {
			t.Errorf("the screen lacks %s:\n%s", want, m.View())
		}
	}
}
