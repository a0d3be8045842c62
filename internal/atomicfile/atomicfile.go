package atomicfile

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

// WriteFile writes data to path atomically (see WriteWith).
func WriteFile(path string, data []byte) error {
	return WriteWith(path, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	})
}

// WriteWith calls fill with a writer for a temporary file next to path and,
// when fill returns nil, renames the temporary file to path. When fill (or
// the file system) fails, the temporary file is removed and the error
// returned; path is not touched. A replaced file keeps its permission bits, a
// new one gets 0o666 less the umask; a read-only destination is refused with
// an error wrapping ErrReadOnly.
func WriteWith(path string, fill func(w io.Writer) error) (err error) {
	path, err = resolve(path)
	if err != nil {
		return err
	}
	fi, statErr := os.Stat(path)
	switch {
	case statErr == nil && fi.IsDir():
		return fmt.Errorf("%w: %s", ErrIsDir, path)
	case statErr == nil && !fi.Mode().IsRegular():
		// A device or a named pipe (/dev/null, /dev/stdout, a FIFO) is
		// written to directly: renaming over it would replace the device
		// itself. Those writes cannot be atomic, and need not be.
		return writeDevice(path, fill)
	case statErr == nil:
		if err := checkWritable(path, fi); err != nil {
			return err
		}
	case !os.IsNotExist(statErr):
		return fmt.Errorf("atomicfile: %w", statErr)
	}

	// Replacing: keep the old permission bits. New: let the kernel apply the
	// umask to 0o666, exactly as for os.Create.
	createPerm, perm, keep := os.FileMode(0o666), os.FileMode(0), false
	if statErr == nil {
		createPerm, perm, keep = 0o600, fi.Mode().Perm(), true
	}
	tmp, err := createTemp(path, createPerm)
	if err != nil {
		return err
	}
	name := tmp.Name()
	committed := false
	defer func() {
		// Also when fill panics: the panic goes on, the temporary file not.
		if !committed {
			tmp.Close()
			os.Remove(name)
		}
		forget(name)
	}()
	// Buffered: a fill that writes in small pieces (a template, a CSV
	// writer) costs one system call per 64 KiB, not one per piece.
	bw := bufio.NewWriterSize(tmp, 64<<10)
	if err = fill(bw); err != nil {
		return err
	}
	if err = bw.Flush(); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	if keep {
		// Created as 0o600 less the umask; now the old bits exactly.
		if err = tmp.Chmod(perm); err != nil {
			return fmt.Errorf("atomicfile: %w", err)
		}
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	if err = renameIfInFlight(name, path); err != nil {
		return err
	}
	committed = true
	syncDir(path)
	return nil
}

// syncDir makes the rename itself durable by syncing the folder that holds
// path. It is best effort: some systems cannot open or sync a folder, and the
// data are already safe in the file.
func syncDir(path string) {
	dir, _ := filepath.Split(path)
	if dir == "" {
		dir = "."
	}
	if d, err := os.Open(dir); err == nil {
		d.Sync()
		d.Close()
	}
}

// writeDevice fills a buffer first, so that a failing fill writes nothing.
func writeDevice(path string, fill func(w io.Writer) error) error {
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
	if err := f.Close(); err != nil {
		return fmt.Errorf("atomicfile: %w", err)
	}
	return nil
}
