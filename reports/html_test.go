package reports

import (
	"bytes"
	"encoding/xml"
	"strings"
	"testing"

	"swaygate/checks"
)

func TestWriteHTML(t *testing.T) {
	for _, units := range []string{UnitsSI, UnitsUS} {
		t.Run(units, func(t *testing.T) {
			run := fxRun
			run.Units = units
			var buf bytes.Buffer
			if err := WriteHTML(&buf, fxReport(true), run); err != nil {
				t.Fatal(err)
			}
			got := buf.String()
			golden(t, "report-"+units+".golden.html", buf.Bytes())
			for _, s := range []string{"<!DOCTYPE html>", "Caution", "Level 1", "Level 2", "Hand calculations",
				"N_om,major", "AS 4100 4.6.2", "@media print"} {
				if !strings.Contains(got, s) {
					t.Errorf("page lacks %q", s)
				}
			}
			selfContained(t, got)
		})
	}
}

// selfContained fails when the page loads anything or runs a script.
func selfContained(t *testing.T, page string) {
	t.Helper()
	lower := strings.ToLower(page)
	for _, s := range []string{"<script", "<link", "<img", "<iframe", "src=", "@import", "url(", "http://", "https://"} {
		if strings.Contains(lower, s) {
			t.Errorf("page contains %q: not self-contained", s)
		}
	}
}

// TestWriteHTMLEscapes puts markup into every kind of model string.
func TestWriteHTMLEscapes(t *testing.T) {
	const evil = `<script>alert("x")</script>`
	r := fxReport(true)
	m := *r.Elements[0].Member
	m.Name, m.Tag, m.Storey = evil, evil, evil
	r.Elements[0].Member = &m
	r.Elements[0].Reasons = append(r.Elements[0].Reasons, checks.Reason{Code: "storey-geometry", Message: evil})
	r.Elements[0].Trace[0].Quantity = evil
	r.Elements[0].Trace[0].Inputs[0].Unit = evil
	r.Assumptions = append(r.Assumptions, evil)
	r.Warnings = append(r.Warnings, checks.Reason{Code: "x", Message: evil, Ref: evil})
	r.Skipped[0].Name = evil
	r.Storeys[0].Name = evil
	run := fxRun
	run.Model.File = evil
	run.Project = evil
	var buf bytes.Buffer
	if err := WriteHTML(&buf, r, run); err != nil {
		t.Fatal(err)
	}
	got := buf.String()
	if strings.Contains(got, "<script") {
		t.Fatal("model data written as markup")
	}
	if n := strings.Count(got, "&lt;script&gt;alert(&#34;x&#34;)&lt;/script&gt;"); n < 10 {
		t.Errorf("escaped text appears %d times, want at least 10", n)
	}
	selfContained(t, got)
}

// TestWriteHTMLWellFormed parses the page as XML to catch unbalanced tags:
// it is written to be well-formed apart from the doctype and the void <meta>
// elements, which the test closes first.
func TestWriteHTMLWellFormed(t *testing.T) {
	var buf bytes.Buffer
	if err := WriteHTML(&buf, fxReport(true), fxRun); err != nil {
		t.Fatal(err)
	}
	page := strings.Replace(buf.String(), "<!DOCTYPE html>", "", 1)
	var b strings.Builder
	for {
		i := strings.Index(page, "<meta ")
		if i < 0 {
			break
		}
		j := i + strings.IndexByte(page[i:], '>')
		b.WriteString(page[:j])
		b.WriteString("/>")
		page = page[j+1:]
	}
	b.WriteString(page)
	page = b.String()
	d := xml.NewDecoder(strings.NewReader(page))
	d.Entity = xml.HTMLEntity
	depth := 0
	for {
		tok, err := d.Token()
		if err != nil {
			if err.Error() == "EOF" {
				break
			}
			t.Fatalf("not well-formed: %v", err)
		}
		switch tok.(type) {
		case xml.StartElement:
			depth++
		case xml.EndElement:
			depth--
		}
	}
	if depth != 0 {
		t.Errorf("unbalanced elements: depth %d at the end", depth)
	}
}
