package vessels

import (
	"runtime"
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels/largeship"
)

// withProcs runs f with GOMAXPROCS set to n, restoring it after.
func withProcs(n int, f func()) {
	old := runtime.GOMAXPROCS(n)
	defer runtime.GOMAXPROCS(old)
	f()
}

// TestCompartmentProblemsInFileOrder: two compartments written as inline
// tables on one line, the first wholly outside the shell (found only when
// its solid is built), the second with a use heelwatch does not know
// (found when it is read). The problems must come out as if each
// compartment were read and built before the next is read: the first's,
// then the second's, on one core or several.
func TestCompartmentProblemsInFileOrder(t *testing.T) {
	src := `format = 1
name = "Order"
compartment = [{name = "Corner void", use = "void", x = [0.0, 3.0], y = [4.0, 5.0], z = [0.0, 0.5]}, {name = "Store", use = "storez", x = [10.0, 12.0], y = [-1.0, 1.0], z = [1.0, 2.0]}]

[hull]
shape = "sections"
length = 30.0

[[hull.section]]
x = 0.0
offsets = [[0.0, 2.0], [1.0, 4.0]]

[[hull.section]]
x = 30.0
offsets = [[0.0, 0.0], [4.0, 0.0], [5.0, 1.0], [5.0, 4.0]]

[[weight]]
name = "Lightship"
mass = 300.0
lcg = 15.0
vcg = 2.0
`
	for _, procs := range []int{1, 2, 4} {
		withProcs(procs, func() {
			_, _, err := Parse("order.toml", []byte(src))
			ps, ok := err.(Problems)
			if !ok || len(ps) != 2 {
				t.Fatalf("GOMAXPROCS %d: want two problems, got %v\n%s", procs, err, src)
			}
			if ps[0].Line != ps[1].Line {
				t.Fatalf("GOMAXPROCS %d: the two problems should share a line: %v", procs, ps)
			}
			if ps[0].Key != "compartment[1]" || !strings.Contains(ps[0].Msg, "holds no part of the hull") {
				t.Errorf("GOMAXPROCS %d: first problem %v, want compartment[1] holding no part of the hull", procs, ps[0])
			}
			if ps[1].Key != "compartment[2].use" || !strings.Contains(ps[1].Msg, `"storez" is not one of`) {
				t.Errorf("GOMAXPROCS %d: second problem %v, want compartment[2].use unknown", procs, ps[1])
			}
		})
	}
}

// TestCompartmentsConcurrentSameAsSerial reads a generated ship with 30
// compartments on one core and on four: every compartment's solid must
// be the same to the bit (the same clip, whichever goroutine ran it) and
// in file order.
func TestCompartmentsConcurrentSameAsSerial(t *testing.T) {
	src := largeship.TOML(largeship.Spec{Stations: 30, Offsets: 12, Bays: 6})
	var serial, concurrent *engine.Vessel
	withProcs(1, func() {
		var err error
		if serial, _, err = Parse("serial.toml", src); err != nil {
			t.Fatal(err)
		}
	})
	withProcs(4, func() {
		var err error
		if concurrent, _, err = Parse("concurrent.toml", src); err != nil {
			t.Fatal(err)
		}
	})
	if len(serial.Compartments) != 30 || len(concurrent.Compartments) != 30 {
		t.Fatalf("compartments: %d serial, %d concurrent, want 30", len(serial.Compartments), len(concurrent.Compartments))
	}
	p := engine.Plane{A: 6, B: 0.002, C: 0.15}
	for i, a := range serial.Compartments {
		b := concurrent.Compartments[i]
		if a.Name != b.Name {
			t.Fatalf("compartment %d: %q serial, %q concurrent", i+1, a.Name, b.Name)
		}
		if a.Solid().Whole() != b.Solid().Whole() || a.Solid().Below(p) != b.Solid().Below(p) {
			t.Errorf("compartment %q: solids differ: %+v and %+v", a.Name, a.Solid().Whole(), b.Solid().Whole())
		}
	}
}
