package report

import (
	"fmt"
	"strings"

	"heelwatch/engine"
)

// This file holds the one wording of how a flooding run ended, for the
// dashboard's panel and log, the event lists and the command line's
// report.

// FloodHeadline says how a run ended in a few words, for an event line or a
// panel title: "levels equal", "SHE SINKS", …
func FloodHeadline(e engine.FloodEnd) string {
	switch e {
	case engine.FloodEqualised:
		return "levels equal"
	case engine.FloodPumpsHold:
		return "pumps hold the level"
	case engine.FloodKeptDry:
		return "pumps keep it dry"
	case engine.FloodNoInflow:
		return "nothing comes in"
	case engine.FloodFull:
		return "compartment full"
	case engine.FloodSinks:
		return "SHE SINKS"
	case engine.FloodCapsizes:
		return "SHE CAPSIZES"
	case engine.FloodTimeLimit:
		return "time limit, still filling"
	}
	return "no answer"
}

// pumpsBarelyHold is the share of the water the space takes open to the
// sea above which pumps that hold the level are said not to save it.
const pumpsBarelyHold = 0.9

// FloodOutcome says how run r ended in one sentence, in two parts: head,
// the words that say it ("levels equal", "pumps hold", "SHE SINKS"; a
// panel writes them in capitals), and rest, when and with how much water
// (" after 1 h 05 min, 180 m³ in").
func FloodOutcome(r engine.FloodReport) (head, rest string) {
	at := Duration(r.EndS)
	in := Fixed(r.FinalWaterM3, 0, "m³ in")
	reason := strings.TrimPrefix(r.EndReason, r.End.String()+": ")
	switch r.End {
	case engine.FloodEqualised:
		return "levels equal", fmt.Sprintf(" after %s, %s", Duration(r.EqualiseS), in)
	case engine.FloodPumpsHold:
		held := fmt.Sprintf("the level %s m below the sea from %s: sounding %s m, %s",
			Fixed(r.SteadyHeadM, 3, ""), at, Fixed(r.Final.SoundingM, 2, ""), in)
		if lb := r.LostBuoyancyWaterM3; lb > 0 && r.FinalWaterM3 >= pumpsBarelyHold*lb {
			// Held only just below the sea: the pumps slow the
			// filling but do not save the space.
			return "floods despite the pumps", fmt.Sprintf(": they hold %s (%.0f %% of the water it takes open to the sea)",
				held, 100*r.FinalWaterM3/lb)
		}
		return "pumps hold", " " + held
	case engine.FloodKeptDry:
		return "pumps keep it dry", ": they take all that the hole lets in"
	case engine.FloodNoInflow:
		return "nothing comes in", ": the hole is clear of the water"
	case engine.FloodFull:
		return "compartment full", fmt.Sprintf(" after %s, %s, its top below the sea", at, in)
	case engine.FloodSinks:
		return "SHE SINKS", fmt.Sprintf(" after %s, with %s: %s", at, in, reason)
	case engine.FloodCapsizes:
		return "SHE CAPSIZES", fmt.Sprintf(" after %s, with %s: %s", at, in, reason)
	case engine.FloodTimeLimit:
		return "still filling", fmt.Sprintf(" at the time limit (%s), %s", at, in)
	}
	return "no answer", ": " + r.EndReason
}
