package tui

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/vessels"
)

// The full help's legend names the margin line only on a passenger ship
// (ship_type = "passenger"); on a cargo ship the flooding run marks the
// deck edge, which is the bulkhead deck's edge.
func TestMarkLegendMarginLineOnlyOnPassengerShips(t *testing.T) {
	for _, c := range []struct {
		vessel    string
		passenger bool
	}{{"freighter", false}, {"ferry", true}} {
		v, info, err := vessels.Open(c.vessel)
		if err != nil {
			t.Fatal(err)
		}
		if v.Passenger() != c.passenger {
			t.Fatalf("%s: passenger %v", c.vessel, v.Passenger())
		}
		m := newModel(v, info, Options{Palette: "day"})
		m.now = fixedClock()
		m.animate = false
		m = drive(t, m, tea.WindowSizeMsg{Width: 200, Height: 40})
		m = press(t, m, "?")
		legend := strings.Join(m.helpLines(), " ")
		if got := strings.Contains(legend, "margin line"); got != c.passenger {
			t.Errorf("%s: legend names the margin line: %v\n%s", c.vessel, got, legend)
		}
		if !c.passenger && !strings.Contains(legend, "d deck edge (bulkhead deck)") {
			t.Errorf("%s: legend lacks the deck edge / bulkhead deck:\n%s", c.vessel, legend)
		}
	}
}
