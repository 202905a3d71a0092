package engine

import "math"

// endGMs sets the GMs of the network run's end position. Equalised and
// within 5 mm of the static spread, the end is that state (every flooded
// space in free communication with the sea), so both GMs are the static
// state's, worked out at the end's plane (openBasisGMs): one GM wherever the
// one position appears. Otherwise the water is held as an added weight and
// the upright GM is worked out for it (it was left unset).
func (r *NetworkRun) endGMs(rep *NetworkReport, sp *Spread) {
	p := rep.Final.Position
	if p == nil {
		return
	}
	if r.end == FloodEqualised && sp.Position != nil && rep.FinalDiffM <= 5e-3 {
		openBasisGMs(r.v, sp.Damage, p)
		return
	}
	if math.IsNaN(p.GMUprightM) {
		FillUpright(r.v, r.damageAt(rep.Final.WaterM3), p)
	}
}
