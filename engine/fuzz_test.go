package engine_test

// FuzzSolve feeds random barges, loads and flooding to Solve: it must never
// panic, never return NaN or an infinity in a Position it calls solved, and
// stop within its iteration bounds.

import (
	"encoding/binary"
	"errors"
	"math"
	"math/rand"
	"reflect"
	"testing"

	"heelwatch/engine"
)

// refCheckFinite reports every NaN or infinite float in pos, walking its
// fields (slices and nested structs included).
func refCheckFinite(t testing.TB, name string, pos engine.Position) {
	t.Helper()
	var walk func(path string, v reflect.Value)
	walk = func(path string, v reflect.Value) {
		switch v.Kind() {
		case reflect.Float64:
			f := v.Float()
			if path == "Position.GMUprightM" && math.IsNaN(f) {
				// Documented: NaN when she cannot be solved upright (she
				// floats heeled but founders brought upright); shown as
				// "—" and written null.
				return
			}
			if math.IsNaN(f) || math.IsInf(f, 0) {
				t.Errorf("%s: %s = %v", name, path, f)
			}
		case reflect.Struct:
			for i := 0; i < v.NumField(); i++ {
				if v.Type().Field(i).IsExported() {
					walk(path+"."+v.Type().Field(i).Name, v.Field(i))
				}
			}
		case reflect.Slice:
			for i := 0; i < v.Len(); i++ {
				walk(path+"[]", v.Index(i))
			}
		}
	}
	walk("Position", reflect.ValueOf(pos))
}

// refFuzzReader turns the fuzzer's bytes into numbers in given ranges;
// past the end of the data it gives the low end of each range.
type refFuzzReader struct{ b []byte }

func (r *refFuzzReader) frac() float64 {
	if len(r.b) < 2 {
		r.b = nil
		return 0
	}
	u := binary.LittleEndian.Uint16(r.b)
	r.b = r.b[2:]
	return float64(u) / 65535
}

func (r *refFuzzReader) in(lo, hi float64) float64 { return lo + (hi-lo)*r.frac() }

func (r *refFuzzReader) byte() byte {
	if len(r.b) == 0 {
		return 0
	}
	c := r.b[0]
	r.b = r.b[1:]
	return c
}

// maxSolveIterations is the most Newton steps Equilibrium reports (its
// documented bound of 60 per solve).
const maxSolveIterations = 60

func FuzzSolve(f *testing.F) {
	f.Add([]byte{})
	f.Add([]byte("barge with two wing tanks open"))
	f.Add([]byte{0xff, 0xff, 0x00, 0x80, 0x40, 0x40, 0x10, 0x20, 0x90, 0xa0, 0x03, 0xff, 0xee, 0x01, 0x02, 0x03, 0x04, 0x05, 0x06, 0x07, 0x08, 0x09, 0x0a, 0x0b, 0x0c, 0x0d, 0x0e, 0x0f})
	f.Add([]byte{0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0x05, 0x80, 0x80, 0x80, 0x80, 0x80, 0x80})
	f.Fuzz(func(t *testing.T, data []byte) { refFuzzSolveOnce(t, data) })
}

// refFuzzSolveOnce runs one fuzzed case and says how it ended: "hull",
// "vessel" (rejected as bad input), an Outcome's name, or "floats".
func refFuzzSolveOnce(t *testing.T, data []byte) string {
	{
		r := &refFuzzReader{data}
		L, B, D := r.in(1, 300), r.in(0.5, 60), r.in(0.3, 40)
		h, err := engine.NewBoxHull(L, B, D)
		if err != nil {
			t.Fatalf("box %g×%g×%g: %v", L, B, D, err)
		}
		full := engine.SeaWaterDensity * L * B * D
		var ws []engine.Weight
		for n := int(r.byte()%4) + 1; n > 0; n-- {
			m := r.in(0, 0.6) * full / 2
			ws = append(ws, engine.Weight{
				Name:  "w",
				MassT: m,
				LCGM:  r.in(0, 1) * L,
				TCGM:  r.in(-0.25, 0.25) * B,
				VCGM:  r.in(-0.1, 1.3) * D,
				FSMTm: r.in(0, 1) * m * B / 20,
			})
		}
		var comps []*engine.Compartment
		var dmg engine.Damage
		for n := int(r.byte() % 5); n > 0; n-- {
			x0, x1 := r.in(-0.1, 1.1)*L, r.in(-0.1, 1.1)*L
			y0, y1 := r.in(-0.7, 0.7)*B, r.in(-0.7, 0.7)*B
			z0, z1 := r.in(-0.2, 1.2)*D, r.in(-0.2, 1.2)*D
			box := engine.Box{X0: math.Min(x0, x1), X1: math.Max(x0, x1), Y0: math.Min(y0, y1), Y1: math.Max(y0, y1), Z0: math.Min(z0, z1), Z1: math.Max(z0, z1)}
			c, err := engine.NewCompartment(h, "space", box)
			if err != nil {
				continue // a box outside the hull or of no size: an error, as it should be
			}
			c.Permeability = r.in(0.01, 1)
			if mode := r.byte(); mode%3 == 0 {
				c.Liquid = &engine.Liquid{Name: "liquid", Density: r.in(0.7, 1.9), Fill: r.in(0, 1)}
			}
			comps = append(comps, c)
			st := engine.SpaceState{}
			switch r.byte() % 4 {
			case 1:
				st.Open = true
			case 2:
				st.WaterM3 = r.in(0, 1.1) * c.Volume()
			}
			if r.byte()%2 == 0 {
				st.Permeability = r.in(0, 1)
			}
			dmg = append(dmg, st)
		}
		v, err := engine.NewVessel(engine.Vessel{Name: "fuzzed barge", Hull: h, Weights: ws, Compartments: comps})
		if err != nil {
			return "vessel" // e.g. no mass at all: an error, as it should be
		}
		pos, err := engine.Solve(v, dmg)
		if err != nil {
			var ne *engine.NoEquilibrium
			if !errors.As(err, &ne) {
				t.Fatalf("error %v is not a *NoEquilibrium", err)
			}
			if ne.Outcome < engine.Sinks || ne.Outcome > engine.NotConverged {
				t.Fatalf("outcome %d unknown", ne.Outcome)
			}
			return ne.Outcome.String()
		}
		refCheckFinite(t, "solved", pos)
		if pos.Iterations < 0 || pos.Iterations > maxSolveIterations {
			t.Fatalf("iterations %d outside [0, %d]", pos.Iterations, maxSolveIterations)
		}
		if math.Abs(pos.HeelDeg) > 90 {
			t.Fatalf("heel %g° beyond 90°", pos.HeelDeg)
		}
		return "floats"
	}
}

// TestFuzzSolveMix runs the fuzz body on seeded random bytes and checks
// that the cases reach every ending, so that the fuzzer's inputs do test
// the solver and not only the input checks.
func TestFuzzSolveMix(t *testing.T) {
	rng := rand.New(rand.NewSource(29))
	count := map[string]int{}
	for i := 0; i < 200; i++ {
		data := make([]byte, 16+rng.Intn(80))
		rng.Read(data)
		count[refFuzzSolveOnce(t, data)]++
	}
	t.Logf("200 random cases: %v", count)
	for _, k := range []string{"floats", "sinks", "capsizes"} {
		if count[k] == 0 {
			t.Errorf("no case ended %q: %v", k, count)
		}
	}
}
