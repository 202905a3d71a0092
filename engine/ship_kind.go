package engine

// Passenger reports whether v is a passenger ship (ShipType "passenger").
// The margin line is a passenger-ship notion (SOLAS 1974 II-1 definitions):
// on a cargo ship the screen and the reports speak of the deck edge, the
// bulkhead deck at side, instead, and raise no margin-line flag or event.
func (v *Vessel) Passenger() bool { return v != nil && v.ShipType == "passenger" }
