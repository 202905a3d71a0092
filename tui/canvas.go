package tui

import (
	"math"
	"strings"

	"github.com/charmbracelet/lipgloss"
)

// ink is what a dot or a cell of a picture shows; a higher ink is drawn
// over a lower one in the same cell.
type ink uint8

const (
	inkNone ink = iota
	inkAxis
	inkFlood
	inkBulkhead
	inkWater
	inkHull
	inkCurve
	inkSpace
	inkMark
	inkOpening
	inkOpeningWet
	inkText
)

// canvas is a picture in terminal cells. Lines are drawn in braille dots,
// two across and four down in each cell, so that a dot is about as wide as
// it is tall; areas are filled cell by cell with a shade character; labels
// are written over both.
type canvas struct {
	w, h int
	dots []uint8
	dink []ink
	fill []rune
	fink []ink
	text []rune
	tink []ink

	// The world window: x0..x1 across, y0..y1 up.
	x0, x1, y0, y1 float64
}

func newCanvas(w, h int) *canvas {
	if w < 1 {
		w = 1
	}
	if h < 1 {
		h = 1
	}
	n := w * h
	return &canvas{w: w, h: h, dots: make([]uint8, n), dink: make([]ink, n),
		fill: make([]rune, n), fink: make([]ink, n), text: make([]rune, n), tink: make([]ink, n),
		x0: 0, x1: 1, y0: 0, y1: 1}
}

// window sets the world rectangle that the canvas shows.
func (c *canvas) window(x0, x1, y0, y1 float64) {
	if !(x1 > x0) || !finite(x0, x1) {
		x0, x1 = 0, 1
	}
	if !(y1 > y0) || !finite(y0, y1) {
		y0, y1 = 0, 1
	}
	c.x0, c.x1, c.y0, c.y1 = x0, x1, y0, y1
}

// windowEqual sets a window holding x0..x1 × y0..y1 with equal scales on
// both axes (a braille dot is about square), centred.
func (c *canvas) windowEqual(x0, x1, y0, y1 float64) {
	dw, dh := float64(2*c.w), float64(4*c.h)
	sx := (x1 - x0) / dw
	sy := (y1 - y0) / dh
	s := math.Max(sx, sy)
	if !(s > 0) || !finite(s) {
		c.window(x0, x1, y0, y1)
		return
	}
	cx, cy := (x0+x1)/2, (y0+y1)/2
	c.window(cx-s*dw/2, cx+s*dw/2, cy-s*dh/2, cy+s*dh/2)
}

// windowStretched is windowEqual, but lets the across scale grow up to
// stretch times the up scale when the canvas is wide and low, so that a
// small picture is not a sliver. The scales stay labelled.
func (c *canvas) windowStretched(x0, x1, y0, y1, stretch float64) {
	dw, dh := float64(2*c.w), float64(4*c.h)
	sx := (x1 - x0) / dw
	sy := (y1 - y0) / dh
	if !(sx > 0 && sy > 0) || !finite(sx, sy) {
		c.window(x0, x1, y0, y1)
		return
	}
	if sy > sx {
		// Room to spare across: use up to stretch of it.
		s := math.Max(sx, sy/stretch)
		cx := (x0 + x1) / 2
		c.window(cx-s*dw/2, cx+s*dw/2, y0, y1)
		return
	}
	c.windowEqual(x0, x1, y0, y1)
}

// dotX and dotY map world coordinates to dot coordinates.
func (c *canvas) dotX(x float64) float64 { return (x - c.x0) / (c.x1 - c.x0) * float64(2*c.w) }
func (c *canvas) dotY(y float64) float64 { return (c.y1 - y) / (c.y1 - c.y0) * float64(4*c.h) }

// cellX and cellY map world coordinates to a cell (may be outside).
func (c *canvas) cellX(x float64) int { return int(math.Floor(c.dotX(x) / 2)) }
func (c *canvas) cellY(y float64) int { return int(math.Floor(c.dotY(y) / 4)) }

// worldX and worldY give the world coordinates of a cell's centre.
func (c *canvas) worldX(cx int) float64 {
	return c.x0 + (float64(cx)+0.5)/float64(c.w)*(c.x1-c.x0)
}
func (c *canvas) worldY(cy int) float64 {
	return c.y1 - (float64(cy)+0.5)/float64(c.h)*(c.y1-c.y0)
}

var brailleBit = [4][2]uint8{{0x01, 0x08}, {0x02, 0x10}, {0x04, 0x20}, {0x40, 0x80}}

// dot sets the dot at dot coordinates (px, py).
func (c *canvas) dot(px, py int, k ink) {
	if px < 0 || py < 0 || px >= 2*c.w || py >= 4*c.h {
		return
	}
	i := (py/4)*c.w + px/2
	c.dots[i] |= brailleBit[py%4][px%2]
	if k > c.dink[i] {
		c.dink[i] = k
	}
}

// line draws a line between two world points.
func (c *canvas) line(xa, ya, xb, yb float64, k ink) {
	if !finite(xa, ya, xb, yb) {
		return
	}
	pa, qa := c.dotX(xa), c.dotY(ya)
	pb, qb := c.dotX(xb), c.dotY(yb)
	// Clip generously so that a line far outside costs nothing.
	lim := float64(8 * (c.w + c.h))
	if math.Abs(pa) > lim || math.Abs(pb) > lim || math.Abs(qa) > lim || math.Abs(qb) > lim {
		if !clipSegment(&pa, &qa, &pb, &qb, -1, -1, float64(2*c.w)+1, float64(4*c.h)+1) {
			return
		}
	}
	n := int(math.Ceil(math.Max(math.Abs(pb-pa), math.Abs(qb-qa))))
	if n < 1 {
		n = 1
	}
	for i := 0; i <= n; i++ {
		t := float64(i) / float64(n)
		c.dot(int(math.Floor(pa+t*(pb-pa))), int(math.Floor(qa+t*(qb-qa))), k)
	}
}

// dashed draws a dashed line between two world points: four dots drawn,
// two left out, so that it reads apart from a solid outline without colour.
func (c *canvas) dashed(xa, ya, xb, yb float64, k ink) { c.patterned(xa, ya, xb, yb, k, 4, 6) }

// dotted draws every other dot of a line, so that it reads apart from a
// solid one without colour.
func (c *canvas) dotted(xa, ya, xb, yb float64, k ink) { c.patterned(xa, ya, xb, yb, k, 1, 2) }

// patterned draws a line between two world points, the first on of every
// period dots drawn and the rest left out.
func (c *canvas) patterned(xa, ya, xb, yb float64, k ink, on, period int) {
	if !finite(xa, ya, xb, yb) {
		return
	}
	pa, qa := c.dotX(xa), c.dotY(ya)
	pb, qb := c.dotX(xb), c.dotY(yb)
	if !clipSegment(&pa, &qa, &pb, &qb, -1, -1, float64(2*c.w)+1, float64(4*c.h)+1) {
		return
	}
	n := int(math.Ceil(math.Max(math.Abs(pb-pa), math.Abs(qb-qa))))
	for i := 0; i <= n; i++ {
		if i%period >= on {
			continue
		}
		t := float64(i) / float64(max(n, 1))
		c.dot(int(math.Floor(pa+t*(pb-pa))), int(math.Floor(qa+t*(qb-qa))), k)
	}
}

// clipSegment clips a segment to a rectangle (Liang–Barsky); false when
// nothing of it is inside.
func clipSegment(x0, y0, x1, y1 *float64, xmin, ymin, xmax, ymax float64) bool {
	t0, t1 := 0.0, 1.0
	dx, dy := *x1-*x0, *y1-*y0
	for _, e := range [4][2]float64{{-dx, *x0 - xmin}, {dx, xmax - *x0}, {-dy, *y0 - ymin}, {dy, ymax - *y0}} {
		p, q := e[0], e[1]
		if p == 0 {
			if q < 0 {
				return false
			}
			continue
		}
		r := q / p
		if p < 0 {
			if r > t1 {
				return false
			}
			t0 = math.Max(t0, r)
		} else {
			if r < t0 {
				return false
			}
			t1 = math.Min(t1, r)
		}
	}
	ax, ay := *x0+t0*dx, *y0+t0*dy
	*x1, *y1 = *x0+t1*dx, *y0+t1*dy
	*x0, *y0 = ax, ay
	return true
}

// polyline draws the closed or open outline through the points.
func (c *canvas) polygon(xs, ys []float64, k ink) {
	n := len(xs)
	for i := 0; i < n; i++ {
		j := (i + 1) % n
		c.line(xs[i], ys[i], xs[j], ys[j], k)
	}
}

// fillCell shades a cell.
func (c *canvas) fillCell(cx, cy int, r rune, k ink) {
	if cx < 0 || cy < 0 || cx >= c.w || cy >= c.h {
		return
	}
	i := cy*c.w + cx
	if k >= c.fink[i] {
		c.fill[i], c.fink[i] = r, k
	}
}

// label writes s at a cell, clipped to the canvas.
func (c *canvas) label(cx, cy int, s string, k ink) {
	if cy < 0 || cy >= c.h {
		return
	}
	for _, r := range s {
		if cx >= 0 && cx < c.w {
			i := cy*c.w + cx
			c.text[i], c.tink[i] = r, k
		}
		cx++
	}
}

// render returns the picture's lines, each cell drawn in the style of its
// ink; runs of one ink are styled together so that a frame stays cheap.
func (c *canvas) render(st map[ink]lipgloss.Style) []string {
	out := make([]string, c.h)
	var b, run strings.Builder
	for y := 0; y < c.h; y++ {
		b.Reset()
		run.Reset()
		cur := inkNone
		flush := func() {
			if run.Len() == 0 {
				return
			}
			if s, ok := st[cur]; ok && cur != inkNone {
				b.WriteString(s.Render(run.String()))
			} else {
				b.WriteString(run.String())
			}
			run.Reset()
		}
		for x := 0; x < c.w; x++ {
			i := y*c.w + x
			r, k := ' ', inkNone
			switch {
			case c.text[i] != 0:
				r, k = c.text[i], c.tink[i]
			case c.dots[i] != 0:
				r, k = rune(0x2800+int(c.dots[i])), c.dink[i]
			case c.fill[i] != 0:
				r, k = c.fill[i], c.fink[i]
			}
			if k != cur {
				flush()
				cur = k
			}
			run.WriteRune(r)
		}
		flush()
		out[y] = b.String()
	}
	return out
}

// niceStep returns a round tick interval (1, 2 or 5 × 10ⁿ) that gives about
// n ticks over span.
func niceStep(span float64, n int) float64 {
	if !(span > 0) || !finite(span) || n < 1 {
		return 1
	}
	raw := span / float64(n)
	p := math.Pow(10, math.Floor(math.Log10(raw)))
	for _, m := range []float64{1, 2, 5, 10} {
		if m*p >= raw {
			return m * p
		}
	}
	return 10 * p
}

// pointInPolygon reports whether (y, z) lies inside the polygon (even–odd).
func pointInPolygon(ys, zs []float64, y, z float64) bool {
	in := false
	n := len(ys)
	for i, j := 0, n-1; i < n; j, i = i, i+1 {
		if (zs[i] > z) != (zs[j] > z) {
			yc := ys[j] + (z-zs[j])*(ys[i]-ys[j])/(zs[i]-zs[j])
			if y < yc {
				in = !in
			}
		}
	}
	return in
}
