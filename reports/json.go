package reports

import (
	"fmt"
	"io"
	"math"
	"time"

	"swaygate/checks"
	"swaygate/checks/section"
)

// WriteJSON writes the canonical report of design §6 to w: the run's facts,
// the summary and gate, assumptions, warnings, skipped elements, the storeys,
// every element keyed by GlobalId in member order with its per-combination and
// per-axis results and its trace, the frame analysis when present, and the
// caution. Unknown numbers are null. The report is streamed element by
// element through a buffer of about 64 KiB; nothing proportional to the
// number of members is held except a set of GlobalIds used to reject
// duplicates before anything is written. On a large report the elements are
// formatted on every core, a few batches at a time, and written in member
// order (the output does not depend on the number of cores).
//
// WriteJSON returns an error, before writing anything, when an element has no
// member, an empty GlobalId or a GlobalId used by an earlier element (a JSON
// object cannot hold both); otherwise it returns the first write error.
func WriteJSON(w io.Writer, r *checks.Report, run Run) error {
	return writeJSONWorkers(w, r, run, jsonWorkers())
}

// writeJSONWorkers is WriteJSON with the elements formatted on workers goroutines
// (one: on the caller's only).
func writeJSONWorkers(w io.Writer, r *checks.Report, run Run, workers int) error {
	if err := checkElements(r.Elements); err != nil {
		return err
	}
	j := newJSONWriter(w)
	j.beginObject()
	writeHeader(j, &run)
	j.fStr("standard", r.Standard)
	j.fStr("sway_method", r.SwayMethod)
	j.fStr("scope", r.Scope)
	writeModelInfo(j, &run.Model)

	j.key("summary")
	j.beginObject()
	j.fInt("members", r.Summary.Members)
	j.fInt("pass", r.Summary.Pass)
	j.fInt("fail", r.Summary.Fail)
	j.fInt("needs_analysis", r.Summary.NeedsAnalysis)
	j.endObject()

	j.key("gate")
	j.beginObject()
	j.fStr("policy", run.Gate.policy())
	j.fBool("passed", run.Gate.Passed)
	j.endObject()

	writeStrings(j, "assumptions", r.Assumptions)
	writeReasons(j, "warnings", r.Warnings)
	writeSkipped(j, r.Skipped)

	j.key("storeys")
	j.beginArray()
	for i := range r.Storeys {
		writeStorey(j, &r.Storeys[i])
	}
	j.endArray()
	j.maybeFlush()

	j.key("elements")
	j.beginObject()
	writeElements(j, r, r.Scope == "full", workers)
	j.endObject()

	if r.Frame != nil {
		writeFrame(j, r.Frame)
	}
	j.fStr("caution", Caution(r.Standard, r.Scope))
	j.endObject()
	j.buf = append(j.buf, '\n')
	return j.flush()
}

// checkElements rejects elements that cannot be keyed by GlobalId.
func checkElements(els []checks.Element) error {
	seen := make(map[string]int, len(els))
	for i := range els {
		m := els[i].Member
		if m == nil {
			return fmt.Errorf("reports: element %d has no member", i)
		}
		if m.GlobalID == "" {
			return fmt.Errorf("reports: element %d (%s %q) has no GlobalId", i, m.Ref, m.Name)
		}
		if k, dup := seen[m.GlobalID]; dup {
			return fmt.Errorf("reports: GlobalId %q of element %d (%s) repeats element %d", m.GlobalID, i, m.Ref, k)
		}
		seen[m.GlobalID] = i
	}
	return nil
}

// writeHeader writes the fields that identify a run.
func writeHeader(j *jsonWriter, run *Run) {
	j.fStr("report_version", ReportVersion)
	j.fStr("run_id", run.RunID)
	j.key("created_at")
	j.sep()
	j.buf = append(j.buf, '"')
	j.buf = run.CreatedAt.UTC().AppendFormat(j.buf, time.RFC3339Nano)
	j.buf = append(j.buf, '"')
	j.fStr("tool_version", run.ToolVersion)
	if run.Project != "" {
		j.fStr("project", run.Project)
	}
}

func writeModelInfo(j *jsonWriter, m *ModelInfo) {
	j.key("model")
	j.beginObject()
	j.fStr("file", m.File)
	j.fStr("sha256", m.SHA256)
	j.fStr("schema", m.Schema)
	j.fInt("instances", m.Instances)
	j.endObject()
}

func writeStrings(j *jsonWriter, k string, ss []string) {
	j.key(k)
	j.beginArray()
	for _, s := range ss {
		j.str(s)
	}
	j.endArray()
}

// writeReasons writes reasons as [{code, message, combination?, axis?, ref?}].
func writeReasons(j *jsonWriter, k string, rs []checks.Reason) {
	j.key(k)
	j.beginArray()
	for i := range rs {
		r := &rs[i]
		j.beginObject()
		j.fStr("code", r.Code)
		j.fStr("message", r.Message)
		if r.Combination != "" {
			j.fStr("combination", r.Combination)
		}
		if r.Axis != "" {
			j.fStr("axis", r.Axis)
		}
		if r.Ref != "" {
			j.fStr("ref", r.Ref)
		}
		j.endObject()
	}
	j.endArray()
}

func writeSkipped(j *jsonWriter, ss []checks.Skipped) {
	j.key("skipped")
	j.beginArray()
	for i := range ss {
		s := &ss[i]
		j.beginObject()
		j.fStr("global_id", s.GlobalID)
		j.fStr("name", s.Name)
		j.fStr("entity", s.Entity)
		j.fStr("reason", s.Reason)
		if s.Message != "" {
			j.fStr("message", s.Message)
		}
		j.endObject()
	}
	j.endArray()
}

func writeStorey(j *jsonWriter, s *checks.StoreyResult) {
	j.beginObject()
	j.fStr("name", s.Name)
	j.fNum("elevation_mm", s.Elevation.F())
	j.fStrOrNull("direction", s.Direction.String())
	j.fStr("combination", s.Combination)
	j.fNum("lambda_c", s.LambdaC.F())
	j.fNum("lambda_form_a", s.FormA.F())
	j.fNum("lambda_form_b", s.FormB.F())
	j.fNum("lambda_form_drift", s.FormDrift.F())
	j.fStrOrNull("form", s.Form)
	j.fInt("sway_members", s.SwayMembers)
	j.fInt("leaning_members", s.LeaningMembers)
	j.fNum("sum_n_star_kn", s.SumNStar.F()/nPerKN)
	j.fBool("complete", s.Complete)
	writeReasons(j, "reasons", s.Reasons)
	j.endObject()
}

func writeElement(j *jsonWriter, e *checks.Element, trace []checks.Step, full bool) {
	m := e.Member
	j.keyString(m.GlobalID)
	j.beginObject()
	j.fStr("entity", m.Entity)
	j.fStr("name", m.Name)
	j.fStr("tag", m.Tag)
	j.fStrOrNull("storey", m.Storey)
	j.fNum("storey_elevation_mm", m.StoreyElevation.F())
	j.fStr("verdict", e.Verdict.String())
	writeReasons(j, "reasons", e.Reasons)
	j.fStrOrNull("governing_combination", e.GoverningCombination)
	if full {
		j.fNum("governing_utilisation", e.GoverningUtilisation.F())
	}
	j.fNumPos("length_mm", m.Length)
	writeSection(j, m.Section)
	writeMaterial(j, e)

	j.key("combinations")
	j.beginArray()
	for i := range e.Combinations {
		writeCombination(j, &e.Combinations[i])
	}
	j.endArray()

	writeTrace(j, trace)
	j.endObject()
}

func writeSection(j *jsonWriter, p *section.Properties) {
	j.key("section")
	if p == nil {
		j.null()
		return
	}
	j.beginObject()
	j.fStr("profile", p.Profile)
	j.fStr("shape", p.Shape)
	j.fNumPos("area_mm2", p.A)
	j.fNumPos("i_major_mm4", p.IMajor)
	j.fNumPos("i_minor_mm4", p.IMinor)
	j.fNumPos("r_major_mm", p.RMajor)
	j.fNumPos("r_minor_mm", p.RMinor)
	j.fNumPos("z_major_mm3", p.ZMajor)
	j.fNumPos("z_minor_mm3", p.ZMinor)
	j.fNumPos("s_major_mm3", p.SMajor)
	j.fNumPos("s_minor_mm3", p.SMinor)
	j.fNumPos("j_mm4", p.J)
	j.fNumPos("iw_mm6", p.Iw)
	j.fNum("angle_deg", p.Angle*(180/3.141592653589793))
	j.fStr("source", p.Source)
	j.endObject()
}

func writeMaterial(j *jsonWriter, e *checks.Element) {
	mat := &e.Member.Material
	j.key("material")
	j.beginObject()
	eMPa, src := e.E, e.ESource
	if !(eMPa > 0) {
		eMPa = mat.E
	}
	if src == "" {
		src = mat.Source
	}
	j.fNumPos("e_mpa", eMPa)
	j.fNumPos("fy_mpa", mat.Fy)
	j.fNumPos("fu_mpa", mat.Fu)
	j.fStr("grade", mat.Grade)
	j.fStr("source", src)
	j.endObject()
}

func writeCombination(j *jsonWriter, c *checks.CombinationResult) {
	j.beginObject()
	j.fStr("name", c.Name)
	j.fStr("theory", c.Theory.String())
	j.fStr("verdict", c.Verdict.String())
	j.fNum("n_star_kn", c.NStar.F()/nPerKN)
	j.key("major")
	writeAxis(j, &c.Axes[checks.Major])
	j.key("minor")
	writeAxis(j, &c.Axes[checks.Minor])
	if len(c.Capacity) > 0 {
		j.key("capacity")
		j.beginArray()
		for i := range c.Capacity {
			writeCapacity(j, &c.Capacity[i])
		}
		j.endArray()
	}
	j.endObject()
}

func writeAxis(j *jsonWriter, a *checks.AxisResult) {
	j.beginObject()
	j.key("sway")
	switch a.Restraint {
	case checks.Sway:
		j.bool(true)
	case checks.Braced:
		j.bool(false)
	default:
		j.null()
	}
	j.fBool("leaning", a.Leaning)
	j.fStrOrNull("direction", a.Direction.String())
	j.fNum("ke", a.Ke.F())
	j.fNum("length_mm", a.Length.F())
	j.fNum("n_om_kn", a.Nom.F()/nPerKN)
	j.fNum("n_omb_kn", a.Nomb.F()/nPerKN)
	j.fNum("lambda_c", a.LambdaC.F())
	j.fNum("beta_m", a.BetaM.F())
	j.fNum("cm", a.Cm.F())
	j.fNum("delta_b", a.DeltaB.F())
	j.fNum("delta_s", a.DeltaS.F())
	j.fNum("delta_m", a.DeltaM.F())
	j.fNum("m_star_knm", a.MStar.F()/nmmPerKNm)
	j.fNum("m_amplified_knm", a.MAmp.F()/nmmPerKNm)
	j.endObject()
}

// writeCapacity writes one capacity check; demand and capacity given in N or
// N·mm are converted to kN or kNm, other units are written as given.
func writeCapacity(j *jsonWriter, c *checks.CapacityCheck) {
	demand, capacity, unit := c.Demand.F(), c.Capacity.F(), c.Unit
	if d, ok := jsonUnits[unit]; ok {
		demand, capacity, unit = demand/d.div, capacity/d.div, d.label
	}
	j.beginObject()
	j.fStr("name", c.Name)
	j.fStr("clause", c.Clause)
	j.fNum("demand", demand)
	j.fNum("capacity", capacity)
	j.fStr("unit", unit)
	j.fNum("utilisation", c.Utilisation.F())
	j.endObject()
}

// jsonUnits converts the engine's internal units to the report's.
var jsonUnits = map[string]struct {
	label string
	div   float64
}{
	"N":    {"kN", nPerKN},
	"N·mm": {"kNm", nmmPerKNm},
	"N.mm": {"kNm", nmmPerKNm},
	"Nmm":  {"kNm", nmmPerKNm},
}

// writeTrace writes the steps as given: their values are already in the unit
// each step names. Step values and inputs are rounded to traceDigits (6)
// significant digits: enough for a hand calculation, and several times
// faster to format than the shortest round-trip form of the other fields.
func writeTrace(j *jsonWriter, steps []checks.Step) {
	j.key("trace")
	j.beginArray()
	// The steps are most of a traced report. Their text around the two
	// numbers is cached per position in the trace (stepTexts): consecutive
	// members have the same steps with the same strings, which compare
	// equal at once when they share their storage.
	if len(j.steps) < len(steps) {
		j.steps = append(j.steps, make([]stepText, len(steps)-len(j.steps))...)
	}
	b := j.buf
	for i := range steps {
		s := &steps[i]
		t := &j.steps[i]
		if i > 0 {
			b = append(b, ',')
		}
		b = append(b, t.headOf(s)...)
		for k := range s.In() {
			in := &s.Inputs[k]
			if k > 0 {
				b = append(b, ',')
			}
			b = append(b, t.inputHead(k, in.Name)...)
			b = j.traceNumber(b, in.Value)
			b = append(b, t.inputTail(k, in.Unit)...)
		}
		b = append(b, `],"value":`...)
		b = j.traceNumber(b, s.Value)
		b = append(b, t.tailOf(s)...)
	}
	j.buf = b
	j.endArray()
}

// traceNumber appends a trace number (appendJSONFloat6), through the number
// cache unless it is an integer or null.
func (j *jsonWriter) traceNumber(b []byte, v float64) []byte {
	if v == math.Trunc(v) && math.Abs(v) < 1e6 || math.IsNaN(v) {
		return appendJSONFloat6(b, v)
	}
	return j.cachedNumber(b, v, true)
}

// stepText is the JSON text of one step of a trace without its numbers, for
// the strings it was made from:
//
//	head:         {"quantity":…,"clause":…,"formula":…,"inputs":[
//	input head:   {"name":…,"value":
//	input tail:   ,"unit":…}
//	tail:         ,"unit":…[,"combination":…][,"axis":…][,"note":…]}
type stepText struct {
	quantity, clause, formula string
	head                      []byte

	names, units [checks.MaxStepInputs]string
	inHead       [checks.MaxStepInputs][]byte
	inTail       [checks.MaxStepInputs][]byte

	unit, comb, axis, note string
	tail                   []byte
}

func (t *stepText) headOf(s *checks.Step) []byte {
	if t.head == nil || s.Quantity != t.quantity || s.Clause != t.clause || s.Formula != t.formula {
		t.quantity, t.clause, t.formula = s.Quantity, s.Clause, s.Formula
		b := append(t.head[:0], `{"quantity":`...)
		b = appendJSONString(b, s.Quantity)
		b = append(b, `,"clause":`...)
		b = appendJSONString(b, s.Clause)
		b = append(b, `,"formula":`...)
		b = appendJSONString(b, s.Formula)
		t.head = append(b, `,"inputs":[`...)
	}
	return t.head
}

func (t *stepText) inputHead(k int, name string) []byte {
	if t.inHead[k] == nil || name != t.names[k] {
		t.names[k] = name
		b := append(t.inHead[k][:0], `{"name":`...)
		b = appendJSONString(b, name)
		t.inHead[k] = append(b, `,"value":`...)
	}
	return t.inHead[k]
}

func (t *stepText) inputTail(k int, unit string) []byte {
	if t.inTail[k] == nil || unit != t.units[k] {
		t.units[k] = unit
		b := append(t.inTail[k][:0], `,"unit":`...)
		b = appendJSONString(b, unit)
		t.inTail[k] = append(b, '}')
	}
	return t.inTail[k]
}

func (t *stepText) tailOf(s *checks.Step) []byte {
	if t.tail == nil || s.Unit != t.unit || s.Combination != t.comb || s.Axis != t.axis || s.Note != t.note {
		t.unit, t.comb, t.axis, t.note = s.Unit, s.Combination, s.Axis, s.Note
		b := append(t.tail[:0], `,"unit":`...)
		b = appendJSONString(b, s.Unit)
		if s.Combination != "" {
			b = append(b, `,"combination":`...)
			b = appendJSONString(b, s.Combination)
		}
		if s.Axis != "" {
			b = append(b, `,"axis":`...)
			b = appendJSONString(b, s.Axis)
		}
		if s.Note != "" {
			b = append(b, `,"note":`...)
			b = appendJSONString(b, s.Note)
		}
		t.tail = append(b, '}')
	}
	return t.tail
}

func writeFrame(j *jsonWriter, f *checks.FrameResult) {
	j.key("frame")
	j.beginObject()
	j.fStr("name", f.Name)
	j.fBool("plane", f.Plane)
	j.fInt("nodes", f.Nodes)
	j.fInt("elements", f.Elements)
	j.fInt("dof", f.DOF)
	j.fStrOrNull("governing_combination", f.Governing)
	j.fInt("covered_members", f.Covered)
	j.fInt("fallback_axes", f.FellBack)
	j.key("members")
	j.beginArray()
	for i := range f.Members {
		m := &f.Members[i]
		j.beginObject()
		j.fStr("id", m.ID)
		j.fInt("start", m.Start)
		j.fInt("end", m.End)
		j.endObject()
	}
	j.endArray()
	j.key("combinations")
	j.beginArray()
	for i := range f.Combinations {
		c := &f.Combinations[i]
		j.beginObject()
		j.fStr("name", c.Name)
		j.fNum("lambda_c", c.LambdaC.F())
		j.fNum("lambda_c_x", c.LambdaX.F())
		j.fNum("lambda_c_y", c.LambdaY.F())
		j.fStr("status", c.Status)
		j.key("drivers")
		j.beginArray()
		for k := range c.Drivers {
			j.beginObject()
			j.fStr("member", c.Drivers[k].Member)
			j.fNum("share", c.Drivers[k].Share)
			j.endObject()
		}
		j.endArray()
		j.key("storeys")
		j.beginArray()
		for k := range c.Storeys {
			s := &c.Storeys[k]
			j.beginObject()
			j.fNum("bottom_z_mm", s.BottomZ)
			j.fNum("top_z_mm", s.TopZ)
			j.fNum("share", s.Share)
			j.fNum("drift", s.Drift)
			j.endObject()
		}
		j.endArray()
		j.key("mode")
		j.beginArray()
		for k := range c.Mode {
			n := &c.Mode[k]
			j.beginObject()
			j.fStr("node", n.Node)
			j.fNum("x_mm", n.X)
			j.fNum("y_mm", n.Y)
			j.fNum("z_mm", n.Z)
			j.fNum("ux", n.UX)
			j.fNum("uy", n.UY)
			j.fNum("uz", n.UZ)
			j.endObject()
		}
		j.endArray()
		j.endObject()
		j.maybeFlush()
	}
	j.endArray()
	writeStrings(j, "notes", f.Notes)
	writeStrings(j, "limitations", f.Limitations)
	j.endObject()
}

// elementTrace returns element i's trace: the stored steps, or, when the run
// built traces on demand (checks.Options.TraceOnDemand), the steps rebuilt
// into buf.
func elementTrace(r *checks.Report, i int, buf []checks.Step) []checks.Step {
	if t := r.Elements[i].Trace; t != nil {
		return t
	}
	return r.AppendTrace(buf, i)
}
