package tui

import (
	"strings"

	"strconv"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"
)

// finder is the type-to-find of the compartment list: the officer types a
// part of a name and the list's selection jumps to the first compartment,
// in the list's order, whose name starts with it (ignoring case), else the
// first that holds it. ↓ and ↑ go to the next and previous match, enter
// keeps the selection, esc puts it back where it was.
type finder struct {
	on      bool
	input   textinput.Model
	names   []string // the compartments' names, by index
	order   []int    // the compartments in the list's order
	from    int      // the selection when the finder opened
	sel     int      // the selection now
	matches []int    // the compartments matching what is typed, in list order
	done    bool     // enter or esc was pressed: the root closes the finder
	st      *Styles
}

// findLines is how many lines the finder takes at the foot of the screen.
const findLines = 2

// newFinder opens a finder on compartments names, listed in order, with
// sel selected.
func newFinder(names []string, order []int, sel int, st *Styles, still bool) (finder, tea.Cmd) {
	in := textinput.New()
	in.Prompt = ""
	in.CharLimit = 40
	in.PromptStyle, in.TextStyle = st.Prompt, st.Value
	f := finder{on: true, input: in, names: names, order: order, from: sel, sel: sel, st: st}
	cmd := f.input.Focus()
	if still {
		// Tests: a still cursor, so that no blink timer runs.
		f.input.Cursor.SetMode(cursor.CursorStatic)
		cmd = nil
	}
	return f, cmd
}

// update takes one key while the finder is open.
func (f finder) update(msg tea.Msg) (finder, tea.Cmd) {
	k, ok := msg.(tea.KeyMsg)
	if !ok {
		var cmd tea.Cmd
		f.input, cmd = f.input.Update(msg)
		return f, cmd
	}
	switch k.Type {
	case tea.KeyEsc:
		f.sel, f.done = f.from, true
		return f, nil
	case tea.KeyEnter:
		f.done = true
		return f, nil
	case tea.KeyDown, tea.KeyUp, tea.KeyTab, tea.KeyShiftTab:
		f.step(k.Type == tea.KeyDown || k.Type == tea.KeyTab)
		return f, nil
	}
	var cmd tea.Cmd
	f.input, cmd = f.input.Update(msg)
	f.match()
	return f, cmd
}

// match finds the compartments that match what is typed and selects the
// first: names starting with it before names holding it.
func (f *finder) match() {
	q := strings.ToLower(strings.TrimSpace(f.input.Value()))
	f.matches = f.matches[:0]
	if q == "" {
		f.sel = f.from
		return
	}
	var inside []int
	for _, i := range f.order {
		n := strings.ToLower(f.names[i])
		switch {
		case strings.HasPrefix(n, q):
			f.matches = append(f.matches, i)
		case strings.Contains(n, q):
			inside = append(inside, i)
		}
	}
	f.matches = append(f.matches, inside...)
	if len(f.matches) > 0 {
		f.sel = f.matches[0]
	}
}

// step moves to the next match (the previous when forward is false),
// round the end of the list.
func (f *finder) step(forward bool) {
	n := len(f.matches)
	if n == 0 {
		return
	}
	k := 0
	for j, i := range f.matches {
		if i == f.sel {
			k = j
		}
	}
	if forward {
		k = (k + 1) % n
	} else {
		k = (k - 1 + n) % n
	}
	f.sel = f.matches[k]
}

// view is the finder's prompt and a line on what it found, in w × h.
func (f finder) view(w, h int) string {
	st := f.st
	p := st.Prompt.Render("find a compartment: ") + f.input.View()
	var hint string
	switch q := strings.TrimSpace(f.input.Value()); {
	case q == "":
		hint = st.Dim.Render("type part of a name (case does not matter) · esc cancels")
	case len(f.matches) == 0:
		hint = st.Error.Render("no compartment's name holds \""+q+"\"") + st.Dim.Render(" · esc cancels")
	default:
		which := 1
		for j, i := range f.matches {
			if i == f.sel {
				which = j + 1
			}
		}
		hint = st.Value.Render(f.names[f.sel]) + st.Dim.Render(" · match "+strconv.Itoa(which)+" of "+
			strconv.Itoa(len(f.matches))+" · ↓↑ next/previous · enter selects · esc goes back")
	}
	return strings.Join(fit([]string{p, hint}, w, h), "\n")
}

// openFind opens the type-to-find on the compartment list.
func (m model) openFind() (tea.Model, tea.Cmd) {
	names := make([]string, len(m.v.Compartments))
	for i, c := range m.v.Compartments {
		names[i] = c.Name
	}
	var order []int
	for _, r := range m.rows {
		if r.idx >= 0 {
			order = append(order, r.idx)
		}
	}
	var cmd tea.Cmd
	m.find, cmd = newFinder(names, order, m.sel, m.st, !m.animate)
	m.mode = modeFind
	m.resize()
	return m, cmd
}

// findKey passes a key to the open finder and follows its selection in
// the list.
func (m model) findKey(msg tea.KeyMsg) (tea.Model, tea.Cmd) {
	if msg.Type == tea.KeyCtrlC {
		return m, tea.Quit
	}
	var cmd tea.Cmd
	m.find, cmd = m.find.update(msg)
	m.sel = m.find.sel
	if m.find.done {
		m.find = finder{}
		m.mode = modeBrowse
		m.resize()
	}
	m.ensureVisible()
	return m, cmd
}
