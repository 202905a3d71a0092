package vessels

import (
	"fmt"
	"math"
	"strings"

	"heelwatch/engine"
)

// Condition is a loading condition kept apart from the ship: the weights on
// board and each tank's contents, read from a condition file (FORMAT.md,
// "Condition files") or set on the dashboard. Applied to the ship it was
// read for (Apply), it replaces the vessel file's whole loading condition:
// the vessel file's weights give way to Weights, and every tank's contents
// to Tanks (a tank not named is empty).
type Condition struct {
	File string // the file it was read from, "" if made on the dashboard
	Name string // the condition's name, free text ("" if not given)
	// Weights is every weight of the condition: those of the vessel file
	// it keeps (the keep key) first, then its own, in the file's order.
	Weights []engine.Weight
	// Tanks is the contents of each tank the condition names, one entry per
	// tank, in the file's order.
	Tanks []TankFill
	// Sounded is true when the file says how the ship lay when the tanks
	// were sounded (heel_deg, trim_m); then soundings are read at that
	// heel and trim, else at the heel and trim she lies at with the
	// condition applied (Apply).
	Sounded        bool
	SoundedHeelDeg float64
	SoundedTrimM   float64
}

// TankFill is one tank's contents in a condition.
type TankFill struct {
	Compartment int           // index in engine.Vessel.Compartments
	Liquid      engine.Liquid // name and density; Fill is the fraction of capacity (by sounding: worked out by Apply)
	// SoundingM is the sounding at the tank's pipe (m) when the contents
	// are given by sounding, else negative.
	SoundingM float64
	Pipe      engine.SoundingPipe // the tank's sounding pipe
	// Where the tank was given, for messages ("" and 0 when set on the
	// dashboard).
	File, Key string
	Line      int
}

// BySounding reports whether the tank's contents are given by sounding.
func (t TankFill) BySounding() bool { return t.SoundingM >= 0 }

// LoadCondition reads the condition file at path for the ship v (info as
// read with v; may be nil).
func LoadCondition(path string, v *engine.Vessel, info *Info) (*Condition, error) {
	data, err := readRegular(path)
	if err != nil {
		return nil, fmt.Errorf("condition file: %w", err)
	}
	return ParseCondition(path, data, v, info)
}

// ParseCondition reads a condition file for the ship v (as read from her
// vessel file; info may be nil). Every problem comes back at once as
// Problems with file, line and key: a tank or weight name the ship does not
// have (matched ignoring case), a tank named twice, contents given two ways
// or none, more than the tank holds (its capacity is μ × its volume inside
// the hull), a sounding above the tank's top at its pipe.
func ParseCondition(file string, data []byte, v *engine.Vessel, info *Info) (*Condition, error) {
	r, root, err := decode(file, data)
	if err != nil {
		return nil, err
	}
	if k := stateOnlyKey(root); k != "" {
		r.addf(k, "this is a saved state (it holds %s, which a condition file does not), not a condition file: take it up on the dashboard with heelwatch --resume %s", k, file)
		return nil, r.probs.sorted()
	}
	c := r.condition(root, v, info)
	root.finish()
	if len(r.probs) > 0 {
		return nil, r.probs.sorted()
	}
	c.File = file
	return c, nil
}

// condition reads the condition's keys from root (a condition file, or a
// saved state file, which holds more).
func (r *reader) condition(root *table, v *engine.Vessel, info *Info) *Condition {
	c := &Condition{}
	r.format(root)
	if n, ok := root.str("name", false, "the condition's name in quotes"); ok && r.checkName("name", n, "condition's name") {
		c.Name = n
	}
	if h, ok := root.num("heel_deg", "degrees, + starboard down, as she lay when the tanks were sounded", false); ok {
		if math.Abs(h) >= 60 {
			r.addf("heel_deg", "%g° is no heel a tank is sounded at: give the heel she lay at when sounded, less than 60°", h)
		}
		c.Sounded, c.SoundedHeelDeg = true, h
	}
	if t, ok := root.num("trim_m", "m, + by the stern, as she lay when the tanks were sounded", false); ok {
		if math.Abs(t) > v.Hull.DepthM {
			r.addf("trim_m", "%g m is more than her depth (%g m): give the trim she lay at when sounded", t, v.Hull.DepthM)
		}
		c.Sounded, c.SoundedTrimM = true, t
	}
	if root.has("heel_deg") != root.has("trim_m") {
		r.addf("heel_deg", "give both heel_deg and trim_m (how she lay when sounded), or neither (then she is taken as she lies with this condition)")
	}
	c.Weights = r.keptWeights(root, v)
	ts := root.entries("weight", "one weight of the condition")
	if len(ts) > 0 {
		seen := map[string]string{}
		for _, w := range c.Weights {
			seen[strings.ToLower(w.Name)] = "a weight kept from the vessel file"
		}
		own := r.weightTables(ts, seen, v.Hull) // as in a vessel file
		c.Weights = append(c.Weights, own...)
	}
	if len(ts) == 0 && !root.has("keep") {
		r.addf("weight", "missing: a condition needs its weights: [[weight]] tables (lightship included), or keep = [names] of the vessel file's")
	}
	// Soundings are checked against full as she lay when sounded if the
	// file says so, else upright and level (Apply reads a sounding past
	// full at her own heel and trim as full).
	slope := engine.Plane{}
	if c.Sounded && v.Hull != nil {
		slope = engine.Plane{B: -c.SoundedTrimM / v.Hull.LengthM, C: math.Tan(c.SoundedHeelDeg * math.Pi / 180)}
	}
	c.Tanks = r.tankFills(root.entries("tank", "one tank's contents"), v, info, slope)
	if n := r.named; n.unknown >= 3 && n.unknown > n.known {
		r.addf("name", "%d of the %d weights and tanks named here are not %s's: is this condition written for another ship?", n.unknown, n.unknown+n.known, v.Name)
	}
	return c
}

// keptWeights reads keep = ["name", …]: the vessel file's weights the
// condition keeps (lightship, as a rule).
func (r *reader) keptWeights(root *table, v *engine.Vessel) []engine.Weight {
	raw, present := root.get("keep")
	if !present {
		return nil
	}
	a, ok := raw.([]any)
	if !ok {
		r.addf("keep", "must be an array of the vessel file's weight names, e.g. [\"Lightship\"], not %s", typeName(raw))
		return nil
	}
	var out []engine.Weight
	var names []string
	for _, w := range v.Weights {
		names = append(names, w.Name)
	}
	taken := map[int]bool{}
	for i, e := range a {
		p := fmt.Sprintf("keep[%d]", i+1)
		s, ok := e.(string)
		if !ok {
			r.addf(p, "must be a weight's name in quotes, not %s", typeName(e))
			continue
		}
		idx := -1
		for j, w := range v.Weights {
			if strings.EqualFold(strings.TrimSpace(w.Name), strings.TrimSpace(s)) {
				idx = j
			}
		}
		if idx < 0 {
			r.named.unknown++
		} else {
			r.named.known++
		}
		switch {
		case idx < 0:
			msg := fmt.Sprintf("%q is not a weight of the vessel file (its weights: %s)", s, quotedList(names))
			if c := closest(s, names); c != "" {
				msg = fmt.Sprintf("%q is not a weight of the vessel file (did you mean %q?)", s, c)
			}
			r.addf(p, "%s", msg)
		case taken[idx]:
			r.addf(p, "%q is kept twice", s)
		default:
			taken[idx] = true
			out = append(out, v.Weights[idx])
		}
	}
	return out
}

// tankAmounts are the keys that say how much a tank holds: exactly one.
var tankAmounts = []string{"fill", "volume_m3", "mass_t", "sounding_m"}

// tankFills reads the [[tank]] tables (tankFill), soundings checked at the
// water plane's slopes slope.
func (r *reader) tankFills(ts []*table, v *engine.Vessel, info *Info, slope engine.Plane) []TankFill {
	var out []TankFill
	seen := map[int]string{}
	for _, t := range ts {
		tf, ok := r.tankFill(t, v, info, seen, slope)
		t.finish()
		if ok {
			out = append(out, tf)
		}
	}
	return out
}

// tankFill reads one [[tank]] table: the tank's compartment, its liquid and
// exactly one amount (tankAmounts); false when it is refused, the problem
// recorded. seen maps each compartment given already to the key path of
// its table (a tank given twice is refused); slope is the water plane's
// slopes (B = −trim/L, C = tan heel) a sounding is checked against full at
// (engine.Compartment.FullSoundingM).
func (r *reader) tankFill(t *table, v *engine.Vessel, info *Info, seen map[int]string, slope engine.Plane) (TankFill, bool) {
	tf := TankFill{SoundingM: -1, File: r.file, Key: t.path, Line: r.lines.line(t.path)}
	name, nameOK := t.str("name", true, "the tank's compartment name in quotes")
	liquid, liquidOK := t.str("liquid", false, "what the tank holds, e.g. \"fuel oil\"")
	liquidOK = liquidOK && r.checkName(t.keyPath("liquid"), liquid, "liquid's name")
	dens, densOK := t.positive("liquid_density", "t/m³", false)
	var given []string
	amounts := map[string]float64{}
	for _, k := range tankAmounts {
		if f, ok := t.num(k, tankAmountUnit(k), false); ok {
			amounts[k] = f
		}
		if t.has(k) {
			given = append(given, k)
		}
	}
	if !nameOK {
		return tf, false
	}
	idx := -1
	var names []string
	for i, c := range v.Compartments {
		names = append(names, c.Name)
		if strings.EqualFold(strings.TrimSpace(c.Name), strings.TrimSpace(name)) {
			idx = i
		}
	}
	if idx < 0 {
		r.named.unknown++
	} else {
		r.named.known++
	}
	if idx < 0 {
		msg := fmt.Sprintf("%q is not a compartment of the vessel", name)
		if c := closest(name, names); c != "" {
			msg += fmt.Sprintf(" (did you mean %q?)", c)
		}
		r.addf(t.keyPath("name"), "%s", msg)
		return tf, false
	}
	c := v.Compartments[idx]
	tf.Compartment = idx
	if c.Use != "tank" {
		r.addf(t.keyPath("name"), "%q is a %s, not a tank: only a compartment with use = \"tank\" holds liquid", c.Name, c.Use)
		return tf, false
	}
	if first, dup := seen[idx]; dup {
		r.addf(t.keyPath("name"), "%q is already given by %s: name each tank once", c.Name, first)
		return tf, false
	}
	seen[idx] = t.path
	// The liquid: the condition's, else the vessel file's.
	if c.Liquid != nil {
		tf.Liquid = engine.Liquid{Name: c.Liquid.Name, Density: c.Liquid.Density}
	}
	if liquidOK {
		tf.Liquid.Name = liquid
	}
	if densOK {
		if dens > 3 {
			r.addf(t.keyPath("liquid_density"), "%g t/m³ is not a liquid's density: give t/m³ (e.g. fuel oil 0.95), at most 3", dens)
			return tf, false
		}
		tf.Liquid.Density = dens
	}
	if tf.Liquid.Name == "" && !t.has("liquid") {
		r.addf(t.keyPath("liquid"), "missing: the vessel file says nothing of what %q holds: give liquid = \"…\"", c.Name)
	}
	if tf.Liquid.Density == 0 && !t.has("liquid_density") {
		r.addf(t.keyPath("liquid_density"), "missing: the vessel file gives no density for %q: give liquid_density in t/m³ (sea water 1.025, fresh water 1.000)", c.Name)
	}
	switch len(given) {
	case 0:
		r.addf(t.path, "says nothing of how much %q holds: give one of %s", c.Name, listOf(tankAmounts))
		return tf, false
	case 1:
	default:
		r.addf(t.keyPath(given[1]), "give one of %s, not both %s and %s", listOf(tankAmounts), given[0], given[1])
		return tf, false
	}
	k := given[0]
	f, ok := amounts[k]
	if !ok || tf.Liquid.Name == "" || !(tf.Liquid.Density > 0) {
		return tf, false
	}
	p := t.keyPath(k)
	capM3 := c.CapacityM3()
	over := func(vol float64) {
		r.addf(p, "%s is more than %q holds (%.1f m³ = %.1f t of %s: permeability %g × %.1f m³ inside the hull)", tankAmountText(k, f), c.Name, capM3, capM3*tf.Liquid.Density, tf.Liquid.Name, c.Permeability, c.Volume())
	}
	if f < 0 {
		r.addf(p, "%g is negative: give %s, 0 or more", f, tankAmountUnit(k))
		return tf, false
	}
	const tol = 1e-9
	switch k {
	case "fill":
		if f > 1 {
			r.addf(p, "%g is more than 1: fill is a fraction of the tank's capacity (μ × its volume inside the hull), 0 to 1%s", f, percentHint(f))
			return tf, false
		}
		tf.Liquid.Fill = f
	case "volume_m3", "mass_t":
		vol := f
		if k == "mass_t" {
			vol = f / tf.Liquid.Density
		}
		if vol > capM3*(1+tol) {
			over(vol)
			return tf, false
		}
		tf.Liquid.Fill = math.Min(vol/capM3, 1)
	case "sounding_m":
		tf.Pipe = c.SoundingPipe() // the file's sounding_pipe, else at the tank's lowest point
		full, err := c.FullSoundingM(tf.Pipe, slope)
		if err != nil {
			r.addf(p, "%v: give the compartment a sounding_pipe = [x, y] inside it in the vessel file", err)
			return tf, false
		}
		if f > full+1e-9 {
			r.addf(p, "%g m is more than %q can sound: it is full at %.3f m at its sounding pipe (x = %.2f m, y = %.2f m)", f, c.Name, full, tf.Pipe.X, tf.Pipe.Y)
			return tf, false
		}
		tf.SoundingM = f
	}
	return tf, true
}

// percentHint is the hint for a fill that looks written in per cent (from
// 2 to 100): ": did you mean 0.80 (80 %)?"; "" otherwise.
func percentHint(f float64) string {
	if !(f >= 2 && f <= 100) {
		return ""
	}
	return fmt.Sprintf(": did you mean %s (%g %%)?", strconvTrim(f/100), f)
}

// strconvTrim writes a fraction with two decimals at least and no
// trailing zeros beyond them: 0.80, 0.555, 1.00.
func strconvTrim(x float64) string {
	s := fmt.Sprintf("%.6f", x)
	for strings.HasSuffix(s, "0") && len(s)-strings.Index(s, ".") > 3 {
		s = s[:len(s)-1]
	}
	return s
}

func tankAmountUnit(k string) string {
	switch k {
	case "fill":
		return "fraction of the tank's capacity, 0 to 1"
	case "volume_m3":
		return "m³ of liquid"
	case "mass_t":
		return "tonnes of liquid"
	}
	return "m, sounded at the tank's pipe from its bottom"
}

func tankAmountText(k string, f float64) string {
	switch k {
	case "volume_m3":
		return fmt.Sprintf("%g m³", f)
	case "mass_t":
		return fmt.Sprintf("%g t", f)
	}
	return fmt.Sprint(f)
}

// stateOnlyKey returns the first top-level key of root that only a saved
// state file holds (vessel, space, connection_state, reading), or "".
func stateOnlyKey(root *table) string {
	for _, k := range []string{"space", "connection_state", "reading", "vessel"} {
		if root.has(k) {
			return k
		}
	}
	return ""
}
