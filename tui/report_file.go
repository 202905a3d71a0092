package tui

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

// writeNewFile writes a new file in dir named base+".md" (base-2.md, … if
// that name is taken) so that it is either whole or absent: the text goes
// to a hidden temporary file in the same directory, is synced and closed,
// and only then gets its name. A full disk or any other failure leaves no
// half report behind (the temporary file is removed), and an existing file
// is never overwritten: the name is given with a hard link, which fails
// when the name exists, or where the file system has no links with a
// rename after a check.
func writeNewFile(dir, base string, write func(io.Writer) error) (string, error) {
	if dir == "" {
		dir = "." // the working directory, not os.TempDir
	}
	tmp, err := os.CreateTemp(dir, ".heelwatch-report-*.tmp")
	if err != nil {
		return "", err
	}
	tmpName := tmp.Name()
	defer os.Remove(tmpName) // gone once named, or on failure
	err = write(tmp)
	if serr := tmp.Sync(); err == nil {
		err = serr
	}
	if cerr := tmp.Close(); err == nil {
		err = cerr
	}
	if err != nil {
		return "", err
	}
	for k := 1; k < 100; k++ {
		name := base + ".md"
		if k > 1 {
			name = fmt.Sprintf("%s-%d.md", base, k)
		}
		path := filepath.Join(dir, name)
		err := os.Link(tmpName, path)
		switch {
		case err == nil:
			return path, nil
		case errors.Is(err, os.ErrExist):
			continue
		}
		if _, serr := os.Lstat(path); serr == nil {
			continue
		}
		if err := os.Rename(tmpName, path); err != nil {
			return path, err
		}
		return path, nil
	}
	return "", fmt.Errorf("%s: 99 reports of that second already", filepath.Join(dir, base))
}
