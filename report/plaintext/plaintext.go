// Package plaintext keeps text from a vessel file, the command line or a
// paste from acting on the terminal it is printed to: it is the one
// sanitiser every name passes through on its way to a screen, a report or
// the event log.
//
// The vessel reader already refuses names that hold such characters; this
// package is the second guard, for every path that prints text whose origin
// it does not control.
package plaintext

import (
	"fmt"
	"strings"
	"unicode/utf8"
)

// Replacement is what an unsafe character is shown as: U+FFFD, the
// replacement character, one column wide and inert on every terminal.
const Replacement = '\uFFFD'

// Unsafe reports whether r may not appear in a name: a C0 control
// (U+0000–U+001F, which includes ESC, CR, LF, TAB and NUL), DEL (U+007F), a
// C1 control (U+0080–U+009F, which 8-bit terminals obey like ESC
// sequences), or a bidirectional control that reorders what follows it
// (U+061C, U+200E, U+200F, U+202A–U+202E, U+2066–U+2069; Unicode
// Standard Annex #9, table 4). A byte that is not UTF-8 is unsafe too; see
// FirstUnsafe.
func Unsafe(r rune) bool {
	switch {
	case r < 0x20, r == 0x7f, r >= 0x80 && r <= 0x9f:
		return true
	case r == 0x061c, r == 0x200e, r == 0x200f,
		r >= 0x202a && r <= 0x202e, r >= 0x2066 && r <= 0x2069:
		return true
	}
	return false
}

// Describe names the unsafe character r for a message, e.g. "ESC
// (U+001B)" or "a bidirectional control (U+202E)".
func Describe(r rune) string {
	names := map[rune]string{0: "NUL", '\t': "TAB", '\n': "a line break (LF)", '\r': "a carriage return (CR)", 0x1b: "ESC", 0x7f: "DEL", 0x9b: "CSI", 0x9d: "OSC"}
	code := fmt.Sprintf("U+%04X", r)
	switch {
	case names[r] != "":
		return names[r] + " (" + code + ")"
	case r == utf8.RuneError:
		return "a byte that is not UTF-8"
	case r < 0x20:
		return "a control character (" + code + ")"
	case r >= 0x80 && r <= 0x9f:
		return "a C1 control character (" + code + ")"
	case Unsafe(r):
		return "a bidirectional control (" + code + ")"
	}
	return code
}

// FirstUnsafe returns the first unsafe character of s and true, or 0 and
// false when s has none. An invalid UTF-8 byte is returned as
// utf8.RuneError.
func FirstUnsafe(s string) (rune, bool) {
	for i, r := range s {
		if r == utf8.RuneError {
			if _, size := utf8.DecodeRuneInString(s[i:]); size == 1 {
				return r, true
			}
			continue // a real U+FFFD is harmless
		}
		if Unsafe(r) {
			return r, true
		}
	}
	return 0, false
}

// Name returns s with every unsafe character (line breaks and tabs
// included) replaced by Replacement: a name printed through Name stays on
// its line and cannot move the cursor, retitle the window or reorder the
// text after it.
func Name(s string) string { return clean(s, false) }

// Text is Name for text of several lines: it keeps LF and TAB, and
// replaces every other unsafe character.
func Text(s string) string { return clean(s, true) }

func clean(s string, keepLines bool) string {
	if _, bad := FirstUnsafe(s); !bad {
		return s
	}
	var b strings.Builder
	b.Grow(len(s))
	for i, r := range s {
		switch {
		case keepLines && (r == '\n' || r == '\t'):
			b.WriteRune(r)
		case r == utf8.RuneError:
			if _, size := utf8.DecodeRuneInString(s[i:]); size == 1 {
				b.WriteRune(Replacement)
			} else {
				b.WriteRune(r)
			}
		case Unsafe(r):
			b.WriteRune(Replacement)
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}
