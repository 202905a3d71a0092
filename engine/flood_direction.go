package engine

// levelWent says which way the level inside went from the start of the run
// to water volume w: "risen to" or "fallen to" (a tank whose contents stood
// above the sea's level empties down to it).
func (r *FloodRun) levelWent(w float64) string {
	if len(r.evals) > 0 && w < r.evals[0].water {
		return "fallen to"
	}
	return "risen to"
}

// stagePassed reports whether the water goes through volume w on its way
// from the start of the run to end: a stage below the water a holed tank
// started with never happened, nor one beyond where a settled run came to
// rest (the level equal to the sea's, the pumps holding it, nothing coming
// in). A run stopped by its time limit keeps the stages still ahead of it.
func (r *FloodRun) stagePassed(w, end float64) bool {
	if len(r.evals) == 0 {
		return true
	}
	start := r.evals[0].water
	tol := 1e-9 * r.capacity
	if r.end == FloodTimeLimit {
		if end >= start {
			return w >= start-tol
		}
		return w <= start+tol
	}
	lo, hi := min(start, end), max(start, end)
	return w >= lo-tol && w <= hi+tol
}
