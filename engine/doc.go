// Package engine computes where a ship floats, intact or flooded, straight from
// its hull geometry.
//
// # Frame, units and signs
//
// Everything in this package is SI with the ship-fixed frame of heelwatch's
// conventions: x longitudinal from the aft perpendicular (positive forward), y
// transverse from the centreline (positive to starboard), z vertical from the
// baseline (positive up). Lengths are metres, masses tonnes, densities t/m³,
// angles radians (degrees only in names ending in Deg). Heel is positive
// starboard side down; trim is draft aft minus draft forward (positive by the
// stern).
//
// The free water surface is the plane z = A + B·x + C·y of the ship frame
// (see Plane): A is the draft on the centreline at the aft perpendicular,
// B = −trim/L and C = tan(heel). Any attitude that is not beam-on or end-on
// can be written so.
//
// # Geometry
//
// A hull is a list of slabs: between two x positions the transverse section
// is a closed polygon whose vertices move linearly with x (a ruled surface).
// A box hull is one slab with a constant rectangle; a hull from station
// offsets has one slab between each pair of stations. A compartment is a box
// clipped by the hull, stored the same way. Integration along x is split at
// the slab ends and at every x where a vertex of the section crosses the
// waterline, and uses two-point Gauss–Legendre on each piece: on a box every
// integrand is then a polynomial of degree at most three in x and the result
// is exact to round-off at any attitude, deck edge immersed or bilge out.
//
// # Failures
//
// A programmer's mistake panics with a message starting "engine: ". Anything
// the data or the physics can cause (a hull that is not closed, a vessel that
// sinks or capsizes) is an error value.
package engine
