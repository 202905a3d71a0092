package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestHandNotUsable: the freighter loaded top-heavy (800 t of deck cargo at
// 7.0 m above the base, tanks empty) with Wing tank 2 S open: the hand
// method's GM is under 0.2 m and its heel 45.6° against 24.2° direct. Its
// answer is kept (the conventions) but marked not usable: past-small-angles
// at danger, hand.usable false with the reason, and the text's hand column
// marked.
func TestHandNotUsable(t *testing.T) {
	cond := filepath.Join(t.TempDir(), "topheavy.toml")
	src := `format = 1
name = "Top-heavy trial"
keep = ["Lightship: hull steel", "Lightship: main engine and machinery", "Lightship: deckhouse and aft outfit", "Lightship: hatch covers and forward outfit", "Crew, provisions and stores", "Cargo hold 2: bagged fertiliser", "Cargo hold 1: steel pipes"]
[[weight]]
name = "Deck cargo"
mass = 800.0
lcg = 44.0
vcg = 7.0
`
	if err := os.WriteFile(cond, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	args := []string{"--vessel", "freighter", "--condition", cond, "--open", "Wing tank 2 S"}
	code, m := solveJSON(t, args...)
	h, _ := m["hand"].(map[string]any)
	eq, _ := m["equilibrium"].(map[string]any)
	if code != 0 || h == nil || eq == nil {
		t.Fatalf("exit %d, hand %v, equilibrium %v", code, h, eq)
	}
	hh, _ := h["heel_deg"].(float64)
	dh, _ := eq["heel_deg"].(float64)
	if hh < 40 || dh > 30 {
		t.Fatalf("hand heel %.2f°, direct %.2f°: the case does not test what it says", hh, dh)
	}
	if h["usable"] != false || !strings.Contains(h["not_usable_because"].(string), "beyond the 20°") {
		t.Errorf("hand usable %v because %q", h["usable"], h["not_usable_because"])
	}
	var sev string
	for _, f := range m["flags"].([]any) {
		if f := f.(map[string]any); f["code"] == "past-small-angles" {
			sev = f["severity"].(string)
			if !strings.HasPrefix(f["message"].(string), "The hand answer is not usable here: ") {
				t.Errorf("message %q", f["message"])
			}
		}
	}
	if sev != "danger" {
		t.Errorf("past-small-angles at %q, want danger", sev)
	}
	_, out, _ := heelwatch(t, append([]string{"solve"}, args...)...)
	for _, want := range []string{"hand (NOT USABLE)", "° to starboard *", "* not usable: beyond the hand method's range", "NOT USABLE: the hand answer"} {
		if !strings.Contains(out, want) {
			t.Errorf("text lacks %q", want)
		}
	}
}
