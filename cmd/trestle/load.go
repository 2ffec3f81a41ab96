package main

import (
	"bytes"
	"fmt"
	"io"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

// demoArg is the file argument that names the built-in demo model.
const demoArg = "demo"

// loadDemo reads the demo model embedded in the modelfile package.
func loadDemo() (*modelfile.File, error) {
	f, err := modelfile.Read("demo", bytes.NewReader(modelfile.Demo()))
	if err != nil {
		return nil, fmt.Errorf("the built-in demo model does not read: %w", err)
	}
	return f, nil
}

// loadFile reads the model file name ("-": standard input; "demo": the
// built-in demo) and builds its model.
func loadFile(name string, stdin io.Reader) (*modelfile.File, error) {
	if name == demoArg {
		return loadDemo()
	}
	data, err := readInput(name, stdin)
	if err != nil {
		return nil, err
	}
	f, err := modelfile.Read(displayName(name), bytes.NewReader(data))
	if err != nil {
		return nil, err
	}
	return f, nil
}

// modelName is how reports name the model of f.
func modelName(f *modelfile.File) string {
	switch {
	case f.Title != "" && f.Name != "":
		return fmt.Sprintf("%s (%s)", f.Title, f.Name)
	case f.Title != "":
		return f.Title
	}
	return f.Name
}

// loadModel reads a model file and returns its model, report name and
// dynamics inputs.
func loadModel(name string, stdin io.Reader) (*springnet.Model, string, dynamics, error) {
	f, err := loadFile(name, stdin)
	if err != nil {
		return nil, "", dynamics{}, err
	}
	return f.Model, modelName(f), dynamicsOf(f), nil
}

// parseLevel reads a --level value.
func parseLevel(s string) (materials.Level, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "nominal", "nom", "":
		return materials.Nominal, nil
	case "low", "lo":
		return materials.Low, nil
	case "high", "hi":
		return materials.High, nil
	}
	return 0, fmt.Errorf("--level %q: want low, nominal or high", s)
}
