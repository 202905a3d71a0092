package tui

import (
	"fmt"
	"strings"

	"github.com/charmbracelet/lipgloss"
)

// safetyLine is on every screen: what heelwatch is, and what governs;
// safetyShort is the same for a screen too narrow for it.
const (
	safetyLine  = "Decision support only: the approved stability information and the master's judgement govern."
	safetyShort = "Decision support only: approved stability information and the master govern."
)

// View draws the dashboard. It only draws: every figure was computed
// before, in a Cmd, and every size was decided in resize.
func (m model) View() string {
	if m.lay.small {
		return m.tooSmallView()
	}
	l := m.lay
	var lines []string
	lines = append(lines, m.headerView(m.width))
	if m.rem.show {
		lines = append(lines, strings.Split(m.rem.with(m).view(m.width, l.bodyH), "\n")...)
	} else if l.wide {
		lines = append(lines, m.wideBody()...)
	} else {
		lines = append(lines, m.narrowBody()...)
	}
	lines = append(lines, m.logView(m.width, l.logLines)...)
	safety := safetyLine
	if len([]rune(safety)) > m.width {
		safety = safetyShort
	}
	lines = append(lines, fitLine(m.st.Safety.Render(clip(safety, m.width)), m.width))
	lines = append(lines, m.footView()...)
	return strings.Join(fit(lines, m.width, m.height), "\n")
}

// tooSmallView says what size the dashboard needs.
func (m model) tooSmallView() string {
	w, h := m.width, m.height
	if w <= 0 || h <= 0 {
		return ""
	}
	msg := wrap(fmt.Sprintf("heelwatch needs a terminal of at least %d×%d; this one is %d×%d. Enlarge the window (q quits).", minWidth, minHeight, w, h), w)
	return strings.Join(fit(msg, w, min(h, len(msg))), "\n")
}

// headerView is the top line: the program, the vessel, a summary of the
// state, the computing mark and the palette.
func (m model) headerView(w int) string {
	st := m.st
	left := st.App.Render("HEELWATCH") + " " + st.Header.Render(m.vesselName())
	var sum []string
	open := 0
	for i := range m.v.Compartments {
		if word, _ := spaceState(m.damage, i); word != "intact" {
			open++
		}
	}
	if open == 0 {
		sum = append(sum, "intact")
	} else {
		sum = append(sum, fmt.Sprintf("%d flooded", open))
	}
	if m.cur != nil && m.cur.Position != nil {
		p := m.cur.Position
		sum = append(sum, "heel "+heelShort(p.HeelDeg), "GM "+num(p.GMUprightM, 2)+" m")
	} else if m.noPosition() {
		sum = append(sum, "NO FLOATING POSITION")
	}
	summary := func(sum []string) string {
		right := st.Header.Render(strings.Join(sum, " · "))
		if m.cur != nil || m.failure != "" {
			// The worst of the flags in a word, first, so that it is the
			// last thing a narrow screen cuts.
			right = m.severityWord() + st.Header.Render(" · ") + right
		}
		right = m.logWarning() + right
		if m.pending() {
			right = st.Busy.Render(m.spin.View()+" computing") + "  " + right
		}
		return right
	}
	right := summary(sum)
	if lipgloss.Width(left)+lipgloss.Width(right)+1 > w && len(sum) > 1 {
		// Short of room, the count of flooded spaces goes first: the
		// list's heading says it too.
		right = summary(sum[1:])
	}
	if m.condition != "" && lipgloss.Width(left)+lipgloss.Width(right)+len([]rune(m.condition))+4 <= w {
		left += st.Dim.Render(" · " + m.condition)
	} else if mark := changeOnly(m.condition); mark != "" && lipgloss.Width(left)+lipgloss.Width(right)+len([]rune(mark))+4 <= w {
		// No room for the name: that it was changed is said all the same.
		left += st.Dim.Render(" · " + mark)
	}
	if palette := st.Dim.Render("  " + m.st.Palette); lipgloss.Width(left)+lipgloss.Width(right+palette)+1 <= w {
		right += palette
	}
	if lipgloss.Width(left)+lipgloss.Width(right)+1 > w {
		// The vessel's name gives way to the figures.
		left = fitLine(left, max(10, w-lipgloss.Width(right)-1))
	}
	gap := w - lipgloss.Width(left) - lipgloss.Width(right)
	if gap < 1 {
		return fitLine(left+" "+right, w)
	}
	return left + strings.Repeat(" ", gap) + right
}

// narrowBody: the list on the left; on the right the figures, the flags
// and one sheet (a picture, the criteria, or the hand working).
func (m model) narrowBody() []string {
	l := m.lay
	sep := m.st.Dim.Render("│")
	list := m.listView(l.listW, l.bodyH)
	if m.cond.show {
		return besides(sep, fit(list, l.listW, l.bodyH), fit(m.conditionLines(l.rightW, l.bodyH), l.rightW, l.bodyH))
	}
	if m.rd.show {
		return besides(sep, fit(list, l.listW, l.bodyH), fit(m.readingLines(l.rightW, l.bodyH), l.rightW, l.bodyH))
	}
	if m.girder.show {
		return besides(sep, fit(list, l.listW, l.bodyH), fit(m.girderLines(l.rightW, l.bodyH), l.rightW, l.bodyH))
	}
	if m.doors.show {
		return besides(sep, fit(list, l.listW, l.bodyH), fit(m.doorsLines(l.rightW, l.bodyH), l.rightW, l.bodyH))
	}
	if m.flood.show {
		return besides(sep, fit(list, l.listW, l.bodyH), strings.Split(m.flood.with(m).view(l.rightW, l.bodyH), "\n"))
	}
	right := fit(m.figuresView(min(l.rightW, maxFigWidth)), l.rightW, figLines)
	if m.noPosition() {
		right = append(right, m.bannerView(l.rightW, l.flagH+l.sheetH)...)
	} else {
		flagH, sheetH := m.flagRoom()
		right = append(right, m.flagsView(l.rightW, flagH)...)
		if sheetH > 0 {
			right = append(right, m.sheetView(l.rightW, sheetH)...)
		}
	}
	return besides(sep, fit(list, l.listW, l.bodyH), fit(right, l.rightW, l.bodyH))
}

// sheetView is the narrow screen's lower right: the chosen picture or the
// criteria (the picture key turns to the next), or the hand working while
// it is shown.
func (m model) sheetView(w, h int) []string {
	if m.hand.show {
		return fit(m.handShown().view(w, h, true), w, h)
	}
	return fit(m.pictureView(m.picture, w, h), w, h)
}

// sectionPicture is the section as View draws it, drawn again only when it
// changed.
func (m model) sectionPicture(w, h int) []string { return m.cached(picSection, w, h, m.sectionView) }

func (m model) pictureView(which, w, h int) []string {
	switch which {
	case picSection:
		return m.sectionPicture(w, h)
	case picProfile:
		return m.cached(picProfile, w, h, m.profileView)
	case picGZ:
		return m.cached(picGZ, w, h, m.gzView)
	}
	return m.criteriaView(w, h, true)
}

// wideBody: on top the list, the figures with the flags (or the hand
// method's answers) under them, and the flags in full with the criteria;
// below, the section, the profile and the GZ curve side by side, or the
// hand working while it is shown.
func (m model) wideBody() []string {
	l := m.lay
	sep := m.st.Dim.Render("│")
	list := m.listView(l.listW, l.topH)
	mid := m.figuresView(l.posW)
	if m.hand.show && m.cur != nil {
		// The hand method's answers right under the direct figures.
		if m.cur.Hand != nil {
			if m.cur.Hand.Usable() {
				mid = append(mid, m.st.Heading.Render("HAND METHOD"))
			} else {
				mid = append(mid, m.st.Danger.Render("HAND METHOD ✗ NOT USABLE: its heel and drafts"))
			}
			mid = append(mid, m.handShown().answers(l.posW)...)
		} else {
			mid = append(mid, m.st.Heading.Render("HAND METHOD"))
			for _, s := range wrap(m.handShown().why(), l.posW) {
				mid = append(mid, m.st.Dim.Render(s))
			}
			// Without a hand working below, its caveats go here.
			mid = append(mid, m.handShown().caveatLines(l.posW)...)
		}
	} else {
		mid = append(mid, m.flagsView(l.posW, l.topH-figLines)...)
	}
	third := m.criteriaView(l.thirdW, l.topH, true)
	top := besides(sep, fit(list, l.listW, l.topH), fit(mid, l.posW, l.topH), fit(third, l.thirdW, l.topH))
	rule := m.st.Dim.Render(strings.Repeat("─", m.width))
	var pics []string
	switch {
	case m.cond.show:
		pics = m.conditionLines(m.width, l.picH)
	case m.rd.show:
		pics = m.readingLines(m.width, l.picH)
	case m.girder.show:
		pics = m.girderLines(m.width, l.picH)
	case m.doors.show:
		pics = m.doorsLines(m.width, l.picH)
	case m.flood.show:
		pics = strings.Split(m.flood.with(m).row(m.width, l.picH, m.sectionPicture), "\n")
	case m.noPosition():
		pics = m.bannerView(m.width, l.picH)
	case m.handShown().hasWorking():
		pics = m.handShown().view(m.width, l.picH, false)
	default:
		pics = besides(sep,
			fit(m.sectionPicture(l.picW[0], l.picH), l.picW[0], l.picH),
			fit(m.cached(picProfile, l.picW[1], l.picH, m.profileView), l.picW[1], l.picH),
			fit(m.cached(picGZ, l.picW[2], l.picH, m.gzView), l.picW[2], l.picH))
	}
	out := append(top, rule)
	return append(out, pics...)
}

// logView shows the newest lines of the event log.
func (m model) logView(w, n int) []string {
	st := m.st
	var lines []string
	start := max(0, len(m.log)-n)
	for _, l := range m.log[start:] {
		lines = append(lines, st.Log.Render(clip(l, w)))
	}
	return fit(lines, w, n)
}

// footView is the help bar, or the permeability prompt while one is typed.
func (m model) footView() []string {
	st := m.st
	switch m.mode {
	case modeForm:
		return m.form.view(m.width, formLines)
	case modeFind:
		return strings.Split(m.find.view(m.width, findLines), "\n")
	case modeMu:
		name := ""
		if len(m.v.Compartments) > 0 {
			name = m.v.Compartments[m.sel].Name
		}
		p := st.Prompt.Render("permeability μ of "+name+": ") + m.input.View()
		hint := st.Dim.Render("0 < μ ≤ 1, e.g. 0.85 or 85% · enter sets · esc cancels")
		if m.inputErr != "" {
			hint = st.Error.Render(m.inputErr)
		}
		return []string{fitLine(p, m.width), fitLine(hint, m.width)}
	}
	return m.helpLines()
}

// helpLines is the help bar, and with the full help the legend of marks.
func (m model) helpLines() []string {
	lines := strings.Split(m.help.View(m.keys), "\n")
	if ks := m.panelHelp(); ks != nil && !m.help.ShowAll {
		lines = []string{m.help.ShortHelpView(ks)}
	}
	if m.help.ShowAll && m.width > 0 {
		for _, l := range wrap(markLegend(m.v.Passenger()), m.width) {
			lines = append(lines, m.st.Dim.Render(l))
		}
	}
	return lines
}
