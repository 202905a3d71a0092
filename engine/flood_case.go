package engine

// This file holds what a flooding run is given: the hole, the pumps and the
// case that ties them to a compartment of a vessel (FloodCase), with the
// physical constants and the defaults of a run. The run is in flood.go.

// StandardGravity is g, 9.80665 m/s² (CGPM standard gravity).
const StandardGravity = 9.80665

// DefaultDischargeCoefficient is C_d of a hole when none is given: 0.6, a
// sharp-edged orifice (hydraulics practice; a ragged hull hole is nearer
// 0.65–0.75).
const DefaultDischargeCoefficient = 0.6

// DefaultFloodLimitS is the time limit of a flooding run when none is
// given: 24 h.
const DefaultFloodLimitS = 24 * 3600

// FloodHeadTolM is how close (m of head) the run must come to its settled
// head before it stops: 1 mm. With no pumps the settled head is zero (the
// levels inside and outside are equal); with pumps it is the head at which
// the inflow equals the pumps' capacity.
const FloodHeadTolM = 1e-3

// Hole is a breach through which the sea reaches one compartment.
type Hole struct {
	AreaM2     float64 // a, m² (> 0)
	XM, YM, ZM float64 // its centre in the ship frame, m
	Cd         float64 // discharge coefficient C_d, 0 < C_d ≤ 1; 0 means DefaultDischargeCoefficient
}

// Pump is one pump working on the flooded compartment.
type Pump struct {
	Name        string
	CapacityM3h float64 // m³/h (≥ 0)
}

// FloodCase is one flooding scenario: a compartment of Vessel, under the
// damage state Base of the others, filling through Hole against Pumps.
type FloodCase struct {
	Vessel *Vessel
	// Base is the state of every compartment (nil: intact). The flooded
	// compartment must not be Open in it; its Permeability applies, and its
	// WaterM3, if any, is the water already in at time zero.
	Base        Damage
	Compartment int // index into Vessel.Compartments
	Hole        Hole
	Pumps       []Pump
	LimitS      float64 // s; 0 means DefaultFloodLimitS

	// Criteria, when set, judges a solved condition: it is called at the
	// end of every accepted step, at each intermediate stage and at each
	// row of the table, and a criterion that passed and then fails is an
	// event placed inside the step (indicators, such as SOLAS s, are shown
	// but make no event). Each call costs what the criteria cost (a GZ
	// curve is some 60–90 solves). The damage d holds the water of that
	// moment as SpaceState.WaterM3 of the flooded compartment. FloodCriteria
	// gives one that applies the vessel's own criteria sets.
	Criteria func(v *Vessel, d Damage, pos Position) []CriterionResult
}
