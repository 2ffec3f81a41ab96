package main

import (
	"encoding/csv"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// slug turns a case name into a file-name part.
func slug(s string) string {
	var b strings.Builder
	for _, r := range strings.ToLower(s) {
		switch {
		case r >= 'a' && r <= 'z', r >= '0' && r <= '9':
			b.WriteRune(r)
		default:
			if b.Len() > 0 && !strings.HasSuffix(b.String(), "-") {
				b.WriteByte('-')
			}
		}
	}
	return strings.Trim(b.String(), "-")
}

func runExport(e env) error {
	fl := newFlags("export", "trestle export [flags] FILE",
		`Assembles the stand in FILE and writes its linear system in Matrix Market
form into the folder --dir: K.mtx (stiffness, symmetric, lower triangle),
M.mtx (lumped mass), one load vector per case (F-1-<case>.mtx, ...) and
equations.csv, which names the node or group and direction of every row.
SI units: N/m, N, N·m/rad, kg, kg·m². Compression-only feet count as in
contact. For checking trestle against other solvers or for research.`,
		"trestle export --dir out stand.toml\ntrestle export --dir demo-system --level low demo", e)
	dir := fl.String("dir", "", "folder to write into (created if missing); required")
	level := fl.levelFlag()
	pos, err := fl.parseWant(e.args, 1, 1)
	if err != nil {
		return handled(err)
	}
	if *dir == "" {
		return fmt.Errorf("export: say which folder to write into with --dir")
	}
	l, err := parseLevel(*level)
	if err != nil {
		return err
	}
	m, name, _, err := loadModel(pos[0], e.stdin)
	if err != nil {
		return err
	}
	sys, err := springnet.Assemble(m, l)
	if err != nil {
		return explain(name, err)
	}
	if err := os.MkdirAll(*dir, 0o755); err != nil {
		return err
	}
	head := []string{fmt.Sprintf("trestle export of %s, material level %s", name, l)}
	write := func(file string, fill func(io.Writer) error) error {
		return writeAtomic(filepath.Join(*dir, file), pos, fill)
	}
	files := []string{"K.mtx", "M.mtx"}
	if err := write("K.mtx", func(w io.Writer) error {
		return sparse.WriteMatrix(w, sys.K(), append(head, "stiffness K [N/m, N, N*m/rad]")...)
	}); err != nil {
		return err
	}
	if err := write("M.mtx", func(w io.Writer) error {
		return sparse.WriteMatrix(w, sys.M(), append(head, "lumped mass M [kg, kg*m, kg*m^2]")...)
	}); err != nil {
		return err
	}
	for c := 0; c < m.NumCases(); c++ {
		id := springnet.CaseID(c)
		file := fmt.Sprintf("F-%d-%s.mtx", c+1, slug(m.CaseName(id)))
		f := sys.LoadTo(nil, id)
		if err := write(file, func(w io.Writer) error {
			return sparse.WriteVector(w, f, append(head, fmt.Sprintf("load vector of case %q [N, N*m]", m.CaseName(id)))...)
		}); err != nil {
			return err
		}
		files = append(files, file)
	}
	if err := write("equations.csv", func(w io.Writer) error {
		cw := csv.NewWriter(w)
		cw.Write([]string{"equation", "kind", "name", "direction", "x_m", "y_m", "z_m"})
		for i := 0; i < sys.N(); i++ {
			owner, d := sys.Equation(i)
			p := sys.Point(i)
			kind, who, ok := strings.Cut(owner, " ")
			if !ok {
				kind, who = "", owner
			}
			if u, err := strconv.Unquote(who); err == nil {
				who = u
			}
			cw.Write([]string{strconv.Itoa(i + 1), kind, who, d.String(),
				strconv.FormatFloat(p.X, 'g', -1, 64), strconv.FormatFloat(p.Y, 'g', -1, 64), strconv.FormatFloat(p.Z, 'g', -1, 64)})
		}
		cw.Flush()
		return cw.Error()
	}); err != nil {
		return err
	}
	files = append(files, "equations.csv")
	fmt.Fprintf(e.stdout, "wrote %d equations of %s to %s: %s\n", sys.N(), name, *dir, strings.Join(files, ", "))
	return nil
}
