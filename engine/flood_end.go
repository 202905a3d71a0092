package engine

// This file says how a flooding run ends (FloodEnd) and what a solver's
// failure means for it (outcomeEnd).

// FloodEnd is how a flooding run ends.
type FloodEnd int

const (
	FloodRunning   FloodEnd = iota // not ended yet
	FloodEqualised                 // the level inside has come to the sea's (risen, or fallen for a tank whose contents stood above it): head zero
	FloodPumpsHold                 // the pumps hold the level where the inflow equals their capacity
	FloodKeptDry                   // the pumps take all that comes in: no water stays
	FloodNoInflow                  // the hole is clear of the water: nothing comes in
	FloodFull                      // the compartment filled to its top while still below the sea
	FloodSinks                     // no floating position: she sinks
	FloodCapsizes                  // no floating position: she capsizes
	FloodTimeLimit                 // the time limit came first
	FloodFailed                    // the solver found no answer (not converged) or the step bound was reached
)

func (e FloodEnd) String() string {
	switch e {
	case FloodRunning:
		return "running"
	case FloodEqualised:
		return "equalised"
	case FloodPumpsHold:
		return "pumps-hold"
	case FloodKeptDry:
		return "kept-dry"
	case FloodNoInflow:
		return "no-inflow"
	case FloodFull:
		return "full"
	case FloodSinks:
		return "sinks"
	case FloodCapsizes:
		return "capsizes"
	case FloodTimeLimit:
		return "time-limit"
	case FloodFailed:
		return "failed"
	}
	return "unknown"
}

func outcomeEnd(o Outcome) FloodEnd {
	switch o {
	case Sinks:
		return FloodSinks
	case Capsizes:
		return FloodCapsizes
	}
	return FloodFailed
}
