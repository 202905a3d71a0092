package main

import (
	"bytes"
	"path/filepath"
	"strings"
	"testing"
)

// TestReportsDirRefusedAtStart: --reports naming a folder that is not there
// is refused before anything is shown (as --log is), with the folder and
// why, and nothing on standard output.
func TestReportsDirRefusedAtStart(t *testing.T) {
	missing := filepath.Join(t.TempDir(), "no-such-folder")
	var out, errOut bytes.Buffer
	code := guarded([]string{"--reports", missing}, &out, &errOut)
	if code != exitUsage || !strings.Contains(errOut.String(), "--reports "+missing+": there is no folder "+missing) {
		t.Errorf("exit %d, stderr %q", code, errOut.String())
	}
	if out.Len() != 0 {
		t.Errorf("something was printed: %q", out.String())
	}
	out.Reset()
	errOut.Reset()
	if code := guarded([]string{"--reports", t.TempDir()}, &out, &errOut); code != exitOK {
		t.Errorf("a folder that is there: exit %d, stderr %q", code, errOut.String())
	}
}
