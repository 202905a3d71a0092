package tui

import (
	"errors"
	"fmt"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"time"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/report/plaintext"
	"heelwatch/vessels"
)

// conditionPanel is the loading condition on the dashboard: every tank
// with its fill and every weight, which the officer changes (a tank's
// fill, a weight added, moved or removed, the best righting option taken
// in), and saves: the condition alone, or the whole state (condition,
// damage, connections, readings) to take up again with --resume. A change
// comes back to the root as a conditionMsg; the root loads the ship with
// it (takeCondition) and works out the intact reference and the state
// shown again.
type conditionPanel struct {
	show   bool
	base   *engine.Vessel     // the ship as her vessel file gives her (Apply's ship); nil: no panel
	cond   *vessels.Condition // the condition now (the panel's own copy)
	taken  *vessels.Condition // the condition the ship is loaded with: what undo goes back to
	named  string             // the condition's name before any change (condition_name.go)
	source string             // where the ship came from, for a state file ("freighter" or a path)
	dir    string             // where files are saved by default
	sel    int                // the row chosen: tanks first, then weights
	typing conditionInput     // what the field is being typed for
	field  textinput.Model    // the value typed
	note   string             // the last thing done or refused, one line
	gen    int                // the condition's number, newest last (baselines of older ones are dropped)
}

type conditionInput int

const (
	condNone   conditionInput = iota
	condTank                  // a tank's contents: "55" (% of capacity), "120t", "80m3", "1.2m" (sounding)
	condWeight                // the chosen weight: "mass lcg tcg vcg"
	condNew                   // a new weight: "name; mass; lcg; tcg; vcg"
	condSave                  // the condition's file name
	condState                 // the state file's name
)

// The panel's keys: conditionKey opens and closes it; the rest answer
// while it is shown.
var (
	conditionKey   = key.NewBinding(key.WithKeys("L"), key.WithHelp("L", "loading condition"))
	condEditKey    = key.NewBinding(key.WithKeys("e", "enter"), key.WithHelp("e", "type value"))
	condNewKey     = key.NewBinding(key.WithKeys("n"), key.WithHelp("n", "new weight"))
	condRemoveKey  = key.NewBinding(key.WithKeys("x"), key.WithHelp("x", "remove weight"))
	condMoreKey    = key.NewBinding(key.WithKeys("+", "="), key.WithHelp("+/−", "fill ±5 %"))
	condLessKey    = key.NewBinding(key.WithKeys("-", "_"))
	condAftKey     = key.NewBinding(key.WithKeys("left"), key.WithHelp("←→", "weight 1 m aft/fwd"))
	condFwdKey     = key.NewBinding(key.WithKeys("right"))
	condRemedyKey  = key.NewBinding(key.WithKeys("A"), key.WithHelp("A", "best righting option in"))
	condSaveKey    = key.NewBinding(key.WithKeys("W"), key.WithHelp("W", "save condition"))
	condSaveAllKey = key.NewBinding(key.WithKeys("S"), key.WithHelp("S", "save all"))
	condUpKey      = key.NewBinding(key.WithKeys("up", "k"))
	condDownKey    = key.NewBinding(key.WithKeys("down", "j"))
	condFirstKey   = key.NewBinding(key.WithKeys("home"))
	condLastKey    = key.NewBinding(key.WithKeys("end"))
)

// Messages.
type (
	// conditionBaseMsg carries the intact assessment of condition gen.
	conditionBaseMsg struct {
		gen int
		a   engine.Assessment
	}
	// condSavedMsg says how a save went.
	condSavedMsg struct {
		path, what string
		err        error
	}
)

// newConditionPanel makes the panel for the ship v as shown (loaded with
// opts.Condition, if any, over opts.Base).
func newConditionPanel(v *engine.Vessel, opts Options, name string) conditionPanel {
	p := conditionPanel{base: opts.Base, dir: opts.ReportDir, field: newTextField()}
	if p.base == nil {
		p.base = v
	}
	p.source = strings.TrimPrefix(opts.VesselFile, "bundled:")
	if !strings.HasPrefix(opts.VesselFile, "bundled:") && p.source != "" {
		if abs, err := filepath.Abs(p.source); err == nil {
			p.source = abs
		}
	}
	if opts.Condition != nil {
		c := *opts.Condition
		c.Weights = append([]engine.Weight(nil), c.Weights...)
		c.Tanks = append([]vessels.TankFill(nil), c.Tanks...)
		// Soundings were read already: the panel works in fills.
		for i, t := range c.Tanks {
			if l := v.Compartments[t.Compartment].Liquid; l != nil {
				c.Tanks[i].Liquid.Fill = l.Fill
			}
			c.Tanks[i].SoundingM = -1
		}
		c.Sounded = false
		p.cond = &c
	} else {
		p.cond = vessels.ConditionOf(p.base, name)
	}
	p.taken = p.cond
	p.named = unchangedName(p.cond.Name)
	p.field.Prompt = ""
	p.field.CharLimit = 120
	return p
}

// condRow is one row of the panel: a tank (compartment index) or a weight.
type condRow struct {
	tank   int // compartment index, −1 for a weight
	weight int // index in cond.Weights, −1 for a tank
}

func (p conditionPanel) rows() []condRow {
	var out []condRow
	for i, c := range p.base.Compartments {
		if c.Use == "tank" {
			out = append(out, condRow{tank: i, weight: -1})
		}
	}
	for i := range p.cond.Weights {
		out = append(out, condRow{tank: -1, weight: i})
	}
	return out
}

// tankFill returns the entry of compartment i in the condition, −1 if none.
func (p conditionPanel) tankFill(i int) int {
	for k, t := range p.cond.Tanks {
		if t.Compartment == i {
			return k
		}
	}
	return -1
}

// setFill sets tank i to fill f (0 to 1), copying the condition first.
func (p *conditionPanel) setFill(i int, f float64, v *engine.Vessel) {
	c := *p.cond
	c.Tanks = append([]vessels.TankFill(nil), c.Tanks...)
	k := p.tankFill(i)
	if k < 0 {
		l := engine.Liquid{Name: "sea water ballast", Density: v.WaterDensity}
		if bl := p.base.Compartments[i].Liquid; bl != nil {
			l = *bl
		}
		c.Tanks = append(c.Tanks, vessels.TankFill{Compartment: i, Liquid: l, SoundingM: -1})
		k = len(c.Tanks) - 1
	}
	c.Tanks[k].Liquid.Fill = math.Min(1, math.Max(0, f))
	p.cond = &c
}

// setWeights replaces the weights, copying the condition first.
func (p *conditionPanel) setWeights(ws []engine.Weight) {
	c := *p.cond
	c.Weights = ws
	p.cond = &c
}

// conditionMsg gives the panel the first look at every message: its own
// messages, its key, and while it is shown its keys. ok is false when the
// message is not the panel's.
func (m model) conditionMsg(msg tea.Msg) (tea.Model, tea.Cmd, bool) {
	if m.cond.base == nil {
		return m, nil, false
	}
	switch msg := msg.(type) {
	case conditionBaseMsg:
		if msg.gen == m.cond.gen {
			a := msg.a
			m.base = &a
		}
		return m, nil, true
	case condSavedMsg:
		line := msg.what + " saved to " + msg.path
		if msg.err != nil {
			line = msg.what + " not saved: " + msg.err.Error()
		}
		m.cond.note = line
		return m, m.addLog(m.now(), line), true
	case tea.KeyMsg:
		if m.lay.small || m.mode != modeBrowse {
			return m, nil, false
		}
		msg = plainKey(msg)
		if m.cond.typing != condNone {
			return m.conditionTyped(msg)
		}
		if key.Matches(msg, conditionKey) {
			m.cond.show = !m.cond.show
			if m.cond.show {
				m.rd.show, m.girder.show, m.doors.show, m.rem.show, m.flood.show = false, false, false, false, false
			}
			return m, nil, true
		}
		if !m.cond.show {
			return m, nil, false
		}
		return m.conditionKey(msg)
	}
	return m, nil, false
}

// conditionKey answers the panel's keys while it is shown.
func (m model) conditionKey(msg tea.KeyMsg) (tea.Model, tea.Cmd, bool) {
	p := &m.cond
	rows := p.rows()
	p.sel = min(max(p.sel, 0), max(len(rows)-1, 0))
	var row condRow
	if len(rows) > 0 {
		row = rows[p.sel]
	} else {
		row = condRow{tank: -1, weight: -1}
	}
	switch {
	case key.Matches(msg, condUpKey):
		p.sel = max(0, p.sel-1)
	case key.Matches(msg, condDownKey):
		p.sel = min(len(rows)-1, p.sel+1)
	case key.Matches(msg, condFirstKey):
		p.sel = 0
	case key.Matches(msg, condLastKey):
		p.sel = max(len(rows)-1, 0)
	case key.Matches(msg, condMoreKey), key.Matches(msg, condLessKey):
		if row.tank < 0 {
			return m, nil, true
		}
		if why := m.seaRefusal(row.tank); why != "" {
			p.note = why
			return m, nil, true
		}
		step := 0.05
		if key.Matches(msg, condLessKey) {
			step = -0.05
		}
		old := m.v.Compartments[row.tank]
		f := 0.0
		if old.Liquid != nil {
			f = old.Liquid.Fill
		}
		nf := math.Min(1, math.Max(0, math.Round((f+step)*20)/20))
		if nf == f {
			return m, nil, true
		}
		p.setFill(row.tank, nf, m.v)
		mm, cmd := m.takeCondition(fmt.Sprintf("%s filled to %.0f %% (was %.0f %%)", old.Name, nf*100, f*100))
		return mm, cmd, true
	case key.Matches(msg, condAftKey), key.Matches(msg, condFwdKey):
		if row.weight < 0 {
			p.note = "←→ move a weight; a tank's contents change with + and −, or e to type them"
			return m, nil, true
		}
		dx := 1.0
		if key.Matches(msg, condAftKey) {
			dx = -1
		}
		ws := append([]engine.Weight(nil), p.cond.Weights...)
		w := &ws[row.weight]
		lo, hi := m.v.Hull.Stations()[0].X, m.v.Hull.Stations()[len(m.v.Hull.Stations())-1].X
		if w.HasExtent() && (w.ExtentM[0]+dx < lo || w.ExtentM[1]+dx > hi) || !w.HasExtent() && (w.LCGM+dx < lo || w.LCGM+dx > hi) {
			p.note = w.Name + " goes no further: the hull ends there"
			return m, nil, true
		}
		w.LCGM += dx
		if w.HasExtent() {
			w.ExtentM[0] += dx
			w.ExtentM[1] += dx
		}
		p.setWeights(ws)
		mm, cmd := m.takeCondition(fmt.Sprintf("%s moved to lcg %.1f m", w.Name, w.LCGM))
		return mm, cmd, true
	case key.Matches(msg, condRemoveKey):
		if row.weight < 0 {
			return m, nil, true
		}
		if len(p.cond.Weights) == 1 {
			p.note = "the last weight stays: a ship has her lightship at least"
			return m, nil, true
		}
		name := p.cond.Weights[row.weight].Name
		ws := append(append([]engine.Weight(nil), p.cond.Weights[:row.weight]...), p.cond.Weights[row.weight+1:]...)
		p.setWeights(ws)
		mm, cmd := m.takeCondition(name + " removed")
		return mm, cmd, true
	case key.Matches(msg, condEditKey):
		switch {
		case row.tank >= 0:
			if why := m.seaRefusal(row.tank); why != "" {
				p.note = why
				return m, nil, true
			}
			f := 0.0
			if l := m.v.Compartments[row.tank].Liquid; l != nil {
				f = l.Fill
			}
			return m.startTyping(condTank, strconv.FormatFloat(math.Round(f*1000)/10, 'f', -1, 64))
		case row.weight >= 0:
			w := p.cond.Weights[row.weight]
			return m.startTyping(condWeight, fmt.Sprintf("%g %g %g %g", w.MassT, w.LCGM, w.TCGM, w.VCGM))
		}
	case key.Matches(msg, condNewKey):
		return m.startTyping(condNew, "")
	case key.Matches(msg, condSaveKey):
		return m.startTyping(condSave, m.cond.defaultPath("condition", m.now()))
	case key.Matches(msg, condSaveAllKey):
		return m.startTyping(condState, m.cond.defaultPath("state", m.now()))
	case key.Matches(msg, condRemedyKey):
		return m.takeRemedy()
	case key.Matches(msg, m.keys.Girder), key.Matches(msg, m.keys.RunPanel), key.Matches(msg, m.keys.Remedies),
		key.Matches(msg, m.keys.Readings), key.Matches(msg, doorsKey):
		// Another panel takes the place: this one gives way, and the root
		// answers the key (through update, so that the readings panel,
		// which takes its key before the root's keys, opens at once).
		p.show = false
		mm, cmd := m.update(msg)
		return mm, cmd, true
	default:
		return m, nil, false
	}
	return m, nil, true
}

// seaRefusal says why tank i's fill cannot be changed now ("" if it can):
// while it is open to the sea or holds floodwater its contents are the
// sea's, and a fill typed would change nothing of how she floats.
func (m model) seaRefusal(i int) string {
	name := m.v.Compartments[i].Name
	switch why := seaHolds(m.damage, i); {
	case why == "":
		return ""
	case m.damage[i].Open:
		return name + " is open to the sea: its contents are the sea's while it is open, so its fill is not changed (close the compartment first: space in the list)"
	}
	return name + " holds floodwater: its contents are the sea's while it is flooded, so its fill is not changed"
}

// defaultPath is the file a save offers: kind and the time to the
// second, in the report directory; never the name of a file already
// there (a second save in the same second gets "-2", and so on), so that
// taking the offer never writes over an earlier save.
func (p conditionPanel) defaultPath(kind string, now time.Time) string {
	base := filepath.Join(p.dir, kind+"-"+now.UTC().Format("20060102-150405"))
	path := base + ".toml"
	for k := 2; k < 1000; k++ {
		if _, err := os.Lstat(path); errors.Is(err, fs.ErrNotExist) {
			break
		}
		path = fmt.Sprintf("%s-%d.toml", base, k)
	}
	return path
}

func (m model) startTyping(what conditionInput, value string) (tea.Model, tea.Cmd, bool) {
	m.cond.typing = what
	m.cond.note = ""
	m.cond.field.Placeholder = ""
	if what == condTank {
		// A tank's contents are typed afresh (a figure typed after the
		// old one would run into it: 70 then 55 read 7055); the fill now
		// shows in the empty field.
		m.cond.field.Placeholder, value = value+" % now", ""
	}
	m.cond.field.SetValue(value)
	m.cond.field.CursorEnd()
	m.cond.field.PromptStyle, m.cond.field.TextStyle = m.st.Prompt, m.st.Value
	cmd := m.cond.field.Focus()
	if !m.animate {
		m.cond.field.Cursor.SetMode(cursor.CursorStatic)
		cmd = nil
	}
	return m, cmd, true
}

// conditionTyped answers keys while a value is typed: Enter takes it, Esc
// drops it.
func (m model) conditionTyped(msg tea.KeyMsg) (tea.Model, tea.Cmd, bool) {
	p := &m.cond
	switch msg.Type {
	case tea.KeyCtrlC:
		return m, tea.Quit, true
	case tea.KeyEsc:
		p.typing = condNone
		p.field.Blur()
		return m, nil, true
	case tea.KeyEnter:
		mm, cmd, err := m.takeTyped(strings.TrimSpace(p.field.Value()))
		if err != "" {
			m.cond.note = err
			return m, nil, true
		}
		mm.cond.typing = condNone
		mm.cond.field.Blur()
		return mm, cmd, true
	}
	var cmd tea.Cmd
	p.field, cmd = p.field.Update(msg)
	return m, cmd, true
}

// takeTyped takes the typed value s; err says why it is refused.
func (m model) takeTyped(s string) (model, tea.Cmd, string) {
	p := &m.cond
	rows := p.rows()
	switch p.typing {
	case condTank:
		i := rows[p.sel].tank
		c := m.v.Compartments[i]
		f, err := parseTankAmount(s, c, p.base.Compartments[i], m.v.WaterDensity)
		what := fmt.Sprintf("%s filled to %.1f %% of capacity", c.Name, f*100)
		if err == "sounding" {
			f, what, err = m.sounded(i, s)
		}
		if err != "" {
			return m, nil, err
		}
		p.setFill(i, f, m.v)
		mm, cmd := m.takeCondition(what)
		return mm.(model), cmd, ""
	case condWeight, condNew:
		w, err := parseWeight(s, p.typing == condNew, m.v.Hull)
		if err != "" {
			return m, nil, err
		}
		ws := append([]engine.Weight(nil), p.cond.Weights...)
		what := ""
		if p.typing == condNew {
			for _, o := range ws {
				if strings.EqualFold(o.Name, w.Name) {
					return m, nil, fmt.Sprintf("%q is already a weight's name: give another", w.Name)
				}
			}
			ws = append(ws, w)
			what = fmt.Sprintf("%s added: %.1f t at lcg %.1f, tcg %.1f, vcg %.1f m", w.Name, w.MassT, w.LCGM, w.TCGM, w.VCGM)
			p.sel = len(rows) // the new row
		} else {
			k := rows[p.sel].weight
			w.Name, w.FSMTm = ws[k].Name, ws[k].FSMTm
			if ws[k].HasExtent() {
				half := (ws[k].ExtentM[1] - ws[k].ExtentM[0]) / 2
				w.ExtentM = [2]float64{w.LCGM - half, w.LCGM + half}
			}
			ws[k] = w
			what = fmt.Sprintf("%s set to %.1f t at lcg %.1f, tcg %.1f, vcg %.1f m", w.Name, w.MassT, w.LCGM, w.TCGM, w.VCGM)
		}
		p.setWeights(ws)
		mm, cmd := m.takeCondition(what)
		return mm.(model), cmd, ""
	case condSave, condState:
		if s == "" {
			return m, nil, "give a file name"
		}
		return m, m.saveCmd(s, p.typing == condState), ""
	}
	return m, nil, ""
}

// parseTankAmount reads a tank's contents as typed: "55" or "55 %" (per
// cent of capacity), "120t" (tonnes), "80m3" (m³). c is the tank as
// loaded now (its liquid), b as the vessel file gives it.
func parseTankAmount(s string, c, b *engine.Compartment, rho float64) (float64, string) {
	dens := rho
	if c.Liquid != nil {
		dens = c.Liquid.Density
	} else if b.Liquid != nil {
		dens = b.Liquid.Density
	}
	t := strings.ToLower(strings.ReplaceAll(s, " ", ""))
	unit := "%"
	for _, u := range []string{"m3", "m³", "t", "%", "m"} {
		if strings.HasSuffix(t, u) {
			unit, t = u, strings.TrimSuffix(t, u)
			break
		}
	}
	if strings.Count(t, ",") == 1 && !strings.Contains(t, ".") {
		t = strings.Replace(t, ",", ".", 1) // a decimal comma, as in "55,5"
	}
	x, err := strconv.ParseFloat(t, 64)
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) || x < 0 {
		return 0, fmt.Sprintf("%q: give per cent of capacity (55), tonnes (120t), m³ (80m3) or a sounding (1.2m), 0 or more", s)
	}
	if unit == "m" {
		return 0, "sounding"
	}
	capM3 := c.CapacityM3()
	var f float64
	switch unit {
	case "%":
		f = x / 100
	case "t":
		f = x / dens / capM3
	default:
		f = x / capM3
	}
	if f > 1+1e-9 {
		return 0, fmt.Sprintf("%s is more than %s holds (%.1f m³, %.1f t)", s, c.Name, capM3, capM3*dens)
	}
	return math.Min(f, 1), ""
}

// sounded reads a sounding typed for tank i ("1.2m") at the tank's pipe
// (the vessel file's sounding_pipe, else at the tank's lowest point:
// engine.Compartment.SoundingPipe) as a condition file's sounding is
// read: the panel's condition is given the sounding and
// vessels.Condition.Apply reads it where she lies intact with it, again
// and again until the heel and trim it gives read the same fill (its
// fixed point). The fill found is what the panel keeps: the sounding is one
// reading, not worked again when later changes move her.
func (m model) sounded(i int, s string) (float64, string, string) {
	c := m.v.Compartments[i]
	x, err := strconv.ParseFloat(strings.TrimSuffix(strings.ToLower(strings.ReplaceAll(s, " ", "")), "m"), 64)
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) || x < 0 {
		return 0, "", fmt.Sprintf("%q: give the sounding in metres, e.g. 1.2m", s)
	}
	pipe := c.DefaultSoundingPipe()
	if m.info != nil && i < len(m.info.Compartments) && m.info.Compartments[i].SoundingPipe != nil {
		pipe = *m.info.Compartments[i].SoundingPipe
	}
	p := m.cond
	p.setFill(i, 0, m.v)
	k := p.tankFill(i)
	p.cond.Tanks[k].SoundingM, p.cond.Tanks[k].Pipe = x, pipe
	nv, aerr := p.cond.Apply(p.base)
	if aerr != nil {
		return 0, "", aerr.Error()
	}
	f := nv.Compartments[i].Liquid.Fill
	what := fmt.Sprintf("%s sounded %.2f m, read where she lies intact with it: %.1f %% of capacity (%.1f m³)",
		c.Name, x, f*100, f*c.CapacityM3())
	if pos, serr := engine.Solve(nv, nv.Intact()); serr == nil {
		what = fmt.Sprintf("%s sounded %.2f m at heel %s, trim %s (where she lies intact with it): %.1f %% of capacity (%.1f m³)",
			c.Name, x, heelShort(pos.HeelDeg), trimText(pos.TrimM), f*100, f*c.CapacityM3())
	}
	return f, what, ""
}

// parseWeight reads "mass lcg tcg vcg" (or, new, "name; mass; lcg; tcg;
// vcg"), numbers in t and m.
func parseWeight(s string, withName bool, h *engine.Hull) (engine.Weight, string) {
	var w engine.Weight
	fields := strings.Fields(strings.ReplaceAll(s, ",", " "))
	if withName {
		parts := strings.Split(s, ";")
		if len(parts) != 5 {
			return w, "write name; mass t; lcg m; tcg m (+ starboard); vcg m"
		}
		w.Name = strings.TrimSpace(parts[0])
		if w.Name == "" || w.Name != plaintext.Name(w.Name) {
			return w, "give the weight a name of plain characters"
		}
		fields = nil
		for _, f := range parts[1:] {
			fields = append(fields, strings.TrimSpace(f))
		}
	}
	if len(fields) != 4 {
		return w, "write four numbers: mass t, lcg m, tcg m (+ starboard), vcg m (decimals with a point: commas and spaces part the numbers)"
	}
	var v [4]float64
	for i, f := range fields {
		x, err := strconv.ParseFloat(f, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return w, fmt.Sprintf("%q is not a number", f)
		}
		v[i] = x
	}
	w.MassT, w.LCGM, w.TCGM, w.VCGM = v[0], v[1], v[2], v[3]
	st := h.Stations()
	switch {
	case !(w.MassT > 0) || w.MassT > 1e6:
		return w, "the mass must be above 0 t"
	case w.LCGM < st[0].X || w.LCGM > st[len(st)-1].X:
		return w, fmt.Sprintf("lcg %g m is off the ship (%g to %g m)", w.LCGM, st[0].X, st[len(st)-1].X)
	case math.Abs(w.TCGM) > h.BreadthM/2:
		return w, fmt.Sprintf("tcg %g m is beyond her side (±%g m)", w.TCGM, h.BreadthM/2)
	case w.VCGM < 0 || w.VCGM > 3*h.DepthM:
		return w, fmt.Sprintf("vcg %g m is not on board (0 to %g m)", w.VCGM, 3*h.DepthM)
	}
	return w, ""
}

// takeRemedy puts the best advisable righting option worked out for the
// state shown into the condition: its tanks at their fills after it.
// Only an option the engine calls advisable (safe at every step) is taken.
func (m model) takeRemedy() (tea.Model, tea.Cmd, bool) {
	set := m.rem.set
	if set == nil || !m.rem.current(m.damage) {
		m.cond.note = "work out the righting options first (o), then take one in with A"
		return m, nil, true
	}
	for _, r := range set.Options {
		if !r.Advisable {
			continue
		}
		for k, i := range r.Tanks {
			m.cond.setFill(i, r.FillAfter[k], m.v)
		}
		m.rem.set = nil
		mm, cmd := m.takeCondition("righting option taken: " + r.Action)
		return mm, cmd, true
	}
	m.cond.note = "no righting option is advisable in this state: none taken"
	return m, nil, true
}

// takeCondition loads the ship with the panel's condition (keeping the
// connections as they are), and works out the intact reference and the
// damage state shown for her again. A flooding run going on is stopped
// (it was of the old condition); the righting options are dropped. The
// change is undone with the undo key, which puts back the condition taken
// before it. A condition the ship cannot take is not taken: the panel goes
// back to the one she is loaded with and says why.
func (m model) takeCondition(what string) (tea.Model, tea.Cmd) {
	before := m.cond.taken
	c := *m.cond.cond
	c.Name = changedName(m.cond.named, m.now())
	m.cond.cond = &c
	m, stop, err := m.loadCondition(m.cond.cond, what)
	if err != nil {
		m.cond.cond = m.cond.taken
		m.cond.note = "not taken: " + err.Error()
		return m, nil
	}
	m.pushUndo(undoEntry{damage: m.damage, what: "condition: " + what, cond: before})
	mm, cmd := m.commit(cloneDamage(m.damage), "condition: "+what)
	return mm, tea.Batch(stop, cmd, m.conditionBase())
}

// undoCondition puts back the condition c (taken before the change u
// undoes) and u's damage state.
func (m model) undoCondition(u undoEntry) (tea.Model, tea.Cmd) {
	m, stop, err := m.loadCondition(u.cond, "undone: "+u.what)
	if err != nil { // the condition was taken once: cannot happen, but say so
		m.cond.note = "not undone: " + err.Error()
		return m, nil
	}
	mm, cmd := m.commit(cloneDamage(u.damage), "undone: "+u.what)
	return mm, tea.Batch(stop, cmd, m.conditionBase())
}

// loadCondition makes c the condition the ship is loaded with (keeping
// the connections as they are): the panel's condition and the one taken.
// A flooding run going on is stopped (stop, it was of the old condition);
// the righting options and the intact reference are dropped.
func (m model) loadCondition(c *vessels.Condition, what string) (model, tea.Cmd, error) {
	nv, err := c.Apply(m.cond.base)
	if err != nil {
		return m, nil, err
	}
	nv = plainNames(nv)
	for i, cn := range m.v.Connections {
		if i < len(nv.Connections) && nv.Connections[i].Open != cn.Open {
			nv = nv.WithConnection(i, cn.Open)
		}
	}
	var stop tea.Cmd
	m.flood, stop = m.flood.with(m).stop(&m) // a run going on is of the old condition
	m.v = nv
	m.cond.cond, m.cond.taken = c, c
	m.condition = c.Name
	m.cond.note = what
	m.cond.gen++
	m.rem.set = nil // worked out for the old condition
	m.base = nil
	return m, stop, nil
}

// conditionBase returns the Cmd that works out the intact reference of
// the condition now taken.
func (m model) conditionBase() tea.Cmd {
	gen, v := m.cond.gen, m.v
	return func() tea.Msg { return conditionBaseMsg{gen: gen, a: engine.Assess(v, v.Intact())} }
}

// withCondition gives the dashboard its condition panel and, taking up a
// saved state, its readings (the state's damage comes as opts.Start).
func (m model) withCondition(opts Options) model {
	m.cond = newConditionPanel(m.v, opts, m.condition)
	if s := opts.Resume; s != nil {
		m.rd.readings = append([]engine.Reading(nil), s.Readings...)
		if n := len(s.Readings); n > 0 {
			m.rd.firstAt = m.now().Add(-time.Duration(s.Readings[n-1].Minutes * float64(time.Minute)))
		}
	}
	return m
}

// saveCmd writes the condition (or, all, the whole state) to path in a Cmd.
func (m model) saveCmd(path string, all bool) tea.Cmd {
	c, v := m.cond.cond, m.v
	what := "condition"
	var data []byte
	var err error
	if all {
		what = "state"
		s := &vessels.State{Vessel: m.cond.source, Condition: c, Damage: cloneDamage(m.damage),
			Readings: append([]engine.Reading(nil), m.rd.readings...)}
		for _, cn := range v.Connections {
			s.ConnectionsOpen = append(s.ConnectionsOpen, cn.Open)
		}
		data, err = vessels.EncodeState(s, v)
	} else {
		data, err = vessels.EncodeCondition(c, v)
	}
	return func() tea.Msg {
		if err == nil {
			err = saveError(path, vessels.WriteFileSafely(path, data))
		}
		return condSavedMsg{path: path, what: what, err: err}
	}
}

// view draws the panel in w × h for the ship v under damage d. A tank
// open to the sea (or holding floodwater) is marked so, without a fill:
// its contents are the sea's and no part of the ship's weight, so the
// totals, like the floating position's ship weight, leave it out.
func (p conditionPanel) view(v *engine.Vessel, d engine.Damage, st *Styles, w, h int) []string {
	title := "LOADING CONDITION"
	if mark := changeOnly(p.cond.Name); mark != "" {
		// The mark of a change first, where a cut name cannot take it.
		title += " " + mark
		if n := unchangedName(p.cond.Name); n != "" {
			title += ": " + n
		}
	} else if p.cond.Name != "" {
		title += ": " + p.cond.Name
	}
	lines := []string{st.Heading.Render(titleFit(w, title, "L closes"))}
	// The names as long as they are where the line has room, then cut
	// keeping a side letter (clipName); a tank row's liquid and a weight
	// row's numbers take the rest. Where the liquid's name would be cut,
	// its column gives way and the chosen tank's contents are said whole
	// under the table.
	rows := p.rows()
	longest, longestW, longestLiquid := 0, 0, len("empty") // tanks', weights', liquids' names
	for _, r := range rows {
		if r.tank >= 0 {
			longest = max(longest, len([]rune(v.Compartments[r.tank].Name)))
			if l := v.Compartments[r.tank].Liquid; l != nil {
				longestLiquid = max(longestLiquid, len([]rune(l.Name)))
			}
		} else {
			longestW = max(longestW, len([]rune(p.cond.Weights[r.weight].Name)))
		}
	}
	const tankFigs, weightWords, weightCols = 18, 38, 27 // the figures after a name
	withLiquid := w-2-tankFigs-2-longestLiquid >= min(longest, 14)
	nameW := max(8, min(longest, w-2-tankFigs))
	if withLiquid {
		nameW = max(8, min(longest, w-2-tankFigs-2-longestLiquid))
	}
	// A weight's figures in full words when they fit, else in columns
	// under a heading that names them.
	wNameW := max(8, min(longestW, w-2-weightWords))
	longWeights := w-2 >= wNameW+weightWords
	if !longWeights {
		wNameW = max(6, min(longestW, w-2-weightCols))
	}
	load := v.Loading(d)
	var fsm float64
	var body []string
	sel := 0
	chosen := "" // the chosen tank's contents when the liquid's column gave way, or the chosen weight's name when cut
	for k, r := range rows {
		var line string
		if r.tank >= 0 {
			c := v.Compartments[r.tank]
			mass, _, _, _, f := v.TankContents(r.tank)
			if why := seaHolds(d, r.tank); why != "" {
				line = fmt.Sprintf("%-*s %s", nameW, clipName(c.Name, nameW), why)
				body = p.rowOf(body, st, k, r, line, w, nameW, wNameW, longWeights, withLiquid, &sel)
				continue
			}
			fsm += f
			fill := 0.0
			liquid := "empty"
			if c.Liquid != nil {
				fill, liquid = c.Liquid.Fill, c.Liquid.Name
			}
			line = fmt.Sprintf("%-*s %5.1f %% %7.1f t", nameW, clipName(c.Name, nameW), fill*100, mass)
			if withLiquid {
				line += "  " + liquid
			} else if k == p.sel {
				chosen = fmt.Sprintf("  = %s, %.1f m³ full", liquid, c.CapacityM3())
			}
		} else {
			wt := p.cond.Weights[r.weight]
			if longWeights {
				line = fmt.Sprintf("%-*s %7.1f t lcg %5.1f tcg %4.1f vcg %4.1f", wNameW, clipName(wt.Name, wNameW), wt.MassT, wt.LCGM, wt.TCGM, wt.VCGM)
			} else {
				line = fmt.Sprintf("%-*s %7.1f %5.1f %5.1f %5.1f", wNameW, clipName(wt.Name, wNameW), wt.MassT, wt.LCGM, wt.TCGM, wt.VCGM)
				if k == p.sel && len([]rune(wt.Name)) > wNameW {
					chosen = "  = " + wt.Name // cut in its row: whole under the table
				}
			}
		}
		body = p.rowOf(body, st, k, r, line, w, nameW, wNameW, longWeights, withLiquid, &sel)
	}
	var foot []string
	for _, l := range wrap(chosen, w) {
		foot = append(foot, st.Text.Render(l))
	}
	foot = append(foot, st.Dim.Render(fitLine(fmt.Sprintf("Δ %.1f t · tanks' FSM %.0f t·m", load.MassT, fsm), w)))
	switch {
	case p.typing != condNone:
		for _, l := range wrap(p.prompt(), w) {
			foot = append(foot, st.Prompt.Render(l))
		}
		foot = append(foot, "> "+p.field.View())
		// A value refused: why, at once under the field, which stays open
		// for the correction.
		for _, l := range wrap(p.note, w) {
			foot = append(foot, st.Error.Render(l))
		}
	default:
		if p.note != "" {
			for _, l := range wrap(p.note, w) {
				foot = append(foot, l)
			}
		}
		for _, l := range wrap("+/− fill 5 % · e type · n new weight · x remove · ←→ move 1 m · A righting option in · W save condition · S save all", w) {
			foot = append(foot, st.Dim.Render(l))
		}
	}
	room := max(h-len(lines)-len(foot), 0)
	start := 0
	if sel >= room {
		start = sel - room + 1
	}
	end := min(len(body), start+room)
	lines = append(lines, body[start:end]...)
	lines = append(lines, fit(nil, w, room-(end-start))...)
	return fit(append(lines, foot...), w, h)
}

// rowOf appends row k (r, drawn as line) to body, under its heading if it
// is the first of its kind; sel is set to its place if it is chosen.
func (p conditionPanel) rowOf(body []string, st *Styles, k int, r condRow, line string, w, nameW, wNameW int, longWeights, withLiquid bool, sel *int) []string {
	if k == 0 && r.tank >= 0 {
		head := fmt.Sprintf("%-*s %7s %9s", nameW+2, "TANKS", "fill", "mass")
		if withLiquid {
			head += "  contents (fill: of capacity)"
		}
		body = append(body, st.Dim.Render(fitLine(head, w)))
	}
	if r.weight == 0 && longWeights {
		body = append(body, st.Dim.Render("WEIGHTS"))
	} else if r.weight == 0 {
		body = append(body, st.Dim.Render(fitLine(fmt.Sprintf("%-*s %7s %5s %5s %5s", wNameW+2, "WEIGHTS", "t", "lcg m", "tcg m", "vcg m"), w)))
	}
	line = fitLine(line, w-2)
	if k == p.sel {
		*sel = len(body)
		line = st.Selected.Render("▸ " + line)
	} else {
		line = "  " + line
	}
	return append(body, line)
}

// seaHolds says why tank i's contents are not the ship's under d (open to
// the sea, or holding floodwater), "" if they are.
func seaHolds(d engine.Damage, i int) string {
	if i >= len(d) {
		return ""
	}
	switch {
	case d[i].Open:
		return "open to the sea: holds sea water, not the ship's"
	case d[i].WaterM3 > 0:
		return fmt.Sprintf("flooded: %.0f m³ of floodwater", d[i].WaterM3)
	}
	return ""
}

// prompt says what is being typed.
func (p conditionPanel) prompt() string {
	switch p.typing {
	case condTank:
		return "contents: per cent of capacity (55), tonnes (120t), m³ (80m3) or sounding (1.2m, read where she lies with it); Enter takes, Esc drops"
	case condWeight:
		return "mass t, lcg m, tcg m (+ starboard), vcg m; Enter takes, Esc drops"
	case condNew:
		return "new weight: name; mass t; lcg m; tcg m; vcg m"
	case condSave:
		return "save the condition to (Enter saves, Esc drops):"
	}
	return "save condition, damage, doors and readings to (read back with --resume):"
}

// conditionLines is the panel drawn for the root model.
func (m model) conditionLines(w, h int) []string { return m.cond.view(m.v, m.damage, m.st, w, h) }
