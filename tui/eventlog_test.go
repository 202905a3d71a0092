package tui

import (
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
)

// fullDisk is a log file on a disk that fills up: once budget bytes have
// been written, a write writes what still fits and fails with ENOSPC, as
// write(2) does. noTruncate makes cutting the torn line away fail too.
type fullDisk struct {
	*os.File
	budget     int
	full       bool
	noTruncate bool
}

func (d *fullDisk) Write(p []byte) (int, error) {
	if !d.full {
		return d.File.Write(p)
	}
	n := min(d.budget, len(p))
	d.budget -= n
	if _, err := d.File.Write(p[:n]); err != nil {
		return 0, err
	}
	if n < len(p) {
		return n, syscall.ENOSPC
	}
	return n, nil
}

func (d *fullDisk) Truncate(size int64) error {
	if d.noTruncate {
		return syscall.EIO
	}
	return d.File.Truncate(size)
}

// logOnDisk opens an event log at a fresh path whose file is a fullDisk.
func logOnDisk(t *testing.T) (*eventLog, *fullDisk, string) {
	t.Helper()
	path := filepath.Join(t.TempDir(), "watch.log")
	var disk *fullDisk
	lg, err := openEventLog(path)
	if err != nil {
		t.Fatal(err)
	}
	lg.open = func(p string) (logFile, error) {
		f, err := os.OpenFile(p, os.O_APPEND|os.O_CREATE|os.O_WRONLY, 0o644)
		if err != nil {
			return nil, err
		}
		disk = &fullDisk{File: f}
		return disk, nil
	}
	if err := lg.reopen(); err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { lg.close() })
	return lg, disk, path
}

func fileLines(t *testing.T, path string) []string {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if len(data) > 0 && data[len(data)-1] != '\n' {
		t.Errorf("the file ends in a torn line: %q", data)
	}
	return strings.Split(strings.TrimSuffix(string(data), "\n"), "\n")
}

// TestChangeLoggedBeforeItsComputation: the change is in the file as soon
// as Update returns, before any Cmd (the computation) has run; its result
// follows on a line of its own once the computation is done.
func TestChangeLoggedBeforeItsComputation(t *testing.T) {
	m, lg, path := loggedModel(t, 100, 30)
	defer lg.close()
	m = selectSpace(t, m, "Hold 2")
	mm, cmd := m.Update(keyMsg("space")) // no Cmd run yet: nothing computed
	lines := fileLines(t, path)
	if last := lines[len(lines)-1]; !strings.Contains(last, "change 1: Hold 2 opened to sea") {
		t.Fatalf("after the key, before the computation, the file ends %q", last)
	}
	if strings.Contains(strings.Join(lines, "\n"), "result 1") {
		t.Fatal("a result is in the file before it was computed")
	}
	m = drive(t, mm.(model), nil, cmd)
	lines = fileLines(t, path)
	if last := lines[len(lines)-1]; !strings.HasPrefix(strings.Fields(last)[1], "result") || !strings.Contains(last, "result 1: Hold 2 opened to sea") || !strings.Contains(last, "drafts aft/mid/fwd") {
		t.Errorf("the result line is %q", last)
	}
}

// TestDiskFullKeepsEveryLineWhole: while the disk is full no line is lost
// and none is torn; the header warns for as long as it lasts; when writing
// works again a gap line says when it failed and the held lines follow in
// order.
func TestDiskFullKeepsEveryLineWhole(t *testing.T) {
	for _, noTruncate := range []bool{false, true} {
		lg, disk, path := logOnDisk(t)
		lg.add("2025-03-14T02:30:00Z  first")
		disk.full, disk.budget, disk.noTruncate = true, 10, noTruncate // the disk fills in the middle of the next line
		m := testModel(t, 100, 30)
		m.file = lg
		m = openSpaces(t, m, "Hold 2", "Wing tank 2 S")
		if err, _ := lg.failing(); err == nil {
			t.Fatal("the log does not know it is failing")
		}
		if v := m.View(); !strings.Contains(v, "LOG NOT WRITTEN since ") {
			t.Errorf("no lasting warning in the header while failing:\n%s", v)
		}
		if !strings.Contains(strings.Join(m.log, "\n"), "event log file not written") {
			t.Error("the screen's log does not say the file failed")
		}
		m = press(t, m, "u") // undo: one more line while full
		disk.full = false
		m = drive(t, m, nil, m.syncLog()) // the retry
		if v := m.View(); strings.Contains(v, "LOG NOT WRITTEN since ") {
			t.Error("the warning stays after the file recovered")
		}
		if !strings.Contains(strings.Join(m.log, "\n"), "event log file written again") {
			t.Error("the screen's log does not say the file recovered")
		}
		lines := fileLines(t, path)
		var kept []string
		gap := -1
		for i, l := range lines {
			if noTruncate && i == 1 {
				// The torn start of a line that could not be cut away
				// stands alone on its line, and its line is written again whole.
				if len(l) != 10 {
					t.Errorf("torn line %q, want the 10 bytes that fitted", l)
				}
				continue
			}
			if _, err := time.Parse(time.RFC3339, strings.Fields(l)[0]); err != nil {
				t.Errorf("line %d is torn or glued: %q", i+1, l)
			}
			if strings.Contains(l, "lines could not be written from") {
				gap = i
			}
			kept = append(kept, l)
		}
		want := []string{"first", "change 1: Hold 2", "result 1", "change 2: Wing tank 2 S", "result 2", "change 3: undone", "result 3"}
		if gap < 0 {
			t.Fatalf("no gap line:\n%s", strings.Join(lines, "\n"))
		}
		var order []string
		for _, l := range kept {
			if !strings.Contains(l, "lines could not be written") {
				order = append(order, l)
			}
		}
		if len(order) != len(want) {
			t.Fatalf("noTruncate=%v: %d lines, want %d:\n%s", noTruncate, len(order), len(want), strings.Join(lines, "\n"))
		}
		for i, w := range want {
			if !strings.Contains(order[i], w) {
				t.Errorf("line %d = %q, want %q", i+1, order[i], w)
			}
		}
	}
}

// TestLogFileMovedOrDeleted: the path is made anew, its first line says
// why, the screen says so, and no later line goes to the old file alone.
func TestLogFileMovedOrDeleted(t *testing.T) {
	for _, how := range []string{"moved", "deleted"} {
		m, lg, path := loggedModel(t, 100, 30)
		m = openSpaces(t, m, "Hold 2")
		if how == "moved" {
			if err := os.Rename(path, path+".old"); err != nil {
				t.Fatal(err)
			}
		} else if err := os.Remove(path); err != nil {
			t.Fatal(err)
		}
		m = openSpaces(t, m, "Wing tank 2 S")
		lines := fileLines(t, path)
		if !strings.Contains(lines[0], "was moved or deleted; this file was made anew") {
			t.Errorf("%s: first line %q", how, lines[0])
		}
		if !strings.Contains(strings.Join(lines, "\n"), "change 2: Wing tank 2 S") || !strings.Contains(strings.Join(lines, "\n"), "result 2") {
			t.Errorf("%s: later lines missing:\n%s", how, strings.Join(lines, "\n"))
		}
		if !strings.Contains(strings.Join(m.log, "\n"), "event log file moved or deleted") {
			t.Errorf("%s: the screen does not say so", how)
		}
		lg.close()
	}
}

// TestLogFileRefusedAtStart: a place that cannot be written, a directory
// and a FIFO (without blocking) are refused before the dashboard starts.
func TestLogFileRefusedAtStart(t *testing.T) {
	dir := t.TempDir()
	for _, p := range append(specialFiles(t, dir), dir, filepath.Join(dir, "no", "such", "dir.log")) {
		if err := CheckLogFile(p); err == nil {
			t.Errorf("CheckLogFile(%s) accepted it", p)
		}
	}
	if err := CheckLogFile(filepath.Join(dir, "ok.log")); err != nil {
		t.Errorf("a writable place refused: %v", err)
	}
}

// TestTooSmallTakesOnlyQuit: while the screen says it is too small, keys
// change nothing and log nothing; q quits.
func TestTooSmallTakesOnlyQuit(t *testing.T) {
	m, lg, path := loggedModel(t, 100, 30)
	defer lg.close()
	m = drive(t, m, tea.WindowSizeMsg{Width: 30, Height: 8})
	if !m.lay.small || !strings.Contains(m.View(), "heelwatch needs") {
		t.Fatal("not the too-small screen")
	}
	before := strings.Join(fileLines(t, path), "\n")
	seq, logN, sel := m.seq, len(m.log), m.sel
	for _, k := range []string{"space", "down", "+", "-", "m", "u", "w", "h", "r", "p", "x", "enter", "esc", "tab"} {
		mm, cmd := m.Update(keyMsg(k))
		m = mm.(model)
		if cmd != nil {
			t.Errorf("key %q on the too-small screen returned a Cmd", k)
		}
	}
	mm, _ := m.Update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune("q"), Paste: true})
	m = mm.(model)
	if m.seq != seq || len(m.log) != logN || m.sel != sel || m.mode != modeBrowse || !allZero(m.damage) {
		t.Errorf("the too-small screen let keys change the state: seq %d→%d, log %d→%d", seq, m.seq, logN, len(m.log))
	}
	if after := strings.Join(fileLines(t, path), "\n"); after != before {
		t.Errorf("the log file changed:\n%s", after)
	}
	if _, cmd := m.Update(keyMsg("q")); cmd == nil || cmd() != tea.Quit() {
		t.Error("q does not quit the too-small screen")
	}
}

// TestNoClipboardProgram: Ctrl+V in a text field asks for no clipboard
// (bubbles would run xclip or the like); a bracketed paste is typed in.
func TestNoClipboardProgram(t *testing.T) {
	m := testModel(t, 100, 30)
	m = press(t, m, "m") // type an exact permeability
	if m.mode != modeMu {
		t.Fatal("not editing")
	}
	if m.input.KeyMap.Paste.Enabled() {
		t.Error("the permeability field has its clipboard key enabled")
	}
	form := press(t, testModel(t, 100, 30), "f") // the flooding run's form
	if form.mode != modeForm {
		t.Fatal("no form")
	}
	for k := range form.form.fields {
		if form.form.fields[k].KeyMap.Paste.Enabled() {
			t.Errorf("form field %d has its clipboard key enabled", k)
		}
	}
	mm, cmd := m.Update(tea.KeyMsg{Type: tea.KeyCtrlV})
	m = mm.(model)
	if cmd != nil {
		t.Errorf("Ctrl+V returned a Cmd (%T), which would read the clipboard", cmd())
	}
	mm, _ = m.Update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune("0.6\x1b[2J"), Paste: true})
	m = mm.(model)
	if v := m.input.Value(); !strings.HasPrefix(v, "0.6") || strings.ContainsRune(v, 0x1b) {
		t.Errorf("pasted %q into the field", v)
	}
}

// TestLogAfterATornLine: a file left with a torn last line (a power cut in
// an earlier session) gets the next line on a fresh line.
func TestLogAfterATornLine(t *testing.T) {
	path := filepath.Join(t.TempDir(), "watch.log")
	if err := os.WriteFile(path, []byte("2025-03-14T02:00:00Z  whole\n2025-03-14T02:00:01Z  tor"), 0o644); err != nil {
		t.Fatal(err)
	}
	lg, err := openEventLog(path)
	if err != nil {
		t.Fatal(err)
	}
	lg.add("2025-03-14T02:30:00Z  next")
	lg.close()
	lines := fileLines(t, path)
	if len(lines) != 3 || lines[2] != "2025-03-14T02:30:00Z  next" {
		t.Errorf("lines %q", lines)
	}
}

// loggedModel is a test dashboard of w × h writing its event log to a new
// file; it returns the model, the log and the file's path.
func loggedModel(t *testing.T, w, h int) (model, *eventLog, string) {
	t.Helper()
	path := filepath.Join(t.TempDir(), "watch.log")
	lg, err := openEventLog(path)
	if err != nil {
		t.Fatal(err)
	}
	m := testModel(t, w, h)
	m.file = lg
	return m, lg, path
}
