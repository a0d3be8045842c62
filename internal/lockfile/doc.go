// Package lockfile keeps two runs from writing one report folder at once.
// Acquire creates DIR/.gwsat.lock holding the process id and host name and
// locks it; a second Acquire of the same folder, from this or any other
// process, fails with a *LockedError (wrapping ErrLocked) that names the
// holder. The release function removes the lock file.
//
// # Stale locks
//
// On Linux, macOS and the BSDs the lock is an flock(2) on the lock file, which
// the kernel drops when the holding process ends however it ends (even by
// SIGKILL or a crash). A lock file left behind by a process that is no longer
// running is therefore not held, and the next Acquire takes it over and
// writes its own process id into it. The process id in the file only says who
// holds the lock; a reused process id cannot keep a folder locked.
//
// Elsewhere (Windows, and unix systems without flock) the lock is the
// exclusive creation of the file alone: a lock file left by a crash is not
// taken over, and the error tells the user to delete it once no run is using
// the folder.
package lockfile
