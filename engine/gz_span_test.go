package engine

import (
	"fmt"
	"math"
	"reflect"
	"runtime"
	"testing"
)

// spanBox returns an invented box barge 60 × 12 × 6 m at a level draft T
// with G at (lcg, tcg, kg), intact, and the problem solved for where she
// lies.
func spanBox(t *testing.T, T, lcg, tcg, kg float64) (*Problem, Position) {
	t.Helper()
	h, err := NewBoxHull(60, 12, 6)
	if err != nil {
		t.Fatal(err)
	}
	v, err := NewVessel(Vessel{Name: "box barge (invented)", Hull: h,
		Weights: []Weight{{Name: "all", MassT: 60 * 12 * T * SeaWaterDensity, LCGM: lcg, TCGM: tcg, VCGM: kg}}})
	if err != nil {
		t.Fatal(err)
	}
	pr := NewProblem(v, v.Intact())
	eq, err := pr.Equilibrium()
	if err != nil {
		t.Fatal(err)
	}
	return NewProblem(v, v.Intact()), eq
}

// spansAt returns a span table with starts for the curve sampled every
// gzStepDeg.
func spansAt(starts ...float64) func(float64) []float64 {
	return func(step float64) []float64 {
		if step == gzStepDeg {
			return starts
		}
		return []float64{0}
	}
}

// sameCurve reports how split differs from whole, the same curve worked
// in one span: "" when they have the same heels (the angle of vanishing
// stability among them to 1e-6°), GZ within 1e-9 m at every heel, the
// same angles of vanishing stability, deck edge and downflooding (to
// 1e-6°), the same downflooding opening, note and 0° plane (to 1e-9 m).
// The spans' first heels start cold, so their levers may differ from the
// warm ones in the last digits of the solver's own tolerance.
func sameCurve(split, whole *GZCurve) string {
	if len(split.HeelDeg) != len(whole.HeelDeg) {
		return fmt.Sprintf("%d samples, want %d (ends %v°, want %v°)", len(split.HeelDeg), len(whole.HeelDeg), split.HeelDeg[len(split.HeelDeg)-1], whole.HeelDeg[len(whole.HeelDeg)-1])
	}
	for i := range whole.HeelDeg {
		if d := math.Abs(split.HeelDeg[i] - whole.HeelDeg[i]); d > 1e-6 {
			return fmt.Sprintf("sample %d at %v°, want %v°", i, split.HeelDeg[i], whole.HeelDeg[i])
		}
		if d := math.Abs(split.GZM[i] - whole.GZM[i]); !(d <= 1e-9) {
			return fmt.Sprintf("GZ at %v° %.12f m, want %.12f (off %.2g m)", whole.HeelDeg[i], split.GZM[i], whole.GZM[i], d)
		}
	}
	for _, a := range []struct {
		what      string
		got, want float64
	}{
		{"angle of vanishing stability", split.VanishingDeg, whole.VanishingDeg},
		{"deck-edge angle", split.DeckEdgeDeg, whole.DeckEdgeDeg},
		{"downflooding angle", split.DownfloodingDeg, whole.DownfloodingDeg},
		{"GZ max angle", split.GZMaxDeg, whole.GZMaxDeg},
		{"equilibrium", split.EquilibriumDeg, whole.EquilibriumDeg},
		{"range", split.RangeDeg, whole.RangeDeg},
	} {
		if !(math.Abs(a.got-a.want) <= 1e-6) {
			return fmt.Sprintf("%s %.9f°, want %.9f°", a.what, a.got, a.want)
		}
	}
	if !(math.Abs(split.GZMaxM-whole.GZMaxM) <= 1e-9) {
		return fmt.Sprintf("GZ max %.12f m, want %.12f", split.GZMaxM, whole.GZMaxM)
	}
	if split.Vanishes != whole.Vanishes || split.Downflooding != whole.Downflooding || split.Note != whole.Note || split.Toward != whole.Toward {
		return fmt.Sprintf("vanishes %v, opening %q, note %q, side %v; want %v, %q, %q, %v",
			split.Vanishes, split.Downflooding, split.Note, split.Toward, whole.Vanishes, whole.Downflooding, whole.Note, whole.Toward)
	}
	if split.hasUpright != whole.hasUpright || math.Abs(split.upright.A-whole.upright.A) > 1e-9 || math.Abs(split.upright.B-whole.upright.B) > 1e-12 {
		return fmt.Sprintf("0° plane %+v, want %+v", split.upright, whole.upright)
	}
	return ""
}

// splitAndWhole works pr's curve towards side from eq in the spans
// starts gives and in one span.
func splitAndWhole(t *testing.T, pr *Problem, eq Position, side Side, starts func(float64) []float64) (split, whole *curveWork) {
	t.Helper()
	split = pr.leverCurvesFrom(eq, []curveAsk{{side, gzStepDeg}}, starts, nil)[0]
	whole = pr.leverCurvesFrom(eq, []curveAsk{{side, gzStepDeg}}, wholeStarts, nil)[0]
	if split.err != nil || whole.err != nil {
		t.Fatalf("split: %v; whole: %v", split.err, whole.err)
	}
	if len(split.spans) < 2 {
		t.Fatalf("%d span(s): the curve was not split", len(split.spans))
	}
	return split, whole
}

// TestSpansVanishBefore60: a box barge (invented) with G high lies at 5.5°
// and her curve vanishes at 48.4°, inside a span, and so ends at 60°: the
// curve worked in the spans of gzSpanStartsDeg is the curve worked from
// one end to the other, and, on one core, the span beyond 60° is not
// worked (on more it may be started before the span that finds where the
// curve ends says so).
func TestSpansVanishBefore60(t *testing.T) {
	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(1))
	pr, eq := spanBox(t, 3, 30, 0.05, 5.0)
	split, whole := splitAndWhole(t, pr, eq, Starboard, spansAt(gzSpanStartsDeg...))
	if !whole.c.Vanishes || !(whole.c.VanishingDeg > 41 && whole.c.VanishingDeg < 59) {
		t.Fatalf("the case vanishes at %v° (%v), not inside the span from 40°", whole.c.VanishingDeg, whole.c.Vanishes)
	}
	if why := sameCurve(split.c, whole.c); why != "" {
		t.Error(why)
	}
	if last := split.spans[len(split.spans)-1]; len(last.heels) > 0 || !last.cut {
		t.Errorf("the span from %v° was worked (%d samples) though the curve ends at 60°", sampleHeel(last.k0, gzStepDeg), len(last.heels))
	}
}

// TestSpansVanishAcrossStart: boxes (invented) whose GZ falls through zero
// between the last heel of one span and the first of the next, so that
// the angle of vanishing stability is refined when the spans are joined:
// G at 5.5 m, vanishing at 39.9° across the span start at 40° of
// gzSpanStartsDeg; and others with a span made to start just after where
// each vanishes.
func TestSpansVanishAcrossStart(t *testing.T) {
	for _, c := range []struct {
		kg, tcg float64
		starts  []float64 // nil: from the whole curve's angle of vanishing stability
	}{
		{5.5, 0.05, gzSpanStartsDeg},
		{5.0, 0.05, nil},
		{4.6, 0.05, nil},
		{4.6, -0.02, nil},
	} {
		pr, eq := spanBox(t, 3, 30, c.tcg, c.kg)
		side := Starboard
		if eq.HeelDeg < 0 {
			side = Port
		}
		whole := pr.leverCurvesFrom(eq, []curveAsk{{side, gzStepDeg}}, wholeStarts, nil)[0]
		if whole.err != nil || !whole.c.Vanishes {
			t.Fatalf("KG %v: %v, vanishes %v", c.kg, whole.err, whole.c.Vanishes)
		}
		vd := whole.c.VanishingDeg
		starts := c.starts
		if starts == nil {
			starts = []float64{0, 20, math.Ceil(vd)}
		}
		split, _ := splitAndWhole(t, pr, eq, side, spansAt(starts...))
		across := false
		for _, s := range split.spans[1:] {
			across = across || sampleHeel(s.k0, gzStepDeg) == math.Ceil(vd)
		}
		if !across {
			t.Fatalf("KG %v: vanishing at %v° is not across a span's start %v", c.kg, vd, starts)
		}
		if why := sameCurve(split.c, whole.c); why != "" {
			t.Errorf("KG %v, TCG %v (vanishing %.4f°, spans from %v): %s", c.kg, c.tcg, vd, starts, why)
		}
	}
}

// TestSpansEndOnFailure: boxes (invented) trimmed far by the stern (G 9
// to 10 m from the aft end of 60) for which no draft and trim is found
// beyond some heel (the stern goes under): the curve worked in spans ends
// where the whole one does, with the same note, whether the failing heel
// is inside a span or a span's first.
func TestSpansEndOnFailure(t *testing.T) {
	for _, c := range []struct{ T, lcg, kg float64 }{
		{1.5, 9, 4},    // fails at 37°
		{1.75, 10, 4},  // fails at 29°
		{1.5, 10, 4.5}, // fails at 53°
	} {
		pr, eq := spanBox(t, c.T, c.lcg, 0.01, c.kg)
		whole := pr.leverCurvesFrom(eq, []curveAsk{{Starboard, gzStepDeg}}, wholeStarts, nil)[0]
		if whole.err != nil || whole.c.Note == "" {
			t.Fatalf("%+v: %v; the curve does not end on a failure (note %q)", c, whole.err, whole.c.Note)
		}
		fail := whole.c.HeelDeg[len(whole.c.HeelDeg)-1] + 1
		for _, starts := range [][]float64{gzSpanStartsDeg, {0, 20, fail - 3, fail}, {0, fail - 1}} {
			split, _ := splitAndWhole(t, pr, eq, Starboard, spansAt(starts...))
			if why := sameCurve(split.c, whole.c); why != "" {
				t.Errorf("%+v, spans from %v: %s", c, starts, why)
			}
		}
	}
}

// TestSpansSameOnAnyCores: the curves are the same, bit for bit, worked
// on one core or on two, for a box barge (invented) split as a large ship
// is, near upright (both sides, the other side's curve beside) and
// upright with G off the centreline's mirror (both sides at 1°).
func TestSpansSameOnAnyCores(t *testing.T) {
	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(0))
	for _, tcg := range []float64{0.05, 0} {
		pr, eq := spanBox(t, 3, 30, tcg, 4.6)
		asks := []curveAsk{{Port, otherSideStepDeg}, {Starboard, gzStepDeg}}
		if tcg == 0 {
			asks = []curveAsk{{Starboard, gzStepDeg}, {Port, gzStepDeg}}
		}
		var got [2][]*GZCurve
		for i, procs := range []int{1, 2} {
			runtime.GOMAXPROCS(procs)
			for _, w := range pr.leverCurvesFrom(eq, asks, spansAt(gzSpanStartsDeg...), nil) {
				if w.err != nil {
					t.Fatal(w.err)
				}
				got[i] = append(got[i], w.c)
			}
		}
		if !reflect.DeepEqual(got[0], got[1]) {
			t.Errorf("TCG %v: the curves worked on one core differ from those on two", tcg)
		}
	}
}
