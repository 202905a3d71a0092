package tui

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
)

// CheckReportDir says why dir cannot take the dashboard's files (reports,
// saved conditions and states), nil if it can: it must be a folder that
// exists and can be written to. The check writes and removes one empty
// hidden file, so that a folder the officer may not write to is found at
// start and not at the first save.
func CheckReportDir(dir string) error {
	st, err := os.Stat(dir)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return fmt.Errorf("there is no folder %s: make it first (mkdir) or name one that exists", dir)
	case err != nil:
		return fmt.Errorf("folder %s cannot be read: %v", dir, osReason(err))
	case !st.IsDir():
		return fmt.Errorf("%s is a file, not a folder: name the folder reports and saved files go to", dir)
	}
	f, err := os.CreateTemp(dir, ".heelwatch-check-*")
	if err != nil {
		return fmt.Errorf("folder %s cannot be written to: %v", dir, osReason(err))
	}
	name := f.Name()
	f.Close()
	os.Remove(name)
	return nil
}

// saveError words a failure to write the file path so that it names the
// file (or its folder, when that is what is wrong), never the hidden
// temporary file the text went to first.
func saveError(path string, err error) error {
	if err == nil {
		return nil
	}
	dir := filepath.Dir(path)
	if st, serr := os.Stat(dir); errors.Is(serr, fs.ErrNotExist) {
		return fmt.Errorf("%s: there is no folder %s", path, dir)
	} else if serr == nil && !st.IsDir() {
		return fmt.Errorf("%s: %s is a file, not a folder", path, dir)
	}
	return fmt.Errorf("%s: %v", path, osReason(err))
}

// osReason is err without the file name an os error carries (which may be
// a hidden temporary file's): "permission denied", "no space left on
// device".
func osReason(err error) error {
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
