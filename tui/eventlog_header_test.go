package tui

import (
	"strings"
	"testing"
)

// TestLogWarningLeavesTheFiguresInTheHeader: at 80 columns the warning is
// short enough that heel and GM still show beside it.
func TestLogWarningLeavesTheFiguresInTheHeader(t *testing.T) {
	lg, disk, _ := logOnDisk(t)
	disk.full = true
	m := testModel(t, 80, 24)
	m.file = lg
	m = openSpaces(t, m, "Hold 2")
	head := strings.Split(m.View(), "\n")[0]
	if !strings.Contains(head, "LOG FAILING") || !strings.Contains(head, "GM ") || strings.Contains(head, "…") {
		t.Errorf("header %q", head)
	}
}
