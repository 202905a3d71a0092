// Package largeship writes the vessel file of a large generated ship, the
// size of a hull exported from a design program, for the benchmarks and
// tests of speed and of many offsets per station. The ship is invented: her
// lines come from a small formula, her compartments are boxes in a regular
// pattern, and none of her figures describe a real vessel.
package largeship

import (
	"fmt"
	"math"
	"strings"
)

// Ship's main dimensions (m): between perpendiculars, moulded breadth and
// depth.
const (
	LengthM  = 180.0
	BreadthM = 28.0
	DepthM   = 16.0
)

// Spec sets the size of the generated file.
type Spec struct {
	Stations int // stations from x = 0 to LengthM, at least 2
	Offsets  int // offsets per station (the starboard half, keel to deck), at least 3
	Bays     int // bays of compartments amidships; each holds five (two double bottoms, two wing tanks, a hold)
}

// Standard is the size the speed goal is set on: 160 stations, 60 offsets
// each and 200 compartments.
var Standard = Spec{Stations: 160, Offsets: 60, Bays: 40}

// OpenSpaces are the two compartments the benchmarks open to the sea: the
// starboard wing tank and the hold of the bay nearest amidships.
func (s Spec) OpenSpaces() []string {
	b := s.Bays/2 + 1
	return []string{fmt.Sprintf("Wing %d S", b), fmt.Sprintf("Hold %d", b)}
}

// halfBreadth returns the half-breadth at height z of the station at x: a
// full, nearly box-shaped section amidships (a parallel middle body over
// the middle 30 % of the length), growing finer towards the ends. y rises
// from 0 at the keel as hd·(1 − (1 − z/D)^k).
func halfBreadth(x, z float64) float64 {
	xi := math.Abs(x-LengthM/2) / (LengthM / 2)
	f := 1.0
	if xi > 0.3 {
		u := (xi - 0.3) / 0.7
		f = math.Max(0.04, 1-u*u)
	}
	hd := BreadthM / 2 * (0.35 + 0.65*f)
	k := 2 + 10*f
	return hd * (1 - math.Pow(1-z/DepthM, k))
}

// TOML returns the vessel file.
func TOML(s Spec) []byte {
	if s.Stations < 2 || s.Offsets < 3 || s.Bays < 1 {
		panic("largeship: a spec needs 2 stations, 3 offsets and 1 bay at least")
	}
	var b strings.Builder
	p := func(format string, args ...any) { fmt.Fprintf(&b, format, args...) }
	p("# An invented large ship generated for heelwatch's benchmarks: not a real vessel.\n")
	p("format = 1\nname = \"Generated %d x %d\"\ncriteria = [\"is-code-2008\"]\n\n", s.Stations, s.Offsets)
	p("[hull]\nshape = \"sections\"\nlength = %g\n\n", LengthM)
	for i := 0; i < s.Stations; i++ {
		x := LengthM * float64(i) / float64(s.Stations-1)
		p("[[hull.section]]\nx = %.6g\noffsets = [", x)
		for j := 0; j < s.Offsets; j++ {
			u := float64(j) / float64(s.Offsets-1)
			z := DepthM * u * math.Sqrt(u)
			if j > 0 {
				p(", ")
			}
			p("[%.6g, %.6g]", halfBreadth(x, z), z)
		}
		p("]\n\n")
	}
	// The displacement at a draft of 0.6 D (trapezoidal in z and x), less
	// the ballast carried, is the ship's weight; KG 0.6 D.
	T := 0.6 * DepthM
	var vol float64
	const nz, nx = 200, 400
	for i := 0; i <= nx; i++ {
		x := LengthM * float64(i) / nx
		var a float64
		for j := 0; j < nz; j++ {
			z0, z1 := T*float64(j)/nz, T*float64(j+1)/nz
			a += (halfBreadth(x, z0) + halfBreadth(x, z1)) * (z1 - z0)
		}
		w := 1.0
		if i == 0 || i == nx {
			w = 0.5
		}
		vol += w * a * LengthM / nx
	}
	x0, x1 := 0.15*LengthM, 0.85*LengthM
	bay := (x1 - x0) / float64(s.Bays)
	const dbTop, wingY = 1.5, 9.0
	ballast := 0.0
	for k := 1; k <= s.Bays; k++ {
		if k%2 == 0 {
			ballast += 1.025 * 0.5 * 2 * bay * wingY * dbTop
		}
	}
	mass := 1.025*vol - ballast
	p("[[weight]]\nname = \"Lightship and cargo\"\nmass = %.1f\nlcg = %g\ntcg = 0.0\nvcg = %g\n\n", mass, LengthM/2, 0.6*DepthM)
	for k := 1; k <= s.Bays; k++ {
		xa, xb := x0+bay*float64(k-1), x0+bay*float64(k)
		box := func(name, use string, y0, y1, z0, z1 float64, extra string) {
			p("[[compartment]]\nname = %q\nuse = %q\nx = [%.6g, %.6g]\ny = [%g, %g]\nz = [%g, %g]\n%s\n", name, use, xa, xb, y0, y1, z0, z1, extra)
		}
		fill := "liquid = \"sea water ballast\"\nliquid_density = 1.025\nfill = 0.0\n"
		if k%2 == 0 {
			fill = "liquid = \"sea water ballast\"\nliquid_density = 1.025\nfill = 0.5\n"
		}
		box(fmt.Sprintf("DB %d P", k), "tank", -BreadthM/2, 0, 0, dbTop, fill)
		box(fmt.Sprintf("DB %d S", k), "tank", 0, BreadthM/2, 0, dbTop, fill)
		box(fmt.Sprintf("Wing %d P", k), "void", -BreadthM/2, -wingY, dbTop, DepthM, "")
		box(fmt.Sprintf("Wing %d S", k), "void", wingY, BreadthM/2, dbTop, DepthM, "")
		box(fmt.Sprintf("Hold %d", k), "dry cargo", -wingY, wingY, dbTop, DepthM, "")
	}
	p("[[opening]]\nname = \"Hold vent S\"\nx = %g\ny = %g\nz = %g\n", LengthM/2, BreadthM/2-1, DepthM+1.5)
	return []byte(b.String())
}
