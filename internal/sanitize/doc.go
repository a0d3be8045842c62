// Package sanitize makes text from files (names, cells, headers) safe to show on
// a terminal. Terminal escapes the characters that a terminal would act on
// instead of showing: C0 controls such as ESC and BEL, DEL, C1 controls, bytes
// that are not UTF-8, the bidirectional controls that can reorder what is shown
// and the Unicode line and paragraph separators. Printable text, including
// non-ASCII letters and symbols (ü, µ, °), passes unchanged.
//
// The escaped form is for reading, not for parsing back: a backslash in the
// input is left as it is (Windows paths keep theirs), so "\x1b" in the output
// may have been either ESC or those four characters.
package sanitize
