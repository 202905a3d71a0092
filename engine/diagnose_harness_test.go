package engine_test

// The hidden-truth harness: random damage cases of the bundled ships (our
// own invented demo vessels) are solved by the engine, read as a crew would
// read them, and diagnosed; the diagnosis never sees the truth. It counts
// how often the truth ranks first and in the first three.
//
// The crew's reading (practice): each mark read with an error uniform in
// ±1 cm and written to the centimetre; the inclinometer with an error
// uniform in ±0.2°. Seeded, so a run is repeatable.
//
//	go test ./engine -run TestDiagnoseHiddenTruth -v                  (the quick run in go test ./...)
//	go test ./engine -run TestDiagnoseHiddenTruth -v -diagnose.cases 200   (a longer run)

import (
	"flag"
	"math"
	"math/rand"
	"sort"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

var diagnoseCases = flag.Int("diagnose.cases", 0, "hidden-truth cases per ship and kind (0: the quick default)")

// crewReading returns what the crew would read of pos: every mark that
// reads, and the inclinometer.
func crewReading(v *engine.Vessel, pos engine.Position, minutes float64, rng *rand.Rand) engine.Reading {
	r := engine.Reading{Minutes: minutes, HasHeel: true}
	r.HeelDeg = math.Round((pos.HeelDeg+(2*rng.Float64()-1)*0.2)*10) / 10
	for i, m := range engine.MarkDrafts(v.Hull, pos.Plane, v.DraftMarks) {
		if m.State != engine.MarkReads {
			continue
		}
		d := math.Round((m.DraftM+(2*rng.Float64()-1)*0.01)*100) / 100
		r.Drafts = append(r.Drafts, engine.MarkReading{Mark: i, DraftM: d})
	}
	return r
}

// truthCase is one hidden damage state.
type truthCase struct {
	set []int
	d   engine.Damage
}

// searchable lists the compartments a diagnosis searches: all but tanks
// pressed full of sea water (a hole below the water changes nothing).
func searchable(v *engine.Vessel) []int {
	var out []int
	for i, c := range v.Compartments {
		if l := c.Liquid; l != nil && l.Fill >= engine.PressedFullFill && math.Abs(l.Density-v.WaterDensity) < 0.01 {
			continue
		}
		out = append(out, i)
	}
	return out
}

// randomCase draws a state of n compartments (n = 2: neighbours): each open
// to the sea (lost buoyancy) or holding a random part of its capacity, at a
// random permeability in [0.6, 0.98].
func randomCase(v *engine.Vessel, pool []int, nb [][]int, n int, rng *rand.Rand) truthCase {
	in := map[int]bool{}
	for _, i := range pool {
		in[i] = true
	}
	for {
		first := pool[rng.Intn(len(pool))]
		set := []int{first}
		if n == 2 {
			var cand []int
			for _, j := range nb[first] {
				if in[j] {
					cand = append(cand, j)
				}
			}
			if len(cand) == 0 {
				continue
			}
			set = append(set, cand[rng.Intn(len(cand))])
		}
		d := v.Intact()
		for _, ci := range set {
			mu := 0.6 + 0.38*rng.Float64()
			if rng.Float64() < 0.4 {
				d[ci] = engine.SpaceState{Open: true, Permeability: mu}
			} else {
				capM3 := mu * v.Compartments[ci].Volume()
				d[ci] = engine.SpaceState{Permeability: mu, WaterM3: capM3 * (0.1 + 0.9*rng.Float64())}
			}
		}
		sort.Ints(set)
		return truthCase{set, d}
	}
}

func sameSet(e engine.Explanation, set []int) bool {
	if len(e.Spaces) != len(set) {
		return false
	}
	for i, s := range e.Spaces {
		if s.Compartment != set[i] {
			return false
		}
	}
	return true
}

// harnessRates runs n cases of groups of size k on the bundled ship name
// and returns the fractions with the truth first and in the first three.
func harnessRates(t *testing.T, name string, k, n int, seed int64) (first, top3 float64, used, hidden int) {
	v, _, err := vessels.Open(name)
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewSource(seed))
	pool, nb := searchable(v), engine.Neighbours(v)
	var hit1, hit3 int
	intact, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	for used < n {
		tc := randomCase(v, pool, nb, k, rng)
		pos, err := engine.Solve(v, tc.d)
		if err != nil {
			continue // she sinks or capsizes: no readings to take
		}
		r := crewReading(v, pos, 0, rng)
		if len(r.Drafts) < 4 {
			continue
		}
		if !visible(v, intact, pos) {
			hidden++
			continue
		}
		used++
		dg, err := engine.Diagnose(v, []engine.Reading{r}, engine.DiagnoseOptions{MaxGroup: max(k, 2)})
		if err != nil {
			t.Fatal(err)
		}
		rank := -1
		for i, e := range dg.Explanations {
			if sameSet(e, tc.set) {
				rank = i
				break
			}
		}
		if rank == 0 {
			hit1++
		}
		if rank >= 0 && rank < 3 {
			hit3++
		}
		if rank != 0 && testing.Verbose() {
			var names []string
			for _, ci := range tc.set {
				names = append(names, v.Compartments[ci].Name)
			}
			best := "—"
			if len(dg.Explanations) > 0 {
				best = dg.Explanations[0].Names(v)
			}
			gap := math.NaN()
			if rank > 0 {
				gap = dg.Explanations[rank].Score - dg.Explanations[0].Score
			}
			t.Logf("%s: truth %v ranked %d; best %s (score gap %.1f)", name, names, rank+1, best, gap)
		}
	}
	return float64(hit1) / float64(n), float64(hit3) / float64(n), used, hidden
}

// visible reports whether a damaged position differs from the intact one
// by more than the crew can read: 2 cm at some mark or 0.3° of heel. A
// holed tank whose new water weighs what its contents did shows nothing:
// no reading can find it, and the harness does not count it.
func visible(v *engine.Vessel, intact, pos engine.Position) bool {
	a := engine.MarkDrafts(v.Hull, intact.Plane, v.DraftMarks)
	b := engine.MarkDrafts(v.Hull, pos.Plane, v.DraftMarks)
	for i := range a {
		if math.Abs(a[i].DraftM-b[i].DraftM) > 0.02 {
			return true
		}
	}
	return math.Abs(intact.HeelDeg-pos.HeelDeg) > 0.3
}

// TestDiagnoseHiddenTruth: over the bundled ships together, the truth must
// rank first in at least 90 % of single-compartment cases (issue 14's
// requirement, checked on the long run, -diagnose.cases 100 or more); the
// quick run in go test ./... has too few cases to tell 90 % from 85 % and
// holds the line at 80 %. The rates of pairs are reported. The misses are
// near-ties: spaces stacked one above the other (a store over a thruster
// room, a double bottom tank under the engine room) that marks and heel
// cannot tell apart and only a sounding can (the diagnosis says which).
func TestDiagnoseHiddenTruth(t *testing.T) {
	n, need := 5, 0.8
	if *diagnoseCases > 0 {
		n, need = *diagnoseCases, 0.9
	} else if testing.Short() {
		n = 3
	}
	var singles, singleHits float64
	for _, ship := range []string{"freighter", "barge", "ferry"} {
		for _, k := range []int{1, 2} {
			m := n
			if k == 2 && *diagnoseCases == 0 {
				m = max(n/2, 2)
			}
			first, top3, used, hidden := harnessRates(t, ship, k, m, int64(len(ship)*10+k))
			t.Logf("%s, %d compartment(s), %d cases (%d more invisible to the marks, not counted): truth first %.0f %%, in the first three %.0f %%", ship, k, used, hidden, 100*first, 100*top3)
			if k == 1 {
				singles += float64(used)
				singleHits += first * float64(used)
			}
		}
	}
	rate := singleHits / singles
	t.Logf("single compartments, all ships: truth first in %.1f %% of %.0f cases", 100*rate, singles)
	if rate < need {
		t.Errorf("single compartments: truth first in %.1f %%, below the %.0f %% required", 100*rate, 100*need)
	}
}
