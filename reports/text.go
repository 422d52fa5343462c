package reports

import (
	"io"
	"strconv"
	"strings"
	"text/tabwriter"
	"unicode/utf8"

	"swaygate/checks"
)

// maxReasonText is the most runes of the main reason a text row shows.
const maxReasonText = 72

// WriteText writes the terminal table of `--format text`: a summary line with
// the gate, one row per member (GlobalId, name, storey, verdict, governing
// combination, governing delta_m, N* and the largest amplified moment of that
// combination in run.Units, and the main reason), then the skipped elements,
// assumptions, warnings and the caution.
func WriteText(w io.Writer, r *checks.Report, run Run) error {
	u, err := run.unitSystem()
	if err != nil {
		return err
	}
	var b strings.Builder
	b.WriteString(summaryLine(r, &run))
	b.WriteString("\n\n")
	if _, err := io.WriteString(w, b.String()); err != nil {
		return err
	}

	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	full := r.Scope == "full"
	head := "GLOBALID\tNAME\tSTOREY\tVERDICT\tGOVERNING\tDELTA_M\tN* (" + u.force + ")\tM* AMP (" + u.moment + ")\t"
	if full {
		head += "UTIL\t"
	}
	tw.Write([]byte(head + "REASON\n"))
	var line []byte
	for i := range r.Elements {
		e := &r.Elements[i]
		m := e.Member
		line = line[:0]
		line = appendCell(line, m.GlobalID)
		line = appendCell(line, orDash(m.Name))
		line = appendCell(line, orDash(m.Storey))
		line = appendCell(line, e.Verdict.String())
		line = appendCell(line, orDash(e.GoverningCombination))
		if g := governing(e); g != nil {
			line = appendCell(line, fmtFixed(maxKnown(g, deltaM), 3))
			line = appendCell(line, fmtFixed(g.NStar.F()/u.perForce, 1))
			line = appendCell(line, fmtFixed(maxKnown(g, mAmp)/u.perMoment, 1))
		} else {
			line = append(line, "-\t-\t-\t"...)
		}
		if full {
			line = appendCell(line, fmtUtil(e.GoverningUtilisation))
		}
		if mr := mainReason(e); mr != nil {
			line = append(line, truncateRunes(reasonText(mr), maxReasonText)...)
		} else {
			line = append(line, '-')
		}
		line = append(line, '\n')
		tw.Write(line)
	}
	if err := tw.Flush(); err != nil {
		return err
	}

	b.Reset()
	if len(r.Skipped) > 0 {
		b.WriteString("\nSkipped (not checked):\n")
		for _, s := range r.Skipped {
			b.WriteString("  - " + s.GlobalID + " " + s.Name + " (" + s.Entity + "): " + s.Reason + "\n")
		}
	}
	writeListText(&b, "Assumptions", r.Assumptions)
	writeReasonsText(&b, "Warnings", r.Warnings)
	b.WriteString("\nCaution: ")
	b.WriteString(Caution(r.Standard, r.Scope))
	b.WriteString("\n")
	_, err = io.WriteString(w, b.String())
	return err
}

// summaryLine is e.g. "swaygate check (as4100, stability, storey): 5
// members: 2 pass, 1 fail, 2 needs-analysis; gate fail: not passed".
func summaryLine(r *checks.Report, run *Run) string {
	var b []byte
	b = append(b, "swaygate check ("...)
	b = append(b, standardName(r.Standard)...)
	b = append(b, ", scope "...)
	b = append(b, r.Scope...)
	b = append(b, ", sway method "...)
	b = append(b, r.SwayMethod...)
	b = append(b, "): "...)
	b = strconv.AppendInt(b, int64(r.Summary.Members), 10)
	b = append(b, " members: "...)
	b = strconv.AppendInt(b, int64(r.Summary.Pass), 10)
	b = append(b, " pass, "...)
	b = strconv.AppendInt(b, int64(r.Summary.Fail), 10)
	b = append(b, " fail, "...)
	b = strconv.AppendInt(b, int64(r.Summary.NeedsAnalysis), 10)
	b = append(b, " needs-analysis; gate "...)
	b = append(b, run.Gate.policy()...)
	if run.Gate.Passed {
		b = append(b, ": passed"...)
	} else {
		b = append(b, ": NOT passed"...)
	}
	return string(b)
}

// truncateRunes shortens s to at most n runes, ending with "…" when cut.
func truncateRunes(s string, n int) string {
	if utf8.RuneCountInString(s) <= n {
		return s
	}
	i, k := 0, 0
	for i = range s {
		if k == n-1 {
			break
		}
		k++
	}
	return s[:i] + "…"
}
