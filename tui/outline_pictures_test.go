package tui

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// pictureModel is the dashboard on vessel v at w × h with the damage
// state that set gives (indices found by name), computed to the end.
func pictureModel(t *testing.T, v *engine.Vessel, info *vessels.Info, w, h int, set func(d engine.Damage, at func(string) int)) model {
	t.Helper()
	m := newModel(v, info, Options{Palette: "day"})
	m.now = fixedClock()
	m.animate = false
	m = drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	m = drive(t, m, nil, m.Init())
	d := cloneDamage(m.damage)
	set(d, func(name string) int {
		i := m.v.CompartmentIndex(name)
		if i < 0 {
			t.Fatalf("no compartment %q in %s", name, m.v.Name)
		}
		return i
	})
	mm, cmd := m.commit(d, "test state")
	m = drive(t, mm.(model), nil, cmd)
	if m.cur == nil || m.cur.Position == nil {
		t.Fatalf("%s: no floating position for the test state", m.v.Name)
	}
	return m
}

// TestBoxPicturesUnchanged draws the section and the profile with each
// box compartment selected in turn, on the three bundled ships, with one
// space open to the sea and one holding water, against goldens written
// before compartments given by outlines were drawn by their own shape: a
// box must look exactly as it did.
func TestBoxPicturesUnchanged(t *testing.T) {
	for _, tc := range []struct {
		vessel, open, held string
		heldM3             float64
	}{
		{"barge", "2 wing void S", "DB ballast fwd", 60},
		{"ferry", "Wing void S", "Crew quarters", 80},
		{"freighter", "Wing tank 2 S", "DB 1 P", 40},
	} {
		t.Run(tc.vessel, func(t *testing.T) {
			v, info, err := vessels.Open(tc.vessel)
			if err != nil {
				t.Fatal(err)
			}
			m := pictureModel(t, v, info, 120, 40, func(d engine.Damage, at func(string) int) {
				d[at(tc.open)].Open = true
				d[at(tc.held)].WaterM3 = tc.heldM3
			})
			var out []string
			for i, c := range m.v.Compartments {
				if c.Sections != nil {
					continue
				}
				m.sel = i
				out = append(out, "== "+c.Name)
				out = append(out, m.sectionView(56, 16)...)
				out = append(out, m.profileView(56, 16)...)
			}
			checkGolden(t, "box_pictures_"+tc.vessel, strings.Join(out, "\n")+"\n")
		})
	}
}
