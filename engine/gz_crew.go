package engine

import (
	"math"
	"runtime"
	"sync"
	"sync/atomic"
)

// This file works one or more GZ curves of a condition at once, their
// spans (gz_span.go) shared out over the cores: the caller, goroutines
// started for it (min(GOMAXPROCS, spans) in all) and a helper started
// earlier, if one is offered (spanHelp), take the spans in a fixed order,
// each on its own copy of the problem (fork: the arc hints carried from
// one evaluation to the next are per problem; they choose only where a
// search starts, never its result). The worker that finishes a curve's
// last span joins the curve (assemble). What each span holds depends only
// on its heels, never on which goroutine worked it or when, so the curves
// are the same whatever the number of cores.

// curveAsk names a curve to work: towards side, sampled every stepDeg.
type curveAsk struct {
	side    Side
	stepDeg float64
}

// spanJob is one span of one curve.
type spanJob struct {
	w *curveWork
	s int
}

// spanPool is the spans of the curves being worked, taken in order by
// whoever works on it.
type spanPool struct {
	jobs  []spanJob
	next  atomic.Int32
	done  sync.WaitGroup // one per job, done when it is worked (and its curve joined if it was the last)
	spare *Problem       // the problem a helper works on
	mu    sync.Mutex
	fault any // the first panic raised by a job
}

// spanHelp offers a spanPool to a goroutine started before it existed
// (Assess starts one with the hand method, so that the core it wakes is
// awake when the spans are ready: waking an idle one can take a fifth of
// a millisecond). The helper works the pool before its own work if the
// pool is there already, else after it if it is there by then; it never
// waits for one. A nil *spanHelp offers nothing.
type spanHelp struct {
	mu    sync.Mutex
	pool  *spanPool
	taken bool // a pool was offered and taken: no more
	gone  bool // the helper is done: no more
}

// offer hands sp to the helper, if it may still take one, and reports
// whether it did.
func (h *spanHelp) offer(sp *spanPool) bool {
	if h == nil {
		return false
	}
	h.mu.Lock()
	defer h.mu.Unlock()
	if h.gone || h.taken || h.pool != nil {
		return false
	}
	h.pool = sp
	return true
}

// take returns the pool offered and not yet taken, or nil; with last, no
// pool can be offered afterwards.
func (h *spanHelp) take(last bool) *spanPool {
	h.mu.Lock()
	defer h.mu.Unlock()
	sp := h.pool
	h.pool = nil
	h.taken = h.taken || sp != nil
	h.gone = h.gone || last
	return sp
}

// alongside works f and the pool offered, if one is: the pool first when
// it is there already (f then fills the time while the other workers
// finish their last spans), else f first and then the pool if it has
// come meanwhile.
func (h *spanHelp) alongside(f func()) {
	if sp := h.take(false); sp != nil {
		sp.work(sp.spare)
	}
	f()
	if sp := h.take(true); sp != nil {
		sp.work(sp.spare)
	}
}

// work takes jobs until none is left.
func (sp *spanPool) work(p *Problem) {
	for {
		i := int(sp.next.Add(1)) - 1
		if i >= len(sp.jobs) {
			return
		}
		sp.do(p, sp.jobs[i])
	}
}

// do works job j on p and, when it is its curve's last span, joins the
// curve. A panic is kept to be raised by wait, on the caller's goroutine.
func (sp *spanPool) do(p *Problem, j spanJob) {
	defer sp.done.Done()
	defer func() {
		if r := recover(); r != nil {
			sp.mu.Lock()
			if sp.fault == nil {
				sp.fault = r
			}
			sp.mu.Unlock()
		}
	}()
	s := &j.w.spans[j.s]
	if int64(s.k0) > j.w.need.Load() {
		s.cut = true
	} else {
		p.workSpan(j.w, s)
	}
	if j.w.left.Add(-1) == 0 {
		j.w.c, j.w.sol, j.w.err = p.assemble(j.w)
	}
}

// wait waits until every job is worked, then raises again a panic one
// raised.
func (sp *spanPool) wait() {
	sp.done.Wait()
	if sp.fault != nil {
		panic(sp.fault)
	}
}

// leverCurves works the curves asked for, from eq, each split into spans
// at the heels spanStarts gives for its step, and returns them in the
// order asked (see spanOrder). A pool offered to help is worked by it as
// well.
func (pr *Problem) leverCurves(eq Position, asks []curveAsk, help *spanHelp) []*curveWork {
	return pr.leverCurvesFrom(eq, asks, pr.spanStarts, help)
}

// leverCurvesFrom is leverCurves with the spans' first heels given by
// starts.
func (pr *Problem) leverCurvesFrom(eq Position, asks []curveAsk, starts func(stepDeg float64) []float64, help *spanHelp) []*curveWork {
	// Heel 0 starts from her own draft and trim: the draft on the
	// centreline changes little as she comes upright; so does every span's
	// first heel.
	start := eq.Plane
	if math.IsNaN(start.A+start.B) || start.A == 0 && start.B == 0 {
		start = pr.upright()
	}
	ws := make([]*curveWork, len(asks))
	for i, a := range asks {
		ws[i] = newCurveWork(a.side, eq, a.stepDeg, start, starts(a.stepDeg))
	}
	sp := &spanPool{jobs: spanOrder(ws)}
	sp.done.Add(len(sp.jobs))
	n := min(runtime.GOMAXPROCS(0), len(sp.jobs)) - 1 // others than the caller
	if n > 0 && help != nil {
		sp.spare = pr.fork()
		if help.offer(sp) {
			n--
		}
	}
	var others beside
	for range n {
		f := pr.fork()
		others.run(func() { sp.work(f) })
	}
	sp.work(pr)
	sp.wait()
	others.wait()
	return ws
}

// spanOrder returns the spans of the curves ws in the order they are
// taken: the curves' in the order asked, each curve's from its first heel
// up. The asker puts a curve worked in one long span first (the other
// side's near upright), so that the short spans are left for the end,
// while the other cores finish; and a span taken after the one that finds
// where the curve ends is then skipped.
func spanOrder(ws []*curveWork) []spanJob {
	var jobs []spanJob
	for _, w := range ws {
		for s := range w.spans {
			jobs = append(jobs, spanJob{w, s})
		}
	}
	return jobs
}
