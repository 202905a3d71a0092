package main

import (
	"encoding/csv"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestVerifyDraftOutsideHull: a booklet row at a draft the model cannot be
// worked at (below the keel, above the hull, above the lowest deck at side)
// is input verify cannot use: exit 1, each row named by file:line with the
// reason, the model's range said once, and no comparison printed.
func TestVerifyDraftOutsideHull(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "h.csv")
	os.WriteFile(p, []byte("draft_m,kmt_m\n12,6\n-1,6\n3,6.6\n"), 0o644)
	code, out, errOut := heelwatch(t, "verify", "--vessel", "barge", "--hydrostatics", p)
	for _, frag := range []string{
		p + ":2: draft_m: 12 m is above the hull: its highest deck at side is 8.000 m",
		p + ":3: draft_m: -1 m is not above the keel (0.000 m)",
		"from the keel (0.000 m) to the deck at side (8.000 m)",
	} {
		if !strings.Contains(errOut, frag) {
			t.Errorf("stderr lacks %q:\n%s", frag, errOut)
		}
	}
	if code != exitInput || out != "" || strings.Contains(errOut, ":4:") {
		t.Errorf("exit %d (want %d), stdout %q", code, exitInput, out)
	}
	// The freighter's deck has sheer: 8.88 m is inside her hull but above
	// her lowest deck at side, where tables stops.
	os.WriteFile(p, []byte("draft_m,kmt_m\n8.88,6\n"), 0o644)
	code, _, errOut = heelwatch(t, "verify", "--vessel", "freighter", "--hydrostatics", p)
	if code != exitInput || !strings.Contains(errOut, ":2: draft_m: 8.88 m is above the lowest deck at side (7.601 m") ||
		!strings.Contains(errOut, "the deck is under water there") {
		t.Errorf("freighter 8.88 m: exit %d\n%s", code, errOut)
	}
}

// TestTablesEndAtDeck: the hydrostatic table ends at the deck at side,
// the box barge's 8.0 m depth included, where the box's closed forms give
// Δ = ρLBT = 10 496 t and KMT = T/2 + B²/(12T) = 6.6667 m (practice,
// references.md); the freighter's ends at her lowest deck at side, and
// verify accepts that draft.
func TestTablesEndAtDeck(t *testing.T) {
	last := func(vessel string) []string {
		code, out, errOut := heelwatch(t, "tables", "--vessel", vessel, "--format", "csv")
		recs, err := csv.NewReader(strings.NewReader(out)).ReadAll()
		if code != exitOK || err != nil {
			t.Fatalf("%s: exit %d %v %s", vessel, code, err, errOut)
		}
		return recs[len(recs)-1]
	}
	num := func(s string) float64 { x, _ := strconv.ParseFloat(s, 64); return x }
	b := last("barge")
	if num(b[0]) != 8 || math.Abs(num(b[1])-1.025*80*16*8) > 1e-3 || math.Abs(num(b[7])-(4+256.0/96)) > 1e-4 {
		t.Errorf("barge's last row %v: want draft 8, Δ 10496, KMT 6.6667", b)
	}
	f := last("freighter")
	if num(f[0]) < 7.6 || num(f[0]) > 7.61 {
		t.Errorf("freighter's last row at %s m, want her lowest deck at side (7.6 m)", f[0])
	}
	p := filepath.Join(t.TempDir(), "h.csv")
	os.WriteFile(p, []byte("draft_m,kmt_m\n"+f[0]+","+f[7]+"\n"), 0o644)
	if code, _, errOut := heelwatch(t, "verify", "--vessel", "freighter", "--hydrostatics", p); code != exitOK {
		t.Errorf("verify at the freighter's top draft %s: exit %d %s", f[0], code, errOut)
	}
}
