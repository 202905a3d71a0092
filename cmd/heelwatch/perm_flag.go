package main

import "strings"

// permFlag is --perm: NAME=μ items, repeated or separated by commas. A
// piece with no "=" after a comma is the decimal part of the item before it
// ("Hold 2=0,85" is 0.85, as the dashboard reads it), so the decimal comma
// and the separating comma can both be written.
type permFlag []string

func (p *permFlag) String() string { return strings.Join(*p, ",") }

func (p *permFlag) Set(s string) error {
	first := len(*p)
	for _, piece := range strings.Split(s, ",") {
		piece = strings.TrimSpace(piece)
		switch {
		case piece == "":
		case !strings.Contains(piece, "=") && len(*p) > first:
			(*p)[len(*p)-1] += "," + piece
		default:
			*p = append(*p, piece)
		}
	}
	return nil
}
