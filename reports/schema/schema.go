// Package schema holds the JSON Schemas (draft 2020-12) of the reports'
// JSON: the check report (report.schema.json, design §6) and the member
// listing (members.schema.json), and validates documents against them.
//
// It is a package of its own so that programs that write reports, and do not
// validate them, do not carry the validator (its package initialisation
// alone costs some 3 ms at every start of the command line).
package schema

import (
	"bytes"
	"embed"
	"fmt"
	"sync"

	"github.com/santhosh-tekuri/jsonschema/v6"
)

//go:embed report.schema.json members.schema.json
var files embed.FS

// Schema identifiers ($id) of the embedded schemas.
const (
	ReportID  = "urn:swaygate:schema:report:1"
	MembersID = "urn:swaygate:schema:members:1"
)

// Report returns the JSON Schema of the check report, as embedded.
func Report() []byte {
	b, _ := files.ReadFile("report.schema.json")
	return b
}

// compiled compiles both schemas once; the result is read-only.
var compiled = sync.OnceValues(func() (map[string]*jsonschema.Schema, error) {
	c := jsonschema.NewCompiler()
	c.AssertFormat()
	for id, file := range map[string]string{
		ReportID:  "report.schema.json",
		MembersID: "members.schema.json",
	} {
		raw, err := files.ReadFile(file)
		if err != nil {
			return nil, err
		}
		doc, err := jsonschema.UnmarshalJSON(bytes.NewReader(raw))
		if err != nil {
			return nil, fmt.Errorf("schema: %s: %w", file, err)
		}
		if err := c.AddResource(id, doc); err != nil {
			return nil, fmt.Errorf("schema: %s: %w", file, err)
		}
	}
	out := map[string]*jsonschema.Schema{}
	for _, id := range []string{ReportID, MembersID} {
		s, err := c.Compile(id)
		if err != nil {
			return nil, fmt.Errorf("schema: compile %s: %w", id, err)
		}
		out[id] = s
	}
	return out, nil
})

// ValidateReport checks a JSON check report against the report schema. The
// error names every place that does not match.
func ValidateReport(report []byte) error {
	return validate(ReportID, "report", report)
}

// ValidateMembers checks a member listing against its schema.
func ValidateMembers(listing []byte) error {
	return validate(MembersID, "member listing", listing)
}

func validate(id, what string, data []byte) error {
	schemas, err := compiled()
	if err != nil {
		return err
	}
	doc, err := jsonschema.UnmarshalJSON(bytes.NewReader(data))
	if err != nil {
		return fmt.Errorf("schema: %s is not JSON: %w", what, err)
	}
	if err := schemas[id].Validate(doc); err != nil {
		return fmt.Errorf("schema: %s does not match its schema: %w", what, err)
	}
	return nil
}
