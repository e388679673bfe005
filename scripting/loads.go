package scripting

import (
	"fmt"

	lua "github.com/yuin/gopher-lua"
)

// loadsBuilders are the consumer kinds computed by package plant/loads.
var loadsBuilders = map[string]unitBuilder{}

func (r *runner) loadsBuilder(kind string) (unitBuilder, bool) {
	b, ok := loadsBuilders[kind]
	return b, ok
}

func (r *runner) registerLoads(methods *lua.LTable) {
	for kind, b := range loadsBuilders {
		methods.RawSetString(kind, r.L.NewFunction(r.unitMethod(kind, b)))
	}
}

func unknownKindMsg(k string) string {
	names := []string{"consumer"}
	for n := range loadsBuilders {
		names = append(names, n)
	}
	sortStrings(names)
	msg := fmt.Sprintf("unknown consumer kind %q", k)
	if s := suggest(k, names); s != "" {
		msg += fmt.Sprintf("; did you mean %q?", s)
	}
	return msg + fmt.Sprintf(" (kinds: %v)", names)
}
