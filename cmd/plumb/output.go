package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
)

// errOutputExists is wrapped by writeFileAtomic's error when the output exists and may not be replaced.
var errOutputExists = errors.New("exists (use --force to overwrite)")

// writeFileAtomic writes data to path through a temporary file in the same folder, renamed over path
// once all of it is written and flushed to disk, so a failure (a full disk, a size limit) leaves
// neither a partial output nor the temporary file, and an existing path is replaced whole or not at
// all. Without overwrite an existing path is an error. Errors name path.
func writeFileAtomic(path string, data []byte, overwrite bool) error {
	if _, err := os.Lstat(path); err == nil && !overwrite {
		return fmt.Errorf("%s %w", path, errOutputExists)
	}
	f, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".*.tmp")
	if err != nil {
		return fmt.Errorf("cannot write %s: %w", path, unwrapPath(err))
	}
	tmp := f.Name()
	_, err = f.Write(data)
	if err == nil {
		err = f.Chmod(0o644)
	}
	if err == nil {
		err = f.Sync()
	}
	if cerr := f.Close(); err == nil {
		err = cerr
	}
	if err == nil {
		err = os.Rename(tmp, path)
	}
	if err != nil {
		os.Remove(tmp)
		return fmt.Errorf("cannot write %s: %w", path, unwrapPath(err))
	}
	return nil
}

// unwrapPath drops the temporary file's name from an error, leaving its cause ("no space left on
// device"), since the message names the output path instead.
func unwrapPath(err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	var le *os.LinkError
	if errors.As(err, &le) {
		return le.Err
	}
	return err
}
