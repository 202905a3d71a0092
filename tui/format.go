package tui

import (
	"math"
	"strconv"
	"strings"

	"heelwatch/report"
)

// blank is what the screen prints in place of a figure that does not exist
// or is not a finite number. Every figure on the screen goes through num,
// signed or one of the phrases below, so NaN and Inf never reach the officer.
const blank = "—"

// num formats v with prec decimals, or blank when v is NaN or infinite.
// Negative zero prints as zero.
func num(v float64, prec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return blank
	}
	s := strconv.FormatFloat(v, 'f', prec, 64)
	if isZeroText(s) {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// signed formats a change: an explicit sign, blank for non-finite values,
// and "±0" style zero written as "0" with the same decimals.
func signed(v float64, prec int) string {
	s := num(v, prec)
	if s == blank {
		return s
	}
	if isZeroText(s) {
		return s
	}
	if v > 0 {
		return "+" + s
	}
	return s
}

func isZeroText(s string) bool {
	return strings.Trim(s, "-0.") == ""
}

// finite reports whether every value is a finite number.
func finite(vs ...float64) bool {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// heelText says the heel with its side: "3.2° to starboard", "upright".
// Heel is positive starboard side down (conventions).
func heelText(deg float64) string {
	if !finite(deg) {
		return blank
	}
	s := num(math.Abs(deg), 1)
	switch {
	case isZeroText(s):
		return "upright"
	case deg > 0:
		return s + "° to starboard"
	default:
		return s + "° to port"
	}
}

// heelShort is heelText for the log and the header: "3.2° S", "0.0°".
func heelShort(deg float64) string {
	if !finite(deg) {
		return blank
	}
	s := num(math.Abs(deg), 1)
	switch {
	case isZeroText(s):
		return "0.0°"
	case deg > 0:
		return s + "° S"
	default:
		return s + "° P"
	}
}

// trimText says the trim with its sense: "0.41 m by the stern",
// "0.12 m by the head", "even keel". Trim is draft aft − draft forward.
func trimText(m float64) string {
	if !finite(m) {
		return blank
	}
	s := num(math.Abs(m), 2)
	switch {
	case isZeroText(s):
		return "even keel"
	case m > 0:
		return s + " m by the stern"
	default:
		return s + " m by the head"
	}
}

// sideWord names a side in lower case.

// muText prints a permeability as every front end does (report.Permeability).
func muText(mu float64) string { return report.Permeability(mu) }

// clip cuts s to at most w display columns, marking the cut with "…".
func clip(s string, w int) string {
	if w <= 0 {
		return ""
	}
	r := []rune(s)
	if len(r) <= w {
		return s
	}
	if w == 1 {
		return "…"
	}
	return string(r[:w-1]) + "…"
}

// pad fills s with spaces to w runes (s must hold no escape codes).
func pad(s string, w int) string {
	n := len([]rune(s))
	if n >= w {
		return clip(s, w)
	}
	return s + strings.Repeat(" ", w-n)
}

// padLeft right-aligns s in w runes.
func padLeft(s string, w int) string {
	n := len([]rune(s))
	if n >= w {
		return clip(s, w)
	}
	return strings.Repeat(" ", w-n) + s
}
