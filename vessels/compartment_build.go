package vessels

import (
	"runtime"
	"sync"
	"sync/atomic"

	"heelwatch/engine"
)

// buildSolids builds on hull the compartment of each read that is to be
// built (cr.build), setting cr.c and cr.err: a box clipped by the hull
// (engine.NewCompartment) or a compartment given by its sections
// (engine.NewSectionCompartment). The compartments are independent, so
// they are built concurrently, on as many goroutines as GOMAXPROCS allows
// (one: in turn, on the caller's); each result lands in its own read, so
// the order and the values are those of building them one by one.
func buildSolids(hull *engine.Hull, reads []compartmentRead) {
	var todo []int
	for i := range reads {
		if reads[i].build {
			todo = append(todo, i)
		}
	}
	build := func(cr *compartmentRead) {
		if cr.secs != nil {
			cr.c, cr.err = engine.NewSectionCompartment(hull, cr.name, cr.secs)
		} else {
			cr.c, cr.err = engine.NewCompartment(hull, cr.name, cr.box)
		}
	}
	workers := min(runtime.GOMAXPROCS(0), len(todo))
	if workers <= 1 {
		for _, i := range todo {
			build(&reads[i])
		}
		return
	}
	var next atomic.Int64
	var wg sync.WaitGroup
	for range workers {
		wg.Go(func() {
			for {
				k := int(next.Add(1)) - 1
				if k >= len(todo) {
					return
				}
				build(&reads[todo[k]])
			}
		})
	}
	wg.Wait()
}
