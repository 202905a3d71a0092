package engine

import (
	"fmt"
	"math"
)

// This file checks a righting option while it is carried out, not only
// when it is done: a tank being filled, pumped or moved passes through
// every fill between before and after, slack, and a ship that is safe at
// both ends may capsize in between. An option is advisable only if at
// every stage she floats, nothing goes under that was clear (deck edge,
// unprotected opening), and she ends with positive upright GM; and the
// time it takes at the file's pump rates is said.

// RemedyStages is how many equal steps of the amount an option is solved
// at between before and after (the last is the option itself): at least
// ten, as the issue that brought the rule asks.
const RemedyStages = 10

// remedyStageCheck solves option r (candidate c, amount r.MassT) at each
// step k/RemedyStages of its amount, k = 1 … RemedyStages−1 (the last step
// is r itself, solved already), counting the solves, and records in r the
// steps checked and the first one that fails, with why. now is the state
// before the option. It stops at the first failure or when the solves run
// out (then r.StagesChecked < RemedyStages and the option cannot be called
// advisable).
func remedyStageCheck(v *Vessel, d Damage, c remedyCandidate, r *Remedy, now remedyFigures, solves *int) {
	if r.Position == nil {
		return
	}
	for k := 1; k < RemedyStages; k++ {
		if *solves+1 > RemedyMaxSolves {
			return
		}
		f := float64(k) / RemedyStages
		m := f * r.MassT
		changes, _, _, after := remedyLoading(v, c, m)
		w, err := remedyVessel(v, changes)
		if err != nil {
			r.StageFail = fmt.Sprintf("at %.0f %% of it (%.0f t) the loading is refused: %v", 100*f, m, err)
			return
		}
		pos, err := NewProblem(w, d).Equilibrium()
		*solves++
		at := fmt.Sprintf("at %.0f %% of it (%.0f t, %s)", 100*f, m, remedyFillWords(r, after))
		if err != nil {
			ne := asNoEquilibrium(err)
			r.StageFail = fmt.Sprintf("%s %s", at, ne.Outcome.Plain())
			return
		}
		fig := remedyMeasure(&pos)
		switch {
		case fig.deck < 0 && (now.deck >= 0 || fig.deck < now.deck):
			r.StageFail = fmt.Sprintf("%s the deck edge goes under (%.2f m)", at, -fig.deck)
			return
		case fig.openingM < 0 && (!(now.openingM < 0) || fig.openingM < now.openingM):
			r.StageFail = fmt.Sprintf("%s the unprotected opening %s goes under (%.2f m)", at, fig.opening, -fig.openingM)
			return
		}
		r.StagesChecked = k
	}
	r.StagesChecked = RemedyStages
}

// remedyFillWords says the tanks' fills at a step: "Wing P 49 %".
func remedyFillWords(r *Remedy, fills []float64) string {
	s := ""
	for i, f := range fills {
		if i > 0 {
			s += ", "
		}
		if i < len(r.TankNames) {
			s += r.TankNames[i] + " "
		}
		s += fmt.Sprintf("%.0f %%", 100*f)
	}
	return s
}

// remedyDuration sets how long option r (candidate c) takes at the pump
// rate the file gives the tank that does the work: the tank filled from
// the sea, the tank pumped out, the tank emptied in a transfer (or, without
// a rate there, the tank filled). NaN and no rate when the file gives none.
func remedyDuration(v *Vessel, c remedyCandidate, r *Remedy) {
	r.DurationS, r.PumpM3h = math.NaN(), 0
	var tank, rho float64 = -1, v.WaterDensity
	switch c.kind {
	case RemedyFill:
		tank = float64(c.to)
	case RemedyDischarge:
		tank, rho = float64(c.from), v.Compartments[c.from].Liquid.Density
	case RemedyTransfer:
		tank, rho = float64(c.from), v.Compartments[c.from].Liquid.Density
		if !(v.Compartments[c.from].PumpM3h > 0) {
			tank = float64(c.to)
		}
	}
	if tank < 0 || !(rho > 0) {
		return
	}
	i := int(tank)
	r.PumpName = v.Compartments[i].Name
	if q := v.Compartments[i].PumpM3h; q > 0 {
		r.PumpM3h = q
		r.DurationS = r.MassT / rho / q * 3600
	}
}

// remedyTimeWords says how long it takes, or that the file gives no rate.
func remedyTimeWords(r *Remedy) string {
	if math.IsNaN(r.DurationS) {
		if r.PumpName == "" {
			return ""
		}
		return fmt.Sprintf("Time unknown: no pump rate for %s in the file.", r.PumpName)
	}
	return fmt.Sprintf("Takes about %s at %.0f m³/h (%s).", remedyHours(r.DurationS), r.PumpM3h, r.PumpName)
}

// remedyHours writes a duration of s seconds to the minute: "1 h 05 min",
// "25 min", or "under a minute".
func remedyHours(s float64) string {
	n := int64(math.Round(s / 60))
	switch {
	case n >= 60:
		return fmt.Sprintf("%d h %02d min", n/60, n%60)
	case n > 0:
		return fmt.Sprintf("%d min", n)
	}
	return "under a minute"
}
