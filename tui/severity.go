package tui

import (
	"heelwatch/engine"
)

// handCaveat reports whether a flag is about the hand method rather than
// the ship: the hand answer parts from the direct one, or the hull is not
// wall-sided where the hand method assumes it. Such flags are shown only
// where the hand working is (the hand key), so that they never push a flag
// about the ship off a crowded screen.
func handCaveat(f engine.Flag) bool { return f.AboutHandMethod() }

// splitFlags orders the flags danger, caution, notes (keeping the engine's
// order within each) and sets the hand method's caveats apart.
func splitFlags(all []engine.Flag) (ship, hand []engine.Flag) {
	for _, sev := range []engine.Severity{engine.Danger, engine.Caution, engine.Info} {
		for _, f := range all {
			if f.Severity != sev {
				continue
			}
			if handCaveat(f) {
				hand = append(hand, f)
			} else {
				ship = append(ship, f)
			}
		}
	}
	return ship, hand
}

// severityWord is the worst severity among the flags about the ship, in a
// word for the header with its mark: "‼ DANGER", "! CAUTION", "· notes",
// or "no flags".
func (m model) severityWord() string {
	st := m.st
	worst := engine.Severity(-1)
	for _, f := range m.derived.flags {
		worst = max(worst, f.Severity)
	}
	switch worst {
	case engine.Danger:
		return st.Danger.Render("‼ DANGER")
	case engine.Caution:
		return st.Caution.Render("! CAUTION")
	case engine.Info:
		return st.Info.Render("· notes")
	}
	return st.Dim.Render("no flags")
}

// caveatLines are the hand method's caveats, wrapped to w, each with the
// mark of its severity: shown only where the hand working is.
func (hp handPanel) caveatLines(w int) []string {
	var out []string
	if len(hp.caveats) > 0 {
		// Said once: "no flags raised" above may stand over them.
		for _, l := range wrap("the hand method's caveats (about the method, not flags of the ship):", w) {
			out = append(out, hp.st.Dim.Render(l))
		}
	}
	for _, f := range hp.caveats {
		for k, l := range wrap(f.Message, w-2) {
			if k == 0 {
				out = append(out, flagMark(hp.st, f)+hp.st.Text.Render(l))
			} else {
				out = append(out, "  "+hp.st.Text.Render(l))
			}
		}
	}
	return out
}

// handShown is the hand method's panel with the figures shown, the
// hand method's caveats among their flags, and the room it is drawn in:
// the wide screen's row of pictures (without its answers, which stand
// under the figures), else the narrow screen's sheet.
func (m model) handShown() handPanel {
	hp := m.hand.with(m.cur, m.st)
	hp.caveats = m.derived.hand
	if m.lay.wide {
		return hp.room(m.width, m.lay.picH, false)
	}
	_, sheetH := m.flagRoom()
	return hp.room(m.lay.rightW, sheetH, true)
}

// danger reports whether a flag about the ship is of danger.
func (m model) danger() bool {
	for _, f := range m.derived.flags {
		if f.Severity == engine.Danger {
			return true
		}
	}
	return false
}
