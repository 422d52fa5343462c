package main

import (
	"encoding/json"
	"errors"
	"io"

	"github.com/spf13/cobra"

	"swaygate/ifcstep"
)

func newScanCmd() *cobra.Command {
	return &cobra.Command{
		Use:   "scan MODEL",
		Short: "Index an IFC model and print its schema, header and entity counts as JSON",
		Long: "scan reads an IFC model (plain, gzip or .ifczip), checks its STEP syntax and prints\n" +
			"the schema, the header, the number of instances of each entity type and the warnings\n" +
			"as JSON. A file that cannot be read exits with status 2 and a positioned message.",
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			f, err := ifcstep.ReadFile(args[0], ifcstep.Options{})
			if err != nil {
				var pe *ifcstep.Error
				if errors.As(err, &pe) {
					return &exitError{code: exitUsage, msg: pe.Error()}
				}
				return &exitError{code: exitUsage, msg: "swaygate: " + err.Error()}
			}
			return writeScan(cmd.OutOrStdout(), f)
		},
	}
}

// scanResult is the JSON document printed by scan; field order is the output order.
type scanResult struct {
	Schema           string         `json:"schema"`
	SchemaIdentifier string         `json:"schema_identifier"`
	Instances        int            `json:"instances"`
	Types            map[string]int `json:"types"` // encoded with sorted keys
	Header           scanHeader     `json:"header"`
	Warnings         []scanWarning  `json:"warnings"`
}

type scanHeader struct {
	Description         []string `json:"description"`
	Name                string   `json:"name"`
	TimeStamp           string   `json:"time_stamp"`
	Author              []string `json:"author"`
	Organization        []string `json:"organization"`
	PreprocessorVersion string   `json:"preprocessor_version"`
	OriginatingSystem   string   `json:"originating_system"`
	Authorization       string   `json:"authorization"`
	ImplementationLevel string   `json:"implementation_level"`
	Schemas             []string `json:"schemas"`
}

type scanWarning struct {
	Code    string `json:"code"`
	Line    int    `json:"line"`
	Column  int    `json:"column"`
	Byte    int    `json:"byte"`
	ID      uint32 `json:"id,omitempty"`
	Message string `json:"message"`
}

func writeScan(w io.Writer, f *ifcstep.File) error {
	h := f.Header
	res := scanResult{
		Schema:           f.Family.String(),
		SchemaIdentifier: f.SchemaID,
		Instances:        f.Len(),
		Types:            f.TypeCounts(),
		Header: scanHeader{
			Description:         nonNil(h.Description),
			Name:                h.Name,
			TimeStamp:           h.TimeStamp,
			Author:              nonNil(h.Author),
			Organization:        nonNil(h.Organization),
			PreprocessorVersion: h.PreprocessorVersion,
			OriginatingSystem:   h.OriginatingSystem,
			Authorization:       h.Authorization,
			ImplementationLevel: h.ImplementationLevel,
			Schemas:             nonNil(h.Schemas),
		},
		Warnings: []scanWarning{},
	}
	for _, wn := range f.Warnings() {
		res.Warnings = append(res.Warnings, scanWarning{
			Code: wn.Code, Line: wn.Pos.Line, Column: wn.Pos.Column, Byte: wn.Pos.Offset, ID: wn.ID, Message: wn.Msg,
		})
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(res)
}

func nonNil(s []string) []string {
	if s == nil {
		return []string{}
	}
	return s
}
