package engine_test

import (
	"reflect"
	"runtime"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels/largeship"
)

// TestSpansLargeShip: on the large generated ship (vessels/largeship, an
// invented vessel) with the benchmark's two compartments open, lying
// within 1° of upright, the curve towards her side is worked in spans
// (one evaluation is costly) and is the curve worked from one end to the
// other, to the solver's tolerance (same heels, GZ within 1e-9 m, the
// same angles of vanishing stability, deck edge and downflooding); so is
// the other side's, every 3°.
func TestSpansLargeShip(t *testing.T) {
	v, d := largeDamaged(t, largeship.Standard)
	pos, err := engine.Solve(v, d)
	if err != nil {
		t.Fatal(err)
	}
	split, whole, spans, err := engine.CurvesSplitAndWhole(v, d, pos)
	if err != nil {
		t.Fatal(err)
	}
	if spans < 2 {
		t.Fatalf("her curve is worked in %d span(s): not split", spans)
	}
	if !whole[0].Vanishes || whole[0].VanishingDeg <= 60 {
		t.Fatalf("the case vanishes at %v° (%v): not beyond 60° as the test expects", whole[0].VanishingDeg, whole[0].Vanishes)
	}
	for i := range split {
		if why := engine.SameCurve(split[i], whole[i]); why != "" {
			t.Errorf("towards %v every %v°: %s", whole[i].Toward, whole[i].HeelDeg[1], why)
		}
	}
}

// TestSpansLargeShipAnyCores: Assess gives the same curves, bit for bit,
// on one core and on two, for the large generated ship (an invented
// vessel) damaged as in the benchmark (near upright: both sides) and
// intact.
func TestSpansLargeShipAnyCores(t *testing.T) {
	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(0))
	v, d := largeDamaged(t, largeship.Standard)
	for _, dd := range []engine.Damage{d, v.Intact()} {
		var got [2]*engine.GZCurve
		for i, procs := range []int{1, 2} {
			runtime.GOMAXPROCS(procs)
			a := engine.Assess(v, dd)
			if a.GZ == nil {
				t.Fatalf("no curve: %v %v", a.NoEq, a.Notes)
			}
			got[i] = a.GZ
		}
		if !reflect.DeepEqual(got[0], got[1]) {
			t.Errorf("damaged %v: the curves worked on one core differ from those on two", engine.IsDamaged(dd))
		}
	}
}
