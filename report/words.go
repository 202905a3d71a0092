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

// heelSide returns the heel's size at prec decimals in degrees and its
// side: +1 starboard, -1 port, 0 upright (the figure rounds to zero).
func heelSide(deg float64, prec int) (string, int) {
	s := Fixed(math.Abs(deg), prec, "°")
	switch {
	case s == Fixed(0, prec, "°"):
		return s, 0
	case deg > 0:
		return s, 1
	}
	return s, -1
}

// Heel says a heel in a sentence: "3.2° to starboard", "0.5° to port",
// "upright" (when it rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func Heel(deg float64, prec int) string {
	if !finite(deg) {
		return Blank
	}
	s, side := heelSide(deg, prec)
	if side == 0 {
		return heelSideWords[1]
	}
	return s + " " + heelSideWords[side+1]
}

// heelSideWords are the sides of a heel, by side+1.
var heelSideWords = [3]string{"to port", "upright", "to starboard"}

// HeelSide is the side of a heel alone: "to starboard", "to port",
// "upright" (when the heel rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func HeelSide(deg float64, prec int) string {
	if !finite(deg) {
		return Blank
	}
	_, side := heelSide(deg, prec)
	return heelSideWords[side+1]
}

// HeelShort says a heel for a narrow column: "3.2° S", "3.2° P", and the
// bare figure "0.0°" when it rounds to zero at prec decimals.
//
// Special cases: NaN and ±Inf are Blank.
func HeelShort(deg float64, prec int) string {
	if !finite(deg) {
		return Blank
	}
	s, side := heelSide(deg, prec)
	return s + [3]string{" P", "", " S"}[side+1]
}

// HeelWords says a heel in a report's table, at two decimals: "3.20° to
// starboard", "1.00° to port", and "0.00° upright" when it rounds to zero
// (the figure is kept so that the column reads as a column).
//
// Special cases: NaN and ±Inf are Blank.
func HeelWords(deg float64) string {
	if !finite(deg) {
		return Blank
	}
	s, _ := heelSide(deg, 2)
	return s + " " + HeelSide(deg, 2)
}

// trimSide returns the trim's size at prec decimals in metres and its
// sense: +1 by the stern, -1 by the head, 0 even keel.
func trimSide(m float64, prec int) (string, int) {
	s := Fixed(math.Abs(m), prec, "m")
	switch {
	case s == Fixed(0, prec, "m"):
		return s, 0
	case m > 0:
		return s, 1
	}
	return s, -1
}

// trimSenseWords are the senses of a trim, by sense+1.
var trimSenseWords = [3]string{"by the head", "even keel", "by the stern"}

// Trim says a trim in a sentence: "0.41 m by the stern", "0.12 m by the
// head", "even keel" (when it rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func Trim(m float64, prec int) string {
	if !finite(m) {
		return Blank
	}
	s, sense := trimSide(m, prec)
	if sense == 0 {
		return trimSenseWords[1]
	}
	return s + " " + trimSenseWords[sense+1]
}

// TrimSense is the sense of a trim alone: "by the stern", "by the head",
// "even keel" (when it rounds to zero at prec decimals).
//
// Special cases: NaN and ±Inf are Blank.
func TrimSense(m float64, prec int) string {
	if !finite(m) {
		return Blank
	}
	_, sense := trimSide(m, prec)
	return trimSenseWords[sense+1]
}

// TrimWords says a trim in a report's table, at three decimals: "0.410 m by
// the stern", and "0.000 m even keel" when it rounds to zero.
//
// Special cases: NaN and ±Inf are Blank.
func TrimWords(m float64) string {
	if !finite(m) {
		return Blank
	}
	s, sense := trimSide(m, 3)
	return s + " " + trimSenseWords[sense+1]
}

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
