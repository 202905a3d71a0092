package engine

import "math"

// Side names a side of the ship.
type Side int

const (
	Port      Side = -1
	Starboard Side = 1
	// Both: the two sides alike, as when she floats upright.
	Both Side = 0
)

func (s Side) String() string {
	switch s {
	case Port:
		return "port"
	case Both:
		return "both"
	}
	return "starboard"
}

// On names the side for a sentence: "the port side", "both sides".
func (s Side) On() string {
	if s == Both {
		return "both sides"
	}
	return "the " + s.String() + " side"
}

// Clearance is the least height of a line along the ship (the deck edge or
// the margin line) above the water: where and on which side.
type Clearance struct {
	HeightM float64 // above the water along the true vertical; negative: immersed
	XM      float64
	Side    Side
}

// StationFreeboard is the freeboard to the deck at side at one station.
type StationFreeboard struct {
	XM                   float64
	PortM, StarboardM    float64
	DeckZM, HalfBreadthM float64
}

// OpeningClearance is an opening's height above the water.
type OpeningClearance struct {
	Opening
	HeightM float64 // along the true vertical; negative: immersed
	// IntoFlooded: it leads into a compartment already flooded in this
	// state (open to the sea or holding water), so water through it
	// spreads no further: no point of progressive flooding.
	IntoFlooded bool
}

// Progressive reports whether the opening, once immersed, lets water
// spread further: it is not closed weathertight and does not lead into a
// compartment already flooded.
func (o OpeningClearance) Progressive() bool { return !o.Weathertight && !o.IntoFlooded }

// Immersed reports whether the opening is under water.
func (o OpeningClearance) Immersed() bool { return o.HeightM < 0 }

// Position is a solved floating position.
type Position struct {
	Plane Plane // the water surface in the ship frame

	DraftAftM, DraftMidM, DraftFwdM float64 // centreline, at AP, amidships, FP
	TrimM                           float64 // draft aft − draft forward
	HeelDeg                         float64 // positive starboard down

	// DisplacementT is the mass afloat, floodwater held included. On the
	// lost-buoyancy basis the sea water in compartments open to the sea is
	// not in it: it is the ship's weight without the water in open spaces
	// (OpenWaterT, beside it).
	DisplacementT float64
	OpenWaterT    float64 // sea water in the compartments open to the sea, t (μ × their part below the water × ρ)
	HeldWaterT    float64 // floodwater held as an added weight (in DisplacementT), t
	VolumeM3      float64 // displaced by the hull still buoyant

	LCBM, TCBM, VCBM float64 // centre of buoyancy
	LCGM, TCGM, KGM  float64 // centre of gravity (solid), floodwater held included
	FSCM             float64 // free-surface correction ΣFSM/Δ, m

	WaterplaneAreaM2 float64 // intact waterplane (lost parts removed), projected
	LCFM, TCFM       float64 // its centroid
	BMTM, BMLM       float64 // its second moments about its own centroidal axes ÷ V
	KMTM             float64 // KG + FSC + GM: upright, VCB + BMT
	GMM              float64 // metacentric height in this position, BMT − BG in the inclined waterplane, corrected for free surface (the solver's own test of stability)
	// GMUprightM is the upright GM of the condition (see UprightGM): she
	// brought upright at the same displacement and free trim, KM − KG − FSC.
	// It is what the screen and the reports call GM. NaN until filled in
	// (Solve, Assess, the flooding run's shown states, the righting
	// options). Like GMAtRestM it is on the lost-buoyancy basis, per the
	// ship's own weight: with floodwater held as an added weight the GM of
	// the whole is scaled by Δ/(Δ − HeldWaterT), the righting moment Δ·GM
	// kept (the two methods give the same moment of statical stability:
	// Barrass & Derrett, bilging), so that a flooded space shows one GM
	// whichever way it was solved.
	GMUprightM float64
	// GMAtRestM is the metacentric height where she lies: the slope of the
	// GZ curve at this heel (free trim, constant displacement), m/rad, from
	// the exact Jacobian (see gmAtRest), on the same basis. Equal to
	// GMUprightM when upright.
	GMAtRestM float64
	GMLM      float64 // longitudinal metacentric height, with the same free-surface correction

	DeckEdge   Clearance
	MarginLine Clearance
	Freeboards []StationFreeboard
	Openings   []OpeningClearance
	Held       []HeldWater // floodwater held in compartments not open to the sea

	Iterations int
}

// HeldWater is the floodwater in a compartment that is not open to the sea
// (the added-weight method): its volume and its free surface, level with
// the sea's attitude.
type HeldWater struct {
	Index    int     // into Vessel.Compartments
	VolumeM3 float64 // sea water held, m³
	Surface  Plane   // its free surface in the ship frame
}

// position works out everything reported at a solved state.
//
// GM in the final position: BMT − BG − FSC, where BMT = I_T/V with I_T the
// second moment of the waterplane still intact about its own centroidal axis
// along the ship's length, measured in the inclined plane, and BG the
// height of G above B along the true vertical. Upright this is
// KB + BM − KG − FSC, the ordinary fluid GM.
func (pr *Problem) position(s state, it int) Position {
	p := s.p
	h := pr.v.Hull
	L := h.LengthM
	W := pr.massT
	pos := Position{Plane: p, Iterations: it, DisplacementT: W}
	pos.DraftAftM = p.A
	pos.DraftMidM = p.A + p.B*L/2
	pos.DraftFwdM = p.A + p.B*L
	pos.TrimM = pos.DraftAftM - pos.DraftFwdM
	pos.HeelDeg = math.Atan(p.C) * 180 / math.Pi
	e := s.e
	pos.VolumeM3 = e.V
	pos.LCBM, pos.TCBM, pos.VCBM = e.Centroid()
	pos.LCGM, pos.TCGM, pos.KGM = s.gx[0], s.gx[1], s.gx[2]

	fsm := s.fsm
	for _, im := range s.heldIm {
		if im.AW > 0 {
			// Measured in the inclined free surface, as BMT is below.
			n := 1 + p.B*p.B + p.C*p.C
			fsm += pr.rho * (im.IYY - im.SY*im.SY/im.AW) * n / (1 + p.B*p.B) * math.Sqrt(n)
		}
	}
	pos.FSCM = fsm / W

	pos.WaterplaneAreaM2 = e.AW
	if e.AW > 0 && e.V > 0 {
		pos.LCFM, pos.TCFM = e.SX/e.AW, e.SY/e.AW
		it := e.IYY - e.AW*pos.TCFM*pos.TCFM
		il := e.IXX - e.AW*pos.LCFM*pos.LCFM
		b2, c2 := p.B*p.B, p.C*p.C
		n := 1 + b2 + c2
		// From the xy projection to the inclined plane: area scales by √n,
		// transverse distances by √(n/(1+B²)), longitudinal by √(n/(1+C²)).
		pos.BMTM = it * n / (1 + b2) * math.Sqrt(n) / e.V
		pos.BMLM = il * n / (1 + c2) * math.Sqrt(n) / e.V
		bg := ((pos.LCGM-pos.LCBM)*(-p.B) + (pos.TCGM-pos.TCBM)*(-p.C) + (pos.KGM - pos.VCBM)) / math.Sqrt(n)
		pos.GMM = pos.BMTM - bg - pos.FSCM
		// The trim balance carries G's virtual rise too (see eval).
		pos.GMLM = pos.BMLM - bg - pos.FSCM
		// KM as GM implies it: KG + FSC + GM (upright, VCB + BMT).
		pos.KMTM = pos.KGM + pos.FSCM + pos.GMM
	}
	pos.OpenWaterT = pr.openWaterT(p)
	pos.HeldWaterT = W - pr.load.MassT
	pos.GMUprightM = math.NaN()
	pos.GMAtRestM = gmAtRest(s, pos.GMM) * pr.shipBasis()
	if math.Abs(pos.HeelDeg) < 1e-9 {
		pos.GMUprightM = pos.GMM * pr.shipBasis()
		pos.GMAtRestM = pos.GMUprightM
	}

	pos.DeckEdge = Clearance{HeightM: math.Inf(1)}
	pos.MarginLine = Clearance{HeightM: math.Inf(1)}
	for i := range h.stations {
		x, hb, z := h.DeckEdge(i)
		sf := StationFreeboard{XM: x, DeckZM: z, HalfBreadthM: hb,
			PortM: p.Height(x, -hb, z), StarboardM: p.Height(x, hb, z)}
		pos.Freeboards = append(pos.Freeboards, sf)
		for _, c := range []struct {
			side Side
			fb   float64
			ml   float64
		}{{Port, sf.PortM, p.Height(x, -hb, z-pr.v.MarginLineM)}, {Starboard, sf.StarboardM, p.Height(x, hb, z-pr.v.MarginLineM)}} {
			if c.fb < pos.DeckEdge.HeightM {
				pos.DeckEdge = Clearance{c.fb, x, c.side}
			}
			if c.ml < pos.MarginLine.HeightM {
				pos.MarginLine = Clearance{c.ml, x, c.side}
			}
		}
	}
	// Upright (the two sides within a millimetre at the least place), the
	// least clearance is on both sides alike.
	for _, c := range []*Clearance{&pos.DeckEdge, &pos.MarginLine} {
		for _, sf := range pos.Freeboards {
			if sf.XM == c.XM && math.Abs(sf.PortM-sf.StarboardM) < 1e-3 {
				c.Side = Both
			}
		}
	}
	for i, pl := range s.heldPl {
		pos.Held = append(pos.Held, HeldWater{Index: pr.heldIx[i], VolumeM3: pr.held[i].vol, Surface: pl})
	}
	for _, o := range pr.v.Openings {
		pos.Openings = append(pos.Openings, OpeningClearance{o, p.Height(o.X, o.Y, o.Z), pr.v.intoFlooded(o, pr.d)})
	}
	return pos
}
