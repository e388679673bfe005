// Package scripting runs load-case scripts written in Lua in a sandbox and
// builds plants and load cases from them. It is the only package that imports
// gopher-lua. (Not built yet: see the open issues.)
package scripting
