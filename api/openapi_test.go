package api

import (
	"bytes"
	"encoding/json"
	"net/http"
	"slices"
	"strings"
	"testing"

	"github.com/santhosh-tekuri/jsonschema/v6"
)

// openAPIRoutes returns "METHOD /path" for every operation of the document,
// with {param} written as gin's :param.
func openAPIRoutes(t *testing.T) []string {
	t.Helper()
	var doc struct {
		OpenAPI string                                `json:"openapi"`
		Paths   map[string]map[string]json.RawMessage `json:"paths"`
	}
	if err := json.Unmarshal(openAPIDoc, &doc); err != nil {
		t.Fatalf("openapi.json: %v", err)
	}
	if !strings.HasPrefix(doc.OpenAPI, "3.") {
		t.Fatalf("openapi version %q", doc.OpenAPI)
	}
	var out []string
	for path, ops := range doc.Paths {
		segs := strings.Split(path, "/")
		for i, s := range segs {
			if strings.HasPrefix(s, "{") && strings.HasSuffix(s, "}") {
				segs[i] = ":" + s[1:len(s)-1]
			}
		}
		gp := strings.Join(segs, "/")
		for m := range ops {
			switch m {
			case "get", "put", "post", "delete", "patch", "head", "options", "trace":
				out = append(out, strings.ToUpper(m)+" "+gp)
			}
		}
	}
	slices.Sort(out)
	return out
}

// TestOpenAPIMatchesRoutes: the document describes exactly the router's
// routes, and every operation has an id and its responses.
func TestOpenAPIMatchesRoutes(t *testing.T) {
	env := newTestEnv(t, nil)
	var routes []string
	for _, r := range env.srv.router.Routes() {
		routes = append(routes, r.Method+" "+r.Path)
	}
	slices.Sort(routes)
	doc := openAPIRoutes(t)
	if strings.Join(doc, "\n") != strings.Join(routes, "\n") {
		t.Errorf("OpenAPI operations and routes differ:\ndocument:\n  %s\nrouter:\n  %s",
			strings.Join(doc, "\n  "), strings.Join(routes, "\n  "))
	}

	var d struct {
		Paths map[string]map[string]struct {
			OperationID string                     `json:"operationId"`
			Responses   map[string]json.RawMessage `json:"responses"`
		} `json:"paths"`
	}
	json.Unmarshal(openAPIDoc, &d)
	ids := map[string]bool{}
	for p, ops := range d.Paths {
		for m, op := range ops {
			if m == "parameters" {
				continue
			}
			if op.OperationID == "" || ids[op.OperationID] {
				t.Errorf("%s %s: operationId %q missing or repeated", m, p, op.OperationID)
			}
			ids[op.OperationID] = true
			if len(op.Responses) == 0 {
				t.Errorf("%s %s: no responses", m, p)
			}
		}
	}

	rec := env.do("GET", "/v1/openapi.json", nil)
	if rec.Code != 200 || !bytes.Equal(rec.Body.Bytes(), openAPIDoc) || rec.Header().Get("Content-Type") != "application/json" {
		t.Errorf("GET /v1/openapi.json: %d %s", rec.Code, rec.Header().Get("Content-Type"))
	}
}

// TestOpenAPISchemas: real responses match the document's component schemas.
func TestOpenAPISchemas(t *testing.T) {
	var doc any
	if err := json.Unmarshal(openAPIDoc, &doc); err != nil {
		t.Fatal(err)
	}
	c := jsonschema.NewCompiler()
	c.DefaultDraft(jsonschema.Draft2020)
	const base = "urn:swaygate:openapi"
	if err := c.AddResource(base, doc); err != nil {
		t.Fatal(err)
	}
	schema := func(name string) *jsonschema.Schema {
		s, err := c.Compile(base + "#/components/schemas/" + name)
		if err != nil {
			t.Fatalf("schema %s: %v", name, err)
		}
		return s
	}

	env := newTestEnv(t, func(o *Options) { o.MaxUploadBytes = 1024 })
	post := env.post("project=api", fakeModel)
	env.post("project=api", fakeModel+"FAKE-SET:"+gidC1+"=fail;")
	id := testRunID(1)
	cases := []struct {
		schema string
		rec    *http.Request
		status int
	}{
		{"Report", httpReq("GET", "/v1/checks/"+id), 200},
		{"ElementResponse", httpReq("GET", "/v1/checks/"+id+"/elements/"+gidC1), 200},
		{"RunList", httpReq("GET", "/v1/projects/api/runs?limit=1"), 200},
		{"RunList", httpReq("GET", "/v1/projects/empty/runs"), 200},
		{"History", httpReq("GET", "/v1/projects/api/members/"+gidC3+"/history"), 200},
		{"Status", httpReq("GET", "/healthz"), 200},
		{"Status", httpReq("GET", "/readyz"), 200},
		{"Error", httpReq("GET", "/v1/checks/nope"), 404},
		{"Error", httpReq("GET", "/v1/projects/api/runs?limit=0"), 400},
	}
	check := func(name string, body []byte) {
		t.Helper()
		v, err := jsonschema.UnmarshalJSON(bytes.NewReader(body))
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if err := schema(name).Validate(v); err != nil {
			t.Errorf("%s does not match:\n%v\n%s", name, err, body)
		}
	}
	check("Report", post.Body.Bytes())
	for _, tt := range cases {
		rec := env.serve(tt.rec)
		if rec.Code != tt.status {
			t.Errorf("%s %s: %d", tt.rec.Method, tt.rec.URL, rec.Code)
			continue
		}
		check(tt.schema, rec.Body.Bytes())
	}
	for _, body := range []string{"", "not step", strings.Repeat("x", 2000)} {
		check("Error", env.post("", body).Body.Bytes())
	}
	check("Error", env.post("", fakeModel+"FAKE-TRUNCATED").Body.Bytes())
}

func httpReq(method, target string) *http.Request {
	r, _ := http.NewRequest(method, target, nil)
	return r
}
