package main

import (
	"errors"
	"fmt"
	"io"

	"heelwatch/vessels"
)

// refuse prints why a file could not be taken (every problem with file,
// line and key, then a count and what was therefore not done, e.g.
// "nothing was computed"; or the one error, after what) and returns the
// exit status for bad input.
func refuse(stderr io.Writer, prefix, path, notDone string, err error, what string) int {
	var ps vessels.Problems
	if errors.As(err, &ps) {
		for _, p := range ps {
			fmt.Fprintln(stderr, p.String())
		}
		fmt.Fprintf(stderr, "%s: %s: %s; %s\n", prefix, path, plural(len(ps), "problem"), notDone)
		return exitInput
	}
	if what != "" {
		fmt.Fprintf(stderr, "%s: %s: %v\n", prefix, what, err)
	} else {
		fmt.Fprintf(stderr, "%s: %v\n", prefix, err)
	}
	return exitInput
}
