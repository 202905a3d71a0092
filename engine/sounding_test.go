package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// soundingTank is a box tank x [30, 42], y [2, 7], z [0, 3] (μ 0.98) in a
// box hull 80 × 16 × 8 m: the hull does not cut it, so it is a rectangular
// prism.
func soundingTank(t *testing.T) *engine.Compartment {
	t.Helper()
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	c, err := engine.NewCompartment(h, "DB 3 S", engine.Box{X0: 30, X1: 42, Y0: 2, Y1: 7, Z0: 0, Z1: 3})
	if err != nil {
		t.Fatal(err)
	}
	c.Permeability = 0.98
	return c
}

// A surface that cuts all four walls of a rectangular prism: the liquid's
// depth is a linear function over the floor, and the mean of a linear
// function over a rectangle is its value at the centre, so
// V = μ · L · B · depth(centre) exactly (derived: elementary integration).
func TestSoundingVolumeBoxHeeledAndTrimmed(t *testing.T) {
	c := soundingTank(t)
	pipe := engine.SoundingPipe{X: 33, Y: 3}
	heel := 2 * math.Pi / 180
	slope := engine.Plane{B: -0.5 / 80, C: math.Tan(heel)} // 0.5 m by the stern, 2° to starboard
	s := 1.5
	got, err := c.SoundingVolumeM3(pipe, s, slope)
	if err != nil {
		t.Fatal(err)
	}
	depthAtCentre := s + slope.B*(36-pipe.X) + slope.C*(4.5-pipe.Y)
	want := 0.98 * 12 * 5 * depthAtCentre
	if math.Abs(got-want) > 1e-9*want {
		t.Errorf("volume %.9f m³, closed form %.9f m³", got, want)
	}
}

// A shallow sounding heeled 10° upright in trim: the liquid is a wedge
// against the low (starboard) wall, a triangular prism of length L whose
// section has the wet width w = y1 − (y_pipe − s/tan φ) and the depth
// w·tan φ at the wall: V = μ · L · ½ · w² · tan φ (derived: area of a
// right triangle).
func TestSoundingVolumeWedge(t *testing.T) {
	c := soundingTank(t)
	pipe := engine.SoundingPipe{X: 36, Y: 6}
	tanPhi := math.Tan(10 * math.Pi / 180)
	s := 0.3
	got, err := c.SoundingVolumeM3(pipe, s, engine.Plane{C: tanPhi})
	if err != nil {
		t.Fatal(err)
	}
	w := 7 - (pipe.Y - s/tanPhi)
	want := 0.98 * 12 * 0.5 * w * w * tanPhi
	if math.Abs(got-want) > 1e-9*want {
		t.Errorf("volume %.9f m³, closed form %.9f m³", got, want)
	}
}

func TestSoundingPipeSpanAndLimits(t *testing.T) {
	c := soundingTank(t)
	p := c.DefaultSoundingPipe()
	if math.Abs(p.X-36) > 1e-9 || math.Abs(p.Y-4.5) > 1e-9 {
		t.Errorf("default pipe at (%g, %g), want the middle (36, 4.5)", p.X, p.Y)
	}
	lo, hi, err := c.PipeSpan(p)
	if err != nil || math.Abs(lo) > 1e-9 || math.Abs(hi-3) > 1e-9 {
		t.Errorf("span [%g, %g] (%v), want [0, 3]", lo, hi, err)
	}
	// Upright and level: the sounding is the depth, V = μ·L·B·s.
	if v, err := c.SoundingVolumeM3(p, 2, engine.Plane{}); err != nil || math.Abs(v-0.98*60*2) > 1e-9 {
		t.Errorf("upright 2 m: %g m³ (%v), want %g", v, err, 0.98*60*2)
	}
	// Full to the top: the capacity.
	if v, err := c.SoundingVolumeM3(p, 3, engine.Plane{}); err != nil || math.Abs(v-c.CapacityM3()) > 1e-9 {
		t.Errorf("full: %g m³ (%v), want the capacity %g", v, err, c.CapacityM3())
	}
	if _, err := c.SoundingVolumeM3(p, 3.2, engine.Plane{}); err == nil {
		t.Error("a sounding above the tank's top was taken")
	}
	if _, _, err := c.PipeSpan(engine.SoundingPipe{X: 36, Y: -4}); err == nil {
		t.Error("a pipe outside the tank was taken")
	}
}
