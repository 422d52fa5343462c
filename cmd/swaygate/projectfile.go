package main

import (
	"bufio"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"github.com/spf13/cobra"
)

// ProjectFileName is the project defaults file looked for beside the model.
const ProjectFileName = "swaygate.conf"

// projectKeys are the check flags a project file may set.
var projectKeys = map[string]bool{
	"standard": true, "gate": true, "sway-method": true, "scope": true, "format": true,
	"trace": true, "nzs-provisions": true, "aisc-method": true, "units": true,
	"sign-convention": true, "ke-from": true, "default-restraint": true,
	"default-major": true, "default-minor": true, "modulus": true, "yield": true,
	"member-pdelta-modelled": true, "load-cases": true, "include": true, "project": true,
	"actions": true, "storeys": true,
}

// applyProjectFile reads the project defaults file (the one named by
// --project-file, else swaygate.conf beside the model when present) and sets
// every flag it names that the command line did not set.
//
// The format is one "key = value" per line, keys being check flag names
// without the dashes; '#' starts a comment. A relative "actions" or
// "storeys" path is taken relative to the file.
func applyProjectFile(cmd *cobra.Command, model string, fl *checkFlags) error {
	if fl.noProjectFile {
		return nil
	}
	path := fl.projectFile
	explicit := path != ""
	if !explicit {
		path = filepath.Join(filepath.Dir(model), ProjectFileName)
	}
	f, err := os.Open(path)
	if err != nil {
		if !explicit && errors.Is(err, os.ErrNotExist) {
			return nil
		}
		return usage("project file: %v", err)
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	line := 0
	for sc.Scan() {
		line++
		text := sc.Text()
		if i := strings.IndexByte(text, '#'); i >= 0 {
			text = text[:i]
		}
		text = strings.TrimSpace(text)
		if text == "" {
			continue
		}
		key, value, ok := strings.Cut(text, "=")
		key, value = strings.TrimSpace(key), strings.TrimSpace(value)
		if !ok || key == "" {
			return &exitError{code: exitUsage, msg: fmt.Sprintf("%s:%d: want key = value", path, line)}
		}
		if !projectKeys[key] {
			return &exitError{code: exitUsage, msg: fmt.Sprintf("%s:%d: unknown key %q", path, line, key)}
		}
		flag := cmd.Flags().Lookup(key)
		if flag == nil || flag.Changed {
			continue
		}
		if (key == "actions" || key == "storeys") && value != "" && !filepath.IsAbs(value) {
			value = filepath.Join(filepath.Dir(path), value)
		}
		if err := cmd.Flags().Set(key, value); err != nil {
			return &exitError{code: exitUsage, msg: fmt.Sprintf("%s:%d: %s: %v", path, line, key, err)}
		}
		flag.Changed = false // still "not given on the command line"
	}
	if err := sc.Err(); err != nil {
		return usage("project file: %v", err)
	}
	return nil
}
