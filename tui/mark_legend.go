package tui

// markLegend says what the dashboard's marks mean; the full help shows it.
// The margin line is a passenger-ship notion (ship_type = "passenger"): on
// any other ship the flooding run watches the deck edge, the edge of the
// bulkhead deck, alone, and the legend says so.
func markLegend(passenger bool) string {
	run := "flooding run: d deck edge (bulkhead deck), o opening, c criterion, » end"
	if passenger {
		run = "flooding run: d deck edge, m margin line, o opening, c criterion, » end"
	}
	return "marks: ■ open to the sea · ▲ next at risk · ‼ danger · ! caution · · for the record · " +
		"░ flooded · ○ opening clear, ● under water, ◇ weathertight · GZ: e where she lies, f downflooding, v vanishing · " + run
}
