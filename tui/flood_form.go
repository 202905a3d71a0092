package tui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// defaultHoleM2 is the area of a hole the vessel file does not give: 0.05
// m², a breach some 22 cm across (heelwatch's own default, to be typed
// over with what the damage-control party reports).
const defaultHoleM2 = 0.05

// The fields of the form, in the order tab goes through them.
const (
	fieldArea = iota
	fieldZ
	fieldCd
	fieldPump
	numFields
)

// floodForm is the small form that sets the hole and the pumps of a
// flooding run for one compartment.
type floodForm struct {
	on     bool
	ci     int
	fields [numFields]textinput.Model
	focus  int
	err    string
}

// fieldSpec says what a field holds and what is allowed.
var fieldSpec = [numFields]struct {
	label, unit string
}{
	{"hole", "m²"},
	{"at z", "m"},
	{"Cd", ""},
	{"pumps", "m³/h"},
}

// openForm opens the form for the selected compartment, filled with the
// vessel file's hole and pumps (or a shell hole at the compartment's
// lowest point and no pumps).
func (m model) openForm() (tea.Model, tea.Cmd) {
	i := m.sel
	sp := m.spaces[i]
	area, z, cd := defaultHoleM2, sp.shellZ, engine.DefaultDischargeCoefficient
	if h := sp.hole; h != nil {
		area, z = h.AreaM2, h.ZM
		if h.Cd > 0 {
			cd = h.Cd
		}
	}
	f := floodForm{on: true, ci: i}
	vals := [numFields]string{short(area, 4), short(z, 2), short(cd, 2), short(sp.pump, 0)}
	for k := range f.fields {
		in := newTextField()
		in.Prompt = ""
		in.CharLimit = 9
		in.SetValue(vals[k])
		in.PromptStyle, in.TextStyle = m.st.Prompt, m.st.Value
		if !m.animate {
			// Tests: a still cursor, so that no blink timer runs.
			in.Cursor.SetMode(cursor.CursorStatic)
		}
		f.fields[k] = in
	}
	m.form = f
	return m, m.focusField(0)
}

// focusField moves the form's cursor to field k.
func (m *model) focusField(k int) tea.Cmd {
	m.form.focus = (k + numFields) % numFields
	var cmd tea.Cmd
	for j := range m.form.fields {
		if j == m.form.focus {
			cmd = m.form.fields[j].Focus()
			m.form.fields[j].CursorEnd()
		} else {
			m.form.fields[j].Blur()
		}
	}
	if !m.animate {
		return nil
	}
	return cmd
}

// formKey handles a key while the form is open.
func (m model) formKey(msg tea.KeyMsg) (tea.Model, tea.Cmd) {
	switch msg.Type {
	case tea.KeyEsc:
		m.form.on = false
		return m, nil
	case tea.KeyCtrlC:
		return m, tea.Quit
	case tea.KeyTab, tea.KeyDown:
		return m, m.focusField(m.form.focus + 1)
	case tea.KeyShiftTab, tea.KeyUp:
		return m, m.focusField(m.form.focus - 1)
	case tea.KeyEnter:
		q, at, err := m.readForm()
		if err != nil {
			m.form.err = err.Error()
			return m, m.focusField(at)
		}
		m.form.on = false
		mm, cmd := m.startFlood(q)
		m = mm.(model)
		return m, cmd
	}
	var cmd tea.Cmd
	m.form.fields[m.form.focus], cmd = m.form.fields[m.form.focus].Update(msg)
	m.form.err = ""
	return m, cmd
}

// readForm checks the form and makes the request; on a bad field it
// returns the field and an error that says what is wrong and what is
// allowed.
func (m model) readForm() (floodRequest, int, error) {
	f := m.form
	ci := f.ci
	var v [numFields]float64
	for k := range f.fields {
		x, err := parseNumber(f.fields[k].Value())
		if err != nil {
			return floodRequest{}, k, fmt.Errorf("%s: %v", fieldSpec[k].label, err)
		}
		v[k] = x
	}
	base := cloneDamage(m.damage)
	wasOpen := base[ci].Open
	base[ci].Open = false
	if wasOpen {
		base[ci].WaterM3 = 0
	}
	ask := vessels.FloodAsk{Compartment: ci, AreaM2: v[fieldArea], ZM: v[fieldZ], Cd: v[fieldCd],
		Pumps: []vessels.FloodPump{{Compartment: ci, M3h: v[fieldPump]}}, Base: base, Criteria: true, By: "dashboard"}
	fc, err := vessels.ResolveFlood(m.v, m.info, ask)
	if err != nil {
		field := fieldArea
		if e := vessels.AsFloodAskError(err); e != nil {
			field = map[vessels.FloodField]int{vessels.FieldZ: fieldZ, vessels.FieldCd: fieldCd, vessels.FieldPumps: fieldPump}[e.Field]
		}
		return floodRequest{}, field, err
	}
	return floodRequest{ci: ci, areaM2: v[fieldArea], zM: v[fieldZ], cd: v[fieldCd], pumpM3h: v[fieldPump],
		base: base, wasOpen: wasOpen, flood: fc}, 0, nil
}

// parseNumber reads a typed number, with a comma or a point for the
// decimals.
func parseNumber(s string) (float64, error) {
	t := strings.TrimSpace(strings.ReplaceAll(s, ",", "."))
	if t == "" {
		return 0, fmt.Errorf("empty: type a number")
	}
	v, err := strconv.ParseFloat(t, 64)
	if err != nil || !finite(v) {
		return 0, fmt.Errorf("%q is not a number", strings.TrimSpace(s))
	}
	return v, nil
}

// short prints v with at most prec decimals, trailing zeros dropped.
func short(v float64, prec int) string {
	s := num(v, prec)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	return s
}

// formLines is how many lines the form takes at the foot of the screen.
const formLines = 3

// formView draws the form: what it is for, the fields, and a hint on where
// the hole goes or what is wrong.
func (m model) formView() []string {
	st := m.st
	f := m.form
	c := m.v.Compartments[f.ci]
	title := st.Prompt.Render("FLOODING RUN · "+c.Name) + st.Dim.Render(" · tab next field · enter starts · esc cancels")
	var row strings.Builder
	for k := range f.fields {
		if k > 0 {
			row.WriteString("  ")
		}
		label := st.Dim
		if k == f.focus {
			label = st.Prompt
		}
		// A field is its value and the cursor's cell, then the unit.
		row.WriteString(label.Render(fieldSpec[k].label+" ") + f.fields[k].View() + st.Dim.Render(fieldSpec[k].unit))
	}
	hint := st.Dim.Render(m.formHint())
	if f.err != "" {
		hint = st.Error.Render(f.err)
	}
	return []string{fitLine(title, m.width), fitLine(row.String(), m.width), fitLine(hint, m.width)}
}

// formHint says where the hole goes and what the run starts from.
func (m model) formHint() string {
	f := m.form
	sp := m.spaces[f.ci]
	var where string
	z, err := parseNumber(f.fields[fieldZ].Value())
	switch {
	case err == nil && vessels.FileHoleAt(sp.hole, z):
		where = fmt.Sprintf("the vessel file's hole, at x %s y %s m", num(sp.hole.XM, 1), num(sp.hole.YM, 2))
	case sp.hole != nil:
		where = "in the shell at mid-length (the file's hole is at z " + short(sp.hole.ZM, 2) + " m)"
	default:
		where = "in the shell at mid-length, outboard; lowest point z " + short(sp.shellZ, 2) + " m"
	}
	s := m.damage[f.ci]
	switch {
	case s.Open:
		where += " · open on the dashboard: the run starts it dry"
	case s.WaterM3 > 0:
		where += " · starts with " + num(s.WaterM3, 0) + " m³ in"
	}
	return where
}
