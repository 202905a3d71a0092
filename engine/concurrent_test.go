package engine_test

import (
	"reflect"
	"sync"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestAssessConcurrent: the dashboard runs each keystroke's Assess in its
// own goroutine, so several may run at once on one vessel. They must not
// disturb one another: each gives exactly what it gives alone, position,
// GZ curve, criteria and flags, over several rounds. (With the race
// detector, `CGO_ENABLED=1 go test -race ./engine`, any shared write shows
// itself too; CI builds without cgo.)
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
	for round := 0; round < 3; round++ {
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
			if !reflect.DeepEqual(want[k], got[k]) {
				t.Errorf("round %d, case %d: the assessment made beside others differs from the one made alone", round, k)
			}
		}
	}
}
