package reports

import (
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"swaygate/checks"
)

// WriteMembersJSON writes what was extracted from a model, for `swaygate
// members --format json`: the report's shape without results, verdicts or
// trace. Each element carries its section, material, restraint per axis, the
// actions of each combination (n_star_kn, m_major_start_knm, m_major_end_knm,
// m_major_peak_knm and the same for minor, theory, source) and its problems
// under "reasons". The top level lists the combinations in model order. The
// schema is schema/members.schema.json.
//
// Like WriteJSON it rejects, before writing, a member without a GlobalId or
// one whose GlobalId repeats.
func WriteMembersJSON(w io.Writer, m *checks.Model, run Run) error {
	if err := checkMembers(m.Members); err != nil {
		return err
	}
	j := newJSONWriter(w)
	j.beginObject()
	writeHeader(j, &run)
	writeModelInfo(j, &run.Model)

	j.key("summary")
	j.beginObject()
	j.fInt("members", len(m.Members))
	j.fInt("with_problems", countWithProblems(m.Members))
	j.endObject()

	writeStrings(j, "assumptions", m.Assumptions)
	writeReasons(j, "warnings", m.Warnings)
	writeSkipped(j, m.Skipped)
	writeStrings(j, "combinations", m.Combinations)

	j.key("elements")
	j.beginObject()
	for i := range m.Members {
		writeMember(j, &m.Members[i])
		j.maybeFlush()
	}
	j.endObject()
	j.endObject()
	j.buf = append(j.buf, '\n')
	return j.flush()
}

func checkMembers(ms []checks.Member) error {
	els := make([]checks.Element, len(ms))
	for i := range ms {
		els[i].Member = &ms[i]
	}
	return checkElements(els)
}

// countWithProblems counts members with at least one verdict-setting problem.
func countWithProblems(ms []checks.Member) int {
	n := 0
	for i := range ms {
		for _, p := range ms[i].Problems {
			if p.Verdict() != checks.Pass {
				n++
				break
			}
		}
	}
	return n
}

func writeMember(j *jsonWriter, m *checks.Member) {
	j.keyString(m.GlobalID)
	j.beginObject()
	j.fStr("entity", m.Entity)
	j.fStr("name", m.Name)
	j.fStr("tag", m.Tag)
	j.fStrOrNull("storey", m.Storey)
	j.fNum("storey_elevation_mm", m.StoreyElevation.F())
	if m.Ref != "" {
		j.fStr("ref", m.Ref)
	}
	writeReasons(j, "reasons", m.Problems)
	j.fNumPos("length_mm", m.Length)
	writeSection(j, m.Section)

	j.key("material")
	j.beginObject()
	j.fNumPos("e_mpa", m.Material.E)
	j.fNumPos("fy_mpa", m.Material.Fy)
	j.fNumPos("fu_mpa", m.Material.Fu)
	j.fStr("grade", m.Material.Grade)
	j.fStr("source", m.Material.Source)
	j.endObject()

	j.key("restraint")
	j.beginObject()
	for _, ax := range checks.Axes {
		j.key(ax.String())
		writeRestraint(j, &m.Axes[ax], m.Length)
	}
	j.endObject()

	j.key("combinations")
	j.beginArray()
	for i := range m.Actions {
		writeActions(j, &m.Actions[i])
	}
	j.endArray()
	j.endObject()
}

func writeRestraint(j *jsonWriter, a *checks.AxisInput, length float64) {
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
	j.fNumPos("ke", a.Ke)
	j.key("braced_ke")
	switch {
	case a.Restraint != checks.Sway:
		j.null()
	case a.BracedKe > 0:
		j.num(a.BracedKe)
	default:
		j.num(1) // the documented default
	}
	bl := a.BucklingLength
	if !(bl > 0) {
		bl = length
	}
	j.fNumPos("buckling_length_mm", bl)
	j.fStrOrNull("direction", a.Direction.String())
	j.fBool("transverse_load", a.TransverseLoad)
	j.fStr("source", a.Source)
	j.endObject()
}

func writeActions(j *jsonWriter, a *checks.Actions) {
	j.beginObject()
	j.fStr("name", a.Combination)
	j.fStr("theory", a.Theory.String())
	j.fStr("source", a.Source)
	if a.Ref != "" {
		j.fStr("ref", a.Ref)
	}
	j.fNum("n_star_kn", a.NStar/nPerKN)
	for _, ax := range checks.Axes {
		mo := &a.Moments[ax]
		pre := "m_major_"
		if ax == checks.Minor {
			pre = "m_minor_"
		}
		j.key(pre + "start_knm")
		j.num(mo.Start / nmmPerKNm)
		j.key(pre + "end_knm")
		j.num(mo.End / nmmPerKNm)
		j.key(pre + "peak_knm")
		if mo.InteriorUnknown {
			j.null()
		} else {
			j.num(peakMoment(mo) / nmmPerKNm)
		}
	}
	j.endObject()
}

// peakMoment is M*m: the given peak, or the larger end moment when the peak is
// zero (the input type's convention).
func peakMoment(mo *checks.AxisMoments) float64 {
	if mo.Peak != 0 {
		return math.Abs(mo.Peak)
	}
	return math.Max(math.Abs(mo.Start), math.Abs(mo.End))
}

// WriteMembersText writes the member listing as a terminal table: one row per
// member with its storey, profile, length, E, restraint per axis, the number
// of combinations with actions and its problems, then the skipped elements,
// assumptions and warnings. Lengths follow run.Units.
func WriteMembersText(w io.Writer, m *checks.Model, run Run) error {
	u, err := run.unitSystem()
	if err != nil {
		return err
	}
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	var line []byte
	line = append(line, "swaygate members: "...)
	line = strconv.AppendInt(line, int64(len(m.Members)), 10)
	line = append(line, " members, "...)
	line = strconv.AppendInt(line, int64(countWithProblems(m.Members)), 10)
	line = append(line, " with problems, "...)
	line = strconv.AppendInt(line, int64(len(m.Combinations)), 10)
	line = append(line, " combinations, "...)
	line = strconv.AppendInt(line, int64(len(m.Skipped)), 10)
	line = append(line, " skipped\n\n"...)
	tw.Write(line)
	tw.Write([]byte("GLOBALID\tNAME\tSTOREY\tPROFILE\tLENGTH (" + u.length + ")\tE (MPa)\tMAJOR\tMINOR\tACTIONS\tPROBLEMS\n"))
	for i := range m.Members {
		mb := &m.Members[i]
		line = line[:0]
		line = appendCell(line, mb.GlobalID)
		line = appendCell(line, mb.Name)
		line = appendCell(line, orDash(mb.Storey))
		profile := "-"
		if mb.Section != nil && mb.Section.Profile != "" {
			profile = mb.Section.Profile
		}
		line = appendCell(line, profile)
		line = appendCell(line, fmtPos(mb.Length, u.perLength))
		line = appendCell(line, fmtPos(mb.Material.E, 1))
		line = appendCell(line, restraintText(&mb.Axes[checks.Major]))
		line = appendCell(line, restraintText(&mb.Axes[checks.Minor]))
		line = strconv.AppendInt(line, int64(len(mb.Actions)), 10)
		line = append(line, '/')
		line = strconv.AppendInt(line, int64(len(m.Combinations)), 10)
		line = append(line, '\t')
		line = append(line, problemCodes(mb.Problems)...)
		line = append(line, '\n')
		tw.Write(line)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	var b strings.Builder
	if len(m.Skipped) > 0 {
		b.WriteString("\nSkipped (not checked):\n")
		for _, s := range m.Skipped {
			b.WriteString("  - " + s.GlobalID + " " + s.Name + " (" + s.Entity + "): " + s.Reason + "\n")
		}
	}
	writeListText(&b, "Assumptions", m.Assumptions)
	writeReasonsText(&b, "Warnings", m.Warnings)
	_, err = io.WriteString(w, b.String())
	return err
}

// restraintText is e.g. "sway ke 1.2 Y" or "braced ke 1 X" or "-".
func restraintText(a *checks.AxisInput) string {
	if a.Restraint == checks.RestraintUnknown && !(a.Ke > 0) {
		return "-"
	}
	s := a.Restraint.String()
	if a.Ke > 0 {
		s += " ke " + fmtSig(a.Ke, 4)
	}
	if d := a.Direction.String(); d != "" {
		s += " " + d
	}
	return s
}

// problemCodes joins the problems' codes with commas ("-" when none).
func problemCodes(rs []checks.Reason) string {
	if len(rs) == 0 {
		return "-"
	}
	codes := make([]string, 0, len(rs))
	for _, r := range rs {
		codes = appendUnique(codes, r.Code)
	}
	return strings.Join(codes, ",")
}

func appendUnique(ss []string, s string) []string {
	for _, x := range ss {
		if x == s {
			return ss
		}
	}
	return append(ss, s)
}
