package engine

import "math"

// This file sounds a drill's high-level alarms: a float switch in a
// compartment's bilge well that sounds once, when the water there first
// stands at its level above the compartment's lowest point.

// DrillAlarm is an alarm that has sounded.
type DrillAlarm struct {
	Minutes     float64
	Compartment int
}

// SetAlarms fits high-level alarms in the compartments given, each
// sounding when the water stands levelM above the compartment's lowest
// point (taken at the compartment's middle, as a sounding). Call it before
// AdvanceTo.
func (d *Drill) SetAlarms(compartments []int, levelM float64) {
	d.alarmAt = levelM
	d.alarmOn = map[int]bool{}
	for _, i := range compartments {
		if i < 0 || i >= len(d.v.Compartments) {
			panic("engine: alarm in a compartment the vessel does not have")
		}
		d.alarmOn[i] = false
	}
}

// Alarms returns the alarms sounded so far, in time order.
func (d *Drill) Alarms() []DrillAlarm { return append([]DrillAlarm(nil), d.alarms...) }

// sound checks the alarms against the state now.
func (d *Drill) sound() {
	if d.pos == nil {
		return
	}
	for i := range d.v.Compartments {
		sounded, fitted := d.alarmOn[i]
		if !fitted || sounded || !d.wet[i] {
			continue
		}
		if d.LowSideDepth(i) >= d.alarmAt {
			d.alarmOn[i] = true
			d.alarms = append(d.alarms, DrillAlarm{Minutes: d.t / 60, Compartment: i})
			d.record("alarm " + d.v.Compartments[i].Name)
		}
	}
}

// Sounding returns the height of the water in compartment i above its
// lowest point, at its middle, along z (0 when dry).
//
// An alarm's float switch sits in the bilge well at the low side, so an
// alarm reads the deepest water at any of the four bottom corners of the
// compartment's box (LowSideDepth) rather than this.
func (d *Drill) Sounding(i int) float64 {
	if d.pos == nil {
		return 0
	}
	c := d.v.Compartments[i]
	xmin, xmax, zmin, _ := c.solid.Extent()
	xc, yc := (xmin+xmax)/2, (c.Box.Y0+c.Box.Y1)/2
	p := d.pos.Plane
	if !d.wet[i] || d.water[i] <= 0 {
		return 0
	}
	wm := math.Min(d.water[i]/d.mu(i), c.solid.Volume()*(1-1e-9))
	pin, _ := levelForVolume(c.solid, wm, p.B, p.C)
	return math.Max(0, pin.Z(xc, yc)-zmin)
}

// LowSideDepth returns the depth of the water in compartment i at the
// lowest of the four bottom corners of its box, along z (0 when dry): where
// the water gathers when she heels and trims, and where a bilge well's
// float switch would feel it first.
func (d *Drill) LowSideDepth(i int) float64 {
	if d.pos == nil || !d.wet[i] || d.water[i] <= 0 {
		return 0
	}
	c := d.v.Compartments[i]
	p := d.pos.Plane
	wm := math.Min(d.water[i]/d.mu(i), c.solid.Volume()*(1-1e-9))
	surf, _ := levelForVolume(c.solid, wm, p.B, p.C)
	_, _, zmin, _ := c.solid.Extent()
	b := c.Box
	deep := 0.0
	for _, x := range []float64{b.X0, b.X1} {
		for _, y := range []float64{b.Y0, b.Y1} {
			deep = math.Max(deep, surf.Z(x, y)-math.Max(zmin, b.Z0))
		}
	}
	return deep
}
