package vessels

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
)

func TestBundledList(t *testing.T) {
	es := Bundled()
	var names []string
	for _, e := range es {
		names = append(names, e.Name)
		if e.Title == "" || e.Summary == "" {
			t.Errorf("%s: empty title or summary: %+v", e.Name, e)
		}
		if !strings.Contains(strings.ToLower(e.Summary), "invented") {
			t.Errorf("%s: summary %q does not say the vessel is invented", e.Name, e.Summary)
		}
		src, ok := Source(e.Name)
		if !ok {
			t.Fatalf("Source(%q) missing", e.Name)
		}
		// The header comment says so too, before any key.
		head := string(src[:strings.Index(string(src), "format =")])
		if !strings.Contains(head, "Invented") && !strings.Contains(head, "invented") {
			t.Errorf("%s: header comment does not say the vessel is invented", e.Name)
		}
	}
	if got, want := strings.Join(names, ","), "barge,ferry,freighter"; got != want {
		t.Errorf("bundled = %s, want %s", got, want)
	}
	if _, ok := Source(Default); !ok {
		t.Errorf("Default %q is not bundled", Default)
	}
	for _, bad := range []string{"", "../go", "bundled/barge", "barge.toml", "nosuch"} {
		if _, ok := Source(bad); ok {
			t.Errorf("Source(%q) found something", bad)
		}
	}
}

func TestOpen(t *testing.T) {
	v, info, err := Open("barge")
	if err != nil {
		t.Fatal(err)
	}
	if info.Bundled != "barge" || info.File != "bundled/barge.toml" || v.Name != "Demo barge" {
		t.Errorf("Open(barge): bundled %q file %q name %q", info.Bundled, info.File, v.Name)
	}
	path := "../testdata/vessels/bad/zero-mass.toml"
	if _, _, err := Open(path); err == nil || !strings.Contains(err.Error(), path+":12:") {
		t.Errorf("Open(%s) = %v, want the file's problem", path, err)
	}
	_, _, err = Open("nosuch")
	if err == nil || !strings.Contains(err.Error(), "barge, ferry, freighter") {
		t.Errorf("Open(nosuch) = %v, want the bundled names listed", err)
	}
	if _, _, err := Open("nosuch.toml"); err == nil || !strings.Contains(err.Error(), "nosuch.toml") {
		t.Errorf("Open(nosuch.toml) = %v, want a file error", err)
	}
}

// design is what a bundled vessel was drawn to do, intact.
type design struct {
	name         string
	compartments int     // at least
	minFreeboard float64 // deck edge clearance at least, m
	maxTrim      float64 // |trim| at most, m
	gmLo, gmHi   float64 // GM range, m
}

var designs = []design{
	// Measured (engine as of this commit): disp 4206.7 t; drafts aft/mid/fwd
	// 3.257/3.206/3.156 m; trim 0.10 m; KMT 8.257; KG 3.248; FSC 2.828;
	// GM 2.18 m; freeboard 4.74 m.
	{"barge", 12, 4.0, 0.5, 1.5, 3.0},
	// Measured: disp 4758.3 t; drafts 5.137/5.075/5.013 m; trim 0.12 m by
	// the stern; KMT 5.604; KG 4.276; FSC 0.073; GM 1.255 m; freeboard 2.52 m.
	{"freighter", 16, 2.0, 0.5, 0.8, 1.5},
	// Measured: disp 3443.6 t; drafts 3.883/3.597/3.312 m; trim 0.57 m by
	// the stern; KMT 8.107; KG 5.189; FSC 0.164; GM 2.75 m; freeboard 2.29 m.
	{"ferry", 16, 2.0, 1.0, 1.5, 3.5},
}

// TestBundledIntact solves each bundled vessel intact and checks that she
// floats as designed: upright (heel < 0.5°), a small trim, drafts a few
// metres below the deck, a realistic GM, and the intact criteria of the
// IMO 2008 IS Code Part A 2.2 (values from references.md, "found
// (secondary text)") on a GZ curve from Problem.AtHeel in 1° steps.
func TestBundledIntact(t *testing.T) {
	for _, d := range designs {
		t.Run(d.name, func(t *testing.T) {
			v, info, err := Open(d.name)
			if err != nil {
				t.Fatal(err)
			}
			if len(v.Compartments) < d.compartments || len(info.Compartments) != len(v.Compartments) {
				t.Fatalf("%d compartments (%d infos), want at least %d", len(v.Compartments), len(info.Compartments), d.compartments)
			}
			pos, err := engine.Solve(v, v.Intact())
			if err != nil {
				t.Fatal(err)
			}
			t.Logf("disp %.1f t, drafts %.3f/%.3f/%.3f m, trim %.3f m, heel %.3f°, KMT %.3f, KG %.3f, FSC %.3f, GM %.3f m, deck edge %.2f m",
				pos.DisplacementT, pos.DraftAftM, pos.DraftMidM, pos.DraftFwdM, pos.TrimM, pos.HeelDeg, pos.KMTM, pos.KGM, pos.FSCM, pos.GMM, pos.DeckEdge.HeightM)
			if math.Abs(pos.HeelDeg) >= 0.5 {
				t.Errorf("heel %.3f°, want upright (< 0.5°)", pos.HeelDeg)
			}
			if math.Abs(pos.TrimM) > d.maxTrim {
				t.Errorf("trim %.3f m, want within ±%.1f m", pos.TrimM, d.maxTrim)
			}
			if pos.DeckEdge.HeightM < d.minFreeboard {
				t.Errorf("least freeboard %.2f m, want at least %.1f m", pos.DeckEdge.HeightM, d.minFreeboard)
			}
			if pos.GMM < d.gmLo || pos.GMM > d.gmHi {
				t.Errorf("GM %.3f m, want %.1f–%.1f m", pos.GMM, d.gmLo, d.gmHi)
			}
			for _, side := range []float64{1, -1} {
				checkISCode(t, v, pos, side)
			}
		})
	}
}

// checkISCode applies IMO 2008 IS Code Part A 2.2 (references.md, found
// (secondary text)) heeling to one side: areas under GZ 0–30° ≥ 0.055,
// 0–40° (or to downflooding) ≥ 0.090, 30–40° (or to downflooding)
// ≥ 0.030 m·rad; GZ ≥ 0.20 m at 30°; angle of maximum GZ ≥ 25°;
// GM0 ≥ 0.15 m. Areas by the trapezoidal rule on 1° steps.
func checkISCode(t *testing.T, v *engine.Vessel, pos engine.Position, side float64) {
	t.Helper()
	pr := engine.NewProblem(v, v.Intact())
	const step = math.Pi / 180
	gz := []float64{0}
	flood := 90.0 // downflooding angle, deg
	guess := pos.Plane
	for deg := 1; deg <= 60; deg++ {
		p, r, err := pr.AtHeel(side*float64(deg)*step, guess)
		if err != nil {
			t.Fatalf("AtHeel(%d°): %v", deg, err)
		}
		guess = p
		gz = append(gz, r)
		for _, o := range v.Openings {
			if !o.Weathertight && flood == 90 && p.Height(o.X, o.Y, o.Z) < 0 {
				flood = float64(deg)
			}
		}
	}
	area := func(a, b float64) float64 { // m·rad, trapezoid on whole degrees
		var s float64
		for k := int(a); k < int(b); k++ {
			s += (gz[k] + gz[k+1]) / 2 * step
		}
		return s
	}
	top := math.Min(40, math.Floor(flood))
	imax := 0
	for k := range gz {
		if gz[k] > gz[imax] {
			imax = k
		}
	}
	for _, c := range []struct {
		what     string
		got, min float64
	}{
		{"area 0–30° (m·rad)", area(0, 30), 0.055},
		{"area 0–40° or to downflooding (m·rad)", area(0, top), 0.090},
		{"area 30–40° or to downflooding (m·rad)", area(30, math.Max(30, top)), 0.030},
		{"GZ at 30° (m)", gz[30], 0.20},
		{"angle of maximum GZ (°)", float64(imax), 25},
		{"GM0 (m)", pos.GMM, 0.15},
	} {
		if !(c.got >= c.min) {
			t.Errorf("heeling %+.0f: %s = %.4f, IS Code 2.2 wants ≥ %.3f", side, c.what, c.got, c.min)
		}
	}
	t.Logf("heeling %+.0f: area 0–30 %.3f, 0–%.0f %.3f, GZ30 %.3f m, max GZ %.3f m at %d°, downflooding %.0f°",
		side, area(0, 30), top, area(0, top), gz[30], gz[imax], imax, flood)
}

// TestBargeClosedForm checks the bundled barge against the closed forms of
// a box: the mean of the drafts (the draft amidships) is Δ/(ρ·L·B) while
// neither deck nor bottom is out of the water, KB is half of it and
// BM = B²/(12 T) (references.md, practice).
func TestBargeClosedForm(t *testing.T) {
	v, _, err := Open("barge")
	if err != nil {
		t.Fatal(err)
	}
	pos, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	// Weights 1100 + 1400 + 1400 t and the aft double bottom tank,
	// 34 × 16 × 1 m, permeability 0.95 (its use's default), at fill 0.55 of
	// its capacity μ × volume (conventions) of sea water at 1.025 t/m³.
	mass := 3900 + 0.95*34*16*1*0.55*1.025
	T := mass / (1.025 * 80 * 16)
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"displacement (t)", pos.DisplacementT, mass},
		{"draft amidships (m)", pos.DraftMidM, T},
		{"mean of drafts aft and forward (m)", (pos.DraftAftM + pos.DraftFwdM) / 2, T},
		{"FSM of the slack tank, μ·ρ·l·b³/12 (t·m)", pos.FSCM * pos.DisplacementT, 0.95 * 1.025 * 34 * 16 * 16 * 16 / 12},
	} {
		if math.Abs(c.got-c.want) > 1e-9*math.Max(1, math.Abs(c.want)) {
			t.Errorf("%s = %.12g, want %.12g", c.what, c.got, c.want)
		}
	}
}

// TestFerryWideHold shows what the ferry is for. Her lower vehicle hold runs
// the full breadth through the waterline: open to the sea it takes away the
// whole breadth of waterplane over 30 m, and the range of positive
// stability left falls below the 20° of MARPOL Annex I Reg. 28.3
// (references.md, found). The freighter's Hold 2, as long but between wing
// tanks, leaves her a range well beyond it.
func TestFerryWideHold(t *testing.T) {
	for _, c := range []struct {
		vessel, open string
		short        bool // range below 20°
	}{
		{"ferry", "Lower vehicle hold", true},
		{"freighter", "Hold 2", false},
	} {
		v, _, err := Open(c.vessel)
		if err != nil {
			t.Fatal(err)
		}
		d := v.Intact()
		for i, comp := range v.Compartments {
			d[i].Open = comp.Name == c.open
		}
		intact, err := engine.Solve(v, v.Intact())
		if err != nil {
			t.Fatal(err)
		}
		pos, err := engine.Solve(v, d)
		if err != nil {
			t.Fatalf("%s with %s open: %v", c.vessel, c.open, err)
		}
		pr := engine.NewProblem(v, d)
		rng, guess := 0.0, pos.Plane
		for deg := 1.0; deg <= 60; deg++ {
			p, gz, err := pr.AtHeel(deg*math.Pi/180, guess)
			if err != nil || gz < 0 {
				break
			}
			rng, guess = deg, p
		}
		t.Logf("%s, %s open: GM %.3f → %.3f m, waterplane %.0f → %.0f m², range %.0f°", c.vessel, c.open, intact.GMM, pos.GMM, intact.WaterplaneAreaM2, pos.WaterplaneAreaM2, rng)
		if (rng < 20) != c.short {
			t.Errorf("%s with %s open: range %.0f°, MARPOL 28.3 wants ≥ 20°; want short = %v", c.vessel, c.open, rng, c.short)
		}
	}
}
