package main

import (
	"fmt"
	"os"
)

func main() {
	fmt.Fprintln(os.Stdout, "sim: steamcase, a steam plant heat and mass balance engine (under construction)")
	os.Exit(0)
}
