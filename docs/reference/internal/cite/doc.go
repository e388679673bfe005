// Package cite finds the citations of the project's reference sheets in
// source files (.go, .md, .lua), checks them against the sheets, and
// rewrites them to the form the project uses, docs/reference/<sheet>
// §<section>. It is shared by the test of docs/reference and by the
// recite command, so that the check and the rewrite agree on what a
// citation is.
//
// What counts as a citation (see Form for the names):
//
//   - a sheet's file name, with or without a path into a reference folder,
//     followed by a section sign: the name alone, a path into the shared set
//     the copies came from (shared/reference/, ../shared/reference/,
//     reference/), or the target path docs/reference/;
//   - a sheet's file name without a section, when the file is one of the
//     known sheets or carries one of those paths (README.md only with a
//     path, since the repository has other READMEs);
//   - two phrases that name a sheet without its file name: "reference
//     README" and "<name> reference sheet" (a hyphenated name);
//   - a further section directly after a citation, joined by a short run of
//     text without a bracket or a sentence end ("§2.1 [C], §11 item 4",
//     "§3.2/§3.3"): chained to it;
//   - a bare section sign after a sheet was named earlier in the same file:
//     implicit, to the sheet named last. Excluded: a section of the form
//     §9-5 (a book's chapter and section), and a section sign whose
//     preceding text names one of OtherSources (EN 1993-1-2 §3.4.1.3). The
//     sheets themselves are scanned without implicit citations, since their
//     bare section signs are their own cross-references.
//
// A citation may carry, after its section, a tag in brackets ("[C]") and a
// sub-item: "item N" or "#N" (the row numbered N of a table of the
// section), "row N" (the N-th data row of the section's tables), "check X"
// (the section's "Check X"); and, before its sheet, quoted words naming an
// item ("Sign of the weights [C]" of …). Sheet.Check verifies the section,
// the sub-item and the quoted words.
//
// Comment leaders (// in Go, -- in Lua, > in Markdown) at the start of a
// line are skipped, so a citation may run over a line break in a comment.
//
// Limits, named: the recognition is textual. A section sign that belongs to
// another source and is not preceded by one of OtherSources is taken as
// the context sheet's; if that section does not exist the check fails and
// the source belongs in OtherSources, but if it happens to exist the
// citation is misattributed silently. The recite command lists every
// implicit citation for review before it rewrites.
package cite
