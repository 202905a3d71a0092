package tui

import (
	"math"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// pictureModel is the dashboard on vessel v at w × h with the damage
// state that set gives (indices found by name), computed to the end.
func pictureModel(t testing.TB, v *engine.Vessel, info *vessels.Info, w, h int, set func(d engine.Damage, at func(string) int)) model {
	t.Helper()
	m := newModel(v, info, Options{Palette: "day"})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	m = drive(t, m, nil, m.Init())
	d := cloneDamage(m.damage)
	set(d, func(name string) int {
		i := m.v.CompartmentIndex(name)
		if i < 0 {
			t.Fatalf("no compartment %q in %s", name, m.v.Name)
		}
		return i
	})
	mm, cmd := m.commit(d, "test state")
	m = drive(t, mm.(model), nil, cmd)
	if m.cur == nil || m.cur.Position == nil {
		t.Fatalf("%s: no floating position for the test state", m.v.Name)
	}
	return m
}

// TestBoxPicturesUnchanged draws the section and the profile with each
// box compartment selected in turn, on the three bundled ships, with one
// space open to the sea and one holding water, against goldens written
// before compartments given by outlines were drawn by their own shape: a
// box must look exactly as it did.
func TestBoxPicturesUnchanged(t *testing.T) {
	for _, tc := range []struct {
		vessel, open, held string
		heldM3             float64
	}{
		{"barge", "2 wing void S", "DB ballast fwd", 60},
		{"ferry", "Wing void S", "Crew quarters", 80},
		{"freighter", "Wing tank 2 S", "DB 1 P", 40},
	} {
		t.Run(tc.vessel, func(t *testing.T) {
			v, info, err := vessels.Open(tc.vessel)
			if err != nil {
				t.Fatal(err)
			}
			m := pictureModel(t, v, info, 120, 40, func(d engine.Damage, at func(string) int) {
				d[at(tc.open)].Open = true
				d[at(tc.held)].WaterM3 = tc.heldM3
			})
			var out []string
			for i, c := range m.v.Compartments {
				if c.Sections != nil {
					continue
				}
				m.sel = i
				out = append(out, "== "+c.Name)
				out = append(out, m.sectionView(56, 16)...)
				out = append(out, m.profileView(56, 16)...)
			}
			checkGolden(t, "box_pictures_"+tc.vessel, strings.Join(out, "\n")+"\n")
		})
	}
}

// cellCorners returns the world corners of cell (cx, cy) of c.
func cellCorners(c *canvas, cx, cy int) [4][2]float64 {
	xa := c.x0 + float64(cx)/float64(c.w)*(c.x1-c.x0)
	xb := c.x0 + float64(cx+1)/float64(c.w)*(c.x1-c.x0)
	ya := c.y1 - float64(cy)/float64(c.h)*(c.y1-c.y0)
	yb := c.y1 - float64(cy+1)/float64(c.h)*(c.y1-c.y0)
	return [4][2]float64{{xa, ya}, {xb, ya}, {xb, yb}, {xa, yb}}
}

// edgeDist returns the signed distances of (y, z) from the lines of the
// edges of the convex polygon o, positive inwards.
func edgeDist(o [][2]float64, y, z float64) []float64 {
	var area float64
	for k := range o {
		a, b := o[k], o[(k+1)%len(o)]
		area += a[0]*b[1] - b[0]*a[1]
	}
	d := make([]float64, len(o))
	for k := range o {
		a, b := o[k], o[(k+1)%len(o)]
		ey, ez := b[0]-a[0], b[1]-a[1]
		d[k] = (ey*(z-a[1]) - ez*(y-a[0])) / math.Hypot(ey, ez)
		if area < 0 {
			d[k] = -d[k]
		}
	}
	return d
}

// cellWhere says where a cell lies against a convex polygon and its box
// (y0..y1 × z0..z1): wholly inside the polygon by at least margin, or
// wholly inside the box and beyond one of the polygon's edges by at least
// margin (so wholly outside it), or neither.
func cellWhere(c *canvas, cx, cy int, poly [][2]float64, y0, y1, z0, z1, margin float64) (inPoly, boxOnly bool) {
	cs := cellCorners(c, cx, cy)
	inPoly, inBox := true, true
	beyond := make([]bool, len(poly))
	for k := range beyond {
		beyond[k] = true
	}
	for _, p := range cs {
		for k, d := range edgeDist(poly, p[0], p[1]) {
			inPoly = inPoly && d >= margin
			beyond[k] = beyond[k] && d <= -margin
		}
		inBox = inBox && p[0] >= y0 && p[0] <= y1 && p[1] >= z0 && p[1] <= z1
	}
	out := false
	for _, b := range beyond {
		out = out || b
	}
	return inPoly, inBox && out
}

// cellOf returns the cell of c that holds world point (x, y).
func cellOf(c *canvas, x, y float64) (int, int) { return c.cellX(x), c.cellY(y) }

// selectedNear reports whether a cell of the column of world u, between
// world v0 and v1, carries dots in the selection's ink.
func selectedNear(c *canvas, u, v0, v1 float64) bool {
	cx := c.cellX(u)
	for cy := c.cellY(v1); cy <= c.cellY(v0); cy++ {
		if i := cy*c.w + cx; cx >= 0 && cx < c.w && cy >= 0 && cy < c.h && c.dots[i] != 0 && c.dink[i] == inkSpace {
			return true
		}
	}
	return false
}

// hopperS is the outline of Hopper 2 S in the bundled freighter's file
// (y, z in metres), a right triangle in the lower starboard corner of
// hold 2 from x = 23 to 48 m, wholly inside the hull there.
var hopperS = [][2]float64{{3.7, 1.2}, {5.7, 1.2}, {5.7, 3.2}}

// TestHopperSectionByOutline draws the freighter's section at its
// starboard hopper tank, selected, first open to the sea and then holding
// water under the heeled surface of a flooded wing tank beside it, and
// reads the canvas cell by cell against the triangle of the vessel file:
// inside it the tank's water is shaded; in the part of its box that the
// triangle leaves out (the hold above the slope) neither its shade nor
// its selection outline appears.
func TestHopperSectionByOutline(t *testing.T) {
	v, info, err := vessels.Open("freighter")
	if err != nil {
		t.Fatal(err)
	}
	ci := v.CompartmentIndex("Hopper 2 S")
	if ci < 0 {
		t.Fatal("no Hopper 2 S in the freighter")
	}
	secs := v.Compartments[ci].Sections
	if len(secs) != 2 || len(secs[0].Outline) != 3 {
		t.Fatalf("Hopper 2 S is no longer the triangular prism this test reads: %+v", secs)
	}
	for _, q := range secs[0].Outline {
		found := false
		for _, h := range hopperS {
			found = found || (q.Y == h[0] && q.Z == h[1])
		}
		if !found {
			t.Fatalf("Hopper 2 S's outline %v is not the triangle %v this test reads", secs[0].Outline, hopperS)
		}
	}
	const by0, by1, bz0, bz1 = 3.7, 5.7, 1.2, 3.2 // its box
	for _, tc := range []struct {
		name string
		set  func(d engine.Damage, at func(string) int)
	}{
		{"open", func(d engine.Damage, at func(string) int) { d[at("Hopper 2 S")].Open = true }},
		{"holding water, heeled", func(d engine.Damage, at func(string) int) {
			d[at("Wing tank 2 S")].Open = true
			d[at("Hopper 2 S")].WaterM3 = 35
		}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			m := pictureModel(t, v, info, 120, 40, tc.set)
			m.sel = ci
			x := m.sectionX()
			if x < 23 || x > 48 {
				t.Fatalf("section at %v m, not through the hopper tank", x)
			}
			c := m.sectionCanvas(x, 190, 76)
			pos := m.cur.Position
			surface := pos.Plane
			if !m.openNow(ci) {
				found := false
				for _, h := range pos.Held {
					if h.Index == ci {
						surface, found = h.Surface, true
					}
				}
				if !found {
					t.Fatalf("the position holds no water in the hopper tank: %+v", pos.Held)
				}
				if math.Abs(pos.HeelDeg) < 1 {
					t.Fatalf("heel %.2f°: the case wants a heeled surface", pos.HeelDeg)
				}
			}
			nWet, nDry, nOut := readCells(t, c, hopperS, [4]float64{by0, by1, bz0, bz1}, 0,
				func(y float64) float64 { return surface.Z(x, y) })
			if nWet < 10 || nOut < 10 {
				t.Fatalf("too few cells to judge: %d wholly inside the triangle and under water, %d in the box only", nWet, nOut)
			}
			if !m.openNow(ci) && nDry < 3 {
				t.Errorf("only %d dry cells inside the tank above its water: the case should leave some", nDry)
			}
			// The selection outline runs along the slope, through its middle.
			sx, sy := cellOf(c, 4.7, 2.2)
			if i := sy*c.w + sx; c.dink[i] != inkSpace {
				t.Errorf("the slope's middle (4.7, 2.2) m is not drawn as the selected tank's outline (ink %d)", c.dink[i])
			}
		})
	}
}

// readCells reads canvas c cell by cell against the compartment the
// selected one should be, poly (convex, in the picture's world
// coordinates) within its box (u0, u1, v0, v1), with its water below
// v = wl(u) (the sea or the surface of the water it holds): a cell wholly
// inside poly and under the water is shaded, one wholly inside and above
// it is not, and one in the box but wholly outside poly is neither shaded
// nor drawn in the selection's ink. It returns how many cells of each
// kind it read.
func readCells(t *testing.T, c *canvas, poly [][2]float64, box [4]float64, margin float64, wl func(u float64) float64) (nWet, nDry, nOut int) {
	t.Helper()
	for cy := 0; cy < c.h; cy++ {
		for cx := 0; cx < c.w; cx++ {
			inPoly, boxOnly := cellWhere(c, cx, cy, poly, box[0], box[1], box[2], box[3], margin)
			i := cy*c.w + cx
			shaded := c.fill[i] == floodShade
			switch {
			case inPoly:
				below, above := true, true
				for _, p := range cellCorners(c, cx, cy) {
					w := wl(p[0])
					below = below && p[1] < w
					above = above && p[1] > w
				}
				if below {
					nWet++
					if !shaded {
						t.Errorf("cell (%d, %d) inside the compartment and under its water is not shaded", cx, cy)
					}
				}
				if above {
					nDry++
					if shaded {
						t.Errorf("cell (%d, %d) inside the compartment above its water is shaded", cx, cy)
					}
				}
			case boxOnly:
				nOut++
				if shaded {
					t.Errorf("cell (%d, %d) in the compartment's box but outside its outline is shaded", cx, cy)
				}
				if c.dots[i] != 0 && c.dink[i] == inkSpace {
					t.Errorf("cell (%d, %d) in the compartment's box but outside its outline carries the selection outline", cx, cy)
				}
			}
		}
	}
	return nWet, nDry, nOut
}

// rakedPeakBarge is the bundled barge with its fore peak given by
// outlines instead of a box: full section at its aft bulkhead (x = 74 m),
// its bottom rising to 3 m and narrowing to 8 m across at the bow
// (x = 80 m), as a raked peak would. Its box is the old one.
func rakedPeakBarge(t *testing.T) (*engine.Vessel, *vessels.Info) {
	t.Helper()
	src, ok := vessels.Source("barge")
	if !ok {
		t.Fatal("no bundled barge")
	}
	const box = `name = "Fore peak void"
use = "void"
group = "peaks"
x = [74.0, 80.0]
y = [-8.0, 8.0]
z = [0.0, 8.0]
`
	const outlines = `name = "Fore peak void"
use = "void"
group = "peaks"
[[compartment.section]]
x = 74.0
outline = [[-8.0, 0.0], [8.0, 0.0], [8.0, 8.0], [-8.0, 8.0]]
[[compartment.section]]
x = 80.0
outline = [[-4.0, 3.0], [4.0, 3.0], [8.0, 8.0], [-8.0, 8.0]]
`
	if strings.Count(string(src), box) != 1 {
		t.Fatal("the barge's fore peak is no longer the box this test replaces")
	}
	v, info, err := vessels.Parse("raked-peak barge", []byte(strings.Replace(string(src), box, outlines, 1)))
	if err != nil {
		t.Fatal(err)
	}
	return v, info
}

// TestRakedPeakByOutline draws the barge's raked fore peak (rakedPeakBarge)
// open to the sea and selected. In the section at its middle (x = 77 m)
// its outline is halfway between its two stations: bottom 1.5 m, bottom
// corners 6 m out; in the profile its bottom rises from 0 at x = 74 m to
// 3 m at x = 80 m. In both, the part of its box below the rising bottom
// (and in the section outside its sloping sides) shows neither water nor
// the selection outline, and the water inside is shaded to the sea. The
// engine takes the part between two different outlines as prisms of the
// outline midway along steps of 0.25 m (engine.NewSectionCompartment), so
// its section at x may stand up to 0.125 m of travel from the straight
// interpolation: a margin of 0.1 m in y and z covers that (the bottom
// moves 0.0625 m and the corners 0.083 m in 0.125 m).
func TestRakedPeakByOutline(t *testing.T) {
	v, info := rakedPeakBarge(t)
	ci := v.CompartmentIndex("Fore peak void")
	m := pictureModel(t, v, info, 120, 40, func(d engine.Damage, at func(string) int) { d[at("Fore peak void")].Open = true })
	m.sel = ci
	p := m.cur.Position.Plane
	const margin = 0.1

	t.Run("section", func(t *testing.T) {
		x := m.sectionX()
		if math.Abs(x-77) > 1e-9 {
			t.Fatalf("section at %v m, want the peak's middle, 77 m", x)
		}
		mid := [][2]float64{{-6, 1.5}, {6, 1.5}, {8, 8}, {-8, 8}}
		c := m.sectionCanvas(x, 190, 76)
		nWet, nDry, nOut := readCells(t, c, mid, [4]float64{-8, 8, 0, 8}, margin,
			func(y float64) float64 { return p.Z(x, y) })
		if nWet < 20 || nDry < 20 || nOut < 20 {
			t.Fatalf("too few cells to judge: %d under water, %d above, %d in the box only", nWet, nDry, nOut)
		}
		if !selectedNear(c, 0, 1.5-margin, 1.5+margin) {
			t.Errorf("the peak's bottom at (0, 1.5) m is not drawn as the selected compartment's outline")
		}
	})
	t.Run("profile", func(t *testing.T) {
		// Seen from the side, x along and z up: bottom from (74, 0) to (80, 3).
		side := [][2]float64{{74, 0}, {80, 3}, {80, 8}, {74, 8}}
		c := m.profileCanvas(190, 60)
		// The profile's rule: the water at the middle of the section's
		// breadth, here the centreline.
		nWet, nDry, nOut := readCells(t, c, side, [4]float64{74, 80, 0, 8}, margin,
			func(x float64) float64 { return p.Z(x, 0) })
		if nWet < 10 || nDry < 10 || nOut < 10 {
			t.Fatalf("too few cells to judge: %d under water, %d above, %d in the box only", nWet, nDry, nOut)
		}
		if !selectedNear(c, 77, 1.5-margin, 1.5+margin) {
			t.Errorf("the peak's rising bottom at (77, 1.5) m is not drawn as the selected compartment's outline")
		}
	})
}

// TestPictureCacheFollowsOutlineSelection: the pictures stay cached while
// nothing they show changes, and selecting a compartment given by
// outlines draws them again with it.
func TestPictureCacheFollowsOutlineSelection(t *testing.T) {
	v, info, err := vessels.Open("freighter")
	if err != nil {
		t.Fatal(err)
	}
	m := pictureModel(t, v, info, 120, 40, func(d engine.Damage, at func(string) int) { d[at("Hopper 2 S")].Open = true })
	for _, kind := range []int{picSection, picProfile} {
		draws := 0
		draw := func(w, h int) []string {
			draws++
			if kind == picSection {
				return m.sectionView(w, h)
			}
			return m.profileView(w, h)
		}
		m.sel = m.v.CompartmentIndex("DB 2 S")
		box := strings.Join(m.cached(kind, 60, 16, draw), "\n")
		_ = m.cached(kind, 60, 16, draw)
		if draws != 1 {
			t.Errorf("picture %d drawn %d times for two views of one state, want 1", kind, draws)
		}
		m.sel = m.v.CompartmentIndex("Hopper 2 S")
		hop := strings.Join(m.cached(kind, 60, 16, draw), "\n")
		if draws != 2 {
			t.Errorf("picture %d drawn %d times after selecting the hopper tank, want 2", kind, draws)
		}
		if hop == box {
			t.Errorf("picture %d unchanged after selecting the hopper tank:\n%s", kind, hop)
		}
		if kind == picSection && !strings.Contains(hop, "Hopper 2 S") {
			t.Errorf("the section's title does not name the selected hopper tank:\n%s", hop)
		}
	}
}

// BenchmarkProfileOutlined measures one drawing of the profile (uncached)
// with the freighter's hold 2, given by outlines, open and selected: the
// profile samples the engine's section of it at every dot across its
// length.
func BenchmarkProfileOutlined(b *testing.B) {
	v, info, err := vessels.Open("freighter")
	if err != nil {
		b.Fatal(err)
	}
	m := pictureModel(b, v, info, 120, 40, func(d engine.Damage, at func(string) int) { d[at("Hold 2")].Open = true })
	m.sel = m.v.CompartmentIndex("Hold 2")
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		_ = m.profileView(38, 14)
	}
}
