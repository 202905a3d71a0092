// Package vessels reads heelwatch's TOML vessel files into engine values
// and carries the bundled demonstration vessels.
//
// A vessel file describes one ship: her hull (a box or station offsets),
// her compartments (boxes clipped by the hull), the openings through which
// water would spread, and one loading condition. FORMAT.md beside this file
// documents every key with its unit; the axes, units and signs are those of
// heelwatch's conventions (x forward from the aft perpendicular, y to
// starboard, z up from the baseline; metres, tonnes, t/m³).
//
// Parse checks the whole file before it builds anything and reports every
// problem at once as Problems, each naming the file, the line, the key and
// what is allowed. A vessel heavier than all her buoyancy is not a problem
// of the file: she loads, and engine.Solve says she sinks.
//
// The bundled vessels (Bundled, Source, Open) are invented for
// demonstration and say so; none of their figures is approved stability
// data.
package vessels
