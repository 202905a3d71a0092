package engine_test

import (
	"math"
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// TestHandUsableWallSided: a box barge 80 × 16 × 8 m at 4 m draft with a
// centreline space open amidships (a vertical prism through the
// waterline: the damaged body stays wall-sided) and G off the centreline.
// On a wall-sided body the direct answer obeys the wall-sided formula
// tan θ·(GM + ½·BM·tan²θ) = lever (Barrass & Derrett, wall-sided formula)
// with the lost-buoyancy GM and BM, while the hand answer is its
// small-angle limit lever/GM: the two part by the factor 1 + ½·BM·tan²θ/GM,
// checked here, which is what HandUsableDropPart bounds. With KG 7.0 m
// (GM about 0.38 m) a lever of 5 cm keeps the left-out term under a quarter
// of GM (usable) and one of 9 cm takes it over at a heel under 20° (not
// usable, and the flag says so at danger).
func TestHandUsableWallSided(t *testing.T) {
	b := flagBarge{80, 16, 8, 4, 7.0}
	for _, c := range []struct {
		tcg    float64
		usable bool
	}{{0.05, true}, {0.09, false}} {
		v := b.vessel(t, b.L/2, c.tcg, nil, handSpec{"centre void", engine.Box{X0: 36, X1: 44, Y0: -2, Y1: 2, Z0: 0, Z1: 8}, 1, nil})
		fl, pos, hw := flagRun(t, v, handOpen(v, 0))
		if hw == nil || pos == nil {
			t.Fatal("no hand or direct answer")
		}
		tHand, tDir := math.Tan(hw.HeelDeg*flagDeg), math.Tan(pos.HeelDeg*flagDeg)
		if want := 1 + hw.BMM*tDir*tDir/(2*hw.GMM); math.Abs(tHand/tDir-want) > 1e-6*want {
			t.Errorf("TCG %.2f: tan ratio hand/direct %.8f, wall-sided %.8f", c.tcg, tHand/tDir, want)
		}
		if math.Abs(hw.HeelDeg) >= engine.HandUsableHeelDeg || hw.GMM < engine.HandUsableGMM {
			t.Fatalf("TCG %.2f: hand heel %.2f°, GM %.3f m: the case tests the left-out term only", c.tcg, hw.HeelDeg, hw.GMM)
		}
		if hw.Usable() != c.usable {
			t.Errorf("TCG %.2f (hand %.2f°, direct %.2f°, GM %.3f m): usable %v, want %v (%s)", c.tcg, hw.HeelDeg, pos.HeelDeg, hw.GMM, hw.Usable(), c.usable, hw.Unusable())
		}
		got := flagFind(fl, engine.FlagPastSmallAngles)
		if c.usable {
			for _, f := range got {
				if f.Severity == engine.Danger {
					t.Errorf("TCG %.2f: usable, but %q", c.tcg, f.Message)
				}
			}
			continue
		}
		if len(got) != 1 || got[0].Severity != engine.Danger || !strings.HasPrefix(got[0].Message, "The hand answer is not usable here: the wall-sided term") {
			t.Errorf("TCG %.2f: flags %v", c.tcg, got)
		}
		if last := hw.Steps[len(hw.Steps)-1]; !strings.Contains(last.Label, "NOT USABLE") {
			t.Errorf("TCG %.2f: the working ends %q: want it to say the answer is not usable", c.tcg, last.Label)
		}
	}
}

// TestHandUsableLimits: the three limits on a working, figure by figure
// (heelwatch's own limits; HandUsableHeelDeg documents them).
func TestHandUsableLimits(t *testing.T) {
	for _, c := range []struct {
		name       string
		w          engine.HandWorking
		usable     bool
		wordsIfNot string
	}{
		{"19.9° with a stiff GM", engine.HandWorking{GMM: 2, BMM: 3, HeelDeg: 19.9}, true, ""},
		{"20.1° with a stiff GM", engine.HandWorking{GMM: 2, BMM: 3, HeelDeg: -20.1}, false, "beyond the 20°"},
		{"GM 4 cm, upright", engine.HandWorking{GMM: 0.04, BMM: 3}, false, "next to nothing"},
		{"GM negative", engine.HandWorking{GMM: -0.1, BMM: 3, HeelDeg: 8}, false, "no small-angle list"},
		{"GM unknown", engine.HandWorking{GMM: math.NaN(), BMM: 3}, false, "could not be worked out"},
		{"12° on GM 0.2 m, BM 4 m", engine.HandWorking{GMM: 0.2, BMM: 4, HeelDeg: 12}, false, "wall-sided term"},
	} {
		why := c.w.Unusable()
		if (why == "") != c.usable || c.w.Usable() != c.usable {
			t.Errorf("%s: %q, want usable %v", c.name, why, c.usable)
		}
		if !c.usable && !strings.Contains(why, c.wordsIfNot) {
			t.Errorf("%s: %q lacks %q", c.name, why, c.wordsIfNot)
		}
	}
	var none *engine.HandWorking
	if !none.Usable() {
		t.Error("no working: nothing to call not usable")
	}
}

// TestFlagPastSmallAnglesSaysWhatParts: the freighter with her engine room
// open lies upright, 3.0 m by the stern; the hand method's trim (a small
// angle on the level waterplane's MCTC) is 3.2 m. The flag must say that
// the drafts part through the trim and that the heel agrees, not speak of
// a heel "beyond the small angles".
func TestFlagPastSmallAnglesSaysWhatParts(t *testing.T) {
	v, _, err := vessels.Open("freighter")
	if err != nil {
		t.Fatal(err)
	}
	d := v.Intact()
	for i, c := range v.Compartments {
		if c.Name == "Engine room" {
			d[i].Open = true
		}
	}
	fl, pos, hw := flagRun(t, v, d)
	if hw == nil || pos == nil || math.Abs(pos.HeelDeg) > 0.005 || math.Abs(hw.TrimM-pos.TrimM) < 0.1 {
		t.Fatalf("hand %v, direct %v: the case does not test what it says", hw, pos)
	}
	flagExpect(t, "engine room", fl, engine.FlagPastSmallAngles, true, "the drafts by up to", "(trim 3.20 m by the stern by hand against 3.01 m by the stern direct)", "the heel agrees (upright, both)", "the trim as a small angle")
	if f := flagFind(fl, engine.FlagPastSmallAngles); len(f) == 1 && (strings.Contains(f[0].Message, "small angles the hand method assumes") || f[0].Severity != engine.Caution) {
		t.Errorf("%s: %q", f[0].Severity, f[0].Message)
	}
}
