package tui

import (
	"math"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/report/plaintext"
)

// FuzzFieldReadings feeds any text to the dashboard's text fields: the
// readings of a typed permeability and of the flooding run's numbers, and
// the fields themselves, pasted (bracketed paste) and entered. Nothing may
// panic; a reading that is taken is finite and in range; and nothing
// unsafe reaches the screen (the test renderer draws no colours, so the
// screen may hold no ESC at all).
func FuzzFieldReadings(f *testing.F) {
	for _, s := range []string{"0.85", "85%", ",85", "0,5%", "0.5%", "nan", "inf", "-0", "1e308", "0x1p-2", "\x1b[2J", "1\r\n2", "\u202e1", "", " ", "%", "1%%", "9999999999"} {
		f.Add(s)
	}
	base := testModel(f, 100, 30)
	f.Fuzz(func(t *testing.T, s string) {
		if mu, err := parseMu(s); err == nil {
			if !(mu > 0 && mu <= 1) || math.IsNaN(mu) {
				t.Fatalf("parseMu(%q) = %v", s, mu)
			}
		} else if _, bad := plaintext.FirstUnsafe(err.Error()); bad {
			t.Fatalf("parseMu(%q) error holds an unsafe character: %q", s, err.Error())
		}
		if x, err := parseNumber(s); err == nil {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				t.Fatalf("parseNumber(%q) = %v", s, x)
			}
		} else if _, bad := plaintext.FirstUnsafe(err.Error()); bad {
			t.Fatalf("parseNumber(%q) error holds an unsafe character: %q", s, err.Error())
		}
		paste := tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(s), Paste: true}
		for _, open := range []string{"m", "f"} {
			m := press(t, base, open)
			m = drive(t, m, paste)
			m = press(t, m, "enter")
			view := m.View()
			for _, line := range strings.Split(view, "\n") {
				if _, bad := plaintext.FirstUnsafe(line); bad {
					t.Fatalf("after pasting %q into field %q the screen holds %q", s, open, line)
				}
			}
			if m.mode == modeMu {
				m = press(t, m, "esc")
			}
		}
	})
}
