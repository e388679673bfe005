//go:build ignore

// Gen writes poly_gen.go, the polynomial sums of IAPWS-IF97 as
// straight-line code, from the coefficient tables in coef.go. It is run by
// go generate ./plant/water (the directive is in doc.go); the work is done
// by package internal/polygen.
package main

import (
	"fmt"
	"os"

	"steamcase/plant/water/internal/polygen"
)

func main() {
	src, err := os.ReadFile("coef.go")
	if err == nil {
		var out []byte
		if out, err = polygen.Generate(src); err == nil {
			err = os.WriteFile("poly_gen.go", out, 0o644)
		}
	}
	if err != nil {
		fmt.Fprintln(os.Stderr, "gen:", err)
		os.Exit(1)
	}
}
