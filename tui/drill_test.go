package tui

import (
	"fmt"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/vessels"
)

func drillKey(s string) tea.KeyMsg {
	switch s {
	case "enter":
		return tea.KeyMsg{Type: tea.KeyEnter}
	case "down":
		return tea.KeyMsg{Type: tea.KeyDown}
	case "esc":
		return tea.KeyMsg{Type: tea.KeyEsc}
	case " ":
		return tea.KeyMsg{Type: tea.KeySpace, Runes: []rune{' '}}
	}
	return tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(s)}
}

// TestDrillCrewViewHidesTruth plays the bundled ferry scenario (our own
// invention) to its end through the crew's dashboard, at two screen sizes,
// with the crew marking, pumping and picking, and reads every screen the
// crew sees: the hidden compartment (the wing void holed at minute 8,
// with no alarm and no report) is never named outside the compartment
// picker, whose list is the same whatever the truth, and the crew's own
// diagnosis from their readings; and no volume of water (m³, other than a
// pump's m³/h) is ever shown.
func TestDrillCrewViewHidesTruth(t *testing.T) {
	const hidden = "Wing void S"
	for _, size := range [][2]int{{80, 24}, {120, 40}} {
		t.Run(fmt.Sprintf("%dx%d", size[0], size[1]), func(t *testing.T) {
			sc, err := vessels.OpenScenario("ferry-collision")
			if err != nil {
				t.Fatal(err)
			}
			m, err := newDrillModel(sc, DrillOptions{Speed: 60})
			if err != nil {
				t.Fatal(err)
			}
			m.noTick = true
			m.Update(tea.WindowSizeMsg{Width: size[0], Height: size[1]})
			hi := drillComp(sc, hidden)
			var pickerLists []string
			screens := 0
			check := func(where string) {
				s := m.View()
				screens++
				lines := strings.Split(s, "\n")
				if len(lines) > size[1] {
					t.Errorf("%s: %d lines on a screen of %d", where, len(lines), size[1])
				}
				for _, l := range lines {
					if lipgloss.Width(l) > size[0] {
						t.Errorf("%s: a line of %d columns on a screen of %d: %q", where, lipgloss.Width(l), size[0], l)
					}
				}
				if m.mode != drillCrew {
					t.Fatalf("%s: not the crew's view", where)
				}
				if strings.Contains(strings.ReplaceAll(s, "m³/h", ""), "m³") {
					t.Errorf("%s: a volume of water on the crew's screen:\n%s", where, s)
				}
				if m.pick != pickNone {
					if i := strings.Index(s, "Mark flooded"); i >= 0 {
						pickerLists = append(pickerLists, s[i:])
					}
					return
				}
				// The crew's own diagnosis is worked out from their readings
				// alone (engine.Diagnose of engine.CrewReading): it may name
				// any compartment, as the onboard computer would.
				for _, l := range m.diagnosis {
					s = strings.ReplaceAll(s, clipText(l, size[0]), "")
				}
				if strings.Contains(s, hidden) {
					t.Errorf("%s: the hidden compartment is named:\n%s", where, s)
				}
				// Its water, to a tenth or a hundredth of a m³ (a whole
				// number would meet a pump's capacity or a draft by chance;
				// no m³ at all is shown, above).
				w := m.d.Now().WaterM3[hi]
				for _, f := range []string{"%.1f", "%.2f"} {
					if w > 1 && strings.Contains(s, fmt.Sprintf(f, w)) {
						t.Errorf("%s: the hidden water %s is shown", where, fmt.Sprintf(f, w))
					}
				}
			}
			check("start")
			for k := 0; !m.d.Over(); k++ {
				m.Update(drillTick{})
				check(fmt.Sprintf("tick %d (%s)", k, clock(m.d.Minutes())))
				switch k {
				case 10: // the crew marks the engine room flooded and starts its pump
					er := drillComp(sc, "Engine room")
					m.Update(drillKey("m"))
					check("mark picker")
					for i := 0; i < er; i++ {
						m.Update(drillKey("down"))
					}
					check("mark picker at the engine room")
					m.Update(drillKey("enter"))
					check("marked")
					m.Update(drillKey("p"))
					for i := 0; i < er; i++ {
						m.Update(drillKey("down"))
					}
					m.Update(drillKey("enter"))
					check("pump started")
				case 30:
					_, cmd := m.Update(drillKey("g"))
					m.Update(cmd())
					if len(m.diagnosis) < 2 {
						t.Errorf("no diagnosis: %q", m.status)
					}
					check("diagnosed")
				case 35: // the crew checks and shuts the engine-room door, opens and shuts the next
					m.Update(drillKey("d"))
					check("door picker")
					m.Update(drillKey("enter"))
					check("door shut")
					m.Update(drillKey("d"))
					m.Update(drillKey("down"))
					m.Update(drillKey("o"))
					check("door opened")
					m.Update(drillKey("d"))
					m.Update(drillKey("down"))
					m.Update(drillKey("enter"))
					check("door shut again")
				case 40:
					m.Update(drillKey(" "))
					check("paused")
					m.Update(drillKey(" "))
				}
				if k > 1000 {
					t.Fatal("the drill does not end")
				}
			}
			if screens < 50 {
				t.Fatalf("only %d screens read", screens)
			}
			// The picker's list is the vessel's, in its order, whatever the
			// truth: the same at every opening.
			for _, p := range pickerLists[1:] {
				if strings.Count(p, "\n") != strings.Count(pickerLists[0], "\n") {
					t.Errorf("the picker's list changed")
				}
			}
			if len(m.marks) == 0 || len(m.ordered) == 0 {
				t.Errorf("the crew's decisions were not taken: marks %v, pumps %v", m.marks, m.ordered)
			}
			// At the end the debrief is made from the replayed log and shows
			// the truth.
			msg := m.makeDebrief()()
			m.Update(msg)
			if m.mode != drillDebrief {
				t.Fatalf("no debrief: %v", m.status)
			}
			m.debrief.Height = 10000
			if s := m.debrief.View(); !strings.Contains(s, hidden) || !strings.Contains(s, "pump Engine room") {
				t.Errorf("the debrief does not tell the truth or the decision:\n%s", s)
			}
		})
	}
}

// TestDrillInstructorInjects: the instructor's view shows the truth, and a
// breach injected there changes it; the log replays the drill.
func TestDrillInstructorInjects(t *testing.T) {
	sc, err := vessels.OpenScenario("freighter-fog")
	if err != nil {
		t.Fatal(err)
	}
	m, err := newDrillModel(sc, DrillOptions{Speed: 60})
	if err != nil {
		t.Fatal(err)
	}
	m.noTick = true
	m.Update(tea.WindowSizeMsg{Width: 120, Height: 40})
	for k := 0; k < 20; k++ {
		m.Update(drillTick{})
	}
	m.Update(drillKey("i"))
	if s := m.View(); !strings.Contains(s, "Wing tank 2 S") || !strings.Contains(s, "m³") {
		t.Fatalf("the instructor does not see the truth:\n%s", s)
	}
	fp := drillComp(sc, "Fore peak tank")
	m.Update(drillKey("b"))
	for i := 0; i < fp; i++ {
		m.Update(drillKey("down"))
	}
	m.Update(drillKey("enter"))
	for _, r := range "0.3" {
		m.Update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{r}})
	}
	m.Update(drillKey("enter"))
	if len(m.extra) != 1 || m.extra[0].Kind != engine.DrillBreach || m.extra[0].By != engine.ByInstructor {
		t.Fatalf("no breach injected: %v (%s)", m.extra, m.status)
	}
	// A door found open: the first of the freighter's, shut in her file.
	m.Update(drillKey("o"))
	m.Update(drillKey("enter"))
	if len(m.extra) != 2 || m.extra[1].Kind != engine.DrillConnection || !m.extra[1].Open || !m.d.Vessel().Connections[0].Open {
		t.Fatalf("no door opened: %v (%s)", m.extra, m.status)
	}
	if s := m.View(); !strings.Contains(s, "Open doors and valves: "+m.d.Vessel().Connections[0].Name) {
		t.Errorf("the instructor does not see the door open:\n%s", s)
	}
	for !m.d.Over() {
		m.Update(drillTick{})
	}
	live := m.d.Rows()[len(m.d.Rows())-1]
	replay, err := sc.Setup(m.extra...).Play()
	if err != nil {
		t.Fatal(err)
	}
	again := replay.Rows()[len(replay.Rows())-1]
	if d := live.Position.HeelDeg - again.Position.HeelDeg; d > 0.01 || d < -0.01 {
		t.Errorf("live heel %.3f, replayed %.3f", live.Position.HeelDeg, again.Position.HeelDeg)
	}
	found := false
	for _, n := range again.Flooded {
		found = found || n == "Fore peak tank"
	}
	if !found {
		t.Errorf("the injected breach is not in the replay: %v", again.Flooded)
	}
}

func drillComp(sc *vessels.Scenario, name string) int {
	for i, c := range sc.Vessel.Compartments {
		if c.Name == name {
			return i
		}
	}
	panic("no compartment " + name)
}
