package atomicfile

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"sync"
)

// registry holds the temporary files of the writes in progress, so that a
// signal handler can remove them. Creation and registration happen under one
// lock, as do the final check and the rename: RemoveInFlight sees every
// temporary file that exists, and a write either completes its rename or
// loses its file, never both.
var registry struct {
	sync.Mutex
	files    map[string]bool
	stopping bool
}

func openRegistered(name string, perm os.FileMode) (*os.File, error) {
	registry.Lock()
	defer registry.Unlock()
	if registry.stopping {
		return nil, ErrInterrupted
	}
	f, err := os.OpenFile(name, os.O_RDWR|os.O_CREATE|os.O_EXCL, perm)
	if err != nil {
		if errors.Is(err, os.ErrExist) {
			return nil, err
		}
		return nil, fmt.Errorf("atomicfile: %w", err)
	}
	if registry.files == nil {
		registry.files = make(map[string]bool)
	}
	registry.files[name] = true
	return f, nil
}

func forget(name string) {
	registry.Lock()
	delete(registry.files, name)
	registry.Unlock()
}

// renameIfInFlight renames the finished temporary file over path, unless
// RemoveInFlight took it away meanwhile.
func renameIfInFlight(name, path string) error {
	registry.Lock()
	defer registry.Unlock()
	if !registry.files[name] {
		return fmt.Errorf("%w: %s not written", ErrInterrupted, path)
	}
	if err := os.Rename(name, path); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	delete(registry.files, name)
	return nil
}

func isInFlight(path string) bool {
	abs, err := filepath.Abs(path)
	if err != nil {
		return false
	}
	registry.Lock()
	defer registry.Unlock()
	for name := range registry.files {
		if a, err := filepath.Abs(name); err == nil && a == abs {
			return true
		}
	}
	return false
}

// RemoveInFlight deletes the temporary files of every write in progress and
// returns their names, sorted. Those writes then fail with ErrInterrupted
// instead of renaming, and so does every write started afterwards: it is
// meant for a process that is stopping, called from the handler of SIGINT or
// SIGTERM just before exiting. Safe for concurrent use.
func RemoveInFlight() []string {
	registry.Lock()
	defer registry.Unlock()
	registry.stopping = true
	var removed []string
	for name := range registry.files {
		if err := os.Remove(name); err == nil || errors.Is(err, os.ErrNotExist) {
			removed = append(removed, name)
		}
		delete(registry.files, name)
	}
	slices.Sort(removed)
	return removed
}
