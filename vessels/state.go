package vessels

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"

	"github.com/BurntSushi/toml"

	"heelwatch/engine"
)

// State is a whole situation saved from the dashboard to be taken up
// again later (FORMAT.md, "State files"): the loading condition, the
// damage (each compartment open to the sea or holding water, with its
// permeability), each connection's state, and the readings taken.
type State struct {
	Vessel    string // where the ship came from: a bundled name or a vessel file's path ("" if not said)
	Condition *Condition
	Damage    engine.Damage
	// ConnectionsOpen is each connection's state, index-aligned with
	// engine.Vessel.Connections.
	ConnectionsOpen []bool
	Readings        []engine.Reading
}

// LoadState reads the state file at path for the ship v (as read from her
// vessel file; info may be nil).
func LoadState(path string, v *engine.Vessel, info *Info) (*State, error) {
	data, err := readRegular(path)
	if err != nil {
		return nil, fmt.Errorf("state file: %w", err)
	}
	return ParseState(path, data, v, info)
}

// StateVessel returns the vessel a state file says it was saved for ("" if
// it does not say), so that the dashboard can open her without --vessel.
func StateVessel(path string) (string, error) {
	data, err := readRegular(path)
	if err != nil {
		return "", fmt.Errorf("state file: %w", err)
	}
	var doc struct {
		Vessel string `toml:"vessel"`
	}
	if _, err := toml.Decode(string(data), &doc); err != nil {
		return "", syntaxProblem(path, err)
	}
	return doc.Vessel, nil
}

// ParseState reads a state file: a condition file's keys (the condition),
// and vessel, [[space]], [[connection_state]] and [[reading]] tables.
// Every problem comes back at once as Problems with file, line and key.
func ParseState(file string, data []byte, v *engine.Vessel, info *Info) (*State, error) {
	r, root, err := decode(file, data)
	if err != nil {
		return nil, err
	}
	s := &State{Damage: v.Intact(), ConnectionsOpen: make([]bool, len(v.Connections))}
	for i, c := range v.Connections {
		s.ConnectionsOpen[i] = c.Open
	}
	s.Vessel, _ = root.str("vessel", false, "the vessel's bundled name or file")
	s.Condition = r.condition(root, v, info)
	for _, t := range root.entries("space", "one compartment's damage") {
		r.spaceState(t, v, s.Damage)
		t.finish()
	}
	for _, t := range root.entries("connection_state", "one connection open or shut") {
		r.connectionState(t, v, s.ConnectionsOpen)
		t.finish()
	}
	for _, t := range root.entries("reading", "what the crew read at one moment") {
		rd, _ := r.reading(t, v)
		s.Readings = append(s.Readings, rd)
	}
	root.finish()
	if len(r.probs) > 0 {
		return nil, r.probs.sorted()
	}
	s.Condition.File = file
	return s, nil
}

// compartmentIndex finds a compartment by name ignoring case, reporting an
// unknown one at path.
func (r *reader) compartmentIndex(path, name string, v *engine.Vessel) int {
	var names []string
	for i, c := range v.Compartments {
		if strings.EqualFold(strings.TrimSpace(c.Name), strings.TrimSpace(name)) {
			return i
		}
		names = append(names, c.Name)
	}
	msg := fmt.Sprintf("%q is not a compartment of the vessel", name)
	if c := closest(name, names); c != "" {
		msg += fmt.Sprintf(" (did you mean %q?)", c)
	}
	r.addf(path, "%s", msg)
	return -1
}

func (r *reader) spaceState(t *table, v *engine.Vessel, d engine.Damage) {
	name, ok := t.str("name", true, "the compartment's name in quotes")
	open, _ := t.boolean("open")
	mu, muOK := t.num("permeability", "fraction, 0 < μ ≤ 1", false)
	water, waterOK := t.num("water_m3", "m³ of sea water held", false)
	if !ok {
		return
	}
	i := r.compartmentIndex(t.keyPath("name"), name, v)
	if i < 0 {
		return
	}
	if muOK && !(mu > 0 && mu <= 1) {
		r.addf(t.keyPath("permeability"), "%g is outside (0, 1]", mu)
		return
	}
	if waterOK && (water < 0 || water > v.Compartments[i].Volume()*1.000001) {
		r.addf(t.keyPath("water_m3"), "%g m³ is not water %q can hold (0 to %.1f m³)", water, v.Compartments[i].Name, v.Compartments[i].Volume())
		return
	}
	if open && waterOK && water > 0 {
		r.addf(t.keyPath("water_m3"), "a compartment open to the sea holds no separate water: give open = true or water_m3, not both")
		return
	}
	d[i] = engine.SpaceState{Open: open, Permeability: mu, WaterM3: water}
}

func (r *reader) connectionState(t *table, v *engine.Vessel, open []bool) {
	name, ok := t.str("name", true, "the connection's name in quotes")
	o, oOK := t.boolean("open")
	if !t.has("open") {
		r.addf(t.keyPath("open"), "missing: give open = true or false")
	}
	if !ok || !oOK {
		return
	}
	for i, c := range v.Connections {
		if strings.EqualFold(c.Name, strings.TrimSpace(name)) {
			open[i] = o
			return
		}
	}
	r.addf(t.keyPath("name"), "%q is not a connection of the vessel", name)
}

// The shapes the files are written in (toml.Encoder).
type (
	weightOut struct {
		Name string    `toml:"name"`
		Mass float64   `toml:"mass"`
		LCG  float64   `toml:"lcg"`
		TCG  float64   `toml:"tcg"`
		VCG  float64   `toml:"vcg"`
		FSM  float64   `toml:"fsm,omitzero"`
		X    []float64 `toml:"x,omitempty"`
	}
	tankOut struct {
		Name    string  `toml:"name"`
		Liquid  string  `toml:"liquid"`
		Density float64 `toml:"liquid_density"`
		Fill    float64 `toml:"fill"`
	}
	spaceOut struct {
		Name         string  `toml:"name"`
		Open         bool    `toml:"open"`
		Permeability float64 `toml:"permeability,omitzero"`
		WaterM3      float64 `toml:"water_m3,omitzero"`
	}
	connOut struct {
		Name string `toml:"name"`
		Open bool   `toml:"open"`
	}
	readingOut struct {
		Minutes float64            `toml:"minutes"`
		HeelDeg *float64           `toml:"heel_deg,omitempty"`
		Drafts  map[string]float64 `toml:"drafts,omitempty"`
		Levels  map[string]float64 `toml:"levels,omitempty"`
	}
	fileOut struct {
		Format      int          `toml:"format"`
		Vessel      string       `toml:"vessel,omitempty"`
		Name        string       `toml:"name,omitempty"`
		Weights     []weightOut  `toml:"weight"`
		Tanks       []tankOut    `toml:"tank,omitempty"`
		Spaces      []spaceOut   `toml:"space,omitempty"`
		Connections []connOut    `toml:"connection_state,omitempty"`
		Readings    []readingOut `toml:"reading,omitempty"`
	}
)

// conditionOut is the condition written out in full: every weight (none
// kept by name) and every tank by fill, so that the file needs nothing
// but the vessel file to be read back (a sounding is saved as the fill it
// came to).
func conditionOut(c *Condition, v *engine.Vessel) fileOut {
	out := fileOut{Format: FormatVersion, Name: c.Name}
	for _, w := range c.Weights {
		wo := weightOut{Name: w.Name, Mass: w.MassT, LCG: w.LCGM, TCG: w.TCGM, VCG: w.VCGM, FSM: w.FSMTm}
		if w.HasExtent() {
			wo.X = []float64{w.ExtentM[0], w.ExtentM[1]}
		}
		out.Weights = append(out.Weights, wo)
	}
	for _, t := range c.Tanks {
		f := t.Liquid.Fill
		if l := v.Compartments[t.Compartment].Liquid; t.BySounding() && l != nil {
			f = l.Fill
		}
		out.Tanks = append(out.Tanks, tankOut{Name: v.Compartments[t.Compartment].Name, Liquid: t.Liquid.Name, Density: t.Liquid.Density, Fill: f})
	}
	return out
}

// EncodeCondition writes the condition c as a condition file; v is the
// ship loaded with it (for the fills soundings came to).
func EncodeCondition(c *Condition, v *engine.Vessel) ([]byte, error) {
	return encode(conditionOut(c, v), "a loading condition saved by heelwatch; read it back with --condition")
}

// EncodeState writes s as a state file; v is the ship loaded with its
// condition, with its connections in the state saved.
func EncodeState(s *State, v *engine.Vessel) ([]byte, error) {
	out := conditionOut(s.Condition, v)
	out.Vessel = s.Vessel
	for i, d := range s.Damage {
		if d == (engine.SpaceState{}) || i >= len(v.Compartments) {
			continue
		}
		out.Spaces = append(out.Spaces, spaceOut{Name: v.Compartments[i].Name, Open: d.Open, Permeability: d.Permeability, WaterM3: d.WaterM3})
	}
	for i, c := range v.Connections {
		out.Connections = append(out.Connections, connOut{Name: c.Name, Open: i < len(s.ConnectionsOpen) && s.ConnectionsOpen[i]})
	}
	for _, rd := range s.Readings {
		ro := readingOut{Minutes: rd.Minutes}
		if rd.HasHeel {
			h := rd.HeelDeg
			ro.HeelDeg = &h
		}
		for _, d := range rd.Drafts {
			if ro.Drafts == nil {
				ro.Drafts = map[string]float64{}
			}
			ro.Drafts[v.DraftMarks[d.Mark].Name] = d.DraftM
		}
		for _, l := range rd.Levels {
			if ro.Levels == nil {
				ro.Levels = map[string]float64{}
			}
			ro.Levels[v.Compartments[l.Compartment].Name] = l.LevelM
		}
		out.Readings = append(out.Readings, ro)
	}
	return encode(out, "a situation saved by heelwatch's dashboard (condition, damage, connections, readings); take it up again with --resume")
}

func encode(out fileOut, what string) ([]byte, error) {
	for _, w := range out.Weights {
		for _, f := range []float64{w.Mass, w.LCG, w.TCG, w.VCG, w.FSM} {
			if math.IsNaN(f) || math.IsInf(f, 0) {
				return nil, fmt.Errorf("weight %q: a number is not finite", w.Name)
			}
		}
	}
	var b bytes.Buffer
	fmt.Fprintf(&b, "# %s (vessels/FORMAT.md).\n", what)
	if err := toml.NewEncoder(&b).Encode(out); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// WriteFileSafely writes data to path so that whatever was there is never
// lost half-way: into a new file beside it, synced, then renamed over it
// in one step. On any failure the old file is as it was and the new one
// is removed.
func WriteFileSafely(path string, data []byte) error {
	dir := filepath.Dir(path)
	f, err := os.CreateTemp(dir, "."+filepath.Base(path)+".*.tmp")
	if err != nil {
		return err
	}
	tmp := f.Name()
	_, err = f.Write(data)
	if err == nil {
		err = f.Sync()
	}
	if cerr := f.Close(); err == nil {
		err = cerr
	}
	if err == nil {
		err = os.Rename(tmp, path)
	}
	if err != nil {
		os.Remove(tmp)
	}
	return err
}
