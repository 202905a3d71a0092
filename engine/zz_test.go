package engine_test

import (
	"fmt"
	"testing"

	"heelwatch/engine"
	"heelwatch/internal/largeship"
)

func TestZZ(t *testing.T) {
	v, _ := largeDamaged(t, largeship.Standard)
	fmt.Println(engine.ConvexCount(v.Hull.Solid()))
	for _, c := range v.Compartments[:10] {
		fmt.Println(c.Name, fmt.Sprint(engine.ConvexCount(c.Solid())))
	}
}
