package vessels

import (
	"embed"
	"fmt"
	"math"
	"os"
	"path"
	"path/filepath"
	"sort"
	"strings"

	"github.com/BurntSushi/toml"

	"heelwatch/engine"
)

// This file reads a drill's scenario file: the vessel, the exercise's
// length, its events in scenario time. A drill's log is a scenario file
// too (the crew's and the instructor's events carry by = "crew" or
// "instructor"), so that a drill replays from it.

//go:embed scenarios/*.toml
var scenarioFS embed.FS

// Scenario is a drill's scenario as read.
type Scenario struct {
	File  string // as given in messages ("scenarios/freighter-night.toml" for a bundled one)
	Name  string // the name key, or the file's base name
	About string // free text: the story, for the instructor
	// VesselRef is the vessel: a bundled vessel's name, else the vessel
	// file's path made absolute (so that a drill's log, written anywhere,
	// names the same file).
	VesselRef string
	// ConditionRef is the condition file's path made absolute ("" when
	// the vessel file's own loading condition is used).
	ConditionRef string
	Vessel       *engine.Vessel
	Info         *Info
	Minutes      float64 // the exercise's length in scenario time
	Seed         int64   // the reading errors' seed (default 1)
	// Alarms are the compartments fitted with a high-level (bilge) alarm:
	// it sounds when the water there first stands AlarmLevelM above the
	// compartment's lowest point.
	Alarms []int
	Events []engine.DrillEvent // in time order
}

// AlarmLevelM is the height of water above a compartment's lowest point at
// which its high-level alarm sounds: 0.2 m (practice: a bilge well's
// float switch).
const AlarmLevelM = 0.2

// ScenarioKinds are the kinds of [[event]].
var ScenarioKinds = []string{"breach", "pump", "connection", "note", "report", "mark", "counterflood"}

// CounterfloodAreaM2 is the area of the sea inlet a counter-flooding
// opens when the scenario or the crew gives none: 0.03 m², about the bore
// of a 200 mm sea valve (practice).
const CounterfloodAreaM2 = 0.03

// BundledScenario is one scenario shipped with heelwatch.
type BundledScenario struct{ Name, Title string }

// BundledScenarios lists the bundled scenarios by name.
func BundledScenarios() []BundledScenario {
	files, err := scenarioFS.ReadDir("scenarios")
	if err != nil {
		panic("vessels: bundled scenarios missing from the binary: " + err.Error())
	}
	var out []BundledScenario
	for _, f := range files {
		name, ok := strings.CutSuffix(f.Name(), ".toml")
		if !ok {
			continue
		}
		src, _ := scenarioFS.ReadFile(path.Join("scenarios", f.Name()))
		var head struct {
			Name string `toml:"name"`
		}
		_, _ = toml.Decode(string(src), &head)
		out = append(out, BundledScenario{Name: name, Title: head.Name})
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Name < out[j].Name })
	return out
}

// OpenScenario reads a bundled scenario by name ("freighter-night") or the
// scenario file at nameOrPath. A vessel path in a file is taken relative to
// the file's folder.
func OpenScenario(nameOrPath string) (*Scenario, error) {
	if nameOrPath != "" && !strings.ContainsAny(nameOrPath, `/\.`) {
		if src, err := scenarioFS.ReadFile(path.Join("scenarios", nameOrPath+".toml")); err == nil {
			return ParseScenario("scenarios/"+nameOrPath+".toml", src, "")
		}
		if _, err := os.Stat(nameOrPath); err != nil {
			var names []string
			for _, s := range BundledScenarios() {
				names = append(names, s.Name)
			}
			return nil, fmt.Errorf("no bundled scenario called %q (bundled: %s) and no file of that name", nameOrPath, strings.Join(names, ", "))
		}
	}
	data, err := readRegular(nameOrPath)
	if err != nil {
		return nil, fmt.Errorf("scenario file: %w", err)
	}
	return ParseScenario(nameOrPath, data, filepath.Dir(nameOrPath))
}

// ParseScenario reads a scenario file. dir is the folder a vessel path is
// taken relative to ("" for the working folder). Every problem is returned
// at once as Problems with file, line and key: a missing or unknown key,
// an event out of time order or past the end, a compartment, connection or
// kind the vessel does not have, a breach or pump that cannot be.
func ParseScenario(file string, data []byte, dir string) (*Scenario, error) {
	r, root, err := decode(file, data)
	if err != nil {
		return nil, err
	}
	sc := &Scenario{File: file, Seed: 1}
	r.format(root)
	if s, ok := root.str("name", false, "the scenario's name"); ok && r.checkText("name", s, "the scenario's name") {
		sc.Name = s
	}
	if sc.Name == "" {
		sc.Name = strings.TrimSuffix(path.Base(filepath.ToSlash(file)), ".toml")
	}
	if s, ok := root.str("about", false, "the story, for the instructor"); ok {
		sc.About = s
	}
	if m, ok := root.positive("minutes", "the exercise's length in scenario minutes", true); ok {
		if m > 24*60 {
			r.addf("minutes", "%g min is more than a day: an exercise lasts at most 1440 min", m)
		} else {
			sc.Minutes = m
		}
	}
	if f, ok := root.get("seed"); ok {
		if n, isInt := f.(int64); isInt {
			sc.Seed = n
		} else {
			r.addf("seed", "must be a whole number (the reading errors' seed), not %s", typeName(f))
		}
	}
	ref, refOK := root.str("vessel", true, `a bundled vessel's name ("freighter") or a vessel file's path`)
	condRef, condOK := root.str("condition", false, "a condition file's path (the loading condition at the start)")
	alarmsRaw, hasAlarms := root.get("alarms")
	evs := root.entries("event", "one event of the exercise")
	root.finish()
	if refOK {
		sc.VesselRef = ref
		p := ref
		if _, bundled := Source(ref); !bundled && dir != "" && !filepath.IsAbs(ref) {
			p = filepath.Join(dir, ref)
		}
		if _, bundled := Source(ref); !bundled {
			sc.VesselRef = absPath(p)
		}
		v, info, err := Open(p)
		if err != nil {
			if ps, ok := err.(Problems); ok {
				return nil, append(r.probs, ps...)
			}
			r.addf("vessel", "%v", err)
		} else {
			sc.Vessel, sc.Info = v, info
		}
	}
	if sc.Vessel != nil && condOK {
		p := condRef
		if dir != "" && !filepath.IsAbs(p) {
			p = filepath.Join(dir, p)
		}
		sc.ConditionRef = absPath(p)
		c, err := LoadCondition(p, sc.Vessel, sc.Info)
		if ps, ok := err.(Problems); ok {
			return nil, append(r.probs, ps...)
		}
		if err == nil {
			var v *engine.Vessel
			if v, err = c.Apply(sc.Vessel); err == nil {
				sc.Vessel = v
			}
		}
		if err != nil {
			r.addf("condition", "%v", err)
			sc.Vessel = nil
		}
	}
	if sc.Vessel == nil {
		if len(r.probs) == 0 {
			r.addf("vessel", "no vessel to run the scenario on")
		}
		return nil, r.probs.sorted()
	}
	if hasAlarms {
		sc.Alarms = r.alarms(alarmsRaw, sc.Vessel)
	}
	prev := 0.0
	for _, t := range evs {
		e, ok := r.scenarioEvent(t, sc)
		if !ok {
			continue
		}
		switch {
		case e.Minutes < prev:
			r.addf(t.keyPath("minutes"), "%g min comes before the event above (%g min): give the events in time order", e.Minutes, prev)
		case sc.Minutes > 0 && e.Minutes > sc.Minutes:
			r.addf(t.keyPath("minutes"), "%g min is past the end of the exercise (minutes = %g)", e.Minutes, sc.Minutes)
		}
		prev = math.Max(prev, e.Minutes)
		sc.Events = append(sc.Events, e)
	}
	if len(r.probs) > 0 {
		return nil, r.probs.sorted()
	}
	return sc, nil
}

func (r *reader) alarms(raw any, v *engine.Vessel) []int {
	a, ok := raw.([]any)
	if !ok {
		r.addf("alarms", "must be a list of compartment names, not %s", typeName(raw))
		return nil
	}
	var out []int
	for k, e := range a {
		s, ok := e.(string)
		p := fmt.Sprintf("alarms[%d]", k+1)
		if !ok {
			r.addf(p, "must be a compartment's name in quotes, not %s", typeName(e))
			continue
		}
		if i := r.compartmentNamed(p, s, v); i >= 0 {
			out = append(out, i)
		}
	}
	return out
}

// compartmentNamed returns the compartment called s (ignoring case), or
// records a problem at p and returns −1.
func (r *reader) compartmentNamed(p, s string, v *engine.Vessel) int {
	var names []string
	for i, c := range v.Compartments {
		if strings.EqualFold(strings.TrimSpace(c.Name), strings.TrimSpace(s)) {
			return i
		}
		names = append(names, c.Name)
	}
	msg := fmt.Sprintf("%q is not a compartment of %s", s, v.Name)
	if c := closest(s, names); c != "" {
		msg += fmt.Sprintf(" (did you mean %q?)", c)
	}
	r.addf(p, "%s", msg)
	return -1
}

// scenarioEvent reads one [[event]].
func (r *reader) scenarioEvent(t *table, sc *Scenario) (engine.DrillEvent, bool) {
	v := sc.Vessel
	e := engine.DrillEvent{Compartment: -1}
	ok := true
	m, mOK := t.num("minutes", "scenario minutes from the start", true)
	if mOK && m < 0 {
		r.addf(t.keyPath("minutes"), "%g is negative: minutes count from the start of the exercise", m)
		mOK = false
	}
	e.Minutes = m
	ok = ok && mOK
	kind, kOK := t.choice("kind", true, ScenarioKinds)
	ok = ok && kOK
	by, byOK := t.choice("by", false, []string{engine.ByScenario, engine.ByCrew, engine.ByInstructor})
	if byOK {
		e.By = by
	}
	if s, has := t.str("text", false, "what the crew is told"); has && r.checkText(t.keyPath("text"), s, "the text") {
		e.Text = s
	}
	need := func(key string, want bool) {
		if t.has(key) && !want {
			r.addf(t.keyPath(key), "a %s event takes no %s", kind, key)
			ok = false
		}
	}
	wantComp := kind == "breach" || kind == "pump" || kind == "mark" || kind == "counterflood" || kind == ""
	if cn, has := t.str("compartment", wantComp && kOK, "the compartment's name"); has {
		e.Compartment = r.compartmentNamed(t.keyPath("compartment"), cn, v)
		ok = ok && e.Compartment >= 0
	} else if wantComp {
		ok = false
	}
	var k eventKeys
	k.area, k.aOK = t.num("area", "m², the hole's area", kind == "breach")
	if kind == "counterflood" && !k.aOK && !t.has("area") {
		k.area, k.aOK = CounterfloodAreaM2, true
	}
	k.z, k.zOK = t.num("z", "m, the height of the hole's centre above the baseline", false)
	k.cd, k.cdOK = t.num("cd", "the hole's discharge coefficient", false)
	k.state, k.sOK = t.choice("state", kind == "pump", []string{"starts", "fails", "stops"})
	k.capm, k.capOK = t.num("capacity_m3h", "m³/h", false)
	k.conn, k.connOK = t.str("connection", kind == "connection", "the connection's name")
	k.open, k.openOK = t.boolean("open")
	k.flooded, k.fOK = t.boolean("flooded")
	t.finish()
	need("area", kind == "breach" || kind == "counterflood")
	for _, key := range []string{"z", "cd"} {
		need(key, kind == "breach")
	}
	for _, key := range []string{"state", "capacity_m3h"} {
		need(key, kind == "pump")
	}
	need("connection", kind == "connection")
	need("open", kind == "connection" || kind == "counterflood")
	need("flooded", kind == "mark")
	if !kOK {
		return e, false
	}
	if !r.scenarioKind(t, sc, &e, kind, k) {
		return e, false
	}
	return e, ok
}

// eventKeys are the keys of an [[event]] that belong to one kind or another.
type eventKeys struct {
	area, z, cd, capm     float64
	aOK, zOK, cdOK, capOK bool
	state, conn           string
	sOK, connOK           bool
	open, flooded         bool
	openOK, fOK           bool
}

// scenarioKind reads what an [[event]] of this kind says into e, from the
// keys k read for it; false when something is missing or wrong (said).
func (r *reader) scenarioKind(t *table, sc *Scenario, e *engine.DrillEvent, kind string, k eventKeys) bool {
	v := sc.Vessel
	switch kind {
	case "breach":
		e.Kind = engine.DrillBreach
		if !k.aOK || e.Compartment < 0 {
			return false
		}
		if !(k.area > 0 && k.area <= MaxHoleM2) {
			r.addf(t.keyPath("area"), "%g m² must be above zero and at most %d m²", k.area, MaxHoleM2)
			return false
		}
		if k.cdOK && !(k.cd > 0 && k.cd <= 1) {
			r.addf(t.keyPath("cd"), "%g is not a discharge coefficient: 0 < C ≤ 1 (about 0.6 sharp-edged, 0.7 a ragged hole)", k.cd)
			return false
		}
		z, cd := k.z, k.cd
		if !k.zOK {
			z = math.NaN()
		}
		if !k.cdOK {
			cd = math.NaN()
		}
		res, err := ResolveFlood(v, sc.Info, FloodAsk{Compartment: e.Compartment, AreaM2: k.area, ZM: z, Cd: cd, Pumps: []FloodPump{}, By: "scenario"})
		if err != nil {
			key := "area"
			if fe := AsFloodAskError(err); fe != nil && fe.Field == FieldZ {
				key = "z"
			}
			r.addf(t.keyPath(key), "%v", err)
			return false
		}
		e.Hole = res.Case.Hole
	case "pump":
		e.Kind = engine.DrillPump
		if !k.sOK || e.Compartment < 0 {
			return false
		}
		if k.state == "starts" {
			e.PumpM3h = sc.Info.Compartments[e.Compartment].PumpM3h
			if k.capOK {
				e.PumpM3h = k.capm
			}
			if !(e.PumpM3h > 0 && e.PumpM3h <= MaxPumpM3h) {
				r.addf(t.keyPath("capacity_m3h"), "give the pumping capacity that starts on %q, above 0 and at most %.0f m³/h (the vessel file gives it no pump_m3h)", v.Compartments[e.Compartment].Name, float64(MaxPumpM3h))
				return false
			}
		} else if k.capOK {
			r.addf(t.keyPath("capacity_m3h"), "a pump that %s has no capacity to give", k.state)
			return false
		}
	case "connection":
		e.Kind = engine.DrillConnection
		if !k.connOK {
			return false
		}
		if !k.openOK {
			r.addf(t.keyPath("open"), "missing: say open = true (found or left open) or open = false (closed)")
			return false
		}
		name, found := connectionNamed(v, k.conn)
		if !found {
			r.addf(t.keyPath("connection"), "%q is not a connection of %s%s", k.conn, v.Name, connectionList(v))
			return false
		}
		e.Name, e.Open = name, k.open
	case "note", "report":
		e.Kind = engine.DrillNote
		if kind == "report" {
			e.Kind = engine.DrillReport
		}
		if e.Text == "" {
			r.addf(t.keyPath("text"), "missing: a %s says something to the crew: give its text", kind)
			return false
		}
	case "counterflood":
		e.Kind = engine.DrillCounterflood
		if !k.aOK || e.Compartment < 0 {
			return false
		}
		if !k.openOK {
			r.addf(t.keyPath("open"), "missing: say open = true (the sea inlet opened) or open = false (shut)")
			return false
		}
		e.Open = k.open
		h, err := CounterfloodInlet(v, e.Compartment, k.area)
		if err != nil {
			r.addf(t.keyPath("area"), "%v", err)
			return false
		}
		e.Hole = h
	case "mark":
		e.Kind = engine.DrillMark
		if e.Compartment < 0 {
			return false
		}
		if !k.fOK {
			r.addf(t.keyPath("flooded"), "missing: say flooded = true or flooded = false")
			return false
		}
		e.Flooded = k.flooded
	}
	return true
}

// Setup returns what the drill of sc is played from, with extra events
// (the crew's and the instructor's) merged in time order after the
// scenario's own at the same minute.
func (sc *Scenario) Setup(extra ...engine.DrillEvent) engine.DrillSetup {
	ev := append(append([]engine.DrillEvent(nil), sc.Events...), extra...)
	sort.SliceStable(ev, func(i, j int) bool { return ev[i].Minutes < ev[j].Minutes })
	pumps := make([]float64, len(sc.Vessel.Compartments))
	for i := range pumps {
		if sc.Info != nil && i < len(sc.Info.Compartments) {
			pumps[i] = sc.Info.Compartments[i].PumpM3h
		}
	}
	return engine.DrillSetup{Vessel: sc.Vessel, Events: ev, EndMin: sc.Minutes, Alarms: sc.Alarms, AlarmLevel: AlarmLevelM, PumpM3h: pumps}
}

// CounterfloodInlet is the sea inlet that counter-floods compartment ci:
// area m² (above 0, at most MaxHoleM2) at the compartment's lowest point
// in the shell (engine.ShellHole), C_d that of a sharp-edged orifice.
func CounterfloodInlet(v *engine.Vessel, ci int, area float64) (engine.Hole, error) {
	if !(area > 0 && area <= MaxHoleM2) {
		return engine.Hole{}, fmt.Errorf("a sea inlet's area %g m² must be above zero and at most %d m²", area, MaxHoleM2)
	}
	return engine.ShellHole(v, ci, area, math.NaN(), engine.DefaultDischargeCoefficient)
}

// absPath returns p made absolute, or p itself if that cannot be done.
func absPath(p string) string {
	if a, err := filepath.Abs(p); err == nil {
		return a
	}
	return p
}
