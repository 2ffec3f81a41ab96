package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

// maxInputBytes bounds what trestle reads from one input (a model file or
// a ring-down record); larger inputs are refused with a clear error.
const maxInputBytes = 256 << 20

// readInput returns the contents of the file name, or of stdin when name
// is "-".
func readInput(name string, stdin io.Reader) ([]byte, error) {
	var r io.Reader
	if name == "-" {
		if stdin == nil {
			return nil, errors.New("no standard input to read from")
		}
		r = stdin
	} else {
		f, err := os.Open(name)
		if err != nil {
			return nil, err
		}
		defer f.Close()
		r = f
	}
	b, err := io.ReadAll(io.LimitReader(r, maxInputBytes+1))
	if err != nil {
		return nil, fmt.Errorf("%s: %w", displayName(name), err)
	}
	if len(b) > maxInputBytes {
		return nil, fmt.Errorf("%s: larger than %d MiB; refusing to read it", displayName(name), maxInputBytes>>20)
	}
	return b, nil
}

// displayName is name as used in messages ("standard input" for "-").
func displayName(name string) string {
	if name == "-" {
		return "standard input"
	}
	return name
}

// checkNewFile returns an error if path names an existing file and replace
// is false: a model file the user may have edited is never overwritten
// without being asked to.
func checkNewFile(path string, replace bool) error {
	if path == "" || path == "-" || replace {
		return nil
	}
	if _, err := os.Stat(path); err == nil {
		return fmt.Errorf("%s exists and may hold your edits; choose another --out, or give --replace to overwrite it", path)
	}
	return nil
}

// checkNotInput returns an error if out names the same file as any of the
// inputs (by path or, where both exist, by identity). An input is never
// overwritten.
func checkNotInput(out string, inputs ...string) error {
	if out == "" || out == "-" {
		return nil
	}
	absOut, err := filepath.Abs(out)
	if err != nil {
		return err
	}
	outInfo, outErr := os.Stat(out)
	for _, in := range inputs {
		if in == "" || in == "-" {
			continue
		}
		absIn, err := filepath.Abs(in)
		if err == nil && absIn == absOut {
			return fmt.Errorf("output %s is the input file; refusing to overwrite an input", out)
		}
		if outErr == nil {
			if inInfo, err := os.Stat(in); err == nil && os.SameFile(inInfo, outInfo) {
				return fmt.Errorf("output %s is the same file as input %s; refusing to overwrite an input", out, in)
			}
		}
	}
	return nil
}

// writeAtomic writes the output of fill to path through a temporary file
// in the same directory, renamed into place only when fill and the close
// succeed, so a reader never sees a half-written file and a failure leaves
// any earlier file untouched. The path must not be one of inputs.
func writeAtomic(path string, inputs []string, fill func(io.Writer) error) (err error) {
	if err := checkNotInput(path, inputs...); err != nil {
		return err
	}
	dir := filepath.Dir(path)
	f, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return fmt.Errorf("cannot write %s: %w", path, err)
	}
	tmp := f.Name()
	defer func() {
		if err != nil {
			f.Close()
			os.Remove(tmp)
		}
	}()
	if err = fill(f); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if err = f.Chmod(0o644); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if err = f.Close(); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	if err = os.Rename(tmp, path); err != nil {
		return fmt.Errorf("writing %s: %w", path, err)
	}
	return nil
}
