package tui

import (
	"regexp"
	"strings"
	"time"
)

// A condition changed on the dashboard is no longer the one its name
// names: it carries the mark " (changed HH:MM)", the clock time of the
// latest change, in the header, the panel, the saved files and the
// reports. Undone back to where it was, it has its name as it was.

// changedMark matches the mark at the end of a name.
var changedMark = regexp.MustCompile(` ?\(changed \d\d:\d\d\)$`)

// changedName is the name of condition named after a change at t.
func changedName(named string, t time.Time) string {
	mark := "(changed " + t.Format("15:04") + ")"
	if named == "" {
		return "condition " + mark
	}
	return named + " " + mark
}

// unchangedName is name without the mark of a change, "" when the name
// was only the mark.
func unchangedName(name string) string {
	n := changedMark.ReplaceAllString(name, "")
	if n == "condition" && n != name {
		return ""
	}
	return strings.TrimSpace(n)
}

// changeOnly is the mark of name alone ("(changed 14:05)"), "" if the
// name has none: what the header shows when the whole name has no room.
func changeOnly(name string) string {
	return strings.TrimSpace(changedMark.FindString(name))
}
