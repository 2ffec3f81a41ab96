package main

import (
	"fmt"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// loadDemo returns the built-in demo model.
func loadDemo() (*springnet.Model, string, error) {
	m, err := demoModel()
	if err != nil {
		return nil, "", fmt.Errorf("building the demo model: %w", err)
	}
	return m, demoName, nil
}

// loadModel reads the model file name ("-": standard input). The special
// name "demo" is the built-in demo stand.
func loadModel(name string, stdin interface{ Read([]byte) (int, error) }) (*springnet.Model, string, error) {
	if name == "demo" {
		return loadDemo()
	}
	if _, err := readInput(name, stdin); err != nil {
		return nil, "", err
	}
	return nil, "", fmt.Errorf("%s: reading model files needs the model-file package (springnet/modelfile), which is not in this build yet; try the built-in model: trestle analyse demo", displayName(name))
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
