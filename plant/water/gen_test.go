package water

import (
	"bytes"
	"flag"
	"os"
	"strings"
	"testing"

	"steamcase/plant/water/internal/polygen"
)

// The package has no golden files. -update rewrites poly_gen.go, the one
// generated file, exactly as go generate ./plant/water does.
var update = flag.Bool("update", false, "rewrite poly_gen.go from the coefficient tables in coef.go (as go generate does)")

// TestGeneratedPolynomials fails when poly_gen.go is not what the generator
// (gen.go, run by go generate, with package internal/polygen) makes of the
// coefficient tables in coef.go. The generated code itself is checked by
// TestKernelsAgreeWithNaiveSums and the verification tests, not by this one.
func TestGeneratedPolynomials(t *testing.T) {
	src, err := os.ReadFile("coef.go")
	if err != nil {
		t.Fatal(err)
	}
	want, err := polygen.Generate(src)
	if err != nil {
		t.Fatal(err)
	}
	if *update {
		if err := os.WriteFile("poly_gen.go", want, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	got, err := os.ReadFile("poly_gen.go")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Fatal("poly_gen.go is not what the generator makes of coef.go: run go generate ./plant/water (or go test ./plant/water -update)")
	}
}

// TestGenerateDirective keeps the go:generate directive that rebuilds
// poly_gen.go in the package doc, where DEVELOPERS.md says it is.
func TestGenerateDirective(t *testing.T) {
	doc, err := os.ReadFile("doc.go")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(doc), "\n//go:generate go run gen.go\n") {
		t.Fatal("doc.go has lost its directive //go:generate go run gen.go")
	}
}
