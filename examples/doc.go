// Package examples holds example model files (*.toml) and, in its
// subfolders, short programs that use trestle's packages. Each program
// keeps its work in a run function that its test calls; the tests in this
// folder read every model file and check it.
package examples
