package tui

import (
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/report/plaintext"
)

// newTextField is a text field that takes typed and pasted text only as
// the terminal delivers it. bubbles' textinput binds Ctrl+V to reading the
// system clipboard, which on Linux runs an external program (xclip, xsel,
// wl-paste) found on the PATH; a bridge tool runs no other program, so the
// binding is switched off. Text pasted in the terminal still arrives, as a
// bracketed paste (a KeyMsg with Paste set), and is typed into the field.
func newTextField() textinput.Model {
	in := textinput.New()
	in.KeyMap.Paste.SetEnabled(false)
	return in
}

// plainKey drops from typed or pasted text every character that could act
// on the terminal or reorder the text (plaintext.Unsafe): a paste may
// carry anything, and bubbles' own filter lets bidirectional controls
// through. A paste's line breaks go with them ("0.5\n" is "0.5").
func plainKey(msg tea.KeyMsg) tea.KeyMsg {
	if msg.Type != tea.KeyRunes {
		return msg
	}
	keep := msg.Runes[:0:0]
	for _, r := range msg.Runes {
		if !plaintext.Unsafe(r) {
			keep = append(keep, r)
		}
	}
	msg.Runes = keep
	return msg
}
