package tui

import (
	"strings"

	"github.com/charmbracelet/x/ansi"
)

// The smallest screen the dashboard is drawn on; below it the screen says
// what it needs.
const (
	minWidth  = 80
	minHeight = 24
)

// Widths of the fixed columns.
const (
	listWidthNarrow = 35
	listWidthWide   = 37
	posWidthWide    = 50 // the figures with an opening's name whole (20 letters)
)

// layout is the division of the screen, worked out at the end of every Update by
// resize (the one place sizes are decided) and read by View.
type layout struct {
	small bool // below the minimum
	wide  bool // pictures side by side

	logLines int
	helpH    int // lines of the help bar or the permeability prompt
	bodyH    int

	listW, listH int

	// narrow: one right column with the figures, the flags and one sheet.
	rightW, figH, flagH, sheetH int

	// wide: list | figures and flags | criteria or hand working, over a
	// row of three pictures.
	posW, thirdW, topH, picH int
	picW                     [3]int
}

// maxFigWidth keeps each figure near its label on a wide column.
const maxFigWidth = 64

// figLines is the height of the floating-position block: a heading and
// nine figures.
const figLines = 10

// resize divides the screen for the current size, help and prompt.
func (m *model) resize() {
	w, h := m.width, m.height
	m.help.Width = w
	l := layout{}
	if w < minWidth || h < minHeight {
		l.small = true
		m.lay = l
		return
	}
	switch {
	case h >= 40:
		l.logLines = 4
	case h >= 30:
		l.logLines = 3
	default:
		l.logLines = 2
	}
	switch m.mode {
	case modeForm:
		l.helpH = formLines
	case modeMu:
		l.helpH = 2
	case modeFind:
		l.helpH = findLines
	default:
		l.helpH = len(m.helpLines())
	}
	// header, log, safety line, help
	l.bodyH = h - 1 - l.logLines - 1 - l.helpH
	if l.bodyH < figLines+1 {
		// The full help leaves too little room: the body keeps its least and
		// the help is cut (View fits the whole screen to the height).
		l.bodyH = figLines + 1
	}
	l.wide = w >= 120 && l.bodyH >= 30
	// Side by side, every picture shows: the picture key has nothing to do.
	m.keys.Picture.SetEnabled(!l.wide)
	if l.wide {
		l.listW = listWidthWide
		l.posW = posWidthWide
		l.thirdW = w - l.listW - l.posW - 2
		l.picH = max(12, l.bodyH*45/100)
		l.topH = l.bodyH - l.picH - 1
		l.listH = l.topH
		pw := (w - 2) / 3
		l.picW = [3]int{pw, pw, w - 2 - 2*pw}
	} else {
		l.listW = listWidthNarrow
		if w >= 100 {
			l.listW = listWidthWide
		}
		l.rightW = w - l.listW - 1
		l.listH = l.bodyH
		l.figH = figLines
		l.flagH = 2
		if l.bodyH < 22 {
			l.flagH = 1
		}
		if l.bodyH >= 30 {
			l.flagH = 4
		}
		l.sheetH = max(0, l.bodyH-l.figH-l.flagH)
		if l.sheetH < 4 {
			l.flagH = max(1, l.bodyH-l.figH)
			l.sheetH = 0
		}
	}
	m.lay = l
	m.ensureVisible()
}

// fit cuts or pads each line to exactly w columns and the block to exactly
// h lines, escape codes allowed.
func fit(lines []string, w, h int) []string {
	out := make([]string, h)
	for i := 0; i < h; i++ {
		var s string
		if i < len(lines) {
			s = lines[i]
		}
		out[i] = fitLine(s, w)
	}
	return out
}

// fitLine cuts or pads one line to exactly w columns.
func fitLine(s string, w int) string {
	if w <= 0 {
		return ""
	}
	n := ansi.StringWidth(s)
	if n > w {
		s = ansi.Truncate(s, w, "…")
		n = ansi.StringWidth(s)
	}
	if n < w {
		s += strings.Repeat(" ", w-n)
	}
	return s
}

// besides joins blocks of equal height side by side with a separator.
func besides(sep string, blocks ...[]string) []string {
	if len(blocks) == 0 {
		return nil
	}
	h := len(blocks[0])
	out := make([]string, h)
	var b strings.Builder
	for i := 0; i < h; i++ {
		b.Reset()
		for k, bl := range blocks {
			if k > 0 {
				b.WriteString(sep)
			}
			if i < len(bl) {
				b.WriteString(bl[i])
			}
		}
		out[i] = b.String()
	}
	return out
}

// wrap breaks text into lines of at most w runes at spaces.
func wrap(text string, w int) []string {
	if w < 1 {
		return nil
	}
	var out []string
	for _, para := range strings.Split(text, "\n") {
		line := ""
		for _, word := range strings.Fields(para) {
			for len([]rune(word)) > w {
				if line != "" {
					out = append(out, line)
					line = ""
				}
				r := []rune(word)
				out = append(out, string(r[:w]))
				word = string(r[w:])
			}
			switch {
			case line == "":
				line = word
			case len([]rune(line))+1+len([]rune(word)) <= w:
				line += " " + word
			default:
				out = append(out, line)
				line = word
			}
		}
		out = append(out, line)
	}
	return out
}

// flagRoom divides the narrow screen's room under the figures between the
// flags and the sheet: the flags take what they need whole, down to the
// sheet's least height (a picture still readable), and never less than
// resize gave them. With a danger flag the words come before the picture:
// the flags may take the whole room (unless the hand working was asked
// for), and a sheet too small to read gives its lines to them.
func (m model) flagRoom() (flagH, sheetH int) {
	l := m.lay
	if l.sheetH == 0 {
		return l.flagH, 0
	}
	room := l.flagH + l.sheetH
	least := 8
	if l.bodyH < 22 {
		least = 6
	}
	if m.danger() && !m.hand.show {
		least = 0
	}
	if m.hand.show {
		// Asked for, the hand method has all but the flags' least: its
		// answers, caveats and working scroll in it.
		least = max(least, min(room-l.flagH, 10))
	}
	flagH = max(l.flagH, min(m.flagsNeed(l.rightW), room-least))
	if room-flagH < 5 {
		flagH = room
	}
	return flagH, room - flagH
}
