package scripting

import (
	"io"
	"math"
	"math/rand/v2"
	"strings"

	lua "github.com/yuin/gopher-lua"
)

// removedGlobals are the base-library functions a load-case script must not
// reach: file and code loading, the module system, the collector, and the
// interpreter's register dump (which writes to stdout).
var removedGlobals = [...]string{
	"dofile", "loadfile", "load", "loadstring", "require", "module",
	"collectgarbage", "_printregs", "newproxy", "getfenv", "setfenv",
}

// newState makes the sandboxed interpreter of one run: base, table, string
// and math only, with print, math.random and the string functions that
// could allocate without bound replaced.
func (r *runner) newState() (*lua.LState, error) {
	L := lua.NewState(lua.Options{
		SkipOpenLibs:    true,
		CallStackSize:   r.opt.CallStackSize,
		RegistrySize:    r.opt.RegistrySize,
		RegistryMaxSize: r.opt.RegistryMaxSize,
		// Grow the data stack in large steps: with the default step of
		// 32 a long unpack copies the stack quadratically, inside Go where
		// the time limit cannot stop it.
		RegistryGrowStep: 4096,
	})
	for _, lib := range []struct {
		name string
		open lua.LGFunction
	}{
		{lua.BaseLibName, lua.OpenBase},
		{lua.TabLibName, lua.OpenTable},
		{lua.StringLibName, lua.OpenString},
		{lua.MathLibName, lua.OpenMath},
	} {
		if err := L.CallByParam(lua.P{Fn: L.NewFunction(lib.open), NRet: 0, Protect: true}, lua.LString(lib.name)); err != nil {
			L.Close()
			return nil, err
		}
	}
	for _, name := range removedGlobals {
		L.SetGlobal(name, lua.LNil)
	}
	L.SetGlobal("print", L.NewFunction(r.luaPrint))
	if fn, ok := L.GetGlobal("unpack").(*lua.LFunction); ok {
		L.SetGlobal("unpack", L.NewFunction(r.boundedUnpack(fn)))
	}

	if m, ok := L.GetGlobal(lua.MathLibName).(*lua.LTable); ok {
		m.RawSetString("random", L.NewFunction(r.luaRandom))
		m.RawSetString("randomseed", L.NewFunction(r.luaRandomSeed))
	}
	if s, ok := L.GetGlobal(lua.StringLibName).(*lua.LTable); ok {
		// string is also the metatable's __index of every string value, so
		// ("x"):rep(n) reaches the replacements too.
		s.RawSetString("dump", lua.LNil)
		s.RawSetString("rep", L.NewFunction(r.luaStrRep))
		for _, name := range [...]string{"find", "match", "gmatch", "gsub"} {
			if fn, ok := s.RawGetString(name).(*lua.LFunction); ok {
				s.RawSetString(name, L.NewFunction(r.boundedPattern(name, fn)))
			}
		}
	}
	return L, nil
}

// luaPrint writes its arguments, separated by tabs, as a line of plain
// text to Options.Print (and to the logger at debug level with the script
// position), or, without a Print writer, to the logger at info level.
func (r *runner) luaPrint(L *lua.LState) int {
	var b strings.Builder
	n := L.GetTop()
	for i := 1; i <= n; i++ {
		if i > 1 {
			b.WriteByte('\t')
		}
		b.WriteString(L.ToStringMeta(L.Get(i)).String())
		if b.Len() > maxPrintBytes {
			break
		}
	}
	s := b.String()
	if len(s) > maxPrintBytes {
		s = s[:maxPrintBytes] + "…"
	}
	if r.opt.Print == nil {
		r.log.Info().Str("pos", r.where().String()).Msg(s)
		return 0
	}
	r.log.Debug().Str("pos", r.where().String()).Msg(s)
	io.WriteString(r.opt.Print, s+"\n") // a print that cannot be shown does not stop the run
	return 0
}

// maxPrintBytes bounds one printed message.
const maxPrintBytes = 64 << 10

// luaRandom is math.random on the run's own seeded PCG source: no argument
// gives a float in [0,1), random(m) an integer in [1,m], random(m,n) an
// integer in [m,n].
func (r *runner) luaRandom(L *lua.LState) int {
	switch L.GetTop() {
	case 0:
		L.Push(lua.LNumber(r.rng.Float64()))
		return 1
	case 1, 2:
		lo, hi := 1.0, float64(L.CheckNumber(1))
		if L.GetTop() == 2 {
			lo, hi = hi, float64(L.CheckNumber(2))
		}
		lo, hi = math.Floor(lo), math.Floor(hi)
		if !(lo <= hi) || hi-lo >= 1<<53 || math.Abs(lo) > 1<<53 || math.Abs(hi) > 1<<53 {
			L.ArgError(1, "interval is empty or too wide")
		}
		L.Push(lua.LNumber(lo + float64(r.rng.Uint64N(uint64(hi-lo)+1))))
		return 1
	}
	L.RaiseError("math.random takes at most 2 arguments")
	return 0
}

// luaRandomSeed restarts the run's source from a seed given by the script.
func (r *runner) luaRandomSeed(L *lua.LState) int {
	s := float64(L.CheckNumber(1))
	r.rng = rand.New(rand.NewPCG(uint64(int64(s)), r.opt.Seed))
	return 0
}

// luaStrRep is string.rep with a bound on the result's size.
func (r *runner) luaStrRep(L *lua.LState) int {
	s := L.CheckString(1)
	n := L.CheckInt(2)
	if n <= 0 || s == "" {
		L.Push(lua.LString(""))
		return 1
	}
	if n > r.opt.MaxString/len(s) {
		L.RaiseError("string.rep: the result would exceed %d bytes", r.opt.MaxString)
	}
	L.Push(lua.LString(strings.Repeat(s, n)))
	return 1
}

// boundedPattern wraps a pattern function so that its work is bounded:
// Lua patterns backtrack, and a long subject with a pattern of several
// repetitions would run inside Go, where the time limit cannot interrupt
// it. The work of a search is taken as n^(1+q) steps for a subject of n
// bytes and a pattern of q repetitions ('*', '+', '-'), and refused above
// maxPatternWork; plain finds (string.find(s, p, init, true)) are linear.
// gsub copies the subject for each replacement: its work is multiplied by
// the number of replacements it may make.
func (r *runner) boundedPattern(name string, fn *lua.LFunction) lua.LGFunction {
	return func(L *lua.LState) int {
		s, _ := L.Get(1).(lua.LString)
		p, _ := L.Get(2).(lua.LString)
		if len(s) > maxPatternSubject {
			L.RaiseError("string.%s: subject of %d bytes is longer than %d", name, len(s), maxPatternSubject)
		}
		if len(p) > maxPattern {
			L.RaiseError("string.%s: pattern of %d bytes is longer than %d", name, len(p), maxPattern)
		}
		plain := name == "find" && lua.LVAsBool(L.Get(4))
		if !plain {
			q := 0
			for i := 0; i < len(p); i++ {
				switch p[i] {
				case '%':
					i++ // an escaped character is not a repetition
				case '*', '+', '-':
					q++
				}
			}
			work := math.Pow(float64(len(s)+1), float64(1+q))
			if name == "gsub" {
				// each replacement copies the subject
				reps := float64(len(s) + 1)
				if n, ok := L.Get(4).(lua.LNumber); ok && float64(n) >= 0 && float64(n) < reps {
					reps = float64(n) + 1
				}
				work *= reps
			}
			if work > maxPatternWork && name == "gsub" {
				L.RaiseError("string.gsub: %d bytes with a pattern of %d repetitions may take too long (each replacement copies the subject); give a shorter subject or a maximum number of replacements", len(s), q)
			}
			if work > maxPatternWork {
				L.RaiseError("string.%s: a pattern with %d repetitions on %d bytes may take too long; use a shorter subject, fewer '*', '+' or '-', or a plain find", name, q, len(s))
			}
		}
		top := L.GetTop()
		L.Push(fn)
		for i := 1; i <= top; i++ {
			L.Push(L.Get(i))
		}
		L.Call(top, lua.MultRet)
		return L.GetTop() - top
	}
}

// Bounds of the pattern functions.
const (
	maxPatternSubject = 1 << 20
	maxPattern        = 256
	maxPatternWork    = 2e7
)

// maxUnpack bounds the values unpack returns.
const maxUnpack = 10000

// boundedUnpack wraps unpack so that it returns at most maxUnpack values.
func (r *runner) boundedUnpack(fn *lua.LFunction) lua.LGFunction {
	return func(L *lua.LState) int {
		t := L.CheckTable(1)
		i := L.OptInt(2, 1)
		j := L.OptInt(3, t.Len())
		if j >= i && j-i >= maxUnpack {
			L.RaiseError("unpack: %d values are more than %d", j-i+1, maxUnpack)
		}
		top := L.GetTop()
		L.Push(fn)
		for k := 1; k <= top; k++ {
			L.Push(L.Get(k))
		}
		L.Call(top, lua.MultRet)
		return L.GetTop() - top
	}
}
