package tui

import (
	"math"
	"regexp"
	"strings"
	"testing"

	"github.com/charmbracelet/x/ansi"
)

// The condition panel uses its width: at 120 columns every name and
// liquid is whole in its row; at 80×24 (44 columns for the panel) the
// liquid is never cut ("sea…"): its column gives way and the chosen
// tank's contents, and a chosen weight's name cut in its row, are said
// whole under the table.
func TestConditionPanelUsesItsWidth(t *testing.T) {
	m := bundledModel(t, "freighter", 120, 40)
	m = press(t, m, "L")
	for k, r := range m.cond.rows() {
		m.cond.sel = k
		panel := ansi.Strip(strings.Join(m.conditionLines(120, 16), "\n"))
		name, liquid := "", ""
		if r.tank >= 0 {
			c := m.v.Compartments[r.tank]
			name = c.Name
			if c.Liquid != nil {
				liquid = c.Liquid.Name
			}
		} else {
			name = m.cond.cond.Weights[r.weight].Name
		}
		row := lineStarting(panel, "▸ "+name)
		if row == "" || !strings.Contains(row, liquid) {
			t.Errorf("120 columns: %q not whole in its row:\n%s", name, panel)
		}
	}
	m = bundledModel(t, "freighter", 80, 24)
	m = press(t, m, "L")
	for k, r := range m.cond.rows() {
		m.cond.sel = k
		lines := m.conditionLines(44, 20)
		panel := ansi.Strip(strings.Join(lines, "\n"))
		if strings.Contains(panel, "sea…") {
			t.Errorf("44 columns: a liquid's name is cut:\n%s", panel)
		}
		want := ""
		if r.tank >= 0 {
			if l := m.v.Compartments[r.tank].Liquid; l != nil {
				want = l.Name
			}
		} else {
			want = m.cond.cond.Weights[r.weight].Name
		}
		if !strings.Contains(panel, want) {
			t.Errorf("44 columns: %q is not whole on the panel:\n%s", want, panel)
		}
	}
}

// The righting options' wide table names each GM by where it is taken and
// gives the opening's height its unit; the hand method's heel apart from
// the direct one carries its degree sign.
func TestHeadingsSayWhatAndUnit(t *testing.T) {
	h := remedyColumns(120).header()
	for _, want := range []string{"GM up m", "GM heel m", "opening m"} {
		if !strings.Contains(h, want) {
			t.Errorf("options heading %q lacks %q", h, want)
		}
	}
	for _, not := range []string{"rest m"} {
		if strings.Contains(h, not) {
			t.Errorf("options heading %q still has %q", h, not)
		}
	}
	m := startModel(t, 120, 40, "Wing tank 2 S", "DB 2 S")
	m = press(t, m, "h")
	p, hw := m.cur.Position, m.cur.Hand
	want := regexp.QuoteMeta(heelShort(hw.HeelDeg)) + `\s+` + regexp.QuoteMeta(heelShort(p.HeelDeg)) + `\s+` + regexp.QuoteMeta(num(math.Abs(hw.HeelDeg-p.HeelDeg), 1)+"°")
	if !regexp.MustCompile(want).MatchString(m.View()) {
		t.Errorf("the hand table's heel row lacks %q:\n%s", want, m.View())
	}
}
