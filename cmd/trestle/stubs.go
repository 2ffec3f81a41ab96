package main

import "errors"

func runModes(e env) error    { return errors.New("modes: not yet") }
func runResponse(e env) error { return errors.New("response: not yet") }
func runGenerate(e env) error { return errors.New("not yet") }
func runExport(e env) error   { return errors.New("not yet") }
