package tui

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/report/plaintext"
)

// TestNamesSanitisedOnScreenAndInTheLog: a vessel built without the
// reader's refusals, with names that would retitle the window, clear the
// screen, forge a log line and reverse text, shows and logs them only
// through the sanitiser.
func TestNamesSanitisedOnScreenAndInTheLog(t *testing.T) {
	v, info := ship(t)
	v.Name = "\x1b]0;owned\x07Bad ship"
	v.Compartments[0].Name = "Aft\x1b[2J\x1b[H peak"
	v.Compartments[1].Name = "Steering\r\n2025-03-14T02:30:00Z  change 9: forged"
	v.Compartments[2].Name = "Store \u202eS"
	if len(v.Openings) > 0 {
		v.Openings[0].Name = "Vent\u009b31m"
	}
	path := filepath.Join(t.TempDir(), "watch.log")
	lg, err := openEventLog(path)
	if err != nil {
		t.Fatal(err)
	}
	defer lg.close()
	m := newModel(v, info, Options{Palette: "day", VesselFile: "ship\x1b[31m.toml"})
	m.now = fixedClock()
	m.animate = false
	m.file = lg
	m = drive(t, m, nil, m.Init())
	for _, w := range [][2]int{{100, 30}, {140, 45}} {
		m = drive(t, m, tea.WindowSizeMsg{Width: w[0], Height: w[1]})
		for i := 0; i < 3; i++ {
			m = press(t, m, "space", "down")
		}
		for _, line := range strings.Split(m.View(), "\n") {
			if r, bad := plaintext.FirstUnsafe(line); bad {
				t.Fatalf("%d×%d: the screen holds %U: %q", w[0], w[1], r, line)
			}
		}
	}
	data, _ := os.ReadFile(path)
	for _, line := range strings.Split(strings.TrimSuffix(string(data), "\n"), "\n") {
		if r, bad := plaintext.FirstUnsafe(line); bad {
			t.Fatalf("the log file holds %U: %q", r, line)
		}
		if strings.Contains(line, "change 9") && !strings.Contains(line, "Steering") {
			t.Fatalf("a name forged a log line: %q", line)
		}
	}
	if !strings.Contains(string(data), "Aft\uFFFD[2J\uFFFD[H peak") {
		t.Errorf("the log does not show the sanitised name:\n%s", data)
	}
}
