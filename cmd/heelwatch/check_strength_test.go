package main

import (
	"bytes"
	"strings"
	"testing"
)

// check says whether the hull girder is worked out: the bundled freighter
// gives weight extents and read-out points with permissible values; the
// test lighter gives no extents, and check says why.
func TestCheckSaysStrength(t *testing.T) {
	for _, c := range []struct{ vessel, want string }{
		{"freighter", "strength   worked out at 6 read-out points"},
		{"../../testdata/cli/report-case.toml", "strength   not worked out: "},
	} {
		var out, errOut bytes.Buffer
		if code := run([]string{"check", "--vessel", c.vessel}, &out, &errOut); code != 0 {
			t.Fatalf("%s: exit %d: %s", c.vessel, code, errOut.String())
		}
		if !strings.Contains(out.String(), c.want) {
			t.Errorf("%s: lacks %q:\n%s", c.vessel, c.want, out.String())
		}
	}
}
