package report

import (
	"fmt"
	"strings"
)

// outcomeLabel names the first outcome of the flood text: the run's own,
// or, when the run through the ship is made, the holed compartment's alone.
func outcomeLabel(f Flood) string {
	if f.Network == nil {
		return "Outcome"
	}
	return "Outcome of " + f.Run.Compartment + " alone (connections shut)"
}

// networkEndLine says, under the compartment's own outcome, that the run
// through the ship is the run's end, and when it comes (as the JSON's
// end_s and final).
func networkEndLine(b *strings.Builder, f Flood) {
	n := f.Network
	if n == nil {
		return
	}
	fmt.Fprintf(b, "  The run's end is that of the whole ship (\"Water spreading through the ship\", below):\n  %s after %s.\n",
		FloodHeadline(n.End), Duration(n.EndS))
}
