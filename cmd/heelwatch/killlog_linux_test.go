package main

import (
	"bytes"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"
	"unsafe"
)

// asProgramEnv makes the test binary act as heelwatch itself, so that the
// tests below can start "heelwatch" in a terminal without building it.
const asProgramEnv = "HEELWATCH_TEST_AS_PROGRAM"

func init() {
	if os.Getenv(asProgramEnv) == "1" {
		os.Exit(guarded(os.Args[1:], os.Stdout, os.Stderr))
	}
}

// openPTY opens a pseudo-terminal of cols×rows (Linux: /dev/ptmx).
func openPTY(t *testing.T, cols, rows uint16) (master, slave *os.File) {
	t.Helper()
	m, err := os.OpenFile("/dev/ptmx", os.O_RDWR|syscall.O_NOCTTY, 0)
	if err != nil {
		t.Skipf("no pseudo-terminals here: %v", err)
	}
	var unlock int32
	if err := ioctl(m, syscall.TIOCSPTLCK, uintptr(unsafe.Pointer(&unlock))); err != nil {
		t.Fatal(err)
	}
	var n uint32
	if err := ioctl(m, syscall.TIOCGPTN, uintptr(unsafe.Pointer(&n))); err != nil {
		t.Fatal(err)
	}
	s, err := os.OpenFile(fmt.Sprintf("/dev/pts/%d", n), os.O_RDWR|syscall.O_NOCTTY, 0)
	if err != nil {
		t.Fatal(err)
	}
	ws := struct{ row, col, x, y uint16 }{rows, cols, 0, 0}
	if err := ioctl(s, syscall.TIOCSWINSZ, uintptr(unsafe.Pointer(&ws))); err != nil {
		t.Fatal(err)
	}
	return m, s
}

func ioctl(f *os.File, req, arg uintptr) error {
	if _, _, e := syscall.Syscall(syscall.SYS_IOCTL, f.Fd(), req, arg); e != 0 {
		return e
	}
	return nil
}

// screen collects what the program draws.
type screen struct {
	mu  sync.Mutex
	buf bytes.Buffer
}

func (s *screen) Write(p []byte) (int, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.buf.Write(p)
}

func (s *screen) String() string {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.buf.String()
}

func waitFor(t *testing.T, what string, cond func() bool) {
	t.Helper()
	deadline := time.Now().Add(20 * time.Second)
	for !cond() {
		if time.Now().After(deadline) {
			t.Fatalf("gave up waiting for %s", what)
		}
		time.Sleep(20 * time.Millisecond)
	}
}

// TestChangeShownThenKilledIsInTheLog runs the dashboard in a terminal with
// --log, types a permeability by a bracketed paste (after a Ctrl+V, which
// must not run a clipboard program), opens a compartment and, the moment
// the screen shows it flooded, kills the program with SIGKILL. The log
// must hold both changes, in whole lines.
func TestChangeShownThenKilledIsInTheLog(t *testing.T) {
	if testing.Short() {
		t.Skip("starts the program in a terminal")
	}
	dir := t.TempDir()
	logPath := filepath.Join(dir, "watch.log")
	// Clipboard programs that leave a mark if anything runs them.
	bin := filepath.Join(dir, "bin")
	mark := filepath.Join(dir, "clipboard-ran")
	os.Mkdir(bin, 0o755)
	for _, name := range []string{"xclip", "xsel", "wl-paste", "wl-copy", "pbpaste", "termux-clipboard-get"} {
		os.WriteFile(filepath.Join(bin, name), []byte("#!/bin/sh\necho "+name+" >> "+mark+"\n"), 0o755)
	}

	master, slave := openPTY(t, 100, 30)
	defer master.Close()
	var scr screen
	go func() { _, _ = ioCopy(&scr, master) }()

	cmd := exec.Command(os.Args[0], "--vessel", "barge", "--log", logPath)
	cmd.Env = append(os.Environ(), asProgramEnv+"=1", "TERM=xterm-256color", "PATH="+bin+":"+os.Getenv("PATH"), "DISPLAY=:0", "WAYLAND_DISPLAY=wayland-0")
	cmd.Stdin, cmd.Stdout, cmd.Stderr = slave, slave, slave
	cmd.SysProcAttr = &syscall.SysProcAttr{Setsid: true, Setctty: true, Ctty: 0}
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	slave.Close()
	killed := false
	defer func() {
		if !killed {
			cmd.Process.Kill()
			cmd.Wait()
		}
	}()
	logText := func() string { b, _ := os.ReadFile(logPath); return string(b) }
	waitFor(t, "the session start in the log", func() bool { return strings.Contains(logText(), "session start") })

	send := func(s string) {
		if _, err := master.WriteString(s); err != nil {
			t.Fatal(err)
		}
	}
	send("m")    // type a permeability
	send("\x16") // Ctrl+V: must run nothing
	time.Sleep(300 * time.Millisecond)
	send("\x1b[200~0.5\x1b[201~") // a bracketed paste, as a terminal sends it
	send("\r")
	waitFor(t, "the typed permeability in the log", func() bool { return strings.Contains(logText(), "μ set 0.50") })
	send(" ") // open the selected compartment to the sea
	waitFor(t, "the screen to show her flooded", func() bool { return strings.Contains(scr.String(), "1 flooded") })
	if err := cmd.Process.Signal(syscall.SIGKILL); err != nil {
		t.Fatal(err)
	}
	killed = true
	cmd.Wait()

	text := logText()
	if !strings.Contains(text, "change 2: ") || !strings.Contains(text, "opened to sea") {
		t.Errorf("the change shown before kill -9 is not in the log:\n%s", text)
	}
	if !strings.HasSuffix(text, "\n") {
		t.Errorf("the log ends in a torn line:\n%q", text)
	}
	for _, l := range strings.Split(strings.TrimSuffix(text, "\n"), "\n") {
		if _, err := time.Parse(time.RFC3339, strings.Fields(l)[0]); err != nil {
			t.Errorf("line without its time: %q", l)
		}
	}
	if b, err := os.ReadFile(mark); err == nil {
		t.Errorf("a clipboard program ran: %s", b)
	}
}

func ioCopy(dst *screen, src *os.File) (int64, error) {
	buf := make([]byte, 4096)
	var n int64
	for {
		k, err := src.Read(buf)
		if k > 0 {
			dst.Write(buf[:k])
			n += int64(k)
			// Answer the terminal queries a real terminal answers (the
			// background colour, the cursor position), so that the program
			// does not wait for their time-outs.
			if bytes.Contains(buf[:k], []byte("\x1b]11;?")) {
				src.WriteString("\x1b]11;rgb:0000/0000/0000\x1b\\")
			}
			if bytes.Contains(buf[:k], []byte("\x1b[6n")) {
				src.WriteString("\x1b[1;1R")
			}
		}
		if err != nil {
			return n, err
		}
	}
}

// TestLogRefusedAtStart: --log to a place that cannot be written is
// refused before anything is shown, in a terminal and without one.
func TestLogRefusedAtStart(t *testing.T) {
	bad := "/proc/heelwatch-no-such-dir/watch.log"
	var out, errOut bytes.Buffer
	if code := guarded([]string{"--log", bad}, &out, &errOut); code != exitFailed || !strings.Contains(errOut.String(), "--log "+bad) {
		t.Errorf("without a terminal: exit %d, stderr %q", code, errOut.String())
	}
	if out.Len() != 0 {
		t.Errorf("without a terminal something was printed: %q", out.String())
	}
	master, slave := openPTY(t, 100, 30)
	defer master.Close()
	var scr screen
	go func() { _, _ = ioCopy(&scr, master) }()
	cmd := exec.Command(os.Args[0], "--log", bad)
	cmd.Env = append(os.Environ(), asProgramEnv+"=1", "TERM=xterm-256color")
	cmd.Stdin, cmd.Stdout, cmd.Stderr = slave, slave, slave
	cmd.SysProcAttr = &syscall.SysProcAttr{Setsid: true, Setctty: true, Ctty: 0}
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	slave.Close()
	done := make(chan error, 1)
	go func() { done <- cmd.Wait() }()
	select {
	case err := <-done:
		if ee, ok := err.(*exec.ExitError); !ok || ee.ExitCode() != exitFailed {
			t.Errorf("in a terminal: %v, want exit %d", err, exitFailed)
		}
	case <-time.After(20 * time.Second):
		cmd.Process.Kill()
		t.Fatal("in a terminal the dashboard started instead of refusing --log")
	}
	waitFor(t, "the message", func() bool { return strings.Contains(scr.String(), "--log "+bad) })
}
