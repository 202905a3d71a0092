package engine

import "testing"

// TestBesideRaisesOnCaller: a panic in work run beside the caller is
// raised again by wait on the caller's goroutine, where the screen and the
// command line recover it, once all the work has returned.
func TestBesideRaisesOnCaller(t *testing.T) {
	var b beside
	done := make(chan bool, 1)
	b.run(func() { panic("engine: test fault") })
	b.run(func() { done <- true })
	defer func() {
		if r := recover(); r != "engine: test fault" {
			t.Errorf("wait raised %v, want the work's panic", r)
		}
		select {
		case <-done:
		default:
			t.Error("wait returned before all the work had")
		}
	}()
	b.wait()
	t.Error("wait did not raise the work's panic")
}
