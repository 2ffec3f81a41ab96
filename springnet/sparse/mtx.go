package sparse

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// Matrix Market exchange format (Boisvert, Pozo and Remington, "The
// Matrix Market exchange formats: initial design", NIST IR 5935, 1996).

// maxMTXOrder bounds the order accepted by the readers, so that a corrupt
// header cannot make them allocate without limit.
const maxMTXOrder = 1 << 24

// WriteMatrix writes a in Matrix Market form as a `coordinate real
// symmetric` matrix: its stored lower triangle, 1-based, sorted by column
// then row, values in the shortest form that parses back to the same
// float64. Each line of comment, if any, is written as a `%` line after
// the header.
func WriteMatrix(w io.Writer, a *Matrix, comment ...string) error {
	bw := bufio.NewWriterSize(w, 1<<16)
	bw.WriteString("%%MatrixMarket matrix coordinate real symmetric\n")
	writeComments(bw, comment)
	fmt.Fprintf(bw, "%d %d %d\n", a.n, a.n, a.NNZ())
	var buf []byte
	for j := 0; j < a.n; j++ {
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			buf = strconv.AppendInt(buf[:0], int64(a.rowIdx[p]+1), 10)
			buf = append(buf, ' ')
			buf = strconv.AppendInt(buf, int64(j+1), 10)
			buf = append(buf, ' ')
			buf = strconv.AppendFloat(buf, a.val[p], 'g', -1, 64)
			buf = append(buf, '\n')
			bw.Write(buf)
		}
	}
	return bw.Flush()
}

// WriteVector writes x in Matrix Market form as an `array real general`
// n×1 matrix, values in the shortest form that parses back exactly.
func WriteVector(w io.Writer, x []float64, comment ...string) error {
	bw := bufio.NewWriterSize(w, 1<<16)
	bw.WriteString("%%MatrixMarket matrix array real general\n")
	writeComments(bw, comment)
	fmt.Fprintf(bw, "%d 1\n", len(x))
	var buf []byte
	for _, v := range x {
		buf = strconv.AppendFloat(buf[:0], v, 'g', -1, 64)
		buf = append(buf, '\n')
		bw.Write(buf)
	}
	return bw.Flush()
}

func writeComments(bw *bufio.Writer, comment []string) {
	for _, c := range comment {
		for _, line := range strings.Split(c, "\n") {
			bw.WriteString("% " + line + "\n")
		}
	}
}

// mtxReader reads the lines of a Matrix Market file, counting them.
type mtxReader struct {
	sc   *bufio.Scanner
	line int
}

func newMTXReader(r io.Reader) *mtxReader {
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 64*1024), 1<<20)
	return &mtxReader{sc: sc}
}

func (m *mtxReader) errorf(format string, args ...any) error {
	return fmt.Errorf("sparse: matrix market line %d: "+format, append([]any{m.line}, args...)...)
}

// next returns the fields of the next line that is neither blank nor a
// comment; io.ErrUnexpectedEOF at the end.
func (m *mtxReader) next() ([]string, error) {
	for m.sc.Scan() {
		m.line++
		t := strings.TrimSpace(m.sc.Text())
		if t == "" || t[0] == '%' {
			continue
		}
		return strings.Fields(t), nil
	}
	if err := m.sc.Err(); err != nil {
		return nil, fmt.Errorf("sparse: matrix market after line %d: %w", m.line, err)
	}
	return nil, io.ErrUnexpectedEOF
}

// header reads and checks the banner line.
func (m *mtxReader) header(format, symmetry string) error {
	if !m.sc.Scan() {
		if err := m.sc.Err(); err != nil {
			return fmt.Errorf("sparse: matrix market: %w", err)
		}
		return errors.New("sparse: matrix market: empty input")
	}
	m.line = 1
	f := strings.Fields(strings.ToLower(m.sc.Text()))
	if len(f) != 5 || f[0] != "%%matrixmarket" || f[1] != "matrix" {
		return m.errorf("not a Matrix Market header (want %q)", "%%MatrixMarket matrix "+format+" real "+symmetry)
	}
	if f[2] != format {
		return m.errorf("format %q: want %q", f[2], format)
	}
	if f[3] != "real" && f[3] != "integer" && f[3] != "double" {
		return m.errorf("field %q: want real or integer", f[3])
	}
	if f[4] != symmetry {
		return m.errorf("symmetry %q: want %q", f[4], symmetry)
	}
	return nil
}

func (m *mtxReader) count(s, what string, limit int) (int, error) {
	v, err := strconv.Atoi(s)
	if err != nil || v < 0 || v > limit {
		return 0, m.errorf("%s %q: want an integer from 0 to %d", what, s, limit)
	}
	return v, nil
}

func (m *mtxReader) value(s string) (float64, error) {
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		return 0, m.errorf("value %q is not a number", s)
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, m.errorf("value %q is not finite", s)
	}
	return v, nil
}

// ReadMatrix reads a `coordinate real symmetric` (or integer) Matrix
// Market matrix. Entries may be given in either triangle; duplicates are
// summed. It returns an error naming the line for a malformed file, an
// index out of range, a non-finite value or a wrong entry count.
func ReadMatrix(r io.Reader) (*Matrix, error) {
	m := newMTXReader(r)
	if err := m.header("coordinate", "symmetric"); err != nil {
		return nil, err
	}
	f, err := m.next()
	if err != nil {
		return nil, m.errorf("missing size line")
	}
	if len(f) != 3 {
		return nil, m.errorf("size line %q: want rows, columns and entry count", strings.Join(f, " "))
	}
	rows, err := m.count(f[0], "rows", maxMTXOrder)
	if err != nil {
		return nil, err
	}
	cols, err := m.count(f[1], "columns", maxMTXOrder)
	if err != nil {
		return nil, err
	}
	if rows != cols {
		return nil, m.errorf("a symmetric matrix must be square, got %d×%d", rows, cols)
	}
	nnz, err := m.count(f[2], "entry count", math.MaxInt32)
	if err != nil {
		return nil, err
	}
	if rows > 0 && nnz > rows*(rows+1)/2 {
		return nil, m.errorf("entry count %d exceeds the %d entries of a triangle of order %d", nnz, rows*(rows+1)/2, rows)
	}
	b := NewBuilder(rows)
	b.grow(min(nnz, 1<<20))
	for k := 0; k < nnz; k++ {
		f, err := m.next()
		if err == io.ErrUnexpectedEOF {
			return nil, m.errorf("file ends after %d of %d entries", k, nnz)
		} else if err != nil {
			return nil, err
		}
		if len(f) != 3 {
			return nil, m.errorf("entry %q: want row, column and value", strings.Join(f, " "))
		}
		i, err1 := strconv.Atoi(f[0])
		j, err2 := strconv.Atoi(f[1])
		if err1 != nil || err2 != nil || i < 1 || j < 1 || i > rows || j > rows {
			return nil, m.errorf("entry index (%s, %s) outside 1..%d", f[0], f[1], rows)
		}
		v, err := m.value(f[2])
		if err != nil {
			return nil, err
		}
		b.Add(i-1, j-1, v)
	}
	if f, err := m.next(); err == nil {
		return nil, m.errorf("unexpected data %q after %d entries", strings.Join(f, " "), nnz)
	} else if err != io.ErrUnexpectedEOF {
		return nil, err
	}
	return b.Matrix(), nil
}

// ReadVector reads an `array real general` n×1 Matrix Market matrix as a
// vector. Errors name the line, as for ReadMatrix.
func ReadVector(r io.Reader) ([]float64, error) {
	m := newMTXReader(r)
	if err := m.header("array", "general"); err != nil {
		return nil, err
	}
	f, err := m.next()
	if err != nil {
		return nil, m.errorf("missing size line")
	}
	if len(f) != 2 {
		return nil, m.errorf("size line %q: want rows and columns", strings.Join(f, " "))
	}
	n, err := m.count(f[0], "rows", maxMTXOrder)
	if err != nil {
		return nil, err
	}
	if f[1] != "1" {
		return nil, m.errorf("%s columns: a vector has 1", f[1])
	}
	x := make([]float64, 0, min(n, 1<<20))
	for k := 0; k < n; k++ {
		f, err := m.next()
		if err == io.ErrUnexpectedEOF {
			return nil, m.errorf("file ends after %d of %d values", k, n)
		} else if err != nil {
			return nil, err
		}
		if len(f) != 1 {
			return nil, m.errorf("want one value per line, got %q", strings.Join(f, " "))
		}
		v, err := m.value(f[0])
		if err != nil {
			return nil, err
		}
		x = append(x, v)
	}
	if f, err := m.next(); err == nil {
		return nil, m.errorf("unexpected data %q after %d values", strings.Join(f, " "), n)
	} else if err != io.ErrUnexpectedEOF {
		return nil, err
	}
	return x, nil
}
