package engine_test

import (
	"fmt"

	"heelwatch/engine"
)

// An invented box barge, 80 m × 16 m × 8 m, carrying 4592 t with G at 5.6 m
// above the keel, amidships. By hand (box closed forms, practice): draft
// T = 4592 / (1.025·80·16) = 3.5 m, KB = T/2 = 1.75 m, BM = B²/12T =
// 6.095 m, so GM = KB + BM − KG = 2.245 m.
func ExampleSolve() {
	hull, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		panic(err)
	}
	v, err := engine.NewVessel(engine.Vessel{
		Name:    "Demo barge (invented)",
		Hull:    hull,
		Weights: []engine.Weight{{Name: "Lightship and cargo", MassT: 4592, LCGM: 40, VCGM: 5.6}},
	})
	if err != nil {
		panic(err)
	}
	pos, err := engine.Solve(v, v.Intact())
	if err != nil {
		panic(err)
	}
	fmt.Printf("draft %.3f m, heel %.1f°, KB %.3f m, BM %.3f m, GM %.3f m\n", pos.DraftMidM, pos.HeelDeg, pos.VCBM, pos.BMTM, pos.GMM)
	// Output:
	// draft 3.500 m, heel 0.0°, KB 1.750 m, BM 6.095 m, GM 2.245 m
}

// The same barge with a wing void on the starboard side, 12 m long and
// 4 m wide, open to the sea (lost buoyancy): she sinks, trims by neither
// end (the void is amidships) and lists to starboard. The small-angle hand
// estimate of the sinkage, lost volume over the intact waterplane
// (0.95·12·4·3.5 / (1280 − 0.95·48) = 0.129 m), is a little less than the
// 0.154 m rise on the centreline that the direct solution finds at 6.5°.
func ExampleSolve_damaged() {
	hull, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		panic(err)
	}
	void, err := engine.NewCompartment(hull, "3 wing void S", engine.Box{X0: 34, X1: 46, Y0: 4, Y1: 8, Z0: 0, Z1: 8})
	if err != nil {
		panic(err)
	}
	void.Use, void.Permeability = "void", 0.95
	v, err := engine.NewVessel(engine.Vessel{
		Name:         "Demo barge (invented)",
		Hull:         hull,
		Weights:      []engine.Weight{{Name: "Lightship and cargo", MassT: 4592, LCGM: 40, VCGM: 5.6}},
		Compartments: []*engine.Compartment{void},
	})
	if err != nil {
		panic(err)
	}
	pos, err := engine.Solve(v, engine.Damage{{Open: true}})
	if err != nil {
		panic(err)
	}
	fmt.Printf("drafts aft %.3f m, mid %.3f m, fwd %.3f m; heel %.2f° to starboard; GM %.3f m\n",
		pos.DraftAftM, pos.DraftMidM, pos.DraftFwdM, pos.HeelDeg, pos.GMM)
	fmt.Printf("least freeboard to the deck edge %.3f m, %s side\n", pos.DeckEdge.HeightM, pos.DeckEdge.Side)
	// Output:
	// drafts aft 3.654 m, mid 3.654 m, fwd 3.654 m; heel 6.47° to starboard; GM 2.040 m
	// least freeboard to the deck edge 3.416 m, starboard side
}
