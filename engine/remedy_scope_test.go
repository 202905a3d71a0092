package engine_test

import (
	"strings"
	"testing"

	"heelwatch/engine"
)

// "No righting action is needed" must not read as "all is well": the
// righting options weigh list and loll only, and the summary says that
// trim, freeboard and the hull girder are for the flags (the freighter with
// Hold 1 open lies upright, 4 m by the head, her girder past its limit).
func TestRemedyNoneNeededSaysItsScope(t *testing.T) {
	v := remedyBarge{kg: 5.0}.vessel(t)
	rs := engine.FindRemedies(v, v.Intact())
	if !strings.Contains(rs.Summary, "no righting action is needed") || !strings.Contains(rs.Summary, "flags") {
		t.Errorf("summary %q: want none needed, and the flags named for what the options do not weigh", rs.Summary)
	}
}
