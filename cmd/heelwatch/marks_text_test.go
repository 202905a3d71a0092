package main

import (
	"regexp"
	"testing"
)

// TestMarksTextSaysWhereAndWhat: in solve's text the mark's place along
// the ship is labelled as such, so that "Aft P  5.0 m  port  5.21 m" is
// not read as two drafts: the first figure is where the mark is.
func TestMarksTextSaysWhereAndWhat(t *testing.T) {
	code, out, errs := heelwatch(t, "solve")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if !regexp.MustCompile(`(?m)^\s+Aft P\s+at x\s+5\.0 m\s+port\s+\d\.\d\d m`).MatchString(out) {
		t.Errorf("the marks' table:\n%s", out)
	}
}
