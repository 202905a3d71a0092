package report

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"heelwatch/engine"
)

// This file holds the words and numbers every front end uses for the same
// quantity (heel, trim, side, numbers, durations, permeability), so that a
// value reads the same on the screen, in the reports and on the command
// line. The rule they share: a figure that rounds to zero at the precision
// shown is zero, never "-0", and a heel or trim that rounds to zero has no
// side: she is upright, on an even keel.
//
// Heel is positive starboard side down; trim is draft aft − draft forward,
// positive by the stern (the conventions).

// Blank is printed in place of a figure that does not exist or is not a
// finite number: NaN and Inf never reach a reader.
const Blank = "—"

// finite reports whether x is neither NaN nor infinite.
func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// Fixed writes x with prec decimals followed by unit: "°" is joined to the
// figure, any other unit follows a space, "" adds nothing.
//
// Special cases: NaN and ±Inf are Blank (without the unit); a value that
// rounds to zero is written without a sign ("0.00", not "-0.00").
func Fixed(x float64, prec int, unit string) string {
	if !finite(x) {
		return Blank
	}
	if x == 0 || math.Abs(x) < 0.5*math.Pow(10, -float64(prec)) {
		x = 0 // no "-0.000"
	}
	s := strconv.FormatFloat(x, 'f', prec, 64)
	if s == "-"+strconv.FormatFloat(0, 'f', prec, 64) {
		s = s[1:]
	}
	switch unit {
	case "":
		return s
	case "°":
		return s + unit
	}
	return s + " " + unit
}

// num is Fixed, the report package's own short name for it.
func num(x float64, prec int, unit string) string { return Fixed(x, prec, unit) }

// Signed is Fixed with an explicit "+" on a positive figure ("+0.25 m").
//
// Special cases: NaN and ±Inf are Blank; a value that rounds to zero has no
// sign.
func Signed(x float64, prec int, unit string) string {
	s := Fixed(x, prec, unit)
	if finite(x) && !strings.HasPrefix(s, "-") && s != Fixed(0, prec, unit) {
		return "+" + s
	}
	return s
}

// signed is Signed, the report package's own short name for it.
func signed(x float64, prec int, unit string) string { return Signed(x, prec, unit) }

// sized returns the size of x at prec decimals with its unit and its
// sign: +1, -1, or 0 when it rounds to zero (it then has no side).
func sized(x float64, prec int, unit string) (string, int) {
	s := Fixed(math.Abs(x), prec, unit)
	switch {
	case s == Fixed(0, prec, unit):
		return s, 0
	case x > 0:
		return s, 1
	}
	return s, -1
}

// phrase writes x's size with the word of its side ("3.2° to starboard"),
// or the word of zero alone when it rounds to zero ("upright"); words are
// the negative side's, zero's and the positive side's.
func phrase(x float64, prec int, unit string, words [3]string) string {
	if !finite(x) {
		return Blank
	}
	s, side := sized(x, prec, unit)
	if side == 0 {
		return words[1]
	}
	return s + " " + words[side+1]
}

// sideWord is the word of x's side alone (phrase without the figure).
func sideWord(x float64, prec int, unit string, words [3]string) string {
	if !finite(x) {
		return Blank
	}
	_, side := sized(x, prec, unit)
	return words[side+1]
}

// figure writes x's size and the word of its side, the figure kept at zero
// ("0.00° upright") so that a column reads as a column.
func figure(x float64, prec int, unit string, words [3]string) string {
	if !finite(x) {
		return Blank
	}
	s, side := sized(x, prec, unit)
	return s + " " + words[side+1]
}

// Heel says a heel in a sentence: "3.2° to starboard", "0.5° to port",
// "upright" (when it rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func Heel(deg float64, prec int) string { return phrase(deg, prec, "°", heelSideWords) }

// heelSideWords are the sides of a heel, by side+1.
var heelSideWords = [...]string{"to port", "upright", "to starboard"}

// HeelSide is the side of a heel alone: "to starboard", "to port",
// "upright" (when the heel rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func HeelSide(deg float64, prec int) string { return sideWord(deg, prec, "°", heelSideWords) }

// HeelShort says a heel for a narrow column: "3.2° S", "3.2° P", and the
// bare figure "0.0°" when it rounds to zero at prec decimals.
//
// Special cases: NaN and ±Inf are Blank.
func HeelShort(deg float64, prec int) string {
	if !finite(deg) {
		return Blank
	}
	s, side := sized(deg, prec, "°")
	return s + [3]string{" P", "", " S"}[side+1]
}

// HeelWords says a heel in a report's table, at two decimals: "3.20° to
// starboard", "1.00° to port", and "0.00° upright" when it rounds to zero
// (the figure is kept so that the column reads as a column).
//
// Special cases: NaN and ±Inf are Blank.
func HeelWords(deg float64) string { return figure(deg, 2, "°", heelSideWords) }

// trimSenseWords are the senses of a trim, by sense+1.
var trimSenseWords = [...]string{"by the head", "even keel", "by the stern"}

// Trim says a trim in a sentence: "0.41 m by the stern", "0.12 m by the
// head", "even keel" (when it rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func Trim(m float64, prec int) string { return phrase(m, prec, "m", trimSenseWords) }

// TrimSense is the sense of a trim alone: "by the stern", "by the head",
// "even keel" (when it rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func TrimSense(m float64, prec int) string { return sideWord(m, prec, "m", trimSenseWords) }

// TrimWords says a trim in a report's table, at three decimals: "0.410 m by
// the stern", and "0.000 m even keel" when it rounds to zero.
//
// Special cases: NaN and ±Inf are Blank.
func TrimWords(m float64) string { return figure(m, 3, "m", trimSenseWords) }

// SideShort names a side for a narrow column: "port", "stbd", "P+S".
func SideShort(s engine.Side) string {
	switch s {
	case engine.Port:
		return "port"
	case engine.Both:
		return "P+S"
	}
	return "stbd"
}

// Duration writes s seconds rounded to the second as "1 h 05 min",
// "12 min 30 s" or "45 s".
//
// Special cases: NaN, ±Inf, a negative duration and one of more than a
// million hours are Blank (a time that is not known, or not a time).
func Duration(s float64) string {
	if !(s >= 0) || s > 3.6e9 {
		return Blank
	}
	n := int64(math.Round(s))
	h, m, sec := n/3600, n%3600/60, n%60
	switch {
	case h > 0:
		return fmt.Sprintf("%d h %02d min", h, m)
	case m > 0:
		return fmt.Sprintf("%d min %02d s", m, sec)
	}
	return fmt.Sprintf("%d s", sec)
}

// Permeability writes μ with two decimals ("0.85", "1.00"), or three when
// two would hide the tenth of a per cent a person can type ("0.005" for
// 0.5 %, "0.855"): the value shown is the value used.
//
// Special cases: NaN and ±Inf are Blank.
func Permeability(mu float64) string {
	if !finite(mu) {
		return Blank
	}
	prec := 2
	if c := mu * 100; math.Abs(c-math.Round(c)) > 1e-9 {
		prec = 3
	}
	return strconv.FormatFloat(mu, 'f', prec, 64)
}
