package tui

import (
	"strings"
	"testing"

	"heelwatch/report"
)

// TestToldLinesWhole: a report from a party is shown to its last word at
// 80 columns and narrower (wrapped under its time, never cut with "…"),
// and when room is short the newest messages are the ones kept.
func TestToldLinesWhole(t *testing.T) {
	feed := []report.CrewMessage{
		{Minutes: 1.5, Text: "Bridge: collision with a fishing vessel, starboard side aft. She has backed off."},
		{Minutes: 4, Text: "Engine room: water coming in low down on the starboard side near the shaft line."},
	}
	for _, w := range []int{40, 60, 80} {
		lines := toldLines(feed, w, 0)
		text := strings.Join(lines, " ")
		for _, f := range feed {
			for _, word := range strings.Fields(f.Text) {
				if !strings.Contains(text, word) {
					t.Errorf("w %d: %q missing from %q", w, word, lines)
				}
			}
		}
		for _, l := range lines {
			if strings.Contains(l, "…") || len([]rune(l)) > w {
				t.Errorf("w %d: line cut or too wide: %q", w, l)
			}
		}
	}
	if got := toldLines(feed, 40, 3); len(got) > 3 || !strings.Contains(got[0], "04:00") {
		t.Errorf("room 3: want the newest message only, got %q", got)
	}
}
