package engine

import (
	"errors"
	"fmt"
	"math"
)

// SeaWaterDensity is the default density of sea water, t/m³
// (Barrass & Derrett, Ship Stability for Masters and Mates, p.130).
const SeaWaterDensity = 1.025

// MarginLineDepthM is the default depth of the margin line below the
// bulkhead deck at side: 76 mm (SOLAS 1974 II-1 definitions).
const MarginLineDepthM = 0.076

// PressedFullFill is the fill above which a tank is taken as pressed full,
// with no free surface (common practice: tanks 98 % full may be regarded as
// full).
const PressedFullFill = 0.98

// Weight is one item of the loading condition.
type Weight struct {
	Name  string
	MassT float64 // t
	LCGM  float64 // m from the aft perpendicular
	TCGM  float64 // m, positive to starboard
	VCGM  float64 // m above the baseline
	FSMTm float64 // free-surface moment, t·m (≥ 0)
	// ExtentM is the stretch [aft, fwd] of the ship the mass is spread
	// over, m, for the hull girder's strength (strength.go); zero when not
	// given.
	ExtentM [2]float64
}

// HasExtent reports whether the weight's extent is given.
func (w Weight) HasExtent() bool { return w.ExtentM[1] > w.ExtentM[0] }

// Opening is a point through which water would spread further into the
// ship once immersed: a vent, an air pipe, a door.
type Opening struct {
	Name         string
	Kind         string // free text: "vent", "air pipe", "door", …
	X, Y, Z      float64
	Weathertight bool // closed weathertight: does not count as a downflooding point
	// LeadsTo names the compartment water runs into through it (matched
	// ignoring case); "" for a space not modelled, a point of downflooding.
	// Into a compartment already flooded it is no point of progressive
	// flooding (see leads.go).
	LeadsTo string
	AreaM2  float64 // flow area for a run through it, m²; 0: DefaultOpeningAreaM2 (connection.go)
}

// Vessel is one ship with one loading condition. Build it with NewVessel.
type Vessel struct {
	Name         string
	WaterDensity float64 // t/m³ of the water she floats in
	Hull         *Hull
	Weights      []Weight
	Compartments []*Compartment
	Openings     []Opening
	Connections  []Connection // ways for water between compartments (connection.go)
	MarginLineM  float64      // margin line's depth below the deck at side, m
	CriteriaSets []string     // the criteria sets she is held to (see criteria.go)
	ShipType     string       // "cargo" or "passenger" (SOLAS s's heel limits); "" is cargo
	DraftMarks   []DraftMark  // the marks the crew reads (draftmark.go)
	Girder       GirderLimits // read-out points and permissible values (strength.go)

	tanks []tankLoad // contents of each compartment at its fill, upright
}

// tankLoad is a tank's contents as loaded, upright and level.
type tankLoad struct {
	massT, x, y, z, fsm float64
	level               Plane // the contents' surface
}

// NewVessel checks v and returns a copy ready to solve: tank contents and
// their free-surface moments are computed from the tanks' geometry at their
// fill, level and upright.
func NewVessel(v Vessel) (*Vessel, error) {
	if v.Hull == nil {
		return nil, errors.New("vessel has no hull")
	}
	if v.WaterDensity == 0 {
		v.WaterDensity = SeaWaterDensity
	}
	if !(v.WaterDensity > 0) || math.IsInf(v.WaterDensity, 0) {
		return nil, fmt.Errorf("water density %v: must be a positive finite number of t/m³", v.WaterDensity)
	}
	if v.MarginLineM == 0 {
		v.MarginLineM = MarginLineDepthM
	}
	v.Weights = append([]Weight(nil), v.Weights...)
	v.Compartments = append([]*Compartment(nil), v.Compartments...)
	v.Openings = append([]Opening(nil), v.Openings...)
	v.CriteriaSets = append([]string(nil), v.CriteriaSets...)
	v.Connections = append([]Connection(nil), v.Connections...)
	if err := checkConnections(&v); err != nil {
		return nil, err
	}
	if err := checkMarks(v.Hull, v.DraftMarks); err != nil {
		return nil, err
	}
	v.DraftMarks = append([]DraftMark(nil), v.DraftMarks...)
	for i, w := range v.Weights {
		for _, f := range []float64{w.MassT, w.LCGM, w.TCGM, w.VCGM, w.FSMTm} {
			if math.IsNaN(f) || math.IsInf(f, 0) {
				return nil, fmt.Errorf("weight %d (%q): mass, centre and free-surface moment must be finite numbers", i+1, w.Name)
			}
		}
		if w.MassT < 0 || w.FSMTm < 0 {
			return nil, fmt.Errorf("weight %d (%q): mass %v t and free-surface moment %v t·m must not be negative", i+1, w.Name, w.MassT, w.FSMTm)
		}
	}
	v.Girder.Points = append([]ReadOutPoint(nil), v.Girder.Points...)
	if err := checkGirderData(&v); err != nil {
		return nil, err
	}
	v.tanks = make([]tankLoad, len(v.Compartments))
	for i, c := range v.Compartments {
		if c == nil || c.solid == nil {
			return nil, fmt.Errorf("compartment %d was not made with NewCompartment", i+1)
		}
		if !(c.Permeability > 0 && c.Permeability <= 1) {
			return nil, fmt.Errorf("compartment %q: permeability %v is outside (0, 1]", c.Name, c.Permeability)
		}
		if c.Liquid == nil || c.Liquid.Fill <= 0 {
			continue
		}
		l := c.Liquid
		if !(l.Density > 0) || math.IsInf(l.Density, 0) || !(l.Fill <= 1) {
			return nil, fmt.Errorf("compartment %q: liquid density %v or fill %v out of range", c.Name, l.Density, l.Fill)
		}
		// The contents fill μ of the space below their level (the
		// structure takes the rest), as the sea would: their level is where
		// μ × the space below it holds them, and their free surface is μ of
		// the space's plan there.
		vol := l.Fill * c.CapacityM3()
		p, im := levelForVolume(c.solid, vol/c.Permeability, 0, 0)
		x, y, z := im.Centroid()
		t := tankLoad{massT: vol * l.Density, x: x, y: y, z: z, level: p}
		if l.Fill < PressedFullFill && im.AW > 0 {
			t.fsm = l.Density * c.Permeability * (im.IYY - im.SY*im.SY/im.AW)
		}
		v.tanks[i] = t
	}
	if err := v.checkLeadsTo(); err != nil {
		return nil, err
	}
	var m float64
	for _, w := range v.Weights {
		m += w.MassT
	}
	for _, t := range v.tanks {
		m += t.massT
	}
	if !(m > 0) {
		return nil, errors.New("the loading condition has no mass")
	}
	return &v, nil
}

// TankContents returns the mass (t), centre (m) and free-surface moment
// (t·m) of compartment i's contents as loaded, upright and level; zero for
// a dry space.
func (v *Vessel) TankContents(i int) (massT, x, y, z, fsmTm float64) {
	t := v.tanks[i]
	return t.massT, t.x, t.y, t.z, t.fsm
}

// SpaceState is the flooding state of one compartment.
type SpaceState struct {
	Open         bool    // open to the sea: its buoyancy is lost (lost-buoyancy method)
	Permeability float64 // μ while flooded; 0 means the compartment's own
	WaterM3      float64 // sea water held while not open (added-weight method), m³
}

// Damage gives each compartment's state, index-aligned with
// Vessel.Compartments. A nil or short Damage leaves the rest intact.
type Damage []SpaceState

// Intact returns an all-intact damage state for v.
func (v *Vessel) Intact() Damage { return make(Damage, len(v.Compartments)) }

func (d Damage) state(i int) SpaceState {
	if i < len(d) {
		return d[i]
	}
	return SpaceState{}
}

// Permeability returns μ of compartment i under d: the override
// d[i].Permeability when one is set (non-zero), else the compartment's own
// (the vessel file's). This is the one place that rule is written.
//
// An override must lie in 0 < μ ≤ 1: whoever builds the damage state checks
// it there (CheckDamage; the front ends read μ with
// vessels.ParsePermeability), so an override out of range here is a
// programmer's mistake and panics.
func (v *Vessel) Permeability(d Damage, i int) float64 {
	mu := d.state(i).Permeability
	switch {
	case mu == 0:
		return v.Compartments[i].Permeability
	case mu > 0 && mu <= 1:
		return mu
	}
	panic(fmt.Sprintf("engine: permeability override %v of compartment %d is outside 0 < μ ≤ 1 (check the damage state with CheckDamage)", mu, i))
}

// CheckDamage returns an error naming the first compartment of d whose
// state cannot be used with v: a permeability override outside 0 < μ ≤ 1
// (0 means the compartment's own), or held water that is negative or not
// finite. A state longer than v's compartments is an error too.
func CheckDamage(v *Vessel, d Damage) error {
	if len(d) > len(v.Compartments) {
		return fmt.Errorf("damage state of %d compartments for a vessel of %d", len(d), len(v.Compartments))
	}
	for i, s := range d {
		name := v.Compartments[i].Name
		if mu := s.Permeability; mu != 0 && !(mu > 0 && mu <= 1) {
			return fmt.Errorf("%s: permeability %v is outside 0 < μ ≤ 1", name, mu)
		}
		if !(s.WaterM3 >= 0) || math.IsInf(s.WaterM3, 0) {
			return fmt.Errorf("%s: water held %v m³ must be a finite number, zero or more", name, s.WaterM3)
		}
	}
	return nil
}

// Load is the loading condition's totals under a damage state: the fixed
// weights and the tanks' contents (a tank open to the sea or holding
// floodwater has lost its contents). Floodwater is not included.
type Load struct {
	MassT            float64
	LCGM, TCGM, VCGM float64 // centre of gravity, solid (no free-surface correction)
	FSMTm            float64 // Σ free-surface moments of weights and intact tanks
}

// Loading returns the load of v under d.
func (v *Vessel) Loading(d Damage) Load {
	var l Load
	var mx, my, mz float64
	for _, w := range v.Weights {
		l.MassT += w.MassT
		mx += w.MassT * w.LCGM
		my += w.MassT * w.TCGM
		mz += w.MassT * w.VCGM
		l.FSMTm += w.FSMTm
	}
	for i, t := range v.tanks {
		s := d.state(i)
		if s.Open || s.WaterM3 > 0 {
			continue
		}
		l.MassT += t.massT
		mx += t.massT * t.x
		my += t.massT * t.y
		mz += t.massT * t.z
		l.FSMTm += t.fsm
	}
	if l.MassT > 0 {
		l.LCGM, l.TCGM, l.VCGM = mx/l.MassT, my/l.MassT, mz/l.MassT
	}
	return l
}

// levelForVolume returns the plane of slopes (b, c) below which solid s holds
// volume vol, and the immersion there. vol is clamped to [0, volume of s].
// Newton's method on the plane's height, safeguarded by bisection; at most
// 200 steps.
func levelForVolume(s *Solid, vol, b, c float64) (Plane, Immersion) {
	xmin, xmax, zmin, zmax := s.Extent()
	var ymax float64
	for i := range s.slabs {
		ymax = math.Max(ymax, s.slabs[i].ymax)
	}
	span := math.Abs(b)*math.Max(math.Abs(xmin), math.Abs(xmax)) + math.Abs(c)*ymax
	lo, hi := zmin-span-1, zmax+span+1
	total := s.Volume()
	if vol <= 0 {
		p := Plane{lo, b, c}
		return p, Immersion{}
	}
	if vol >= total {
		p := Plane{hi, b, c}
		return p, s.Below(p)
	}
	// Start from the level of a prism with the solid's mean plan area.
	a := zmin + (zmax-zmin)*vol/total + b*(xmin+xmax)/2
	if !(a > lo && a < hi) {
		a = (lo + hi) / 2
	}
	var im Immersion
	for it := 0; it < 200; it++ {
		p := Plane{a, b, c}
		im = s.Below(p)
		f := im.V - vol
		if math.Abs(f) <= 1e-13*total {
			return p, im
		}
		if f > 0 {
			hi = a
		} else {
			lo = a
		}
		next := a - f/im.AW
		if im.AW <= 0 || !(next > lo && next < hi) {
			next = (lo + hi) / 2
		}
		if hi-lo <= 1e-13*(1+math.Abs(a)) {
			return p, im
		}
		a = next
	}
	return Plane{a, b, c}, im
}
