package engine

import "fmt"

// This file holds what happens in an exercise (a drill): the events of a
// scenario, of the crew's decisions and of the instructor's injections, in
// scenario time. The truth they drive is in drill.go.

// DrillEventKind names what a DrillEvent does.
type DrillEventKind int

const (
	// DrillBreach makes a hole in the shell into a compartment.
	DrillBreach DrillEventKind = iota + 1
	// DrillPump starts (PumpM3h > 0) or stops (PumpM3h = 0: it fails, or is
	// stopped) the pumping on a compartment.
	DrillPump
	// DrillConnection opens or closes a connection between compartments
	// (a door found open, a door closed by the crew). The vessel's
	// connections are named by Name.
	DrillConnection
	// DrillNote is a note to the crew: what they are told (Text).
	DrillNote
	// DrillReport is a report from a party ("water in the engine room
	// bilge"): Text, about Compartment when one is named.
	DrillReport
	// DrillMark is the crew's own picture: they mark Compartment flooded
	// (Flooded) or dry again. It changes nothing of the truth.
	DrillMark
	// DrillCounterflood opens (Open) or closes the sea inlet Hole into
	// Compartment: flooding a space on purpose, to take off a list.
	DrillCounterflood
)

func (k DrillEventKind) String() string {
	switch k {
	case DrillBreach:
		return "breach"
	case DrillPump:
		return "pump"
	case DrillConnection:
		return "connection"
	case DrillNote:
		return "note"
	case DrillReport:
		return "report"
	case DrillMark:
		return "mark"
	case DrillCounterflood:
		return "counterflood"
	}
	return "unknown"
}

// Who made a DrillEvent.
const (
	ByScenario   = "scenario"
	ByCrew       = "crew"
	ByInstructor = "instructor"
)

// DrillEvent is one thing that happens in a drill at a moment of scenario
// time.
type DrillEvent struct {
	Minutes     float64 // scenario time, min
	Kind        DrillEventKind
	By          string // ByScenario, ByCrew or ByInstructor ("" is ByScenario)
	Compartment int    // index into Vessel.Compartments; −1: none
	Hole        Hole   // DrillBreach, DrillCounterflood: the hole or inlet (C_d filled in)
	PumpM3h     float64
	Name        string // DrillConnection: the connection's name
	Open        bool   // DrillConnection, DrillCounterflood: open (true) or closed
	Flooded     bool   // DrillMark: marked flooded (true) or dry
	// Text is what the crew is told when the event happens; "" tells them
	// nothing (a breach, a pump that fails unseen).
	Text string
}

// Label returns the event's name in the timeline: its kind and what it
// works on, e.g. "breach Hold 1", "pump Engine room 60 m3/h".
func (e DrillEvent) Label(v *Vessel) string {
	name := ""
	if e.Compartment >= 0 && e.Compartment < len(v.Compartments) {
		name = v.Compartments[e.Compartment].Name
	}
	switch e.Kind {
	case DrillBreach:
		return fmt.Sprintf("breach %s", name)
	case DrillPump:
		if e.PumpM3h > 0 {
			return fmt.Sprintf("pump %s %.0f m3/h", name, e.PumpM3h)
		}
		return fmt.Sprintf("pump %s stopped", name)
	case DrillConnection:
		if e.Open {
			return "connection " + e.Name + " open"
		}
		return "connection " + e.Name + " closed"
	case DrillMark:
		if e.Flooded {
			return "mark " + name + " flooded"
		}
		return "mark " + name + " dry"
	case DrillCounterflood:
		if e.Open {
			return "counter-flood " + name + " open"
		}
		return "counter-flood " + name + " closed"
	case DrillReport, DrillNote:
		return e.Kind.String()
	}
	return e.Kind.String()
}

// Physical reports whether the event changes the truth (a breach, a pump,
// a connection); notes, reports and marks do not.
func (e DrillEvent) Physical() bool {
	return e.Kind == DrillBreach || e.Kind == DrillPump || e.Kind == DrillConnection || e.Kind == DrillCounterflood
}
