package engine

import (
	"math"
	"runtime"
	"sync/atomic"
)

// This file works one or more GZ curves of a condition at once, their
// spans (gz_span.go) shared out over the cores: min(GOMAXPROCS, spans)
// goroutines, the caller's among them, take the spans in a fixed order,
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

// leverCurves works the curves asked for, from eq, each split into spans
// at the heels spanStarts gives for its step, and returns them in the
// order asked (see spanOrder).
func (pr *Problem) leverCurves(eq Position, asks []curveAsk) []*curveWork {
	return pr.leverCurvesFrom(eq, asks, pr.spanStarts)
}

// leverCurvesFrom is leverCurves with the spans' first heels given by
// starts.
func (pr *Problem) leverCurvesFrom(eq Position, asks []curveAsk, starts func(stepDeg float64) []float64) []*curveWork {
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
	jobs := spanOrder(ws)
	var next atomic.Int32
	work := func(p *Problem) {
		for {
			i := int(next.Add(1)) - 1
			if i >= len(jobs) {
				return
			}
			j := jobs[i]
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
	}
	n := min(runtime.GOMAXPROCS(0), len(jobs))
	var others beside
	for range n - 1 {
		f := pr.fork()
		others.run(func() { work(f) })
	}
	// A fault in another worker is raised here once all have stopped (a
	// faulty span is never joined, so neither is its curve).
	defer others.wait()
	work(pr)
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
