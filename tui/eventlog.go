package tui

import (
	"os"
	"strings"
	"sync"
)

// eventLog appends the dashboard's event lines to a file as they happen,
// each batch synced to the disk, so that a crash or a pulled plug loses
// nothing already shown. add only queues (it is called from Update and
// never waits on the disk); flush, run from a Cmd, writes what is queued in
// order. Lines keep their order however the flushes are scheduled, because
// a flush takes the queue only while it holds the file.
type eventLog struct {
	file  sync.Mutex // held while writing
	qmu   sync.Mutex // guards queue
	queue []string
	f     *os.File
}

// openEventLog opens path for appending, creating it if need be.
func openEventLog(path string) (*eventLog, error) {
	f, err := os.OpenFile(path, os.O_APPEND|os.O_CREATE|os.O_WRONLY, 0o644)
	if err != nil {
		return nil, err
	}
	return &eventLog{f: f}, nil
}

func (l *eventLog) add(line string) {
	l.qmu.Lock()
	l.queue = append(l.queue, line)
	l.qmu.Unlock()
}

// flush writes every queued line and syncs the file.
func (l *eventLog) flush() error {
	l.file.Lock()
	defer l.file.Unlock()
	l.qmu.Lock()
	q := l.queue
	l.queue = nil
	l.qmu.Unlock()
	if len(q) == 0 || l.f == nil {
		return nil
	}
	if _, err := l.f.WriteString(strings.Join(q, "\n") + "\n"); err != nil {
		return err
	}
	return l.f.Sync()
}

// close flushes and closes the file.
func (l *eventLog) close() error {
	err := l.flush()
	l.file.Lock()
	defer l.file.Unlock()
	if l.f == nil {
		return err
	}
	if cerr := l.f.Close(); err == nil {
		err = cerr
	}
	l.f = nil
	return err
}
