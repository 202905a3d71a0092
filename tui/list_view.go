package tui

import (
	"fmt"

	"heelwatch/engine"
)

// listRow is one line of the compartment list: a group heading (idx −1) or
// a compartment.
type listRow struct {
	group string
	idx   int
}

// listRows groups the compartments: groups in the order their first member
// comes in the vessel file, members in file order.
func listRows(spaces []space) []listRow {
	var order []string
	members := map[string][]int{}
	for i, s := range spaces {
		if _, ok := members[s.group]; !ok {
			order = append(order, s.group)
		}
		members[s.group] = append(members[s.group], i)
	}
	var rows []listRow
	for _, g := range order {
		rows = append(rows, listRow{group: g, idx: -1})
		for _, i := range members[g] {
			rows = append(rows, listRow{group: g, idx: i})
		}
	}
	return rows
}

// listDetail is the number of lines under the list that describe the
// selected compartment.
const listDetail = 3

// listVisible is how many rows of the list fit.
func (m *model) listVisible() int { return max(1, m.lay.listH-1-listDetail) }

// ensureVisible scrolls the list so that the selected row shows, with its
// group's heading when it fits.
func (m *model) ensureVisible() {
	rows := m.rows
	vis := m.listVisible()
	r := 0
	for k, row := range rows {
		if row.idx == m.sel {
			r = k
		}
	}
	top := r
	if top > 0 && rows[top-1].idx < 0 {
		top--
	}
	if top < m.offset {
		m.offset = top
	}
	if r >= m.offset+vis {
		m.offset = r - vis + 1
	}
	m.offset = max(0, min(m.offset, len(rows)-vis))
}

// useShort is a compartment's use in at most five letters for the list.
func useShort(use string) string {
	switch use {
	case "stores":
		return "store"
	case "accommodation":
		return "accom"
	case "machinery":
		return "mach"
	case "dry cargo":
		return "cargo"
	case "containers":
		return "cntr"
	case "vehicles":
		return "vehic"
	}
	return clip(use, 5)
}

// spaceState is a compartment's state in words.
func spaceState(d engine.Damage, i int) (word, mark string) {
	if i < len(d) {
		switch {
		case d[i].Open:
			return "OPEN", "■"
		case d[i].WaterM3 > 0:
			return "part", "◧"
		}
	}
	return "intact", " "
}

// listView draws the compartment list in w × h.
func (m model) listView(w, h int) []string {
	st := m.st
	var lines []string
	nOpen := 0
	for i := range m.v.Compartments {
		if w, _ := spaceState(m.damage, i); w != "intact" {
			nOpen++
		}
	}
	head := "COMPARTMENTS"
	if nOpen > 0 {
		head += fmt.Sprintf("  %d flooded", nOpen)
	}
	lines = append(lines, st.Heading.Render(head))
	vis := max(1, h-1-listDetail)
	// columns: cursor, mark, name, use (when there is room), μ, state
	withUse := w >= listWidthWide
	nameW := max(4, w-1-1-1-4-1-6-1)
	if withUse {
		nameW -= 6
	}
	for k := m.offset; k < len(m.rows) && k < m.offset+vis; k++ {
		row := m.rows[k]
		if row.idx < 0 {
			lines = append(lines, st.Group.Render(clip("─ "+row.group, w)))
			continue
		}
		i := row.idx
		c := m.v.Compartments[i]
		word, mark := spaceState(m.damage, i)
		if sw, sm := spreadState(m.cur, m.damage, i); sw != "" {
			word, mark = sw, sm
		}
		risk := ""
		style := st.Text
		switch {
		case word != "intact":
			style = st.Open
		case m.derived.via[i] >= 0 && m.derived.height[i] < 0:
			mark, risk = "‼", "water in"
			style = st.Danger
		case i == m.derived.next:
			mark = "▲"
			style = st.AtRisk
		}
		if risk != "" {
			word = risk
		}
		cursor := " "
		if i == m.sel {
			cursor = "▸"
		}
		text := cursor + mark + " " + pad(c.Name, nameW) + " "
		if withUse {
			text += pad(useShort(m.spaces[i].use), 5) + " "
		}
		text += padLeft(muText(m.mu(m.damage, i)), 4) + " " + pad(word, 6)
		if i == m.sel {
			lines = append(lines, st.Selected.Render(pad(text, w)))
		} else {
			lines = append(lines, style.Render(text))
		}
	}
	if len(m.rows) > vis {
		// Say that the list scrolls and where we are in it.
		last := min(len(m.rows), m.offset+vis)
		more := ""
		if m.offset > 0 {
			more += "↑"
		}
		if last < len(m.rows) {
			more += "↓"
		}
		lines[0] = fitLine(lines[0], w-len([]rune(more))-1) + " " + st.Dim.Render(more)
	}
	lines = fit(lines, w, h-listDetail)
	return append(lines, fit(m.detailView(w), w, listDetail)...)
}

// detailView describes the selected compartment in three lines.
func (m model) detailView(w int) []string {
	st := m.st
	if len(m.v.Compartments) == 0 {
		return []string{st.Dim.Render("this vessel has no compartments")}
	}
	i := m.sel
	c := m.v.Compartments[i]
	sp := m.spaces[i]
	vol := c.Volume()
	mu := m.mu(m.damage, i)
	about := " · "
	if sp.use != "" {
		about += sp.use + " · "
	}
	l1 := st.Value.Render(c.Name) + st.Dim.Render(about+num(vol, 0)+" m³")
	var l2 string
	switch word, _ := spaceState(m.damage, i); word {
	case "OPEN":
		l2 = st.Open.Render("open to the sea") + st.Text.Render(", μ "+muText(mu)+": "+num(mu*vol, 0)+" m³ of sea")
	case "part":
		l2 = st.Open.Render("flooded to a level") + st.Text.Render(": "+num(m.damage[i].WaterM3, 0)+" m³ held")
	default:
		l2 = st.Text.Render("intact, μ " + muText(mu) + " if opened")
		if c.Liquid != nil && c.Liquid.Fill > 0 {
			l2 += st.Dim.Render(" · " + c.Liquid.Name + " " + num(100*c.Liquid.Fill, 0) + "%")
		}
	}
	var l3 string
	if k := m.derived.via[i]; k >= 0 && m.cur != nil && m.cur.Position != nil {
		o := m.cur.Position.Openings[k]
		if o.HeightM < 0 {
			l3 = st.Danger.Render(fmt.Sprintf("‼ %s under water by %s m", o.Name, num(-o.HeightM, 2)))
		} else {
			s := st.AtRisk
			if i != m.derived.next {
				s = st.Dim
			}
			l3 = s.Render(fmt.Sprintf("%s %s m above water", o.Name, num(o.HeightM, 2)))
		}
	} else if sp.pump > 0 {
		l3 = st.Dim.Render("pump " + num(sp.pump, 0) + " m³/h")
	}
	return []string{l1, l2, l3}
}

// page moves the selection a screenful of the list down (up when down is
// false): as many compartments as the list shows, less one for the
// context.
func (m *model) page(down bool) {
	n := max(1, m.listVisible()-1)
	if !down {
		n = -n
	}
	m.move(n)
}
