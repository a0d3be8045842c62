package atomicfile

import "errors"

var (
	// ErrReadOnly: the destination exists and has no write permission for us
	// (no owner write bit, or the access check fails). It is not replaced.
	ErrReadOnly = errors.New("atomicfile: destination is read-only")
	// ErrIsDir: the destination is a directory.
	ErrIsDir = errors.New("atomicfile: destination is a directory")
	// ErrInterrupted: RemoveInFlight was called (the process is stopping);
	// the write was abandoned and its temporary file removed.
	ErrInterrupted = errors.New("atomicfile: write interrupted")
)
