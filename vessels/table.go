package vessels

import (
	"fmt"
	"math"
	"sort"
)

// reader collects the problems of one file.
type reader struct {
	file  string
	lines *lineIndex
	probs Problems
	// named counts the names of the ship's weights and tanks a condition
	// file gives that she has (known) and has not (unknown): most of them
	// unknown means the file was written for another ship.
	named struct{ known, unknown int }
}

// addf records a problem at the line of path.
func (r *reader) addf(path, format string, args ...any) {
	line := r.lines.line(path)
	if line == 0 {
		line = 1 // a key missing at the top of the file
	}
	r.probs = append(r.probs, Problem{File: r.file, Line: line, Key: path, Msg: fmt.Sprintf(format, args...)})
}

// table is one TOML table being read. Every key the reader asks for is
// remembered; finish reports the keys nobody asked for as unknown, so that a
// table's getters must all be called whatever the file holds.
type table struct {
	r     *reader
	path  string
	m     map[string]any
	asked []string
}

func (r *reader) table(path string, m map[string]any) *table {
	return &table{r: r, path: path, m: m}
}

func (t *table) keyPath(key string) string { return joinPath(t.path, key) }

// get returns the raw value of key and marks key as known.
func (t *table) get(key string) (any, bool) {
	t.asked = append(t.asked, key)
	v, ok := t.m[key]
	return v, ok
}

// has reports whether key is present (without marking it known).
func (t *table) has(key string) bool {
	_, ok := t.m[key]
	return ok
}

// finish reports every key of the table that was not asked for.
func (t *table) finish() {
	var unknown []string
	for k := range t.m {
		if !contains(t.asked, k) {
			unknown = append(unknown, k)
		}
	}
	if len(unknown) == 0 {
		return
	}
	sort.Strings(unknown)
	allowed := append([]string(nil), t.asked...)
	sort.Strings(allowed)
	where := "at the top level"
	if t.path != "" {
		where = "in " + t.path
	}
	for _, k := range unknown {
		msg := fmt.Sprintf("unknown key; the keys allowed %s are %s", where, listOf(allowed))
		if c := closest(k, allowed); c != "" {
			msg = fmt.Sprintf("unknown key: did you mean %q? The keys allowed %s are %s", c, where, listOf(allowed))
		}
		t.r.addf(t.keyPath(k), "%s", msg)
	}
}

func listOf(keys []string) string {
	var out []string
	for _, k := range keys {
		if !contains(out, k) {
			out = append(out, k)
		}
	}
	s := ""
	for i, k := range out {
		if i > 0 {
			s += ", "
		}
		s += k
	}
	return s
}

func typeName(v any) string {
	switch v.(type) {
	case string:
		return "text"
	case int64, float64:
		return "a number"
	case bool:
		return "true/false"
	case []any:
		return "an array"
	case map[string]any:
		return "a table"
	case []map[string]any:
		return "an array of tables"
	}
	return "a date or time"
}

// number converts a TOML integer or float.
func number(v any) (float64, bool) {
	switch n := v.(type) {
	case int64:
		return float64(n), true
	case float64:
		return n, true
	}
	return 0, false
}

// num reads a finite number with the given unit. It reports a value of the
// wrong type or one that is not finite; ok is false then or when absent.
func (t *table) num(key, unit string, required bool) (float64, bool) {
	v, present := t.get(key)
	if !present {
		if required {
			t.r.addf(t.keyPath(key), "missing: give a number (%s)", unit)
		}
		return 0, false
	}
	f, isNum := number(v)
	if !isNum {
		t.r.addf(t.keyPath(key), "must be a number (%s), not %s", unit, typeName(v))
		return 0, false
	}
	if math.IsNaN(f) || math.IsInf(f, 0) {
		t.r.addf(t.keyPath(key), "%v is not allowed: give a finite number (%s)", f, unit)
		return 0, false
	}
	if math.Abs(f) > maxMagnitude {
		t.r.addf(t.keyPath(key), "%g is too large for any ship: numbers may be at most %g in size (%s)", f, maxMagnitude, unit)
		return 0, false
	}
	return f, true
}

// maxMagnitude bounds every number in a vessel file, so that no sum or
// product of them can overflow to infinity.
const maxMagnitude = 1e7

// positive reads a number that must be above zero.
func (t *table) positive(key, unit string, required bool) (float64, bool) {
	f, ok := t.num(key, unit, required)
	if ok && !(f > 0) {
		t.r.addf(t.keyPath(key), "%g must be above zero (%s)", f, unit)
		return 0, false
	}
	return f, ok
}

// dimension reads a positive hull dimension no larger than limit metres.
func (t *table) dimension(key, unit string, required bool, limit float64) (float64, bool) {
	f, ok := t.positive(key, unit, required)
	if ok && f > limit {
		t.r.addf(t.keyPath(key), "%g m is more than any ship's (at most %g m)", f, limit)
		return 0, false
	}
	return f, ok
}

// str reads a string.
func (t *table) str(key string, required bool, what string) (string, bool) {
	v, present := t.get(key)
	if !present {
		if required {
			t.r.addf(t.keyPath(key), "missing: give %s", what)
		}
		return "", false
	}
	s, ok := v.(string)
	if !ok {
		t.r.addf(t.keyPath(key), "must be text in quotes (%s), not %s", what, typeName(v))
		return "", false
	}
	return s, true
}

// choice reads a string that must be one of vals.
func (t *table) choice(key string, required bool, vals []string) (string, bool) {
	if s, ok := t.m[key].(string); ok && contains(vals, s) {
		// A good value: taken without building the list for a message.
		t.asked = append(t.asked, key)
		return s, true
	}
	s, ok := t.str(key, required, "one of "+quotedList(vals))
	if !ok {
		return "", false
	}
	if !contains(vals, s) {
		msg := fmt.Sprintf("%q is not one of %s", s, quotedList(vals))
		if c := closest(s, vals); c != "" {
			msg += fmt.Sprintf(" (did you mean %q?)", c)
		}
		t.r.addf(t.keyPath(key), "%s", msg)
		return "", false
	}
	return s, true
}

// boolean reads true or false.
func (t *table) boolean(key string) (bool, bool) {
	v, present := t.get(key)
	if !present {
		return false, false
	}
	b, ok := v.(bool)
	if !ok {
		t.r.addf(t.keyPath(key), "must be true or false, not %s", typeName(v))
		return false, false
	}
	return b, true
}

// bounds reads a [low, high] pair of finite numbers with low < high.
func (t *table) bounds(key, what string) ([2]float64, bool) {
	v, present := t.get(key)
	if !present {
		t.r.addf(t.keyPath(key), "missing: give the %s as [low, high] in metres", what)
		return [2]float64{}, false
	}
	a, ok := v.([]any)
	if !ok || len(a) != 2 {
		t.r.addf(t.keyPath(key), "must be a pair [low, high] of numbers in metres (the %s), not %s", what, describe(v))
		return [2]float64{}, false
	}
	var out [2]float64
	for i, e := range a {
		f, ok := number(e)
		if !ok {
			t.r.addf(t.keyPath(key), "must be a pair [low, high] of numbers in metres (the %s); item %d is %s", what, i+1, typeName(e))
			return out, false
		}
		if math.IsNaN(f) || math.IsInf(f, 0) || math.Abs(f) > maxMagnitude {
			t.r.addf(t.keyPath(key), "item %d is %v: the %s must be finite numbers in metres, at most %g in size", i+1, f, what, maxMagnitude)
			return out, false
		}
		out[i] = f
	}
	if !(out[1] > out[0]) {
		t.r.addf(t.keyPath(key), "[%g, %g] does not run from low to high: the %s must be [low, high] with low < high", out[0], out[1], what)
		return out, false
	}
	return out, true
}

func describe(v any) string {
	if a, ok := v.([]any); ok {
		return fmt.Sprintf("an array of %d", len(a))
	}
	return typeName(v)
}

// sub reads a sub-table (a [a.b] table or an inline table).
func (t *table) sub(key string, required bool, what string) (*table, bool) {
	v, present := t.get(key)
	p := t.keyPath(key)
	if !present {
		if required {
			t.r.addf(p, "missing: the file needs a [%s] table (%s)", p, what)
		}
		return nil, false
	}
	m, ok := v.(map[string]any)
	if !ok {
		t.r.addf(p, "must be a table (%s), not %s", what, typeName(v))
		return nil, false
	}
	return t.r.table(p, m), true
}

// entries reads an array of tables ([[key]] entries); absent is no entries.
func (t *table) entries(key, what string) []*table {
	v, present := t.get(key)
	if !present {
		return nil
	}
	p := t.keyPath(key)
	var out []*table
	switch a := v.(type) {
	case []map[string]any:
		for i, m := range a {
			out = append(out, t.r.table(elemPath(p, i+1), m))
		}
	case []any:
		for i, e := range a {
			m, ok := e.(map[string]any)
			if !ok {
				t.r.addf(elemPath(p, i+1), "must be a table (%s), not %s", what, typeName(e))
				continue
			}
			out = append(out, t.r.table(elemPath(p, i+1), m))
		}
	default:
		t.r.addf(p, "must be written as [[%s]] tables (%s), not %s", p, what, typeName(v))
	}
	return out
}
