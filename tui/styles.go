package tui

import (
	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/lipgloss"
)

// Palette names, in the order the palette key cycles through them.
var paletteNames = []string{"day", "night", "mono"}

// palette is the handful of colours a theme is made of. An empty colour
// means "the terminal's own": the monochrome palette is all empty and
// speaks through weight, underline and reverse video alone.
type palette struct {
	name    string
	text    lipgloss.TerminalColor
	dim     lipgloss.TerminalColor
	heading lipgloss.TerminalColor
	accent  lipgloss.TerminalColor // the selected row's band
	onBand  lipgloss.TerminalColor // text on that band
	water   lipgloss.TerminalColor
	flood   lipgloss.TerminalColor
	hull    lipgloss.TerminalColor
	good    lipgloss.TerminalColor
	caution lipgloss.TerminalColor
	danger  lipgloss.TerminalColor
}

// dayPalette: ordinary contrast on a light or dark terminal.
func dayPalette() palette {
	ad := func(light, dark string) lipgloss.TerminalColor {
		return lipgloss.AdaptiveColor{Light: light, Dark: dark}
	}
	return palette{
		name:    "day",
		text:    ad("#1a1a1a", "#e4e4e4"),
		dim:     ad("#6b6b6b", "#8f8f8f"),
		heading: ad("#00507a", "#7cc7ff"),
		accent:  ad("#cfe6f5", "#23435a"),
		onBand:  ad("#000000", "#ffffff"),
		water:   ad("#0063b1", "#4aa8ff"),
		flood:   ad("#0a7bd6", "#2f86d9"),
		hull:    ad("#303030", "#d0d0d0"),
		good:    ad("#1d7a1d", "#6fd36f"),
		caution: ad("#a35c00", "#ffb347"),
		danger:  ad("#b00020", "#ff5c5c"),
	}
}

// nightPalette: dim and red only, so that a glance at the screen does not
// cost the officer of the watch the dark adaptation of his eyes (red light
// at low level is the usual bridge practice). Meant for a dark terminal;
// emphasis comes from weight and reverse video, not from brightness.
func nightPalette() palette {
	// Reds that a 256-colour terminal has exactly (xterm 52, 88, 124, 160),
	// so that nothing drifts towards white when colours are degraded.
	return palette{
		name:    "night",
		text:    lipgloss.Color("#af0000"),
		dim:     lipgloss.Color("#870000"),
		heading: lipgloss.Color("#d70000"),
		accent:  lipgloss.Color("#5f0000"),
		onBand:  lipgloss.Color("#d70000"),
		water:   lipgloss.Color("#af0000"),
		flood:   lipgloss.Color("#5f0000"),
		hull:    lipgloss.Color("#af0000"),
		good:    lipgloss.Color("#870000"),
		caution: lipgloss.Color("#d70000"),
		danger:  lipgloss.Color("#d70000"),
	}
}

// monoPalette: no colour at all (NO_COLOR, a monochrome console, a printout).
func monoPalette() palette { return palette{name: "mono"} }

// paletteFor returns the palette of that name; unknown names give day.
func paletteFor(name string) palette {
	switch name {
	case "night":
		return nightPalette()
	case "mono":
		return monoPalette()
	}
	return dayPalette()
}

// Styles is every style the dashboard draws with, built from one palette by
// newStyles so that a theme is a value that can be compared and tested.
// Every state the screen shows also has a mark or a word of its own, so that
// nothing depends on colour alone.
type Styles struct {
	Palette string

	App      lipgloss.Style // the title in the header
	Header   lipgloss.Style
	Heading  lipgloss.Style // a panel's title
	Text     lipgloss.Style
	Dim      lipgloss.Style // labels, units, scales
	Value    lipgloss.Style // a figure
	Change   lipgloss.Style // a change since intact
	Selected lipgloss.Style // the selected compartment's row
	Group    lipgloss.Style // a group heading in the list
	Open     lipgloss.Style // a compartment open to the sea
	AtRisk   lipgloss.Style // the compartment next at risk
	Info     lipgloss.Style
	Caution  lipgloss.Style
	Danger   lipgloss.Style
	Pass     lipgloss.Style
	Fail     lipgloss.Style
	Banner   lipgloss.Style // "she sinks", "she capsizes"
	Safety   lipgloss.Style
	Log      lipgloss.Style
	Prompt   lipgloss.Style
	Error    lipgloss.Style
	Busy     lipgloss.Style // the computing mark
	// BarColor is the fill of a flooding run's progress bar, a hex colour
	// for bubbles/progress ("" in the monochrome palette: the terminal's own).
	BarColor string

	// Pictures.
	Hull       lipgloss.Style
	Bulkhead   lipgloss.Style // other compartments' outlines
	Space      lipgloss.Style // the selected compartment's outline
	Waterline  lipgloss.Style
	Flood      lipgloss.Style // flooded spaces
	Opening    lipgloss.Style
	OpeningWet lipgloss.Style // an opening under water
	Axis       lipgloss.Style
	Curve      lipgloss.Style
	Mark       lipgloss.Style // angles marked on the GZ curve

	Help help.Styles
}

// newStyles builds the dashboard's styles for a palette on renderer r (the
// renderer decides how far colours are degraded for the terminal).
func newStyles(r *lipgloss.Renderer, p palette) *Styles {
	fg := func(c lipgloss.TerminalColor) lipgloss.Style {
		s := r.NewStyle()
		if c != nil {
			s = s.Foreground(c)
		}
		return s
	}
	mono := p.text == nil
	s := Styles{Palette: p.name}
	s.Text = fg(p.text)
	s.Dim = fg(p.dim)
	s.Value = fg(p.text).Bold(true)
	s.Change = fg(p.dim)
	s.App = fg(p.heading).Bold(true)
	s.Header = fg(p.text)
	s.Heading = fg(p.heading).Bold(true)
	s.Group = fg(p.heading)
	s.Open = fg(p.water).Bold(true)
	s.AtRisk = fg(p.caution)
	s.Info = fg(p.dim)
	s.Caution = fg(p.caution).Bold(true)
	s.Danger = fg(p.danger).Bold(true)
	s.Pass = fg(p.good)
	s.Fail = fg(p.danger).Bold(true)
	s.Banner = fg(p.danger).Bold(true)
	s.Safety = fg(p.dim).Italic(true)
	s.Log = fg(p.dim)
	s.Prompt = fg(p.heading).Bold(true)
	s.Error = fg(p.danger).Bold(true)
	s.Busy = fg(p.caution).Bold(true)
	s.BarColor = hexOf(r, p.water)

	s.Hull = fg(p.hull)
	s.Bulkhead = fg(p.dim)
	s.Space = fg(p.caution).Bold(true)
	s.Waterline = fg(p.water).Bold(true)
	s.Flood = fg(p.flood)
	s.Opening = fg(p.text)
	s.OpeningWet = fg(p.danger).Bold(true)
	s.Axis = fg(p.dim)
	s.Curve = fg(p.text).Bold(true)
	s.Mark = fg(p.caution)

	if mono {
		s.Selected = r.NewStyle().Reverse(true)
		s.Group = r.NewStyle().Underline(true)
		s.Dim = r.NewStyle().Faint(true)
		s.Flood = r.NewStyle().Faint(true)
	} else {
		s.Selected = r.NewStyle().Background(p.accent).Foreground(p.onBand).Bold(true)
	}

	if mono || p.name == "night" {
		// Where danger and headings share a colour (night: all red) or have
		// none (mono), danger is told by reverse video and caution by an
		// underline, besides their marks (‼ and !).
		s.Danger = s.Danger.Reverse(true)
		s.Fail = s.Fail.Reverse(true)
		s.Caution = s.Caution.Underline(true)
	}

	s.Help = help.Styles{
		ShortKey:       fg(p.heading).Bold(true),
		ShortDesc:      fg(p.dim),
		ShortSeparator: fg(p.dim),
		Ellipsis:       fg(p.dim),
		FullKey:        fg(p.heading).Bold(true),
		FullDesc:       fg(p.dim),
		FullSeparator:  fg(p.dim),
	}
	return &s
}

// hexOf is the hex string of a palette colour as the renderer would show
// it ("" for the terminal's own colour).
func hexOf(r *lipgloss.Renderer, c lipgloss.TerminalColor) string {
	switch c := c.(type) {
	case lipgloss.Color:
		return string(c)
	case lipgloss.AdaptiveColor:
		if r.HasDarkBackground() {
			return c.Dark
		}
		return c.Light
	}
	return ""
}
