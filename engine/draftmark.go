package engine

import (
	"fmt"
	"math"
)

// DraftMark is a draft mark painted on the shell: the scale the crew reads
// at one place along the ship on one side. Side is Port, Starboard, or Both
// for a mark on the centreline (a stem or stern mark).
type DraftMark struct {
	Name string
	XM   float64 // m from the aft perpendicular
	Side Side
}

// MarkState says how a mark meets the water.
type MarkState int

const (
	// MarkReads: the water crosses the mark's line on the shell.
	MarkReads MarkState = iota
	// MarkKeelOut: the water lies below the keel at that side; the draft
	// given is the height of the water surface at the shell's lowest point
	// (zero or less), nothing the crew can read.
	MarkKeelOut
	// MarkSubmerged: the water is above the deck at side there; the draft
	// given continues the shell straight up from the deck edge.
	MarkSubmerged
)

func (s MarkState) String() string {
	switch s {
	case MarkKeelOut:
		return "keel out"
	case MarkSubmerged:
		return "under water"
	}
	return "reads"
}

// MarkDraft is the draft at one mark in one floating position.
type MarkDraft struct {
	DraftMark
	DraftM float64 // height of the water surface above the baseline at the mark, m
	YM     float64 // where the water meets the shell's line there, m (0 for a centre mark)
	State  MarkState
}

// MarkDrafts returns the draft at each mark when the water surface is p
// (ship frame). A mark's draft is the height z above the baseline of the
// point where the water surface meets the shell's line at the mark: the
// section at x = XM, on the mark's side. That point (x, y(z), z) lies on
// the plane, z = A + B·x + C·y(z), where y(z) is the outboard-most point of
// the section at height z on that side; solved by bisection on z between
// the section's keel and deck at side. On a centre mark y = 0 and the draft
// is A + B·x exactly. Valid at any heel and trim at which the mark's line
// still crosses the water; beyond that see MarkState.
//
// A mark outside the hull's length is a programmer's mistake (the vessel
// reader refuses it): it panics.
func MarkDrafts(h *Hull, p Plane, marks []DraftMark) []MarkDraft {
	out := make([]MarkDraft, len(marks))
	for i, m := range marks {
		out[i] = shellAt(h, m).draft(p)
	}
	return out
}

// markShell is the hull's section at a mark, kept so that the draft can be
// read at many planes.
type markShell struct {
	m      DraftMark
	sec    []Point
	lo, hi float64
}

func shellAt(h *Hull, m DraftMark) markShell {
	sec := h.SectionAt(m.XM)
	if len(sec) < 3 {
		panic(fmt.Sprintf("engine: draft mark %q at x %g m lies outside the hull", m.Name, m.XM))
	}
	lo, hi := zRange(sec)
	return markShell{m, sec, lo, hi}
}

// draft reads the mark at plane p (see MarkDrafts).
func (ms markShell) draft(p Plane) MarkDraft {
	m := ms.m
	md := MarkDraft{DraftMark: m}
	lo, hi := ms.lo, ms.hi
	if m.Side == Both {
		md.DraftM = p.Z(m.XM, 0)
		switch {
		case md.DraftM < lo:
			md.State = MarkKeelOut
		case md.DraftM > hi:
			md.State = MarkSubmerged
		}
		return md
	}
	s := float64(m.Side)
	shell := func(z float64) float64 { return s * outboard(ms.sec, z, s) }
	g := func(z float64) float64 { return z - p.Z(m.XM, shell(z)) }
	switch {
	case g(lo) >= 0:
		md.YM = shell(lo)
		md.DraftM, md.State = p.Z(m.XM, md.YM), MarkKeelOut
		if g(lo) == 0 {
			md.State = MarkReads
		}
		return md
	case g(hi) <= 0:
		md.YM = shell(hi)
		md.DraftM, md.State = p.Z(m.XM, md.YM), MarkSubmerged
		return md
	}
	// Bisection to a nanometre: g rises with z wherever the
	// shell's slope times tan(heel) is below one, and bisection needs only
	// the change of sign.
	a, b := lo, hi
	for b-a > 1e-9 {
		c := (a + b) / 2
		if g(c) < 0 {
			a = c
		} else {
			b = c
		}
	}
	z := (a + b) / 2
	md.DraftM, md.YM = z, shell(z)
	return md
}

// zRange returns the lowest and highest z of a polygon.
func zRange(poly []Point) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, q := range poly {
		lo, hi = math.Min(lo, q.Z), math.Max(hi, q.Z)
	}
	return lo, hi
}

// outboard returns the largest s·y of the polygon at height z (s = ±1): how
// far out the shell is on that side. z outside the polygon's range is taken
// to its nearest end.
func outboard(poly []Point, z, s float64) float64 {
	lo, hi := zRange(poly)
	z = math.Max(lo, math.Min(hi, z))
	best := math.Inf(-1)
	for k := range poly {
		a, b := poly[k], poly[(k+1)%len(poly)]
		switch {
		case a.Z == z:
			best = math.Max(best, s*a.Y)
		case (a.Z < z) != (b.Z < z):
			best = math.Max(best, s*(a.Y+(z-a.Z)/(b.Z-a.Z)*(b.Y-a.Y)))
		}
	}
	if math.IsInf(best, -1) {
		return 0
	}
	return best
}

// checkMarks refuses a mark outside the hull's length or on no side.
func checkMarks(h *Hull, marks []DraftMark) error {
	xmin, xmax, _, _ := h.solid.Extent()
	for _, m := range marks {
		if !(m.XM >= xmin && m.XM <= xmax) {
			return fmt.Errorf("draft mark %q: x %v m is outside the hull, which runs from %g to %g m", m.Name, m.XM, xmin, xmax)
		}
		if m.Side != Port && m.Side != Starboard && m.Side != Both {
			return fmt.Errorf("draft mark %q: side %d is not port, starboard or centre", m.Name, m.Side)
		}
	}
	return nil
}
