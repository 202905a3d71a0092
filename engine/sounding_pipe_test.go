package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// hopperTank is a hopper-shaped tank in a box hull 80 × 16 × 8 m, x [23,
// 48]: a right triangle in section with its flat bottom y [3.7, 5.7] at
// z = 1.2, its outer wall at y = 5.7 up to z = 3.2 and its top sloping
// from (3.7, 1.2) to (5.7, 3.2). The hull does not cut it.
func hopperTank(t *testing.T) *engine.Compartment {
	t.Helper()
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	o := []engine.Point{{Y: 3.7, Z: 1.2}, {Y: 5.7, Z: 1.2}, {Y: 5.7, Z: 3.2}}
	c, err := engine.NewSectionCompartment(h, "Hopper", []engine.CompartmentSection{{X: 23, Outline: o}, {X: 48, Outline: o}})
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// The hopper's section below a level h above its bottom is the whole
// triangle (2 m²) less the triangle above the level, whose legs are
// 2 − h: A(h) = 2 − (2 − h)²/2, and V = 25·A (derived: areas of right
// triangles). Its bottom is flat, so the pipe stands in the middle of
// the flat, where the sloping top is only 1 m up: the pipe runs on to the
// deck, and every sounding of the table up to full (2 m) is taken and
// gives the row's volume.
func TestSoundingHopperTableRoundTrip(t *testing.T) {
	c := hopperTank(t)
	p := c.DefaultSoundingPipe()
	if math.Abs(p.X-35.5) > 1e-9 || math.Abs(p.Y-4.7) > 1e-9 {
		t.Errorf("default pipe (%g, %g), want the middle of the flat bottom (35.5, 4.7)", p.X, p.Y)
	}
	if full, err := c.FullSoundingM(p, engine.Plane{}); err != nil || math.Abs(full-2) > 1e-9 {
		t.Errorf("full at %g m (%v), want the tank's height 2 m", full, err)
	}
	rows := engine.CapacityTable(c, 1.025, 0.25)
	if n := len(rows); n != 9 || math.Abs(rows[n-1].SoundingM-2) > 1e-9 {
		t.Fatalf("%d rows to %g m: want 9, 0 to 2 m, no row repeated at the top", n, rows[n-1].SoundingM)
	}
	for _, r := range rows {
		h := r.SoundingM
		want := 25 * (2 - (2-h)*(2-h)/2)
		if math.Abs(r.VolumeM3-want) > 1e-9*50 {
			t.Errorf("table %g m: %.9f m³, closed form %.9f", h, r.VolumeM3, want)
		}
		got, err := c.SoundingVolumeM3(p, h, engine.Plane{})
		if err != nil || math.Abs(got-r.VolumeM3) > 1e-6 {
			t.Errorf("sounding %g m: %.9f m³ (%v), table %.9f", h, got, err, r.VolumeM3)
		}
	}
	if _, err := c.SoundingVolumeM3(p, 2.1, engine.Plane{}); err == nil {
		t.Error("a sounding above full was taken")
	}
}

// A tank whose bottom slopes: the triangle (2, 1), (6, 3), (2, 3), its
// bottom rising outboard from its inner wall. The pipe ends at the low
// corner, y = 2 on the inner wall, and a sounding h there is the level
// above the lowest point: A(h) = h²·(4/2)/2 = h² (a right triangle with
// legs h and 2h), V = 25·h² (derived).
func TestSoundingPipeAtLowestPoint(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	o := []engine.Point{{Y: 2, Z: 1}, {Y: 6, Z: 3}, {Y: 2, Z: 3}}
	c, err := engine.NewSectionCompartment(h, "Slope", []engine.CompartmentSection{{X: 23, Outline: o}, {X: 48, Outline: o}})
	if err != nil {
		t.Fatal(err)
	}
	p := c.DefaultSoundingPipe()
	if math.Abs(p.X-35.5) > 1e-9 || math.Abs(p.Y-2) > 1e-9 {
		t.Errorf("default pipe (%g, %g), want the low corner (35.5, 2)", p.X, p.Y)
	}
	for _, s := range []float64{0.5, 1, 1.5, 2} {
		got, err := c.SoundingVolumeM3(p, s, engine.Plane{})
		if want := 25 * s * s; err != nil || math.Abs(got-want) > 1e-9*want {
			t.Errorf("sounding %g m: %.9f m³ (%v), closed form %.9f", s, got, err, want)
		}
	}
	// A pipe the file places on the slope (y = 4, its foot 1 m up) cannot
	// see the liquid below its foot: the table counts from the foot and
	// its first row is empty, as a sounding of 0 is.
	c.Pipe = &engine.SoundingPipe{X: 30, Y: 4}
	rows := engine.CapacityTable(c, 1.0, 0.5)
	if rows[0].VolumeM3 != 0 || math.Abs(rows[len(rows)-1].SoundingM-1) > 1e-9 {
		t.Fatalf("rows from %g m³ to %g m: want empty at 0 and full at 1 m", rows[0].VolumeM3, rows[len(rows)-1].SoundingM)
	}
	for _, r := range rows {
		got, err := c.SoundingVolumeM3(*c.Pipe, r.SoundingM, engine.Plane{})
		if want := 25 * (1 + r.SoundingM) * (1 + r.SoundingM); r.SoundingM > 0 && math.Abs(r.VolumeM3-want) > 1e-9*want {
			t.Errorf("table %g m: %.9f m³, closed form %.9f", r.SoundingM, r.VolumeM3, want)
		}
		if err != nil || math.Abs(got-r.VolumeM3) > 1e-6 {
			t.Errorf("sounding %g m: %.9f m³ (%v), table %.9f", r.SoundingM, got, err, r.VolumeM3)
		}
	}
}

// A box tank keeps its pipe in the middle and its table: V = μ·L·B·s
// (a rectangular prism), each row's sounding giving the row back.
func TestSoundingBoxTableUnchanged(t *testing.T) {
	c := soundingTank(t)
	rows := engine.CapacityTable(c, 1.025, 0.5)
	if len(rows) != 7 {
		t.Fatalf("%d rows, want 7 (0 to 3 m by 0.5)", len(rows))
	}
	for _, r := range rows {
		want := 0.98 * 12 * 5 * r.SoundingM
		got, err := c.SoundingVolumeM3(c.SoundingPipe(), r.SoundingM, engine.Plane{})
		if math.Abs(r.VolumeM3-want) > 1e-9 || err != nil || math.Abs(got-want) > 1e-9 {
			t.Errorf("%g m: table %g, sounding %g (%v), prism %g", r.SoundingM, r.VolumeM3, got, err, want)
		}
	}
}
