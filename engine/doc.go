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
// # Where each piece lives
//
//   - Geometry: section.go (a section clipped by a plane), solid.go (slabs
//     integrated along the length; the plane of the water), waterline_cut.go,
//     convex_cut.go and outline_cursor.go (the fast paths of a slab's
//     immersion), hull.go and compartment.go, clip_scratch.go (the buffers
//     a compartment's clip by the hull reuses); leads.go and neighbours.go
//     (where openings lead, which compartments touch).
//   - The loading condition: vessel.go (weights, tanks and their contents,
//     damage states, permeability).
//   - Where she floats: equilibrium.go (Newton with the exact Jacobian, the
//     lost-buoyancy and added-weight methods, NoEquilibrium) and position.go
//     (what a solved position reports: drafts, GM, freeboards, openings).
//   - The two GMs every screen shows: gm_upright.go.
//   - The righting-lever curve: gz.go (the curve and what is read off it),
//     spline.go (the not-a-knot spline that joins its samples, fitted once per
//     curve), criteria.go (the stability criteria read off it) and gz_sides.go
//     (the worse side near upright). The curve is worked in spans over the
//     cores: gz_span.go (one span of samples from a fixed heel),
//     gz_span_starts.go (the fixed heels, so that the curve is the same on
//     any machine), gz_crew.go (the spans of one or more curves shared
//     out), gz_assemble.go (the spans joined by the rules of a curve worked
//     end to end) and gz_sides_concurrent.go (both sides at once).
//   - The hand method: hand.go, hand_ship.go (on a ship-shaped hull) and
//     hand_usable.go (when its answer is beyond its range). The flags:
//     flags.go; ballast_basis.go (the basis of the GM shown when a holed
//     tank held water ballast). Righting options:
//     remedy.go and remedy_stages.go (each checked while carried out).
//     Still-water strength: strength.go. All of one keystroke: assess.go
//     (Assess and the result types).
//   - Flooding over time: flood_case.go (what a run is given), flood.go (the
//     run: Torricelli inflow, the re-solve at each evaluation, stopping),
//     dormand_prince.go (the integrator), flood_events.go, flood_end.go,
//     flood_direction.go, flood_report.go (table, trace, intermediate
//     stages), shell_hole.go, spill.go (what a holed tank lets out) and
//     warm_start.go (each solve of a sequence started from the last).
//   - Readings and exercises: draftmark.go, draftsurvey.go, reading.go,
//     diagnose.go and diagnose_fit.go (what is flooding, from what the crew
//     reads), trend.go; drill.go, drill_event.go, drill_reading.go,
//     drill_alarm.go, drill_debrief.go (an exercise's truth on the network
//     run, what the crew would read and hear of it, and its debrief).
//   - Water spreading through the ship: connection.go (doors, ducts,
//     pipes and cross-flooding fittings between compartments), spread.go
//     (the final state of progressive flooding, to a fixed point),
//     crossflood.go (the MSC.362(92) time to equalise), network.go (a run
//     through the ship: the case and the flow law of each path),
//     network_run.go (the run, its events and report) and
//     network_stepper.go (its linearly implicit Rosenbrock integrator).
//   - Soundings and tables: sounding.go (a sounding to a volume at the
//     tank's pipe), tables.go (hydrostatic and capacity tables).
//   - One root-finder for functions that cost a solve per value:
//     illinois.go (the vanishing angle, flooding events, righting options).
//   - Work beside the caller: beside.go (goroutines whose panic is raised
//     again on the caller's) and fan_out.go (FanOut: independent calls over
//     GOMAXPROCS goroutines).
//
// The free-surface correction is spread over four files, each doing one
// part of it: vessel.go computes the free-surface moment of each slack tank
// (ρ·i of its waterplane about its own centreline, NewVessel) and sums the
// moments of weights and tanks (Vessel.Loading, Load.FSMTm); equilibrium.go
// applies ΣFSM/Δ as a virtual rise of G in every solve (Problem.eval);
// position.go adds the moments of floodwater held as an added weight, in its
// inclined surface, and reports FSC and the corrected GM (Problem.position);
// hand.go uses the same ΣFSM/Δ in the hand method's GM and GML.
//
// # Failures
//
// A programmer's mistake panics with a message starting "engine: ". Anything
// the data or the physics can cause (a hull that is not closed, a vessel that
// sinks or capsizes) is an error value.
package engine
