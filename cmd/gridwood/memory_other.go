//go:build !linux

package main

// addressSpaceLeft: only Linux's address-space limit is read.
func addressSpaceLeft() (int64, bool) { return 0, false }
