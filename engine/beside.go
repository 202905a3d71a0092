package engine

import "sync"

// This file runs work on goroutines of their own beside the caller's, so
// that a keystroke uses more than one core, without letting a fault in
// that work escape the caller: the screen and the command line recover a
// panic in the engine on the caller's goroutine (tui/newest.go,
// cmd/heelwatch/guard.go), never on another.

// beside is work started on goroutines of their own. The zero value is
// ready to use; it must not be copied once used.
type beside struct {
	wg    sync.WaitGroup
	mu    sync.Mutex
	fault any // the first panic raised by the work, nil if none
}

// run starts f on a goroutine of its own.
func (b *beside) run(f func()) {
	b.wg.Go(func() {
		defer func() {
			if r := recover(); r != nil {
				b.mu.Lock()
				if b.fault == nil {
					b.fault = r
				}
				b.mu.Unlock()
			}
		}()
		f()
	})
}

// wait waits for all the work started to return, then raises again, on
// the caller's goroutine, the first panic it raised.
func (b *beside) wait() {
	b.wg.Wait()
	if b.fault != nil {
		panic(b.fault)
	}
}
