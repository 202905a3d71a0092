package engine

import (
	"fmt"
	"testing"
)

// TestCandidateSets: three boxes in a row along a box barge, the two ends
// joined by a pipe: neighbours touch on a face; the pipe joins the ends
// as a pair; triples are connected.
func TestCandidateSets(t *testing.T) {
	h, err := NewBoxHull(30, 10, 5)
	if err != nil {
		t.Fatal(err)
	}
	var comps []*Compartment
	for i, name := range []string{"A", "B", "C"} {
		c, err := NewCompartment(h, name, Box{X0: 10 * float64(i), X1: 10 * float64(i+1), Y0: -5, Y1: 5, Z0: 0, Z1: 5})
		if err != nil {
			t.Fatal(err)
		}
		comps = append(comps, c)
	}
	v, err := NewVessel(Vessel{Name: "row", Hull: h, Compartments: comps,
		Weights:     []Weight{{Name: "w", MassT: 300, LCGM: 15, VCGM: 2}},
		Connections: []Connection{{Name: "pipe A–C", Kind: "pipe", From: 0, To: 2, AreaM2: 0.01, X: 15, Z: 0.2}}})
	if err != nil {
		t.Fatal(err)
	}
	if nb := Neighbours(v); fmt.Sprint(nb) != "[[1] [0 2] [1]]" {
		t.Errorf("neighbours %v", nb)
	}
	got := map[string]bool{}
	for _, s := range candidateSets(v, []int{0, 1, 2}, DiagnoseOptions{MaxGroup: 3}) {
		got[fmt.Sprint(s)] = true
	}
	for _, want := range []string{"[]", "[0]", "[1]", "[2]", "[0 1]", "[1 2]", "[0 2]", "[0 1 2]"} {
		if !got[want] {
			t.Errorf("candidate %s missing from %v", want, got)
		}
	}
	if len(got) != 8 {
		t.Errorf("%d candidates: %v", len(got), got)
	}
}
