package main

import (
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"io"
	"os"

	"swaygate/checks"
	"swaygate/ifcstep"
	"swaygate/ifcstep/ifc"
	"swaygate/ifcstep/sidecar"
	"swaygate/reports"
)

// loadedModel is a read model and what was extracted from it.
type loadedModel struct {
	File  *ifcstep.File
	Model *checks.Model
	Info  reports.ModelInfo // file, sha256 of the file as stored, schema, instances
}

// loadModel reads the model at path (and the side-car actions file, when
// actionsPath is not empty) and extracts its members. The file's SHA-256 is
// computed on another goroutine while the model is parsed. A file that
// cannot be read, or a side-car with an error, is an *exitError with status
// exitUsage and a positioned message.
func loadModel(path, actionsPath string, opt ifc.Options) (*loadedModel, error) {
	type hashed struct {
		sum string
		err error
	}
	hc := make(chan hashed, 1)
	go func() {
		sum, err := fileSHA256(path)
		hc <- hashed{sum, err}
	}()

	if actionsPath != "" {
		sc, err := sidecar.ReadFile(actionsPath)
		if err != nil {
			<-hc
			return nil, inputError(err)
		}
		opt.Actions = sc
	}
	f, err := ifcstep.ReadFile(path, ifcstep.Options{})
	h := <-hc
	if err != nil {
		return nil, inputError(err)
	}
	if h.err != nil {
		return nil, inputError(h.err)
	}
	m, err := ifc.Extract(f, opt)
	if err != nil {
		return nil, &exitError{code: exitUsage, msg: "swaygate: " + err.Error()}
	}
	return &loadedModel{
		File:  f,
		Model: m,
		Info:  reports.ModelInfo{File: path, SHA256: h.sum, Schema: f.Family.String(), Instances: f.Len()},
	}, nil
}

// inputError turns a read error into exit status 2 with its message: the
// positioned text of the reader's errors, or the operating system's.
func inputError(err error) error {
	var pe *ifcstep.Error
	var se *sidecar.Error
	switch {
	case errors.As(err, &pe):
		return &exitError{code: exitUsage, msg: pe.Error()}
	case errors.As(err, &se):
		return &exitError{code: exitUsage, msg: se.Error()}
	}
	return &exitError{code: exitUsage, msg: "swaygate: " + err.Error()}
}

func fileSHA256(path string) (string, error) {
	fh, err := os.Open(path)
	if err != nil {
		return "", err
	}
	defer fh.Close()
	h := sha256.New()
	if _, err := io.Copy(h, fh); err != nil {
		return "", err
	}
	return hex.EncodeToString(h.Sum(nil)), nil
}
