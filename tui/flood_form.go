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
//
// It is a child of the dashboard with its own update and view: it holds
// what it shows (the compartment, the vessel file's hole, where a shell
// hole goes, the compartment's state) from when it was opened, and tells
// the dashboard through a formAction when it is sent or closed.
type floodForm struct {
	ci     int
	fields [numFields]textinput.Model
	focus  int
	err    string

	name    string       // the compartment's name
	hole    *engine.Hole // the vessel file's hole into it, nil if none
	shellZ  float64      // its lowest point in the shell at mid-length
	state   engine.SpaceState
	animate bool
	st      *Styles
}

// formAction is what a key in the form asks of the dashboard.
type formAction int

const (
	formStays  formAction = iota // the form stays open
	formCancel                   // esc: close it
	formSend                     // enter: read it and start the run
	formQuit                     // ctrl+c
)

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
	f := floodForm{ci: i, name: m.v.Compartments[i].Name, hole: sp.hole, shellZ: sp.shellZ,
		state: m.damage[i], animate: m.animate, st: m.st}
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
	var cmd tea.Cmd
	m.form, cmd = f.focusField(0)
	m.mode = modeForm
	return m, cmd
}

// focusField moves the form's cursor to field k.
func (f floodForm) focusField(k int) (floodForm, tea.Cmd) {
	f.focus = (k + numFields) % numFields
	var cmd tea.Cmd
	for j := range f.fields {
		if j == f.focus {
			cmd = f.fields[j].Focus()
			f.fields[j].CursorEnd()
		} else {
			f.fields[j].Blur()
		}
	}
	if !f.animate {
		return f, nil
	}
	return f, cmd
}

// update handles a key while the form is open.
func (f floodForm) update(msg tea.KeyMsg) (floodForm, tea.Cmd, formAction) {
	switch msg.Type {
	case tea.KeyEsc:
		return f, nil, formCancel
	case tea.KeyCtrlC:
		return f, tea.Quit, formQuit
	case tea.KeyTab, tea.KeyDown:
		f, cmd := f.focusField(f.focus + 1)
		return f, cmd, formStays
	case tea.KeyShiftTab, tea.KeyUp:
		f, cmd := f.focusField(f.focus - 1)
		return f, cmd, formStays
	case tea.KeyEnter:
		return f, nil, formSend
	}
	var cmd tea.Cmd
	f.fields[f.focus], cmd = f.fields[f.focus].Update(msg)
	f.err = ""
	return f, cmd, formStays
}

// formKey passes a key to the form and does what it asks: close it, or
// read it and start the run (a bad field keeps it open with the cursor
// there and the reason shown).
func (m model) formKey(msg tea.KeyMsg) (tea.Model, tea.Cmd) {
	var cmd tea.Cmd
	var act formAction
	m.form, cmd, act = m.form.update(msg)
	switch act {
	case formCancel:
		m.mode = modeBrowse
	case formSend:
		q, at, err := m.readForm()
		if err != nil {
			m.form.err = err.Error()
			m.form, cmd = m.form.focusField(at)
			return m, cmd
		}
		m.mode = modeBrowse
		m.rem.show = false // the run's panel in the options' place
		return m.updateFlood(q)
	}
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

// view draws the form in w columns, formLines lines: what it is for, the
// fields, and a hint on where the hole goes or what is wrong.
func (f floodForm) view(w, h int) []string {
	st := f.st
	title := st.Prompt.Render("FLOODING RUN · "+f.name) + st.Dim.Render(" · tab next field · enter starts · esc cancels")
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
	hint := st.Dim.Render(f.hint())
	if f.err != "" {
		hint = st.Error.Render(f.err)
	}
	return fit([]string{fitLine(title, w), fitLine(row.String(), w), fitLine(hint, w)}, w, h)
}

// hint says where the hole goes and what the run starts from.
func (f floodForm) hint() string {
	var where string
	z, err := parseNumber(f.fields[fieldZ].Value())
	switch {
	case err == nil && vessels.FileHoleAt(f.hole, z):
		where = fmt.Sprintf("the vessel file's hole, at x %s y %s m", num(f.hole.XM, 1), num(f.hole.YM, 2))
	case f.hole != nil:
		where = "in the shell at mid-length (the file's hole is at z " + short(f.hole.ZM, 2) + " m)"
	default:
		where = "in the shell at mid-length, outboard; lowest point z " + short(f.shellZ, 2) + " m"
	}
	switch s := f.state; {
	case s.Open:
		where += " · open on the dashboard: the run starts it dry"
	case s.WaterM3 > 0:
		where += " · starts with " + num(s.WaterM3, 0) + " m³ in"
	}
	return where
}
