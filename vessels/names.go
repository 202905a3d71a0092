package vessels

import (
	"fmt"
	"strings"
	"unicode"

	"heelwatch/report/plaintext"
)

// checkName reports a name that a terminal or a command line could not
// take as it is: one holding a control character (C0, C1, DEL) or a
// bidirectional control, which would act on the terminal it is printed to
// or reorder the text after it (plaintext.Unsafe), or one starting or
// ending with a space, which could never be typed back on the command line
// (arguments are trimmed). It returns false when it reported one.
func (r *reader) checkName(path, n, what string) bool {
	if c, bad := plaintext.FirstUnsafe(n); bad {
		r.addf(path, "the %s %s holds %s: names may hold no control or bidirectional characters (they are printed to terminals and reports)", what, quoteName(n), plaintext.Describe(c))
		return false
	}
	if n != "" && (startsWithSpace(n) || endsWithSpace(n)) {
		r.addf(path, "%s starts or ends with a space: write the %s without it (names are typed on the command line, which drops such spaces)", quoteName(n), what)
		return false
	}
	return true
}

// checkText reports free text (a description) holding a control or
// bidirectional character other than a line break or a tab.
func (r *reader) checkText(path, s, what string) bool {
	if c, bad := plaintext.FirstUnsafe(strings.ReplaceAll(strings.ReplaceAll(s, "\n", ""), "\t", "")); bad {
		r.addf(path, "holds %s: %s may hold line breaks but no other control or bidirectional characters", plaintext.Describe(c), what)
		return false
	}
	return true
}

func startsWithSpace(s string) bool {
	for _, c := range s {
		return unicode.IsSpace(c)
	}
	return false
}

func endsWithSpace(s string) bool {
	t := strings.TrimRightFunc(s, unicode.IsSpace)
	return len(t) < len(s)
}

// quoteName quotes a name for a message with Go's escapes, so that the
// message itself shows an ESC as \x1b rather than sending it (%q escapes
// every character strconv.IsPrint refuses, and every byte not UTF-8).
func quoteName(n string) string { return fmt.Sprintf("%q", n) }
