// Package atomicfile writes output files so that a reader never sees a half
// file: data go to a temporary file in the destination's directory, which is
// synced and then renamed over the destination. A failed write leaves the
// destination as it was (absent or the previous version) and no temporary file.
package atomicfile

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

// WriteFile writes data to path atomically with permissions 0o644.
func WriteFile(path string, data []byte) error {
	return WriteWith(path, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	})
}

// WriteWith calls fill with a writer for a temporary file next to path and,
// when fill returns nil, renames the temporary file to path. When fill (or
// the file system) fails, the temporary file is removed and the error
// returned; path is not touched.
func WriteWith(path string, fill func(w io.Writer) error) (err error) {
	// A symbolic link is followed, so the file it points to is replaced and
	// the link kept. A device or a named pipe (/dev/null, /dev/stdout, a
	// FIFO) is written to directly: renaming over it would replace the
	// device itself. Those writes cannot be atomic, and need not be.
	if real, err := filepath.EvalSymlinks(path); err == nil {
		path = real
	}
	if fi, err := os.Stat(path); err == nil && !fi.Mode().IsRegular() {
		if fi.IsDir() {
			return fmt.Errorf("atomicfile: %s is a directory", path)
		}
		var buf bytes.Buffer
		if err := fill(&buf); err != nil {
			return err
		}
		f, err := os.OpenFile(path, os.O_WRONLY, 0)
		if err != nil {
			return fmt.Errorf("atomicfile: %w", err)
		}
		if _, err := f.Write(buf.Bytes()); err != nil {
			f.Close()
			return fmt.Errorf("atomicfile: %w", err)
		}
		return f.Close()
	}
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	name := tmp.Name()
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(name)
		}
	}()
	if err = fill(tmp); err != nil {
		return err
	}
	if err = tmp.Chmod(0o644); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	if err = os.Rename(name, path); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	return nil
}
