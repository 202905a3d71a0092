package tui

import (
	"errors"
	"io"
	"os"
	"path/filepath"
	"syscall"
	"testing"
)

// TestReportWholeOrAbsent: a report whose writing fails half-way (a full
// disk) leaves no file, not even the temporary one; a good one gets its
// name, and a second of the same second the next name, never overwriting.
func TestReportWholeOrAbsent(t *testing.T) {
	dir := t.TempDir()
	_, err := writeNewFile(dir, "r", func(w io.Writer) error {
		io.WriteString(w, "# half a report")
		return syscall.ENOSPC
	})
	if !errors.Is(err, syscall.ENOSPC) {
		t.Fatalf("err %v", err)
	}
	if files, _ := os.ReadDir(dir); len(files) != 0 {
		t.Fatalf("a failed report left %v", files)
	}
	for k, want := range []string{"r.md", "r-2.md"} {
		path, err := writeNewFile(dir, "r", func(w io.Writer) error {
			_, err := io.WriteString(w, "report "+want)
			return err
		})
		if err != nil || path != filepath.Join(dir, want) {
			t.Fatalf("report %d: %s, %v", k+1, path, err)
		}
	}
	files, _ := os.ReadDir(dir)
	if len(files) != 2 {
		t.Errorf("files %v, want r.md and r-2.md only", files)
	}
	if b, _ := os.ReadFile(filepath.Join(dir, "r.md")); string(b) != "report r.md" {
		t.Errorf("r.md was overwritten: %q", b)
	}
}
