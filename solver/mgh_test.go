package solver

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// Test systems of Moré, Garbow and Hillstrom, "Testing unconstrained
// optimization software", ACM TOMS 7(1):17-41, 1981 (MGH below), with the
// problem numbers of that paper. Each square problem is used as the system
// F(x) = 0 of its residuals f_i. Wood (14) and variably dimensioned (25)
// have more residuals than unknowns (6 for 4, and n+2 for n), so they are
// used as the square system ∇(Σ f_i²)(x) = 0 (their gradient), whose root
// is the paper's minimiser; the Jacobian is then the Hessian.
type mghProblem struct {
	name    string
	source  string
	n       int
	f       func(r, x []float64)
	jac     func(j *mat.Dense, x []float64)
	x0      []float64
	root    []float64 // nil where the paper gives no closed-form root
	pattern [][]int   // nil for a dense Jacobian
}

// problem returns the system with unit scales, as the paper poses it
// (the solver's own default derives scales from the start point instead;
// the expected outcomes in the tests were observed with unit scales).
func (m mghProblem) problem(analytic bool) Problem {
	p := Problem{Dim: m.n, Pattern: m.pattern,
		XScale: filled(m.n, 1), FScale: filled(m.n, 1),
		Residual: func(r, x []float64) error { m.f(r, x); return nil }}
	if analytic {
		p.Jacobian = func(j *mat.Dense, x []float64) error { m.jac(j, x); return nil }
	}
	return p
}

func filled(n int, v float64) []float64 {
	x := make([]float64, n)
	for i := range x {
		x[i] = v
	}
	return x
}

// band returns the pattern of a band matrix with lower width ml and upper
// width mu.
func band(n, ml, mu int) [][]int {
	p := make([][]int, n)
	for i := range p {
		for j := max(0, i-ml); j <= min(n-1, i+mu); j++ {
			p[i] = append(p[i], j)
		}
	}
	return p
}

func rosenbrock() mghProblem {
	return mghProblem{name: "Rosenbrock", source: "MGH (1)", n: 2,
		f: func(r, x []float64) {
			r[0] = 10 * (x[1] - x[0]*x[0])
			r[1] = 1 - x[0]
		},
		jac: func(j *mat.Dense, x []float64) {
			j.Set(0, 0, -20*x[0])
			j.Set(0, 1, 10)
			j.Set(1, 0, -1)
		},
		x0: []float64{-1.2, 1}, root: []float64{1, 1}}
}

func powellBadlyScaled() mghProblem {
	return mghProblem{name: "Powell badly scaled", source: "MGH (3)", n: 2,
		f: func(r, x []float64) {
			r[0] = 1e4*x[0]*x[1] - 1
			r[1] = math.Exp(-x[0]) + math.Exp(-x[1]) - 1.0001
		},
		jac: func(j *mat.Dense, x []float64) {
			j.Set(0, 0, 1e4*x[1])
			j.Set(0, 1, 1e4*x[0])
			j.Set(1, 0, -math.Exp(-x[0]))
			j.Set(1, 1, -math.Exp(-x[1]))
		},
		// MGH give the minimiser to four figures, (1.098e-5, 9.106); the
		// check below uses that precision.
		x0: []float64{0, 1}, root: []float64{1.098e-5, 9.106}}
}

// helicalTheta is θ of MGH (7): arctan(x2/x1)/2π, plus 1/2 for x1 < 0.
// At x1 = 0 (undefined in the paper) the limit ±1/4 is used.
func helicalTheta(x1, x2 float64) float64 {
	switch {
	case x1 > 0:
		return math.Atan(x2/x1) / (2 * math.Pi)
	case x1 < 0:
		return math.Atan(x2/x1)/(2*math.Pi) + 0.5
	}
	return math.Copysign(0.25, x2)
}

func helicalValley() mghProblem {
	return mghProblem{name: "helical valley", source: "MGH (7)", n: 3,
		f: func(r, x []float64) {
			r[0] = 10 * (x[2] - 10*helicalTheta(x[0], x[1]))
			r[1] = 10 * (math.Hypot(x[0], x[1]) - 1)
			r[2] = x[2]
		},
		jac: func(j *mat.Dense, x []float64) {
			q := x[0]*x[0] + x[1]*x[1]
			rr := math.Sqrt(q)
			j.Set(0, 0, 100*x[1]/(2*math.Pi*q))
			j.Set(0, 1, -100*x[0]/(2*math.Pi*q))
			j.Set(0, 2, 10)
			j.Set(1, 0, 10*x[0]/rr)
			j.Set(1, 1, 10*x[1]/rr)
			j.Set(2, 2, 1)
		},
		x0: []float64{-1, 0, 0}, root: []float64{1, 0, 0}}
}

func powellSingularF(r, x []float64) {
	for k := 0; k+3 < len(x); k += 4 {
		r[k] = x[k] + 10*x[k+1]
		r[k+1] = math.Sqrt(5) * (x[k+2] - x[k+3])
		r[k+2] = (x[k+1] - 2*x[k+2]) * (x[k+1] - 2*x[k+2])
		r[k+3] = math.Sqrt(10) * (x[k] - x[k+3]) * (x[k] - x[k+3])
	}
}

func powellSingularJ(j *mat.Dense, x []float64) {
	for k := 0; k+3 < len(x); k += 4 {
		j.Set(k, k, 1)
		j.Set(k, k+1, 10)
		j.Set(k+1, k+2, math.Sqrt(5))
		j.Set(k+1, k+3, -math.Sqrt(5))
		d := x[k+1] - 2*x[k+2]
		j.Set(k+2, k+1, 2*d)
		j.Set(k+2, k+2, -4*d)
		e := x[k] - x[k+3]
		j.Set(k+3, k, 2*math.Sqrt(10)*e)
		j.Set(k+3, k+3, -2*math.Sqrt(10)*e)
	}
}

func powellSingularPattern(n int) [][]int {
	p := make([][]int, n)
	for k := 0; k+3 < n; k += 4 {
		p[k] = []int{k, k + 1}
		p[k+1] = []int{k + 2, k + 3}
		p[k+2] = []int{k + 1, k + 2}
		p[k+3] = []int{k, k + 3}
	}
	return p
}

func powellSingular() mghProblem {
	return mghProblem{name: "Powell singular", source: "MGH (13)", n: 4,
		f: powellSingularF, jac: powellSingularJ,
		x0: []float64{3, -1, 0, 1}, root: []float64{0, 0, 0, 0}}
}

func extendedPowellSingular(n int) mghProblem {
	x0 := make([]float64, n)
	for k := 0; k+3 < n; k += 4 {
		copy(x0[k:], []float64{3, -1, 0, 1})
	}
	return mghProblem{name: "extended Powell singular", source: "MGH (22)", n: n,
		f: powellSingularF, jac: powellSingularJ,
		x0: x0, root: make([]float64, n), pattern: powellSingularPattern(n)}
}

// wood is the gradient of MGH (14), f = 100(x2−x1²)² + (1−x1)² +
// 90(x4−x3²)² + (1−x3)² + 10(x2+x4−2)² + 0.1(x2−x4)².
func wood() mghProblem {
	return mghProblem{name: "Wood (gradient)", source: "MGH (14), as ∇f = 0", n: 4,
		f: func(r, x []float64) {
			r[0] = -400*x[0]*(x[1]-x[0]*x[0]) - 2*(1-x[0])
			r[1] = 200*(x[1]-x[0]*x[0]) + 20*(x[1]+x[3]-2) + 0.2*(x[1]-x[3])
			r[2] = -360*x[2]*(x[3]-x[2]*x[2]) - 2*(1-x[2])
			r[3] = 180*(x[3]-x[2]*x[2]) + 20*(x[1]+x[3]-2) - 0.2*(x[1]-x[3])
		},
		jac: func(j *mat.Dense, x []float64) {
			j.Set(0, 0, -400*x[1]+1200*x[0]*x[0]+2)
			j.Set(0, 1, -400*x[0])
			j.Set(1, 0, -400*x[0])
			j.Set(1, 1, 220.2)
			j.Set(1, 3, 19.8)
			j.Set(2, 2, -360*x[3]+1080*x[2]*x[2]+2)
			j.Set(2, 3, -360*x[2])
			j.Set(3, 2, -360*x[2])
			j.Set(3, 3, 200.2)
			j.Set(3, 1, 19.8)
		},
		x0: []float64{-3, -1, -3, -1}, root: []float64{1, 1, 1, 1},
		pattern: [][]int{{0, 1}, {0, 1, 3}, {2, 3}, {1, 2, 3}}}
}

func trigonometric(n int) mghProblem {
	return mghProblem{name: "trigonometric", source: "MGH (26)", n: n,
		f: func(r, x []float64) {
			sc := 0.0
			for _, v := range x {
				sc += math.Cos(v)
			}
			for i := range r {
				r[i] = float64(n) - sc + float64(i+1)*(1-math.Cos(x[i])) - math.Sin(x[i])
			}
		},
		jac: func(j *mat.Dense, x []float64) {
			for i := 0; i < n; i++ {
				for k := 0; k < n; k++ {
					j.Set(i, k, math.Sin(x[k]))
				}
				j.Set(i, i, math.Sin(x[i])+float64(i+1)*math.Sin(x[i])-math.Cos(x[i]))
			}
		},
		x0: filled(n, 1/float64(n))}
}

func brownAlmostLinear(n int) mghProblem {
	return mghProblem{name: "Brown almost-linear", source: "MGH (27)", n: n,
		f: func(r, x []float64) {
			sum, prod := 0.0, 1.0
			for _, v := range x {
				sum += v
				prod *= v
			}
			for i := 0; i < n-1; i++ {
				r[i] = x[i] + sum - float64(n+1)
			}
			r[n-1] = prod - 1
		},
		jac: func(j *mat.Dense, x []float64) {
			for i := 0; i < n-1; i++ {
				for k := 0; k < n; k++ {
					j.Set(i, k, 1)
				}
				j.Set(i, i, 2)
			}
			for k := 0; k < n; k++ {
				p := 1.0
				for l, v := range x {
					if l != k {
						p *= v
					}
				}
				j.Set(n-1, k, p)
			}
		},
		x0: filled(n, 0.5)}
}

// bvpGrid returns h and t_i = i·h of MGH (28) and (29).
func bvpGrid(n int) (float64, []float64) {
	h := 1 / float64(n+1)
	t := make([]float64, n)
	for i := range t {
		t[i] = float64(i+1) * h
	}
	return h, t
}

func discreteBVP(n int) mghProblem {
	h, t := bvpGrid(n)
	x0 := make([]float64, n)
	for i := range x0 {
		x0[i] = t[i] * (t[i] - 1)
	}
	return mghProblem{name: "discrete boundary value", source: "MGH (28)", n: n,
		f: func(r, x []float64) {
			for i := 0; i < n; i++ {
				lo, hi := 0.0, 0.0
				if i > 0 {
					lo = x[i-1]
				}
				if i < n-1 {
					hi = x[i+1]
				}
				c := x[i] + t[i] + 1
				r[i] = 2*x[i] - lo - hi + h*h*c*c*c/2
			}
		},
		jac: func(j *mat.Dense, x []float64) {
			for i := 0; i < n; i++ {
				c := x[i] + t[i] + 1
				j.Set(i, i, 2+1.5*h*h*c*c)
				if i > 0 {
					j.Set(i, i-1, -1)
				}
				if i < n-1 {
					j.Set(i, i+1, -1)
				}
			}
		},
		x0: x0, pattern: band(n, 1, 1)}
}

func discreteIntegral(n int) mghProblem {
	h, t := bvpGrid(n)
	x0 := make([]float64, n)
	for i := range x0 {
		x0[i] = t[i] * (t[i] - 1)
	}
	return mghProblem{name: "discrete integral equation", source: "MGH (29)", n: n,
		f: func(r, x []float64) {
			for i := 0; i < n; i++ {
				s1, s2 := 0.0, 0.0
				for k := 0; k <= i; k++ {
					c := x[k] + t[k] + 1
					s1 += t[k] * c * c * c
				}
				for k := i + 1; k < n; k++ {
					c := x[k] + t[k] + 1
					s2 += (1 - t[k]) * c * c * c
				}
				r[i] = x[i] + h*((1-t[i])*s1+t[i]*s2)/2
			}
		},
		jac: func(j *mat.Dense, x []float64) {
			for i := 0; i < n; i++ {
				for k := 0; k < n; k++ {
					c := x[k] + t[k] + 1
					w := t[i] * (1 - t[k])
					if k <= i {
						w = (1 - t[i]) * t[k]
					}
					v := h * w * 3 * c * c / 2
					if k == i {
						v++
					}
					j.Set(i, k, v)
				}
			}
		},
		x0: x0}
}

func broydenTridiagonal(n int) mghProblem {
	return mghProblem{name: "Broyden tridiagonal", source: "MGH (30)", n: n,
		f: func(r, x []float64) {
			for i := 0; i < n; i++ {
				lo, hi := 0.0, 0.0
				if i > 0 {
					lo = x[i-1]
				}
				if i < n-1 {
					hi = x[i+1]
				}
				r[i] = (3-2*x[i])*x[i] - lo - 2*hi + 1
			}
		},
		jac: func(j *mat.Dense, x []float64) {
			for i := 0; i < n; i++ {
				j.Set(i, i, 3-4*x[i])
				if i > 0 {
					j.Set(i, i-1, -1)
				}
				if i < n-1 {
					j.Set(i, i+1, -2)
				}
			}
		},
		x0: filled(n, -1), pattern: band(n, 1, 1)}
}

func broydenBanded(n int) mghProblem {
	const ml, mu = 5, 1
	return mghProblem{name: "Broyden banded", source: "MGH (31)", n: n,
		f: func(r, x []float64) {
			for i := 0; i < n; i++ {
				s := 0.0
				for k := max(0, i-ml); k <= min(n-1, i+mu); k++ {
					if k != i {
						s += x[k] * (1 + x[k])
					}
				}
				r[i] = x[i]*(2+5*x[i]*x[i]) + 1 - s
			}
		},
		jac: func(j *mat.Dense, x []float64) {
			for i := 0; i < n; i++ {
				for k := max(0, i-ml); k <= min(n-1, i+mu); k++ {
					if k != i {
						j.Set(i, k, -(1 + 2*x[k]))
					}
				}
				j.Set(i, i, 2+15*x[i]*x[i])
			}
		},
		x0: filled(n, -1), pattern: band(n, ml, mu)}
}

func extendedRosenbrock(n int) mghProblem {
	x0 := make([]float64, n)
	p := make([][]int, n)
	for k := 0; k+1 < n; k += 2 {
		x0[k], x0[k+1] = -1.2, 1
		p[k] = []int{k, k + 1}
		p[k+1] = []int{k}
	}
	return mghProblem{name: "extended Rosenbrock", source: "MGH (21)", n: n,
		f: func(r, x []float64) {
			for k := 0; k+1 < n; k += 2 {
				r[k] = 10 * (x[k+1] - x[k]*x[k])
				r[k+1] = 1 - x[k]
			}
		},
		jac: func(j *mat.Dense, x []float64) {
			for k := 0; k+1 < n; k += 2 {
				j.Set(k, k, -20*x[k])
				j.Set(k, k+1, 10)
				j.Set(k+1, k, -1)
			}
		},
		x0: x0, root: filled(n, 1), pattern: p}
}

// variablyDimensioned is the gradient of MGH (25),
// f = Σ(x_j−1)² + s² + s⁴ with s = Σ j(x_j−1).
func variablyDimensioned(n int) mghProblem {
	x0 := make([]float64, n)
	for k := range x0 {
		x0[k] = 1 - float64(k+1)/float64(n)
	}
	sum := func(x []float64) float64 {
		s := 0.0
		for k, v := range x {
			s += float64(k+1) * (v - 1)
		}
		return s
	}
	return mghProblem{name: "variably dimensioned (gradient)", source: "MGH (25), as ∇f = 0", n: n,
		f: func(r, x []float64) {
			s := sum(x)
			for k := range r {
				r[k] = 2*(x[k]-1) + (2*s+4*s*s*s)*float64(k+1)
			}
		},
		jac: func(j *mat.Dense, x []float64) {
			s := sum(x)
			for k := 0; k < n; k++ {
				for l := 0; l < n; l++ {
					v := (2 + 12*s*s) * float64((k+1)*(l+1))
					if k == l {
						v += 2
					}
					j.Set(k, l, v)
				}
			}
		},
		x0: x0, root: filled(n, 1)}
}

// mghProblems lists the systems with the dimensions used in the tests.
func mghProblems() []mghProblem {
	return []mghProblem{
		rosenbrock(),
		powellBadlyScaled(),
		helicalValley(),
		powellSingular(),
		wood(),
		trigonometric(10),
		brownAlmostLinear(10),
		discreteBVP(10),
		discreteIntegral(10),
		broydenTridiagonal(10),
		broydenBanded(10),
		extendedRosenbrock(10),
		extendedPowellSingular(8),
		variablyDimensioned(10),
	}
}
