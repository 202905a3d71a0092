package engine

import (
	"fmt"
	"math"
)

// crossFloodingWords names each shut cross-flooding fitting that joins a
// compartment open to the sea under d to one that is not, and says where
// she would lie with both open once it has equalised (solved from the hull
// geometry, as solve --open of both). Opening it is the righting the
// fitting was built for (SOLAS II-1 Reg. 7-2), but it floods a second space
// and costs freeboard on the way: it is named as an option to weigh, never
// marked advisable. "" when there is none.
func crossFloodingWords(v *Vessel, d Damage) string {
	out := ""
	for _, c := range v.Connections {
		if c.Kind != "cross-flooding" || c.Open {
			continue
		}
		from, to := c.From, c.To
		if d.state(to).Open && !d.state(from).Open {
			from, to = to, from
		}
		if !d.state(from).Open || d.state(to).Open {
			continue
		}
		both := append(Damage(nil), d...)
		both[to] = SpaceState{Open: true}
		name := fmt.Sprintf(" %s (shut) joins %s, open to the sea, to %s: opening it lets the water across.", c.Name, v.Compartments[from].Name, v.Compartments[to].Name)
		pos, err := Solve(v, both)
		if err != nil {
			out += name + " With both flooded there is no floating position (" + asNoEquilibrium(err).Reason + "): do not open it."
			continue
		}
		up := ""
		if !math.IsNaN(pos.GMUprightM) {
			up = fmt.Sprintf(", upright GM %.2f m", pos.GMUprightM)
		}
		out += name + fmt.Sprintf(" With both flooded, once it has equalised, she would lie %s, deck edge %.2f m clear%s; weigh the second space's water and the time it takes before opening it.",
			heelWords(pos.HeelDeg), pos.DeckEdge.HeightM, up)
	}
	return out
}
