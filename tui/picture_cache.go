package tui

import "heelwatch/engine"

// This file keeps the pictures (the section, the profile, the GZ curve and
// the flooding run's plot) once drawn, so that View draws one again only
// when what it shows or its size has changed, not on every spinner tick
// or key that leaves it as it was.

// pictureKey is everything a picture is drawn from.
type pictureKey struct {
	kind     int // picSection, picProfile, picGZ or picFloodPlot
	w, h     int
	palette  int
	sel      int
	seq      int                // the damage state's change number
	cur      *engine.Assessment // the figures shown
	floodSeq int                // the flooding run's request
	floodN   int                // its progress points
	floodRep *engine.FloodReport
	floodNet *engine.NetworkReport // the run through the ship (flood_network.go)
	running  bool
}

// picFloodPlot is the flooding run's plot, beside the other pictures.
const picFloodPlot = numPictures

// pictureCache holds the last drawing of each kind of picture. It is shared
// by the copies of the model (a pointer), and only View reads and fills it.
type pictureCache struct {
	entries [numPictures + 1]struct {
		key   pictureKey
		lines []string
		ok    bool
	}
}

// cached returns picture kind drawn in w × h by draw, drawing it only when
// its key has changed since the last time.
func (m model) cached(kind, w, h int, draw func(w, h int) []string) []string {
	k := m.pictureKey(kind)
	k.w, k.h = w, h
	return m.pics.drawn(k, draw)
}

// pictureKey is what the dashboard's state gives of picture kind's key;
// the flooding run's panel adds its run (floodPanel.cachedPlot) and the
// size. (A pointer receiver: the model is large, and View calls it for
// every picture.)
func (m *model) pictureKey(kind int) pictureKey {
	return pictureKey{kind: kind, palette: m.palette, sel: m.sel, seq: m.seq, cur: m.cur}
}

// drawn returns the picture of key k, drawn by draw only when k differs
// from the last key of its kind; without a cache (nil) it always draws.
func (c *pictureCache) drawn(k pictureKey, draw func(w, h int) []string) []string {
	if c == nil {
		return draw(k.w, k.h)
	}
	e := &c.entries[k.kind]
	if !e.ok || e.key != k {
		e.key, e.lines, e.ok = k, draw(k.w, k.h), true
	}
	return append([]string(nil), e.lines...)
}
