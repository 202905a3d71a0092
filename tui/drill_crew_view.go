package tui

import (
	"fmt"
	"sort"
	"strings"

	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/report"
)

// This file draws the crew's view of a drill: only what a damage-control
// party would have. The draft marks and the inclinometer as read each
// minute (with the reading errors of engine.CrewReading), what they have
// been told (notes, reports, alarms), and their own picture: what they
// marked flooded and the pumps they ordered. Nothing of the truth: no
// water, no flooded list, no true heel or drafts.

// crewReadings returns the readings of the last n whole minutes, newest
// last.
func (m *drillModel) crewReadings(n int) []engine.Reading {
	v := m.d.Vessel()
	var out []engine.Reading
	for _, r := range m.d.Rows() {
		if r.Event != "" || r.Position == nil {
			continue
		}
		out = append(out, engine.CrewReading(v, *r.Position, r.Minutes, m.sc.Seed))
	}
	if len(out) > n {
		out = out[len(out)-n:]
	}
	return out
}

func (m *drillModel) crewView(w, h int) string {
	v := m.d.Vessel()
	bold := lipgloss.NewStyle().Bold(true)
	var lines []string
	hist := max(3, min(10, (h-10)/3))
	rs := m.crewReadings(hist)
	if len(rs) == 0 {
		lines = append(lines, bold.Render("Readings"), "  none yet")
	} else {
		last := rs[len(rs)-1]
		lines = append(lines, bold.Render(fmt.Sprintf("Readings at %s", clock(last.Minutes)))+"   inclinometer "+report.HeelShort(last.HeelDeg, 1))
		var marks []string
		for _, mr := range last.Drafts {
			marks = append(marks, fmt.Sprintf("%s %.2f", v.DraftMarks[mr.Mark].Name, mr.DraftM))
		}
		if len(marks) < len(v.DraftMarks) {
			marks = append(marks, fmt.Sprintf("(%d marks cannot be read)", len(v.DraftMarks)-len(marks)))
		}
		lines = append(lines, wrapItems(marks, w-2, "  ")...)
		lines = append(lines, fmt.Sprintf("  %-7s %9s %8s %8s %8s", "time", "heel", "aft m", "fwd m", "mean m"))
		for _, r := range rs {
			a, f := report.ReadAftFwd(v, r)
			lines = append(lines, fmt.Sprintf("  %-7s %9s %8s %8s %8s", clock(r.Minutes), report.HeelShort(r.HeelDeg, 1),
				report.Fixed(a, 2, ""), report.Fixed(f, 2, ""), report.Fixed((a+f)/2, 2, "")))
		}
		if len(rs) >= 2 {
			a0, f0 := report.ReadAftFwd(v, rs[0])
			a1, f1 := report.ReadAftFwd(v, rs[len(rs)-1])
			dt := rs[len(rs)-1].Minutes - rs[0].Minutes
			lines = append(lines, fmt.Sprintf("  over %s: heel %s, mean draft %s", report.Duration(dt*60),
				report.Signed(rs[len(rs)-1].HeelDeg-rs[0].HeelDeg, 1, "°"), report.Signed(((a1+f1)-(a0+f0))/2*100, 0, "cm")))
		}
	}
	lines = append(lines, "")
	if m.pick != pickNone {
		return strings.Join(append(lines, m.pickerView(w, h-len(lines))...), "\n")
	}
	picture := m.crewPicture(w)
	for _, l := range m.diagnosis {
		picture = append(picture, clipText(l, w))
	}
	room := h - len(lines) - len(picture) - 1
	feed := report.CrewFeed(m.d)
	lines = append(lines, bold.Render("Told"))
	if len(feed) == 0 {
		lines = append(lines, "  nothing yet")
	}
	lines = append(lines, toldLines(feed, w, room)...)
	lines = append(lines, picture...)
	return strings.Join(lines, "\n")
}

// toldLines lays out what the crew has been told, each message whole
// (wrapped under its time, not cut: a report from a party is read to its
// end), the newest that fit in room lines (all of them when room ≤ 0).
func toldLines(feed []report.CrewMessage, w, room int) []string {
	var entries [][]string
	for _, f := range feed {
		stamp := fmt.Sprintf("  %s  ", clock(f.Minutes))
		e := wrapWords(strings.Fields(f.Text), w, strings.Repeat(" ", lipgloss.Width(stamp)))
		if len(e) == 0 {
			e = []string{stamp}
		}
		e[0] = stamp + strings.TrimLeft(e[0], " ")
		for i := range e {
			e[i] = clipText(e[i], w)
		}
		entries = append(entries, e)
	}
	n, start := 0, len(entries)
	for start > 0 && (room <= 0 || n == 0 || n+len(entries[start-1]) <= room) {
		start--
		n += len(entries[start])
	}
	var out []string
	for _, e := range entries[start:] {
		out = append(out, e...)
	}
	return out
}

// crewPicture is what the crew has marked and ordered.
func (m *drillModel) crewPicture(w int) []string {
	v := m.d.Vessel()
	bold := lipgloss.NewStyle().Bold(true)
	var marked, pumps []string
	for i, c := range v.Compartments {
		if m.marks[i] {
			marked = append(marked, c.Name)
		}
	}
	var on []int
	for i := range m.ordered {
		on = append(on, i)
	}
	sort.Ints(on)
	told := map[int]bool{} // a pump the crew has been told has stopped
	for _, e := range m.d.Log() {
		if e.Kind == engine.DrillPump {
			told[e.Compartment] = e.PumpM3h == 0 && e.Text != ""
		}
	}
	for _, i := range on {
		p := fmt.Sprintf("%s %.0f m³/h", v.Compartments[i].Name, m.ordered[i])
		if told[i] {
			p += " (reported stopped)"
		}
		pumps = append(pumps, p)
	}
	out := []string{"", bold.Render("Our picture")}
	if len(marked) == 0 {
		marked = []string{"nothing"}
	}
	if len(pumps) == 0 {
		pumps = []string{"none"}
	}
	out = append(out, clipText("  Marked flooded: "+strings.Join(marked, ", "), w))
	out = append(out, clipText("  Pumps ordered:  "+strings.Join(pumps, ", "), w))
	var inl []string
	for i, c := range v.Compartments {
		if m.inlets[i] {
			inl = append(inl, c.Name)
		}
	}
	if len(inl) > 0 {
		out = append(out, clipText("  Counter-flooding: "+strings.Join(inl, ", "), w))
	}
	var open []string
	for i, c := range v.Connections {
		if m.doors[i] {
			open = append(open, c.Name)
		}
	}
	if len(v.Connections) > 0 {
		if len(open) == 0 {
			open = []string{"none"}
		}
		out = append(out, clipText("  Open as we believe: "+strings.Join(open, ", "), w))
	}
	return out
}

// pickerView lists the compartments to choose from, in the vessel's order
// (the same list whatever the truth).
func (m *drillModel) pickerView(w, h int) []string {
	v := m.d.Vessel()
	title := map[pickFor]string{pickMark: "Mark flooded / dry", pickPump: "Start pumping on", pickStop: "Stop pumping on",
		pickCounter: "Counter-flood: open / shut the sea inlet into", pickDoor: "Doors and valves: order open / shut",
		pickDoorTruth: "Doors and valves (instructor): open / shut in truth",
		pickBreach:    "Breach in (instructor)", pickFail: "Pump fails on (instructor)"}[m.pick]
	out := []string{lipgloss.NewStyle().Bold(true).Render(title)}
	rows := max(1, h-1)
	top := max(0, min(m.cursor-rows/2, len(m.pickList)-rows))
	for k := top; k < len(m.pickList) && k < top+rows; k++ {
		i := m.pickList[k]
		mark := " "
		if (m.pick == pickMark && m.marks[i]) || (m.pick == pickCounter && m.inlets[i]) {
			mark = "✓"
		}
		name := ""
		switch m.pick {
		case pickDoor:
			c := v.Connections[i]
			state := "shut"
			if m.doors[i] {
				state = "open"
			}
			name = fmt.Sprintf("%s (%s, %s–%s): we believe it %s", c.Name, c.Kind, v.Compartments[c.From].Name, v.Compartments[c.To].Name, state)
		case pickDoorTruth:
			c := v.Connections[i]
			state := "shut"
			if c.Open {
				state = "open"
			}
			name = fmt.Sprintf("%s: %s", c.Name, state)
		default:
			name = v.Compartments[i].Name
		}
		line := fmt.Sprintf("  %s %s", mark, name)
		if k == m.cursor {
			line = lipgloss.NewStyle().Reverse(true).Render(fmt.Sprintf("> %s %s", mark, name))
		}
		out = append(out, clipText(line, w))
	}
	return out
}

// wrapWords lays words out on lines of at most w cells, one space apart,
// each line indented.
func wrapWords(words []string, w int, indent string) []string {
	return wrapJoined(words, w, indent, " ")
}

// wrapItems lays items out on lines of at most w cells, two spaces apart,
// each line indented.
func wrapItems(items []string, w int, indent string) []string {
	return wrapJoined(items, w, indent, "  ")
}

// wrapJoined lays parts out on lines of at most w cells (measured as the
// terminal shows them), sep between them, each line indented; a part
// wider than a line stands alone on its line.
func wrapJoined(parts []string, w int, indent, sep string) []string {
	var out []string
	cur := indent
	for _, it := range parts {
		if len(cur) > len(indent) && lipgloss.Width(cur)+lipgloss.Width(sep)+lipgloss.Width(it) > w {
			out = append(out, cur)
			cur = indent
		}
		if len(cur) > len(indent) {
			cur += sep
		}
		cur += it
	}
	if len(cur) > len(indent) {
		out = append(out, cur)
	}
	return out
}
