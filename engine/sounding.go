package engine

import (
	"fmt"
	"math"
)

// SoundingPipe is where a tank is sounded: the pipe's position in plan
// (x, y in the ship frame, m). A sounding is measured up the pipe, along
// the ship's vertical, from the tank's bottom under the pipe (its datum) to
// the liquid's surface.
type SoundingPipe struct {
	X, Y float64
}

// DefaultSoundingPipe is the pipe a tank has when its vessel file names
// none: at the middle of the tank's length, and there at the middle of its
// section's breadth.
func (c *Compartment) DefaultSoundingPipe() SoundingPipe {
	xmin, xmax, _, _ := c.solid.Extent()
	x := (xmin + xmax) / 2
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, q := range c.solid.SectionAt(x) {
		lo, hi = math.Min(lo, q.Y), math.Max(hi, q.Y)
	}
	if lo > hi {
		return SoundingPipe{X: x, Y: (c.Box.Y0 + c.Box.Y1) / 2}
	}
	return SoundingPipe{X: x, Y: (lo + hi) / 2}
}

// PipeSpan returns the heights (m above the baseline) at which a vertical
// line through the pipe enters the tank from below (the datum soundings
// count from) and leaves it at the top. It fails when the pipe misses the
// tank.
//
// Method: the tank's section at the pipe's x is a closed polygon in (y, z);
// every edge the vertical y = pipe.Y crosses gives one height, and the
// lowest and highest of them bound the tank there.
func (c *Compartment) PipeSpan(p SoundingPipe) (datumZ, topZ float64, err error) {
	sec := c.solid.SectionAt(p.X)
	datumZ, topZ = math.Inf(1), math.Inf(-1)
	for i := range sec {
		a, b := sec[i], sec[(i+1)%len(sec)]
		lo, hi := math.Min(a.Y, b.Y), math.Max(a.Y, b.Y)
		if p.Y < lo-1e-9 || p.Y > hi+1e-9 {
			continue
		}
		var z float64
		if hi-lo < 1e-12 {
			// A vertical edge at the pipe: both its ends bound the tank.
			datumZ, topZ = math.Min(datumZ, math.Min(a.Z, b.Z)), math.Max(topZ, math.Max(a.Z, b.Z))
			continue
		}
		z = a.Z + (p.Y-a.Y)*(b.Z-a.Z)/(b.Y-a.Y)
		datumZ, topZ = math.Min(datumZ, z), math.Max(topZ, z)
	}
	if !(topZ > datumZ) {
		return 0, 0, fmt.Errorf("compartment %q: its sounding pipe at x = %g m, y = %g m does not pass through the tank", c.Name, p.X, p.Y)
	}
	return datumZ, topZ, nil
}

// SoundingVolumeM3 returns the liquid a tank holds (m³) when it sounds
// soundingM at pipe p while the ship lies with her water plane's slopes
// (slope.B = −trim/L, slope.C = tan heel; slope.A is not used). The
// liquid's surface is parallel to the sea's, so it is the plane with those
// slopes through the point soundingM above the datum at the pipe; the
// liquid fills μ of the tank below it (the tank rule: capacity = μ × the
// volume inside the hull).
//
// Valid for a sounding from 0 to the top of the tank at the pipe (PipeSpan):
// beyond, it fails. A pipe at the high side of a heeled tank that sounds 0
// says only that the liquid is below its datum: the volume returned is
// then the least the tank may hold, 0.
func (c *Compartment) SoundingVolumeM3(p SoundingPipe, soundingM float64, slope Plane) (float64, error) {
	datum, top, err := c.PipeSpan(p)
	if err != nil {
		return 0, err
	}
	if math.IsNaN(soundingM) || soundingM < 0 {
		return 0, fmt.Errorf("compartment %q: sounding %v m: must be 0 or more", c.Name, soundingM)
	}
	if soundingM > top-datum+1e-9 {
		return 0, fmt.Errorf("compartment %q: sounding %.3f m is above the tank's top at its pipe (%.3f m)", c.Name, soundingM, top-datum)
	}
	if soundingM == 0 {
		return 0, nil
	}
	z := datum + soundingM
	surface := Plane{A: z - slope.B*p.X - slope.C*p.Y, B: slope.B, C: slope.C}
	v := c.Permeability * c.solid.Below(surface).V
	return math.Min(v, c.CapacityM3()), nil
}
