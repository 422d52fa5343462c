package reports

import (
	"embed"
	"html/template"
	"io"
	"strconv"
	"strings"

	"swaygate/checks"
)

//go:embed templates/report.html
var templateFS embed.FS

// reportTemplate is parsed once; html/template escapes every value by
// context, so model data (names, tags, messages) cannot inject markup.
var reportTemplate = template.Must(template.New("report.html").
	Funcs(template.FuncMap{"vclass": verdictClass}).
	ParseFS(templateFS, "templates/report.html"))

// WriteHTML writes one self-contained HTML page (inline CSS, no scripts, no
// external assets, print-friendly): the caution, the run's facts, the summary
// and gate, assumptions, warnings and skipped elements, the storeys table, a
// table per storey of its members (verdict, governing combination, delta_m,
// N*, amplified moment, reasons), and each member's hand calculation rendered
// from its trace one step per line (quantity = formula, inputs with units =
// value unit, clause). Forces, moments and lengths follow run.Units.
func WriteHTML(w io.Writer, r *checks.Report, run Run) error {
	u, err := run.unitSystem()
	if err != nil {
		return err
	}
	return reportTemplate.Execute(w, newHTMLPage(r, &run, u))
}

type htmlPage struct {
	Title      string
	Caution    string
	Facts      []htmlFact
	Summary    checks.Summary
	GatePolicy string
	GatePassed bool
	// Display unit labels.
	Force, Moment, Length string
	// Full: scope full, so members show their governing utilisation.
	Full bool

	Assumptions []string
	Warnings    []string
	Skipped     []checks.Skipped
	Storeys     []htmlStorey
	Frame       *htmlFrame
	Groups      []htmlGroup
	Calcs       []htmlCalc
}

type htmlFact struct{ Label, Value string }

type htmlStorey struct {
	Name, Elevation, Direction, Combination string
	LambdaC, FormA, FormB, FormDrift, Form  string
	Sway, Leaning                           int
	SumNStar                                string
	Complete                                bool
	Reasons                                 []string
}

type htmlGroup struct {
	Name    string
	Members []htmlMember
}

type htmlMember struct {
	Anchor, GlobalID, Name, Tag, Verdict, Governing string
	DeltaM, NStar, MAmp, Util                       string
	Reasons                                         []string
}

type htmlCalc struct {
	Anchor, GlobalID, Name, Storey, Verdict string
	Facts                                   []htmlFact
	Reasons                                 []string
	Steps                                   []htmlStep
}

type htmlStep struct {
	Group                                                string // non-empty when the step starts a new combination/axis block
	Quantity, Formula, Inputs, Value, Unit, Clause, Note string
}

func newHTMLPage(r *checks.Report, run *Run, u *unitSystem) *htmlPage {
	p := &htmlPage{
		Caution:     Caution(r.Standard, r.Scope),
		Summary:     r.Summary,
		GatePolicy:  run.Gate.policy(),
		GatePassed:  run.Gate.Passed,
		Force:       u.force,
		Moment:      u.moment,
		Full:        r.Scope == "full",
		Length:      u.length,
		Assumptions: r.Assumptions,
		Skipped:     r.Skipped,
	}
	p.Title = "swaygate check"
	if run.Model.File != "" {
		p.Title += ": " + run.Model.File
	}
	p.Facts = []htmlFact{
		{"Model", run.Model.File},
		{"Schema", run.Model.Schema},
		{"Instances", strconv.Itoa(run.Model.Instances)},
		{"SHA-256", run.Model.SHA256},
		{"Standard", standardName(r.Standard)},
		{"Scope", r.Scope},
		{"Sway method", r.SwayMethod},
		{"Run", run.RunID},
		{"Created", run.CreatedAt.UTC().Format("2006-01-02 15:04:05 UTC")},
		{"Tool version", run.ToolVersion},
	}
	if run.Project != "" {
		p.Facts = append([]htmlFact{{"Project", run.Project}}, p.Facts...)
	}
	for i := range r.Warnings {
		s := reasonText(&r.Warnings[i])
		if r.Warnings[i].Ref != "" {
			s += " (" + r.Warnings[i].Ref + ")"
		}
		p.Warnings = append(p.Warnings, s)
	}
	for i := range r.Storeys {
		s := &r.Storeys[i]
		hs := htmlStorey{
			Name: s.Name, Elevation: fmtSig(s.Elevation.F()/u.perLength, 4),
			Direction: orDash(s.Direction.String()), Combination: s.Combination,
			LambdaC: fmtFixed(s.LambdaC.F(), 2), FormA: fmtFixed(s.FormA.F(), 2),
			FormB: fmtFixed(s.FormB.F(), 2), FormDrift: fmtFixed(s.FormDrift.F(), 2),
			Form: orDash(s.Form), Sway: s.SwayMembers, Leaning: s.LeaningMembers,
			SumNStar: fmtFixed(s.SumNStar.F()/u.perForce, 1), Complete: s.Complete,
		}
		for k := range s.Reasons {
			hs.Reasons = append(hs.Reasons, reasonText(&s.Reasons[k]))
		}
		p.Storeys = append(p.Storeys, hs)
	}

	p.Frame = newHTMLFrame(r.Frame)

	groupIdx := map[string]int{}
	for i := range r.Elements {
		e := &r.Elements[i]
		m := e.Member
		anchor := "m" + strconv.Itoa(i+1)
		storey := m.Storey
		if storey == "" {
			storey = junitNoStorey
		}
		gi, ok := groupIdx[storey]
		if !ok {
			gi = len(p.Groups)
			groupIdx[storey] = gi
			p.Groups = append(p.Groups, htmlGroup{Name: storey})
		}
		reasons := make([]string, len(e.Reasons))
		for k := range e.Reasons {
			reasons[k] = reasonText(&e.Reasons[k])
		}
		hm := htmlMember{
			Anchor: anchor, GlobalID: m.GlobalID, Name: m.Name, Tag: m.Tag,
			Verdict: e.Verdict.String(), Governing: orDash(e.GoverningCombination),
			DeltaM: "-", NStar: "-", MAmp: "-", Util: fmtUtil(e.GoverningUtilisation), Reasons: reasons,
		}
		if g := governing(e); g != nil {
			hm.DeltaM = fmtFixed(maxKnown(g, deltaM), 3)
			hm.NStar = fmtFixed(g.NStar.F()/u.perForce, 1)
			hm.MAmp = fmtFixed(maxKnown(g, mAmp)/u.perMoment, 1)
		}
		p.Groups[gi].Members = append(p.Groups[gi].Members, hm)
		p.Calcs = append(p.Calcs, htmlCalc{
			Anchor: anchor, GlobalID: m.GlobalID, Name: m.Name, Storey: storey,
			Verdict: e.Verdict.String(), Facts: memberFacts(e, u), Reasons: reasons,
			Steps: htmlSteps(elementTrace(r, i, nil), u),
		})
	}
	return p
}

// memberFacts lists the inputs an engineer checks first.
func memberFacts(e *checks.Element, u *unitSystem) []htmlFact {
	m := e.Member
	f := []htmlFact{}
	if m.Tag != "" {
		f = append(f, htmlFact{"Tag", m.Tag})
	}
	if s := m.Section; s != nil {
		f = append(f, htmlFact{"Section", s.Profile + " (" + s.Shape + ")"})
		f = append(f, htmlFact{"A", quantity(s.A, "mm2", u)})
		f = append(f, htmlFact{"I major", quantity(s.IMajor, "mm4", u)})
		f = append(f, htmlFact{"I minor", quantity(s.IMinor, "mm4", u)})
	} else {
		f = append(f, htmlFact{"Section", "unknown"})
	}
	f = append(f, htmlFact{"Length", quantity(m.Length, "mm", u)})
	eMPa, src := e.E, e.ESource
	if !(eMPa > 0) {
		eMPa, src = m.Material.E, m.Material.Source
	}
	es := quantity(eMPa, "MPa", u)
	if src != "" {
		es += " (" + src + ")"
	}
	f = append(f, htmlFact{"E", es})
	if m.Material.Fy > 0 {
		f = append(f, htmlFact{"fy", quantity(m.Material.Fy, "MPa", u)})
	}
	return f
}

// quantity formats a positive value in an SI unit as "v unit" in the
// display system, "-" when unknown.
func quantity(v float64, unit string, u *unitSystem) string {
	if !(v > 0) {
		return "-"
	}
	v, unit = u.traceValue(v, unit)
	return fmtSig(v, 4) + " " + prettyUnit(unit)
}

// prettyUnit writes exponents as superscripts.
func prettyUnit(unit string) string {
	switch unit {
	case "mm2", "mm^2":
		return "mm²"
	case "mm3", "mm^3":
		return "mm³"
	case "mm4", "mm^4":
		return "mm⁴"
	case "mm6", "mm^6":
		return "mm⁶"
	}
	return unit
}

func htmlSteps(steps []checks.Step, u *unitSystem) []htmlStep {
	out := make([]htmlStep, len(steps))
	prevComb, prevAxis := "\x00", "\x00"
	var b []byte
	for i := range steps {
		s := &steps[i]
		hs := &out[i]
		if s.Combination != prevComb || s.Axis != prevAxis {
			switch {
			case s.Combination == "" && s.Axis == "":
				hs.Group = "member"
			case s.Axis == "":
				hs.Group = s.Combination
			case s.Combination == "":
				hs.Group = s.Axis + " axis"
			default:
				hs.Group = s.Combination + ", " + s.Axis + " axis"
			}
			prevComb, prevAxis = s.Combination, s.Axis
		}
		b = b[:0]
		for k, in := range s.In() {
			if k > 0 {
				b = append(b, ", "...)
			}
			v, unit := u.traceValue(in.Value, in.Unit)
			b = append(b, in.Name...)
			b = append(b, " = "...)
			b = appendSig(b, v, 4)
			if unit != "" {
				b = append(b, ' ')
				b = append(b, prettyUnit(unit)...)
			}
		}
		v, unit := u.traceValue(s.Value, s.Unit)
		hs.Quantity, hs.Formula, hs.Inputs = s.Quantity, s.Formula, string(b)
		hs.Value, hs.Unit, hs.Clause, hs.Note = fmtSig(v, 4), prettyUnit(unit), s.Clause, s.Note
	}
	return out
}

// verdictClass is the CSS class of a verdict.
func verdictClass(v string) string {
	return "v-" + strings.ReplaceAll(v, "-", "")
}
