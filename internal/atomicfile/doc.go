// Package atomicfile writes output files so that a reader never sees a half
// file: data go to a temporary file in the destination's directory, which is
// synced and then renamed over the destination. A failed write leaves the
// destination as it was (absent or the previous version) and no temporary file.
//
// # What is kept
//
// A symbolic link is followed, so its target is replaced and the link kept (a
// dangling link's target is created, as os.Create would). A device or a named
// pipe (/dev/null, a FIFO) is written into, never replaced. A file that is
// replaced keeps its permission bits; a new file gets 0o666 less the process
// umask, as with os.Create. A file without write permission is not replaced:
// the error wraps ErrReadOnly. (Ownership and extended attributes are not
// copied: the new file belongs to the writing user.)
//
// # Temporary files
//
// Temporary files are named ".NAME.gwsat-tmp-XXXXXXXXXXXX" (twelve hex digits)
// next to the destination. CleanStale removes those that a killed process left
// behind, and nothing else. Writes in progress are registered: a command's
// main calls RemoveInFlight when it receives SIGINT or SIGTERM, which deletes
// their temporary files and makes those writes (and any later ones) fail with
// ErrInterrupted instead of renaming.
package atomicfile
