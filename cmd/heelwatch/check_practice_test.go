package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// check reports what makes a file a sound model beyond its form: the
// intact criteria, the hull volume no compartment holds, holes off the shell.
func TestCheckReportsPractice(t *testing.T) {
	_, src, _ := heelwatch(t, "vessels", "barge")
	// The barge's hole moved 2 m inboard of the side and up to z = 3 m: on the wing void's
	// inner bulkhead. The barge is a box (B = 16 m), so it is min(2, 3) m from
	// the shell (plain geometry).
	moved := strings.Replace(src, "x = 40.0, y = 8.0, z = 1.5", "x = 40.0, y = 6.0, z = 3.0", 1)
	if moved == src {
		t.Fatal("the barge's hole is not where this test expects it")
	}
	path := filepath.Join(t.TempDir(), "barge.toml")
	if err := os.WriteFile(path, []byte(moved), 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, errOut := heelwatch(t, "check", path)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	for _, want := range []string{
		"intact criteria  ", "pass  area under GZ from 0° to 30°",
		"0.0 m³ (0.00 %) held by no compartment",
		`the hole into "2 wing void S" at x 40.00, y 6.00, z 3.00 m is 2.00 m from the shell`,
		"every opening names the compartment it lets water into",
	} {
		if !strings.Contains(out, want) {
			t.Errorf("check lacks %q:\n%s", want, out)
		}
	}
	// The barge's vent without its leads_to leads nowhere.
	nowhere := strings.Replace(moved, "leads_to = \"2 wing void S\"\n", "", 1)
	if err := os.WriteFile(path, []byte(nowhere), 0o644); err != nil {
		t.Fatal(err)
	}
	if _, out, _ := heelwatch(t, "check", path); !strings.Contains(out, "1 of 5 openings lead to no compartment") || !strings.Contains(out, "2 wing void vent S") {
		t.Errorf("check does not say the vent leads nowhere:\n%s", out)
	}
	_, out, _ = heelwatch(t, "check", "barge", "ferry", "freighter")
	if strings.Contains(out, "WARNING") || strings.Count(out, "on the shell") != 3 {
		t.Errorf("the bundled ships are not all sound models:\n%s", out)
	}
}
