package vessels

import (
	"strings"

	"heelwatch/engine"
)

// This file reads the [[connection]] tables (doors, hatches, ducts, pipes
// and cross-flooding fittings between two compartments) and the area key
// of an [[opening]] (its leads_to is read in openings.go).

// touchTolM is how near two compartments' boxes must come to count as
// touching, m.
const touchTolM = 1e-3

// openingArea reads an opening's area key (its leads_to is read in
// openings.go).
func (r *reader) openingArea(t *table, o *engine.Opening) {
	if a, ok := t.positive("area", "m², the area water flows through", false); ok {
		o.AreaM2 = a
	}
}

// compartmentNames maps each compartment's folded name to its index.
func compartmentNames(comps []*engine.Compartment) map[string]int {
	m := map[string]int{}
	for i, c := range comps {
		m[strings.ToLower(strings.TrimSpace(c.Name))] = i
	}
	return m
}

// connections reads the [[connection]] tables. comps may be short of the
// file's compartments when some could not be built; then only the file's
// own checks run. It returns the connections and the warnings: a door,
// hatch or opening between compartments that do not touch, or whose sill
// lies outside either of them. (A duct, pipe or cross-flooding fitting may
// run through other spaces: no warning for those.)
func (r *reader) connections(ts []*table, comps []*engine.Compartment, complete bool) ([]engine.Connection, Problems) {
	names := compartmentNames(comps)
	seen := map[string]string{}
	var out []engine.Connection
	var warns Problems
	for _, t := range ts {
		var c engine.Connection
		c.Name, _ = r.name(t, seen, "connection")
		c.Kind, _ = t.choice("kind", true, engine.ConnectionKinds)
		from, fromOK := t.str("from", true, "the name of the compartment on one side")
		to, toOK := t.str("to", true, "the name of the compartment on the other side")
		c.AreaM2, _ = t.positive("area", "m², the clear area water flows through", true)
		c.X, _ = t.num("x", "m from the aft perpendicular", true)
		c.Y, _ = t.num("y", "m from the centreline, + to starboard", true)
		var zOK bool
		c.Z, zOK = t.num("z", "m above the baseline: the sill", true)
		if zOK && c.Z < 0 {
			r.addf(t.keyPath("z"), "%g m is below the baseline: a sill's z is 0 or more", c.Z)
		}
		if h, present := t.num("height", "m above the sill", false); present {
			if h < 0 {
				r.addf(t.keyPath("height"), "%g m is negative: give the opening's height above its sill, or leave it out for a small hole", h)
			}
			c.HeightM = h
		}
		if k, present := t.num("k", "sum of loss coefficients", false); present {
			if k < 0 {
				r.addf(t.keyPath("k"), "%g is negative: the loss coefficients' sum is 0 or more (F = 1/√(1+k))", k)
			}
			c.K = k
		}
		if !t.has("open") {
			r.addf(t.keyPath("open"), "missing: say whether it is open now: open = true or open = false")
		}
		c.Open, _ = t.boolean("open")
		t.finish()
		c.From, c.To = -1, -1
		for _, e := range []struct {
			key  string
			name string
			ok   bool
			ix   *int
		}{{"from", from, fromOK, &c.From}, {"to", to, toOK, &c.To}} {
			if !e.ok {
				continue
			}
			i, found := names[strings.ToLower(strings.TrimSpace(e.name))]
			if !found {
				if complete {
					r.addf(t.keyPath(e.key), "%q is not the name of a compartment in this file", e.name)
				}
				continue
			}
			*e.ix = i
		}
		if c.From >= 0 && c.From == c.To {
			r.addf(t.keyPath("to"), "%q is the compartment on the other side too: a connection joins two different compartments", to)
			continue
		}
		if c.From < 0 || c.To < 0 {
			continue
		}
		out = append(out, c)
		if c.Kind == "duct" || c.Kind == "pipe" || c.Kind == engine.CrossFloodingKind {
			continue
		}
		a, b := comps[c.From].Box, comps[c.To].Box
		if !boxesTouch(a, b) {
			warns = append(warns, Problem{File: r.file, Line: r.lines.line(t.path), Key: t.path,
				Msg: "a " + c.Kind + " between " + quote(comps[c.From].Name) + " and " + quote(comps[c.To].Name) + ", which do not touch: check from and to"})
		} else if !nearBox(a, c.X, c.Y, c.Z) || !nearBox(b, c.X, c.Y, c.Z) {
			warns = append(warns, Problem{File: r.file, Line: r.lines.line(t.path), Key: t.path,
				Msg: "its sill (x, y, z) lies outside " + quote(comps[c.From].Name) + " or " + quote(comps[c.To].Name) + ": check its position"})
		}
	}
	return out, warns
}

func quote(s string) string { return "\"" + s + "\"" }

// boxesTouch reports whether two boxes meet: their closed extents overlap
// or touch in all three axes.
func boxesTouch(a, b engine.Box) bool {
	return a.X0 <= b.X1+touchTolM && b.X0 <= a.X1+touchTolM &&
		a.Y0 <= b.Y1+touchTolM && b.Y0 <= a.Y1+touchTolM &&
		a.Z0 <= b.Z1+touchTolM && b.Z0 <= a.Z1+touchTolM
}

// nearBox reports whether the point lies in box b or on its faces.
func nearBox(b engine.Box, x, y, z float64) bool {
	const tol = 0.05
	return x >= b.X0-tol && x <= b.X1+tol && y >= b.Y0-tol && y <= b.Y1+tol && z >= b.Z0-tol && z <= b.Z1+tol
}
