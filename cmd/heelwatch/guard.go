package main

import (
	"fmt"
	"io"
	"runtime/debug"
	"unicode/utf8"

	"heelwatch/report/plaintext"
)

// guarded runs the program with its output through outputGuards and turns
// what would otherwise be lost or misreported into a plain exit status:
//
//   - output that cannot be written (a full disk, a closed pipe,
//     >/dev/full) ends with a message on stderr and status 1, whatever the
//     command had computed: its answer did not reach anyone;
//   - a panic, which is a fault in heelwatch and never the input's, ends
//     with a message, the stack for the report, and status 1 (Go would
//     exit 2, which heelwatch keeps for bad usage).
//
// The Go runtime's own fatal errors (out of memory, a deadlock) cannot be
// recovered in the process and still exit 2; heelwatch keeps them out of
// reach by bounding what it reads (vessels.MaxFileBytes and the nesting
// limit) rather than by running itself as a child of another process.
func guarded(args []string, stdout, stderr io.Writer) int {
	return guard(func(out, errOut io.Writer) int { return run(args, out, errOut) }, stdout, stderr)
}

// guard runs prog as guarded describes.
func guard(prog func(stdout, stderr io.Writer) int, stdout, stderr io.Writer) (status int) {
	out := &outputGuard{w: stdout}
	errOut := &outputGuard{w: stderr}
	defer func() {
		if r := recover(); r != nil {
			fmt.Fprintf(errOut, "heelwatch: internal fault (not in your input): %v\nplease report it with the command line and this trace:\n%s", r, debug.Stack())
			status = exitFailed
		}
		out.flush()
		if out.err != nil {
			fmt.Fprintf(errOut, "heelwatch: the output could not be written: %v\n", out.err)
			status = exitFailed
		}
		errOut.flush()
	}()
	return prog(out, errOut)
}

// outputGuard is a writer in front of stdout or stderr. It passes
// everything through plaintext.Text, so that no text from a vessel file or
// the command line can act on the terminal (the second guard behind the
// vessel reader's refusals), and it keeps the first write error: after it,
// every write fails with it and guarded reports it. A UTF-8 sequence split
// across two writes is held back until it is whole, so that the sanitiser
// sees whole characters.
type outputGuard struct {
	w     io.Writer
	err   error
	carry []byte // the start of a UTF-8 sequence the last write ended in
}

func (g *outputGuard) Write(p []byte) (int, error) {
	if g.err != nil {
		return 0, g.err
	}
	buf := append(g.carry, p...)
	cut := wholeRunes(buf)
	g.carry = append([]byte(nil), buf[cut:]...)
	if cut > 0 {
		if _, err := io.WriteString(g.w, plaintext.Text(string(buf[:cut]))); err != nil {
			g.err = err
			return 0, err
		}
	}
	return len(p), nil
}

// flush writes what is held back (a sequence that never completed, which
// the sanitiser shows as U+FFFD).
func (g *outputGuard) flush() {
	if len(g.carry) == 0 || g.err != nil {
		return
	}
	c := g.carry
	g.carry = nil
	if _, err := io.WriteString(g.w, plaintext.Text(string(c))); err != nil {
		g.err = err
	}
}

// file returns the writer behind g, for the check whether it is a
// terminal.
func (g *outputGuard) file() io.Writer { return g.w }

// wholeRunes returns the length of the longest prefix of b that does not
// end inside a UTF-8 sequence that could still be completed.
func wholeRunes(b []byte) int {
	for back := 1; back <= utf8.UTFMax-1 && back <= len(b); back++ {
		c := b[len(b)-back]
		if c < 0x80 {
			return len(b) // ASCII: nothing is open
		}
		if utf8.RuneStart(c) {
			if utf8.FullRune(b[len(b)-back:]) {
				return len(b)
			}
			return len(b) - back
		}
	}
	return len(b)
}
