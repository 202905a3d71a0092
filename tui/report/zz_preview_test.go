package report

import (
	"os"
	"testing"
	"time"

	"heelwatch/engine"
	"heelwatch/vessels"
)

func TestZZPreview(t *testing.T) {
	for _, c := range []struct {
		vessel string
		open   []string
	}{{"barge", []string{"2 wing void S"}}, {"freighter", []string{"Wing tank 2 S", "DB 2 S"}}} {
		v, info, err := vessels.Open(c.vessel)
		if err != nil {
			t.Fatal(err)
		}
		d := v.Intact()
		for i, cc := range v.Compartments {
			for _, n := range c.open {
				if cc.Name == n {
					d[i].Open = true
				}
			}
		}
		a := engine.Assess(v, d)
		if h, err := engine.HandMethod(v, d); err == nil {
			a.Hand = h
		} else {
			a.HandWhy = err.Error()
		}
		if a.Position != nil {
			g, err := engine.RightingLevers(engine.NewProblem(v, d), *a.Position)
			if err == nil {
				a.GZ = g
				cr, err := engine.EvaluateCriteria(v.CriteriaSets, engine.CriteriaCase{Curve: g, Eq: *a.Position, Damaged: true, ShipType: info.ShipType})
				if err != nil {
					t.Log(err)
				}
				a.Criteria = cr
			} else {
				t.Log(err)
			}
		}
		a.Flags = engine.Flags(v, d, a.Position, a.NoEq, a.Hand)
		r := New(v, "bundled:"+c.vessel, a, time.Now(), "dev")
		r.Condition = info.Condition
		Text(os.Stdout, r)
		if c.vessel == "freighter" {
			Markdown(os.Stdout, r)
		}
	}
}
