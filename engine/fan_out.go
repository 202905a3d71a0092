package engine

import (
	"runtime"
	"sync"
	"sync/atomic"
)

// fanOut calls f(k) for every k in [0, n), on as many goroutines as
// GOMAXPROCS allows (on the caller's alone when that is one, or n is), and
// returns when all calls have. The calls must be independent: each may
// write only what belongs to its own k, so that the result is the same in
// whatever order they run.
func fanOut(n int, f func(k int)) {
	workers := min(runtime.GOMAXPROCS(0), n)
	if workers <= 1 {
		for k := 0; k < n; k++ {
			f(k)
		}
		return
	}
	var next atomic.Int64
	var wg sync.WaitGroup
	for range workers {
		wg.Go(func() {
			for {
				k := int(next.Add(1)) - 1
				if k >= n {
					return
				}
				f(k)
			}
		})
	}
	wg.Wait()
}
