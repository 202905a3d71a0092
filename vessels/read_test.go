package vessels

import (
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"strings"
	"testing"

	"heelwatch/engine"
)

// boxBarge returns the text of a box barge with one weight.
func boxBarge(L, B, D, mass, lcg, kg float64, rho string, extra string) string {
	dens := ""
	if rho != "" {
		dens = "water_density = " + rho + "\n"
	}
	return fmt.Sprintf(`format = 1
name = "Closed-form barge"
%s
[hull]
shape = "box"
length = %v
breadth = %v
depth = %v

[[weight]]
name = "All"
mass = %v
lcg = %v
vcg = %v
%s`, dens, L, B, D, mass, lcg, kg, extra)
}

// TestBoxRoundTrip writes box barges of random size and load to text,
// reads them back and solves them. For a box floating level the closed
// forms hold exactly (references.md, practice): Δ = ρ·L·B·T, KB = T/2,
// BM_T = B²/(12 T), BM_L = L²/(12 T), GM = KB + BM − KG.
func TestBoxRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 7))
	for i := 0; i < 20; i++ {
		L := 20 + 100*rng.Float64()
		B := 5 + 20*rng.Float64()
		D := 3 + 9*rng.Float64()
		T := D * (0.2 + 0.6*rng.Float64())
		rho, rhoText := 1.025, ""
		if i%2 == 1 {
			rho, rhoText = 1.000, "1.000"
		}
		kb, bm := T/2, B*B/(12*T)
		kg := (kb + bm) * (0.3 + 0.5*rng.Float64())
		mass := rho * L * B * T
		src := boxBarge(L, B, D, mass, L/2, kg, rhoText, "")
		v, info, err := Parse(fmt.Sprintf("barge%d.toml", i), []byte(src))
		if err != nil {
			t.Fatalf("case %d: %v\n%s", i, err, src)
		}
		if info.Shape != "box" || !v.Hull.Box || v.WaterDensity != rho {
			t.Fatalf("case %d: shape %q box %v rho %v", i, info.Shape, v.Hull.Box, v.WaterDensity)
		}
		pos, err := engine.Solve(v, v.Intact())
		if err != nil {
			t.Fatalf("case %d: %v", i, err)
		}
		const tol = 1e-9
		for _, c := range []struct {
			what      string
			got, want float64
		}{
			{"displacement ρLBT", pos.DisplacementT, mass},
			{"volume LBT", pos.VolumeM3, L * B * T},
			{"draft aft", pos.DraftAftM, T},
			{"draft amidships", pos.DraftMidM, T},
			{"draft forward", pos.DraftFwdM, T},
			{"KB = T/2", pos.VCBM, kb},
			{"BMT = B²/12T", pos.BMTM, bm},
			{"BML = L²/12T", pos.BMLM, L * L / (12 * T)},
			{"GM = KB + BM − KG", pos.GMM, kb + bm - kg},
		} {
			if math.Abs(c.got-c.want) > tol*math.Max(1, math.Abs(c.want)) {
				t.Errorf("case %d (L %.2f B %.2f T %.3f ρ %.3f): %s = %.12g, want %.12g", i, L, B, T, rho, c.what, c.got, c.want)
			}
		}
	}
}

// TestSectionsEqualBox reads a "sections" hull whose stations are all the
// same rectangle: it must float exactly as the box of those dimensions
// (closed form Δ = ρ·L·B·T, practice), and its breadth and depth follow
// from the sections.
func TestSectionsEqualBox(t *testing.T) {
	src := `format = 1
name = "Rectangles"
[hull]
shape = "sections"
length = 50.0
breadth = 12.0   # agrees with the sections: accepted
[[hull.section]]
x = 0.0
offsets = [[6.0, 0.0], [6.0, 6.0]]
[[hull.section]]
x = 25.0
offsets = [[0.0, 0.0], [6.0, 0.0], [6.0, 6.0]]
[[hull.section]]
x = 50.0
offsets = [[6.0, 0.0], [6.0, 6.0]]
[[weight]]
name = "All"
mass = 1845.0
lcg = 25.0
vcg = 3.0
`
	v, _, err := Parse("rect.toml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if v.Hull.BreadthM != 12 || v.Hull.DepthM != 6 {
		t.Errorf("breadth %v depth %v, want 12 and 6 from the sections", v.Hull.BreadthM, v.Hull.DepthM)
	}
	pos, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	T := 1845.0 / (1.025 * 50 * 12) // = 3.0 m
	if math.Abs(pos.DraftMidM-T) > 1e-9 || math.Abs(pos.TrimM) > 1e-9 {
		t.Errorf("draft %.12g trim %.3g, want %.12g level", pos.DraftMidM, pos.TrimM, T)
	}
}

// TestDefaultPermeability checks the permeability each use gives when the
// file has none: SOLAS II-1 Reg. 7-3 as tabled in references.md (stores,
// accommodation, machinery, void, liquids: found, 46 CFR 172.240; dry
// cargo and containers: memory); vehicles (ro-ro spaces) 0.90 from the same
// regulation (memory). An explicit permeability overrides it.
func TestDefaultPermeability(t *testing.T) {
	cases := []struct {
		use  string
		mu   float64
		give string // an explicit permeability, "" for none
	}{
		{"stores", 0.60, ""},
		{"accommodation", 0.95, ""},
		{"machinery", 0.85, ""},
		{"void", 0.95, ""},
		{"tank", 0.95, ""},
		{"dry cargo", 0.70, ""},
		{"containers", 0.70, ""},
		{"vehicles", 0.90, ""},
		{"dry cargo", 0.80, "0.80"},
		{"void", 1.0, "1"},
	}
	var b strings.Builder
	for i, c := range cases {
		fmt.Fprintf(&b, "\n[[compartment]]\nname = \"C%d\"\nuse = %q\nx = [%d, %d]\ny = [-5, 5]\nz = [0, 5]\n", i, c.use, 2*i, 2*i+2)
		if c.give != "" {
			fmt.Fprintf(&b, "permeability = %s\n", c.give)
		}
	}
	v, info, err := Parse("uses.toml", []byte(boxBarge(40, 10, 5, 600, 20, 2.5, "", b.String())))
	if err != nil {
		t.Fatal(err)
	}
	for i, c := range cases {
		comp, ci := v.Compartments[i], info.Compartments[i]
		if comp.Permeability != c.mu || comp.Use != c.use || ci.Use != c.use {
			t.Errorf("%s: μ %v use %q, want %v", c.use, comp.Permeability, comp.Use, c.mu)
		}
		if ci.DefaultPermeabilityFromUse != (c.give == "") {
			t.Errorf("%s (given %q): DefaultPermeabilityFromUse = %v", c.use, c.give, ci.DefaultPermeabilityFromUse)
		}
		if mu, ok := UsePermeability(c.use); !ok || (c.give == "" && mu != c.mu) {
			t.Errorf("UsePermeability(%q) = %v, %v", c.use, mu, ok)
		}
	}
}

// TestTankContents reads a box tank 15 × 10 × 1 m (permeability 0.95, the
// default for a tank: capacity 0.95 × 150 m³, conventions) in a box barge,
// given by volume and by fraction of the capacity: mass = ρ·volume, the
// liquid standing at the fill's share of the depth with its centre half way
// up, and its free-surface moment μ·ρ·l·b³/12 of the rectangular surface
// (closed forms, practice).
func TestTankContents(t *testing.T) {
	for _, c := range []struct {
		fill string
		frac float64
	}{
		{"fill_m3 = 71.25", 0.5},
		{"fill = 0.25", 0.25},
		{"fill = 1.0", 1.0}, // pressed full: no free surface
		{"fill = 0", 0},
	} {
		tank := fmt.Sprintf(`
[[compartment]]
name = "DB tank"
use = "tank"
x = [5.0, 20.0]
y = [-5.0, 5.0]
z = [0.0, 1.0]
liquid = "fresh water"
liquid_density = 1.0
%s
`, c.fill)
		v, info, err := Parse("tank.toml", []byte(boxBarge(40, 10, 5, 600, 20, 2.5, "", tank)))
		if err != nil {
			t.Fatalf("%s: %v", c.fill, err)
		}
		l := v.Compartments[0].Liquid
		if l == nil || l.Name != "fresh water" || math.Abs(l.Fill-c.frac) > 1e-12 {
			t.Fatalf("%s: liquid %+v, want fill %v", c.fill, l, c.frac)
		}
		if info.Compartments[0].Group != "tanks" {
			t.Errorf("default group of a tank = %q, want \"tanks\"", info.Compartments[0].Group)
		}
		m, x, _, z, fsm := v.TankContents(0)
		vol := 0.95 * 150 * c.frac
		wantFSM := 0.95 * 15.0 * 1000 / 12
		if c.frac == 0 || c.frac >= engine.PressedFullFill {
			wantFSM = 0
		}
		if math.Abs(m-vol) > 1e-9 || math.Abs(fsm-wantFSM) > 1e-9 {
			t.Errorf("%s: mass %.9g fsm %.9g, want %.9g and %.9g", c.fill, m, fsm, vol, wantFSM)
		}
		if vol > 0 && (math.Abs(x-12.5) > 1e-9 || math.Abs(z-c.frac/2) > 1e-9) {
			t.Errorf("%s: centre x %.9g z %.9g, want 12.5 and %.9g", c.fill, x, z, c.frac/2)
		}
	}
}

// TestHoleAndPump reads the flooding-over-time keys.
func TestHoleAndPump(t *testing.T) {
	src := boxBarge(40, 10, 5, 600, 20, 2.5, "", `
[[compartment]]
name = "Wing S"
use = "void"
group = "wing voids"
x = [10.0, 20.0]
y = [3.0, 5.0]
z = [0.0, 5.0]
pump_m3h = 90
[compartment.hole]
area = 0.2
z = 1.0

[[compartment]]
name = "Wing P"
use = "void"
x = [10.0, 20.0]
y = [-5.0, -3.0]
z = [0.0, 5.0]
hole = { area = 0.05, x = 12.0, y = -5.0, z = 0.5, cd = 0.7 }
`)
	v, info, err := Parse("hole.toml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if len(info.Compartments) != 2 || len(v.Compartments) != 2 {
		t.Fatalf("%d infos", len(info.Compartments))
	}
	s, p := info.Compartments[0], info.Compartments[1]
	if s.Group != "wing voids" || s.PumpM3h != 90 || s.Hole == nil || *s.Hole != (engine.Hole{AreaM2: 0.2, XM: 15, YM: 4, ZM: 1, Cd: DefaultCd}) {
		t.Errorf("Wing S: %+v hole %+v", s, s.Hole)
	}
	if p.Group != "voids" || p.PumpM3h != 0 || p.Hole == nil || *p.Hole != (engine.Hole{AreaM2: 0.05, XM: 12, YM: -5, ZM: 0.5, Cd: 0.7}) {
		t.Errorf("Wing P: %+v hole %+v", p, p.Hole)
	}
}

// TestTopLevelKeys reads the keys beyond the hull and the load.
func TestTopLevelKeys(t *testing.T) {
	src := strings.Replace(boxBarge(40, 10, 5, 600, 20, 2.5, "1.010", `
[[opening]]
name = "Door"
kind = "door"
x = 5
y = 2
z = 6
closed_weathertight = true

[[opening]]
name = "Pipe"
x = 30
y = -4
z = 5.8
`), `name = "Closed-form barge"`, `name = "Closed-form barge"
about = """
First line.
Second line."""
condition = "Ballast"
ship_type = "passenger"
criteria = ["marpol-i-28", "solas-s-factor"]
margin_line_depth = 0.1`, 1)
	v, info, err := Parse("top.toml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if info.Description != "First line.\nSecond line." || info.Condition != "Ballast" || info.ShipType != "passenger" || info.File != "top.toml" {
		t.Errorf("info %+v", info)
	}
	if strings.Join(v.CriteriaSets, ",") != "marpol-i-28,solas-s-factor" || v.MarginLineM != 0.1 || v.WaterDensity != 1.010 {
		t.Errorf("criteria %v margin %v rho %v", v.CriteriaSets, v.MarginLineM, v.WaterDensity)
	}
	want := []engine.Opening{{Name: "Door", Kind: "door", X: 5, Y: 2, Z: 6, Weathertight: true}, {Name: "Pipe", Kind: "other", X: 30, Y: -4, Z: 5.8}}
	for i, o := range want {
		if v.Openings[i] != o {
			t.Errorf("opening %d = %+v, want %+v", i, v.Openings[i], o)
		}
	}
	// Defaults: criteria, margin line, ship type.
	v, info, err = Parse("defaults.toml", []byte(boxBarge(40, 10, 5, 600, 20, 2.5, "", "")))
	if err != nil {
		t.Fatal(err)
	}
	if strings.Join(v.CriteriaSets, ",") != "is-code-2008" || v.MarginLineM != engine.MarginLineDepthM || info.ShipType != "cargo" || v.WaterDensity != engine.SeaWaterDensity {
		t.Errorf("defaults: criteria %v margin %v type %q rho %v", v.CriteriaSets, v.MarginLineM, info.ShipType, v.WaterDensity)
	}
}

// TestHeavyIsNotALoadError: a vessel heavier than all her buoyancy loads;
// solving says she sinks.
func TestHeavyIsNotALoadError(t *testing.T) {
	v, _, err := Parse("heavy.toml", []byte(boxBarge(40, 10, 5, 1e5, 20, 2.5, "", "")))
	if err != nil {
		t.Fatal(err)
	}
	_, err = engine.Solve(v, v.Intact())
	ne, ok := err.(*engine.NoEquilibrium)
	if !ok || ne.Outcome != engine.Sinks {
		t.Errorf("Solve = %v, want sinks", err)
	}
}

func TestLineIndex(t *testing.T) {
	src := `# comment [not] a = table
format = 1
about = """
x = 5
[hull]
"""
'quoted key' = 'a # not a comment'
dotted.key = 3

[hull]
shape = "box"   # [[weight]]
arr = [
  1,   # one
  [2, 3],
  { a = 1, b = [4,
    5] },
]

[[compartment]]
name = "A"
[compartment.hole]
area = 1

[[compartment]]
name = "B"
hole = { area = 2,
  z = 3 }
`
	ix := indexLines(src)
	for _, c := range []struct {
		path string
		line int
	}{
		{"format", 2},
		{"about", 3},
		{"quoted key", 7},
		{"dotted.key", 8},
		{"hull", 10},
		{"hull.shape", 11},
		{"hull.arr", 12},
		{"hull.arr[1]", 13},
		{"hull.arr[2]", 14},
		{"hull.arr[2][2]", 14},
		{"hull.arr[3].b[2]", 16},
		{"compartment", 19},
		{"compartment[1].name", 20},
		{"compartment[1].hole.area", 22},
		{"compartment[2]", 24},
		{"compartment[2].hole.z", 27},
		{"compartment[2].volume", 24}, // absent: its table
		{"weight", 0},
	} {
		if got := ix.line(c.path); got != c.line {
			t.Errorf("line(%q) = %d, want %d", c.path, got, c.line)
		}
	}
}

func TestClosest(t *testing.T) {
	keys := []string{"permeability", "pump_m3h", "name"}
	for _, c := range []struct{ in, want string }{
		{"permability", "permeability"},
		{"nme", "name"},
		{"colour", ""},
	} {
		if got := closest(c.in, keys); got != c.want {
			t.Errorf("closest(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}

func ExampleParse() {
	src := `format = 1
name = "Scow"

[hull]
shape = "box"
length = 30.0
breadth = -8.0
depth = 3.0

[[weight]]
name = "Lightship"
mass = 200.0
lcg = 15.0
vcg = 1.5
permability = 0.9
`
	_, _, err := Parse("scow.toml", []byte(src))
	fmt.Println(err)
	// Output:
	// scow.toml:7: hull.breadth: -8 must be above zero (m, moulded)
	// scow.toml:15: weight[1].permability: unknown key; the keys allowed in weight[1] are fsm, lcg, mass, name, tcg, vcg, x
}

// TestFormatExample reads the example of FORMAT.md, so that the page and
// the reader cannot drift apart.
func TestFormatExample(t *testing.T) {
	page, err := os.ReadFile("FORMAT.md")
	if err != nil {
		t.Fatal(err)
	}
	s := string(page)
	start := strings.Index(s, "An invented 40 m box pontoon")
	open := strings.Index(s[start:], "```toml\n")
	if start < 0 || open < 0 {
		t.Fatal("FORMAT.md has no pontoon example")
	}
	body := s[start+open+len("```toml\n"):]
	body = body[:strings.Index(body, "```")]
	v, info, err := Parse("FORMAT.md example", []byte(body))
	if err != nil {
		t.Fatal(err)
	}
	if v.Name != "Pontoon P-40" || len(v.Compartments) != 2 || len(v.Openings) != 2 || info.Compartments[1].Hole == nil {
		t.Errorf("example read as %q with %d compartments, %d openings", v.Name, len(v.Compartments), len(v.Openings))
	}
	// Box pontoon: Δ = 320 t + 0.5 × 0.95 × 32 × 10 × 0.8 m³ of sea water
	// (half the capacity μ × volume, μ = 0.95 for a tank), and the draft
	// ρLBT closed form (practice).
	pos, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	mass := 320 + 0.5*0.95*32*10*0.8*1.025
	if T := mass / (1.025 * 40 * 10); math.Abs(pos.DraftMidM-T) > 1e-9 {
		t.Errorf("draft amidships %.12g, want %.12g", pos.DraftMidM, T)
	}
}
