package engine

import (
	"fmt"
	"math"
	"strings"
)

// ConnectionKinds are the kinds of connection between two compartments.
// "cross-flooding" marks a fitting fitted to equalise a list (SOLAS II-1
// Reg. 7-2; MSC.362(92)): its time to equalise is reported against the
// 10 min limit.
var ConnectionKinds = []string{"door", "hatch", "duct", "pipe", "cross-flooding", "opening"}

// CrossFloodingKind is the kind of a cross-flooding fitting.
const CrossFloodingKind = "cross-flooding"

// Connection is a way for water between two compartments of the ship: a
// door, a hatch, a duct, a pipe or a cross-flooding fitting. Water flows
// either way, from the higher level to the lower.
//
// Its opening is taken as a rectangle standing on its sill: clear area
// AreaM2, height HeightM above the sill at Z (so a width of
// AreaM2/HeightM); HeightM 0 is a small hole at the point (X, Y, Z). The
// flow through it is the orifice law Q = Cd·F·A·√(2g·Δh) with the speed
// reduction F = 1/√(1+K) of MSC.362(92) (see ConnectionFlow).
type Connection struct {
	Name     string
	Kind     string  // one of ConnectionKinds
	From, To int     // compartment indices into Vessel.Compartments
	AreaM2   float64 // clear area, m² (> 0)
	X, Y, Z  float64 // the middle of its sill, ship frame, m
	HeightM  float64 // height of the opening above its sill, m (0: a small hole)
	Open     bool    // its state now
	K        float64 // sum of loss coefficients (≥ 0)
}

// SpeedFactor returns F = 1/√(1 + K), the speed reduction factor of
// MSC.362(92) for a fitting whose loss coefficients sum to K.
func (c Connection) SpeedFactor() float64 { return 1 / math.Sqrt(1+c.K) }

// Other returns the compartment at the other end from i (i must be one end).
func (c Connection) Other(i int) int {
	switch i {
	case c.From:
		return c.To
	case c.To:
		return c.From
	}
	panic(fmt.Sprintf("engine: compartment %d is not an end of connection %q", i, c.Name))
}

// DefaultOpeningAreaM2 is the flow area of an opening that leads into a
// compartment when none is given: 0.02 m², about the bore of a 160 mm air
// pipe or a small vent (practice).
const DefaultOpeningAreaM2 = 0.02

// checkConnections checks the connections and the openings' LeadsTo of v.
func checkConnections(v *Vessel) error {
	n := len(v.Compartments)
	for i, c := range v.Connections {
		if c.From < 0 || c.From >= n || c.To < 0 || c.To >= n || c.From == c.To {
			return fmt.Errorf("connection %d (%q): it must join two different compartments of the vessel", i+1, c.Name)
		}
		for _, f := range []float64{c.AreaM2, c.X, c.Y, c.Z, c.HeightM, c.K} {
			if math.IsNaN(f) || math.IsInf(f, 0) {
				return fmt.Errorf("connection %d (%q): area, position, height and k must be finite numbers", i+1, c.Name)
			}
		}
		if !(c.AreaM2 > 0) || c.HeightM < 0 || c.K < 0 {
			return fmt.Errorf("connection %d (%q): area %v m² must be positive, height %v m and k %v not negative", i+1, c.Name, c.AreaM2, c.HeightM, c.K)
		}
	}
	for i, o := range v.Openings {
		if o.AreaM2 < 0 || math.IsNaN(o.AreaM2) || math.IsInf(o.AreaM2, 0) {
			return fmt.Errorf("opening %d (%q): area %v m² must be a finite number, zero or more", i+1, o.Name, o.AreaM2)
		}
	}
	return nil
}

// CompartmentIndex returns the index of the compartment named name
// (ignoring case), or -1.
func (v *Vessel) CompartmentIndex(name string) int {
	for i, c := range v.Compartments {
		if strings.EqualFold(c.Name, name) {
			return i
		}
	}
	return -1
}

// flowAreaM2 returns the area water flows through an opening: its own, or
// DefaultOpeningAreaM2.
func (o Opening) flowAreaM2() float64 {
	if o.AreaM2 > 0 {
		return o.AreaM2
	}
	return DefaultOpeningAreaM2
}

// WithConnection returns a copy of v with connection i open or closed (the
// dashboard's door switch). The copy shares the hull and compartments.
func (v *Vessel) WithConnection(i int, open bool) *Vessel {
	if i < 0 || i >= len(v.Connections) {
		panic(fmt.Sprintf("engine: connection %d out of range", i))
	}
	w := *v
	w.Connections = append([]Connection(nil), v.Connections...)
	w.Connections[i].Open = open
	return &w
}
