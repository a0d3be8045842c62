// Package outguard stops a command from writing over its own input. A Set
// collects the paths a command reads (AddInput) and writes (AddOutput,
// AddOutputDir) and refuses, with a *ClashError, an output that is the same
// file as an input or as another output, or a report folder that contains an
// input.
//
// "The same file" is decided by identity, not spelling: existing files are
// compared with os.SameFile after following symbolic links, which also catches
// hard links and bind mounts; paths that do not exist yet are compared as
// absolute paths with the symbolic links of their existing part resolved, so
// "out.csv", "./out.csv" and "sub/../out.csv" are one file. "-" (standard input
// or output) is skipped; AddInputFile and AddOutputFile check an open file such
// as a redirected standard input or output by identity. Devices and named pipes
// are never a clash: writing /dev/null twice is fine.
//
// Paths are compared byte for byte: on a case-insensitive file system two new
// outputs "A.csv" and "a.csv" are not caught until one of them exists.
package outguard
