package tui

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"heelwatch/engine"
	"heelwatch/report"
)

// The righting-options panel takes the whole body of the screen, under the
// header and over the event log: on top what kind of heel it is (a list,
// or a loll with the warning not to ballast the high side), then the
// options ranked best first, one row each, their notes under the table,
// and at the foot, always in view, the words that they are options and not
// orders. What does not fit scrolls with [ and ].

// Wording of the panel's foot: what the options are, in full where it
// takes at most two lines, else in short.
const (
	remedyCautionShort = "Options to weigh, not orders · one tank at a time · solve again before the next"
	remedyCautionLead  = "Options to weigh against the ship's approved stability information, not orders."
)

// remedyWideW is the width from which the table has the upright GM and the
// lowest opening as well, and the engine's summary stands above it.
const remedyWideW = 110

// view draws the panel in w × h.
func (p remedyPanel) view(w, h int) string {
	head, body, foot := p.parts(w, h)
	room := h - len(head) - len(foot)
	if room < 1 {
		// Too little room for a scrolling part: the head and the foot
		// share it, the foot (the caution) kept.
		keep := max(0, h-len(foot))
		return strings.Join(fit(append(fit(head, w, keep), foot...), w, h), "\n")
	}
	if len(body) > room {
		first := min(p.scroll, len(body)-room)
		last := first + room
		head[0] = fitLine(head[0], max(0, w-16)) + p.st.Dim.Render(fmt.Sprintf(" %d–%d/%d [ ]", first+1, last, len(body)))
		body = body[first:last]
	}
	out := append(append(head, body...), fit(nil, w, room-len(body))...)
	return strings.Join(fit(append(out, foot...), w, h), "\n")
}

// scrollMax is how far the panel's scrolling part can be scrolled on the
// screen's body.
func (p remedyPanel) scrollMax() int {
	head, body, foot := p.parts(p.w, p.h)
	return scrolled(len(body), body, p.h-len(head)-len(foot), 0)
}

// remedyParts is the panel's fixed head, its scrolling body and its fixed
// foot, for width w (h only decides how much of the summary stands in the
// head).
func (p remedyPanel) parts(w, h int) (head, body, foot []string) {
	st := p.st
	r := p
	title := []string{"RIGHTING OPTIONS"}
	switch {
	case r.current(p.damage):
		title = append(title, "for "+p.damageWords(r.set.Damage))
	case r.running && sameDamage(r.asked, p.damage):
		title = append(title, "for "+p.damageWords(r.asked))
	}
	if r.current(p.damage) && !r.running {
		title = append(title, "o hides")
	}
	t := st.Heading.Render(titleFit(w, title...))
	if r.running {
		t = st.Heading.Render(titleFit(max(0, w-12), title...)) + " " + st.Busy.Render(p.spin+" computing")
	}
	head = []string{t}
	foot = p.foot(w, h)
	add := func(to *[]string, s func(...string) string, text string) {
		for _, l := range wrap(text, w) {
			*to = append(*to, s(l))
		}
	}
	cur := r.current(p.damage)
	switch {
	case r.running && !cur && sameDamage(r.asked, p.damage):
		add(&head, st.Busy.Render, fmt.Sprintf("Working out the righting options for the state shown (up to %d solves)…", engine.RemedyMaxSolves))
		return head, nil, foot
	case r.running && !cur:
		add(&head, st.Caution.Render, "! OUT OF DATE: the damage state has changed since the options were asked for. o works them out for the state now.")
		return head, nil, foot
	case r.err != "" && !cur:
		add(&head, st.Error.Render, "The righting options could not be worked out: engine failure: "+r.err)
		add(&head, st.Dim.Render, "o tries again.")
		return head, nil, foot
	case !cur && r.set != nil:
		add(&head, st.Caution.Render, "! OUT OF DATE: the damage state has changed since the options were worked out, so none is shown. o works them out for the state now.")
		return head, nil, foot
	case !cur:
		add(&head, st.Dim.Render, "o works out the righting options for the state shown.")
		return head, nil, foot
	}
	rs := r.set
	head = append(head, p.lead(rs, w)...)
	summary := wrap(rs.Summary, w)
	if len(rs.Options) == 0 {
		for _, l := range summary {
			body = append(body, st.Text.Render(l))
		}
		return head, body, foot
	}
	wide := w >= remedyWideW
	if wide && len(head)+len(summary)+len(foot)+1+len(rs.Options) <= h {
		for _, l := range summary {
			head = append(head, st.Text.Render(l))
		}
		summary = nil
	}
	cols := remedyColumns(w)
	head = append(head, st.Heading.Render(cols.header()))
	for i, o := range rs.Options {
		body = append(body, p.row(cols, i+1, o)...)
	}
	body = append(body, st.Heading.Render("NOTES"))
	for i, o := range rs.Options {
		s := st.Text.Render
		if !o.Advisable {
			s = st.Caution.Render
		}
		lead := padLeft(strconv.Itoa(i+1), 2) + " "
		for k, l := range wrap(o.Note, w-3) {
			if k == 0 {
				body = append(body, st.Dim.Render(lead)+s(l))
			} else {
				body = append(body, "   "+s(l))
			}
		}
	}
	if len(summary) > 0 {
		body = append(body, st.Heading.Render("IN FULL"))
		for _, l := range summary {
			body = append(body, st.Text.Render(l))
		}
	}
	return head, body, foot
}

// remedyLead says plainly what kind of heel it is, from the engine's
// figures: a list, a loll (with the warning not to ballast the high side,
// in the danger style), no action needed, or no floating position.
func (p remedyPanel) lead(rs *engine.RemedySet, w int) []string {
	st := p.st
	var out []string
	add := func(s func(...string) string, text string) {
		for _, l := range wrap(text, w) {
			out = append(out, s(l))
		}
	}
	high := "port"
	if rs.HeelDeg < 0 {
		high = "starboard"
	}
	noBallast := "‼ DO NOT COUNTER-BALLAST THE HIGH (" + strings.ToUpper(high) + ") SIDE: she would flop over to " + high + ", perhaps further."
	if math.Abs(rs.HeelDeg) < 0.005 {
		noBallast = "‼ DO NOT COUNTER-BALLAST THE HIGH SIDE: she would flop over to it, perhaps further."
	}
	switch {
	case rs.Position == nil:
		why := "no floating position"
		if rs.NoEq != nil {
			why = rs.NoEq.Outcome.Plain()
		}
		add(st.Danger.Render, "‼ NO FLOATING POSITION ("+why+"): no righting option is worked out.")
	case rs.Loll:
		add(st.Danger.Render, "‼ LOLL, not a list: upright GM "+num(rs.UprightGMM, 2)+" m, lolling "+heelText(rs.HeelDeg)+".")
		add(st.Danger.Render, noBallast+" Lower G first.")
	case !finite(rs.UprightGMM):
		add(st.Danger.Render, "‼ UPRIGHT GM UNKNOWN: a list cannot be told from a loll. Treat it as a loll, "+heelText(rs.HeelDeg)+".")
		add(st.Danger.Render, noBallast)
	case rs.Needed:
		add(st.Value.Render, "LIST, not a loll: upright GM "+num(rs.UprightGMM, 2)+" m, heel "+heelText(rs.HeelDeg)+
			". Weight to the "+high+" side brings her back.")
	default:
		where := fmt.Sprintf("within %s° of upright (%s)", num(engine.RemedyUprightDeg, 1), heelText(rs.HeelDeg))
		if math.Abs(rs.HeelDeg) < 0.005 {
			where = "upright"
		}
		add(st.Value.Render, fmt.Sprintf("NO RIGHTING ACTION NEEDED for list or loll: %s, upright GM %s m.", where, num(rs.UprightGMM, 2)))
	}
	return out
}

// remedyFoot is the caution, always on screen under the options: in full
// (the report's words after a line of the panel's own) on a panel of 30
// lines or more when it takes at most three lines, else in short.
func (p remedyPanel) foot(w, h int) []string {
	var lines []string
	if h >= 30 {
		lines = append(wrap(remedyCautionLead, w), wrap(report.RemediesCaution, w)...)
	}
	if len(lines) == 0 || len(lines) > 3 {
		lines = wrap(remedyCautionShort, w)
	}
	out := make([]string, len(lines))
	for i, l := range lines {
		out[i] = p.st.Caution.Render(l)
	}
	return out
}

// remedyCols is the layout of the options table for one width: the
// action's column takes what the figures leave.
type remedyCols struct {
	actionW int
	wide    bool // the upright GM and the lowest opening too
}

func remedyColumns(w int) remedyCols {
	c := remedyCols{wide: w >= remedyWideW}
	fixed := 3 + 7 + 8 + 6 + 7 + 5
	if c.wide {
		fixed += 2 + 10 + 10 + 6
	}
	c.actionW = max(8, w-fixed)
	return c
}

// header is the table's heading line.
func (c remedyCols) header() string {
	if c.wide {
		// Each GM says where it is taken (upright, at the heel she comes
		// to), and the opening's height its unit.
		s := " # " + pad("action", c.actionW) + padLeft("mass t", 7) + padLeft("heel", 8) + padLeft("GM up m", 8) + padLeft("deck m", 7)
		s += padLeft("GM heel m", 10) + padLeft("opening m", 10)
		return s + "  advisable"
	}
	s := " # " + pad("action", c.actionW) + padLeft("mass t", 7) + padLeft("heel", 8) + padLeft("GM m", 6) + padLeft("deck m", 7)
	return s + "  adv"
}

// remedyRow is one option: its rank, its action (wrapped in its column,
// at most three lines), and on the first line the mass, the heel she
// comes to with its side, GM, the least freeboard to the deck edge (and
// on a wide screen the upright GM and the lowest unprotected opening's
// height), and whether it is advisable.
func (p remedyPanel) row(c remedyCols, rank int, o engine.Remedy) []string {
	st := p.st
	text := st.Text
	if !o.Advisable {
		text = st.Dim
	}
	act := wrapKeep(o.Action, c.actionW)
	if len(act) > 3 {
		act = append(act[:2], clip(strings.Join(act[2:], " "), c.actionW))
	}
	var heel, gm, deck, gm0, open string
	deckStyle, heelStyle := text, text
	if p := o.Position; p != nil {
		heel, gm, deck = heelShort(p.HeelDeg), num(o.UprightGMM, 2), num(p.DeckEdge.HeightM, 2)
		if p.DeckEdge.HeightM < 0 {
			deckStyle = st.Danger
		}
		gm0, open = num(p.GMAtRestM, 2), num(o.LowestOpeningM, 2)
	} else {
		heel, heelStyle = "no pos.", st.Danger
		if o.NoEq != nil && o.NoEq.Outcome != engine.NotConverged {
			heel = o.NoEq.Outcome.String()
		}
		gm, deck, gm0, open = blank, blank, blank, blank
	}
	adv := st.Pass.Render("yes")
	if !o.Advisable {
		adv = st.Caution.Render("NO")
	}
	first := st.Dim.Render(padLeft(strconv.Itoa(rank), 2)+" ") + text.Render(pad(firstOf(act), c.actionW)) +
		text.Render(padLeft(massText(o.MassT), 7)) + heelStyle.Render(padLeft(heel, 8))
	if c.wide {
		first += text.Render(padLeft(gm, 8)) + deckStyle.Render(padLeft(deck, 7)) + text.Render(padLeft(gm0, 10)+padLeft(open, 10))
	} else {
		first += text.Render(padLeft(gm, 6)) + deckStyle.Render(padLeft(deck, 7))
	}
	out := []string{first + "  " + adv}
	for _, l := range act[min(1, len(act)):] {
		out = append(out, "   "+text.Render(l))
	}
	return out
}

// massText is an option's mass in tonnes: one decimal under 1000 t.
func massText(t float64) string {
	if math.Abs(t) >= 1000 {
		return num(t, 0)
	}
	return num(t, 1)
}

// wrapKeep is wrap that never breaks a figure from its unit (a space
// before % or t).
func wrapKeep(text string, w int) []string {
	const glue = "\x00"
	r := strings.NewReplacer(" %", glue+"%", " t ", glue+"t ")
	lines := wrap(r.Replace(text), w)
	for i, l := range lines {
		lines[i] = strings.ReplaceAll(l, glue, " ")
	}
	return lines
}

func firstOf(s []string) string {
	if len(s) == 0 {
		return ""
	}
	return s[0]
}

// damageWords names a damage state for the panel's title: the
// compartments open to the sea or holding water, or "intact".
func (p remedyPanel) damageWords(d engine.Damage) string {
	var open []string
	for i := range p.v.Compartments {
		if i < len(d) && (d[i].Open || d[i].WaterM3 > 0) {
			open = append(open, p.v.Compartments[i].Name)
		}
	}
	switch len(open) {
	case 0:
		return "the intact ship"
	case 1, 2:
		return strings.Join(open, " + ") + " flooded"
	}
	return fmt.Sprintf("%s + %d more flooded", open[0], len(open)-1)
}

// spinView is the spinner's frame, or a still mark when it does not turn
// (tests).
func (m model) spinView() string {
	if !m.animate {
		return "…"
	}
	return m.spin.View()
}
