package engine

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// HandNotApplicable is the error HandMethod returns when the small-angle
// lost-buoyancy method does not describe the case at all. Reason is a plain
// sentence for the screen.
type HandNotApplicable struct{ Reason string }

func (e *HandNotApplicable) Error() string { return "hand method not applicable: " + e.Reason }

// handSpace is one open compartment as the hand method sees it: its box
// clipped to the hull's box, with its permeability.
type handSpace struct {
	name                   string
	mu                     float64
	x0, x1, y0, y1, z0, z1 float64
}

func (c handSpace) l() float64  { return c.x1 - c.x0 }
func (c handSpace) b() float64  { return c.y1 - c.y0 }
func (c handSpace) xc() float64 { return (c.x0 + c.x1) / 2 }
func (c handSpace) yc() float64 { return (c.y0 + c.y1) / 2 }

// plan is the space's plan area l·b (m²), before permeability.
func (c handSpace) plan() float64 { return c.l() * c.b() }

// depth is the height of the space below a level waterline at t: 0 when
// the space lies wholly above it, its full height when wholly below.
func (c handSpace) depth(t float64) float64 {
	return math.Max(0, math.Min(t, c.z1)-c.z0)
}

// pierces reports whether a level waterline at t cuts the space (bottom
// included, top excluded: the side a rising waterline sees).
func (c handSpace) pierces(t float64) bool { return t >= c.z0 && t < c.z1 }

// HandMethod works the small-angle lost-buoyancy method for a box-shaped
// vessel (v.Hull.Box) under damage d, keeping every step.
//
// Frame and data: the ship frame of the package (x from the aft
// perpendicular, y to starboard, z from the baseline). The box is L × B × D;
// an open compartment is its box clipped to the hull, l × b × h from z0 to
// z1, centred at (xc, yc), with permeability μ. Δ, LCG, TCG, KG and ΣFSM are
// v.Loading(d): a tank open to the sea has lost its contents.
//
// Steps, all with the ship level except where a tilt is found:
//
//	V   = Δ/ρ (unchanged by the damage);  T0 = V/(L·B)
//	v   = Σ μ·l·b·d(T0), d(T) = clamp(T − z0, 0, h)  (lost volume)
//	a   = Σ μ·l·b over the spaces the waterline cuts  (lost waterplane)
//	s   = v ÷ (L·B − a)                                (sinkage)
//
// When a space's top or bottom lies between T0 and T0 + s the lost area
// changes on the way: the sinkage is then worked in stages between those
// heights, each stage with its own intact waterplane, until L·B·T1 −
// Σ μ·l·b·d(T1) = V. T1 = T0 + s is the new mean draft. Should T1 reach the
// deck the method has no waterplane left and HandMethod says so.
//
// At T1 the waterplane still intact is the rectangle L × B less μ times
// each cut space's plan: area A', centroid (xF, yF) (the new centre of
// flotation; yF is the transverse shift, xF − L/2 the longitudinal), and
// second moments about its own centroidal axes by the parallel-axis theorem,
//
//	I_T  = L·B³/12 + L·B·yF² − Σ μ[l·b³/12 + l·b·(yc − yF)²]
//	I_L  = B·L³/12 + L·B·(L/2 − xF)² − Σ μ[b·l³/12 + l·b·(xc − xF)²]
//	I_xy = L·B·(L/2 − xF)(0 − yF) − Σ μ·l·b·(xc − xF)(yc − yF).
//
// BM = I_T/V and BML = I_L/V with V the intact volume. The remaining
// buoyant body at T1 (hull below T1 less μ × each space below T1) has volume
// V and centre (LCB', TCB', KB'). KM = KB' + BM; GM = KM − KG − FSC with
// FSC = ΣFSM/Δ; GML = KB' + BML − KG − FSC (the same virtual rise of G the
// direct solution uses; BML dwarfs it).
//
// The list. Tilt the level waterline at T1 about axes through F:
// z = T1 + β(x − xF) + γ(y − yF), γ = tan θ, β = −trim/L. The volume gained
// on one side of F equals the volume lost on the other (to first order; and
// exactly while the sides between the waterlines are vertical), and the
// centre of buoyancy moves by δTCB·V = γ·I_T + β·I_xy, δLCB·V = β·I_L +
// γ·I_xy, δKB = O(γ², β²). She is at rest when B lies on the vertical through
// G (with its virtual rise): (TCB − TCG) + γ(KB − KG − FSC) = 0 and the same
// lengthwise, which to first order is
//
//	γ·GM + β·I_xy/V   = TCG − TCB'
//	β·GML + γ·I_xy/V  = LCG − LCB'.
//
// The method takes the principal axes along and across the ship (I_xy
// neglected): tan θ = (TCG − TCB')/GM, trim = (LCB' − LCG)·L/GML. The lever
// is the transverse distance from the centre of buoyancy of the remaining
// body to G. For a space open from the keel through the waterline TCB'
// equals the shift yF of the centre of flotation (the usual statement,
// Barrass & Derrett, bilging chapter, memory: "tan θ =
// shift/GM"); for a space with its bottom above the keel, or wholly under
// water, the two differ and TCB' is the one that agrees with the direct
// solution. With I_xy kept, the pair solved together is the first-order limit
// of the direct solution; it is recorded as CoupledHeelDeg and
// CoupledTrimM.
//
// Validity: small angles on a wall-sided body. Carried to third order on a
// wall-sided body the transverse balance is tan θ·(GM + ½·BM·tan²θ) =
// TCG − TCB' (the wall-sided formula); the method's tan θ is its
// small-angle limit, and the two part by ½·BM·tan³θ/GM. When GM ≤ 0 there
// is no small-angle list: the heel is then the root of that wall-sided
// relation on the side of the lever (the angle of loll, tan θ =
// √(−2GM/BM), when the lever is nil; starboard is taken when she could go
// either way), and the working says so.
//
// Drafts are read on the centreline: draft aft = T1 + trim·xF/L − tan θ·yF,
// forward = T1 − trim·(L − xF)/L − tan θ·yF (the waterline turns about F).
//
// Errors: a *HandNotApplicable when the hull is not a box, no compartment is
// open to the sea, a compartment holds floodwater as an added weight, or the
// sinkage takes the mean draft to the deck. v must be a vessel made by
// NewVessel.
func HandMethod(v *Vessel, d Damage) (*HandWorking, error) {
	if v == nil || v.Hull == nil {
		panic("engine: HandMethod needs a vessel made by NewVessel")
	}
	h := v.Hull
	if !h.Box || openOutlined(v, d) {
		// A ship-shaped hull, or a space given by its own outlines (a
		// hopper tank on a box barge): the working from the hull's own
		// hydrostatics, which on a box with box spaces is the same.
		return markUsable(handShip(v, d)) // hand_ship.go
	}
	L, B, D := h.LengthM, h.BreadthM, h.DepthM
	spaces, spilt, spiltT, err := handSpaces(v, d)
	if err != nil {
		return nil, err
	}

	w := &HandWorking{}
	step := w.step
	n := handNum
	ld := v.Loading(d)
	rho := v.WaterDensity
	LB := L * B

	// Displacement and intact draft.
	if len(spilt) > 0 {
		step("contents run out to the sea", "tank contents of "+strings.Join(spilt, ", ")+" are lost", spiltT, "t")
	}
	V := ld.MassT / rho
	step("displaced volume V", fmt.Sprintf("Δ/ρ = %s/%s", n(ld.MassT), n(rho)), V, "m³")
	T0 := V / LB
	step("intact draft T₀", fmt.Sprintf("V/(L·B) = %s/(%s×%s)", n(V), n(L), n(B)), T0, "m")
	if T0 >= D {
		return nil, &HandNotApplicable{fmt.Sprintf("intact she would float at %s m, at or above her depth of %s m: there is no waterplane for the method", n(T0), n(D))}
	}

	// Lost volume and waterplane at the intact draft.
	for _, c := range spaces {
		where := "cut by the waterline"
		switch {
		case c.z1 <= T0:
			where = "wholly under water: nothing lost from the waterplane"
		case c.z0 >= T0:
			where = "wholly above water: nothing lost"
		}
		step("lost volume of "+c.name+" ("+where+")",
			fmt.Sprintf("μ·l·b·d = %s×%s×%s×%s", n(c.mu), n(c.l()), n(c.b()), n(c.depth(T0))),
			c.mu*c.plan()*c.depth(T0), "m³")
	}
	v0 := handLost(spaces, T0)
	a0 := handCutArea(spaces, T0)
	step("lost volume v", "Σ μ·l·b·d at T₀", v0, "m³")
	step("lost waterplane a", "Σ μ·l·b of the spaces cut at T₀", a0, "m²")
	step("intact waterplane A", fmt.Sprintf("L·B − a = %s − %s", n(LB), n(a0)), LB-a0, "m²")

	// Sinkage, in stages where a space's top or bottom is passed.
	T1, staged := w.handSinkage(spaces, V, T0, LB, D)
	if math.IsNaN(T1) || T1 >= D {
		return nil, &HandNotApplicable{fmt.Sprintf("the lost buoyancy is more than the hull has above the waterline: the sinkage would take the mean draft past the deck at %s m, leaving no waterplane for the method", n(D))}
	}
	w.IntactDraftM = T0
	w.VolumeM3 = V
	w.LostVolumeM3 = v0
	w.SinkageM = T1 - T0
	w.DraftM = T1
	if staged {
		step("sinkage s", fmt.Sprintf("T₁ − T₀ = %s − %s", n(T1), n(T0)), w.SinkageM, "m")
	}
	step("new mean draft T₁", fmt.Sprintf("T₀ + s = %s + %s", n(T0), n(w.SinkageM)), T1, "m")

	// The waterplane still intact at T1, its centroid and second moments.
	var aL, mxL, myL float64
	var cut []handSpace
	for _, c := range spaces {
		if c.pierces(T1) {
			cut = append(cut, c)
			m := c.mu * c.plan()
			aL += m
			mxL += m * c.xc()
			myL += m * c.yc()
		}
	}
	A1 := LB - aL
	xF := (LB*L/2 - mxL) / A1
	yF := -myL / A1
	w.LostAreaM2 = aL
	w.WaterplaneM2 = A1
	w.LCFM, w.TCFM = xF, yF
	w.CFShiftM = math.Abs(yF)
	if aL != a0 {
		step("lost waterplane at T₁", "Σ μ·l·b of the spaces cut at T₁", aL, "m²")
		step("intact waterplane at T₁", fmt.Sprintf("L·B − a = %s − %s", n(LB), n(aL)), A1, "m²")
	}
	step("transverse shift of the centre of flotation", fmt.Sprintf("(0 − Σ μ·l·b·yc)/A = %s/%s (%s)", n(-myL), n(A1), signWords(yF, "starboard", "port", "on the centreline")), yF, "m")
	step("longitudinal shift of the centre of flotation", fmt.Sprintf("(L·B·L/2 − Σ μ·l·b·xc)/A − L/2 = (%s − %s)/%s − %s (%s)", n(LB*L/2), n(mxL), n(A1), n(L/2), signWords(xF-L/2, "forward", "aft", "none")), xF-L/2, "m")

	iT := L*B*B*B/12 + LB*yF*yF
	iL := B*L*L*L/12 + LB*(L/2-xF)*(L/2-xF)
	iXY := LB * (L/2 - xF) * (0 - yF)
	step("I_T of the whole waterplane about the new axis", fmt.Sprintf("L·B³/12 + L·B·yF² = %s×%s³/12 + %s×%s²", n(L), n(B), n(LB), n(yF)), iT, "m⁴")
	step("I_L of the whole waterplane about the new axis", fmt.Sprintf("B·L³/12 + L·B·(L/2 − xF)² = %s×%s³/12 + %s×%s²", n(B), n(L), n(LB), n(L/2-xF)), iL, "m⁴")
	for _, c := range cut {
		m := c.mu * c.plan()
		dy, dx := c.yc()-yF, c.xc()-xF
		lt := c.mu*c.l()*c.b()*c.b()*c.b()/12 + m*dy*dy
		ll := c.mu*c.b()*c.l()*c.l()*c.l()/12 + m*dx*dx
		step("I_T lost with "+c.name, fmt.Sprintf("μ[l·b³/12 + l·b·(yc − yF)²] = %s×[%s×%s³/12 + %s×%s²]", n(c.mu), n(c.l()), n(c.b()), n(c.plan()), n(dy)), lt, "m⁴")
		step("I_L lost with "+c.name, fmt.Sprintf("μ[b·l³/12 + l·b·(xc − xF)²] = %s×[%s×%s³/12 + %s×%s²]", n(c.mu), n(c.b()), n(c.l()), n(c.plan()), n(dx)), ll, "m⁴")
		iT -= lt
		iL -= ll
		iXY -= m * dx * dy
	}
	w.ITM4, w.ILM4, w.IXYM4 = iT, iL, iXY
	step("I_T of the intact waterplane", "whole − Σ lost (parallel-axis theorem)", iT, "m⁴")
	step("I_L of the intact waterplane", "whole − Σ lost (parallel-axis theorem)", iL, "m⁴")

	// BM, KB, KM, GM.
	w.BMM = iT / V
	w.BMLM = iL / V
	step("BM", fmt.Sprintf("I_T/V = %s/%s", n(iT), n(V)), w.BMM, "m")
	step("BML", fmt.Sprintf("I_L/V = %s/%s", n(iL), n(V)), w.BMLM, "m")
	mz := LB * T1 * T1 / 2
	mx := LB * T1 * L / 2
	my := 0.0
	var lz, lv float64
	for _, c := range spaces {
		dep := c.depth(T1)
		vol := c.mu * c.plan() * dep
		lv += vol
		lz += vol * (c.z0 + dep/2)
		mx -= vol * c.xc()
		my -= vol * c.yc()
	}
	mz -= lz
	// The body below T1 holds V by construction; divide by it.
	w.KBM = mz / V
	w.LCBM = mx / V
	w.TCBM = my / V
	if lv != v0 {
		step("lost volume below T₁", "Σ μ·l·b·d at T₁", lv, "m³")
	}
	kl := 0.0
	if lv > 0 {
		kl = lz / lv
	}
	step("KB of the remaining buoyant body", fmt.Sprintf("(L·B·T₁²/2 − v·kv)/V = (%s − %s×%s)/%s", n(LB*T1*T1/2), n(lv), n(kl), n(V)), w.KBM, "m")
	if err := w.metacentre(ld, "BML"); err != nil {
		return nil, err
	}

	// The list.
	step("TCB of the remaining buoyant body", fmt.Sprintf("−Σ μ·l·b·d·yc/V = %s/%s", n(my), n(V)), w.TCBM, "m")
	lever := ld.TCGM - w.TCBM
	step("list lever", fmt.Sprintf("TCG − TCB = %s − %s (%s)", n(ld.TCGM), n(w.TCBM), signWords(lever, "G to starboard of B", "G to port of B", "G over B")), lever, "m")
	tanT := w.handHeelTan(lever)
	w.HeelDeg = math.Atan(tanT) * 180 / math.Pi
	step("heel θ", fmt.Sprintf("atan(%s), %s", strings.TrimSuffix(strings.TrimPrefix(n(tanT), "("), ")"), signWords(tanT, "starboard side down", "port side down", "upright")), w.HeelDeg, "°")

	// Trim.
	step("LCB of the remaining buoyant body", fmt.Sprintf("(L·B·T₁·L/2 − Σ μ·l·b·d·xc)/V = %s/%s", n(mx), n(V)), w.LCBM, "m")
	tlever := w.LCBM - ld.LCGM
	w.TrimM = tlever * L / w.GMLM
	step("trim", fmt.Sprintf("(LCB − LCG)·L/GML = (%s − %s)×%s/%s (%s)", n(w.LCBM), n(ld.LCGM), n(L), n(w.GMLM), signWords(w.TrimM, "by the stern", "by the head", "even keel")), w.TrimM, "m")

	// Drafts on the centreline, the waterline turning about F.
	w.drafts(T1, xF, yF, L, tanT)

	// Heel and trim solved together (I_xy kept): for the record.
	w.handCoupled(iXY, V, L, lever, ld.LCGM)
	return markUsable(w, nil)
}

// openOutlined reports whether a compartment given by its own outlines is
// open to the sea in d.
func openOutlined(v *Vessel, d Damage) bool {
	for i, c := range v.Compartments {
		if d.state(i).Open && c.Sections != nil {
			return true
		}
	}
	return false
}

// handSpaces returns the compartments open to the sea as the hand method's
// spaces (clipped to the box), with the tanks among them whose contents run
// out (names and tonnes). Errors: a *HandNotApplicable when floodwater is
// held as an added weight or no compartment is open to the sea.
func handSpaces(v *Vessel, d Damage) (spaces []handSpace, spilt []string, spiltT float64, err error) {
	L, B, D := v.Hull.LengthM, v.Hull.BreadthM, v.Hull.DepthM
	var held []string
	for i, c := range v.Compartments {
		s := d.state(i)
		switch {
		case s.Open && c.Sections != nil:
			return nil, nil, 0, &HandNotApplicable{fmt.Sprintf("%s is given by its own outlines, not a box: the box closed forms do not describe it", c.Name)}
		case s.Open:
			b := c.Box
			hs := handSpace{name: c.Name, mu: v.Permeability(d, i),
				x0: math.Max(b.X0, 0), x1: math.Min(b.X1, L),
				y0: math.Max(b.Y0, -B/2), y1: math.Min(b.Y1, B/2),
				z0: math.Max(b.Z0, 0), z1: math.Min(b.Z1, D)}
			spaces = append(spaces, hs)
			if m, _, _, _, _ := v.TankContents(i); m > 0 {
				spilt = append(spilt, c.Name)
				spiltT += m
			}
		case s.WaterM3 > 0:
			held = append(held, c.Name)
		}
	}
	switch {
	case len(held) > 0 && len(spaces) == 0:
		return nil, nil, 0, &HandNotApplicable{fmt.Sprintf("the only floodwater is held as an added weight (%s); the lost-buoyancy hand method needs a compartment open to the sea", strings.Join(held, ", "))}
	case len(held) > 0:
		return nil, nil, 0, &HandNotApplicable{fmt.Sprintf("floodwater is held as an added weight in %s; the lost-buoyancy hand method takes only compartments open to the sea", strings.Join(held, ", "))}
	case len(spaces) == 0:
		return nil, nil, 0, &HandNotApplicable{"no compartment is open to the sea"}
	}
	return spaces, spilt, spiltT, nil
}

// step adds one line to the working.
// drafts reads the drafts on the centreline at the perpendiculars after
// heeling and trimming about the new centre of flotation (xF, yF): the
// waterline through (xF, yF) at the mean draft T1, falling by trim/L
// forward and tan θ to port. They are the working's last steps.
func (w *HandWorking) drafts(T1, xF, yF, L, tanT float64) {
	n := handNum
	w.DraftAftM = T1 + w.TrimM*xF/L - tanT*yF
	w.DraftFwdM = T1 - w.TrimM*(L-xF)/L - tanT*yF
	w.DraftMidM = (w.DraftAftM + w.DraftFwdM) / 2
	w.step("draft aft", fmt.Sprintf("T₁ + trim·xF/L − tan θ·yF = %s + %s×%s/%s − %s×%s", n(T1), n(w.TrimM), n(xF), n(L), n(tanT), n(yF)), w.DraftAftM, "m")
	w.step("draft forward", fmt.Sprintf("T₁ − trim·(L − xF)/L − tan θ·yF = %s − %s×%s/%s − %s×%s", n(T1), n(w.TrimM), n(L-xF), n(L), n(tanT), n(yF)), w.DraftFwdM, "m")
	w.Waterline = Plane{A: w.DraftAftM, B: -w.TrimM / L, C: tanT}
}

// metacentre works, from the working's KB, BM and BML and the load: KM =
// KB + BM, the free-surface correction ΣFSM/Δ, GM = KM − KG − FSC and
// GML = KB + BML − KG − FSC (bml names BML in the working's words). A GML
// of zero or less leaves the method nothing to trim with: an error.
func (w *HandWorking) metacentre(ld Load, bml string) error {
	n := handNum
	w.KMM = w.KBM + w.BMM
	w.step("KM", fmt.Sprintf("KB + BM = %s + %s", n(w.KBM), n(w.BMM)), w.KMM, "m")
	W := ld.MassT
	w.KGM = ld.VCGM
	w.FSCM = ld.FSMTm / W
	w.step("free-surface correction", fmt.Sprintf("ΣFSM/Δ = %s/%s", n(ld.FSMTm), n(W)), w.FSCM, "m")
	w.GMM = w.KMM - w.KGM - w.FSCM
	w.step("GM", fmt.Sprintf("KM − KG − FSC = %s − %s − %s", n(w.KMM), n(w.KGM), n(w.FSCM)), w.GMM, "m")
	w.GMLM = w.KBM + w.BMLM - w.KGM - w.FSCM
	w.step("GML", fmt.Sprintf("KB + %s − KG − FSC = %s + %s − %s − %s", bml, n(w.KBM), n(w.BMLM), n(w.KGM), n(w.FSCM)), w.GMLM, "m")
	if !(w.GMLM > 0) {
		return &HandNotApplicable{fmt.Sprintf("the longitudinal metacentric height is %s m: she has no trim stability for the method to work with", n(w.GMLM))}
	}
	return nil
}

func (w *HandWorking) step(label, formula string, value float64, unit string) {
	w.Steps = append(w.Steps, HandStep{label, formula, value, unit})
}

// handLost is the volume the spaces lose below the draft t (Σ μ·l·b·d).
func handLost(spaces []handSpace, t float64) float64 {
	var s float64
	for _, c := range spaces {
		s += c.mu * c.plan() * c.depth(t)
	}
	return s
}

// handCutArea is the waterplane the spaces cut at draft t lose (Σ μ·l·b).
func handCutArea(spaces []handSpace, t float64) float64 {
	var s float64
	for _, c := range spaces {
		if c.pierces(t) {
			s += c.mu * c.plan()
		}
	}
	return s
}

// handSinkage works the sinkage from the intact draft T0 to the new mean
// draft T1 (NaN when she would sink past the deck at D), in stages where a
// space's top or bottom is passed: on each stage the volume still wanting
// is regained over the waterplane intact there. Each stage passes at least
// one of the 2·n heights, so the loop ends. staged reports whether there
// was more than one stage.
func (w *HandWorking) handSinkage(spaces []handSpace, V, T0, LB, D float64) (T1 float64, staged bool) {
	n := handNum
	T := T0
	T1 = math.NaN()
	for stage := 0; stage <= 2*len(spaces)+1; stage++ {
		next := D
		for _, c := range spaces {
			for _, z := range [2]float64{c.z0, c.z1} {
				if z > T && z < next {
					next = z
				}
			}
		}
		want := V - (LB*T - handLost(spaces, T)) // volume still to be regained at T, ≥ 0
		area := LB - handCutArea(spaces, T)
		if stage == 0 && area > 0 {
			w.step("sinkage s", fmt.Sprintf("v/A = %s/%s", n(want), n(area)), want/area, "m")
		}
		if area > 0 && T+want/area <= next {
			T1 = T + want/area
			if staged {
				w.step("last stage", fmt.Sprintf("%s + %s/%s (wanting %s m³ over an intact waterplane of %s m²)", n(T), n(want), n(area), n(want), n(area)), T1, "m")
			}
			break
		}
		if next >= D {
			break
		}
		if stage == 0 {
			var passed []string
			for _, c := range spaces {
				if c.z0 == next {
					passed = append(passed, "bottom of "+c.name)
				} else if c.z1 == next {
					passed = append(passed, "top of "+c.name)
				}
			}
			w.step("the sinkage passes the "+strings.Join(passed, " and "),
				fmt.Sprintf("at %s m, below T₀ + s: the lost waterplane changes there, so the sinkage is worked in stages", n(next)),
				next, "m")
		}
		staged = true
		regained := area * (next - T)
		w.step(fmt.Sprintf("stage %s → %s m", n(T), n(next)),
			fmt.Sprintf("intact waterplane %s m² × %s m regains %s m³ of %s", n(area), n(next-T), n(regained), n(want)),
			want-regained, "m³")
		T = next
	}
	return T1, staged
}

// handHeelTan works tan θ from the list lever and GM: lever/GM, or on the
// wall-sided relation when GM ≤ 0 (see handLollTan).
func (w *HandWorking) handHeelTan(lever float64) float64 {
	n := handNum
	if w.GMM > 0 {
		tanT := lever / w.GMM
		w.step("tan θ", fmt.Sprintf("lever/GM = %s/%s", n(lever), n(w.GMM)), tanT, "")
		return tanT
	}
	tanT := handLollTan(w.GMM, w.BMM, lever)
	formula := fmt.Sprintf("GM ≤ 0, no small-angle list: root of GM·t + ½·BM·t³ = lever, %s·t + ½×%s·t³ = %s", n(w.GMM), n(w.BMM), n(lever))
	if lever == 0 {
		formula = fmt.Sprintf("GM ≤ 0, angle of loll to either side: √(−2GM/BM) = √(−2×%s/%s)", n(w.GMM), n(w.BMM))
	}
	w.step("tan θ (loll)", formula, tanT, "")
	return tanT
}

// handCoupled records heel and trim solved together with the product of
// inertia iXY kept (for the record; the method neglects it).
func (w *HandWorking) handCoupled(iXY, V, L, lever, lcg float64) {
	w.CoupledHeelDeg, w.CoupledTrimM = w.HeelDeg, w.TrimM
	if !(w.GMM > 0) || iXY == 0 {
		return
	}
	k := iXY / V
	det := w.GMM*w.GMLM - k*k
	if det > 0 {
		ry, rx := lever, lcg-w.LCBM
		g := (ry*w.GMLM - k*rx) / det
		b := (w.GMM*rx - k*ry) / det
		w.CoupledHeelDeg = math.Atan(g) * 180 / math.Pi
		w.CoupledTrimM = -b * L
		w.step("product of inertia I_xy (neglected above)", fmt.Sprintf("about the new axes; heel and trim solved together give %s° and %s m", handNum(w.CoupledHeelDeg), handNum(w.CoupledTrimM)), iXY, "m⁴")
	}
}

// handLollTan returns the tangent of heel t on the wall-sided relation
// gm·t + ½·bm·t³ = lever for gm ≤ 0: the root on the lever's side (on
// starboard for a nil lever) farthest from upright, the one she comes to rest
// at. bm > 0. Newton's method from above the root: the cubic is convex there,
// so the iterates fall monotonically; at most 100 steps.
func handLollTan(gm, bm, lever float64) float64 {
	if !(bm > 0) {
		return 0
	}
	sgn := 1.0
	if lever < 0 {
		sgn, lever = -1, -lever
	}
	t := math.Sqrt(math.Max(-2*gm/bm, 0)) + math.Cbrt(2*lever/bm) + 1
	for i := 0; i < 100; i++ {
		f := gm*t + bm*t*t*t/2 - lever
		df := gm + 1.5*bm*t*t
		if df <= 0 {
			break
		}
		nt := t - f/df
		if math.Abs(nt-t) <= 1e-15*(1+t) {
			t = nt
			break
		}
		t = nt
	}
	return sgn * t
}

// handNum formats a figure of the working with about four significant
// figures and no exponent; negative figures are bracketed so that they read
// well inside a formula. A figure that rounds to zero at the finest
// precision written (six decimals: round-off of sums, as a TCG of 1e-17 m
// on the centreline) is written 0, without a sign.
func handNum(x float64) string {
	if x == 0 || math.Abs(x) < 5e-7 {
		return "0"
	}
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return "—"
	}
	a := math.Abs(x)
	dec := 6
	switch {
	case a >= 1000:
		dec = 0
	case a >= 100:
		dec = 1
	case a >= 10:
		dec = 2
	case a >= 1:
		dec = 3
	case a >= 0.001:
		dec = 4
	}
	s := strconv.FormatFloat(a, 'f', dec, 64)
	if x < 0 {
		return "(−" + s + ")"
	}
	return s
}
