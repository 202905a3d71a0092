package main

import (
	"bytes"
	"errors"
	"io"
	"strings"
	"syscall"
	"testing"
)

// fullWriter fails every write as a full disk does (>/dev/full).
type fullWriter struct{}

func (fullWriter) Write([]byte) (int, error) { return 0, syscall.ENOSPC }

// TestOutputThatCannotBeWrittenExits1: every command whose output is lost
// says so and exits 1, not 0 (issue: `vessels barge >/dev/full` exited 0).
func TestOutputThatCannotBeWrittenExits1(t *testing.T) {
	for _, args := range [][]string{
		{"vessels"}, {"vessels", "barge"}, {"check", "barge"}, {"--help"}, {"help"},
		{"--version"}, {"solve"}, {"solve", "--format", "json"}, {"solve", "--help"},
		{"flood", "--help"}, {"flood", "--vessel", "barge", "--hole", "Hold aft:0.05", "--limit", "10m"},
		{}, // no terminal: the intact condition is printed
	} {
		var errOut bytes.Buffer
		code := guarded(args, fullWriter{}, &errOut)
		if code != exitFailed {
			t.Errorf("%q >/dev/full: exit %d, want %d", args, code, exitFailed)
		}
		if !strings.Contains(errOut.String(), "no space left on device") {
			t.Errorf("%q >/dev/full: stderr %q does not say why", args, errOut.String())
		}
	}
}

func TestGuardTurnsAPanicIntoStatus1(t *testing.T) {
	var out, errOut bytes.Buffer
	code := guard(func(io.Writer, io.Writer) int {
		var a []int
		return a[3] // index out of range
	}, &out, &errOut)
	if code != exitFailed {
		t.Errorf("exit %d after a panic, want %d (2 is for bad usage only)", code, exitFailed)
	}
	if !strings.Contains(errOut.String(), "internal fault") || !strings.Contains(errOut.String(), "index out of range") {
		t.Errorf("stderr %q", errOut.String())
	}
}

// TestOutputGuardCleansSplitSequences: a bidirectional override or a C1
// control split across two writes is still replaced; plain text passes.
func TestOutputGuardCleansSplitSequences(t *testing.T) {
	var b bytes.Buffer
	g := &outputGuard{w: &b}
	for _, p := range []string{"Hold \xe2\x80", "\xae1\t\n", "x\xc2", "\x9b2J\x1b]0;t\x07 Ölbunker\n", "\xe2"} {
		if n, err := g.Write([]byte(p)); err != nil || n != len(p) {
			t.Fatalf("Write(%q) = %d, %v", p, n, err)
		}
	}
	g.flush()
	want := "Hold \uFFFD1\t\nx\uFFFD2J\uFFFD]0;t\uFFFD Ölbunker\n\uFFFD"
	if b.String() != want {
		t.Errorf("got %q, want %q", b.String(), want)
	}
}

func TestOutputGuardKeepsTheFirstError(t *testing.T) {
	g := &outputGuard{w: fullWriter{}}
	if _, err := g.Write([]byte("a")); !errors.Is(err, syscall.ENOSPC) {
		t.Fatalf("err %v", err)
	}
	if _, err := g.Write([]byte("b")); !errors.Is(err, syscall.ENOSPC) || !errors.Is(g.err, syscall.ENOSPC) {
		t.Errorf("a later write: %v", err)
	}
}

// TestFloodArgumentsThatCrashedOrPassed: --pump on a vessel with no
// compartments panicked; --hole "X:nan" was taken as "no area given".
func TestFloodArgumentsThatCrashedOrPassed(t *testing.T) {
	const empty = "../../testdata/cli/no-compartments.toml"
	for _, tc := range []struct {
		args []string
		frag string
	}{
		{[]string{"flood", "--vessel", empty, "--pump", "foo"}, "write NAME:M3H"},
		{[]string{"flood", "--vessel", empty, "--pump", "foo:10"}, "It has no compartments"},
		{[]string{"flood", "--vessel", empty, "--hole", "X:nan"}, "NaN is not a number"},
		{[]string{"flood", "--vessel", "barge", "--hole", "Hold aft:nan"}, "NaN is not a number"},
		{[]string{"flood", "--vessel", "barge", "--hole", "Hold aft:0.1:inf"}, "+Inf is not a number"},
	} {
		var out, errOut bytes.Buffer
		code := guarded(tc.args, &out, &errOut)
		if code != exitUsage || !strings.Contains(errOut.String(), tc.frag) || strings.Contains(errOut.String(), "internal fault") {
			t.Errorf("%q: exit %d, stderr %q; want %d and %q", tc.args, code, errOut.String(), exitUsage, tc.frag)
		}
	}
}

// TestHalfPercentOnTheCommandLine: --perm "X=0.5%" is 0.005 in the text,
// in the hand working and in the JSON (it was shown as 0.01).
func TestHalfPercentOnTheCommandLine(t *testing.T) {
	args := []string{"solve", "--vessel", "barge", "--open", "Hold aft", "--perm", "Hold aft=0.5%"}
	var out, errOut bytes.Buffer
	if code := guarded(args, &out, &errOut); code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut.String())
	}
	if s := out.String(); !strings.Contains(s, "μ 0.005") || !strings.Contains(s, "0.0050×") || strings.Contains(s, "μ 0.01") {
		t.Errorf("text:\n%s", s)
	}
	out.Reset()
	if code := guarded(append(args, "--format", "json"), &out, &errOut); code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut.String())
	}
	if s := out.String(); !strings.Contains(s, `"permeability": 0.005`) {
		t.Errorf("JSON:\n%s", s)
	}
}
