package scripting

import (
	"bytes"

	"github.com/yuin/gopher-lua/parse"
)

// tableLines finds, in a script's source, the line of every table
// constructor that names itself (name = "AB1") or is the value of a key
// (hotwell = {...}): the short form uses them to give each unit the line of
// its own entry rather than that of the steam_plant call. Keys are
// recorded as "=key". The result maps each name to its lines, in order.
func tableLines(src []byte, chunk string) map[string][]int {
	out := map[string][]int{}
	sc := parse.NewScanner(bytes.NewReader(src), chunk)
	lx := &parse.Lexer{}
	var braces []int // lines of the open '{'
	type tk struct {
		typ int
		str string
	}
	var p2, p1 tk // the token before last, and the last
	for n := 0; n < 1<<20; n++ {
		tok, err := sc.Scan(lx)
		if err != nil || tok.Type == parse.EOF || tok.Type == 0 {
			break
		}
		lx.PrevTokenType = tok.Type
		assign := p1.typ == '=' && p2.typ == parse.TIdent
		switch tok.Type {
		case '{':
			if assign {
				out["="+p2.str] = append(out["="+p2.str], tok.Pos.Line)
			}
			braces = append(braces, tok.Pos.Line)
		case '}':
			if len(braces) > 0 {
				braces = braces[:len(braces)-1]
			}
		case parse.TString:
			if assign && p2.str == "name" && len(braces) > 0 {
				out[tok.Str] = append(out[tok.Str], braces[len(braces)-1])
			}
		}
		p2, p1 = p1, tk{tok.Type, tok.Str}
	}
	return out
}

// entryPos is the position of a table entry of a call at pos: the first
// table named key (see tableLines) at or after the call's line in its
// file, or pos itself.
func (r *runner) entryPos(pos Pos, key string) Pos {
	tl, ok := r.tlines[pos.File]
	if !ok {
		src, known := r.sources[pos.File]
		if !known {
			return pos
		}
		tl = tableLines(src, pos.File)
		r.tlines[pos.File] = tl
	}
	for _, l := range tl[key] {
		if l >= pos.Line {
			return Pos{File: pos.File, Line: l}
		}
	}
	return pos
}
