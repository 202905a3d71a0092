//go:build !unix

package tui

import "testing"

func specialFiles(*testing.T, string) []string { return nil }
