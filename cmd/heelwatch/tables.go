package main

import (
	"encoding/csv"
	"flag"
	"fmt"
	"io"
	"math"
	"text/tabwriter"

	"heelwatch/engine"
)

const tablesHelp = `heelwatch tables: the ship's hydrostatic and tank tables, from her hull.

Usage:
  heelwatch tables [--vessel FILE|NAME] [--table T] [--step M] [--format F]

  --table T    hydrostatics, tanks or capacity (csv: one table, default
               hydrostatics; text and json: all three unless one is named)
  --step M     the drafts' step, m (default 0.25, from one step above the
               keel; the last row is at the lowest deck at side, where the
               model's hull ends); the tanks' soundings step M/2.5
  --format F   text (default), csv or json

hydrostatics: at even keel and upright, per draft: displacement, LCB, VCB
(KB), LCF, TPC, MCTC, KMT, KML (columns as heelwatch verify reads them).
tanks: each tank full (μ × its volume) and its centre. capacity: each tank
level by level from empty to full: sounding at its sounding pipe (the file's
sounding_pipe, else at the tank's lowest point), volume,
centre (blank, or null, when empty), free-surface moment (its own liquid's
density, given in the heading, the CSV's density_t_m3 column and the JSON's
density_t_m3; sea water if none). JSON figures are rounded to 4 decimals.
`

// tanksOf returns the indices of v's tanks (use "tank").
func tanksOf(v *engine.Vessel) []int {
	var out []int
	for i, c := range v.Compartments {
		if c.Use == "tank" {
			out = append(out, i)
		}
	}
	return out
}

// hydroTable returns the hydrostatic table of v at every step from one
// step above the keel, and at the top of the hydrostatic range (the lowest
// deck at side, hydroRange) when the steps do not land on it.
func hydroTable(v *engine.Vessel, step float64) []engine.HydroRow {
	hr := hydroRangeOf(v.Hull)
	var rows []engine.HydroRow
	for k := 1; ; k++ {
		T := math.Round(float64(k)*step*1e6) / 1e6
		if T > hr.TopM-1e-9 {
			T = hr.TopM
		}
		if r, err := hydrostaticsAt(v, hr, T); err == nil && T > hr.KeelM {
			rows = append(rows, r)
		}
		if T >= hr.TopM {
			return rows
		}
	}
}

// tankFull is one line of the tanks table: a tank full.
type tankFull struct {
	Name     string  `json:"name"`
	VolumeM3 float64 `json:"volume_m3"`
	LCGM     float64 `json:"lcg_m"`
	TCGM     float64 `json:"tcg_m"`
	VCGM     float64 `json:"vcg_m"`
}

// fullTanks returns each tank of v full: its capacity μ × its volume inside
// the hull (m³) and the centroid of that volume (ship frame, m).
func fullTanks(v *engine.Vessel) []tankFull {
	var out []tankFull
	for _, i := range tanksOf(v) {
		c := v.Compartments[i]
		x, y, z := c.Solid().Whole().Centroid()
		out = append(out, tankFull{c.Name, c.Permeability * c.Volume(), x, y, z})
	}
	return out
}

// liquidName names what a tank's free-surface moment is worked for: its
// liquid, or the sea water it would hold when the file gives none.
func liquidName(c *engine.Compartment) string {
	if c.Liquid != nil && c.Liquid.Density > 0 && c.Liquid.Name != "" {
		return c.Liquid.Name
	}
	if c.Liquid != nil && c.Liquid.Density > 0 {
		return "its liquid"
	}
	return "sea water"
}

// liquidDensity is the density (t/m³) a tank's free-surface moment is
// worked at: its liquid's, else water, the sea's (liquidName).
func liquidDensity(c *engine.Compartment, water float64) float64 {
	if c.Liquid != nil && c.Liquid.Density > 0 {
		return c.Liquid.Density
	}
	return water
}

// hydroColumns are the hydrostatic table's CSV columns, as verify reads them.
var hydroColumns = []string{"draft_m", "displacement_t", "lcb_m", "vcb_m", "lcf_m", "tpc_t", "mct_tm", "kmt_m", "kml_m"}

// hydroValues is row r's figures in the order of hydroColumns.
func hydroValues(r engine.HydroRow) []float64 {
	return []float64{r.DraftM, r.DisplacementT, r.LCBM, r.VCBM, r.LCFM, r.TPCt, r.MCTCtm, r.KMTM, r.KMLM}
}

// runTables runs `heelwatch tables` (tablesHelp) and returns its exit status.
func runTables(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch tables", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	vessel := fs.String("vessel", "", "")
	table := fs.String("table", "", "")
	step := fs.Float64("step", 0.25, "")
	format := fs.String("format", "text", "")
	help := func(w io.Writer) { fmt.Fprint(w, tablesHelp) }
	rest, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "tables", help)
	}
	switch {
	case len(rest) > 0:
		fmt.Fprintf(stderr, "heelwatch tables: unexpected argument %q (the vessel is --vessel)\n", rest[0])
		return exitUsage
	case *table != "" && *table != "hydrostatics" && *table != "tanks" && *table != "capacity":
		fmt.Fprintf(stderr, "heelwatch tables: --table %q: give hydrostatics, tanks or capacity\n", *table)
		return exitUsage
	case !(*step >= 0.01 && *step <= 5):
		fmt.Fprintf(stderr, "heelwatch tables: --step %g: give a step in metres from 0.01 to 5\n", *step)
		return exitUsage
	case *format != "text" && *format != "csv" && *format != "json":
		fmt.Fprintf(stderr, "heelwatch tables: --format %q: give text, csv or json\n", *format)
		return exitUsage
	}
	v, info, status := openVessel(*vessel, stderr)
	if status != exitOK {
		return status
	}
	want := func(t string) bool { return *table == "" || *table == t }
	if *format == "csv" && *table == "" {
		*table = "hydrostatics"
	}
	hyd := hydroTable(v, *step)
	tanks := fullTanks(v)
	sstep := *step / 2.5
	var werr error
	switch *format {
	case "csv":
		cw := csv.NewWriter(stdout)
		f := func(x float64) string { return fixedN(x, 4) }
		switch *table {
		case "hydrostatics":
			cw.Write(hydroColumns)
			for _, r := range hyd {
				var rec []string
				for _, x := range hydroValues(r) {
					rec = append(rec, f(x))
				}
				cw.Write(rec)
			}
		case "tanks":
			cw.Write([]string{"name", "volume_m3", "lcg_m", "tcg_m", "vcg_m"})
			for _, t := range tanks {
				cw.Write([]string{t.Name, f(t.VolumeM3), f(t.LCGM), f(t.TCGM), f(t.VCGM)})
			}
		case "capacity":
			cw.Write([]string{"name", "sounding_m", "volume_m3", "lcg_m", "tcg_m", "vcg_m", "fsm_tm", "density_t_m3"})
			for _, i := range tanksOf(v) {
				c := v.Compartments[i]
				rho := liquidDensity(c, v.WaterDensity)
				for _, r := range capacityRows(c, rho, sstep) {
					lcg, tcg, vcg := "", "", ""
					if r.VolumeM3 > 0 {
						lcg, tcg, vcg = f(r.LCGM), f(r.TCGM), f(r.VCGM)
					}
					cw.Write([]string{c.Name, f(r.SoundingM), f(r.VolumeM3), lcg, tcg, vcg, f(r.FSMTm), fixedN(rho, 3)})
				}
			}
		}
		cw.Flush()
		werr = cw.Error()
	case "json":
		werr = writeTablesJSON(stdout, v, want, hyd, tanks, sstep)
	default:
		tw := tabwriter.NewWriter(stdout, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintf(tw, "%s — %s\n", v.Name, source(info))
		if want("hydrostatics") {
			fmt.Fprintf(tw, "\nHydrostatics, even keel, upright, water %.3f t/m³\n", v.WaterDensity)
			fmt.Fprintf(tw, "drafts %s\n", hydroRangeOf(v.Hull).why())
			fmt.Fprintln(tw, "draft m\tΔ t\tLCB m\tKB m\tLCF m\tTPC t/cm\tMCTC t·m/cm\tKMT m\tKML m\t")
			for _, r := range hyd {
				fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t\n", fixedN(r.DraftM, 3), fixedN(r.DisplacementT, 1), fixedN(r.LCBM, 3), fixedN(r.VCBM, 3),
					fixedN(r.LCFM, 3), fixedN(r.TPCt, 2), fixedN(r.MCTCtm, 1), fixedN(r.KMTM, 3), fixedN(r.KMLM, 1))
			}
		}
		if want("tanks") {
			fmt.Fprintln(tw, "\nTanks full (μ × volume)")
			fmt.Fprintln(tw, "tank\tm³\tLCG m\tTCG m\tVCG m\t")
			for _, t := range tanks {
				fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t\n", t.Name, fixedN(t.VolumeM3, 1), fixedN(t.LCGM, 3), fixedN(t.TCGM, 3), fixedN(t.VCGM, 3))
			}
		}
		if want("capacity") {
			for _, i := range tanksOf(v) {
				c := v.Compartments[i]
				rho := liquidDensity(c, v.WaterDensity)
				fmt.Fprintf(tw, "\nCapacity: %s, FSM for %s of %.3f t/m³\n", c.Name, liquidName(c), rho)
				fmt.Fprintln(tw, "sounding m\tm³\tLCG m\tTCG m\tVCG m\tFSM t·m\t")
				for _, r := range capacityRows(c, rho, sstep) {
					lcg, tcg, vcg := "", "", ""
					if r.VolumeM3 > 0 {
						lcg, tcg, vcg = fixedN(r.LCGM, 3), fixedN(r.TCGM, 3), fixedN(r.VCGM, 3)
					}
					fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t\n", fixedN(r.SoundingM, 3), fixedN(r.VolumeM3, 1), lcg, tcg, vcg, fixedN(r.FSMTm, 1))
				}
			}
		}
		werr = tw.Flush()
	}
	if werr != nil {
		fmt.Fprintln(stderr, "heelwatch tables: writing the tables:", werr)
		return exitFailed
	}
	return exitOK
}
