package reports

import (
	"bytes"
	"encoding/xml"
	"strings"
	"testing"
)

func TestWriteJUnit(t *testing.T) {
	for _, tc := range []struct {
		policy, golden                   string
		tests, failures, skipped, suites int
	}{
		// 5 members + 1 not-steel column; C5 fails, C4 needs analysis.
		{GateFail, "report-gate-fail.golden.xml", 6, 1, 2, 3},
		{GateNeedsAnalysis, "report-gate-needs-analysis.golden.xml", 6, 2, 1, 3},
	} {
		t.Run(tc.policy, func(t *testing.T) {
			run := fxRun
			run.Gate = Gate{Policy: tc.policy}
			var buf bytes.Buffer
			if err := WriteJUnit(&buf, fxReport(true), run); err != nil {
				t.Fatal(err)
			}
			got := buf.Bytes()
			golden(t, tc.golden, got)

			// Round trip: read it back into the same types and write it again.
			var doc junitSuites
			if err := xml.Unmarshal(got, &doc); err != nil {
				t.Fatal(err)
			}
			if doc.Tests != tc.tests || doc.Failures != tc.failures || doc.Errors != 0 || len(doc.Suites) != tc.suites {
				t.Errorf("testsuites tests=%d failures=%d errors=%d suites=%d; want %d %d 0 %d",
					doc.Tests, doc.Failures, doc.Errors, len(doc.Suites), tc.tests, tc.failures, tc.suites)
			}
			var tests, failures, skipped int
			for _, s := range doc.Suites {
				var f, sk int
				for _, c := range s.Cases {
					if c.Classname != s.Name {
						t.Errorf("case %q classname %q in suite %q", c.Name, c.Classname, s.Name)
					}
					if c.Failure != nil {
						f++
					}
					if c.Skipped != nil {
						sk++
					}
					if c.Failure != nil && c.Skipped != nil {
						t.Errorf("case %q both failed and skipped", c.Name)
					}
				}
				if s.Tests != len(s.Cases) || s.Failures != f || s.Skipped != sk {
					t.Errorf("suite %q counts %d/%d/%d, cases say %d/%d/%d", s.Name, s.Tests, s.Failures, s.Skipped, len(s.Cases), f, sk)
				}
				if !strings.Contains(s.SystemOut, "licensed structural engineer") {
					t.Errorf("suite %q system-out lacks the caution", s.Name)
				}
				tests, failures, skipped = tests+s.Tests, failures+f, skipped+sk
			}
			if tests != doc.Tests || failures != doc.Failures || skipped != tc.skipped {
				t.Errorf("suite totals %d/%d/%d, want %d/%d/%d", tests, failures, skipped, doc.Tests, doc.Failures, tc.skipped)
			}
			again, err := xml.MarshalIndent(doc, "", "  ")
			if err != nil {
				t.Fatal(err)
			}
			again = append([]byte(xml.Header), again...)
			again = append(again, '\n')
			if !bytes.Equal(again, got) {
				t.Errorf("round trip differs:\n%s", firstDiff(again, got))
			}

			// The failing member.
			c5 := findCase(doc, "C5 (1hL2Wb0aL9$Qm8sZkT4p05)")
			if c5 == nil || c5.Failure == nil || c5.Failure.Type != "fail" || c5.Classname != "Level 2" ||
				!strings.HasPrefix(c5.Failure.Message, "fail: unstable") {
				t.Errorf("C5 = %+v", c5)
			}
			c4 := findCase(doc, "C4 (1hL2Wb0aL9$Qm8sZkT4p04)")
			switch {
			case c4 == nil:
				t.Fatal("no case for C4")
			case tc.policy == GateFail && (c4.Skipped == nil || !strings.Contains(c4.Skipped.Text, "missing-restraint")):
				t.Errorf("C4 under gate fail = %+v, want skipped with its reasons", c4)
			case tc.policy == GateNeedsAnalysis && (c4.Failure == nil || c4.Failure.Type != "needs-analysis"):
				t.Errorf("C4 under gate needs-analysis = %+v, want a failure", c4)
			}
		})
	}
}

func findCase(doc junitSuites, name string) *junitCase {
	for i := range doc.Suites {
		for k := range doc.Suites[i].Cases {
			if doc.Suites[i].Cases[k].Name == name {
				return &doc.Suites[i].Cases[k]
			}
		}
	}
	return nil
}

// TestWriteJUnitEscapes checks that markup and control characters in model
// data stay data.
func TestWriteJUnitEscapes(t *testing.T) {
	r := fxReport(false)
	m := *r.Elements[4].Member
	m.Name = `<script>alert("x")</script> & ]]>` + "\x01"
	m.Storey = `Level "2" <roof>`
	r.Elements[4].Member = &m
	var buf bytes.Buffer
	if err := WriteJUnit(&buf, r, fxRun); err != nil {
		t.Fatal(err)
	}
	if bytes.Contains(buf.Bytes(), []byte("<script>")) || bytes.Contains(buf.Bytes(), []byte("<roof>")) {
		t.Error("markup from model data written unescaped")
	}
	var doc junitSuites
	if err := xml.Unmarshal(buf.Bytes(), &doc); err != nil {
		t.Fatal(err)
	}
	if c := findCase(doc, `<script>alert("x")</script> & ]]>`+"\uFFFD"+` (1hL2Wb0aL9$Qm8sZkT4p05)`); c == nil || c.Classname != `Level "2" <roof>` {
		t.Errorf("escaped name not read back: %+v", doc.Suites)
	}
}
