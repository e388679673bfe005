// Package reference holds no code: it is the folder of the project's
// reference sheets and data files (see README.md here), and its tests keep
// the citations of the sheets in step with them.
//
// The sheets are copies, byte for byte, of the shared reference set the
// project was started with; they are now the project's own. The code cites
// them as docs/reference/<sheet> §<section>, with the item's tag, for
// example docs/reference/plant-checks.md §3.6 [C].
//
// The tests, run with go test ./docs/reference:
//
//   - TestCitationsResolve scans every .go, .md and .lua file of the
//     repository (the root is two folders up from here, and nothing outside
//     it is read) and fails, listing file:line, for each citation whose
//     sheet is not in this folder, or whose section, sub-item or quoted
//     item words do not exist in that sheet.
//   - TestCitationsStrict fails for each citation outside this folder's
//     Markdown files that is not in the docs/reference/ form (the older
//     forms omit the folder, or lean on a sheet named earlier in the file
//     with a bare section sign).
//   - TestTestdataCopies checks that the packages' testdata copies of the
//     data files agree with the files here: whole files byte for byte, and
//     the two subsets of plant/combustion row for row.
//
// What a citation is, and the rules that find it, are in package
// docs/reference/internal/cite; the command docs/reference/internal/recite
// lists the citations and rewrites them to the docs/reference/ form.
package reference
