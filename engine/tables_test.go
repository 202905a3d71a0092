package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// TestHydrostaticsWigley: the hydrostatic table of the Wigley hull at its
// design draft against the closed forms (references.md: Wigley hull,
// derived in refWigleyClosed): Δ = ρ·4/9·LBT, KB = 5T/8, LCB = LCF = L/2,
// TPC = ρ·(2/3)LB/100, KMT = KB + 3B²/(35T), KML = KB + 3L²/(40T) and
// MCTC = ρ·I_L/(100L), I_L = BL³/30; within 0.1 % at 81 stations and
// waterlines (the offsets' second-order error, TestWigleyConvergence).
func TestHydrostaticsWigley(t *testing.T) {
	const L, B, T, D, rho = 100.0, 10.0, 6.25, 9.0, 1.025
	h := refWigley(t, L, B, T, D, 81, 81)
	r, err := engine.Hydrostatics(h, rho, T)
	if err != nil {
		t.Fatal(err)
	}
	kb := 5 * T / 8
	for _, q := range []struct {
		name      string
		got, want float64
	}{
		{"displacement", r.DisplacementT, rho * 4 / 9 * L * B * T},
		{"KB", r.VCBM, kb},
		{"LCB", r.LCBM, L / 2},
		{"LCF", r.LCFM, L / 2},
		{"TPC", r.TPCt, rho * 2 / 3 * L * B / 100},
		{"KMT", r.KMTM, kb + 3*B*B/(35*T)},
		{"KML", r.KMLM, kb + 3*L*L/(40*T)},
		{"MCTC", r.MCTCtm, rho * B * L * L * L / 30 / (100 * L)},
	} {
		if e := math.Abs(q.got-q.want) / q.want; !(e < 1e-3) {
			t.Errorf("%s %.6f, closed form %.6f (relative error %.2e)", q.name, q.got, q.want, e)
		}
	}
	if _, err := engine.Hydrostatics(h, rho, D+1); err == nil {
		t.Error("a draft above the deck was accepted")
	}
}

// TestCapacityTableBruteForce: a wing tank clipped from the Wigley hull,
// level by level, against a brute-force integration: 4000 slices along
// the ship, each the hull's section at its middle clipped by the tank's
// box and the level (Sutherland–Hodgman on the polygon, area and moments by
// the shoelace formulas: the midpoint rule, nothing of the slabs'
// integration). Volume, centre and the surface's second moment (free-surface
// moment) agree within 1e-4 relative.
func TestCapacityTableBruteForce(t *testing.T) {
	const L, B, T, D = 100.0, 10.0, 6.25, 9.0
	h := refWigley(t, L, B, T, D, 41, 41)
	box := engine.Box{X0: 30, X1: 55, Y0: 1.5, Y1: 6, Z0: 1, Z1: 7}
	c, err := engine.NewCompartment(h, "wing", box)
	if err != nil {
		t.Fatal(err)
	}
	rows := engine.CapacityTable(c, 1.0, 0.75)
	if last := rows[len(rows)-1]; math.Abs(last.VolumeM3-c.Volume()) > 1e-9*c.Volume() || rows[0].VolumeM3 != 0 {
		t.Fatalf("table from %v to %v m³, tank %v m³", rows[0].VolumeM3, last.VolumeM3, c.Volume())
	}
	_, _, zmin, _ := c.Solid().Extent()
	const n = 4000
	for _, r := range rows[1:] {
		level := zmin + r.SoundingM
		var v, mx, my, mz, iyy, sy, aw float64
		for i := 0; i < n; i++ {
			x := box.X0 + (box.X1-box.X0)*(float64(i)+0.5)/n
			dx := (box.X1 - box.X0) / n
			p := h.SectionAt(x)
			for _, e := range [][3]float64{{-1, 0, -box.Y0}, {1, 0, box.Y1}, {0, -1, -box.Z0}, {0, 1, math.Min(box.Z1, level)}} {
				p = bruteClip(p, e[0], e[1], e[2])
			}
			a, cy, cz := bruteMoments(p)
			v += a * dx
			mx += a * x * dx
			my += cy * dx
			mz += cz * dx
			// The surface's chord at this x: where the clipped polygon
			// meets the level.
			lo, hi := math.Inf(1), math.Inf(-1)
			for _, q := range p {
				if math.Abs(q.Z-level) < 1e-9 {
					lo, hi = math.Min(lo, q.Y), math.Max(hi, q.Y)
				}
			}
			if hi > lo && level < box.Z1 {
				aw += (hi - lo) * dx
				sy += (hi*hi - lo*lo) / 2 * dx
				iyy += (hi*hi*hi - lo*lo*lo) / 3 * dx
			}
		}
		fsm := 0.0
		if aw > 0 {
			fsm = iyy - sy*sy/aw
		}
		for _, q := range [][3]float64{{r.VolumeM3, v, v}, {r.LCGM, mx / v, L}, {r.TCGM, my / v, B}, {r.VCGM, mz / v, D}, {r.FSMTm, fsm, math.Max(fsm, 1)}} {
			if math.Abs(q[0]-q[1]) > 1e-4*q[2] {
				t.Errorf("sounding %.2f m: table %v, brute force %v", r.SoundingM, q[0], q[1])
			}
		}
	}
}

// bruteClip keeps the part of polygon p with ny·y + nz·z ≤ k.
func bruteClip(p []engine.Point, ny, nz, k float64) []engine.Point {
	var out []engine.Point
	for i := range p {
		a, b := p[(i+len(p)-1)%len(p)], p[i]
		da, db := ny*a.Y+nz*a.Z-k, ny*b.Y+nz*b.Z-k
		if (da <= 0) != (db <= 0) {
			t := da / (da - db)
			out = append(out, engine.Point{Y: a.Y + t*(b.Y-a.Y), Z: a.Z + t*(b.Z-a.Z)})
		}
		if db <= 0 {
			out = append(out, b)
		}
	}
	return out
}

// bruteMoments returns a polygon's area and first moments ∫y dA, ∫z dA.
func bruteMoments(p []engine.Point) (a, sy, sz float64) {
	for i := range p {
		q, r := p[i], p[(i+1)%len(p)]
		cr := q.Y*r.Z - r.Y*q.Z
		a += cr / 2
		sy += (q.Y + r.Y) * cr / 6
		sz += (q.Z + r.Z) * cr / 6
	}
	return
}
