package engine

func ConvexCount(s *Solid) (int, int) {
	c := 0
	for i := range s.slabs {
		if s.slabs[i].convex {
			c++
		}
	}
	return c, len(s.slabs)
}
