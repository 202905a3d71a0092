package tui

import "github.com/charmbracelet/bubbles/key"

// keyMap is every key the dashboard answers to. The help bar at the foot of
// the screen is drawn from it (bubbles/help), so a key and its description
// live in one place.
type keyMap struct {
	Move                  key.Binding // for the help bar only: up and down in one
	Up, Down, Top, Bottom key.Binding
	PageUp, PageDown      key.Binding // a screenful of the list
	Find                  key.Binding // type-to-find in the list
	Flood                 key.Binding // open to the sea / close up (intact)
	MuUp, MuDown, MuSet   key.Binding
	Undo, Reset           key.Binding
	Picture               key.Binding // next picture (narrow screens)
	Hand                  key.Binding
	WorkUp, WorkDown      key.Binding // scroll the hand working, or the flags and criteria
	Report                key.Binding
	HoleRun               key.Binding // the hole-and-pumps form, then a flooding run
	RunPanel              key.Binding // the flooding-run panel shown or hidden
	RunStage              key.Binding // the run's next stage onto the dashboard
	Remedies              key.Binding // the righting options worked out and shown, or hidden
	Girder                key.Binding // the hull girder's panel shown or hidden
	Readings              key.Binding // the draft marks and readings panel shown or hidden
	Palette               key.Binding
	Help                  key.Binding
	Quit                  key.Binding
}

func newKeyMap() keyMap {
	return keyMap{
		Move:     key.NewBinding(key.WithKeys("up", "down"), key.WithHelp("↑↓/jk", "move")),
		Up:       key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("↑/k", "up")),
		Down:     key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("↓/j", "down")),
		Top:      key.NewBinding(key.WithKeys("home", "g"), key.WithHelp("home", "first")),
		Bottom:   key.NewBinding(key.WithKeys("end", "G"), key.WithHelp("end", "last")),
		PageUp:   key.NewBinding(key.WithKeys("pgup"), key.WithHelp("pgup", "page up")),
		PageDown: key.NewBinding(key.WithKeys("pgdown"), key.WithHelp("pgdn", "page down")),
		Find:     key.NewBinding(key.WithKeys("/"), key.WithHelp("/", "find")),
		Flood:    key.NewBinding(key.WithKeys(" ", "enter"), key.WithHelp("space", "open/close")),
		MuUp:     key.NewBinding(key.WithKeys("+", "="), key.WithHelp("+/−", "μ")),
		MuDown:   key.NewBinding(key.WithKeys("-", "_"), key.WithHelp("−", "μ −0.05")),
		MuSet:    key.NewBinding(key.WithKeys("m"), key.WithHelp("m", "type μ")),
		Undo:     key.NewBinding(key.WithKeys("u", "ctrl+z"), key.WithHelp("u", "undo")),
		Reset:    key.NewBinding(key.WithKeys("R"), key.WithHelp("R", "all intact")),
		Picture:  key.NewBinding(key.WithKeys("tab", "v"), key.WithHelp("tab", "picture")),
		Hand:     key.NewBinding(key.WithKeys("h"), key.WithHelp("h", "hand")),
		WorkUp:   key.NewBinding(key.WithKeys("["), key.WithHelp("[", "scroll back")),
		WorkDown: key.NewBinding(key.WithKeys("]"), key.WithHelp("]", "scroll on")),
		Report:   key.NewBinding(key.WithKeys("w"), key.WithHelp("w", "write report")),
		HoleRun:  key.NewBinding(key.WithKeys("f"), key.WithHelp("f", "flooding run")),
		RunPanel: key.NewBinding(key.WithKeys("t"), key.WithHelp("t", "run panel")),
		RunStage: key.NewBinding(key.WithKeys("s"), key.WithHelp("s", "stage shown"), key.WithDisabled()),
		Remedies: key.NewBinding(key.WithKeys("o"), key.WithHelp("o", "righting options")),
		Girder:   key.NewBinding(key.WithKeys("b"), key.WithHelp("b", "hull girder")),
		Readings: key.NewBinding(key.WithKeys("r"), key.WithHelp("r", "marks & readings")),
		Palette:  key.NewBinding(key.WithKeys("c"), key.WithHelp("c", "day/night/mono")),
		Help:     key.NewBinding(key.WithKeys("?"), key.WithHelp("?", "keys")),
		Quit:     key.NewBinding(key.WithKeys("q", "ctrl+c"), key.WithHelp("q", "quit")),
	}
}

// ShortHelp is the one-line help bar: the keys an officer needs first.
func (k keyMap) ShortHelp() []key.Binding {
	// ? and q before the rest, so that a narrow bar cuts the others first;
	// then the righting options, the flooding run, then the pictures.
	return []key.Binding{k.Move, k.Flood, k.MuUp, k.MuSet, k.Undo, k.Help, k.Quit, k.Remedies, k.HoleRun, k.RunPanel, k.RunStage, k.Picture, k.Hand, k.Girder, k.Readings, k.Find}
}

// FullHelp is the help shown with `?`, in three columns that fit 80
// columns, in fuller words than the one-line bar.
func (k keyMap) FullHelp() [][]key.Binding {
	say := func(b key.Binding, keys, desc string) key.Binding {
		b.SetHelp(keys, desc)
		return b
	}
	// The stage key answers only once a run has stages; the full help
	// lists it all the same.
	stage := say(k.RunStage, "s", "a run's stage shown")
	stage.SetEnabled(true)
	return [][]key.Binding{
		{k.Up, k.Down, say(k.Top, "home", "first"), say(k.Bottom, "end", "last"),
			say(k.PageUp, "pgup", "page up"), say(k.PageDown, "pgdn", "page down"),
			say(k.Find, "/", "find by name"), say(k.Picture, "tab", "next picture"), say(k.HoleRun, "f", "hole & pumps")},
		{say(k.Flood, "space", "open to sea / intact"), say(k.MuUp, "+ −", "permeability ±0.05"),
			say(k.MuSet, "m", "type a permeability"), k.Undo, k.Reset, stage,
			say(k.Remedies, "o", "righting options"), say(k.Girder, "b", "hull girder, l limits"),
			say(k.Readings, "r", "draft readings, n new")},
		{say(k.RunPanel, "t", "run panel"), doorsKey, say(k.Hand, "h", "hand working on/off"),
			say(k.WorkUp, "[ ]", "scroll working/criteria"), k.Report,
			say(k.Palette, "c", "day / night / mono"), say(conditionKey, "L", "loading condition, save"),
			say(k.Help, "?", "close this help"),
			say(k.Quit, "q", "quit (also ctrl+c)")},
	}
}
