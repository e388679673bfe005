//go:build !unix

package main

import "testing"

// makeFIFO skips the test: there are no named pipes in the file system.
func makeFIFO(t *testing.T, path string) {
	t.Skip("no named pipes on this system")
}
