package engine

import (
	"fmt"
	"math"
	"strings"
)

// This file finds the final state of flooding that spreads through the
// ship: from the compartments open to the sea, water reaches every
// compartment behind an open connection whose sill is under the water
// inside, and behind every opening that leads into a compartment and goes
// under; the ship is solved again with those open too, to a fixed point.

// SpreadLink is one way water went further in the final state.
type SpreadLink struct {
	Compartment int     // the compartment it floods
	From        int     // the compartment the water comes from; -1 for the sea (an opening)
	Connection  int     // index into Vessel.Connections, -1 for an opening
	Opening     int     // index into Vessel.Openings, -1 for a connection
	Via         string  // the connection's or the opening's name
	Kind        string  // its kind
	DepthM      float64 // how far its sill (or the opening) is under the water, m
	HeelDeg     float64 // the heel of the stage at which it was found under water
	Round       int     // 1 for the first spread beyond the compartments opened, …
	Message     string  // the link in plain words
}

// Saving says what closing one link would do when the ship is lost
// through progressive flooding.
type Saving struct {
	Link     SpreadLink
	Position *Position // where she would float with it closed; nil if she is lost all the same
	Message  string
}

// Spread is the final state of progressive flooding.
type Spread struct {
	Start   Damage // as given
	Damage  Damage // final: every compartment reached open to the sea
	Flooded []int  // every compartment open to the sea at the end, the given first, then in order reached
	Links   []SpreadLink
	// Position is the final floating position; nil with NoEq when she does
	// not float at the end.
	Position *Position
	NoEq     *NoEquilibrium
	// StartPosition is where she would float with only the given
	// compartments open; nil with StartNoEq when she would not.
	StartPosition *Position
	StartNoEq     *NoEquilibrium
	// LostBy is the link after which she no longer floats, when she floats
	// with the given compartments open but is lost through the spread; nil
	// otherwise.
	LostBy *SpreadLink
	// Savings says, for each connection or opening of the chain, what
	// closing it would keep (only when LostBy is set).
	Savings []Saving
}

// Progressive works out how flooding spreads from damage d of v and where
// she floats at the end.
//
// Method (a fixed point): solve with the compartments open to the sea;
// the water inside an open compartment stands at the sea's level, so every
// open connection with one end flooded whose sill lies under the sea's
// plane (along the true vertical) floods the other end, and every opening
// that is not weathertight, leads into a compartment and lies under the
// water floods that compartment; open those and solve again, until
// nothing more floods or she no longer floats. At most one round per
// compartment. Water held as an added weight (SpaceState.WaterM3) does not
// spread in this static picture; the run over time (NetworkRun) moves it.
//
// Validity: the final state of quasi-static flooding where every path,
// once wetted, has time to equalise; a connection's sill is its lowest
// point.
func Progressive(v *Vessel, d Damage) Spread {
	sp := progressive(v, d, -1, -1)
	if sp.LostBy == nil {
		return sp
	}
	// What closing each link of the chain would keep.
	for _, l := range sp.Links {
		alt := progressive(v, d, l.Connection, l.Opening)
		s := Saving{Link: l, Position: alt.Position}
		if alt.Position != nil {
			s.Message = fmt.Sprintf("closing %s keeps her afloat: heel %.1f°, drafts %.2f m aft and %.2f m forward, %d compartment(s) flooded",
				l.Via, alt.Position.HeelDeg, alt.Position.DraftAftM, alt.Position.DraftFwdM, len(alt.Flooded))
		} else {
			s.Message = fmt.Sprintf("closing %s alone does not save her", l.Via)
		}
		sp.Savings = append(sp.Savings, s)
	}
	return sp
}

// progressive runs the fixed point with connection shutC (−1: none) held
// closed and opening shutO (−1: none) held weathertight.
func progressive(v *Vessel, d Damage, shutC, shutO int) Spread {
	n := len(v.Compartments)
	cur := make(Damage, n)
	copy(cur, d)
	sp := Spread{Start: append(Damage(nil), cur...)}
	for i := range cur {
		if cur[i].Open {
			sp.Flooded = append(sp.Flooded, i)
		}
	}
	var guess Plane
	warm := false
	for round := 0; round <= n; round++ {
		pos, err := NewProblem(v, cur).EquilibriumFrom(guess, warm)
		if err != nil {
			sp.NoEq = asNoEquilibrium(err)
			if round == 0 {
				sp.StartNoEq = sp.NoEq
			} else if sp.StartPosition != nil {
				// Lost in this round: the first link found in it.
				for k := range sp.Links {
					if sp.Links[k].Round == round {
						l := sp.Links[k]
						sp.LostBy = &l
						break
					}
				}
			}
			break
		}
		p := pos
		sp.Position = &p
		if round == 0 {
			sp.StartPosition = &p
		}
		guess, warm = pos.Plane, true
		var found []SpreadLink
		reached := map[int]bool{}
		for ci, c := range v.Connections {
			if !c.Open || ci == shutC {
				continue
			}
			a, b := cur[c.From].Open, cur[c.To].Open
			if a == b {
				continue
			}
			from, to := c.From, c.To
			if b {
				from, to = to, from
			}
			depth := -pos.Plane.Height(c.X, c.Y, c.Z)
			if !(depth > 0) || reached[to] {
				continue
			}
			reached[to] = true
			found = append(found, SpreadLink{Compartment: to, From: from, Connection: ci, Opening: -1,
				Via: c.Name, Kind: c.Kind, DepthM: depth, HeelDeg: pos.HeelDeg, Round: round + 1})
		}
		for oi, o := range v.Openings {
			j := v.LeadsToIndex(o)
			if j < 0 || o.Weathertight || oi == shutO || cur[j].Open || reached[j] {
				continue
			}
			depth := -pos.Plane.Height(o.X, o.Y, o.Z)
			if !(depth > 0) {
				continue
			}
			reached[j] = true
			found = append(found, SpreadLink{Compartment: j, From: -1, Connection: -1, Opening: oi,
				Via: o.Name, Kind: o.Kind, DepthM: depth, HeelDeg: pos.HeelDeg, Round: round + 1})
		}
		if len(found) == 0 {
			break
		}
		for _, l := range found {
			l.Message = linkWords(v, l)
			cur[l.Compartment] = SpaceState{Open: true, Permeability: cur[l.Compartment].Permeability}
			sp.Flooded = append(sp.Flooded, l.Compartment)
			sp.Links = append(sp.Links, l)
		}
		sp.Position = nil
	}
	sp.Damage = cur
	return sp
}

// linkWords says one link: "Hold 4 floods from Hold 3 through WT door 3/4
// (door, open), its sill 1.20 m under the water" or "Hold 4 floods through
// its vent Vent 4, under water at a heel of 12.3° to starboard".
func linkWords(v *Vessel, l SpreadLink) string {
	to := v.Compartments[l.Compartment].Name
	if l.Connection >= 0 {
		return fmt.Sprintf("%s floods from %s through %s (%s, open), its sill %.2f m under the water",
			to, v.Compartments[l.From].Name, l.Via, l.Kind, l.DepthM)
	}
	return fmt.Sprintf("%s floods through %s (%s), under water by %.2f m when she lies at %s",
		to, l.Via, l.Kind, l.DepthM, heelPhrase(l.HeelDeg))
}

// heelPhrase says a heel for a sentence: "a heel of 12.3° to starboard",
// "upright".
func heelPhrase(deg float64) string {
	if math.Abs(deg) < 0.05 {
		return "upright"
	}
	side := "starboard"
	if deg < 0 {
		side = "port"
	}
	return fmt.Sprintf("a heel of %.1f° to %s", math.Abs(deg), side)
}

// Chain says the whole spread in plain words: the compartments open to
// the sea, then each link in turn; "" when nothing spreads.
func (sp Spread) Chain(v *Vessel) string {
	if len(sp.Links) == 0 {
		return ""
	}
	var b strings.Builder
	var start []string
	for _, i := range sp.Flooded {
		if sp.Start.state(i).Open {
			start = append(start, v.Compartments[i].Name)
		}
	}
	fmt.Fprintf(&b, "Open to the sea: %s.", strings.Join(start, ", "))
	for _, l := range sp.Links {
		fmt.Fprintf(&b, " Then %s.", l.Message)
	}
	return b.String()
}

// SpreadFlags says the spread as flags for a screen: one Danger flag per
// link ("water-spreads"), and when she is lost through the spread, what
// does it ("lost-through-spread") and what closing each link would keep.
func SpreadFlags(v *Vessel, sp Spread) []Flag {
	var out []Flag
	for _, l := range sp.Links {
		out = append(out, Flag{Code: "water-spreads", Severity: Danger, Message: l.Message})
	}
	if sp.LostBy != nil {
		out = append(out, Flag{Code: "lost-through-spread", Severity: Danger,
			Message: "she floats with the compartments opened but is lost through progressive flooding: " + sp.LostBy.Message})
		for _, s := range sp.Savings {
			sev := Caution
			if s.Position != nil {
				sev = Danger
			}
			out = append(out, Flag{Code: "closing-saves", Severity: sev, Message: s.Message})
		}
	}
	for _, c := range CrossFloodingTimes(v, sp) {
		sev := Info
		if !c.WithinTen {
			sev = Caution
		}
		out = append(out, Flag{Code: "cross-flooding-time", Severity: sev,
			Message: fmt.Sprintf("%s equalises in %.0f s by MSC.362(92), %s", c.Name, c.TimeS, CrossFloodingVerdict(c.TimeS))})
	}
	return out
}
