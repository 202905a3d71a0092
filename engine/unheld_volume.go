package engine

// UnheldVolume returns the hull's moulded volume below the deck (m³) and
// the part of it that no compartment holds (m³): the hull's volume less the
// sum of the compartments' volumes. Compartments may not overlap (the
// vessel file's reader refuses it), so the sum counts no space twice.
//
// Volume that no compartment holds is buoyancy the ship keeps whatever
// floods: a vessel file that leaves much of it paints her safer than she
// is. Round-off of the slab integration makes a few cubic metres either
// way; a negative difference is returned as 0.
func UnheldVolume(v *Vessel) (hullM3, unheldM3 float64) {
	hullM3 = v.Hull.Solid().Volume()
	held := 0.0
	for _, c := range v.Compartments {
		held += c.Volume()
	}
	return hullM3, max(0, hullM3-held)
}
