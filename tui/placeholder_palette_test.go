package tui

import (
	"testing"

	"github.com/charmbracelet/lipgloss"
)

// TestPlaceholdersInPalette: the typed-μ field's and the reading form's
// placeholders (the μ in force, the drafts the marks read now) are drawn
// in the palette's dim style: bubbles' own grey placeholder is neither red
// at night nor colourless in mono.
func TestPlaceholdersInPalette(t *testing.T) {
	for _, pal := range []string{"night", "mono"} {
		m := bundledModel(t, "freighter", 80, 24)
		for paletteNames[m.palette] != pal {
			m = press(t, m, "c")
		}
		same := func(a, b lipgloss.Style) bool {
			return a.GetForeground() == b.GetForeground() && a.GetFaint() == b.GetFaint()
		}
		if !same(m.input.PlaceholderStyle, m.st.Dim) {
			t.Errorf("%s: the μ field's placeholder is %v, the palette's dim %v", pal, m.input.PlaceholderStyle.GetForeground(), m.st.Dim.GetForeground())
		}
		m = press(t, m, "r", "n")
		for k, f := range m.rd.form.fields {
			if !same(f.PlaceholderStyle, m.st.Dim) {
				t.Errorf("%s: reading form field %d's placeholder is %v", pal, k, f.PlaceholderStyle.GetForeground())
			}
		}
	}
}
