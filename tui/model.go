package tui

import (
	"fmt"
	"math"
	"sync/atomic"
	"time"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/progress"
	"github.com/charmbracelet/bubbles/spinner"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// space is what the list shows of one compartment beyond the engine's values.
type space struct {
	group string
	use   string
	pump  float64      // m³/h, 0 if none
	hole  *engine.Hole // the vessel file's hole into it, nil if none
	// shellZ is the height of the compartment's lowest point in the shell
	// at the middle of its length (engine.ShellHole): where a hole the
	// vessel file does not give goes by default.
	shellZ float64
}

// change is one edit of the damage state, waiting for its figures.
type change struct {
	at   time.Time
	what string
}

// Messages.
type (
	// resultMsg carries the assessment of the damage state of one
	// sequence number. Skipped is set when a newer change had already been
	// made before the computation started, so it was not done.
	resultMsg struct {
		seq     int
		a       engine.Assessment
		skipped bool
		failure string // the engine failed (a recovered panic)
	}
	// baselineMsg carries the intact assessment, the reference for every
	// "since intact" figure.
	baselineMsg struct{ a engine.Assessment }
	reportMsg   struct {
		path string
		err  error
	}
)

// model is the dashboard. It holds its parts as concrete values; Update
// never computes physics (that runs in recompute's Cmd) and View only draws.
type model struct {
	v         *engine.Vessel
	spaces    []space
	into      []int // the compartment each opening leads into (leadsInto)
	opts      Options
	condition string        // the loading condition's name from the file
	info      *vessels.Info // the vessel file's holes, pumps and ship type for a flooding run; may be nil
	now       func() time.Time

	keys     keyMap
	help     help.Model
	spin     spinner.Model
	spinning bool
	animate  bool // false in tests: no spinner ticks
	input    textinput.Model
	bar      progress.Model // a flooding run's progress, drawn with ViewAs
	inputErr string
	mode     mode // what the keys work on

	form   floodForm    // the hole-and-pumps form of a flooding run
	flood  floodPanel   // the flooding run and its panel (flood.go)
	rem    remedyPanel  // the righting options and their panel (remedy.go)
	girder girderPanel  // the hull girder's shear force and bending moment (strength_view.go)
	rd     readingPanel // draft marks, readings by hand and their diagnosis (reading_panel.go)
	doors  doorsPanel   // the doors and valves, open or shut (doors.go)
	find   finder       // the type-to-find of the compartment list (find.go)

	cond conditionPanel // the loading condition: tanks, weights, saving (condition_view.go)

	rend    *lipgloss.Renderer
	palette int
	st      *Styles
	inks    map[ink]lipgloss.Style

	damage engine.Damage
	undo   []undoEntry

	seq     int           // the newest change's number
	latest  *atomic.Int64 // the same, for the Cmds to read
	shown   int           // the number of the change whose figures are shown
	cur     *engine.Assessment
	base    *engine.Assessment
	derived derived
	failure string

	changes map[int]change
	results map[int][2]string // for the screen, for the file
	logNext int
	log     []string // on screen, newest last
	file    *eventLog
	wantRep bool

	rows       []listRow
	sel        int
	offset     int
	picture    int
	hand       handPanel // the hand method's panel
	textScroll int       // the first line of the flags and criteria shown
	width      int
	height     int
	lay        layout
	pics       *pictureCache // the pictures as last drawn (View's only state)
}

// mode is what the keys work on: one value routes every key.
type mode int

const (
	modeBrowse mode = iota // the list, the panels and their keys
	modeForm               // the flooding run's form (floodForm.update)
	modeMu                 // a permeability being typed (editKey)
	modeFind               // a compartment's name being typed (finder.update)
)

type undoEntry struct {
	damage engine.Damage
	what   string
	// cond is the loading condition to go back to when the change undone
	// was one of the condition (condition panel); nil for a change of the
	// damage.
	cond *vessels.Condition
}

// Pictures a narrow screen shows one at a time.
const (
	picSection = iota
	picProfile
	picGZ
	picCriteria
	numPictures
)

// newModel builds the dashboard for v. info may be nil.
func newModel(v *engine.Vessel, info *vessels.Info, opts Options) model {
	v, info, opts = plainNames(v), plainInfo(info), plainOptions(opts)
	m := model{
		pics:    &pictureCache{},
		v:       v,
		opts:    opts,
		now:     time.Now,
		keys:    newKeyMap(),
		help:    help.New(),
		spin:    spinner.New(spinner.WithSpinner(spinner.MiniDot)),
		animate: true,
		input:   newTextField(),
		rend:    lipgloss.DefaultRenderer(),
		damage:  v.Intact(),
		latest:  new(atomic.Int64),
		flood:   floodPanel{latest: new(atomic.Int64)},
		rem:     remedyPanel{latest: new(atomic.Int64)},
		changes: map[int]change{},
		results: map[int][2]string{},
		logNext: 1,
		width:   80,
		height:  24,
	}
	m.info = info
	if info != nil {
		m.condition = info.Condition
	}
	m = m.withCondition(opts)
	m.into = leadsInto(v)
	m.derived = derive(v, m.into, nil)
	m.spaces = make([]space, len(v.Compartments))
	for i, c := range v.Compartments {
		s := space{use: c.Use}
		if info != nil && i < len(info.Compartments) {
			ci := info.Compartments[i]
			s.group, s.pump, s.hole = ci.Group, ci.PumpM3h, ci.Hole
			if ci.Use != "" {
				s.use = ci.Use
			}
		}
		if s.group == "" {
			s.group = zoneOf(v, c)
		}
		s.shellZ = c.Box.Z0
		if h, err := engine.ShellHole(v, i, 1, math.NaN(), 0); err == nil {
			s.shellZ = h.ZM
		}
		m.spaces[i] = s
	}
	m.rows = listRows(m.spaces)
	for _, r := range m.rows {
		if r.idx >= 0 {
			m.sel = r.idx
			break
		}
	}
	m.input.Prompt = ""
	m.input.CharLimit = 8
	m.input.Placeholder = "0.85"
	for i, n := range paletteNames {
		if n == opts.Palette {
			m.palette = i
		}
	}
	m.setStyles()
	m.resize()
	return m.startWith(opts.Start)
}

// zoneOf places a compartment without a group by where it lies along the
// ship: the third of the length that holds its middle.
func zoneOf(v *engine.Vessel, c *engine.Compartment) string {
	L := v.Hull.LengthM
	x := (c.Box.X0 + c.Box.X1) / 2
	switch {
	case x < L/3:
		return "aft"
	case x > 2*L/3:
		return "forward"
	}
	return "midships"
}

func (m *model) setStyles() {
	m.st = newStyles(m.rend, paletteFor(paletteNames[m.palette]))
	m.inks = m.st.pictureInks()
	m.help.Styles = m.st.Help
	m.spin.Style = m.st.Busy
	m.input.PromptStyle = m.st.Prompt
	m.input.TextStyle = m.st.Value
	m.input.PlaceholderStyle = m.st.Dim // bubbles' own grey is not red at night
	m.bar = progress.New(progress.WithSolidFill(m.st.BarColor), progress.WithColorProfile(m.rend.ColorProfile()))
	m.bar.EmptyColor = ""
	m.form.st = m.st
	for k := range m.form.fields {
		m.form.fields[k].PromptStyle, m.form.fields[k].TextStyle = m.st.Prompt, m.st.Value
	}
}

// Init computes the intact condition, the reference for every change.
func (m model) Init() tea.Cmd {
	v := m.v
	return newest(0, nil, nil,
		func(why string) tea.Msg { return resultMsg{seq: 0, failure: why} },
		func() tea.Msg { return baselineMsg{engine.Assess(v, v.Intact())} })
}

// pending reports whether the figures shown are not yet those of the
// newest change.
func (m model) pending() bool {
	return m.shown != m.seq || (m.base == nil && m.failure == "")
}

// Update handles one message, then divides the screen for what it left:
// the one place sizes are decided (resize), once per message.
func (m model) Update(msg tea.Msg) (tea.Model, tea.Cmd) {
	next, cmd := m.update(msg)
	mm := next.(model)
	mm.resize()
	return mm, cmd
}

// update handles one message.
func (m model) update(msg tea.Msg) (tea.Model, tea.Cmd) {
	if mm, cmd, ok := m.conditionMsg(msg); ok {
		return mm, cmd
	}
	if mm, cmd, ok := m.readingMsg(msg); ok {
		return mm, cmd
	}
	switch msg := msg.(type) {
	case tea.WindowSizeMsg:
		m.width, m.height = msg.Width, msg.Height
		return m, nil

	case baselineMsg:
		a := msg.a
		m.base = &a
		if m.seq == 0 {
			m.cur = &a
			m.derived = derive(m.v, m.into, m.cur)
			m.ensureVisible()
		}
		what := "start, all intact"
		file := "session start: " + m.vesselName()
		if m.opts.VesselFile != "" {
			file += " (" + m.opts.VesselFile + ")"
		}
		if m.condition != "" {
			file += ", " + m.condition
		}
		file += ", all intact"
		logged := m.addLogPair(m.now(), what+" → "+m.outcome(&a, false), file+" → "+m.outcome(&a, true))
		var start tea.Cmd
		m, start = m.startCase() // the case given on the command line, if any
		return m, tea.Batch(logged, start)

	case resultMsg:
		return m.takeResult(msg)

	case logStatusMsg:
		return m.takeLogStatus()
	case logRetryMsg:
		return m.retryLog()

	case reportMsg:
		line := "report written to " + msg.path
		if msg.err != nil {
			line = "report not written: " + msg.err.Error()
		}
		return m, m.addLog(m.now(), line)

	case spinner.TickMsg:
		if !m.pending() && !m.rem.running {
			m.spinning = false
			return m, nil
		}
		var cmd tea.Cmd
		m.spin, cmd = m.spin.Update(msg)
		return m, cmd

	case floodStepMsg, floodDoneMsg, netDoneMsg:
		return m.updateFlood(msg)

	case remedyMsg:
		return m.updateRemedies(msg)

	case doorMsg:
		return m.takeDoor(msg)

	case tea.KeyMsg:
		msg = plainKey(msg)
		if m.lay.small {
			return m.smallScreenKey(msg)
		}
		if msg.Type == tea.KeyRunes && len(msg.Runes) > 1 && !msg.Paste {
			// Keys pressed faster than the terminal is read arrive as one
			// message ("jj"): take them one at a time, each in the mode the
			// one before left (a form or a typed permeability included).
			var cmds []tea.Cmd
			var cur tea.Model = m
			for _, r := range msg.Runes {
				var cmd tea.Cmd
				cur, cmd = cur.Update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{r}, Alt: msg.Alt})
				cmds = append(cmds, cmd)
			}
			return cur, tea.Batch(cmds...)
		}
		switch m.mode {
		case modeForm:
			return m.formKey(msg)
		case modeMu:
			return m.editKey(msg)
		case modeFind:
			return m.findKey(msg)
		}
		return m.key(msg)
	}
	return m, nil
}

func (m model) key(msg tea.KeyMsg) (tea.Model, tea.Cmd) {
	k := m.keys
	if m.rem.handles(msg, k) {
		// The righting options' own keys (while shown, the scroll keys
		// before the hand panel's).
		return m.updateRemedies(msg)
	}
	var took bool
	if m.hand, took = m.handShown().update(msg, k); took {
		return m, nil
	}
	n := len(m.v.Compartments)
	switch {
	case key.Matches(msg, k.Quit):
		return m, tea.Quit
	case key.Matches(msg, k.Help):
		m.help.ShowAll = !m.help.ShowAll
	case key.Matches(msg, doorsKey):
		return m.doorsToggle()
	case m.doors.handles(msg):
		var cmd tea.Cmd
		m.doors, cmd = m.doors.update(msg, m.v.Connections)
		return m, cmd
	case key.Matches(msg, k.Up):
		m.move(-1)
	case key.Matches(msg, k.Down):
		m.move(1)
	case key.Matches(msg, k.Top):
		m.move(-len(m.rows))
	case key.Matches(msg, k.Bottom):
		m.move(len(m.rows))
	case key.Matches(msg, k.PageUp), key.Matches(msg, k.PageDown):
		m.page(key.Matches(msg, k.PageDown))
	case key.Matches(msg, k.Find):
		return m.openFind()
	case key.Matches(msg, k.Picture):
		m.picture = (m.picture + 1) % numPictures
	case key.Matches(msg, k.WorkUp), key.Matches(msg, k.WorkDown):
		step := scrollStep
		if key.Matches(msg, k.WorkUp) {
			step = -scrollStep
		}
		m.scroll(step)
	case key.Matches(msg, k.Palette):
		m.palette = (m.palette + 1) % len(paletteNames)
		m.setStyles()
	case key.Matches(msg, k.Report):
		if !m.reportReady() {
			m.wantRep = true
			return m, nil
		}
		if m.cur == nil {
			return m, m.addLog(m.now(), "report not written: there are no figures to report")
		}
		return m, m.writeReport()
	case key.Matches(msg, k.Girder):
		return m.girderKey()
	case m.girder.handles(msg):
		var cmd tea.Cmd
		m.girder, cmd = m.girder.update(msg)
		return m, cmd
	case key.Matches(msg, k.RunPanel) && m.rem.show:
		// The righting options give way to the run's panel.
		m.rem.show, m.flood.show = false, true
	case key.Matches(msg, k.RunPanel), key.Matches(msg, k.RunStage):
		return m.updateFlood(msg)
	case n == 0:
		return m, nil
	case key.Matches(msg, k.HoleRun):
		return m.openForm()
	case key.Matches(msg, k.Flood):
		return m.toggleFlooded()
	case key.Matches(msg, k.MuUp):
		return m.stepMu(0.05)
	case key.Matches(msg, k.MuDown):
		return m.stepMu(-0.05)
	case key.Matches(msg, k.MuSet):
		m.mode = modeMu
		m.inputErr = ""
		m.input.SetValue("")
		m.input.Placeholder = muText(m.mu(m.damage, m.sel))
		cmd := m.input.Focus()
		if !m.animate {
			// Tests: a still cursor, so that no blink timer runs.
			m.input.Cursor.SetMode(cursor.CursorStatic)
			cmd = nil
		}
		return m, cmd
	case key.Matches(msg, k.Undo):
		if len(m.undo) == 0 {
			return m, nil
		}
		u := m.undo[len(m.undo)-1]
		m.undo = m.undo[:len(m.undo)-1]
		if u.cond != nil {
			return m.undoCondition(u)
		}
		return m.commit(u.damage, "undone: "+u.what)
	case key.Matches(msg, k.Reset):
		if len(m.damage) == 0 || allZero(m.damage) {
			return m, nil
		}
		return m.apply(m.v.Intact(), "all compartments intact (reset)")
	}
	return m, nil
}

// toggleFlooded opens the selected compartment to the sea, or closes it up
// (intact) when it is open or holds water.
func (m model) toggleFlooded() (tea.Model, tea.Cmd) {
	d := cloneDamage(m.damage)
	c := m.v.Compartments[m.sel]
	if d[m.sel].Open || d[m.sel].WaterM3 > 0 {
		d[m.sel].Open, d[m.sel].WaterM3 = false, 0
		return m.apply(d, c.Name+" closed up (intact)")
	}
	d[m.sel].Open = true
	return m.apply(d, c.Name+" opened to sea (μ "+muText(m.mu(d, m.sel))+")")
}

// stepMu moves the selected compartment's permeability by step, to the
// nearest hundredth, between 0.05 and 1.
func (m model) stepMu(step float64) (tea.Model, tea.Cmd) {
	old := m.mu(m.damage, m.sel)
	mu := math.Round((old+step)*100) / 100
	mu = math.Min(1, math.Max(0.05, mu))
	if mu == old {
		return m, nil
	}
	return m.setMu(mu)
}

// scroll moves the flags and criteria, where they are on screen, by step
// lines (up when negative); the righting options and the hand working
// scroll in their own panels.
func (m *model) scroll(step int) {
	if m.cur != nil {
		w, h := m.criteriaBox()
		m.textScroll = scrolled(m.textScroll, m.criteriaLines(w, true), h-1, step)
	}
}

// criteriaBox is the size the flags and criteria are drawn in: the wide
// screen's third column, else the narrow screen's sheet.
func (m model) criteriaBox() (w, h int) {
	if m.lay.wide {
		return m.lay.thirdW, m.lay.topH
	}
	return m.lay.rightW, m.lay.sheetH
}

// move selects the compartment steps rows down the list (up when
// negative), in the order the list shows them, stopping at the ends.
func (m *model) move(steps int) {
	pos := -1
	var order []int
	for _, r := range m.rows {
		if r.idx >= 0 {
			if r.idx == m.sel {
				pos = len(order)
			}
			order = append(order, r.idx)
		}
	}
	if len(order) == 0 {
		return
	}
	pos = min(max(pos+steps, 0), len(order)-1)
	m.sel = order[pos]
	m.ensureVisible()
}

// editKey handles keys while an exact permeability is being typed.
func (m model) editKey(msg tea.KeyMsg) (tea.Model, tea.Cmd) {
	switch msg.Type {
	case tea.KeyEsc:
		m.mode = modeBrowse
		m.input.Blur()
		return m, nil
	case tea.KeyCtrlC:
		return m, tea.Quit
	case tea.KeyEnter:
		mu, err := parseMu(m.input.Value())
		if err != nil {
			m.inputErr = err.Error()
			return m, nil
		}
		m.mode = modeBrowse
		m.input.Blur()
		if mu == m.mu(m.damage, m.sel) {
			return m, nil
		}
		return m.setMu(mu)
	}
	var cmd tea.Cmd
	m.input, cmd = m.input.Update(msg)
	m.inputErr = ""
	return m, cmd
}

// parseMu reads a typed permeability as the command line does (see
// vessels.ParsePermeability).
func parseMu(s string) (float64, error) { return vessels.ParsePermeability(s) }

// setMu sets the selected compartment's permeability.
func (m model) setMu(mu float64) (tea.Model, tea.Cmd) {
	d := cloneDamage(m.damage)
	old := m.mu(d, m.sel)
	d[m.sel].Permeability = mu
	c := m.v.Compartments[m.sel]
	what := fmt.Sprintf("%s μ set %s (was %s)", c.Name, muText(mu), muText(old))
	if !d[m.sel].Open {
		what += " (intact: counts when it is opened)"
	}
	return m.apply(d, what)
}

// mu returns the permeability compartment i has under d.
func (m model) mu(d engine.Damage, i int) float64 { return m.v.Permeability(d, i) }

// apply makes d the damage state, keeping the old one for undo.
func (m model) apply(d engine.Damage, what string) (tea.Model, tea.Cmd) {
	m.pushUndo(undoEntry{damage: m.damage, what: what})
	return m.commit(d, what)
}

// pushUndo keeps u as the change the undo key undoes next (the last 500).
func (m *model) pushUndo(u undoEntry) {
	m.undo = append(m.undo, u)
	if len(m.undo) > 500 {
		m.undo = m.undo[1:]
	}
}

// commit makes d the damage state and starts its computation: the change
// gets the next sequence number, and only the result of the newest number
// is ever shown.
func (m model) commit(d engine.Damage, what string) (tea.Model, tea.Cmd) {
	m.damage = d
	m.seq++
	m.latest.Store(int64(m.seq))
	m.changes[m.seq] = change{at: m.now(), what: what}
	logged := m.logChange(m.seq, m.changes[m.seq]) // in the file before it is computed or shown
	spin := m.startSpinner()                       // before m is copied out: the order is not Go's to promise
	return m, tea.Batch(logged, recompute(m.v, cloneDamage(d), m.seq, m.latest), spin)
}

// recompute returns the Cmd that assesses damage state d, change number seq.
// It does nothing when a newer change was made before it started (the
// result could never be shown), and it turns an engine failure into a
// message instead of taking the screen down.
func recompute(v *engine.Vessel, d engine.Damage, seq int, latest *atomic.Int64) tea.Cmd {
	return newest(seq, latest,
		func() tea.Msg { return resultMsg{seq: seq, skipped: true} },
		func(why string) tea.Msg { return resultMsg{seq: seq, failure: why} },
		func() tea.Msg { return resultMsg{seq: seq, a: assessSpread(v, d)} })
}

// takeResult shows a result if it is the newest and logs every change in
// the order it was made.
func (m model) takeResult(r resultMsg) (tea.Model, tea.Cmd) {
	var cmds []tea.Cmd
	if r.seq == m.seq && !r.skipped {
		if r.failure != "" {
			m.failure = r.failure
			m.cur = nil
		} else {
			a := r.a
			m.cur, m.failure = &a, ""
		}
		m.shown = r.seq
		m.derived = derive(m.v, m.into, m.cur)
		m.ensureVisible()
		if m.wantRep && m.reportReady() {
			m.wantRep = false
			cmds = append(cmds, m.writeReport())
		}
	}
	if r.seq >= m.logNext {
		switch {
		case r.skipped:
			m.results[r.seq] = [2]string{"not worked out: a newer change came first", "not worked out: a newer change came first"}
		case r.failure != "":
			m.results[r.seq] = [2]string{"engine failure: " + r.failure, "engine failure: " + r.failure}
		default:
			m.results[r.seq] = [2]string{m.outcome(&r.a, false), m.outcome(&r.a, true)}
		}
	}
	for {
		res, ok := m.results[m.logNext]
		if !ok {
			break
		}
		ch := m.changes[m.logNext]
		delete(m.results, m.logNext)
		delete(m.changes, m.logNext)
		cmds = append(cmds, m.addLogResult(m.logNext, ch, res))
		m.logNext++
	}
	return m, tea.Batch(cmds...)
}

// outcome is a result in one line for the log: heel and drafts, or why
// there is no floating position. The long form, for the file, names the
// drafts.
func (m model) outcome(a *engine.Assessment, long bool) string {
	if a.Position == nil {
		if a.NoEq != nil {
			return "NO EQUILIBRIUM: " + a.NoEq.Outcome.Plain() + " (" + a.NoEq.Reason + ")"
		}
		return "no floating position"
	}
	p := a.Position
	drafts := "drafts"
	if long {
		drafts = "drafts aft/mid/fwd"
	}
	return fmt.Sprintf("heel %s, %s %s/%s/%s m", heelShort(p.HeelDeg), drafts,
		num(p.DraftAftM, 2), num(p.DraftMidM, 2), num(p.DraftFwdM, 2))
}

// addLog puts a line in the event log on screen and, with a log file, in
// the file's queue; the Cmd it returns writes and syncs the file.
func (m *model) addLog(at time.Time, line string) tea.Cmd { return m.addLogPair(at, line, line) }

// addLogPair is addLog with a fuller line for the file than for the screen.
func (m *model) addLogPair(at time.Time, line, fileLine string) tea.Cmd {
	m.screenLog(at, line)
	return m.fileLine(at, fileLine)
}

func (m *model) startSpinner() tea.Cmd {
	if !m.animate || m.spinning {
		return nil
	}
	m.spinning = true
	return m.spin.Tick
}

func (m model) vesselName() string {
	if m.opts.VesselName != "" {
		return m.opts.VesselName
	}
	return m.v.Name
}

// cloneDamage copies a damage state.
func cloneDamage(d engine.Damage) engine.Damage { return append(engine.Damage(nil), d...) }

// allZero reports whether d is the intact state with every compartment at
// its own permeability.
func allZero(d engine.Damage) bool {
	for _, s := range d {
		if s != (engine.SpaceState{}) {
			return false
		}
	}
	return true
}
