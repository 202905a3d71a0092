package engine

// This file says where the spans of a GZ curve (gz_span.go) start. The
// heels are fixed, never chosen by the number of cores, so that a curve
// is the same on any machine.

// gzSpanStartsDeg are the heels at which the spans of a curve sampled
// every gzStepDeg start. Counted on the large generated ship
// (vessels/largeship, BenchmarkRecomputeLargeHull): a span's first heel,
// started cold from her own draft and trim, costs 2 or 3 evaluations
// where a warm one costs 1, so each span adds about 1.5 evaluations to
// the 82 of her curve; spans of about 20 samples (21, 23, 23 and 22
// evaluations) balance two cores both when this curve is worked alone
// and when the other side's, 3° apart (49 evaluations, one span, taken
// first), is worked beside it. The last span starts at 61° so that the
// sample at gzMinEndDeg, where a curve that vanished earlier ends, lies in
// the span before it, and the last is not worked at all.
var gzSpanStartsDeg = []float64{0, 20, 40, 61}

// spanMinVertices is the number of section vertices (the hull's and the
// spaces' open to the sea, over all their slabs) from which one
// evaluation is costly enough for the curve sampled every gzStepDeg to be
// split. The large generated ship has 13 501 and one evaluation takes
// about 20 µs; the bundled freighter (1 084) about 10 µs, a keystroke
// under 1 ms, and her spans' cold starts cost 3 to 7 evaluations each:
// split, her curve would cost a sixth more work on one core.
const spanMinVertices = 4000

// spanStarts returns the heels at which the spans of pr's curve sampled
// every stepDeg start: gzSpanStartsDeg for the curve sampled every
// gzStepDeg when one evaluation is costly (see spanMinVertices), else the
// one span from 0°. A coarser curve (the other side's near upright) is
// one span.
func (pr *Problem) spanStarts(stepDeg float64) []float64 {
	if stepDeg == gzStepDeg && pr.sectionVertices() >= spanMinVertices {
		return gzSpanStartsDeg
	}
	return []float64{0}
}

// sectionVertices returns the number of section vertices over the slabs
// of the hull and of the spaces open to the sea: what one evaluation
// walks.
func (pr *Problem) sectionVertices() int {
	n := solidVertices(pr.v.Hull.solid)
	for _, o := range pr.open {
		n += solidVertices(o.solid)
	}
	return n
}

// solidVertices returns the number of section vertices over s's slabs.
func solidVertices(s *Solid) int {
	if s == nil {
		return 0
	}
	n := 0
	for i := range s.slabs {
		n += len(s.slabs[i].p0)
	}
	return n
}
