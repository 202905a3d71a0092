package vessels

import (
	"errors"
	"fmt"
	"math"

	"heelwatch/engine"
)

// Apply returns the ship v (as read from her vessel file, the ship the
// condition was read for) loaded to the condition: her weights are the
// condition's Weights, and her tanks hold the condition's Tanks, every tank
// the condition does not name empty. The rest of the vessel file (hull,
// compartments, openings, marks, criteria) is kept.
//
// Tanks given by sounding are read at the heel and trim the condition says
// they were sounded at; without one, at the heel and trim she lies at with
// the condition applied: a fixed point, found by solving her intact
// equilibrium, reading the soundings there and again until no fill moves by
// more than 1e-9 (at most 40 rounds).
func (c *Condition) Apply(v *engine.Vessel) (*engine.Vessel, error) {
	if c == nil {
		return v, nil
	}
	for _, t := range c.Tanks {
		if t.Compartment < 0 || t.Compartment >= len(v.Compartments) {
			panic("engine: condition applied to a ship it was not read for")
		}
	}
	fills := make([]float64, len(c.Tanks))
	for i, t := range c.Tanks {
		fills[i] = t.Liquid.Fill
	}
	slope := engine.Plane{}
	if c.Sounded {
		slope = engine.Plane{B: -c.SoundedTrimM / v.Hull.LengthM, C: math.Tan(c.SoundedHeelDeg * math.Pi / 180)}
	}
	sounded := false
	for _, t := range c.Tanks {
		sounded = sounded || t.BySounding()
	}
	if !sounded {
		return c.build(v, fills)
	}
	const rounds = 40
	for round := 0; ; round++ {
		moved := 0.0
		for i, t := range c.Tanks {
			if !t.BySounding() {
				continue
			}
			cp := v.Compartments[t.Compartment]
			s := t.SoundingM
			if !c.Sounded {
				// A sounding within full upright (what a condition file
				// is checked against) that is past full at her own heel
				// and trim reads as full: the liquid stands in the pipe.
				// One past full upright too is refused below.
				up, errUp := cp.FullSoundingM(t.Pipe, engine.Plane{})
				if full, err := cp.FullSoundingM(t.Pipe, slope); err == nil && errUp == nil && s <= up+1e-9 {
					s = math.Min(s, full)
				}
			}
			vol, err := cp.SoundingVolumeM3(t.Pipe, s, slope)
			if err != nil {
				return nil, t.problem(err.Error())
			}
			f := math.Min(vol/cp.CapacityM3(), 1)
			moved = math.Max(moved, math.Abs(f-fills[i]))
			fills[i] = f
		}
		nv, err := c.build(v, fills)
		if err != nil || c.Sounded || (round > 0 && moved <= 1e-9) {
			return nv, err
		}
		if round == rounds {
			return nil, errors.New("the soundings give no steady heel and trim: say how she lay when sounded (heel_deg and trim_m in the condition file)")
		}
		pos, err := engine.Solve(nv, nv.Intact())
		if err != nil {
			return nil, fmt.Errorf("with the soundings read upright she finds no equilibrium (%v): say how she lay when sounded (heel_deg and trim_m in the condition file)", err)
		}
		slope = engine.Plane{B: pos.Plane.B, C: pos.Plane.C}
	}
}

// build makes the ship loaded with the condition's weights and the tanks at
// fills (index-aligned with c.Tanks).
func (c *Condition) build(v *engine.Vessel, fills []float64) (*engine.Vessel, error) {
	nv := *v
	nv.Weights = append([]engine.Weight(nil), c.Weights...)
	nv.Compartments = make([]*engine.Compartment, len(v.Compartments))
	for i, cp := range v.Compartments {
		cc := *cp
		cc.Liquid = nil
		nv.Compartments[i] = &cc
	}
	for i, t := range c.Tanks {
		l := t.Liquid
		l.Fill = fills[i]
		nv.Compartments[t.Compartment].Liquid = &l
	}
	return engine.NewVessel(nv)
}

// problem is a problem with the tank's entry, at its place in the file.
func (t TankFill) problem(msg string) error {
	if t.File == "" {
		return errors.New(msg)
	}
	return Problems{{File: t.File, Line: t.Line, Key: t.Key, Msg: msg}}
}

// Fills returns the fraction of capacity each tank of the loaded ship v
// holds (index-aligned with v.Compartments; 0 for a dry space): what the
// soundings came to, once applied.
func Fills(v *engine.Vessel) []float64 {
	out := make([]float64, len(v.Compartments))
	for i, c := range v.Compartments {
		if c.Liquid != nil {
			out[i] = c.Liquid.Fill
		}
	}
	return out
}

// ConditionOf returns the loading condition the ship v holds now, as a
// Condition (every weight its own, every tank holding liquid at its fill):
// the start of the dashboard's condition when no condition file is given.
// Applied to v it gives v again.
func ConditionOf(v *engine.Vessel, name string) *Condition {
	c := &Condition{Name: name, Weights: append([]engine.Weight(nil), v.Weights...)}
	for i, cp := range v.Compartments {
		if cp.Liquid != nil {
			c.Tanks = append(c.Tanks, TankFill{Compartment: i, Liquid: *cp.Liquid, SoundingM: -1})
		}
	}
	return c
}
