package engine

import (
	"fmt"
	"math"
)

// The hand method's range. Its list is tan θ = lever/GM, the small-angle
// limit of the wall-sided balance tan θ·(GM + ½·BM·tan²θ) = lever: the
// answer leaves out ½·BM·tan²θ beside GM, and divides by GM. Past these
// limits the hand heel, and the drafts read off it, are not usable (not
// merely less exact):
//
//   - HandUsableHeelDeg: a heel beyond 20°. The metacentre stays put only
//     at small angles; by 20° tan θ runs 4 % ahead of θ and the term left
//     out is 6.6 % × BM/GM of GM: 13 % for a stiff ship (BM/GM = 2) and
//     past a quarter once BM/GM exceeds 4. The deck edge or the bilge of a
//     ship-shaped hull is reached at about that heel, where no hull is
//     wall-sided, so beyond it the method is not trusted however stiff she
//     is. Below it, the next limit judges by her own BM and GM.
//   - HandUsableDropPart: the term left out, ½·BM·tan²θ at the hand heel,
//     more than a quarter of GM. The small-angle tan θ exceeds the
//     wall-sided one by the factor 1 + ½·BM·tan²θ/GM, so the hand heel is
//     then out by a quarter or more, whatever the angle (a low GM with a
//     modest list).
//   - HandUsableGMM: a GM below 0.05 m (or negative: no small-angle list at
//     all). The heel is lever/GM: with GM that small a centimetre of KG
//     moves it by a fifth or more, beyond what any condition is known to.
//
// These are heelwatch's own limits, derived above from the wall-sided
// formula; they judge the method, not the ship.
const (
	HandUsableHeelDeg  = 20.0
	HandUsableDropPart = 0.25
	HandUsableGMM      = 0.05
)

// Unusable returns why the hand answer (its heel, and the drafts read off
// that heel) is not usable for this state, in words that name the figures,
// or "" when it is within the method's range (see HandUsableHeelDeg). It
// is a pure function of the working. The conventions keep the hand answer
// whenever a compartment is open: a screen or report shows it marked as
// not usable rather than dropping it.
func (w *HandWorking) Unusable() string {
	if w == nil {
		return ""
	}
	var why []string
	switch {
	case math.IsNaN(w.GMM) || math.IsInf(w.GMM, 0) || math.IsNaN(w.HeelDeg) || math.IsInf(w.HeelDeg, 0):
		return "its GM or heel could not be worked out"
	case !(w.GMM > 0):
		why = append(why, fmt.Sprintf("its GM is %.3f m: there is no small-angle list to work (%s); GM must be %.2f m or more", w.GMM, "tan θ = lever/GM divides by nothing", HandUsableGMM))
	case w.GMM < HandUsableGMM:
		why = append(why, fmt.Sprintf("its GM of %.3f m is next to nothing (under %.2f m): tan θ = lever/GM turns on a centimetre of KG", w.GMM, HandUsableGMM))
	}
	if a := math.Abs(w.HeelDeg); a > HandUsableHeelDeg {
		why = append(why, fmt.Sprintf("its heel of %.2f° is beyond the %.0f° to which tan θ = lever/GM, a small-angle formula, holds", a, HandUsableHeelDeg))
	}
	if w.GMM > 0 {
		t := math.Tan(w.HeelDeg * math.Pi / 180)
		if drop := w.BMM * t * t / 2; drop > HandUsableDropPart*w.GMM {
			why = append(why, fmt.Sprintf("the wall-sided term it leaves out (½·BM·tan²θ = %.3f m) is %.0f %% of its GM of %.3f m, above the %.0f %% it bears", drop, 100*drop/w.GMM, w.GMM, 100*HandUsableDropPart))
		}
	}
	switch len(why) {
	case 0:
		return ""
	case 1:
		return why[0]
	}
	s := why[0]
	for _, x := range why[1 : len(why)-1] {
		s += "; " + x
	}
	return s + "; and " + why[len(why)-1]
}

// Usable reports whether the hand answer is within the method's range
// (Unusable is "").
func (w *HandWorking) Usable() bool { return w.Unusable() == "" }

// markUsable ends a finished working with a line saying that its answer is
// not usable, where it is not, so that every screen that shows the working
// shows that too.
func markUsable(w *HandWorking, err error) (*HandWorking, error) {
	if err != nil || w == nil {
		return w, err
	}
	if why := w.Unusable(); why != "" {
		w.step("NOT USABLE: the hand answer", why+": read the direct answer", w.HeelDeg, "°")
	}
	return w, nil
}
