//go:build unix

package tui

import (
	"path/filepath"
	"syscall"
	"testing"
)

// specialFiles returns paths the event log must refuse without blocking:
// a FIFO (opening one for writing waits for a reader) and a place under
// /proc that cannot be created.
func specialFiles(t *testing.T, dir string) []string {
	fifo := filepath.Join(dir, "fifo")
	if err := syscall.Mkfifo(fifo, 0o600); err != nil {
		t.Fatal(err)
	}
	return []string{fifo, "/proc/heelwatch-cannot/log"}
}
