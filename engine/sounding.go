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

// SoundingPipe returns the pipe the tank is sounded at: Pipe when the
// vessel file gives one, else DefaultSoundingPipe.
func (c *Compartment) SoundingPipe() SoundingPipe {
	if c.Pipe != nil {
		return *c.Pipe
	}
	return c.DefaultSoundingPipe()
}

// DefaultSoundingPipe is the pipe a tank has when its vessel file names
// none: at the tank's lowest point, where a real sounding pipe ends so that
// it reaches the last of the liquid. Its datum is then the tank's lowest
// point, and upright and level a sounding is the height of the surface
// above it, the sounding of the capacity table (CapacityTable).
//
// Where the bottom is flat (every point within 1 µm of the lowest) the
// pipe stands in the middle of the flat: at the middle of the x range of
// the lowest points and, at that x, at the middle of the lowest points'
// breadth. So a box tank is sounded at its middle. Where the middle of
// either range is not on the lowest place (the lowest points lie apart),
// the pipe goes to the lowest point nearest it.
func (c *Compartment) DefaultSoundingPipe() SoundingPipe {
	const tol = 1e-6
	if c.solid == nil || len(c.solid.slabs) == 0 {
		return SoundingPipe{X: (c.Box.X0 + c.Box.X1) / 2, Y: (c.Box.Y0 + c.Box.Y1) / 2}
	}
	_, _, zlow, _ := c.solid.Extent()
	// The lowest points are vertices at the slabs' ends: a slab's vertices
	// run straight between its ends.
	var xs []float64
	for i := range c.solid.slabs {
		sl := &c.solid.slabs[i]
		for k := range sl.p0 {
			if sl.p0[k].Z <= zlow+tol {
				xs = append(xs, sl.x0)
			}
			if sl.p1[k].Z <= zlow+tol {
				xs = append(xs, sl.x1)
			}
		}
	}
	x := nearestMiddle(xs, func(x float64) bool {
		return sectionLow(c.solid.SectionAt(x)) <= zlow+tol
	})
	sec := c.solid.SectionAt(x)
	zs := sectionLow(sec)
	var ys []float64
	for _, q := range sec {
		if q.Z <= zs+tol {
			ys = append(ys, q.Y)
		}
	}
	y := nearestMiddle(ys, func(y float64) bool {
		d, _, err := c.PipeSpan(SoundingPipe{X: x, Y: y})
		return err == nil && d <= zs+tol
	})
	return SoundingPipe{X: x, Y: y}
}

// sectionLow is the lowest z of a section polygon (+Inf for none).
func sectionLow(sec []Point) float64 {
	z := math.Inf(1)
	for _, q := range sec {
		z = math.Min(z, q.Z)
	}
	return z
}

// nearestMiddle returns the middle of vs's range when ok holds there, else
// the value of vs nearest that middle. vs must not be empty.
func nearestMiddle(vs []float64, ok func(float64) bool) float64 {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	mid := (lo + hi) / 2
	if ok(mid) {
		return mid
	}
	best := vs[0]
	for _, v := range vs {
		if math.Abs(v-mid) < math.Abs(best-mid) {
			best = v
		}
	}
	return best
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

// FullSoundingM returns the sounding at pipe p at which the tank is full
// while the ship lies with her water plane's slopes (slope.B = −trim/L,
// slope.C = tan heel): the height above the pipe's datum of the surface
// through the pipe that just covers the tank's highest corner,
// max over the corners of z − B·(x − x_p) − C·(y − y_p), less the datum.
//
// A sounding pipe runs from its datum up to the deck, so the liquid
// stands in it at the tank's level even where that level is above the
// tank's top at the pipe (a hopper tank's sloping top, a tank whose top
// follows the sheer): the full sounding is at least the top at the pipe,
// and upright and level with the pipe at the lowest point it is the
// tank's whole height. It fails when the pipe misses the tank.
func (c *Compartment) FullSoundingM(p SoundingPipe, slope Plane) (float64, error) {
	datum, top, err := c.PipeSpan(p)
	if err != nil {
		return 0, err
	}
	h := top
	for i := range c.solid.slabs {
		sl := &c.solid.slabs[i]
		for k := range sl.p0 {
			h = math.Max(h, sl.p0[k].Z-slope.B*(sl.x0-p.X)-slope.C*(sl.p0[k].Y-p.Y))
			h = math.Max(h, sl.p1[k].Z-slope.B*(sl.x1-p.X)-slope.C*(sl.p1[k].Y-p.Y))
		}
	}
	return h - datum, nil
}

// SoundingVolumeM3 returns the liquid a tank holds (m³) when it sounds
// soundingM at pipe p while the ship lies with her water plane's slopes
// (slope.B = −trim/L, slope.C = tan heel; slope.A is not used). The
// liquid's surface is parallel to the sea's, so it is the plane with those
// slopes through the point soundingM above the datum at the pipe; the
// liquid fills μ of the tank below it (the tank rule: capacity = μ × the
// volume inside the hull).
//
// Valid for a sounding from 0 to the sounding at which the tank is full
// (FullSoundingM): beyond, it fails. A pipe at the high side of a heeled
// tank that sounds 0 says only that the liquid is below its datum: the
// volume returned is then the least the tank may hold, 0.
func (c *Compartment) SoundingVolumeM3(p SoundingPipe, soundingM float64, slope Plane) (float64, error) {
	datum, _, err := c.PipeSpan(p)
	if err != nil {
		return 0, err
	}
	if math.IsNaN(soundingM) || soundingM < 0 {
		return 0, fmt.Errorf("compartment %q: sounding %v m: must be 0 or more", c.Name, soundingM)
	}
	full, err := c.FullSoundingM(p, slope)
	if err != nil {
		return 0, err
	}
	if soundingM > full+1e-9 {
		return 0, fmt.Errorf("compartment %q: sounding %.3f m is above the tank's top: it is full when its pipe sounds %.3f m", c.Name, soundingM, full)
	}
	if soundingM == 0 {
		return 0, nil
	}
	z := datum + soundingM
	surface := Plane{A: z - slope.B*p.X - slope.C*p.Y, B: slope.B, C: slope.C}
	v := c.Permeability * c.solid.Below(surface).V
	return math.Min(v, c.CapacityM3()), nil
}
