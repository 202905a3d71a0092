package vessels

import (
	"errors"
	"strings"
	"testing"
)

// strengthFile is a small box barge with weight extents and a [strength]
// table; each case below replaces one line of it.
const strengthFile = `format = 1
name = "Strength test barge"
[hull]
shape = "box"
length = 40.0
breadth = 10.0
depth = 5.0
[[weight]]
name = "Lightship"
mass = 600.0
lcg = 20.0
vcg = 3.0
x = [0.0, 40.0]
[strength]
limits = "harbour"
[[strength.point]]
name = "Midships"
x = 20.0
shear_sea = 3000.0
hog_sea = 30000.0
sag_sea = 25000.0
hog_harbour = 40000.0
`

func TestStrengthKeysRead(t *testing.T) {
	v, _, err := Parse("s.toml", []byte(strengthFile))
	if err != nil {
		t.Fatal(err)
	}
	if v.Weights[0].ExtentM != [2]float64{0, 40} {
		t.Errorf("extent %v", v.Weights[0].ExtentM)
	}
	g := v.Girder
	if !g.Harbour || len(g.Points) != 1 || g.Points[0].Name != "Midships" || g.Points[0].XM != 20 ||
		g.Points[0].Sea.SagKNm != 25000 || g.Points[0].Harbour.HogKNm != 40000 || g.Points[0].Harbour.ShearKN != 0 {
		t.Errorf("girder %+v", g)
	}
}

func TestStrengthKeysRefused(t *testing.T) {
	for _, c := range []struct {
		old, new string
		line     int
		key      string
		frag     string
	}{
		{"x = [0.0, 40.0]", "x = [25.0, 40.0]", 13, "weight[1].x", "does not hold the weight's lcg 20 m"},
		{"x = [0.0, 40.0]", "x = [-5.0, 40.0]", 13, "weight[1].x", "reaches beyond the hull, which runs from x = 0 to 40 m"},
		{"x = [0.0, 40.0]", "x = [40.0, 0.0]", 13, "weight[1].x", "low < high"},
		{`limits = "harbour"`, `limits = "port"`, 15, "strength.limits", `"port" is not one of "sea", "harbour"`},
		{"x = 20.0", "x = 41.0", 18, "strength.point[1].x", "lies outside the hull"},
		{"sag_sea = 25000.0", "sag_sea = -25000.0", 21, "strength.point[1].sag_sea", "above zero"},
		{"hog_harbour = 40000.0", "hogging = 40000.0", 22, "strength.point[1].hogging", "unknown key"},
	} {
		src := strings.Replace(strengthFile, c.old, c.new, 1)
		_, _, err := Parse("s.toml", []byte(src))
		var ps Problems
		if !errors.As(err, &ps) || len(ps) != 1 {
			t.Errorf("%s: got %v, want one problem", c.new, err)
			continue
		}
		p := ps[0]
		if p.Line != c.line || p.Key != c.key || !strings.Contains(p.Msg, c.frag) {
			t.Errorf("%s: got %d %s %q; want %d %s …%s…", c.new, p.Line, p.Key, p.Msg, c.line, c.key, c.frag)
		}
	}
}
