package reports

import (
	"encoding/xml"
	"io"
	"strconv"
	"strings"

	"swaygate/checks"
)

// The JUnit XML shape that CI systems read, kept within the common JUnit XSD
// (the junit-4.xsd family): testsuites (name, tests, failures, errors, time) /
// testsuite (name, tests, failures, errors, skipped, time, timestamp) /
// properties / testcase (name, classname, time) / failure or skipped /
// system-out. That XSD has no skipped count on testsuites: it is on each
// testsuite.
type junitSuites struct {
	XMLName  xml.Name     `xml:"testsuites"`
	Name     string       `xml:"name,attr"`
	Tests    int          `xml:"tests,attr"`
	Failures int          `xml:"failures,attr"`
	Errors   int          `xml:"errors,attr"`
	Time     string       `xml:"time,attr"`
	Suites   []junitSuite `xml:"testsuite"`
}

type junitSuite struct {
	XMLName    xml.Name        `xml:"testsuite"`
	Name       string          `xml:"name,attr"`
	Tests      int             `xml:"tests,attr"`
	Failures   int             `xml:"failures,attr"`
	Errors     int             `xml:"errors,attr"`
	Skipped    int             `xml:"skipped,attr"`
	Time       string          `xml:"time,attr"`
	Timestamp  string          `xml:"timestamp,attr,omitempty"`
	Properties []junitProperty `xml:"properties>property"`
	Cases      []junitCase     `xml:"testcase"`
	SystemOut  string          `xml:"system-out,omitempty"`
}

type junitProperty struct {
	Name  string `xml:"name,attr"`
	Value string `xml:"value,attr"`
}

type junitCase struct {
	Name      string        `xml:"name,attr"`
	Classname string        `xml:"classname,attr"`
	Time      string        `xml:"time,attr"`
	Failure   *junitOutcome `xml:"failure,omitempty"`
	Skipped   *junitOutcome `xml:"skipped,omitempty"`
}

type junitOutcome struct {
	Message string `xml:"message,attr,omitempty"`
	Type    string `xml:"type,attr,omitempty"`
	Text    string `xml:",chardata"`
}

// Names used where the data has none.
const (
	junitNoStorey    = "(no storey)"
	junitNotChecked  = "(not checked)"
	junitSuitesName  = "swaygate"
	junitTimestampFm = "2006-01-02T15:04:05"
)

// WriteJUnit writes the result as JUnit XML: one testsuite per storey (in the
// order storeys first appear among the elements; members without a storey in
// "(no storey)"), one testcase per member with classname = storey and name =
// "member name (GlobalId)". A failing member has a <failure>; a member that
// needs analysis has a <failure> when the gate policy is needs-analysis, else
// a <skipped>, each with the member's reasons. Elements skipped by the
// extraction (not steel) follow as skipped testcases in a suite "(not
// checked)". Every suite carries the run's facts as properties and the
// caution as its system-out. Suites are encoded one at a time.
func WriteJUnit(w io.Writer, r *checks.Report, run Run) error {
	failNA := run.Gate.policy() == GateNeedsAnalysis
	caution := Caution(r.Standard, r.Scope)
	props := junitProps(r, &run)
	stamp := run.CreatedAt.UTC().Format(junitTimestampFm)

	// Group elements by storey, keeping first-appearance order.
	var names []string
	groups := map[string][]int{}
	for i := range r.Elements {
		s := r.Elements[i].Member.Storey
		if s == "" {
			s = junitNoStorey
		}
		if _, ok := groups[s]; !ok {
			names = append(names, s)
		}
		groups[s] = append(groups[s], i)
	}

	top := junitSuites{Name: junitSuitesName, Time: "0"}
	for i := range r.Elements {
		top.Tests++
		switch outcome(r.Elements[i].Verdict, failNA) {
		case outcomeFailure:
			top.Failures++
		}
	}
	top.Tests += len(r.Skipped)

	if _, err := io.WriteString(w, xml.Header); err != nil {
		return err
	}
	enc := xml.NewEncoder(w)
	enc.Indent("", "  ")
	start := xml.StartElement{Name: xml.Name{Local: "testsuites"}, Attr: []xml.Attr{
		{Name: xml.Name{Local: "name"}, Value: top.Name},
		{Name: xml.Name{Local: "tests"}, Value: strconv.Itoa(top.Tests)},
		{Name: xml.Name{Local: "failures"}, Value: strconv.Itoa(top.Failures)},
		{Name: xml.Name{Local: "errors"}, Value: "0"},
		{Name: xml.Name{Local: "time"}, Value: top.Time},
	}}
	if err := enc.EncodeToken(start); err != nil {
		return err
	}
	for _, name := range names {
		s := junitSuite{Name: name, Time: "0", Timestamp: stamp, Properties: props, SystemOut: caution}
		for _, i := range groups[name] {
			s.Cases = append(s.Cases, junitElementCase(&r.Elements[i], name, failNA))
		}
		s.count()
		if err := enc.Encode(s); err != nil {
			return err
		}
	}
	if len(r.Skipped) > 0 {
		s := junitSuite{Name: junitNotChecked, Time: "0", Timestamp: stamp, Properties: props, SystemOut: caution}
		for _, sk := range r.Skipped {
			msg := sk.Reason
			if sk.Message != "" {
				msg += ": " + sk.Message
			}
			s.Cases = append(s.Cases, junitCase{
				Name: caseName(sk.Name, sk.GlobalID), Classname: junitNotChecked, Time: "0",
				Skipped: &junitOutcome{Message: msg},
			})
		}
		s.count()
		if err := enc.Encode(s); err != nil {
			return err
		}
	}
	if err := enc.EncodeToken(start.End()); err != nil {
		return err
	}
	if err := enc.Flush(); err != nil {
		return err
	}
	_, err := io.WriteString(w, "\n")
	return err
}

type junitResult uint8

const (
	outcomePass junitResult = iota
	outcomeFailure
	outcomeSkipped
)

// outcome maps a verdict to a JUnit outcome under the gate policy.
func outcome(v checks.Verdict, failNeedsAnalysis bool) junitResult {
	switch {
	case v == checks.Fail:
		return outcomeFailure
	case v == checks.NeedsAnalysis && failNeedsAnalysis:
		return outcomeFailure
	case v == checks.NeedsAnalysis:
		return outcomeSkipped
	}
	return outcomePass
}

func (s *junitSuite) count() {
	s.Tests = len(s.Cases)
	for i := range s.Cases {
		if s.Cases[i].Failure != nil {
			s.Failures++
		}
		if s.Cases[i].Skipped != nil {
			s.Skipped++
		}
	}
}

func caseName(name, gid string) string {
	if name == "" {
		return gid
	}
	return name + " (" + gid + ")"
}

func junitElementCase(e *checks.Element, classname string, failNA bool) junitCase {
	m := e.Member
	c := junitCase{Name: caseName(m.Name, m.GlobalID), Classname: classname, Time: "0"}
	o := outcome(e.Verdict, failNA)
	if o == outcomePass {
		return c
	}
	msg := e.Verdict.String()
	if mr := mainReason(e); mr != nil {
		msg += ": " + mr.Code
		if mr.Message != "" {
			msg += ": " + mr.Message
		}
	}
	out := &junitOutcome{Message: msg, Text: junitDetail(e)}
	if o == outcomeFailure {
		out.Type = e.Verdict.String()
		c.Failure = out
	} else {
		c.Skipped = out
	}
	return c
}

// junitDetail lists the verdict, governing combination and reasons.
func junitDetail(e *checks.Element) string {
	var b strings.Builder
	b.WriteString("verdict: " + e.Verdict.String() + "\n")
	if e.GoverningCombination != "" {
		b.WriteString("governing combination: " + e.GoverningCombination)
		if g := governing(e); g != nil {
			b.WriteString(", delta_m " + fmtFixed(maxKnown(g, deltaM), 3))
		}
		b.WriteString("\n")
	}
	for i := range e.Reasons {
		b.WriteString("- " + reasonText(&e.Reasons[i]) + "\n")
	}
	return b.String()
}

func junitProps(r *checks.Report, run *Run) []junitProperty {
	p := []junitProperty{
		{"report_version", ReportVersion},
		{"run_id", run.RunID},
		{"tool_version", run.ToolVersion},
		{"standard", r.Standard},
		{"sway_method", r.SwayMethod},
		{"scope", r.Scope},
		{"gate_policy", run.Gate.policy()},
		{"gate_passed", strconv.FormatBool(run.Gate.Passed)},
		{"model_file", run.Model.File},
		{"model_sha256", run.Model.SHA256},
		{"model_schema", run.Model.Schema},
	}
	if run.Project != "" {
		p = append(p, junitProperty{"project", run.Project})
	}
	return p
}
