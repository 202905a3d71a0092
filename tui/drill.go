package tui

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"sort"
	"strconv"
	"strings"
	"time"

	"github.com/charmbracelet/bubbles/textinput"
	"github.com/charmbracelet/bubbles/viewport"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

// This file is the drill's dashboard: a program of its own, started by
// `heelwatch drill SCENARIO`, apart from the officer's dashboard. It runs
// the truth in scenario time and shows the crew only what they would have
// (drill_crew_view.go); the instructor's view (drill_instructor_view.go)
// shows the truth and injects events; at the end the debrief is shown.

// DrillOptions are the drill dashboard's settings.
type DrillOptions struct {
	Speed   float64 // scenario minutes per real minute at the start (1: real time)
	LogFile string  // the drill's log (a scenario file) is written here after every change; the debrief beside it (.debrief.md) at the end
	Version string
}

// drillTick is one tick of the scenario clock.
type drillTick struct{}

// drillTickEvery is the real time between ticks.
const drillTickEvery = 250 * time.Millisecond

// drillSpeeds are the clock's speeds, scenario minutes per real minute.
var drillSpeeds = []float64{1, 2, 5, 10, 30, 60, 120}

// drillDebriefMsg carries a finished debrief.
type drillDebriefMsg struct {
	text string
	err  error
}

// drillDiagnosisMsg carries the crew's diagnosis from their readings.
type drillDiagnosisMsg struct {
	minutes float64
	lines   []string
	err     error
}

// drillMode is what the screen shows.
type drillMode int

const (
	drillCrew drillMode = iota
	drillInstructor
	drillDebrief
)

// pickFor is what a compartment picker is choosing for.
type pickFor int

const (
	pickNone pickFor = iota
	pickMark
	pickPump
	pickStop
	pickCounter
	pickDoor      // a connection, not a compartment
	pickDoorTruth // instructor: a connection's true state
	pickBreach    // instructor
	pickFail      // instructor
)

// drillModel is the drill's root model.
type drillModel struct {
	sc      *vessels.Scenario
	d       *engine.Drill
	extra   []engine.DrillEvent // the crew's and the instructor's events
	speed   float64
	paused  bool
	mode    drillMode
	w, h    int
	opts    DrillOptions
	status  string
	marks   map[int]bool    // the crew's picture: marked flooded
	ordered map[int]float64 // pumps the crew ordered on, m³/h
	inlets  map[int]bool    // sea inlets the crew opened to counter-flood
	doors   map[int]bool    // connections as the crew believe them: open (true) or shut

	pick     pickFor
	pickList []int
	cursor   int
	input    textinput.Model
	asking   string // "" or what the input asks for: "breach", "note"
	pickComp int

	diagnosis   []string // the crew's last diagnosis from their readings
	diagnosing  bool
	debrief     viewport.Model
	debriefText string
	debriefed   bool
	noTick      bool // tests drive the clock themselves
}

// RunDrill shows the drill of scenario sc until the instructor quits.
func RunDrill(sc *vessels.Scenario, opts DrillOptions) error {
	m, err := newDrillModel(sc, opts)
	if err != nil {
		return err
	}
	_, err = tea.NewProgram(m, tea.WithAltScreen()).Run()
	return err
}

func newDrillModel(sc *vessels.Scenario, opts DrillOptions) (*drillModel, error) {
	setup := sc.Setup()
	d, err := engine.NewDrill(setup.Vessel, setup.Base, setup.Events, setup.EndMin)
	if err != nil {
		return nil, err
	}
	if len(setup.Alarms) > 0 {
		d.SetAlarms(setup.Alarms, setup.AlarmLevel)
	}
	if opts.Speed <= 0 {
		opts.Speed = 10
	}
	in := newTextField()
	in.CharLimit = 200
	return &drillModel{sc: sc, d: d, speed: opts.Speed, opts: opts, marks: map[int]bool{}, ordered: map[int]float64{}, inlets: map[int]bool{}, doors: doorsAsFitted(sc),
		input: in, w: 80, h: 24, debrief: viewport.New(80, 20)}, nil
}

func (m *drillModel) Init() tea.Cmd { return m.tick() }

func (m *drillModel) tick() tea.Cmd {
	if m.noTick {
		return nil
	}
	return tea.Tick(drillTickEvery, func(time.Time) tea.Msg { return drillTick{} })
}

// advance moves the scenario clock on by real seconds s at the speed set.
func (m *drillModel) advance(s float64) {
	if m.paused || m.d.Over() {
		return
	}
	m.d.AdvanceTo(m.d.Minutes() + m.speed*s/60)
}

func (m *drillModel) Update(msg tea.Msg) (tea.Model, tea.Cmd) {
	switch msg := msg.(type) {
	case tea.WindowSizeMsg:
		m.w, m.h = msg.Width, msg.Height
		m.debrief.Width, m.debrief.Height = msg.Width, max(msg.Height-2, 3)
		if m.debriefText != "" {
			m.debrief.SetContent(lipgloss.NewStyle().Width(m.w).Render(m.debriefText))
		}
		return m, nil
	case drillTick:
		m.advance(drillTickEvery.Seconds())
		if m.d.Over() {
			if m.debriefed {
				return m, nil // the clock stops at the end
			}
			m.debriefed = true
			m.writeLog()
			return m, m.makeDebrief()
		}
		return m, m.tick()
	case drillDiagnosisMsg:
		m.diagnosing = false
		if msg.err != nil {
			m.status = "diagnosis: " + msg.err.Error()
			return m, nil
		}
		m.status = ""
		m.diagnosis = append([]string{fmt.Sprintf("Our diagnosis from the readings at %s:", clock(msg.minutes))}, msg.lines...)
		if !m.d.Over() && len(msg.lines) > 0 {
			// Logged as the crew's own note, for the debrief.
			m.decide(engine.DrillEvent{Kind: engine.DrillNote, By: engine.ByCrew, Compartment: -1,
				Text: fmt.Sprintf("Our diagnosis from the readings at %s: %s", clock(msg.minutes), strings.TrimSpace(msg.lines[0]))})
		}
		return m, nil
	case drillDebriefMsg:
		if msg.err != nil {
			m.status = "debrief: " + msg.err.Error()
			return m, nil
		}
		m.debriefText = msg.text
		if m.opts.LogFile != "" && m.d.Over() {
			path := strings.TrimSuffix(m.opts.LogFile, ".toml") + ".debrief.md"
			if err := os.WriteFile(path, []byte(msg.text), 0o644); err != nil {
				m.status = "debrief: " + err.Error()
			} else {
				m.status = "Debrief written to " + path
			}
		}
		m.debrief.SetContent(lipgloss.NewStyle().Width(m.w).Render(msg.text))
		m.mode = drillDebrief
		return m, nil
	case tea.KeyMsg:
		return m.key(msg)
	}
	return m, nil
}

func (m *drillModel) key(k tea.KeyMsg) (tea.Model, tea.Cmd) {
	s := k.String()
	if s == "ctrl+c" {
		m.writeLog()
		return m, tea.Quit
	}
	if m.asking != "" {
		return m.answer(k)
	}
	if m.pick != pickNone {
		return m.picking(s)
	}
	switch s {
	case "q":
		m.writeLog()
		return m, tea.Quit
	case " ":
		m.paused = !m.paused
	case "+", "=":
		m.speed = nextSpeed(m.speed, +1)
	case "-":
		m.speed = nextSpeed(m.speed, -1)
	case "i":
		if m.mode == drillInstructor {
			m.mode = drillCrew
		} else {
			m.mode = drillInstructor
		}
	case "esc":
		if m.mode != drillCrew && !m.d.Over() {
			m.mode = drillCrew
		}
	}
	if m.mode == drillDebrief {
		var cmd tea.Cmd
		m.debrief, cmd = m.debrief.Update(k)
		return m, cmd
	}
	if m.d.Over() {
		return m, nil
	}
	if m.mode == drillInstructor {
		return m, m.instructorKey(s)
	}
	return m, m.crewKey(s)
}

// indices returns 0, 1, …, n−1.
func indices(n int) []int {
	out := make([]int, n)
	for i := range out {
		out[i] = i
	}
	return out
}

// crewKey acts on a key of the crew's view.
func (m *drillModel) crewKey(s string) tea.Cmd {
	v := m.d.Vessel()
	switch s {
	case "m":
		m.startPick(pickMark, indices(len(v.Compartments)))
	case "p":
		m.startPick(pickPump, indices(len(v.Compartments)))
	case "c":
		m.startPick(pickCounter, indices(len(v.Compartments)))
	case "d":
		if len(v.Connections) == 0 {
			m.status = "This ship has no doors or valves between compartments in her file."
			return nil
		}
		m.startPick(pickDoor, indices(len(v.Connections)))
	case "g":
		if m.diagnosing {
			return nil
		}
		m.diagnosing = true
		m.status = "Diagnosing from our readings…"
		return m.diagnose()
	case "s":
		var on []int
		for i := range m.ordered {
			on = append(on, i)
		}
		sort.Ints(on)
		if len(on) == 0 {
			m.status = "No pump ordered on."
			return nil
		}
		m.startPick(pickStop, on)
	}
	return nil
}

// instructorKey acts on a key of the instructor's view.
func (m *drillModel) instructorKey(s string) tea.Cmd {
	v := m.d.Vessel()
	switch s {
	case "b":
		m.startPick(pickBreach, indices(len(v.Compartments)))
	case "f":
		m.startPick(pickFail, indices(len(v.Compartments)))
	case "o":
		if len(v.Connections) > 0 {
			m.startPick(pickDoorTruth, indices(len(v.Connections)))
		}
	case "n":
		m.ask("note", "Note to the crew: ")
	case "D":
		return m.makeDebrief()
	}
	return nil
}

func nextSpeed(cur float64, dir int) float64 {
	i := sort.SearchFloat64s(drillSpeeds, cur)
	if i < len(drillSpeeds) && drillSpeeds[i] == cur {
		i += dir
	} else if dir < 0 {
		i--
	}
	i = max(0, min(i, len(drillSpeeds)-1))
	return drillSpeeds[i]
}

func (m *drillModel) startPick(p pickFor, list []int) {
	m.pick, m.pickList, m.cursor = p, list, 0
}

func (m *drillModel) ask(what, prompt string) {
	m.asking = what
	m.input.Reset()
	m.input.Prompt = prompt
	m.input.Focus()
}

func (m *drillModel) picking(s string) (tea.Model, tea.Cmd) {
	switch s {
	case "esc", "q":
		m.pick = pickNone
	case "up", "k":
		m.cursor = max(0, m.cursor-1)
	case "down", "j":
		m.cursor = min(len(m.pickList)-1, m.cursor+1)
	case "pgup":
		m.cursor = max(0, m.cursor-10)
	case "pgdown":
		m.cursor = min(len(m.pickList)-1, m.cursor+10)
	case "enter":
		i := m.pickList[m.cursor]
		p := m.pick
		m.pick = pickNone
		m.chosen(p, i)
	case "o":
		if m.pick == pickDoor {
			m.pick = pickNone
			m.orderDoor(m.pickList[m.cursor], true)
		}
	}
	return m, nil
}

// orderDoor orders connection i open or shut (shut: checked and closed,
// whatever the crew believed of it).
func (m *drillModel) orderDoor(i int, open bool) {
	c := m.d.Vessel().Connections[i]
	m.doors[i] = open
	m.decide(engine.DrillEvent{Kind: engine.DrillConnection, By: engine.ByCrew, Compartment: -1, Name: c.Name, Open: open})
	if open {
		m.status = c.Name + " ordered open."
	} else {
		m.status = c.Name + " ordered checked and shut."
	}
}

// doorsAsFitted is the state of each connection as the vessel file gives
// it: what the crew believe at the start.
func doorsAsFitted(sc *vessels.Scenario) map[int]bool {
	out := map[int]bool{}
	for i, c := range sc.Vessel.Connections {
		out[i] = c.Open
	}
	return out
}

// chosen acts on the compartment (or connection) picked.
func (m *drillModel) chosen(p pickFor, i int) {
	v := m.d.Vessel()
	if p == pickDoor {
		m.orderDoor(i, false)
		return
	}
	if p == pickDoorTruth {
		c := v.Connections[i]
		m.decide(engine.DrillEvent{Kind: engine.DrillConnection, By: engine.ByInstructor, Compartment: -1, Name: c.Name, Open: !c.Open})
		if c.Open {
			m.status = c.Name + " now shut (instructor)."
		} else {
			m.status = c.Name + " now open (instructor): found open if the crew look."
		}
		return
	}
	name := v.Compartments[i].Name
	switch p {
	case pickMark:
		m.marks[i] = !m.marks[i]
		m.decide(engine.DrillEvent{Kind: engine.DrillMark, By: engine.ByCrew, Compartment: i, Flooded: m.marks[i]})
	case pickPump:
		capm := 0.0
		if m.sc.Info != nil {
			capm = m.sc.Info.Compartments[i].PumpM3h
		}
		if capm <= 0 {
			m.status = "No pump can be put on " + name + "."
			return
		}
		m.ordered[i] = capm
		m.decide(engine.DrillEvent{Kind: engine.DrillPump, By: engine.ByCrew, Compartment: i, PumpM3h: capm})
		m.status = fmt.Sprintf("Pumping ordered on %s, %.0f m³/h.", name, capm)
	case pickStop:
		delete(m.ordered, i)
		m.decide(engine.DrillEvent{Kind: engine.DrillPump, By: engine.ByCrew, Compartment: i})
		m.status = "Pumping stopped on " + name + "."
	case pickCounter:
		h, err := vessels.CounterfloodInlet(v, i, vessels.CounterfloodAreaM2)
		if err != nil {
			m.status = err.Error()
			return
		}
		open := !m.inlets[i]
		m.inlets[i] = open
		if !open {
			delete(m.inlets, i)
		}
		m.decide(engine.DrillEvent{Kind: engine.DrillCounterflood, By: engine.ByCrew, Compartment: i, Hole: h, Open: open})
		if open {
			m.status = fmt.Sprintf("Sea inlet opened into %s (%.2f m²).", name, h.AreaM2)
		} else {
			m.status = "Sea inlet into " + name + " shut."
		}
	case pickBreach:
		m.pickComp = i
		m.ask("breach", "Breach in "+name+": area m² [height z m]: ")
	case pickFail:
		m.decide(engine.DrillEvent{Kind: engine.DrillPump, By: engine.ByInstructor, Compartment: i,
			Text: "Engine room: the pump on " + name + " has stopped."})
		m.status = "Pump failure injected on " + name + "."
	}
}

// decide applies a crew decision or an instructor's injection now.
func (m *drillModel) decide(e engine.DrillEvent) {
	if err := m.d.Apply(e); err != nil {
		m.status = err.Error()
		return
	}
	e.Minutes = m.d.Minutes()
	m.extra = append(m.extra, e)
	m.writeLog()
}

func (m *drillModel) answer(k tea.KeyMsg) (tea.Model, tea.Cmd) {
	switch k.String() {
	case "esc":
		m.asking = ""
		return m, nil
	case "enter":
		what, text := m.asking, strings.TrimSpace(m.input.Value())
		m.asking = ""
		m.answered(what, text)
		return m, nil
	}
	var cmd tea.Cmd
	m.input, cmd = m.input.Update(k)
	return m, cmd
}

func (m *drillModel) answered(what, text string) {
	switch what {
	case "note":
		if text != "" {
			m.decide(engine.DrillEvent{Kind: engine.DrillNote, By: engine.ByInstructor, Compartment: -1, Text: text})
		}
	case "breach":
		f := strings.Fields(strings.ReplaceAll(text, ",", "."))
		nums := []float64{math.NaN(), math.NaN()}
		for k := 0; k < len(f) && k < 2; k++ {
			x, err := strconv.ParseFloat(f[k], 64)
			if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
				m.status = fmt.Sprintf("%q is not a number: give the area in m², then the height if wanted", f[k])
				return
			}
			nums[k] = x
		}
		res, err := vessels.ResolveFlood(m.d.Vessel(), m.sc.Info, vessels.FloodAsk{Compartment: m.pickComp, AreaM2: nums[0], ZM: nums[1],
			Cd: math.NaN(), Pumps: []vessels.FloodPump{}, By: "instructor"})
		if err != nil {
			m.status = err.Error()
			return
		}
		m.decide(engine.DrillEvent{Kind: engine.DrillBreach, By: engine.ByInstructor, Compartment: m.pickComp, Hole: res.Case.Hole})
		m.status = "Breach injected in " + m.d.Vessel().Compartments[m.pickComp].Name + "."
	}
}

// diagnose runs the diagnosis on the crew's readings (never the truth):
// what the onboard computer would tell them from the marks and the
// inclinometer as read.
func (m *drillModel) diagnose() tea.Cmd {
	rs := m.crewReadings(10)
	v := m.d.Vessel()
	return func() tea.Msg {
		if len(rs) == 0 {
			return drillDiagnosisMsg{err: fmt.Errorf("no readings yet")}
		}
		dg, err := engine.Diagnose(v, rs, engine.DiagnoseOptions{Keep: 3})
		if err != nil {
			return drillDiagnosisMsg{err: err}
		}
		var lines []string
		for k, e := range dg.Explanations {
			lines = append(lines, fmt.Sprintf("  %d. %s (marks off by %s rms)", k+1, e.Names(v), report.Fixed(e.DraftRMSM*100, 1, "cm")))
		}
		if !dg.Fits {
			lines = append(lines, "  none explains the readings within their errors")
		}
		return drillDiagnosisMsg{minutes: rs[len(rs)-1].Minutes, lines: lines}
	}
}

// reportDrill is the drill as the report package writes it.
func (m *drillModel) reportDrill() report.Drill {
	return report.Drill{Scenario: m.sc.Name, File: m.sc.File, VesselRef: m.sc.VesselRef, ConditionRef: m.sc.ConditionRef, About: m.sc.About, Seed: m.sc.Seed,
		Alarms: m.sc.Alarms, Played: m.d, Version: m.opts.Version, AlarmLevel: vessels.AlarmLevelM,
		Events: m.sc.Setup(m.extra...).Events}
}

// writeLog writes the drill's log, when one was asked for.
func (m *drillModel) writeLog() {
	if m.opts.LogFile == "" {
		return
	}
	var b bytes.Buffer
	if err := report.DrillLog(&b, m.reportDrill()); err != nil {
		m.status = "log: " + err.Error()
		return
	}
	if err := os.WriteFile(m.opts.LogFile, b.Bytes(), 0o644); err != nil {
		m.status = "log: " + err.Error()
	}
}

// makeDebrief replays the drill from its log and writes the debrief.
func (m *drillModel) makeDebrief() tea.Cmd {
	setup := m.sc.Setup(m.extra...)
	dr := m.reportDrill()
	return func() tea.Msg {
		a, err := engine.AnalyseDrill(setup)
		if err != nil {
			return drillDebriefMsg{err: err}
		}
		dr.Played = a.Played
		var b bytes.Buffer
		err = report.DrillDebrief(&b, dr, a)
		return drillDebriefMsg{text: b.String(), err: err}
	}
}

func (m *drillModel) View() string {
	if m.w < 60 || m.h < 16 {
		return "The drill needs a screen of at least 60×16. q quits."
	}
	var body string
	switch m.mode {
	case drillInstructor:
		body = m.instructorView(m.w, m.h-2)
	case drillDebrief:
		body = m.debrief.View()
	default:
		body = m.crewView(m.w, m.h-2)
	}
	body = lipgloss.NewStyle().Height(m.h - 2).MaxHeight(m.h - 2).Render(body)
	return lipgloss.JoinVertical(lipgloss.Left, m.header(), body, m.footer())
}

func (m *drillModel) header() string {
	state := "running"
	switch {
	case m.d.Over() && m.d.Lost():
		state = "LOST"
	case m.d.Over():
		state = "ended"
	case m.paused:
		state = "paused"
	}
	view := map[drillMode]string{drillCrew: "CREW", drillInstructor: "INSTRUCTOR", drillDebrief: "DEBRIEF"}[m.mode]
	s := fmt.Sprintf("DRILL %s · %s · %s / %s · ×%g · %s", view, clipText(m.sc.Name, 30), clock(m.d.Minutes()), clock(m.d.EndMinutes()), m.speed, state)
	return lipgloss.NewStyle().Bold(true).Reverse(true).Width(m.w).MaxWidth(m.w).Render(s)
}

func (m *drillModel) footer() string {
	var s string
	switch {
	case m.asking != "":
		s = m.input.View()
	case m.pick == pickDoor:
		s = "↑/↓ choose · enter check and shut · o open · esc cancel"
	case m.pick != pickNone:
		s = "↑/↓ choose · enter take · esc cancel"
	case m.mode == drillDebrief:
		s = "↑/↓ pgup/pgdn scroll · q quit"
	case m.mode == drillInstructor:
		s = "b breach · f pump fails · o door open/shut · n note · D debrief · i crew · space pause · +/- · q quit"
	default:
		s = "m mark · p pump · s stop pump · d doors · c counter-flood · g diagnose · space pause · +/- speed · i instructor · q quit"
		if m.w < 120 {
			s = "m mark·p pump·s stop·d doors·c cntr-flood·g diag·spc pause·+/-·i instr·q quit"
		}
	}
	if m.status != "" && m.asking == "" && m.pick == pickNone {
		s = m.status + " · " + s
	}
	return lipgloss.NewStyle().Width(m.w).MaxWidth(m.w).Render(clipText(s, m.w))
}

// clock writes scenario minutes as mm:ss.
func clock(min float64) string {
	s := int(math.Round(min * 60))
	return fmt.Sprintf("%02d:%02d", s/60, s%60)
}

func clipText(s string, n int) string {
	r := []rune(s)
	if len(r) <= n || n < 2 {
		return s
	}
	return string(r[:n-1]) + "…"
}
