package engine

// openWaterT returns the sea water (t) standing in the compartments open to
// the sea at plane p: Σ ρ μ × each one's part below the water. With it the
// lost-buoyancy displacement (the ship's weight alone) adds up to what the
// hull displaces as a whole.
func (pr *Problem) openWaterT(p Plane) float64 {
	var w float64
	for _, o := range pr.open {
		w += pr.rho * o.mu * o.solid.Below(p).V
	}
	return w
}
