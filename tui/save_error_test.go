package tui

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// A folder that is missing when a report or a save is written (made away
// after start) is named in the message, with the file meant; the hidden
// temporary file the text goes to first is not.
func TestSaveFailureNamesTheFile(t *testing.T) {
	gone := filepath.Join(t.TempDir(), "reports")
	m := testModel(t, 120, 40)
	m.opts.ReportDir = gone
	m.cond.dir = gone
	m = press(t, m, "w")
	last := m.log[len(m.log)-1]
	if !strings.Contains(last, "report not written") || !strings.Contains(last, "there is no folder "+gone) || strings.Contains(last, ".tmp") {
		t.Errorf("report into a missing folder: %q", last)
	}
	for _, k := range []string{"W", "S"} {
		m = press(t, m, "L", k)
		m = press(t, m, "enter")
		note := m.cond.note
		if !strings.Contains(note, "not saved: "+gone+string(filepath.Separator)) || !strings.Contains(note, "there is no folder "+gone) || strings.Contains(note, ".tmp") {
			t.Errorf("%s into a missing folder: %q", k, note)
		}
		m = press(t, m, "L")
	}
}

// CheckReportDir refuses a missing folder, a file and a folder that cannot
// be written, naming it, and takes a folder that can.
func TestCheckReportDir(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "a-file")
	os.WriteFile(file, nil, 0o644)
	for _, c := range []struct{ dir, want string }{
		{filepath.Join(dir, "none"), "there is no folder " + filepath.Join(dir, "none")},
		{file, file + " is a file, not a folder"},
	} {
		if err := CheckReportDir(c.dir); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: %v, want %q", c.dir, err, c.want)
		}
	}
	if err := CheckReportDir(dir); err != nil {
		t.Errorf("a writable folder refused: %v", err)
	}
	if es, _ := os.ReadDir(dir); len(es) != 1 {
		t.Errorf("the check left files behind: %v", es)
	}
	if os.Geteuid() != 0 {
		ro := filepath.Join(dir, "ro")
		os.Mkdir(ro, 0o555)
		if err := CheckReportDir(ro); err == nil || !strings.Contains(err.Error(), "folder "+ro+" cannot be written to") {
			t.Errorf("read-only folder: %v", err)
		}
	}
}
