package tui

import (
	"math"
	"strings"

	"heelwatch/report"
)

// blank is what the screen prints in place of a figure that does not exist
// or is not a finite number. Every figure on the screen goes through num,
// signed or one of the phrases below (all of them report's words), so NaN
// and Inf never reach the officer.
const blank = report.Blank

// num formats v with prec decimals, or blank when v is NaN or infinite
// (report.Fixed).
func num(v float64, prec int) string { return report.Fixed(v, prec, "") }

// signed formats a change with an explicit sign (report.Signed).
func signed(v float64, prec int) string { return report.Signed(v, prec, "") }

// finite reports whether every value is a finite number.
func finite(vs ...float64) bool {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// heelText says the heel with its side: "3.2° to starboard", "upright"
// (report.Heel at one decimal).
func heelText(deg float64) string { return report.Heel(deg, 1) }

// heelShort is heelText for the log and the header: "3.2° S", "0.0°".
func heelShort(deg float64) string { return report.HeelShort(deg, 1) }

// trimText says the trim with its sense: "0.41 m by the stern", "even keel"
// (report.Trim at two decimals).
func trimText(m float64) string { return report.Trim(m, 2) }

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
