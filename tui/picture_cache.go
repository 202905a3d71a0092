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
	if m.pics == nil {
		return draw(w, h)
	}
	k := pictureKey{kind: kind, w: w, h: h, palette: m.palette, sel: m.sel, seq: m.seq, cur: m.cur}
	if kind == picFloodPlot {
		f := m.flood
		k.floodSeq, k.floodN, k.floodRep, k.running = f.seq, len(f.track), f.rep, f.running
		k.floodNet = f.net
	}
	e := &m.pics.entries[kind]
	if !e.ok || e.key != k {
		e.key, e.lines, e.ok = k, draw(w, h), true
	}
	return append([]string(nil), e.lines...)
}
