package outguard

import (
	"errors"
	"fmt"
)

var (
	// ErrSameFile: an output is the same file as an input or another output.
	ErrSameFile = errors.New("outguard: output would overwrite another file of the command")
	// ErrInputInDir: a report folder holds an input file.
	ErrInputInDir = errors.New("outguard: report folder contains an input")
)

// ClashError names the two paths, as the user spelled them, and wraps
// ErrSameFile or ErrInputInDir.
type ClashError struct {
	Path      string // the path that was being added
	Kind      Kind
	Other     string // the path it clashes with
	OtherKind Kind
	Err       error
}

func (e *ClashError) Error() string {
	if errors.Is(e.Err, ErrInputInDir) {
		in, dir := e.Path, e.Other
		if e.Kind == OutputDir {
			in, dir = e.Other, e.Path
		}
		return fmt.Sprintf("outguard: input %q is inside the output folder %q", in, dir)
	}
	return fmt.Sprintf("outguard: %s %q is the same file as %s %q", e.Kind, e.Path, e.OtherKind, e.Other)
}

func (e *ClashError) Unwrap() error { return e.Err }
