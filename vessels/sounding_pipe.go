package vessels

import (
	"heelwatch/engine"
)

// soundingPipe reads a compartment's optional sounding_pipe = [x, y]: where
// its tank is sounded, in plan. It must lie within the compartment's box;
// a pipe that misses the tank where the hull cuts the box is reported when
// a sounding is read (condition files). Nil when absent or refused: the
// tank is then sounded at its lowest point (engine.DefaultSoundingPipe;
// where the bottom is flat, in the middle of the flat).
func (r *reader) soundingPipe(t *table, b engine.Box, boxOK bool) *engine.SoundingPipe {
	raw, present := t.get("sounding_pipe")
	if !present {
		return nil
	}
	p := t.keyPath("sounding_pipe")
	a, ok := raw.([]any)
	if !ok || len(a) != 2 {
		r.addf(p, "must be a pair [x, y] in metres (the pipe's place in plan), not %s", describe(raw))
		return nil
	}
	x, xOK := number(a[0])
	y, yOK := number(a[1])
	if !xOK || !yOK {
		r.addf(p, "must be two numbers [x, y] in metres")
		return nil
	}
	if !boxOK {
		return nil
	}
	const tol = 1e-6
	if x < b.X0-tol || x > b.X1+tol || y < b.Y0-tol || y > b.Y1+tol {
		r.addf(p, "[%g, %g] lies outside the compartment (x [%g, %g], y [%g, %g]): the pipe must lead into the tank", x, y, b.X0, b.X1, b.Y0, b.Y1)
		return nil
	}
	return &engine.SoundingPipe{X: x, Y: y}
}
