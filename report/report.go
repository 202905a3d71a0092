// Package report renders one assessed damage state of a vessel (an
// engine.Assessment) for people and for programs: as aligned plain text for
// the terminal, as Markdown for printing or pasting into the log, and as the
// JSON object of heelwatch's `solve` contract.
//
// The renderers only show: every figure comes from the engine. Fields of the
// Assessment that are empty (no hand method, no GZ curve yet, no criteria)
// are shown as absent, never invented. Non-finite numbers never reach the
// output: JSON writes them as null and text as "—".
//
// Units are those of the engine's names: metres, tonnes, degrees, m³.
package report

import (
	"fmt"
	"io"
	"math"
	"sort"
	"strings"
	"time"

	"heelwatch/engine"
)

// Report is one assessed state of a vessel with the facts a record needs:
// which vessel, from where, which compartments are open and at what
// permeability, when it was made and by which version of heelwatch.
// Build it with New, or fill it by hand.
type Report struct {
	VesselName string
	VesselFile string // where the vessel came from: a path, or "bundled:NAME"
	Condition  string // the loading condition's name, "" if the file gives none

	// Vessel, when set, gives each compartment's use, volume and own
	// permeability to the renderers. Optional.
	Vessel *engine.Vessel

	Open           []string           // compartments open to the sea, in the order chosen
	Permeabilities map[string]float64 // μ in force for each open compartment

	Assessment engine.Assessment
	// Remedies, when set, are the righting options worked out for the
	// state (engine.FindRemedies), shown after the flags; nil leaves them
	// out of every format.
	Remedies *engine.RemedySet
	// Spread, when set, is how flooding spread through connections and
	// openings (engine.Progressive); Assessment is then of its final state.
	Spread *engine.Spread
	// IntactStrength is the hull girder of the same ship intact, shown
	// beside a damaged state's (nil when intact or not worked out).
	IntactStrength *engine.Strength
	Made           time.Time // when the assessment was made (shown in UTC)
	Version        string    // heelwatch's version
}

// New returns the Report of assessment a of vessel v: the open
// compartments and their permeabilities are read from a.Damage.
func New(v *engine.Vessel, file string, a engine.Assessment, made time.Time, version string) Report {
	r := Report{VesselName: v.Name, VesselFile: file, Vessel: v, Assessment: a,
		Made: made, Version: version, Permeabilities: map[string]float64{}}
	for i, c := range v.Compartments {
		if i >= len(a.Damage) || !a.Damage[i].Open {
			continue
		}
		r.Open = append(r.Open, c.Name)
		r.Permeabilities[c.Name] = v.Permeability(a.Damage, i)
	}
	if a.Strength != nil && engine.IsDamaged(a.Damage) {
		r.IntactStrength, _ = engine.IntactStrength(v)
	}
	return r
}

// Cautions returns the words that go with every report: what heelwatch is for
// and what governs instead of it. Each call returns a new slice.
func Cautions() []string {
	return []string{
		"heelwatch is decision support only. It computes from the hull geometry in the vessel file; it is not an approved loading instrument.",
		"The ship's approved stability information and loading instrument, the master's judgement, class rules and flag-state requirements govern.",
		"Follow local codes and licensed practice first. Check every figure against the ship's own documents before acting on it.",
	}
}

// Outcome is how the state ends: "floats", or why not ("sinks",
// "capsizes", "not converged").
func (r Report) Outcome() string {
	a := r.Assessment
	if a.Position != nil {
		return "floats"
	}
	if a.NoEq != nil {
		return a.NoEq.Outcome.String()
	}
	return "not converged"
}

// Flags returns the assessment's flags, with one added (the engine's code
// for it) when there is no equilibrium and no danger flag already says so.
func (r Report) Flags() []engine.Flag {
	fl := append([]engine.Flag(nil), r.Assessment.Flags...)
	if r.Assessment.Position != nil {
		return fl
	}
	for _, f := range fl {
		if f.Severity == engine.Danger {
			return fl
		}
	}
	code, msg := engine.FlagNotSolved, "No floating position was found: treat the state as dangerous."
	if ne := r.Assessment.NoEq; ne != nil {
		switch ne.Outcome {
		case engine.Sinks:
			code, msg = engine.FlagWillSink, "There is no floating position: she sinks ("+ne.Reason+")."
		case engine.Capsizes:
			code, msg = engine.FlagWillCapsize, "There is no position of rest: she capsizes ("+ne.Reason+")."
		default:
			msg = "No floating position was found (" + ne.Reason + "): treat the state as dangerous."
		}
	}
	return append(fl, engine.Flag{Code: code, Severity: engine.Danger, Message: msg})
}

// Severity is the highest severity among the flags, or "none".
func (r Report) Severity() string { return highest(r.Flags(), false) }

// ShipSeverity is the highest severity among the flags about the ship,
// leaving out the hand method's caveats (engine.Flag.AboutHandMethod), or
// "none": the word for the ship's state, as the dashboard's header gives
// it.
func (r Report) ShipSeverity() string { return highest(r.Flags(), true) }

// highest is the highest severity among fl (without the hand method's
// caveats when shipOnly), or "none".
func highest(fl []engine.Flag, shipOnly bool) string {
	s, any := engine.Info, false
	for _, f := range fl {
		if shipOnly && f.AboutHandMethod() {
			continue
		}
		any = true
		if f.Severity > s {
			s = f.Severity
		}
	}
	if !any {
		return "none"
	}
	return s.String()
}

// compartment returns the named compartment of r.Vessel, or nil.
// heldWater lists the compartments holding floodwater that are not open to
// the sea (partly flooded, the added-weight method), with the water in each.
func (r Report) heldWater() []HeldDoc {
	var out []HeldDoc
	for i, s := range r.Assessment.Damage {
		if s.Open || !(s.WaterM3 > 0) {
			continue
		}
		name := fmt.Sprintf("compartment %d", i+1)
		if r.Vessel != nil && i < len(r.Vessel.Compartments) {
			name = r.Vessel.Compartments[i].Name
		}
		out = append(out, HeldDoc{Name: name, WaterM3: Num(s.WaterM3)})
	}
	return out
}

func (r Report) compartment(name string) *engine.Compartment {
	if r.Vessel == nil {
		return nil
	}
	for _, c := range r.Vessel.Compartments {
		if engine.SameName(c.Name, name) {
			return c
		}
	}
	return nil
}

// clearanceWords says a least clearance: height, where and which side.
func clearanceWords(c engine.Clearance) string {
	if !finite(c.HeightM) {
		return "—"
	}
	s := num(c.HeightM, 3, "m") + " at x " + num(c.XM, 1, "m") + ", " + c.Side.String()
	if c.HeightM < 0 {
		s += " (immersed)"
	}
	return s
}

// openingsByHeight returns the openings nearest the water first.
func openingsByHeight(p *engine.Position) []engine.OpeningClearance {
	o := append([]engine.OpeningClearance(nil), p.Openings...)
	sort.SliceStable(o, func(i, j int) bool { return o[i].HeightM < o[j].HeightM })
	return o
}

// gzRows picks the computed points of the curve to tabulate: those at
// multiples of step degrees, or, if the curve's heels do not fall on them,
// about a dozen spread along it. Every row is a point the engine computed.
func gzRows(g *engine.GZCurve, step float64) []int {
	n := len(g.HeelDeg)
	if len(g.GZM) < n {
		n = len(g.GZM)
	}
	var rows []int
	for i := 0; i < n; i++ {
		q := g.HeelDeg[i] / step
		if math.Abs(q-math.Round(q)) < 1e-6 {
			rows = append(rows, i)
		}
	}
	if len(rows) >= 3 || n == 0 {
		return rows
	}
	rows = rows[:0]
	k := (n + 11) / 12
	for i := 0; i < n; i += k {
		rows = append(rows, i)
	}
	if rows[len(rows)-1] != n-1 {
		rows = append(rows, n-1)
	}
	return rows
}

// madeWords is the time made, in UTC to the second.
func madeWords(t time.Time) string {
	if t.IsZero() {
		return "—"
	}
	return t.UTC().Format("2006-01-02 15:04:05 UTC")
}

// errWriter remembers the first write error so renderers can print freely.
type errWriter struct {
	w   io.Writer
	err error
}

func (e *errWriter) printf(format string, a ...any) {
	if e.err == nil {
		_, e.err = fmt.Fprintf(e.w, format, a...)
	}
}

func (e *errWriter) line(parts ...string) {
	e.printf("%s\n", strings.Join(parts, ""))
}

// sentence starts s with a capital letter.
func sentence(s string) string {
	for i, r := range s {
		return strings.ToUpper(string(r)) + s[i+len(string(r)):]
	}
	return s
}

// verdict is a criterion's result in one word: PASS, FAIL, or READ for an
// indicator, which is a figure to read rather than a limit she is held to.
func verdict(c engine.CriterionResult) string {
	switch {
	case c.Indicator:
		return "READ"
	case c.Pass:
		return "PASS"
	}
	return "FAIL"
}

// requirementWords is a criterion's requirement with its note, if any.
func requirementWords(c engine.CriterionResult) string {
	if c.Note == "" {
		return c.Requirement
	}
	return c.Requirement + " (" + c.Note + ")"
}
