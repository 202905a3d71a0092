package vessels

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"heelwatch/engine"
)

func openBundled(t *testing.T, name string) (*engine.Vessel, *Info) {
	t.Helper()
	v, info, err := Open(name)
	if err != nil {
		t.Fatal(err)
	}
	return v, info
}

func TestConditionFilesRead(t *testing.T) {
	v, info := openBundled(t, "freighter")
	for _, f := range []string{"freighter-ballast-departure.toml", "freighter-sounded.toml"} {
		c, err := LoadCondition("../testdata/conditions/"+f, v, info)
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		nv, err := c.Apply(v)
		if err != nil {
			t.Fatalf("%s: apply: %v", f, err)
		}
		if _, err := engine.Solve(nv, nv.Intact()); err != nil {
			t.Errorf("%s: %v", f, err)
		}
	}
}

// A condition that says again what the vessel file says (all its weights
// kept, every tank at its fill) gives the same ship: the same equilibrium
// to round-off.
func TestConditionSameAsVesselFile(t *testing.T) {
	v, info := openBundled(t, "freighter")
	var b strings.Builder
	b.WriteString("format = 1\nkeep = [")
	for i, w := range v.Weights {
		if i > 0 {
			b.WriteString(", ")
		}
		b.WriteString(`"` + strings.ToUpper(w.Name) + `"`) // ignoring case
	}
	b.WriteString("]\n")
	for _, c := range v.Compartments {
		if c.Liquid != nil {
			b.WriteString("[[tank]]\nname = \"" + c.Name + "\"\nfill = " + strconvG(c.Liquid.Fill) + "\n")
		}
	}
	c, err := ParseCondition("same.toml", []byte(b.String()), v, info)
	if err != nil {
		t.Fatal(err)
	}
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	p0, err0 := engine.Solve(v, v.Intact())
	p1, err1 := engine.Solve(nv, nv.Intact())
	if err0 != nil || err1 != nil {
		t.Fatal(err0, err1)
	}
	if math.Abs(p0.DraftAftM-p1.DraftAftM) > 1e-9 || math.Abs(p0.DraftFwdM-p1.DraftFwdM) > 1e-9 || math.Abs(p0.HeelDeg-p1.HeelDeg) > 1e-9 {
		t.Errorf("file %+v, condition %+v", p0, p1)
	}
}

// The amounts given four ways come to the fills they should: a fraction
// as it is, m³ and tonnes over the capacity (μ × volume inside the hull),
// and on the box barge a level sounding over a box tank the depth times
// its plan (a rectangular prism: V = μ·L·B·s, exact).
func TestConditionAmounts(t *testing.T) {
	v, info := openBundled(t, "barge")
	src := `format = 1
name = "Test"
heel_deg = 0.0
trim_m = 0.0
keep = ["lightship"]
[[tank]]
name = "DB ballast aft"
sounding_m = 0.4
[[tank]]
name = "DB ballast fwd"
mass_t = 200.0
`
	c, err := ParseCondition("c.toml", []byte(src), v, info)
	if err != nil {
		t.Fatal(err)
	}
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	aft, fwd := v.Compartments[1], v.Compartments[2]
	wantAft := aft.Permeability * 34 * 16 * 0.4 / aft.CapacityM3()
	if got := nv.Compartments[1].Liquid.Fill; math.Abs(got-wantAft) > 1e-9 {
		t.Errorf("sounded fill %g, prism %g", got, wantAft)
	}
	wantFwd := 200 / 1.025 / fwd.CapacityM3()
	if got := nv.Compartments[2].Liquid.Fill; math.Abs(got-wantFwd) > 1e-12 {
		t.Errorf("fill from tonnes %g, want %g", got, wantFwd)
	}
	if len(nv.Weights) != 1 || nv.Weights[0].Name != "Lightship" {
		t.Errorf("weights %v: want the lightship kept alone", nv.Weights)
	}
}

// Without heel_deg and trim_m the soundings are read where she lies with
// the condition applied: at her equilibrium, reading the sounding again
// gives back the fill (a fixed point).
func TestConditionSoundingAtHerOwnHeelAndTrim(t *testing.T) {
	v, info := openBundled(t, "freighter")
	c, err := LoadCondition("../testdata/conditions/freighter-ballast-departure.toml", v, info)
	if err != nil {
		t.Fatal(err)
	}
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	pos, err := engine.Solve(nv, nv.Intact())
	if err != nil {
		t.Fatal(err)
	}
	for _, tf := range c.Tanks {
		if !tf.BySounding() {
			continue
		}
		cp := nv.Compartments[tf.Compartment]
		vol, err := cp.SoundingVolumeM3(tf.Pipe, tf.SoundingM, pos.Plane)
		if err != nil {
			t.Fatal(err)
		}
		if got := cp.Liquid.Fill; math.Abs(got-vol/cp.CapacityM3()) > 1e-7 {
			t.Errorf("%s: fill %g, but the sounding read at trim %.3f m reads %g", cp.Name, got, pos.TrimM, vol/cp.CapacityM3())
		}
		if pos.TrimM == 0 {
			t.Error("trim 0: the test shows nothing")
		}
	}
}

func TestConditionProblems(t *testing.T) {
	v, info := openBundled(t, "barge")
	cases := []struct{ src, want string }{
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast middle\"\nfill = 0.5\n",
			`c.toml:4: tank[1].name: "DB ballast middle" is not a compartment of the vessel (did you mean "DB ballast fwd"?)`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nvolume_m3 = 600.0\n",
			`c.toml:5: tank[1].volume_m3: 600 m³ is more than "DB ballast aft" holds`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nmass_t = 600.0\n",
			`c.toml:5: tank[1].mass_t: 600 t is more than`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nfill = 1.2\n",
			`c.toml:5: tank[1].fill: 1.2 is more than 1`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nsounding_m = 1.5\n",
			`c.toml:5: tank[1].sounding_m: 1.5 m is more than "DB ballast aft" can sound: it is full at 1.000 m`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nfill = 0.5\nvolume_m3 = 3.0\n",
			`tank[1].volume_m3: give one of fill, volume_m3, mass_t, sounding_m, not both fill and volume_m3`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"Hold aft\"\nfill = 0.5\n",
			`"Hold aft" is a dry cargo, not a tank`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nfill = 0.5\n[[tank]]\nname = \"db ballast AFT\"\nfill = 0.2\n",
			`c.toml:7: tank[2].name: "DB ballast aft" is already given by tank[1]`},
		{"format = 1\nkeep = [\"Lightshp\"]\n", `c.toml:2: keep[1]: "Lightshp" is not a weight of the vessel file (did you mean "Lightship"?)`},
		{"format = 1\n", `c.toml:1: weight: missing`},
		{"format = 1\nkeep = [\"Lightship\"]\nballast = 3\n", `c.toml:3: ballast: unknown key`},
		{"format = 1\nkeep = [\"Lightship\"]\n[[weight]]\nname = \"lightship\"\nmass = 1.0\nlcg = 3.0\nvcg = 1.0\n",
			`weight[1].name: "lightship" is already the name of a weight kept from the vessel file`},
		{"format = 1\nkeep = [\"Lightship\"]\nheel_deg = 2.0\n", `heel_deg: give both heel_deg and trim_m`},
	}
	for _, c := range cases {
		_, err := ParseCondition("c.toml", []byte(c.src), v, info)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q:\n got %v\nwant %s", c.src, err, c.want)
		}
	}
}

func TestSoundingPipeKey(t *testing.T) {
	src, _ := Source("barge")
	s := strings.Replace(string(src), "fill = 0.55\n", "fill = 0.55\nsounding_pipe = [7.0, -7.5]\n", 1)
	v, info, err := Parse("b.toml", []byte(s))
	if err != nil {
		t.Fatal(err)
	}
	if p := info.Compartments[1].SoundingPipe; p == nil || p.X != 7 || p.Y != -7.5 {
		t.Fatalf("pipe %v", p)
	}
	// Trimmed 1 m by the stern, a sounding at the aft end reads deeper than
	// at the middle: less liquid for the same sounding.
	c, err := ParseCondition("c.toml", []byte("format = 1\nkeep = [\"Lightship\"]\nheel_deg = 0.0\ntrim_m = 1.0\n[[tank]]\nname = \"DB ballast aft\"\nsounding_m = 0.5\n"), v, info)
	if err != nil {
		t.Fatal(err)
	}
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	// Prism: depth at the tank's middle (x = 23) is 0.5 − (1/80)(23 − 7).
	want := (0.5 - (23.0-7.0)/80) / 1.0
	if got := nv.Compartments[1].Liquid.Fill; math.Abs(got-want) > 1e-9 {
		t.Errorf("fill %g, prism %g", got, want)
	}
	bad := strings.Replace(string(src), "fill = 0.55\n", "fill = 0.55\nsounding_pipe = [50.0, 0.0]\n", 1)
	if _, _, err := Parse("b.toml", []byte(bad)); err == nil || !strings.Contains(err.Error(), "sounding_pipe: [50, 0] lies outside the compartment") {
		t.Errorf("pipe outside: %v", err)
	}
}

func strconvG(f float64) string { return strconv.FormatFloat(f, 'f', -1, 64) }
