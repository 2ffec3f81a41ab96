package main

import "errors"

func runModes(e env) error     { return errors.New("modes: not yet") }
func runResponse(e env) error  { return errors.New("response: not yet") }
func runRanges(e env) error    { return errors.New("not yet") }
func runCompare(e env) error   { return errors.New("not yet") }
func runRingdown(e env) error  { return errors.New("not yet") }
func runGenerate(e env) error  { return errors.New("not yet") }
func runExport(e env) error    { return errors.New("not yet") }
