package tui

import "github.com/charmbracelet/bubbles/key"

// keyMap is every key the dashboard answers to. The help bar at the foot of
// the screen is drawn from it (bubbles/help), so a key and its description
// live in one place.
type keyMap struct {
	Up, Down, Top, Bottom key.Binding
	Flood                 key.Binding // open to the sea / close up (intact)
	MuUp, MuDown, MuSet   key.Binding
	Undo, Reset           key.Binding
	Picture               key.Binding // next picture (narrow screens)
	Hand                  key.Binding
	WorkUp, WorkDown      key.Binding // scroll the hand working
	Report                key.Binding
	Palette               key.Binding
	Help                  key.Binding
	Quit                  key.Binding
}

func newKeyMap() keyMap {
	return keyMap{
		Up:      key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("↑/k", "up")),
		Down:    key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("↓/j", "down")),
		Top:     key.NewBinding(key.WithKeys("home", "g", "pgup"), key.WithHelp("home/pgup", "first")),
		Bottom:  key.NewBinding(key.WithKeys("end", "G", "pgdown"), key.WithHelp("end/pgdn", "last")),
		Flood:   key.NewBinding(key.WithKeys(" ", "enter"), key.WithHelp("space", "open/close")),
		MuUp:    key.NewBinding(key.WithKeys("+", "="), key.WithHelp("+/−", "μ ±0.05")),
		MuDown:  key.NewBinding(key.WithKeys("-", "_"), key.WithHelp("−", "μ −0.05")),
		MuSet:   key.NewBinding(key.WithKeys("m"), key.WithHelp("m", "type μ")),
		Undo:    key.NewBinding(key.WithKeys("u", "ctrl+z"), key.WithHelp("u", "undo")),
		Reset:   key.NewBinding(key.WithKeys("R"), key.WithHelp("R", "all intact")),
		Picture: key.NewBinding(key.WithKeys("tab", "v"), key.WithHelp("tab", "next picture")),
		Hand:    key.NewBinding(key.WithKeys("h"), key.WithHelp("h", "hand working")),
		WorkUp: key.NewBinding(key.WithKeys("["), key.WithHelp("[", "working up"),
			key.WithDisabled()),
		WorkDown: key.NewBinding(key.WithKeys("]"), key.WithHelp("]", "working down"),
			key.WithDisabled()),
		Report:  key.NewBinding(key.WithKeys("w"), key.WithHelp("w", "write report")),
		Palette: key.NewBinding(key.WithKeys("c"), key.WithHelp("c", "day/night/mono")),
		Help:    key.NewBinding(key.WithKeys("?"), key.WithHelp("?", "all keys")),
		Quit:    key.NewBinding(key.WithKeys("q", "ctrl+c"), key.WithHelp("q", "quit")),
	}
}

// ShortHelp is the one-line help bar: the keys an officer needs first.
func (k keyMap) ShortHelp() []key.Binding {
	return []key.Binding{k.Up, k.Down, k.Flood, k.MuUp, k.MuSet, k.Undo, k.Picture, k.Hand, k.Help, k.Quit}
}

// FullHelp is the help shown with `?`, in columns.
func (k keyMap) FullHelp() [][]key.Binding {
	return [][]key.Binding{
		{k.Up, k.Down, k.Top, k.Bottom},
		{k.Flood, k.MuUp, k.MuSet},
		{k.Undo, k.Reset, k.Report},
		{k.Picture, k.Hand, k.WorkUp, k.WorkDown},
		{k.Palette, k.Help, k.Quit},
	}
}
