package main

import (
	"encoding/json"
	"io"
	"math"
	"strconv"
	"strings"

	"heelwatch/engine"
)

// fixedN prints x to n decimals; a value that rounds to zero prints as
// zero, never as "-0.000" (a centreline tank's TCG is zero to round-off,
// either side).
func fixedN(x float64, n int) string {
	s := strconv.FormatFloat(x, 'f', n, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// round4 rounds x to 4 decimals, the CSV's precision, for the JSON: no
// 0.30000000000000004 for a step's third sounding, no 3e-18 for a
// centreline TCG, no -0.
func round4(x float64) float64 {
	r := math.Round(x*1e4) / 1e4
	if r == 0 {
		return 0
	}
	return r
}

// capacityRows is tank c's capacity table as the engine works it, less a
// row whose sounding lies within half the printed millimetre of the next
// row's: a step that lands on the tank's top but for round-off would
// otherwise print the full row twice.
func capacityRows(c *engine.Compartment, rho, step float64) []engine.CapacityRow {
	rows := engine.CapacityTable(c, rho, step)
	var out []engine.CapacityRow
	for i, r := range rows {
		if i+1 < len(rows) && rows[i+1].SoundingM-r.SoundingM < 0.0005 {
			continue
		}
		out = append(out, r)
	}
	return out
}

// writeTablesJSON writes the tables wanted as one JSON document, figures
// rounded to 4 decimals. An empty tank's centre is null: it has none.
func writeTablesJSON(w io.Writer, v *engine.Vessel, want func(string) bool, hyd []engine.HydroRow, tanks []tankFull, sstep float64) error {
	type hrow struct {
		DraftM        float64 `json:"draft_m"`
		DisplacementT float64 `json:"displacement_t"`
		LCBM          float64 `json:"lcb_m"`
		VCBM          float64 `json:"vcb_m"`
		LCFM          float64 `json:"lcf_m"`
		TPCt          float64 `json:"tpc_t"`
		MCTtm         float64 `json:"mct_tm"`
		KMTM          float64 `json:"kmt_m"`
		KMLM          float64 `json:"kml_m"`
	}
	type crow struct {
		SoundingM float64  `json:"sounding_m"`
		VolumeM3  float64  `json:"volume_m3"`
		LCGM      *float64 `json:"lcg_m"`
		TCGM      *float64 `json:"tcg_m"`
		VCGM      *float64 `json:"vcg_m"`
		FSMtm     float64  `json:"fsm_tm"`
	}
	type tank struct {
		tankFull
		DensityTM3 *float64 `json:"density_t_m3,omitempty"` // the liquid's the FSM is worked for
		Capacity   []crow   `json:"capacity,omitempty"`
	}
	doc := struct {
		Vessel       string `json:"vessel"`
		Hydrostatics []hrow `json:"hydrostatics,omitempty"`
		Tanks        []tank `json:"tanks,omitempty"`
	}{Vessel: v.Name}
	if want("hydrostatics") {
		for _, r := range hyd {
			doc.Hydrostatics = append(doc.Hydrostatics, hrow{round4(r.DraftM), round4(r.DisplacementT), round4(r.LCBM), round4(r.VCBM),
				round4(r.LCFM), round4(r.TPCt), round4(r.MCTCtm), round4(r.KMTM), round4(r.KMLM)})
		}
	}
	if want("tanks") || want("capacity") {
		for k, i := range tanksOf(v) {
			f := tanks[k]
			t := tank{tankFull: tankFull{f.Name, round4(f.VolumeM3), round4(f.LCGM), round4(f.TCGM), round4(f.VCGM)}}
			if want("capacity") {
				c := v.Compartments[i]
				rho := liquidDensity(c, v.WaterDensity)
				t.DensityTM3 = &rho
				for _, r := range capacityRows(c, rho, sstep) {
					row := crow{SoundingM: round4(r.SoundingM), VolumeM3: round4(r.VolumeM3), FSMtm: round4(r.FSMTm)}
					if r.VolumeM3 > 0 {
						x, y, z := round4(r.LCGM), round4(r.TCGM), round4(r.VCGM)
						row.LCGM, row.TCGM, row.VCGM = &x, &y, &z
					}
					t.Capacity = append(t.Capacity, row)
				}
			}
			doc.Tanks = append(doc.Tanks, t)
		}
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(doc)
}
