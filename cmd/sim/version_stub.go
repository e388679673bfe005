package main

// version is a stand-in until cmd/sim/version.go (written on another
// branch) says which version of the program this is; the JSON document
// carries it. Delete this file when that one arrives.
func version() string { return "devel" }
