package tui

import (
	"errors"
	"fmt"
	"io"
	"os"
	"strings"
	"sync"
	"sync/atomic"
	"time"
)

// eventLog appends the dashboard's event lines to a file: the ship's
// record of the casualty, so it loses nothing.
//
//   - add hands each line to the kernel at once, in Update, before the
//     change's computation starts and before the screen shows it: a quit,
//     a crash or a kill -9 after that cannot lose it (only a power cut
//     before the next sync can). sync, run from a Cmd, syncs it to the disk
//     without holding the lock, so Update never waits for a sync.
//   - Lines are written whole. A write that fails (a full disk) is cut back
//     to the last whole line where the file allows it; where it does not,
//     the next write starts on a fresh line. No line is dropped: they stay
//     queued, in order, and are written when writing works again, after a
//     line that says from when to when writing failed and why.
//   - While writing fails, failing says so (the header shows it until it
//     recovers), and the model retries every few seconds.
//   - When the path no longer names the file opened (it was deleted or
//     moved), the path is opened anew and the first line there says so.
type eventLog struct {
	path string
	now  func() time.Time
	open func(path string) (logFile, error)

	mu        sync.Mutex // guards what follows; held while lines go to the kernel, never while syncing
	f         logFile
	id        os.FileInfo // the file f is, to notice when path names another
	queue     []string    // lines not yet written, oldest first
	torn      bool        // a failed write may have left part of a line behind
	failErr   error       // the last write error; nil while writing works
	failSince time.Time
	notes     []string // for the screen's event log, taken by takeNotes
	closed    bool

	retrying atomic.Bool // a retry is scheduled
}

// logFile is what the event log needs of its file; *os.File has it.
type logFile interface {
	io.Writer
	Seek(offset int64, whence int) (int64, error)
	Truncate(size int64) error
	Sync() error
	Close() error
	Stat() (os.FileInfo, error)
}

func openLogFile(path string) (logFile, error) {
	return os.OpenFile(path, os.O_APPEND|os.O_CREATE|os.O_WRONLY, 0o644)
}

// CheckLogFile reports whether path can take the event log: a regular file
// (or none yet) that can be opened for appending. A FIFO or a device is
// refused without being opened, since opening a FIFO blocks.
func CheckLogFile(path string) error {
	if st, err := os.Stat(path); err == nil && !st.Mode().IsRegular() {
		return fmt.Errorf("%s is not a regular file: give a file the event log can be appended to", path)
	}
	f, err := openLogFile(path)
	if err != nil {
		return err
	}
	return f.Close()
}

// openEventLog opens path for appending, creating it if need be.
func openEventLog(path string) (*eventLog, error) {
	if err := CheckLogFile(path); err != nil {
		return nil, err
	}
	l := &eventLog{path: path, now: time.Now, open: openLogFile}
	if err := l.reopen(); err != nil {
		return nil, err
	}
	return l, nil
}

// reopen opens path anew. Called with mu held (or before l is shared).
func (l *eventLog) reopen() error {
	f, err := l.open(l.path)
	if err != nil {
		return err
	}
	id, err := f.Stat()
	if err != nil {
		f.Close()
		return err
	}
	if l.f != nil {
		l.f.Close()
	}
	l.f, l.id, l.torn = f, id, !endsInNewline(l.path, id.Size())
	return nil
}

// endsInNewline reports whether the file at path, size bytes long, is
// empty or ends with a whole line (a session cut off by a power failure
// may have left a torn one; the first line written then starts afresh).
func endsInNewline(path string, size int64) bool {
	if size == 0 {
		return true
	}
	f, err := os.Open(path)
	if err != nil {
		return true
	}
	defer f.Close()
	var b [1]byte
	if _, err := f.ReadAt(b[:], size-1); err != nil {
		return true
	}
	return b[0] == '\n'
}

// add queues line (a whole line, without its newline) and writes every
// queued line. The error is the write's; the lines stay queued then.
func (l *eventLog) add(line string) error {
	l.mu.Lock()
	defer l.mu.Unlock()
	l.queue = append(l.queue, line)
	return l.writeLocked()
}

// stamp is the time at the head of every line of the file.
func (l *eventLog) stamp() string { return l.now().Format(time.RFC3339) }

// followPath reopens the path when it no longer names the file open.
func (l *eventLog) followPath() error {
	st, err := os.Stat(l.path)
	if err == nil && l.id != nil && os.SameFile(st, l.id) {
		return nil
	}
	if err := l.reopen(); err != nil {
		return fmt.Errorf("%s was moved or deleted and cannot be made anew: %w", l.path, err)
	}
	note := fmt.Sprintf("event log: %s was moved or deleted; this file was made anew and holds the lines from here on", l.path)
	l.queue = append([]string{l.stamp() + "  " + note}, l.queue...)
	l.notes = append(l.notes, "event log file moved or deleted: "+l.path+" made anew")
	return nil
}

func (l *eventLog) writeLocked() error {
	if l.closed {
		return errors.New("the event log is closed")
	}
	if len(l.queue) == 0 && l.failErr == nil {
		return nil
	}
	err := l.followPath()
	if err == nil {
		err = l.writeQueue()
	}
	if err != nil {
		if l.failErr == nil {
			l.failSince = l.now()
			l.notes = append(l.notes, "event log file not written: "+err.Error()+"; the lines are kept and retried")
		}
		l.failErr = err
		return err
	}
	return nil
}

// writeQueue writes the queued lines whole, after a gap line when writing
// had failed.
func (l *eventLog) writeQueue() error {
	lines := l.queue
	if l.failErr != nil {
		gap := fmt.Sprintf("event log: lines could not be written from %s to %s (%v); the %d lines held back follow, each with the time it happened",
			l.failSince.Format(time.RFC3339), l.now().Format(time.RFC3339), l.failErr, len(l.queue))
		lines = append([]string{l.stamp() + "  " + gap}, lines...)
	}
	var b strings.Builder
	if l.torn {
		b.WriteByte('\n')
	}
	for _, s := range lines {
		b.WriteString(s)
		b.WriteByte('\n')
	}
	end, serr := l.f.Seek(0, io.SeekEnd)
	n, err := l.f.Write([]byte(b.String()))
	if err != nil {
		if n > 0 && (serr != nil || l.f.Truncate(end) != nil) {
			l.torn = true
		}
		return err
	}
	if l.failErr != nil {
		l.notes = append(l.notes, fmt.Sprintf("event log file written again: %d lines held back since %s are in it", len(l.queue), l.failSince.Format("15:04:05")))
	}
	l.queue, l.torn, l.failErr = nil, false, nil
	return nil
}

// sync writes what is queued and syncs the file to the disk.
func (l *eventLog) sync() error {
	l.mu.Lock()
	err := l.writeLocked()
	f := l.f
	l.mu.Unlock()
	if err != nil {
		return err
	}
	if f != nil {
		if err := f.Sync(); err != nil && !errors.Is(err, os.ErrClosed) {
			return err
		}
	}
	return nil
}

// failing returns the error writing fails with and since when; nil while
// writing works.
func (l *eventLog) failing() (error, time.Time) {
	l.mu.Lock()
	defer l.mu.Unlock()
	return l.failErr, l.failSince
}

// takeNotes returns, once, what the screen's event log should say about
// the file.
func (l *eventLog) takeNotes() []string {
	l.mu.Lock()
	defer l.mu.Unlock()
	n := l.notes
	l.notes = nil
	return n
}

// close writes and syncs what it can and closes the file. Lines that
// still cannot be written are returned in the error, so that the caller
// can print them rather than lose them.
func (l *eventLog) close() error {
	err := l.sync()
	l.mu.Lock()
	defer l.mu.Unlock()
	if l.f == nil {
		return err
	}
	if cerr := l.f.Close(); err == nil {
		err = cerr
	}
	l.f, l.closed = nil, true
	if len(l.queue) > 0 {
		err = fmt.Errorf("%w; %d lines could not be written:\n%s", err, len(l.queue), strings.Join(l.queue, "\n"))
	}
	return err
}
