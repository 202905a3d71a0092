package tui

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestHalfPercentIsOneValueEverywhere: μ typed as "0.5%" was used as 0.005
// but shown and logged as 0.01. It is 0.005 in the state the engine
// computes, on the screen, in the screen's log and in the log file.
func TestHalfPercentIsOneValueEverywhere(t *testing.T) {
	path := filepath.Join(t.TempDir(), "watch.log")
	lg, err := openEventLog(path)
	if err != nil {
		t.Fatal(err)
	}
	defer lg.close()
	m := testModel(t, 120, 40)
	m.file = lg
	m = selectSpace(t, m, "Hold 2")
	m = press(t, m, "m", "0", ".", "5", "%", "enter", "space")
	if got := m.damage[m.sel].Permeability; got != 0.005 {
		t.Fatalf("used μ %v, want 0.005", got)
	}
	if m.cur == nil || m.cur.Damage[m.sel].Permeability != 0.005 || !m.cur.Damage[m.sel].Open {
		t.Fatalf("the assessment shown is not of Hold 2 open at μ 0.005")
	}
	if v := m.View(); !strings.Contains(v, "0.005") || strings.Contains(v, "μ 0.01") {
		t.Errorf("the screen does not show 0.005:\n%s", v)
	}
	screen := strings.Join(m.log, "\n")
	if !strings.Contains(screen, "Hold 2 μ set 0.005") || !strings.Contains(screen, "Hold 2 opened to sea (μ 0.005)") {
		t.Errorf("the screen's log:\n%s", screen)
	}
	data, _ := os.ReadFile(path)
	for _, want := range []string{"change 1: Hold 2 μ set 0.005", "change 2: Hold 2 opened to sea (μ 0.005)", "result 2: Hold 2 opened to sea (μ 0.005)"} {
		if !strings.Contains(string(data), want) {
			t.Errorf("the log file lacks %q:\n%s", want, data)
		}
	}
	if strings.Contains(string(data), "μ 0.01") {
		t.Errorf("the log file shows 0.01:\n%s", data)
	}
}
