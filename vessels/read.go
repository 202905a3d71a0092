package vessels

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/BurntSushi/toml"

	"heelwatch/engine"
)

// FormatVersion is the only value of the format key this reader accepts.
const FormatVersion = 1

// Info is what a vessel file says beyond the engine's values: text for the
// screen, and each compartment's hole (an engine.Hole) and pumps, which a
// flooding run takes when it is not told otherwise (ResolveFlood).
type Info struct {
	File        string // the file name used in messages ("bundled/barge.toml" for a bundled one)
	Bundled     string // the bundled name ("barge"), "" for a file of the user's
	Description string // the about key: what the vessel is, free text
	Condition   string // the condition key: the loading condition's name, "" if not given
	ShipType    string // "cargo" or "passenger" (SOLAS II-1 Reg. 7-2's θmin/θmax)
	Shape       string // "box" or "sections"

	// Compartments is index-aligned with engine.Vessel.Compartments.
	Compartments []CompartmentInfo
	// Warnings are things in the file that are allowed but look wrong (see
	// connections.go); the file is still used.
	Warnings Problems
}

// CompartmentInfo is the file's extra data on one compartment.
type CompartmentInfo struct {
	Use   string       // as in the file; also set on engine.Compartment.Use
	Group string       // the group key, or the use's default group (see FORMAT.md)
	Hole  *engine.Hole // a hole in the shell into this compartment (C_d filled in), nil if none
	// PumpM3h is the pumping capacity that can be put on the compartment, m³/h.
	PumpM3h float64
	// SoundingPipe is where the tank is sounded (sounding_pipe), nil for
	// its lowest point (engine.DefaultSoundingPipe).
	SoundingPipe *engine.SoundingPipe
	// DefaultPermeabilityFromUse is true when the file gave no permeability
	// and the compartment's μ is the default of its use.
	DefaultPermeabilityFromUse bool
}

// Parse reads a vessel file. file is the name used in messages. Any problem
// in the file is returned as Problems, all of them at once.
func Parse(file string, data []byte) (*engine.Vessel, *Info, error) {
	r, root, err := decode(file, data)
	if err != nil {
		return nil, nil, err
	}
	v, info := r.vessel(root)
	if len(r.probs) > 0 {
		return nil, nil, r.probs.sorted()
	}
	info.File = file
	return v, info, nil
}

func syntaxProblem(file string, err error) error {
	var pe toml.ParseError
	if errors.As(err, &pe) {
		msg := pe.Message
		if pe.Usage != "" {
			msg += " (" + strings.TrimSpace(pe.Usage) + ")"
		}
		key := pe.LastKey
		if key == "" {
			key = "syntax"
		}
		return Problems{{File: file, Line: max(pe.Position.Line, 1), Key: key, Msg: "TOML syntax: " + msg}}
	}
	return Problems{{File: file, Line: 1, Key: "syntax", Msg: "TOML syntax: " + err.Error()}}
}

// vessel reads the whole document.
func (r *reader) vessel(root *table) (*engine.Vessel, *Info) {
	info := &Info{}
	r.format(root)
	name, ok := root.str("name", true, "the vessel's name in quotes")
	if ok && strings.TrimSpace(name) == "" {
		r.addf("name", "is empty: give the vessel's name")
	} else if ok {
		r.checkName("name", name, "vessel's name")
	}
	rho := engine.SeaWaterDensity
	if d, ok := root.num("water_density", "t/m³", false); ok {
		if !(d >= 0.95 && d <= 1.30) {
			r.addf("water_density", "%g t/m³ is not a density of water: give t/m³ between 0.95 and 1.30 (sea water 1.025, fresh 1.000)", d)
		} else {
			rho = d
		}
	}
	info.Description, _ = root.str("about", false, "a description of the vessel")
	r.checkText("about", info.Description, "the description")
	info.Condition, _ = root.str("condition", false, "the loading condition's name")
	r.checkName("condition", info.Condition, "condition's name")
	info.ShipType = "cargo"
	if s, ok := root.choice("ship_type", false, shipTypes); ok {
		info.ShipType = s
	}
	criteria := DefaultCriteria()
	if v, ok := root.get("criteria"); ok {
		criteria = r.criteria(v)
	}
	margin, marginOK := root.positive("margin_line_depth", "m below the deck at side", false)

	hull := r.hull(root, info)
	if hull != nil && marginOK && margin >= hull.DepthM {
		r.addf("margin_line_depth", "%g m is not less than the depth %g m: the margin line lies just below the deck (SOLAS: 0.076 m)", margin, hull.DepthM)
	}

	weights := r.weights(root.entries("weight", "one item of the loading condition"), hull)
	comps, cinfo := r.compartments(root.entries("compartment", "one space of the ship"), hull)
	openingTables := root.entries("opening", "a point where water would spread")
	openings := r.openings(openingTables)
	r.checkLeadsTo(openingTables, openings, comps)
	conns, warns := r.connections(root.entries("connection", "a door, hatch, duct or pipe between two compartments"), comps, len(r.probs) == 0)
	if hull != nil && (marginOK && margin < hull.DepthM || !root.has("margin_line_depth")) {
		r.marginBelowKeel(hull, margin, marginOK)
	}
	if hull != nil {
		r.openingsNearHull(hull, openings)
	}
	marks := r.draftMarks(root.entries("draft_mark", "a draft mark on the shell"), hull)
	girder := r.girder(root, hull)
	root.finish()

	if len(r.probs) > 0 || hull == nil {
		return nil, nil
	}
	v, err := engine.NewVessel(engine.Vessel{
		Name: name, WaterDensity: rho, Hull: hull, Weights: weights,
		Compartments: comps, Openings: openings, Connections: conns, MarginLineM: margin, CriteriaSets: criteria, ShipType: info.ShipType,
		DraftMarks: marks,
		Girder:     girder,
	})
	if err != nil {
		r.addf("weight", "%v", err)
		return nil, nil
	}
	info.Compartments = cinfo
	info.Warnings = warns
	return v, info
}

func (r *reader) criteria(v any) []string {
	a, ok := v.([]any)
	if !ok {
		r.addf("criteria", "must be an array of names, e.g. [%s], not %s", quotedList(criteriaSets), typeName(v))
		return nil
	}
	var out []string
	for i, e := range a {
		s, ok := e.(string)
		p := fmt.Sprintf("criteria[%d]", i+1)
		switch {
		case !ok:
			r.addf(p, "must be a criteria set's name in quotes, one of %s", quotedList(criteriaSets))
		case !contains(criteriaSets, s):
			r.addf(p, "%q is not a criteria set heelwatch knows: use %s", s, quotedList(criteriaSets))
		case contains(out, s):
			r.addf(p, "%q is listed twice", s)
		default:
			out = append(out, s)
		}
	}
	return out
}

// hull reads [hull] and builds the engine hull; nil when it cannot.
func (r *reader) hull(root *table, info *Info) *engine.Hull {
	t, ok := root.sub("hull", true, `shape = "box" or "sections", length, breadth, depth`)
	if !ok {
		return nil
	}
	defer t.finish()
	shape, shapeOK := t.choice("shape", true, []string{"box", "sections"})
	info.Shape = shape
	length, lOK := t.dimension("length", "m, between perpendiculars", true, 1000)
	breadth, bOK := t.dimension("breadth", "m, moulded", shape == "box", 200)
	depth, dOK := t.dimension("depth", "m, baseline to deck at side", shape == "box", 100)
	sections := t.entries("section", "one station's offsets")
	if !shapeOK {
		for _, s := range sections {
			s.get("x")
			s.get("offsets")
		}
		return nil
	}
	if shape == "box" {
		if len(sections) > 0 {
			r.addf(sections[0].path, `sections are read only with shape = "sections"; a box hull takes length, breadth and depth`)
		}
		for _, s := range sections {
			s.get("x")
			s.get("offsets")
		}
		if !lOK || !bOK || !dOK {
			return nil
		}
		h, err := engine.NewBoxHull(length, breadth, depth)
		if err != nil {
			r.addf("hull", "%v", err)
			return nil
		}
		return h
	}
	stations, ok := r.stations(t, sections)
	if !ok || !lOK {
		return nil
	}
	h, err := engine.NewSectionHull(length, stations)
	if err != nil {
		r.addf("hull.section", "%v", err)
		return nil
	}
	// Breadth and depth follow from the sections; if given they must agree.
	const tol = 0.01
	if bOK && math.Abs(breadth-h.BreadthM) > tol {
		r.addf("hull.breadth", "%g m disagrees with the sections' largest breadth %.3f m: leave breadth out or make it agree within %g m", breadth, h.BreadthM, tol)
	}
	if dOK && math.Abs(depth-h.DepthM) > tol {
		r.addf("hull.depth", "%g m disagrees with the sections' highest deck at side %.3f m: leave depth out or make it agree within %g m", depth, h.DepthM, tol)
	}
	return h
}

// stations reads the [[hull.section]] tables, reporting every problem.
func (r *reader) stations(t *table, sections []*table) ([]engine.Station, bool) {
	ok := true
	if len(sections) < 2 {
		r.addf("hull.section", `a hull of shape = "sections" needs at least two [[hull.section]] tables (found %d), aft to forward`, len(sections))
		ok = false
	}
	var out []engine.Station
	prevX, havePrev := 0.0, false
	for _, s := range sections {
		x, xOK := s.num("x", "m from the aft perpendicular", true)
		if xOK && havePrev && !(x > prevX) {
			r.addf(s.keyPath("x"), "%g m is not forward of the section before (x = %g m): give sections aft to forward with x increasing", x, prevX)
			ok = false
		}
		if xOK {
			prevX, havePrev = x, true
		} else {
			ok = false
		}
		off, offOK := r.offsets(s)
		s.finish()
		ok = ok && offOK
		out = append(out, engine.Station{X: x, Offsets: off})
	}
	return out, ok && !r.spanTooLong(out)
}

func (r *reader) offsets(s *table) ([]engine.Point, bool) {
	pts, ok := r.pointPairs(s, "offsets", "half_breadth, z", "give the starboard half outline as [[half_breadth, z], …] from the keel up to the deck at side")
	if pts == nil {
		return nil, false
	}
	if ok && len(pts) < 2 {
		r.addf(s.keyPath("offsets"), "has %d point(s): an outline needs at least two [half_breadth, z] pairs, keel to deck", len(pts))
		return nil, false
	}
	p := s.keyPath("offsets")
	out := make([]engine.Point, 0, len(pts))
	for _, q := range pts {
		y, z := q.Y, q.Z
		descends := len(out) > 0 && z < out[len(out)-1].Z
		if y > maxHalfBreadth || z > maxHeight || y < 0 || z < 0 || descends {
			// Only a refused point needs its key path.
			ep := elemPath(p, q.at)
			if r.pointTooFar(ep, y, z) {
				ok = false
			}
			if y < 0 {
				r.addf(ep, "half-breadth %g m is negative: give the starboard half, 0 or more", y)
				ok = false
			}
			if z < 0 {
				r.addf(ep, "height %g m is below the baseline: z must be 0 or more", z)
				ok = false
			}
			if descends {
				r.addf(ep, "height %g m is below the point before (%g m): heights must ascend from the keel to the deck", z, out[len(out)-1].Z)
				ok = false
			}
		}
		out = append(out, q.Point)
	}
	if ok && !(out[len(out)-1].Z > out[0].Z) {
		r.addf(s.keyPath("offsets"), "the last point (the deck at side) is not above the first (the keel)")
		ok = false
	}
	return out, ok
}

// pointAt is a point read from a file with the place it was read at: the
// 1-based index of its pair in the array (its key path is elemPath(array's
// path, at), built only for a message).
type pointAt struct {
	engine.Point
	at int
}

// pointPairs reads the array key of s as [a, b] pairs of finite metres
// (names says what a and b are, as "y, z"), each with its key path. A
// missing key says missing; nil means nothing could be read; ok is false
// if any pair was refused (the others are still returned).
func (r *reader) pointPairs(s *table, key, names, missing string) ([]pointAt, bool) {
	v, present := s.get(key)
	p := s.keyPath(key)
	if !present {
		r.addf(p, "missing: %s", missing)
		return nil, false
	}
	a, isArr := v.([]any)
	if !isArr {
		r.addf(p, "must be an array of [%s] pairs in metres, not %s", names, typeName(v))
		return nil, false
	}
	ok := true
	out := make([]pointAt, 0, len(a))
	for j, e := range a {
		pair, isPair := e.([]any)
		if !isPair || len(pair) != 2 {
			r.addf(elemPath(p, j+1), "must be a pair [%s] in metres, not %s", names, describe(e))
			ok = false
			continue
		}
		y, yOK := number(pair[0])
		z, zOK := number(pair[1])
		switch {
		case !yOK || !zOK:
			r.addf(elemPath(p, j+1), "must be two numbers [%s] in metres", names)
			ok = false
			continue
		case math.IsNaN(y) || math.IsInf(y, 0) || math.IsNaN(z) || math.IsInf(z, 0) || math.Abs(y) > maxMagnitude || math.Abs(z) > maxMagnitude:
			r.addf(elemPath(p, j+1), "[%v, %v] is not a pair of finite metres (at most %g in size)", y, z, maxMagnitude)
			ok = false
			continue
		}
		out = append(out, pointAt{engine.Point{Y: y, Z: z}, j + 1})
	}
	return out, ok
}

// weights reads the [[weight]] tables.
func (r *reader) weights(ts []*table, hull *engine.Hull) []engine.Weight {
	if len(ts) == 0 {
		r.addf("weight", "missing: the loading condition needs at least one [[weight]] (lightship at least) with name, mass, lcg, vcg")
	}
	return r.weightTables(ts, map[string]string{}, hull)
}

// weightTables reads [[weight]] tables, each with name (unique ignoring
// case among those in seen), mass, lcg, tcg, vcg, fsm and the extent x.
func (r *reader) weightTables(ts []*table, seen map[string]string, hull *engine.Hull) []engine.Weight {
	var out []engine.Weight
	for _, t := range ts {
		var w engine.Weight
		w.Name, _ = r.name(t, seen, "weight")
		w.MassT, _ = t.positive("mass", "t", true)
		var lcgOK bool
		w.LCGM, lcgOK = t.num("lcg", "m from the aft perpendicular", true)
		w.TCGM, _ = t.num("tcg", "m from the centreline, + to starboard", false)
		w.VCGM, _ = t.num("vcg", "m above the baseline", true)
		if f, ok := t.num("fsm", "t·m", false); ok {
			if f < 0 {
				r.addf(t.keyPath("fsm"), "%g t·m is negative: a free-surface moment is 0 or more", f)
			}
			w.FSMTm = f
		}
		w.ExtentM = r.weightExtent(t, w.LCGM, lcgOK, hull)
		t.finish()
		out = append(out, w)
	}
	return out
}

// name reads a unique, non-empty name. seen maps folded names to the key
// that used them first.
func (r *reader) name(t *table, seen map[string]string, what string) (string, bool) {
	n, ok := t.str("name", true, "the "+what+"'s name in quotes")
	if !ok {
		return "", false
	}
	p := t.keyPath("name")
	if strings.TrimSpace(n) == "" {
		r.addf(p, "is empty: every %s needs a name", what)
		return n, false
	}
	if !r.checkName(p, n, what+"'s name") {
		return n, false
	}
	if what != "weight" && strings.Contains(n, ",") {
		r.addf(p, "%q holds a comma: %s names may not (the command line separates names with commas)", n, what)
	}
	fold := strings.ToLower(strings.TrimSpace(n))
	if first, dup := seen[fold]; dup {
		r.addf(p, "%q is already the name of %s: each %s needs its own name (names that differ only in case count as the same)", n, first, what)
		return n, false
	}
	seen[fold] = t.path
	return n, true
}

// compartments reads the [[compartment]] tables and builds them on hull
// (nil if the hull could not be built: then only the file's own checks run).
//
// It works in three passes: each table is read in file order (its
// problems kept aside), the solids of those read well are built at once
// (buildSolids, concurrently), and then, in file order again, each
// compartment's problems are recorded, followed by those found building
// it, filling it and checking it against the ones before. The problems
// come out in the same order as if each compartment were read and built
// before the next.
func (r *reader) compartments(ts []*table, hull *engine.Hull) ([]*engine.Compartment, []CompartmentInfo) {
	names := map[string]string{}
	reads := make([]compartmentRead, len(ts))
	for i, t := range ts {
		mark := len(r.probs)
		reads[i] = r.compartment(t, names, hull)
		reads[i].probs = append(Problems(nil), r.probs[mark:]...)
		r.probs = r.probs[:mark]
	}
	buildSolids(hull, reads)
	var out []*engine.Compartment
	var infos []CompartmentInfo
	var paths []string
	for i := range reads {
		cr := &reads[i]
		t, name := cr.t, cr.name
		r.probs = append(r.probs, cr.probs...)
		if !cr.build {
			continue
		}
		c, err := cr.c, cr.err
		if err != nil {
			if cr.secs != nil {
				r.addf(t.keyPath("section"), "%v", err)
			} else {
				bx, by, bz := cr.box.X0, cr.box.Y0, cr.box.Z0
				r.addf(t.path, "%q holds no part of the hull: its box x [%g, %g], y [%g, %g], z [%g, %g] lies outside the shell", name, bx, cr.box.X1, by, cr.box.Y1, bz, cr.box.Z1)
			}
			continue
		}
		c.Use = cr.ci.Use
		c.Permeability = cr.mu
		c.PumpM3h = cr.ci.PumpM3h
		c.Pipe = cr.ci.SoundingPipe
		if liquid := cr.liquid; liquid != nil {
			if liquid.volumeM3 >= 0 {
				if vol := c.CapacityM3(); liquid.volumeM3 > vol*(1+1e-9) {
					r.addf(t.keyPath("fill_m3"), "%g m³ is more than the tank holds (%.1f m³: permeability %g × %.1f m³ inside the hull)", liquid.volumeM3, vol, c.Permeability, c.Volume())
				} else {
					liquid.Fill = math.Min(liquid.volumeM3/vol, 1)
				}
			}
			c.Liquid = &liquid.Liquid
		}
		for j, o := range out {
			if v := overlapM3(hull, o, c); v > 0 {
				r.addf(t.path, "%q overlaps %s %q by %.3g m³ inside the hull: compartments may touch but not overlap", name, paths[j], o.Name, v)
			}
		}
		out = append(out, c)
		infos = append(infos, cr.ci)
		paths = append(paths, t.path)
	}
	return out, infos
}

// compartmentRead is one [[compartment]] table as read: what the engine
// needs to build its solid, what is set on it once built, and the problems
// found reading it.
type compartmentRead struct {
	t      *table
	name   string
	mu     float64 // permeability, given or the use's default
	ci     CompartmentInfo
	liquid *tankLiquid
	box    engine.Box                  // the compartment's box (given, or that of its sections)
	secs   []engine.CompartmentSection // nil for a box
	build  bool                        // read well enough, on a hull, to build its solid
	probs  Problems                    // found reading the table

	c   *engine.Compartment // built (buildSolids), nil with err when it could not be
	err error
}

// compartment reads one [[compartment]] table (names maps the folded
// names of the compartments before it to their paths) and reports its
// problems.
func (r *reader) compartment(t *table, names map[string]string, hull *engine.Hull) compartmentRead {
	name, _ := r.name(t, names, "compartment")
	use, useOK := t.choice("use", true, useNames)
	cr := compartmentRead{t: t, name: name}
	ci := &cr.ci
	ci.Use = use
	mu, muGiven := t.num("permeability", "fraction, 0 < μ ≤ 1", false)
	if muGiven && !(mu > 0 && mu <= 1) {
		def := ""
		if useOK {
			def = fmt.Sprintf(", or leave it out for the default %.2f of use %q", uses[use].permeability, use)
		}
		r.addf(t.keyPath("permeability"), "%g is outside (0, 1]: give the fraction of the space water can fill, above 0 and at most 1%s", mu, def)
		muGiven = false
	}
	if !muGiven && useOK {
		mu = uses[use].permeability
		ci.DefaultPermeabilityFromUse = true
	}
	cr.mu = mu
	secs, secBox, secsOK := r.sectionOutlines(t)
	var bx, by, bz [2]float64
	xOK, yOK, zOK := secsOK, secsOK, secsOK
	if secs == nil {
		bx, xOK = t.bounds("x", "aft and forward bounds")
		by, yOK = t.bounds("y", "port and starboard bounds")
		bz, zOK = t.bounds("z", "bottom and top")
	}
	box := engine.Box{X0: bx[0], X1: bx[1], Y0: by[0], Y1: by[1], Z0: bz[0], Z1: bz[1]}
	if secs != nil {
		box = secBox
	}
	cr.box, cr.secs = box, secs
	ci.Group = uses[use].group
	if g, ok := t.str("group", false, "the compartment's group, e.g. \"double bottom\""); ok {
		if strings.TrimSpace(g) == "" {
			r.addf(t.keyPath("group"), "is empty: give a group name or leave the key out")
		} else if r.checkName(t.keyPath("group"), g, "group's name") {
			ci.Group = g
		}
	}
	cr.liquid = r.liquid(t, use, useOK)
	ci.Hole = r.hole(t, box, xOK && yOK && zOK)
	if p, ok := t.num("pump_m3h", "m³/h", false); ok {
		if p < 0 {
			r.addf(t.keyPath("pump_m3h"), "%g m³/h is negative: pumping capacity is 0 or more", p)
		}
		ci.PumpM3h = p
	}
	ci.SoundingPipe = r.soundingPipe(t, box, xOK && yOK && zOK)
	t.finish()
	cr.build = hull != nil && xOK && yOK && zOK && r.insideHull(t, hull, box)
	return cr
}

// insideHull reports (and returns false) when box reaches beyond the hull's
// bounding box: x outside the stations, |y| beyond half the breadth, z below
// the baseline or above the highest deck at side.
func (r *reader) insideHull(t *table, h *engine.Hull, b engine.Box) bool {
	st := h.Stations()
	x0, x1 := st[0].X, st[len(st)-1].X
	half := h.BreadthM / 2
	const tol = 1e-6
	ok := true
	if b.X0 < x0-tol || b.X1 > x1+tol {
		r.addf(t.keyPath("x"), "[%g, %g] reaches beyond the hull, which runs from x = %g to %g m", b.X0, b.X1, x0, x1)
		ok = false
	}
	if b.Y0 < -half-tol || b.Y1 > half+tol {
		r.addf(t.keyPath("y"), "[%g, %g] reaches beyond the hull's sides at y = ±%g m", b.Y0, b.Y1, half)
		ok = false
	}
	if b.Z0 < -tol || b.Z1 > h.DepthM+tol {
		r.addf(t.keyPath("z"), "[%g, %g] reaches beyond the hull, from the baseline z = 0 to the deck at side z = %g m", b.Z0, b.Z1, h.DepthM)
		ok = false
	}
	return ok
}

// overlap returns the volume inside the hull common to two boxes (0 if they
// only touch or meet outside the shell).
func overlap(h *engine.Hull, a, b engine.Box) float64 {
	const tol = 1e-6
	c := engine.Box{
		X0: math.Max(a.X0, b.X0), X1: math.Min(a.X1, b.X1),
		Y0: math.Max(a.Y0, b.Y0), Y1: math.Min(a.Y1, b.Y1),
		Z0: math.Max(a.Z0, b.Z0), Z1: math.Min(a.Z1, b.Z1),
	}
	if !(c.X1-c.X0 > tol && c.Y1-c.Y0 > tol && c.Z1-c.Z0 > tol) {
		return 0
	}
	cc, err := engine.NewCompartment(h, "", c)
	if err != nil {
		return 0
	}
	return cc.Volume()
}

// tankLiquid is a tank's contents as read; volumeM3 ≥ 0 when given as a
// volume (converted to a fill once the tank's volume is known).
type tankLiquid struct {
	engine.Liquid
	volumeM3 float64
}

// liquid reads a tank's liquid, liquid_density and fill or fill_m3.
func (r *reader) liquid(t *table, use string, useOK bool) *tankLiquid {
	name, nameOK := t.str("liquid", false, "what the tank holds, e.g. \"fuel oil\"")
	nameOK = nameOK && r.checkName(t.keyPath("liquid"), name, "liquid's name")
	dens, densOK := t.positive("liquid_density", "t/m³", false)
	fill, fillOK := t.num("fill", "fraction of the tank, 0 to 1", false)
	vol, volOK := t.num("fill_m3", "m³", false)
	given := t.has("liquid") || t.has("liquid_density") || t.has("fill") || t.has("fill_m3")
	if !given {
		return nil
	}
	if useOK && use != "tank" {
		r.addf(t.keyPath("liquid"), `only a compartment with use = "tank" holds liquid (this one is %q)`, use)
		return nil
	}
	if !t.has("liquid") {
		r.addf(t.keyPath("liquid"), `missing: a tank given liquid_density, fill or fill_m3 needs liquid = "…" (what it holds)`)
	}
	if !t.has("liquid_density") {
		r.addf(t.keyPath("liquid_density"), "missing: give the liquid's density in t/m³ (e.g. sea water 1.025, fresh water 1.000)")
	}
	if densOK && dens > 3 {
		r.addf(t.keyPath("liquid_density"), "%g t/m³ is not a liquid's density: give t/m³ (e.g. fuel oil 0.95), at most 3", dens)
		densOK = false
	}
	switch {
	case t.has("fill") && t.has("fill_m3"):
		r.addf(t.keyPath("fill_m3"), "give fill (a fraction) or fill_m3 (a volume), not both")
		return nil
	case !t.has("fill") && !t.has("fill_m3"):
		r.addf(t.keyPath("fill"), "missing: say how full the tank is, fill = 0.0 to 1.0 (fraction) or fill_m3 (m³)")
		return nil
	}
	l := &tankLiquid{Liquid: engine.Liquid{Name: name, Density: dens}, volumeM3: -1}
	if fillOK {
		if !(fill >= 0 && fill <= 1) {
			r.addf(t.keyPath("fill"), "%g is outside [0, 1]: give the fraction of the tank filled%s", fill, percentHint(fill))
			return nil
		}
		l.Fill = fill
	} else if volOK {
		if vol < 0 {
			r.addf(t.keyPath("fill_m3"), "%g m³ is negative: give the volume of liquid, 0 or more", vol)
			return nil
		}
		l.volumeM3 = vol
	} else {
		return nil
	}
	if !nameOK || !densOK {
		return nil
	}
	return l
}

// hole reads a compartment's hole table.
func (r *reader) hole(t *table, b engine.Box, boxOK bool) *engine.Hole {
	h, ok := t.sub("hole", false, "area, z and optionally x, y, cd")
	if !ok {
		return nil
	}
	defer h.finish()
	area, aOK := h.positive("area", "m²", true)
	x, xOK := h.num("x", "m", false)
	y, yOK := h.num("y", "m", false)
	z, zOK := h.num("z", "m above the baseline", true)
	cd, cdOK := h.num("cd", "discharge coefficient", false)
	if !cdOK {
		cd = DefaultCd
		if h.has("cd") {
			return nil
		}
	} else if !(cd > 0 && cd <= 1) {
		r.addf(h.keyPath("cd"), "%g is outside (0, 1]: a discharge coefficient is about 0.6 for a sharp-edged hole, 0.7 for a ragged one", cd)
		return nil
	}
	if !xOK {
		x = (b.X0 + b.X1) / 2
		if h.has("x") {
			return nil
		}
	}
	if !yOK {
		y = (b.Y0 + b.Y1) / 2
		if h.has("y") {
			return nil
		}
	}
	if !aOK || !zOK || !boxOK {
		return nil
	}
	const tol = 1e-6
	for _, c := range []struct {
		key    string
		v      float64
		lo, hi float64
	}{{"x", x, b.X0, b.X1}, {"y", y, b.Y0, b.Y1}, {"z", z, b.Z0, b.Z1}} {
		if c.v < c.lo-tol || c.v > c.hi+tol {
			r.addf(h.keyPath(c.key), "%g m is outside the compartment's %s bounds [%g, %g]: the hole must lead into it", c.v, c.key, c.lo, c.hi)
			return nil
		}
	}
	return &engine.Hole{AreaM2: area, XM: x, YM: y, ZM: z, Cd: cd}
}

// openings reads the [[opening]] tables.
func (r *reader) openings(ts []*table) []engine.Opening {
	names := map[string]string{}
	var out []engine.Opening
	for _, t := range ts {
		var o engine.Opening
		o.Name, _ = r.name(t, names, "opening")
		o.X, _ = t.num("x", "m from the aft perpendicular", true)
		o.Y, _ = t.num("y", "m from the centreline, + to starboard", true)
		var zOK bool
		o.Z, zOK = t.num("z", "m above the baseline", true)
		if zOK && o.Z < 0 {
			r.addf(t.keyPath("z"), "%g m is below the baseline: an opening's z is 0 or more", o.Z)
		}
		o.Kind = "other"
		if k, ok := t.choice("kind", false, openingKinds); ok {
			o.Kind = k
		}
		o.Weathertight, _ = t.boolean("closed_weathertight")
		o.LeadsTo = r.leadsTo(t)
		r.openingArea(t, &o)
		t.finish()
		out = append(out, o)
	}
	return out
}

// tomlText writes a TOML value roughly as it was written, for messages.
func tomlText(v any) string {
	switch x := v.(type) {
	case string:
		return fmt.Sprintf("%q", x)
	case float64:
		return strconv.FormatFloat(x, 'f', -1, 64)
	}
	return fmt.Sprint(v)
}
