// Package materials holds the engineering properties of the materials a
// machine stand is built from, each known as a range (low, nominal, high)
// and each with its source.
package materials
