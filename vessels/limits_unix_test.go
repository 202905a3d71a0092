//go:build unix

package vessels

import (
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// TestOnlyRegularFilesAreRead: a FIFO (which blocked forever), a device
// (/dev/zero, read until memory ran out), a directory and a file over
// MaxFileBytes are refused without being read.
func TestOnlyRegularFilesAreRead(t *testing.T) {
	dir := t.TempDir()
	fifo := filepath.Join(dir, "pipe.toml")
	if err := syscall.Mkfifo(fifo, 0o600); err != nil {
		t.Fatal(err)
	}
	big := filepath.Join(dir, "big.toml")
	if err := os.WriteFile(big, nil, 0o600); err != nil {
		t.Fatal(err)
	}
	if err := os.Truncate(big, MaxFileBytes+1); err != nil { // sparse: no disk used
		t.Fatal(err)
	}
	for path, frag := range map[string]string{
		fifo:        "named pipe",
		"/dev/zero": "is a device",
		dir:         "is a directory",
		big:         "larger than 16 MiB",
	} {
		_, _, err := Load(path)
		if err == nil || !strings.Contains(err.Error(), frag) || !strings.Contains(err.Error(), path) {
			t.Errorf("Load(%s) = %v, want %q", path, err, frag)
		}
	}
	// A condition file that is a device is called a condition file, not a
	// vessel file.
	v, info := openBundled(t, "barge")
	if _, err := LoadCondition("/dev/zero", v, info); err == nil || !strings.HasPrefix(err.Error(), "condition file: /dev/zero is a device") || strings.Contains(err.Error(), "vessel file") {
		t.Errorf("LoadCondition(/dev/zero) = %v", err)
	}
	if _, _, err := Parse("big.toml", make([]byte, MaxFileBytes+1)); err == nil || !strings.Contains(err.Error(), "larger than 16 MiB") {
		t.Errorf("Parse of 16 MiB + 1: %v", err)
	}
}
