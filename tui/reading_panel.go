package tui

import (
	"fmt"
	"math"
	"strings"
	"time"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/progress"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/report"
)

// readingPanel is the draft marks and readings panel: the draft the crew
// will read at each mark in the state shown, a reading taken by hand (the
// form), and the diagnosis of the readings taken, which runs in a Cmd with
// a progress bar and shows the best explanations, what tells them apart
// and, with two readings or more, the trend. The root model holds it, opens
// it with the readings key, and hands it every message first (readingMsg).
type readingPanel struct {
	show     bool
	form     readingForm
	readings []engine.Reading
	firstAt  time.Time // wall-clock time of the first reading (minute 0)

	seq         int // the newest diagnosis asked for
	running     bool
	done, total int
	result      *engine.Diagnosis
	trend       *engine.Trend
	trendNote   string
	failure     string
	off         int // the diagnosis scrolled on by this many lines ([ ])

	// What to draw with, handed in by the root model (with).
	v     *engine.Vessel
	cur   *engine.Position
	st    *Styles
	bar   progress.Model
	wide  bool
	shown []engine.MarkDraft
}

// The panel's own keys while it is shown.
var (
	readingNewKey = key.NewBinding(key.WithKeys("n"), key.WithHelp("n", "new reading"))
	readingClear  = key.NewBinding(key.WithKeys("X"), key.WithHelp("X", "readings cleared"))
	readingApply  = key.NewBinding(key.WithKeys("a"), key.WithHelp("a", "best explanation onto the dashboard"))
)

// Messages of a diagnosis running in a Cmd.
type (
	diagProgressMsg struct {
		seq, done, total int
		ch               <-chan tea.Msg
	}
	diagDoneMsg struct {
		seq       int
		res       *engine.Diagnosis
		trend     *engine.Trend
		trendNote string
		failure   string
	}
)

// with returns the panel with what it needs to draw.
func (p readingPanel) with(v *engine.Vessel, cur *engine.Position, st *Styles, bar progress.Model, wide bool) readingPanel {
	p.v, p.cur, p.st, p.bar, p.wide = v, cur, st, bar, wide
	p.shown = nil
	if cur != nil && len(v.DraftMarks) > 0 {
		p.shown = engine.MarkDrafts(v.Hull, cur.Plane, v.DraftMarks)
	}
	return p
}

// readingMsg gives the panel the first look at every message: the
// diagnosis's own messages, keys while its form is open, the readings key
// and, while it is shown, its own keys. ok is false when the message is
// not the panel's.
func (m model) readingMsg(msg tea.Msg) (tea.Model, tea.Cmd, bool) {
	switch msg := msg.(type) {
	case diagProgressMsg:
		if msg.seq != m.rd.seq {
			// An older diagnosis: read it to its end so that its goroutine
			// can finish, and show none of it.
			return m, waitDiagnosis(msg.ch), true
		}
		m.rd.done, m.rd.total = msg.done, msg.total
		return m, waitDiagnosis(msg.ch), true
	case diagDoneMsg:
		if msg.seq != m.rd.seq {
			return m, nil, true
		}
		m.rd.running, m.rd.off = false, 0
		m.rd.result, m.rd.trend, m.rd.trendNote, m.rd.failure = msg.res, msg.trend, msg.trendNote, msg.failure
		return m, m.addLog(m.now(), m.diagnosisLine()), true
	case tea.KeyMsg:
		if m.lay.small || m.mode != modeBrowse || (msg.Type == tea.KeyRunes && len(msg.Runes) > 1 && !msg.Paste) {
			return m, nil, false
		}
		if m.rd.form.on {
			if msg.Type == tea.KeyCtrlC {
				return m, tea.Quit, true
			}
			var cmd tea.Cmd
			var r *engine.Reading
			m.rd.form, cmd, r = m.rd.form.update(msg, m.v, m.animate)
			if r == nil {
				return m, cmd, true
			}
			mm, cmd2 := m.takeReading(*r)
			return mm, tea.Batch(cmd, cmd2), true
		}
		switch {
		case key.Matches(msg, m.keys.Readings):
			m.rd.show = !m.rd.show
			if m.rd.show {
				m.girder.show, m.rem.show = false, false
			}
			return m, nil, true
		case !m.rd.show:
			return m, nil, false
		case key.Matches(msg, readingNewKey):
			minutes := 0.0
			if len(m.rd.readings) > 0 {
				minutes = math.Round(m.now().Sub(m.rd.firstAt).Minutes()*10) / 10
				minutes = math.Max(minutes, m.rd.readings[len(m.rd.readings)-1].Minutes)
			}
			var shown []engine.MarkDraft
			if m.cur != nil && m.cur.Position != nil && len(m.v.DraftMarks) > 0 {
				shown = engine.MarkDrafts(m.v.Hull, m.cur.Position.Plane, m.v.DraftMarks)
			}
			m.rd.form = newReadingForm(m.v, minutes, shown, m.st, m.animate)
			return m, m.rd.form.focusOn(rfMarks, m.animate), true
		case key.Matches(msg, readingClear):
			if len(m.rd.readings) == 0 {
				return m, nil, true
			}
			m.rd.readings, m.rd.result, m.rd.trend, m.rd.trendNote, m.rd.failure = nil, nil, nil, "", ""
			m.rd.seq++
			m.rd.running = false
			return m, m.addLog(m.now(), "readings cleared"), true
		case key.Matches(msg, readingApply):
			e, what, ok := m.rd.toApply(m.v)
			if !ok {
				return m, nil, true
			}
			d := m.v.Intact()
			for _, s := range e.Spaces {
				d[s.Compartment] = engine.SpaceState{WaterM3: s.WaterM3}
				if s.Open {
					// Level with the sea: open to it, so that she shows
					// the GM of free communication, as solve does.
					d[s.Compartment] = engine.SpaceState{Open: true}
				}
				if s.Permeability != m.v.Compartments[s.Compartment].Permeability {
					d[s.Compartment].Permeability = s.Permeability
				}
			}
			mm, cmd := m.apply(d, "diagnosis onto the dashboard: "+what)
			return mm, cmd, true
		case key.Matches(msg, m.keys.WorkUp), key.Matches(msg, m.keys.WorkDown):
			step := 3
			if key.Matches(msg, m.keys.WorkUp) {
				step = -3
			}
			w, h := m.readingSize()
			m.rd.off = min(max(0, m.rd.off+step), m.rd.with(m.v, m.curPosition(), m.st, m.bar, m.lay.wide).maxOff(w, h))
			return m, nil, true
		case key.Matches(msg, m.keys.Girder), key.Matches(msg, m.keys.RunPanel), key.Matches(msg, m.keys.Remedies):
			// Another panel takes the place: this one gives way.
			m.rd.show = false
			return m, nil, false
		}
	}
	return m, nil, false
}

// toApply is the explanation the apply key puts onto the dashboard and
// what the log calls it: the best, when it fits the readings; when nothing
// fits but something does without the readings that disagree, that one
// (the officer is told which readings it leaves out); else the best all
// the same, said not to fit. ok is false when there is nothing to apply.
func (p readingPanel) toApply(v *engine.Vessel) (e engine.Explanation, what string, ok bool) {
	res := p.result
	if res == nil || len(res.Explanations) == 0 {
		return e, "", false
	}
	e, what = res.Explanations[0], res.Explanations[0].Names(v)
	switch {
	case res.Fits:
	case res.Without != nil && len(res.Without.Spaces) > 0:
		e = *res.Without
		var left []string
		for _, g := range res.Disagreements {
			if g.Reading == res.Reading && g.What == "heel" {
				left = append(left, "the inclinometer")
			} else if g.Reading == res.Reading {
				left = append(left, g.What)
			}
		}
		what = e.Names(v) + " (the fit leaving out " + strings.Join(left, " and ") + ")"
	default:
		what += " (which does not fit the readings)"
	}
	return e, what, len(e.Spaces) > 0
}

// takeReading keeps a reading, logs it and starts the diagnosis of all the
// readings so far. A reading earlier than the last is refused.
func (m model) takeReading(r engine.Reading) (tea.Model, tea.Cmd) {
	if n := len(m.rd.readings); n > 0 && r.Minutes < m.rd.readings[n-1].Minutes {
		m.rd.form.on = true
		m.rd.form.err = fmt.Sprintf("minutes: %g comes before the last reading (%g min)", r.Minutes, m.rd.readings[n-1].Minutes)
		return m, nil
	}
	if len(m.rd.readings) == 0 {
		m.rd.firstAt = m.now().Add(-time.Duration(r.Minutes * float64(time.Minute)))
	}
	m.rd.readings = append(m.rd.readings, r)
	logged := m.addLog(m.now(), readingLine(m.v, r))
	m.rd.seq++
	m.rd.running, m.rd.done, m.rd.total, m.rd.failure = true, 0, 1, ""
	var opts engine.TrendOptions
	if m.info != nil {
		opts = m.info.TrendOptions()
	}
	return m, tea.Batch(logged, startDiagnosis(m.v, append([]engine.Reading(nil), m.rd.readings...), opts, m.rd.seq))
}

// startDiagnosis runs the diagnosis (and the trend, with two readings or
// more) in a goroutine; its progress and its answer come back through a
// channel, one message per Cmd.
func startDiagnosis(v *engine.Vessel, rs []engine.Reading, opts engine.TrendOptions, seq int) tea.Cmd {
	ch := make(chan tea.Msg, 16)
	go func() {
		defer close(ch)
		defer func() {
			if r := recover(); r != nil {
				ch <- diagDoneMsg{seq: seq, failure: "engine failure: " + fmt.Sprint(r)}
			}
		}()
		progress := func(done, total int) {
			select {
			case ch <- diagProgressMsg{seq: seq, done: done, total: total + 1, ch: ch}:
			default: // the screen is behind: this step need not be drawn
			}
		}
		res, err := engine.Diagnose(v, rs, engine.DiagnoseOptions{Progress: progress})
		if err != nil {
			ch <- diagDoneMsg{seq: seq, failure: err.Error()}
			return
		}
		out := diagDoneMsg{seq: seq, res: &res}
		switch {
		case len(rs) < 2:
			out.trendNote = "trend: needs two readings or more"
		case len(res.Explanations) == 0 || len(res.Explanations[0].Spaces) == 0:
			out.trendNote = "no trend: the best explanation floods nothing"
		case !res.Fits:
			out.trendNote = "no trend: nothing fits the latest reading"
		default:
			opts.LimitS = 6 * 3600
			if t, err := engine.EstimateTrend(v, rs, res.Explanations[0], opts); err != nil {
				out.trendNote = err.Error()
			} else {
				out.trend = &t
			}
		}
		ch <- out
	}()
	return waitDiagnosis(ch)
}

// waitDiagnosis is the Cmd that waits for the next message of a diagnosis.
func waitDiagnosis(ch <-chan tea.Msg) tea.Cmd {
	return func() tea.Msg {
		msg, ok := <-ch
		if !ok {
			return nil
		}
		return msg
	}
}

// readingLine is a reading in one line for the session's log.
func readingLine(v *engine.Vessel, r engine.Reading) string {
	var parts []string
	for _, d := range r.Drafts {
		parts = append(parts, v.DraftMarks[d.Mark].Name+" "+num(d.DraftM, 2))
	}
	if r.HasHeel {
		parts = append(parts, "heel "+heelShort(r.HeelDeg))
	}
	for _, l := range r.Levels {
		parts = append(parts, v.Compartments[l.Compartment].Name+" level "+num(l.LevelM, 2)+" m")
	}
	return "reading at " + num(r.Minutes, 1) + " min: " + strings.Join(parts, ", ")
}

// diagnosisLine is the diagnosis in one line for the session's log.
func (m model) diagnosisLine() string {
	p := m.rd
	if p.failure != "" {
		return "diagnosis failed: " + p.failure
	}
	if p.result == nil {
		return "diagnosis: no answer"
	}
	res := p.result
	s := "diagnosis: " + res.Verdict
	if len(res.Explanations) > 1 {
		s += " Next: " + res.Explanations[1].Names(m.v) + "."
	}
	if p.trend != nil {
		s += fmt.Sprintf(" Inflow %.0f ± %.0f m³/h.", p.trend.InflowM3h, p.trend.InflowSDM3h)
	}
	return s
}

// view draws the panel in w × h.
func (p readingPanel) view(w, h int) string {
	if p.form.on {
		return strings.Join(p.form.view(p.st, w, h), "\n")
	}
	marks := p.marksLines()
	diag, room := p.diagnosisLines(w), h-len(marks)-1
	if p.wide && w >= 90 {
		lw := min(46, w/2)
		rw := w - lw - 1
		diag = p.scrolled(p.diagnosisLines(rw), h)
		return strings.Join(besides(p.st.Dim.Render("│"), fit(marks, lw, h), fit(diag, rw, h)), "\n")
	}
	return strings.Join(fit(append(append(marks, ""), p.scrolled(diag, room)...), w, h), "\n")
}

// diagRoom is the diagnosis's lines and the room they have in w × h, as
// view lays them out.
func (p readingPanel) diagRoom(w, h int) ([]string, int) {
	if p.form.on {
		return nil, h
	}
	if p.wide && w >= 90 {
		return p.diagnosisLines(w - min(46, w/2) - 1), h
	}
	return p.diagnosisLines(w), h - len(p.marksLines()) - 1
}

// maxOff is how far the diagnosis can be scrolled on in w × h.
func (p readingPanel) maxOff(w, h int) int {
	lines, room := p.diagRoom(w, h)
	if len(lines) <= room || room < 4 {
		return 0
	}
	return len(lines) - 1 - (room - 2)
}

// scrolled fits the diagnosis's lines into room: its heading always, the
// lines from the scroll offset on, and, when they do not all fit, a last
// line that says there is more and which key shows it, so that nothing is
// cut off unseen (at 80×24 the ranking, the trend and the apply key's
// line fell below the panel's foot).
func (p readingPanel) scrolled(lines []string, room int) []string {
	if len(lines) <= room || room < 4 {
		return lines
	}
	body := lines[1:]
	n := room - 2
	off := min(max(0, p.off), len(body)-n)
	out := append([]string{lines[0]}, body[off:off+n]...)
	var hint string
	switch {
	case off+n < len(body) && off > 0:
		hint = fmt.Sprintf("▼ %d more lines: ] on, [ back", len(body)-off-n)
	case off+n < len(body):
		hint = fmt.Sprintf("▼ %d more lines: ] shows them", len(body)-off-n)
	default:
		hint = "▲ [ back to the top"
	}
	return append(out, p.st.Dim.Render(hint))
}

// marksLines is the table of the marks: the draft the crew will read in
// the state shown and, beside it, the last reading.
func (p readingPanel) marksLines() []string {
	st := p.st
	lines := []string{st.Heading.Render("DRAFT MARKS") + st.Dim.Render("  now · read · n new reading")}
	if len(p.v.DraftMarks) == 0 {
		return append(lines, st.Dim.Render("the vessel file places no [[draft_mark]]"))
	}
	var last map[int]float64
	if n := len(p.readings); n > 0 {
		last = map[int]float64{}
		for _, d := range p.readings[n-1].Drafts {
			last[d.Mark] = d.DraftM
		}
	}
	nameW := 0
	for _, mk := range p.v.DraftMarks {
		nameW = max(nameW, len([]rune(mk.Name)))
	}
	for i, mk := range p.v.DraftMarks {
		now := blank
		note := ""
		if i < len(p.shown) {
			now = num(p.shown[i].DraftM, 2)
			if p.shown[i].State != engine.MarkReads {
				note = " " + p.shown[i].State.String()
			}
		}
		read := ""
		if d, ok := last[i]; ok {
			read = num(d, 2)
		}
		name := mk.Name + strings.Repeat(" ", nameW-len([]rune(mk.Name)))
		lines = append(lines, fmt.Sprintf("%s %s %s %s%s", st.Dim.Render(name), st.Value.Render(fmt.Sprintf("%6s", now)),
			st.Dim.Render("m"), fmt.Sprintf("%6s", read), st.Caution.Render(note)))
	}
	if p.cur != nil && len(p.shown) > 0 {
		if s, err := engine.SurveyMarks(p.v.Hull.LengthM, p.cur.Plane.C, p.shown); err == nil {
			lines = append(lines, st.Dim.Render(fmt.Sprintf("perp. A %s M %s F %s · hog/sag %s",
				num(s.AftM, 2), num(s.MidM, 2), num(s.FwdM, 2), report.HogSagWords(s.DeflectionM))))
		}
	}
	return lines
}

// diagnosisLines is the diagnosis: the progress bar while it runs, then
// the verdict, the best explanations, what tells them apart and the trend.
func (p readingPanel) diagnosisLines(w int) []string {
	st := p.st
	n := len(p.readings)
	head := st.Heading.Render("DIAGNOSIS")
	if n > 0 {
		head += st.Dim.Render(fmt.Sprintf("  %d read, last %s min · X clears", n, num(p.readings[n-1].Minutes, 1)))
	}
	lines := []string{head}
	switch {
	case p.running:
		bar := p.bar
		bar.Width = max(10, w-12)
		frac := 0.0
		if p.total > 0 {
			frac = float64(p.done) / float64(p.total)
		}
		return append(lines, st.Busy.Render("searching ")+bar.ViewAs(frac))
	case p.failure != "":
		return append(lines, wrapStyled(st.Error, p.failure, w)...)
	case p.result == nil:
		return append(lines, wrapStyled(st.Dim, "Take a reading (n): the drafts at the marks, the heel, any soundings. heelwatch finds what flooding explains them.", w)...)
	}
	res := p.result
	style := st.Text
	if !res.Fits {
		style = st.Danger
	}
	lines = append(lines, wrapStyled(style, res.Verdict, w)...)
	for _, g := range res.Disagreements {
		lines = append(lines, wrapStyled(st.Caution, g.Message, w)...)
	}
	for i, e := range res.Explanations {
		if i >= 3 {
			break
		}
		mk, hl := report.ErrorWords(e)
		var water []string
		for _, s := range e.Spaces {
			water = append(water, num(s.WaterM3, 0)+" m³")
		}
		line := fmt.Sprintf("%d %s", i+1, e.Names(p.v))
		if len(water) > 0 {
			line += " " + strings.Join(water, "+")
		}
		errs := " " + strings.ReplaceAll(mk, " ", "") + " " + hl
		lw := max(0, w-len([]rune(errs)))
		lines = append(lines, fitLine(clip(line, lw), lw)+st.Dim.Render(errs))
	}
	if p.trend != nil {
		for _, s := range report.TrendWords(p.v, *p.trend) {
			lines = append(lines, wrapStyled(st.Text, s, w)...)
		}
	} else if p.trendNote != "" {
		lines = append(lines, st.Dim.Render(clip(p.trendNote, w)))
	}
	if len(res.Tellers) > 0 {
		lines = append(lines, wrapStyled(st.Caution, res.Tellers[0], w)...)
	}
	if _, what, ok := p.toApply(p.v); ok {
		lines = append(lines, wrapStyled(st.Dim, "a: "+what+" onto the dashboard", w)...)
	}
	return lines
}

func wrapStyled(s interface{ Render(...string) string }, text string, w int) []string {
	var out []string
	for _, l := range wrap(text, w) {
		out = append(out, s.Render(l))
	}
	return out
}

// readingSize is the panel's size on the screen as the root lays it out
// (view.go: beside the list on a narrow screen, under the figures on a
// wide one).
func (m model) readingSize() (int, int) {
	if m.lay.wide {
		return m.width, m.lay.picH
	}
	return m.lay.rightW, m.lay.bodyH
}

// readingLines draws the panel for the root model.
func (m model) readingLines(w, h int) []string {
	return strings.Split(m.rd.with(m.v, m.curPosition(), m.st, m.bar, m.lay.wide).view(w, h), "\n")
}

// curPosition is the floating position shown, nil if none.
func (m model) curPosition() *engine.Position {
	if m.cur == nil {
		return nil
	}
	return m.cur.Position
}
