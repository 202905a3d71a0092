package engine_test

// The righting options against closed forms on box barges: the heel after
// ballast, pumping or a transfer from the wall-sided formula with the new
// weight, centre and free surface worked by hand; the loll rule (never
// ballast the high side); no action for a ship floating upright; a holed
// tank never a candidate; and the bounds on the bundled ship.

import (
	"math"
	"math/rand"
	"strings"
	"testing"

	"heelwatch/engine"
)

// remedyBarge is a box barge 80 × 16 × 8 m with tanks whose boxes lie
// inside the shell, so that each is an exact box: wing tanks 20 × 2 × 7 m
// each side on double-bottom tanks 40 × 8 × 1 m each side, all sea-water
// ballast at the fills given (P, S wing; P, S double bottom), and one
// weight of 4592 t at (40, tcg, kg).
type remedyBarge struct {
	tcg, kg                float64
	wingP, wingS, dbP, dbS float64
}

const (
	rbL, rbB, rbD = 80.0, 16.0, 8.0
	rbMass        = 4592.0
	rbRho         = 1.025
	rbMu          = 0.95 // the tanks' permeability, also their capacity's share of the box (conventions)
)

// rbTank is a tank of the barge: its box and index.
var rbTanks = []struct {
	name string
	box  engine.Box
}{
	{"Wing P", engine.Box{X0: 30, X1: 50, Y0: -8, Y1: -6, Z0: 1, Z1: 8}},
	{"Wing S", engine.Box{X0: 30, X1: 50, Y0: 6, Y1: 8, Z0: 1, Z1: 8}},
	{"DB P", engine.Box{X0: 20, X1: 60, Y0: -8, Y1: 0, Z0: 0, Z1: 1}},
	{"DB S", engine.Box{X0: 20, X1: 60, Y0: 0, Y1: 8, Z0: 0, Z1: 1}},
}

func (rb remedyBarge) fills() []float64 { return []float64{rb.wingP, rb.wingS, rb.dbP, rb.dbS} }

func (rb remedyBarge) vessel(t *testing.T) *engine.Vessel {
	t.Helper()
	h, err := engine.NewBoxHull(rbL, rbB, rbD)
	if err != nil {
		t.Fatal(err)
	}
	var cs []*engine.Compartment
	for i, tk := range rbTanks {
		c, err := engine.NewCompartment(h, tk.name, tk.box)
		if err != nil {
			t.Fatal(err)
		}
		c.Use, c.Permeability = "tank", rbMu
		c.Liquid = &engine.Liquid{Name: "sea water ballast", Density: rbRho, Fill: rb.fills()[i]}
		cs = append(cs, c)
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "remedy barge", WaterDensity: rbRho, Hull: h,
		Weights:      []engine.Weight{{Name: "all", MassT: rbMass, LCGM: 40, TCGM: rb.tcg, VCGM: rb.kg}},
		Compartments: cs})
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// rbClosedForm works the barge by hand at the given tank fills: each tank a
// box of level liquid, its centre at the middle of the box in plan and at
// half the liquid's depth; its capacity μ·l·b·d and its free-surface
// moment μ·ρ·l·b³/12 when slack (fill below 98 %, the pressed-full
// convention; a rectangle, practice), μ the permeability (conventions:
// capacity = μ × volume, so the liquid stands at fill × d).
// Then Δ, KG, TCG and the free-surface correction; the box's level draft
// T = Δ/(ρLB), KB = T/2, BM = B²/(12T) (practice), the fluid GM upright
// GM = KB + BM − KG − ΣFSM/Δ; and the heel from the wall-sided formula
// (Barrass & Derrett, Ship Stability for Masters and Mates, p.130, found):
// GZ = sin θ (GM + ½BM tan²θ) − TCG cos θ = 0, i.e. the cubic
// GM·tanθ + ½BM·tan³θ = TCG, solved by bisection. With GM < 0 and TCG = 0
// the root taken is the angle of loll to starboard, tanθ = √(−2GM/BM).
// All tanks sit at x = 40 m with the weight, so she has no trim.
func rbClosedForm(rb remedyBarge, fills []float64) (heelDeg, gm, draft float64) {
	m, my, mz, fsm := rbMass, rbMass*rb.tcg, rbMass*rb.kg, 0.0
	for i, tk := range rbTanks {
		b := tk.box
		l, w, d := b.X1-b.X0, b.Y1-b.Y0, b.Z1-b.Z0
		f := fills[i]
		if f <= 0 {
			continue
		}
		mt := rbRho * f * rbMu * l * w * d
		m += mt
		my += mt * (b.Y0 + b.Y1) / 2
		mz += mt * (b.Z0 + f*d/2)
		if f < engine.PressedFullFill {
			fsm += rbMu * rbRho * l * w * w * w / 12
		}
	}
	kg, tcg := mz/m, my/m
	T := m / (rbRho * rbL * rbB)
	bm := rbB * rbB / (12 * T)
	gm = T/2 + bm - kg - fsm/m
	lever := func(tn float64) float64 { return gm*tn + bm*tn*tn*tn/2 - tcg }
	lo, hi := -2.0, 2.0
	if tcg == 0 && gm < 0 {
		lo = 1e-9 // the loll to starboard
	}
	for i := 0; i < 200; i++ {
		mid := (lo + hi) / 2
		if (lever(mid) > 0) == (lever(hi) > 0) {
			hi = mid
		} else {
			lo = mid
		}
	}
	return math.Atan((lo+hi)/2) * 180 / math.Pi, gm, T
}

// rbIndex returns the index of the barge's tank of that name.
func rbIndex(name string) int {
	for i, tk := range rbTanks {
		if tk.name == name {
			return i
		}
	}
	panic("no tank " + name)
}

// TestRemedyWallSided checks every option worked out for a listed barge
// against the wall-sided heel and the box's upright GM of the condition it
// leaves, worked by hand from its fills.
func TestRemedyWallSided(t *testing.T) {
	tests := []struct {
		name      string
		rb        remedyBarge
		wantKinds []engine.RemedyKind // kinds that must be among the options
		heelTol   float64             // degrees
		gmTol     float64             // m
	}{
		// A weight 0.08 m to starboard; all tanks empty: only ballast on the
		// port side helps (nothing to pump out or move).
		{"empty tanks", remedyBarge{tcg: 0.08, kg: 5.0}, []engine.RemedyKind{engine.RemedyFill}, 1e-6, 1e-9},
		// Wing tanks half full: ballast port, pump out starboard, or move
		// starboard's water across to port (slack tanks left behind carry
		// their free surface).
		{"wing tanks half full", remedyBarge{tcg: 0.08, kg: 5.0, wingP: 0.5, wingS: 0.5},
			[]engine.RemedyKind{engine.RemedyFill, engine.RemedyDischarge, engine.RemedyTransfer}, 1e-6, 1e-9},
		// Listed to port by the double bottom on that side; transfer across.
		{"double bottom port full", remedyBarge{tcg: 0.0, kg: 5.2, dbP: 1.0, dbS: 0.1},
			[]engine.RemedyKind{engine.RemedyFill, engine.RemedyDischarge, engine.RemedyTransfer}, 1e-6, 1e-9},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			v := tc.rb.vessel(t)
			rs := engine.FindRemedies(v, v.Intact())
			if rs.Position == nil || !rs.Needed || rs.Loll {
				t.Fatalf("want a list needing action; got needed %v, loll %v, %s", rs.Needed, rs.Loll, rs.Summary)
			}
			// The present heel, worked by hand (wall-sided, Barrass & Derrett p.130).
			h0, gm0, _ := rbClosedForm(tc.rb, tc.rb.fills())
			if math.Abs(rs.HeelDeg-h0) > tc.heelTol || math.Abs(rs.UprightGMM-gm0) > tc.gmTol {
				t.Fatalf("now: heel %.9f°, GM₀ %.9f m; closed form %.9f°, %.9f m", rs.HeelDeg, rs.UprightGMM, h0, gm0)
			}
			kinds := map[engine.RemedyKind]bool{}
			for _, o := range rs.Options {
				kinds[o.Kind] = true
				fills := tc.rb.fills()
				for k, i := range o.Tanks {
					if math.Abs(fills[i]-o.FillBefore[k]) > 1e-12 {
						t.Errorf("%s: fill before of %s %v, want %v", o.Action, o.TankNames[k], o.FillBefore[k], fills[i])
					}
					fills[i] = o.FillAfter[k]
				}
				// The mass moved is the change of the liquid in the tanks.
				var dm float64
				for k, i := range o.Tanks {
					b := rbTanks[i].box
					dm += math.Abs(o.FillAfter[k]-o.FillBefore[k]) * rbRho * rbMu * (b.X1 - b.X0) * (b.Y1 - b.Y0) * (b.Z1 - b.Z0)
				}
				if o.Kind == engine.RemedyTransfer {
					dm /= 2
				}
				if math.Abs(dm-o.MassT) > 1e-9*dm {
					t.Errorf("%s: mass %v t, the fills give %v t", o.Action, o.MassT, dm)
				}
				if o.Position == nil {
					t.Errorf("%s: no position: %v", o.Action, o.NoEq)
					continue
				}
				heel, gm, draft := rbClosedForm(tc.rb, fills)
				if d := math.Abs(o.Position.HeelDeg - heel); d > tc.heelTol {
					t.Errorf("%s: heel %.9f°, wall-sided formula %.9f° (off by %.2g°)", o.Action, o.Position.HeelDeg, heel, d)
				}
				if d := math.Abs(o.UprightGMM - gm); d > tc.gmTol {
					t.Errorf("%s: upright GM %.9f m, box closed form %.9f m", o.Action, o.UprightGMM, gm)
				}
				// Level draft of the box (practice): the drafts at the heel are
				// read on the centreline, where the waterline stays at T.
				if d := math.Abs(o.Position.DraftMidM - draft); d > 1e-9 || math.Abs(o.Position.TrimM) > 1e-9 {
					t.Errorf("%s: draft %.9f m, trim %.2g m; closed form %.9f m, no trim", o.Action, o.Position.DraftMidM, o.Position.TrimM, draft)
				}
				// Ballast and transfers go to the high side only (port side up
				// means weight to port).
				high := -1.0
				if rs.HeelDeg < 0 {
					high = 1
				}
				if o.Kind != engine.RemedyDischarge {
					to := rbTanks[o.Tanks[len(o.Tanks)-1]].box
					if (to.Y0+to.Y1)/2*high <= 0 {
						t.Errorf("%s: fills a tank that is not on the high side", o.Action)
					}
				}
			}
			for _, k := range tc.wantKinds {
				if !kinds[k] {
					t.Errorf("no %s option among %d", k, len(rs.Options))
				}
			}
		})
	}
}

// TestRemedyToUpright checks that when ballasting the high side to 98 %
// overshoots, the smaller amount offered leaves her nearer upright than
// either, and that the options are ranked by the heel left, advisable
// first.
func TestRemedyToUpright(t *testing.T) {
	rb := remedyBarge{tcg: 0.08, kg: 5.0}
	v := rb.vessel(t)
	rs := engine.FindRemedies(v, v.Intact())
	var full, part *engine.Remedy
	for i := range rs.Options {
		o := &rs.Options[i]
		if o.Kind == engine.RemedyFill && o.Tanks[0] == rbIndex("Wing P") {
			if o.ToUpright {
				part = o
			} else {
				full = o
			}
		}
	}
	if full == nil || part == nil {
		t.Fatalf("want Wing P filled full and until upright; options: %d", len(rs.Options))
	}
	// 0.98·280 m³ of sea water at 7 m to port against 367 t·m to starboard:
	// by hand she comes to TCG = (4592·0.08 − 281.3·7)/4873.3 = −0.33 m, to
	// port (moment balance, practice).
	if full.Position.HeelDeg > -1 {
		t.Fatalf("Wing P full: heel %.3f°, want an overshoot to port", full.Position.HeelDeg)
	}
	if h := math.Abs(part.Position.HeelDeg); h > 0.1 || part.MassT >= full.MassT {
		t.Errorf("until upright: %.3f° with %.1f t (full %.1f t), want within 0.1° with less", part.Position.HeelDeg, part.MassT, full.MassT)
	}
	if !strings.Contains(part.Note, "slack") {
		t.Errorf("until upright note %q does not mention the slack tank", part.Note)
	}
	for i := 1; i < len(rs.Options); i++ {
		a, b := rs.Options[i-1], rs.Options[i]
		if !a.Advisable && b.Advisable {
			t.Errorf("option %d (%s) not advisable ranks above advisable %s", i, a.Action, b.Action)
		}
		if a.Advisable == b.Advisable && (a.FreeboardLossM > engine.RemedyFreeboardLossM) == (b.FreeboardLossM > engine.RemedyFreeboardLossM) &&
			math.Abs(a.Position.HeelDeg) > math.Abs(b.Position.HeelDeg) {
			t.Errorf("option %d (%s, %.2f°) ranks above %s (%.2f°)", i, a.Action, a.Position.HeelDeg, b.Action, b.Position.HeelDeg)
		}
	}
	if f := rs.Options[0]; !f.Advisable || math.Abs(f.Position.HeelDeg) > math.Abs(part.Position.HeelDeg) {
		t.Errorf("first option %q (%.3f°), want one at least as near upright as %q", f.Action, f.Position.HeelDeg, part.Action)
	}
}

// TestRemedyLoll checks the rule for a loll (upright GM negative): never
// ballast or move liquid to the high side (common bridge and damage-control
// practice: weight on the high side of a lolling ship makes her flop over
// to that side, perhaps further); offer ballast low on the low side, and
// say so plainly. The present heel is the angle of loll of the wall-sided
// formula, tanθ = √(−2GM/BM) (Barrass & Derrett p.130, found), and the
// upright GM after ballasting the low double bottom is the box's closed
// form. Then seeded random lolls to either side keep the rule.
func TestRemedyLoll(t *testing.T) {
	rb := remedyBarge{kg: 7.9, wingP: 0, wingS: 0}
	v := rb.vessel(t)
	rs := engine.FindRemedies(v, v.Intact())
	if !rs.Loll || !rs.Needed {
		t.Fatalf("want a loll; got %s", rs.Summary)
	}
	h0, gm0, _ := rbClosedForm(rb, rb.fills())
	if gm0 >= 0 || math.Abs(rs.HeelDeg-h0) > 1e-6 || math.Abs(rs.UprightGMM-gm0) > 1e-9 {
		t.Fatalf("loll %.9f° with GM₀ %.9f m; closed form %.9f°, %.9f m", rs.HeelDeg, rs.UprightGMM, h0, gm0)
	}
	if !strings.Contains(rs.Summary, "Do not counter-ballast the high (port) side") {
		t.Errorf("summary does not say plainly not to ballast the high side: %q", rs.Summary)
	}
	var db *engine.Remedy
	for i := range rs.Options {
		if o := &rs.Options[i]; o.Kind == engine.RemedyFill && o.Tanks[0] == rbIndex("DB S") {
			db = o
		}
	}
	if db == nil {
		t.Fatalf("no option ballasts the low (starboard) double bottom")
	}
	fills := rb.fills()
	fills[rbIndex("DB S")] = db.FillAfter[0]
	heel, gm, _ := rbClosedForm(rb, fills)
	if math.Abs(db.UprightGMM-gm) > 1e-9 || !(gm > gm0) {
		t.Errorf("DB S ballasted: upright GM %.9f m, box closed form %.9f m (from %.3f m)", db.UprightGMM, gm, gm0)
	}
	if math.Abs(db.Position.HeelDeg-heel) > 1e-6 {
		t.Errorf("DB S ballasted: heel %.9f°, wall-sided formula %.9f°", db.Position.HeelDeg, heel)
	}
	if !db.Advisable || !strings.Contains(db.Note, "Halfway") {
		t.Errorf("DB S: advisable %v, note %q: want advisable with the slack state worked", db.Advisable, db.Note)
	}

	// Random lolls: a small off-centre weight either way, slack wing tanks
	// nearly alike, the double bottoms both empty or both pressed full (a
	// slack double bottom of this size carries some 1 750 t·m of free
	// surface, and a full one on one side some 1 300 t·m of heeling moment:
	// either capsizes her), and the weight's height set so that the upright
	// GM by hand is between −0.25 and −0.02 m (GM falls linearly with that
	// height).
	rng := rand.New(rand.NewSource(7))
	lolls := 0
	for k := 0; k < 8; k++ {
		w, db := 0.6*rng.Float64(), float64(rng.Intn(2))
		rb := remedyBarge{tcg: 0.04 * (rng.Float64() - 0.5),
			wingP: w, wingS: math.Max(0, w+0.05*(rng.Float64()-0.5)), dbP: db, dbS: db}
		_, g0, _ := rbClosedForm(rb, rb.fills())
		rb.kg = 1
		_, g1, _ := rbClosedForm(rb, rb.fills())
		rb.kg = (g0 + 0.02 + 0.23*rng.Float64()) / (g0 - g1)
		v := rb.vessel(t)
		rs := engine.FindRemedies(v, v.Intact())
		_, gm, _ := rbClosedForm(rb, rb.fills())
		if rs.Position == nil {
			t.Errorf("case %d %+v: no floating position: %s", k, rb, rs.Summary)
			continue
		}
		if !rs.Loll {
			if gm < 0 {
				t.Errorf("case %d %+v: GM₀ %.3f m by hand but no loll found: %s", k, rb, gm, rs.Summary)
			}
			continue
		}
		lolls++
		highSign := -1.0 // she lolls to starboard: port is up
		if rs.HeelDeg < 0 {
			highSign = 1
		}
		for _, o := range rs.Options {
			if o.Kind == engine.RemedyTransfer {
				t.Errorf("case %d: a transfer is offered in a loll: %s", k, o.Action)
			}
			if o.Kind == engine.RemedyFill {
				b := rbTanks[o.Tanks[0]].box
				if (b.Y0+b.Y1)/2*highSign > 0 {
					t.Errorf("case %d (heel %.2f°): ballasts the high side: %s", k, rs.HeelDeg, o.Action)
				}
			}
			if o.Advisable && !(o.UprightGMM > rs.UprightGMM) {
				t.Errorf("case %d: %s advisable but upright GM %.3f m not above %.3f m", k, o.Action, o.UprightGMM, rs.UprightGMM)
			}
		}
		if rs.Solves > engine.RemedyMaxSolves {
			t.Errorf("case %d: %d solves, bound %d", k, rs.Solves, engine.RemedyMaxSolves)
		}
	}
	if lolls < 4 {
		t.Errorf("only %d of the random cases loll: the test proves little", lolls)
	}
}

// TestRemedyNoneNeeded checks that a symmetric condition with positive GM
// floats upright and gets no options (symmetry: no heeling moment, so
// nothing to right).
func TestRemedyNoneNeeded(t *testing.T) {
	tests := []struct {
		name string
		rb   remedyBarge
	}{
		{"empty", remedyBarge{kg: 5.0}},
		{"symmetric slack tanks", remedyBarge{kg: 5.0, wingP: 0.4, wingS: 0.4, dbP: 0.7, dbS: 0.7}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			v := tc.rb.vessel(t)
			rs := engine.FindRemedies(v, v.Intact())
			if rs.Needed || rs.Loll || len(rs.Options) != 0 || math.Abs(rs.HeelDeg) > 1e-9 {
				t.Errorf("needed %v, loll %v, %d options, heel %g°: want none needed upright", rs.Needed, rs.Loll, len(rs.Options), rs.HeelDeg)
			}
			if !strings.Contains(rs.Summary, "no righting action is needed") {
				t.Errorf("summary %q", rs.Summary)
			}
		})
	}
}

// TestRemedyHoledTankNotUsed opens a tank to the sea and checks that it is
// never a candidate, nor is one holding floodwater (the brief's rule:
// a damaged tank's contents and level are the sea's).
func TestRemedyHoledTankNotUsed(t *testing.T) {
	rb := remedyBarge{kg: 5.0, wingP: 0.3, wingS: 0.3}
	v := rb.vessel(t)
	tests := []struct {
		name string
		set  func(d engine.Damage)
		out  []int
	}{
		{"wing S open", func(d engine.Damage) { d[rbIndex("Wing S")].Open = true }, []int{rbIndex("Wing S")}},
		{"DB S holds water", func(d engine.Damage) { d[rbIndex("DB S")].WaterM3 = 150 }, []int{rbIndex("DB S")}},
		{"wing S open, DB S holds water", func(d engine.Damage) {
			d[rbIndex("Wing S")].Open = true
			d[rbIndex("DB S")].WaterM3 = 40
		}, []int{rbIndex("Wing S"), rbIndex("DB S")}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			d := v.Intact()
			tc.set(d)
			rs := engine.FindRemedies(v, d)
			if !rs.Needed || len(rs.Options) == 0 {
				t.Fatalf("want options for the damaged barge; %s", rs.Summary)
			}
			for _, o := range rs.Options {
				for _, i := range o.Tanks {
					for _, bad := range tc.out {
						if i == bad {
							t.Errorf("%s uses damaged tank %s", o.Action, rbTanks[i].name)
						}
					}
				}
			}
		})
	}
}

// TestRemedyBundled runs the options on the bundled ship (an invented demo
// vessel) holed in a wing tank: bounded work, figures finite, the holed
// tank left alone, and the first option advisable and nearer upright.
func TestRemedyBundled(t *testing.T) {
	for _, open := range [][]string{{"Wing tank 2 S"}, {"Wing tank 2 S", "DB 2 S"}, {"Wing tank 1 P"}} {
		t.Run(strings.Join(open, "+"), func(t *testing.T) {
			v, d := refBundledDamaged(t, open...)
			rs := engine.FindRemedies(v, d)
			if !rs.Needed || rs.Loll || len(rs.Options) == 0 {
				t.Fatalf("needed %v, loll %v, %d options: %s", rs.Needed, rs.Loll, len(rs.Options), rs.Summary)
			}
			if rs.Solves > engine.RemedyMaxSolves {
				t.Errorf("%d solves, bound %d", rs.Solves, engine.RemedyMaxSolves)
			}
			first := rs.Options[0]
			if !first.Advisable || math.Abs(first.Position.HeelDeg) >= math.Abs(rs.HeelDeg) {
				t.Errorf("first option %s: advisable %v, heel %.2f° (now %.2f°)", first.Action, first.Advisable, first.Position.HeelDeg, rs.HeelDeg)
			}
			for _, o := range rs.Options {
				for _, i := range o.Tanks {
					if d[i].Open {
						t.Errorf("%s uses the holed %s", o.Action, v.Compartments[i].Name)
					}
				}
				if o.Position == nil {
					continue
				}
				for _, x := range []float64{o.MassT, o.Position.HeelDeg, o.Position.TrimM, o.Position.GMM, o.UprightGMM, o.Position.DeckEdge.HeightM} {
					if math.IsNaN(x) || math.IsInf(x, 0) {
						t.Errorf("%s: a figure is not finite: %v", o.Action, x)
					}
				}
				if o.Note == "" || o.Action == "" {
					t.Errorf("option without words: %+v", o)
				}
			}
		})
	}
}

// BenchmarkRemedies times one call of FindRemedies on the bundled ship
// holed in Wing tank 2 S. Run with
//
//	go test ./engine -run '^$' -bench Remedies -cpu 1 -count 3
func BenchmarkRemedies(b *testing.B) {
	v, d := refBundledDamaged(b, "Wing tank 2 S")
	rs := engine.FindRemedies(v, d)
	if len(rs.Options) == 0 {
		b.Fatal(rs.Summary)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		engine.FindRemedies(v, d)
	}
	b.ReportMetric(float64(rs.Solves), "solves/op")
}
