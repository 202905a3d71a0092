package tui

import (
	"os"
	"path/filepath"
	"testing"
	"time"
)

// TestSaveOfferNeverOverwrites: two saves in the same minute (and in the
// same second) are offered two names; taking the offers keeps both files
// (the officer trial lost a condition saved twice in one minute).
func TestSaveOfferNeverOverwrites(t *testing.T) {
	dir := t.TempDir()
	p := conditionPanel{dir: dir}
	at := time.Date(2026, 12, 2, 13, 1, 5, 0, time.UTC)
	first := p.defaultPath("condition", at)
	if err := os.WriteFile(first, []byte("x"), 0o644); err != nil {
		t.Fatal(err)
	}
	second := p.defaultPath("condition", at)
	third := p.defaultPath("condition", at.Add(20*time.Second))
	if second == first || third == first {
		t.Errorf("offers %q, %q after %q was saved", second, third, first)
	}
	if filepath.Dir(second) != dir || filepath.Base(first) != "condition-20261202-130105.toml" {
		t.Errorf("first %q, second %q", first, second)
	}
}
