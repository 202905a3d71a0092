package report

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"

	"heelwatch/engine"
)

// This file writes a drill: its timeline (JSON and text), what the crew is
// told along it, and its log as a scenario file that replays it.

// Drill is a played drill and what is known of its scenario.
type Drill struct {
	Scenario  string // the scenario's name
	File      string // the scenario file
	VesselRef string // its vessel key
	// ConditionRef is its condition key ("" for the vessel file's own).
	ConditionRef string
	About        string
	Seed         int64
	Alarms       []int
	Played       *engine.Drill
	Version      string
	AlarmLevel   float64
	// Events, when set, are the events the log holds (the scenario's and
	// those added); else the events the drill has applied.
	Events []engine.DrillEvent
}

type drillRowDoc struct {
	Minutes   Num      `json:"minutes"`
	Event     string   `json:"event"`
	HeelDeg   Num      `json:"heel_deg"`
	DraftAftM Num      `json:"draft_aft_m"`
	DraftFwdM Num      `json:"draft_fwd_m"`
	Flooded   []string `json:"flooded"`
	DeckEdgeM Num      `json:"deck_edge_m"`
	WaterM3   Num      `json:"water_m3"`
}

type drillDoc struct {
	Scenario string        `json:"scenario"`
	Vessel   string        `json:"vessel"`
	Minutes  Num           `json:"minutes"`
	End      string        `json:"end"`
	Timeline []drillRowDoc `json:"timeline"`
	Version  string        `json:"heelwatch_version"`
}

// DrillEnd says how the drill ended: "time-limit", or "sinks"/"capsizes"
// (or "not converged") when she was lost.
func DrillEnd(d *engine.Drill) string {
	if !d.Lost() {
		return "time-limit"
	}
	rows := d.Rows()
	if ne := rows[len(rows)-1].NoEq; ne != nil {
		return ne.Outcome.String()
	}
	return "lost"
}

// DrillJSON writes the timeline of a played drill (conventions: minutes,
// event, heel_deg, draft_aft_m, draft_fwd_m, flooded; and heelwatch's own
// deck_edge_m, the least height of the deck edge above the water, and
// water_m3, all the sea water in her). Figures are null where she has no
// floating position.
func DrillJSON(w io.Writer, dr Drill) error {
	d := dr.Played
	doc := drillDoc{Scenario: dr.Scenario, Vessel: d.Vessel().Name, Minutes: Num(d.EndMinutes()), End: DrillEnd(d), Timeline: []drillRowDoc{}, Version: dr.Version}
	nan := Num(math.NaN())
	for _, r := range d.Rows() {
		row := drillRowDoc{Minutes: Num(r.Minutes), Event: r.Event, HeelDeg: nan, DraftAftM: nan, DraftFwdM: nan, DeckEdgeM: nan, Flooded: append([]string{}, r.Flooded...)}
		if p := r.Position; p != nil {
			row.HeelDeg, row.DraftAftM, row.DraftFwdM, row.DeckEdgeM = Num(p.HeelDeg), Num(p.DraftAftM), Num(p.DraftFwdM), Num(p.DeckEdge.HeightM)
		}
		var wsum float64
		for _, x := range r.WaterM3 {
			wsum += x
		}
		row.WaterM3 = Num(wsum)
		doc.Timeline = append(doc.Timeline, row)
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(doc)
}

// DrillText writes the timeline as a table.
func DrillText(w io.Writer, dr Drill) error {
	d := dr.Played
	var b strings.Builder
	fmt.Fprintf(&b, "Drill %q on %s, %s min\n\n", dr.Scenario, d.Vessel().Name, Fixed(d.EndMinutes(), 0, ""))
	fmt.Fprintf(&b, "%7s  %-28s %9s %7s %7s %8s  %s\n", "min", "event", "heel", "aft m", "fwd m", "deck m", "flooded")
	for _, r := range d.Rows() {
		heel, aft, fwd, deck := "—", "—", "—", "—"
		if p := r.Position; p != nil {
			heel, aft, fwd, deck = HeelShort(p.HeelDeg, 1), Fixed(p.DraftAftM, 2, ""), Fixed(p.DraftFwdM, 2, ""), Fixed(p.DeckEdge.HeightM, 2, "")
		}
		fmt.Fprintf(&b, "%7s  %-28s %9s %7s %7s %8s  %s\n", Fixed(r.Minutes, 1, ""), clip(r.Event, 28), heel, aft, fwd, deck, strings.Join(r.Flooded, ", "))
	}
	fmt.Fprintf(&b, "\nEnd: %s\n", DrillEnd(d))
	_, err := io.WriteString(w, b.String())
	return err
}

func clip(s string, n int) string {
	r := []rune(s)
	if len(r) <= n {
		return s
	}
	return string(r[:n-1]) + "…"
}

// CrewMessage is something the crew is told, at a moment.
type CrewMessage struct {
	Minutes float64
	Text    string
}

// CrewFeed returns what the crew has been told so far: the text of each
// event that has one (not the crew's own notes), and each alarm that has
// sounded, in time order.
func CrewFeed(d *engine.Drill) []CrewMessage {
	v := d.Vessel()
	var out []CrewMessage
	for _, e := range d.Log() {
		if e.Text != "" && e.Kind != engine.DrillMark && e.By != engine.ByCrew {
			out = append(out, CrewMessage{e.Minutes, e.Text})
		}
	}
	for _, a := range d.Alarms() {
		out = append(out, CrewMessage{a.Minutes, "High-level alarm: " + v.Compartments[a.Compartment].Name})
	}
	sort.SliceStable(out, func(i, j int) bool { return out[i].Minutes < out[j].Minutes })
	return out
}

// ReadAftFwd returns the mean of the drafts read at the aftmost and at the
// foremost marks of a reading (NaN where no mark there read).
func ReadAftFwd(v *engine.Vessel, r engine.Reading) (aft, fwd float64) {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, m := range r.Drafts {
		x := v.DraftMarks[m.Mark].XM
		lo, hi = math.Min(lo, x), math.Max(hi, x)
	}
	var sa, sf float64
	var na, nf int
	for _, m := range r.Drafts {
		x := v.DraftMarks[m.Mark].XM
		if x == lo {
			sa, na = sa+m.DraftM, na+1
		}
		if x == hi {
			sf, nf = sf+m.DraftM, nf+1
		}
	}
	aft, fwd = math.NaN(), math.NaN()
	if na > 0 {
		aft = sa / float64(na)
	}
	if nf > 0 {
		fwd = sf / float64(nf)
	}
	return aft, fwd
}

// DrillLog writes the drill's log as a scenario file: the scenario's keys
// and every event applied, the crew's and the instructor's with their by.
// Played again, it gives the same drill.
func DrillLog(w io.Writer, dr Drill) error {
	d := dr.Played
	v := d.Vessel()
	var b strings.Builder
	b.WriteString("# heelwatch drill log: a scenario file that replays the drill.\n")
	fmt.Fprintf(&b, "format = 1\nname = %s\n", strconv.Quote(dr.Scenario))
	if dr.About != "" {
		fmt.Fprintf(&b, "about = %s\n", strconv.Quote(dr.About))
	}
	fmt.Fprintf(&b, "vessel = %s\nminutes = %s\nseed = %d\n", strconv.Quote(dr.VesselRef), ftoa(d.EndMinutes()), dr.Seed)
	if dr.ConditionRef != "" {
		fmt.Fprintf(&b, "condition = %s\n", strconv.Quote(dr.ConditionRef))
	}
	if len(dr.Alarms) > 0 {
		var names []string
		for _, i := range dr.Alarms {
			names = append(names, strconv.Quote(v.Compartments[i].Name))
		}
		fmt.Fprintf(&b, "alarms = [%s]\n", strings.Join(names, ", "))
	}
	events := dr.Events
	if events == nil {
		events = d.Log()
	}
	for _, e := range events {
		b.WriteString("\n[[event]]\n")
		fmt.Fprintf(&b, "minutes = %s\nkind = %q\n", ftoa(e.Minutes), e.Kind.String())
		if e.By != "" && e.By != engine.ByScenario {
			fmt.Fprintf(&b, "by = %q\n", e.By)
		}
		if e.Compartment >= 0 && e.Compartment < len(v.Compartments) {
			fmt.Fprintf(&b, "compartment = %s\n", strconv.Quote(v.Compartments[e.Compartment].Name))
		}
		switch e.Kind {
		case engine.DrillBreach:
			fmt.Fprintf(&b, "area = %s\nz = %s\ncd = %s\n", ftoa(e.Hole.AreaM2), ftoa(e.Hole.ZM), ftoa(e.Hole.Cd))
		case engine.DrillPump:
			if e.PumpM3h > 0 {
				fmt.Fprintf(&b, "state = \"starts\"\ncapacity_m3h = %s\n", ftoa(e.PumpM3h))
			} else {
				b.WriteString("state = \"stops\"\n")
			}
		case engine.DrillConnection:
			fmt.Fprintf(&b, "connection = %s\nopen = %t\n", strconv.Quote(e.Name), e.Open)
		case engine.DrillMark:
			fmt.Fprintf(&b, "flooded = %t\n", e.Flooded)
		case engine.DrillCounterflood:
			fmt.Fprintf(&b, "area = %s\nopen = %t\n", ftoa(e.Hole.AreaM2), e.Open)
		}
		if e.Text != "" {
			fmt.Fprintf(&b, "text = %s\n", strconv.Quote(e.Text))
		}
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// ftoa writes x so that it reads back exactly.
func ftoa(x float64) string {
	s := strconv.FormatFloat(x, 'g', -1, 64)
	if !strings.ContainsAny(s, ".eE") {
		s += ".0"
	}
	return s
}
