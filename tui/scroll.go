package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/viewport"
)

// This file holds the one way a panel's text scrolls: bubbles' viewport
// keeps the first line shown within the text, for the flags and criteria,
// the hand working (a step at a time) and the righting options alike.

// scrollStep is how many lines [ and ] move a text.
const scrollStep = 3

// scrolled returns the first line to show of a text of these lines in room
// lines, after moving from first by step lines (up when negative), never
// before the top nor past the point where the last line comes into view.
func scrolled(first int, lines []string, room, step int) int {
	vp := viewport.New(0, max(room, 1))
	vp.SetContent(strings.Join(lines, "\n"))
	vp.SetYOffset(first)
	if step < 0 {
		vp.ScrollUp(-step)
	} else {
		vp.ScrollDown(step)
	}
	return vp.YOffset
}
