package tui

import (
	"fmt"
	"strings"

	"github.com/charmbracelet/lipgloss"

	"heelwatch/report"
)

// This file draws the instructor's view of a drill: the truth now (heel,
// drafts, the deck edge, the water in every compartment that holds some)
// and the scenario's events still to come. Its keys inject events (drill.go).

func (m *drillModel) instructorView(w, h int) string {
	v := m.d.Vessel()
	bold := lipgloss.NewStyle().Bold(true)
	now := m.d.Now()
	var lines []string
	lines = append(lines, bold.Render("The truth (hidden from the crew)"))
	if p := now.Position; p != nil {
		lines = append(lines, fmt.Sprintf("  heel: %s   draft aft %s  fwd %s   trim %s   deck edge %s above water",
			report.Heel(p.HeelDeg, 1), report.Fixed(p.DraftAftM, 2, "m"), report.Fixed(p.DraftFwdM, 2, "m"),
			report.Trim(p.TrimM, 2), report.Fixed(p.DeckEdge.HeightM, 2, "m")))
		lines = append(lines, fmt.Sprintf("  GM %s", report.Fixed(p.GMM, 2, "m")))
	} else {
		why := "no floating position"
		if now.NoEq != nil {
			why = now.NoEq.Error()
		}
		lines = append(lines, "  "+why)
	}
	if m.pick != pickNone {
		return strings.Join(append(lines, m.pickerView(w, h-len(lines))...), "\n")
	}
	lines = append(lines, "", bold.Render("Water in her"))
	wet := false
	for i, c := range v.Compartments {
		if now.WaterM3[i] <= 0 {
			continue
		}
		wet = true
		lines = append(lines, clipText(fmt.Sprintf("  %-24s %8s   sounding %s", c.Name, report.Fixed(now.WaterM3[i], 1, "m³"), report.Fixed(m.d.Sounding(i), 2, "m")), w))
	}
	if !wet {
		lines = append(lines, "  none")
	}
	if len(v.Connections) > 0 {
		var open []string
		for _, c := range v.Connections {
			if c.Open {
				open = append(open, c.Name)
			}
		}
		if len(open) == 0 {
			open = []string{"none"}
		}
		lines = append(lines, clipText("  Open doors and valves: "+strings.Join(open, ", "), w))
	}
	lines = append(lines, "", bold.Render("Events"))
	for _, e := range m.sc.Setup(m.extra...).Events {
		done := "  "
		if e.Minutes <= m.d.Minutes() {
			done = "✓ "
		}
		by := ""
		if e.By != "" && e.By != "scenario" {
			by = " (" + e.By + ")"
		}
		text := e.Label(v) + by
		if e.Text != "" {
			text += ": " + e.Text
		}
		lines = append(lines, clipText(fmt.Sprintf("%s%s  %s", done, clock(e.Minutes), text), w))
	}
	if about := strings.Fields(m.sc.About); len(about) > 0 && h-len(lines) >= 4 {
		lines = append(lines, "", bold.Render("The story"))
		lines = append(lines, wrapWords(about, w-2, "  ")...)
	}
	if len(lines) > h {
		lines = lines[:h]
	}
	return strings.Join(lines, "\n")
}
