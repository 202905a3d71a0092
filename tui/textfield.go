package tui

import "github.com/charmbracelet/bubbles/textinput"

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
