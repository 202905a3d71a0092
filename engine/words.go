package engine

import (
	"fmt"
	"math"
)

// This file holds the few words the engine's own sentences use (flags,
// righting options, the hand working). They follow the front ends' rule
// (report/words.go): a heel that rounds to zero at the precision written
// has no side, she is upright. The engine imports nothing of the
// presentation, so its sentences keep these words here.

// heelWords writes a heel for a sentence, at two decimals: "3.21° to
// starboard", "0.50° to port", "upright" below 0.005°; "—" for NaN.
func heelWords(deg float64) string {
	if math.IsNaN(deg) {
		return "—"
	}
	if math.Abs(deg) < 0.005 {
		return "upright"
	}
	return fmt.Sprintf("%.2f° %s", math.Abs(deg), signWords(deg, "to starboard", "to port", ""))
}

// sideWords names the side of a transverse position y: "starboard",
// "port" or "centreline".
func sideWords(y float64) string { return signWords(y, "starboard", "port", "centreline") }

// signWords picks the word for the sign of x: pos when x > 0, neg when
// x < 0, zero otherwise (zero and NaN).
func signWords(x float64, pos, neg, zero string) string {
	switch {
	case x > 0:
		return pos
	case x < 0:
		return neg
	}
	return zero
}

// trimWords writes a trim for a sentence, at two decimals: "3.20 m by the
// stern", "0.41 m by the head", "even keel" below 0.005 m; "—" for NaN.
func trimWords(m float64) string {
	if math.IsNaN(m) {
		return "—"
	}
	if math.Abs(m) < 0.005 {
		return "even keel"
	}
	return fmt.Sprintf("%.2f m %s", math.Abs(m), signWords(m, "by the stern", "by the head", ""))
}
