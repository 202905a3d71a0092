package main

import (
	"fmt"
	"io"
)

// runFlood will run flooding through a hole over time; it is not built yet.
func runFlood(args []string, stdout, stderr io.Writer) int {
	fmt.Fprintln(stderr, "heelwatch flood: flooding over time is not built yet")
	return exitUsage
}
