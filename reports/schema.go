package reports

import (
	"bytes"
	"embed"
	"fmt"
	"sync"

	"github.com/santhosh-tekuri/jsonschema/v6"
)

//go:embed schema/report.schema.json schema/members.schema.json
var schemaFS embed.FS

// Schema identifiers ($id) of the embedded schemas.
const (
	ReportSchemaID  = "urn:swaygate:schema:report:1"
	MembersSchemaID = "urn:swaygate:schema:members:1"
)

// ReportSchema returns the JSON Schema (draft 2020-12) of the report, as
// embedded in the package.
func ReportSchema() []byte {
	b, _ := schemaFS.ReadFile("schema/report.schema.json")
	return b
}

// compiledSchemas compiles both schemas once; the result is read-only.
var compiledSchemas = sync.OnceValues(func() (map[string]*jsonschema.Schema, error) {
	c := jsonschema.NewCompiler()
	c.AssertFormat()
	for id, file := range map[string]string{
		ReportSchemaID:  "schema/report.schema.json",
		MembersSchemaID: "schema/members.schema.json",
	} {
		raw, err := schemaFS.ReadFile(file)
		if err != nil {
			return nil, err
		}
		doc, err := jsonschema.UnmarshalJSON(bytes.NewReader(raw))
		if err != nil {
			return nil, fmt.Errorf("reports: %s: %w", file, err)
		}
		if err := c.AddResource(id, doc); err != nil {
			return nil, fmt.Errorf("reports: %s: %w", file, err)
		}
	}
	out := map[string]*jsonschema.Schema{}
	for _, id := range []string{ReportSchemaID, MembersSchemaID} {
		s, err := c.Compile(id)
		if err != nil {
			return nil, fmt.Errorf("reports: compile %s: %w", id, err)
		}
		out[id] = s
	}
	return out, nil
})

// ValidateJSON checks a JSON report against the report schema. The error
// names every place that does not match.
func ValidateJSON(report []byte) error {
	return validate(ReportSchemaID, "report", report)
}

// ValidateMembersJSON checks a member listing (WriteMembersJSON) against its
// schema.
func ValidateMembersJSON(listing []byte) error {
	return validate(MembersSchemaID, "member listing", listing)
}

func validate(id, what string, data []byte) error {
	schemas, err := compiledSchemas()
	if err != nil {
		return err
	}
	doc, err := jsonschema.UnmarshalJSON(bytes.NewReader(data))
	if err != nil {
		return fmt.Errorf("reports: %s is not JSON: %w", what, err)
	}
	if err := schemas[id].Validate(doc); err != nil {
		return fmt.Errorf("reports: %s does not match its schema: %w", what, err)
	}
	return nil
}
