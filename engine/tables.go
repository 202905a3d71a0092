package engine

import (
	"errors"
	"fmt"
	"math"
)

// This file computes the tables of a ship's stability booklet: the
// hydrostatic table (at even keel, upright, draft by draft) and each tank's
// capacity table (level by level, upright and level).

// HydroRow is the hydrostatics of the hull at an even-keel, upright draft,
// the figures a booklet tabulates.
type HydroRow struct {
	DraftM        float64 // moulded draft T, on the baseline
	VolumeM3      float64 // ∇, the hull below T
	DisplacementT float64 // Δ = ρ∇
	LCBM, VCBM    float64 // centre of buoyancy: from the aft perpendicular, above the baseline (KB)
	WaterplaneM2  float64 // A_WP
	LCFM          float64 // centre of flotation from the aft perpendicular
	TPCt          float64 // tonnes per centimetre immersion, ρ·A_WP/100
	MCTCtm        float64 // moment to change trim one centimetre, ρ·I_L/(100·L) = Δ·BM_L/(100·L) (t·m)
	KMTM, KMLM    float64 // transverse and longitudinal metacentres above the baseline: KB + I_T/∇, KB + I_L/∇
}

// Hydrostatics returns the hull's hydrostatics at even-keel draft T in water
// of density rho (t/m³). I_T and I_L are the waterplane's second moments
// about its own centroidal axes; MCTC takes BM_L for GM_L (the booklet's
// usual approximation: G lies far below the longitudinal metacentre) and
// L, the length between perpendiculars, for the lever of the trim.
// Errors: a draft that is not above the keel or not below the deck's
// highest point, or no waterplane there.
func Hydrostatics(h *Hull, rho, T float64) (HydroRow, error) {
	_, _, zmin, zmax := h.solid.Extent()
	if math.IsNaN(T) || !(T > zmin) || !(T < zmax) {
		return HydroRow{}, fmt.Errorf("draft %g m: give a draft between the keel (%g m) and the deck (%g m)", T, zmin, zmax)
	}
	im := h.solid.Below(Plane{A: T})
	if !(im.V > 0) || !(im.AW > 0) {
		return HydroRow{}, errors.New("the hull has no waterplane at that draft")
	}
	x, _, z := im.Centroid()
	lcf := im.SX / im.AW
	it := im.IYY - im.SY*im.SY/im.AW
	il := im.IXX - im.SX*im.SX/im.AW
	return HydroRow{
		DraftM: T, VolumeM3: im.V, DisplacementT: rho * im.V,
		LCBM: x, VCBM: z, WaterplaneM2: im.AW, LCFM: lcf,
		TPCt: rho * im.AW / 100, MCTCtm: rho * il / (100 * h.LengthM),
		KMTM: z + it/im.V, KMLM: z + il/im.V,
	}, nil
}

// CapacityRow is one line of a tank's capacity table: its contents when it
// sounds SoundingM at its pipe, upright and level.
type CapacityRow struct {
	SoundingM  float64 // the sounding at the tank's pipe (Compartment.SoundingPipe): the surface's height above the pipe's datum
	VolumeM3   float64 // μ × the tank's volume below the surface (its capacity is μ × its volume: conventions)
	LCGM, TCGM float64 // centre of the contents
	VCGM       float64
	FSMTm      float64 // free-surface moment ρ·μ·i, i the surface's second moment about its own fore-and-aft axis (0 when full or empty)
}

// CapacityTable returns compartment c's capacity table, from empty to full,
// with a row every stepM metres of sounding and one at full, for a liquid
// of density rho (t/m³; the free-surface moment).
//
// The sounding is the one a condition's sounding_m is: taken at the
// tank's pipe (c.SoundingPipe(); a pipe that misses the tank gives way to
// DefaultSoundingPipe), from the pipe's datum up, so a sounding read off
// the table and entered in a condition gives the row's contents
// (SoundingVolumeM3, upright and level). At the default pipe the datum is
// the tank's lowest point. The table runs to the sounding at which the
// tank is full (FullSoundingM), which may be above the tank's top at the
// pipe; a pipe whose datum is above the tank's lowest point cannot see
// the liquid below its datum, and its row at 0 is empty, as a sounding of
// 0 is taken.
func CapacityTable(c *Compartment, rho, stepM float64) []CapacityRow {
	if !(stepM > 0) {
		panic("engine: CapacityTable step must be positive")
	}
	_, _, zmin, zmax := c.solid.Extent()
	datum := zmin
	p := c.SoundingPipe()
	if d, _, err := c.PipeSpan(p); err == nil {
		datum = d
	} else if d, _, err := c.PipeSpan(c.DefaultSoundingPipe()); err == nil {
		datum = d
	}
	top := zmax - datum
	mu := c.Permeability
	capM3 := c.CapacityM3()
	var out []CapacityRow
	for k := 0; ; k++ {
		s := float64(k) * stepM
		// A step that lands within round-off of the top is the top: no
		// second row a hair above it.
		if s >= top-1e-9*math.Max(1, top) {
			s = top
		}
		row := CapacityRow{SoundingM: s}
		if s > 0 || datum <= zmin {
			im := c.solid.Below(Plane{A: datum + s})
			row.VolumeM3 = math.Min(mu*im.V, capM3)
			if im.V > 0 {
				row.LCGM, row.TCGM, row.VCGM = im.Centroid()
			}
			if im.AW > 0 && s < top {
				row.FSMTm = rho * mu * (im.IYY - im.SY*im.SY/im.AW)
			}
		}
		out = append(out, row)
		if s >= top {
			return out
		}
	}
}
