package main

import (
	"strings"
	"testing"
)

// The margin line is a passenger-ship notion (SOLAS II-1, subdivision of
// passenger ships): check names it for the ferry only; a cargo ship's
// summary speaks of the deck edge.
func TestCheckMarginLineOnPassengerShipsOnly(t *testing.T) {
	for _, c := range []struct {
		vessel string
		want   bool
	}{{"ferry", true}, {"freighter", false}, {"barge", false}} {
		_, out, errOut := heelwatch(t, "check", c.vessel)
		if got := strings.Contains(out, "margin line"); got != c.want {
			t.Errorf("check %s: says margin line %v, want %v\n%s%s", c.vessel, got, c.want, out, errOut)
		}
	}
}
