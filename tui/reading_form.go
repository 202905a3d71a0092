package tui

import (
	"errors"
	"fmt"
	"strconv"
	"strings"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// readingForm is the form in which a reading is taken by hand: its time in
// minutes, the draft at any of the vessel's marks, the inclinometer, and
// soundings as "name = level" pairs. A field left empty was not read. The
// reading is checked as the readings file is (vessels.ParseReadings): a
// mark under the keel, a heel beyond 90° or a name the vessel does not
// have is refused with the reason, and the form stays open.
type readingForm struct {
	on     bool
	labels []string
	units  []string
	fields []textinput.Model
	focus  int
	err    string
}

// The fixed fields around the marks: minutes first, then one per mark,
// then the heel and the levels.
const (
	rfMinutes = 0
	rfMarks   = 1
)

// newReadingForm returns the form for v: the minutes since the first
// reading by the clock as the minutes field's placeholder (taken when the
// field is left empty, so that typing "3" gives 3, not the clock's value
// with a 3 after it), each mark's field with the draft of the state shown
// as its placeholder.
func newReadingForm(v *engine.Vessel, minutes float64, shown []engine.MarkDraft, st *Styles, animate bool) readingForm {
	f := readingForm{on: true}
	add := func(label, unit, value, hint string, limit int) {
		in := newTextField()
		in.Prompt = ""
		in.CharLimit = limit
		in.SetValue(value)
		in.Placeholder = hint
		in.PromptStyle, in.TextStyle, in.PlaceholderStyle = st.Prompt, st.Value, st.Dim
		if !animate {
			in.Cursor.SetMode(cursor.CursorStatic)
		}
		f.labels, f.units, f.fields = append(f.labels, label), append(f.units, unit), append(f.fields, in)
	}
	add("minutes", "min (empty: now)", "", strconv.FormatFloat(minutes, 'f', -1, 64), 8)
	for i, m := range v.DraftMarks {
		hint := ""
		if i < len(shown) {
			hint = num(shown[i].DraftM, 2)
		}
		add(m.Name, "m", "", hint, 7)
	}
	add("heel", "° +stbd", "", "", 6)
	add("levels", "", "", "Hold 2 = 1.35, …", 120)
	return f
}

// focusOn moves the cursor to field k.
func (f *readingForm) focusOn(k int, animate bool) tea.Cmd {
	n := len(f.fields)
	f.focus = (k%n + n) % n
	var cmd tea.Cmd
	for j := range f.fields {
		if j == f.focus {
			cmd = f.fields[j].Focus()
			f.fields[j].CursorEnd()
		} else {
			f.fields[j].Blur()
		}
	}
	if !animate {
		return nil
	}
	return cmd
}

// update handles a key while the form is open. done is set when the
// reading was taken (r holds it); the form closes itself on esc.
func (f readingForm) update(msg tea.KeyMsg, v *engine.Vessel, animate bool) (readingForm, tea.Cmd, *engine.Reading) {
	switch msg.Type {
	case tea.KeyEsc:
		f.on = false
		return f, nil, nil
	case tea.KeyTab, tea.KeyDown:
		return f, f.focusOn(f.focus+1, animate), nil
	case tea.KeyShiftTab, tea.KeyUp:
		return f, f.focusOn(f.focus-1, animate), nil
	case tea.KeyEnter:
		r, at, err := f.read(v)
		if err != nil {
			f.err = err.Error()
			return f, f.focusOn(at, animate), nil
		}
		f.on = false
		return f, nil, &r
	}
	var cmd tea.Cmd
	f.fields[f.focus], cmd = f.fields[f.focus].Update(msg)
	f.err = ""
	return f, cmd, nil
}

// read checks the form and returns the reading, or the field at fault and
// what is wrong.
func (f readingForm) read(v *engine.Vessel) (engine.Reading, int, error) {
	var b strings.Builder
	b.WriteString("format = 1\n[[reading]]\n")
	val := func(k int) string { return strings.TrimSpace(f.fields[k].Value()) }
	ms := val(rfMinutes)
	if ms == "" {
		ms = f.fields[rfMinutes].Placeholder
	}
	minutes, err := parseNumber(ms)
	if err != nil {
		return engine.Reading{}, rfMinutes, fmt.Errorf("minutes: %v", err)
	}
	fmt.Fprintf(&b, "minutes = %s\n", strconv.FormatFloat(minutes, 'g', -1, 64))
	heelAt := rfMarks + len(v.DraftMarks)
	if s := val(heelAt); s != "" {
		h, err := parseNumber(s)
		if err != nil {
			return engine.Reading{}, heelAt, fmt.Errorf("heel: %v", err)
		}
		fmt.Fprintf(&b, "heel_deg = %s\n", strconv.FormatFloat(h, 'g', -1, 64))
	}
	var drafts []string
	for i, m := range v.DraftMarks {
		s := val(rfMarks + i)
		if s == "" {
			continue
		}
		d, err := parseNumber(s)
		if err != nil {
			return engine.Reading{}, rfMarks + i, fmt.Errorf("%s: %v", m.Name, err)
		}
		drafts = append(drafts, fmt.Sprintf("%q = %s", m.Name, strconv.FormatFloat(d, 'g', -1, 64)))
	}
	if len(drafts) > 0 {
		fmt.Fprintf(&b, "drafts = { %s }\n", strings.Join(drafts, ", "))
	}
	levelsAt := heelAt + 1
	if s := val(levelsAt); s != "" {
		var items []string
		for _, item := range strings.Split(s, ",") {
			name, lv, ok := strings.Cut(item, "=")
			if !ok {
				return engine.Reading{}, levelsAt, fmt.Errorf("levels: write name = level in metres, e.g. %q", "Hold 2 = 1.35")
			}
			x, err := parseNumber(strings.TrimSpace(lv))
			if err != nil {
				return engine.Reading{}, levelsAt, fmt.Errorf("levels: %s: %v", strings.TrimSpace(name), err)
			}
			items = append(items, fmt.Sprintf("%q = %s", strings.TrimSpace(name), strconv.FormatFloat(x, 'g', -1, 64)))
		}
		fmt.Fprintf(&b, "levels = { %s }\n", strings.Join(items, ", "))
	}
	if len(drafts) == 0 && val(heelAt) == "" && val(levelsAt) == "" {
		return engine.Reading{}, rfMarks, errors.New("nothing read: give the drafts at some marks, the heel or a level")
	}
	rs, err := vessels.ParseReadings("the reading", []byte(b.String()), v)
	if err != nil {
		var ps vessels.Problems
		if errors.As(err, &ps) && len(ps) > 0 {
			p := ps[0]
			return engine.Reading{}, f.fieldOf(p.Key, v), fmt.Errorf("%s: %s", shortKey(p.Key), p.Msg)
		}
		return engine.Reading{}, rfMarks, err
	}
	return rs[0], 0, nil
}

// fieldOf finds the field a readings-file key came from.
func (f readingForm) fieldOf(key string, v *engine.Vessel) int {
	switch {
	case strings.Contains(key, ".heel_deg"):
		return rfMarks + len(v.DraftMarks)
	case strings.Contains(key, ".levels"):
		return rfMarks + len(v.DraftMarks) + 1
	case strings.Contains(key, ".minutes"):
		return rfMinutes
	}
	for i, m := range v.DraftMarks {
		if strings.HasSuffix(key, "."+m.Name) {
			return rfMarks + i
		}
	}
	return rfMarks
}

// shortKey is a readings-file key as the form names it: "Fwd P", "heel".
func shortKey(key string) string {
	for _, pre := range []string{"reading[1].drafts.", "reading[1].levels.", "reading[1]."} {
		if s, ok := strings.CutPrefix(key, pre); ok {
			if s == "heel_deg" {
				return "heel"
			}
			return s
		}
	}
	return key
}

// view draws the form in w × h: a title, one field a line (in two columns
// when they do not fit), the error or the keys.
func (f readingForm) view(st *Styles, w, h int) []string {
	lines := []string{st.Heading.Render("READING BY HAND") + st.Dim.Render("  empty: not read")}
	labelW := 0
	for _, l := range f.labels {
		labelW = max(labelW, len([]rune(l)))
	}
	row := func(k int) string {
		label := f.labels[k] + strings.Repeat(" ", labelW-len([]rune(f.labels[k])))
		mark := "  "
		if k == f.focus {
			mark = st.Prompt.Render("› ")
		}
		s := mark + st.Dim.Render(label) + " " + f.fields[k].View()
		if f.units[k] != "" {
			s += " " + st.Dim.Render(f.units[k])
		}
		return s
	}
	n := len(f.fields)
	room := h - 3
	if n <= room || w < 2*(labelW+14) {
		for k := 0; k < n; k++ {
			lines = append(lines, row(k))
		}
	} else {
		// Minutes and the marks in two columns, heel and levels below.
		half := w / 2
		body := n - 2
		per := (body + 1) / 2
		for r := 0; r < per; r++ {
			left := fitLine(row(r), half)
			right := ""
			if r+per < body {
				right = row(r + per)
			}
			lines = append(lines, left+right)
		}
		lines = append(lines, row(n-2), row(n-1))
	}
	if f.err != "" {
		for _, s := range wrap(f.err, w) {
			lines = append(lines, st.Error.Render(s))
		}
	} else {
		lines = append(lines, st.Dim.Render("tab/↑↓ field · enter takes it · esc cancels"))
	}
	return fit(lines, w, h)
}
