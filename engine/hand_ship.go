package engine

import (
	"fmt"
	"math"
	"strings"
)

// handShip works the lost-buoyancy method on a ship-shaped hull as an
// officer does from the booklet: the ship's own hydrostatics at the draft
// (displacement table, TPC, LCF, KB, the waterplane's second moments, so
// KM and MCTC) and, for each compartment open to the sea, the part of the
// waterplane it takes away with its own area, centroid and second moments
// (the tank tables' free-surface data give the same). Steps:
//
//	V   = Δ/ρ;  T₀: the even-keel draft whose displacement is Δ (hydrostatic table)
//	v   = Σ μ·(space's volume below T₀);  a = Σ μ·(space's waterplane at T₀)
//	s   = v / (A_WP − a) = v·ρ/(100·TPC′)            (sinkage, TPC′ of the intact waterplane)
//	T₁  = T₀ + s
//
// At T₁ the intact waterplane is the hull's less μ × each space's: area A′,
// centroid (xF, yF), and second moments about its own axes by the
// parallel-axis theorem, I_T′ = ΣI_y(about the centreline) − A′·yF²,
// I_L′ = ΣI_x(about the aft perpendicular) − A′·xF², I_xy likewise. The
// remaining body below T₁ (hull less μ × the spaces) gives KB′, LCB′ and
// TCB′. BM = I_T′/V, KM = KB′ + BM, GM = KM − KG − FSC, GML = KB′ + I_L′/V
// − KG − FSC, MCTC = Δ·GML/(100·L); tan θ = (TCG − TCB′)/GM; trim =
// Δ·(LCB′ − LCG)/(100·MCTC) (m, by the stern when G lies aft of B), drafts
// at the perpendiculars turning about F, as on a box (see HandMethod).
//
// Where it stops holding, a step says so: the waterplane changing by more
// than 5 % between T₀ and T₁ (the sinkage from TPC at T₀ is then rough),
// and the heel beyond 10° (small angles). On a box this is the box
// method's working with the box's hydrostatics.
func handShip(v *Vessel, d Damage) (*HandWorking, error) {
	h := v.Hull
	L := h.LengthM
	type space struct {
		name  string
		mu    float64
		solid *Solid
	}
	var spaces []space
	var held, spilt []string
	var spiltT float64
	for i, c := range v.Compartments {
		s := d.state(i)
		switch {
		case s.Open:
			spaces = append(spaces, space{c.Name, v.Permeability(d, i), c.solid})
			if m, _, _, _, _ := v.TankContents(i); m > 0 {
				spilt = append(spilt, c.Name)
				spiltT += m
			}
		case s.WaterM3 > 0:
			held = append(held, c.Name)
		}
	}
	switch {
	case len(held) > 0:
		return nil, &HandNotApplicable{fmt.Sprintf("floodwater is held as an added weight in %s; the lost-buoyancy hand method takes only compartments open to the sea", strings.Join(held, ", "))}
	case len(spaces) == 0:
		return nil, &HandNotApplicable{"no compartment is open to the sea"}
	}
	w := &HandWorking{}
	step := w.step
	n := handNum
	ld := v.Loading(d)
	rho := v.WaterDensity
	if len(spilt) > 0 {
		step("contents run out to the sea", "tank contents of "+strings.Join(spilt, ", ")+" are lost", spiltT, "t")
	}
	V := ld.MassT / rho
	step("displaced volume V", fmt.Sprintf("Δ/ρ = %s/%s", n(ld.MassT), n(rho)), V, "m³")
	if V >= h.solid.Volume() {
		return nil, &HandNotApplicable{"her displacement is more than the whole hull: there is no intact draft"}
	}
	p0, _ := levelForVolume(h.solid, V, 0, 0)
	T0 := p0.A
	step("intact draft T₀", fmt.Sprintf("from the hydrostatic table, Δ = %s t", n(ld.MassT)), T0, "m")
	level := func(s *Solid, T float64) Immersion { return s.Below(Plane{A: T}) }
	hull0 := level(h.solid, T0)
	var v0, a0 float64
	for _, sp := range spaces {
		im := level(sp.solid, T0)
		step("lost volume of "+sp.name, fmt.Sprintf("μ × its volume below T₀ = %s × %s", n(sp.mu), n(im.V)), sp.mu*im.V, "m³")
		v0 += sp.mu * im.V
		a0 += sp.mu * im.AW
	}
	step("lost volume v", "Σ μ × volume below T₀", v0, "m³")
	step("lost waterplane a", "Σ μ × waterplane area at T₀", a0, "m²")
	A0 := hull0.AW - a0
	if !(A0 > 0) {
		return nil, &HandNotApplicable{"the open spaces take the whole waterplane: there is none left for the method"}
	}
	tpc := rho * A0 / 100
	step("TPC of the intact waterplane", fmt.Sprintf("ρ·(A_WP − a)/100 = %s×(%s − %s)/100", n(rho), n(hull0.AW), n(a0)), tpc, "t/cm")
	s := v0 * rho / (100 * tpc)
	step("sinkage s", fmt.Sprintf("v·ρ/(100·TPC) = %s×%s/(100×%s)", n(v0), n(rho), n(tpc)), s, "m")
	T1 := T0 + s
	step("new mean draft T₁", fmt.Sprintf("T₀ + s = %s + %s", n(T0), n(s)), T1, "m")
	if T1 >= h.DepthM {
		return nil, &HandNotApplicable{fmt.Sprintf("the sinkage takes the mean draft past the deck at %s m: there is no waterplane for the method", n(h.DepthM))}
	}

	// The intact waterplane and the remaining body at T1.
	hull1 := level(h.solid, T1)
	e := hull1
	var lost Immersion
	for _, sp := range spaces {
		im := level(sp.solid, T1)
		lost.add(im, sp.mu)
		e.add(im, -sp.mu)
	}
	if math.Abs(e.AW-A0) > 0.05*A0 {
		step("caution: the intact waterplane changes by more than 5 % between T₀ and T₁", fmt.Sprintf("%s m² at T₀, %s m² at T₁: the sinkage from TPC at T₀ is rough", n(A0), n(e.AW)), e.AW-A0, "m²")
	}
	step("waterplane of the hull at T₁", "hydrostatic table", hull1.AW, "m²")
	step("lost waterplane at T₁", "Σ μ × the spaces' waterplane at T₁", lost.AW, "m²")
	A1 := e.AW
	if !(A1 > 0) {
		return nil, &HandNotApplicable{"no waterplane is left at the new draft"}
	}
	xF, yF := e.SX/A1, e.SY/A1
	if math.Abs(yF) < 1e-9*h.BreadthM {
		yF = 0 // round-off of a symmetric waterplane
	}
	w.IntactDraftM, w.VolumeM3, w.LostVolumeM3 = T0, V, v0
	w.SinkageM, w.DraftM = s, T1
	w.LostAreaM2, w.WaterplaneM2 = lost.AW, A1
	w.LCFM, w.TCFM = xF, yF
	w.CFShiftM = math.Abs(yF)
	step("intact waterplane A′", fmt.Sprintf("%s − %s", n(hull1.AW), n(lost.AW)), A1, "m²")
	step("centre of flotation, transverse yF", fmt.Sprintf("(0 − Σ μ·a·y)/A′ = %s/%s (%s)", n(-lost.SY), n(A1), signWords(yF, "starboard", "port", "on the centreline")), yF, "m")
	step("centre of flotation, LCF", fmt.Sprintf("(A_WP·LCF − Σ μ·a·x)/A′ = (%s − %s)/%s", n(hull1.SX), n(lost.SX), n(A1)), xF, "m")
	iT := e.IYY - A1*yF*yF
	iL := e.IXX - A1*xF*xF
	iXY := e.IXY - A1*xF*yF
	step("I_T of the intact waterplane about yF", fmt.Sprintf("I_hull − Σ μ·i_lost about the centreline, − A′·yF² = %s − %s − %s×%s²", n(hull1.IYY), n(lost.IYY), n(A1), n(yF)), iT, "m⁴")
	step("I_L of the intact waterplane about xF", fmt.Sprintf("I_hull − Σ μ·i_lost about the AP, − A′·xF² = %s − %s − %s×%s²", n(hull1.IXX), n(lost.IXX), n(A1), n(xF)), iL, "m⁴")
	w.ITM4, w.ILM4, w.IXYM4 = iT, iL, iXY
	// The remaining body below T1 holds V to the sinkage's accuracy;
	// its centre is taken over its own volume.
	lcb, tcb, kb := e.Centroid()
	w.KBM, w.LCBM, w.TCBM = kb, lcb, tcb
	step("KB of the remaining buoyant body", fmt.Sprintf("(hull − Σ μ·lost) moments / volume, %s m³", n(e.V)), kb, "m")
	w.BMM = iT / V
	w.BMLM = iL / V
	step("BM", fmt.Sprintf("I_T/V = %s/%s", n(iT), n(V)), w.BMM, "m")
	if err := w.metacentre(ld, "I_L/V"); err != nil {
		return nil, err
	}
	W := ld.MassT
	mctc := W * w.GMLM / (100 * L)
	step("MCTC", fmt.Sprintf("Δ·GML/(100·L) = %s×%s/(100×%s)", n(W), n(w.GMLM), n(L)), mctc, "t·m/cm")

	// The list.
	step("TCB of the remaining buoyant body", "(hull − Σ μ·lost) moment / volume", w.TCBM, "m")
	lever := ld.TCGM - w.TCBM
	step("list lever", fmt.Sprintf("TCG − TCB = %s − %s (%s)", n(ld.TCGM), n(w.TCBM), signWords(lever, "G to starboard of B", "G to port of B", "G over B")), lever, "m")
	tanT := w.handHeelTan(lever)
	w.HeelDeg = math.Atan(tanT) * 180 / math.Pi
	step("heel θ", fmt.Sprintf("atan(%s), %s", strings.TrimSuffix(strings.TrimPrefix(n(tanT), "("), ")"), signWords(tanT, "starboard side down", "port side down", "upright")), w.HeelDeg, "°")
	if math.Abs(w.HeelDeg) > 10 {
		step("caution: heel beyond 10°", "the small-angle method loses its hold: read the direct answer", w.HeelDeg, "°")
	}

	// Trim.
	step("LCB of the remaining buoyant body", "(hull − Σ μ·lost) moment / volume", w.LCBM, "m")
	// G aft of B (LCB > LCG) trims her by the stern: positive.
	w.TrimM = W * (w.LCBM - ld.LCGM) / (100 * mctc)
	step("trim", fmt.Sprintf("Δ·(LCB − LCG)/(100·MCTC) = %s×(%s − %s)/(100×%s) (%s)", n(W), n(w.LCBM), n(ld.LCGM), n(mctc), signWords(w.TrimM, "by the stern", "by the head", "even keel")), w.TrimM, "m")

	// Drafts on the centreline, the waterline turning about F.
	w.drafts(T1, xF, yF, L, tanT)
	w.handCoupled(iXY, V, L, lever, ld.LCGM)
	return w, nil
}
