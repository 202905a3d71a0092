package tui

import "strings"

// clipName cuts a compartment's or a weight's name to w runes as clip
// does, but keeps a short last word (a side or a number: "P", "S", "2")
// after the ellipsis, so that two names differing only there stay apart
// on a narrow screen: "ER DB fuel oil P" at 12 is "ER DB fue… P", not
// "ER DB fuel …" for both tanks.
func clipName(s string, w int) string {
	r := []rune(s)
	if len(r) <= w {
		return s
	}
	i := strings.LastIndexByte(s, ' ')
	if i < 0 {
		return clip(s, w)
	}
	tail := []rune(s[i:])
	if len(tail) > 4 || w-len(tail)-1 < 3 {
		return clip(s, w)
	}
	head := []rune(strings.TrimRight(string(r[:w-len(tail)-1]), " "))
	return string(head) + "…" + string(tail)
}
