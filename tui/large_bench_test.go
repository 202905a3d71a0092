package tui

// Benchmarks of the dashboard on the large generated ship
// (vessels/largeship, an invented vessel of 160 stations × 60 offsets and
// 200 compartments): the first frame (reading her file, the first
// assessment, the first drawing at 120×40), whose budget is 100 ms, and a
// keystroke to the screen (opening a compartment: the assessment and the
// redraw), whose budget is one 60 Hz frame.

import (
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/vessels"
	"heelwatch/vessels/largeship"
)

func BenchmarkFirstFrameLargeHull(b *testing.B) {
	src := largeship.TOML(largeship.Standard)
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		v, info, err := vessels.Parse("large.toml", src)
		if err != nil {
			b.Fatal(err)
		}
		m := newModel(v, info, Options{Palette: "day"})
		m.now, m.animate = fixedClock(), false
		m = drive(b, m, tea.WindowSizeMsg{Width: 120, Height: 40}, m.Init())
		if m.cur == nil || m.cur.Position == nil {
			b.Fatal("no first assessment")
		}
		_ = m.View()
	}
}

func BenchmarkKeystrokeLargeHull(b *testing.B) {
	v, info, err := vessels.Parse("large.toml", largeship.TOML(largeship.Standard))
	if err != nil {
		b.Fatal(err)
	}
	m := newModel(v, info, Options{Palette: "day"})
	m.now, m.animate = fixedClock(), false
	m = drive(b, m, tea.WindowSizeMsg{Width: 120, Height: 40}, m.Init())
	open := largeship.Standard.OpenSpaces()
	m = openSpaces(b, m, open[0])
	m = selectSpace(b, m, open[1])
	_ = m.View()
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		// Open and close the second space in turn: each a change of the
		// damage, assessed and drawn.
		m = press(b, m, "space")
		_ = m.View()
	}
}
