package engine_test

import (
	"sync"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestAssessConcurrent: the dashboard runs each keystroke's Assess in its
// own goroutine, so several may run at once on one vessel. They must not
// disturb one another: each gives what it gives alone (run with -race to
// see any shared write).
func TestAssessConcurrent(t *testing.T) {
	v, _, err := vessels.Open(vessels.Default)
	if err != nil {
		t.Fatal(err)
	}
	cases := make([]engine.Damage, 4)
	for k := range cases {
		d := v.Intact()
		d[(3*k+1)%len(d)].Open = true
		cases[k] = d
	}
	want := make([]engine.Assessment, len(cases))
	for k, d := range cases {
		want[k] = engine.Assess(v, d)
	}
	got := make([]engine.Assessment, len(cases))
	var wg sync.WaitGroup
	for k, d := range cases {
		wg.Add(1)
		go func() {
			defer wg.Done()
			got[k] = engine.Assess(v, d)
		}()
	}
	wg.Wait()
	for k := range cases {
		w, g := want[k].Position, got[k].Position
		if (w == nil) != (g == nil) || w != nil && (w.Plane != g.Plane || w.GMM != g.GMM) {
			t.Errorf("case %d: alone %+v, together %+v", k, w, g)
		}
		if len(want[k].Flags) != len(got[k].Flags) {
			t.Errorf("case %d: %d flags alone, %d together", k, len(want[k].Flags), len(got[k].Flags))
		}
	}
}
