package tui

import (
	"strings"
	"testing"
)

// The hull girder's panel: opened with b, the freighter with hold 1 open
// shows the readings against the permissible values (the shear force at
// the hold 2/1 bulkhead past its limit, marked ‼), the l key turns to the
// harbour values, and the panel fits every size from the smallest up.
func TestGirderPanel(t *testing.T) {
	m := testModel(t, 80, 24)
	m = openSpaces(t, m, "Hold 1")
	m = press(t, m, "b")
	if !m.girder.show {
		t.Fatal("b did not open the hull girder's panel")
	}
	v := m.View()
	for _, want := range []string{"HULL GIRDER", "limits at sea", "Hold 2/1", "101 %", "‼"} {
		if !strings.Contains(v, want) {
			t.Errorf("80x24 panel lacks %q:\n%s", want, v)
		}
	}
	m = press(t, m, "l")
	if v := m.View(); !strings.Contains(v, "limits in harbour") || strings.Contains(v, "101 %") {
		t.Errorf("l did not turn to the harbour values:\n%s", v)
	}
	for _, sz := range [][2]int{{minWidth, minHeight}, {80, 24}, {100, 30}, {120, 40}, {160, 50}} {
		v := checkFits(t, "girder panel", m, sz[0], sz[1])
		if !strings.Contains(v, "HULL GIRDER") {
			t.Errorf("%dx%d: no panel:\n%s", sz[0], sz[1], v)
		}
	}
	m = press(t, m, "b")
	if m.girder.show || strings.Contains(m.View(), "HULL GIRDER") {
		t.Error("b did not close the panel")
	}
}

// Without weight extents the panel says why there is no curve.
func TestGirderPanelSaysWhy(t *testing.T) {
	m := testModel(t, 80, 24)
	m.cur.Strength, m.cur.StrengthWhy = nil, "the vessel file gives no weight extents"
	m = press(t, m, "b")
	if v := m.View(); !strings.Contains(v, "no weight extents") {
		t.Errorf("panel does not say why:\n%s", v)
	}
	p := girderPanel{show: true}.with(nil, nil, m.st, m.inks)
	if v := p.view(50, 10); !strings.Contains(v, "not yet computed") {
		t.Errorf("panel before any figures: %q", v)
	}
}
