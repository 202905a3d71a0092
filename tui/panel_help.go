package tui

import "github.com/charmbracelet/bubbles/key"

// panelHelp is the help bar's keys while a panel that answers keys of its
// own is shown (the loading condition, the draft marks and readings), nil
// otherwise. The dashboard's bar said "+/− μ" and "space open/close" while
// + filled the chosen tank and ↑↓ moved in the panel, not in the list.
func (m model) panelHelp() []key.Binding {
	say := func(keys, desc string) key.Binding {
		return key.NewBinding(key.WithKeys(keys), key.WithHelp(keys, desc))
	}
	switch {
	case m.cond.typing != condNone:
		return []key.Binding{say("enter", "take it"), say("esc", "drop it"), say("ctrl+c", "quit")}
	case m.rd.show && m.rd.form.on:
		return []key.Binding{say("tab/↑↓", "field"), say("enter", "take the reading"), say("esc", "cancel"), say("ctrl+c", "quit")}
	case m.cond.show && m.cond.base != nil:
		return []key.Binding{say("↑↓", "tank/weight"), say("+/−", "fill 5 %"), say("e", "type"),
			say("n", "new weight"), say("x", "remove"), say("←→", "move 1 m"), say("W", "save"),
			say("S", "save all"), say("L", "close"), m.keys.Help, m.keys.Quit}
	case m.rd.show && !m.rd.form.on:
		return []key.Binding{say("n", "new reading"), say("a", "onto dashboard"), say("[ ]", "scroll"),
			say("X", "clear readings"), say("r", "close"), m.keys.Move, m.keys.Flood, m.keys.Undo,
			m.keys.Help, m.keys.Quit}
	}
	return nil
}
