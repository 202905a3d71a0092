package vessels

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"heelwatch/engine"
)

// This file resolves a flooding case: what a person asks for (on the
// command line or in the dashboard's form) with the vessel file's hole and
// pumps filling the gaps, by one set of rules, and where each value came
// from. The front ends only parse what is typed.

// MaxHoleM2 is the largest hole area taken: 100 m², a breach some 11 m
// across, beyond which the quasi-static inflow model (a hole small against
// the compartment) no longer holds.
const MaxHoleM2 = 100

// MaxPumpM3h is the largest pumping capacity taken on one compartment:
// 100 000 m³/h, far beyond any ship's pumps (a number that large is a
// slip of the keyboard).
const MaxPumpM3h = 1e5

// FloodPump is one pump a person names: the compartment it works on and
// its capacity.
type FloodPump struct {
	Compartment int
	M3h         float64
}

// FloodAsk is what a person asks of a flooding run. A NaN (or nil) value
// is left to the vessel file.
type FloodAsk struct {
	// Compartment is the index of the compartment that floods; -1: the one
	// compartment the pumps name, else the only one with a hole in the file.
	Compartment int
	AreaM2      float64 // the hole's area, m²; NaN: the file's hole's
	// ZM is the height of the hole's centre above the baseline, m. NaN:
	// the file's hole, else the compartment's lowest point in the shell.
	// The file hole's own height (to 5 mm) is the file's hole; any other
	// height puts the hole in the shell at mid-length (engine.ShellHole).
	ZM     float64
	Cd     float64       // NaN: the file hole's, else engine.DefaultDischargeCoefficient
	Pumps  []FloodPump   // nil: the file's pump_m3h for the compartment; a zero capacity is no pump
	Base   engine.Damage // the others' state; the flooded compartment must not be open in it
	LimitS float64       // 0: engine.DefaultFloodLimitS
	// Criteria: judge the vessel's criteria along the way.
	Criteria bool
	// By names who asked, for the words of where a value came from:
	// "command line", "dashboard".
	By string
}

// FloodField names the part of a FloodAsk an error is about, so that a
// form can put its cursor there.
type FloodField int

const (
	FieldCompartment FloodField = iota
	FieldArea
	FieldZ
	FieldCd
	FieldPumps
	FieldBase
)

// FloodAskError is a FloodAsk that cannot be used, and why.
type FloodAskError struct {
	Field FloodField
	Msg   string
}

func (e *FloodAskError) Error() string { return e.Msg }

// FloodResolved is a flooding case ready to run and where its values came
// from.
type FloodResolved struct {
	Case      engine.FloodCase
	HoleFrom  string // "vessel file", "<By>", "vessel file's position, area from the <By>", "<By>, at the compartment's lowest point"
	PumpsFrom string // "vessel file", "<By>" or "none"
}

// ResolveFlood makes the flooding case of ask for vessel v (info, which may
// be nil, holds the file's holes and pumps). It is the one place that
// decides where the hole and the pumps come from. Errors are
// *FloodAskError naming the part that is wrong and what is allowed.
func ResolveFlood(v *engine.Vessel, info *Info, ask FloodAsk) (FloodResolved, error) {
	fail := func(f FloodField, format string, a ...any) (FloodResolved, error) {
		return FloodResolved{}, &FloodAskError{f, fmt.Sprintf(format, a...)}
	}
	by := ask.By
	if by == "" {
		by = "command line"
	}
	fileHole := func(i int) *engine.Hole {
		if info != nil && i >= 0 && i < len(info.Compartments) {
			return info.Compartments[i].Hole
		}
		return nil
	}
	ci, err := floodCompartment(v, ask, fileHole)
	if err != nil {
		return FloodResolved{}, err
	}
	comp := v.Compartments[ci]
	area, z, cd := ask.AreaM2, ask.ZM, ask.Cd
	if !math.IsNaN(area) && !(area > 0 && area <= MaxHoleM2) {
		return fail(FieldArea, "hole area %v m² must be a positive number, at most %d m²", area, MaxHoleM2)
	}
	if !math.IsNaN(cd) && !(cd > 0 && cd <= 1) {
		return fail(FieldCd, "a discharge coefficient is a number with 0 < C ≤ 1 (about 0.6 for a sharp-edged hole, 0.7 for a ragged one), not %v", cd)
	}
	if b := comp.Box; math.IsInf(z, 0) || z < b.Z0-0.005 || z > b.Z1+0.005 {
		return fail(FieldZ, "height %v m is outside %s, which runs from z %.2f to %.2f m", z, comp.Name, b.Z0, b.Z1)
	}
	fh := fileHole(ci)
	var hole engine.Hole
	from := by
	switch {
	case fh != nil && (math.IsNaN(z) || FileHoleAt(fh, z)):
		hole = *fh
		from = "vessel file"
		if !math.IsNaN(area) && area != fh.AreaM2 {
			hole.AreaM2 = area
			from = "vessel file's position, area from the " + by
		}
	case math.IsNaN(area):
		return fail(FieldArea, "%q has no hole in the vessel file: give its area, e.g. %q", comp.Name, comp.Name+":0.05")
	default:
		h, err := engine.ShellHole(v, ci, area, z, 0)
		if err != nil {
			return fail(FieldZ, "%v", err)
		}
		hole = h
		if math.IsNaN(z) {
			from = by + ", at the compartment's lowest point"
		}
	}
	switch {
	case !math.IsNaN(cd):
		hole.Cd = cd
	case fh != nil:
		// A hole placed anew keeps the file's discharge coefficient.
		hole.Cd = fh.Cd
	}
	if hole.Cd == 0 {
		hole.Cd = engine.DefaultDischargeCoefficient
	}

	pumps, pumpsFrom, err := floodPumps(v, info, ask, ci, by)
	if err != nil {
		return FloodResolved{}, err
	}
	base := append(engine.Damage(nil), ask.Base...)
	if ci < len(base) && base[ci].Open {
		return fail(FieldBase, "%q is the compartment flooding through the hole: it cannot also be open to the sea", comp.Name)
	}
	if err := engine.CheckDamage(v, base); err != nil {
		return fail(FieldBase, "%v", err)
	}
	c := engine.FloodCase{Vessel: v, Base: base, Compartment: ci, Hole: hole, Pumps: pumps, LimitS: ask.LimitS}
	if ask.Criteria {
		shipType := ""
		if info != nil {
			shipType = info.ShipType
		}
		c.Criteria = engine.FloodCriteria(shipType)
	}
	return FloodResolved{Case: c, HoleFrom: from, PumpsFrom: pumpsFrom}, nil
}

// floodCompartment returns the compartment that floods: the one asked, else
// the one compartment the pumps name, else the only one with a file hole.
func floodCompartment(v *engine.Vessel, ask FloodAsk, fileHole func(int) *engine.Hole) (int, error) {
	if ask.Compartment >= len(v.Compartments) {
		panic("vessels: ResolveFlood of a compartment the vessel does not have")
	}
	if ask.Compartment >= 0 {
		return ask.Compartment, nil
	}
	named := map[int]bool{}
	for _, p := range ask.Pumps {
		named[p.Compartment] = true
	}
	var withHole []int
	for i := range v.Compartments {
		if fileHole(i) != nil {
			withHole = append(withHole, i)
		}
	}
	switch {
	case len(named) == 1:
		for i := range named {
			return i, nil
		}
	case len(withHole) == 1:
		return withHole[0], nil
	}
	var b strings.Builder
	b.WriteString("name the compartment that floods with --hole NAME[:AREA[:Z]].")
	if len(withHole) > 0 {
		b.WriteString(" These have a hole in the vessel file:")
		for _, i := range withHole {
			fmt.Fprintf(&b, "\n  %s", v.Compartments[i].Name)
		}
	}
	return 0, &FloodAskError{FieldCompartment, b.String()}
}

// floodPumps returns the pumps on compartment ci: those asked (each on ci),
// else the file's pump_m3h for it, and where they came from.
func floodPumps(v *engine.Vessel, info *Info, ask FloodAsk, ci int, by string) ([]engine.Pump, string, error) {
	if ask.Pumps == nil {
		if info != nil && ci < len(info.Compartments) && info.Compartments[ci].PumpM3h > 0 {
			return []engine.Pump{{Name: "vessel file", CapacityM3h: info.Compartments[ci].PumpM3h}}, "vessel file", nil
		}
		return nil, "none", nil
	}
	var out []engine.Pump
	for _, p := range ask.Pumps {
		if p.Compartment != ci {
			return nil, "", &FloodAskError{FieldPumps, fmt.Sprintf("pumps work on the flooded compartment, %q", v.Compartments[ci].Name)}
		}
		if !(p.M3h >= 0 && p.M3h <= MaxPumpM3h) {
			return nil, "", &FloodAskError{FieldPumps, fmt.Sprintf("pumps %v m³/h: give the capacity on the flooded compartment, zero or more and at most %.0f m³/h", p.M3h, float64(MaxPumpM3h))}
		}
		if p.M3h > 0 {
			out = append(out, engine.Pump{Name: fmt.Sprintf("pump %d", len(out)+1), CapacityM3h: p.M3h})
		}
	}
	return out, by, nil
}

// FileHoleAt reports whether a hole asked at height zM is the vessel file's
// hole fh: the same height to 5 mm (a form shows heights to the
// centimetre).
func FileHoleAt(fh *engine.Hole, zM float64) bool {
	return fh != nil && math.Abs(zM-fh.ZM) < 0.005
}

// AsFloodAskError returns err as a *FloodAskError, or nil.
func AsFloodAskError(err error) *FloodAskError {
	var e *FloodAskError
	if errors.As(err, &e) {
		return e
	}
	return nil
}
