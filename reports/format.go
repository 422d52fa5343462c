package reports

import (
	"math"
	"strconv"
	"strings"

	"swaygate/checks"
)

// fmtSig formats v with about sig significant digits for people: plain
// decimals for magnitudes from 0.001 to below 10⁶ (trailing zeros dropped),
// "1.23e7" otherwise, and "-" when v is NaN or infinite.
func fmtSig(v float64, sig int) string {
	return string(appendSig(nil, v, sig))
}

func appendSig(b []byte, v float64, sig int) []byte {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return append(b, '-')
	}
	if v == 0 {
		return append(b, '0')
	}
	exp := int(math.Floor(math.Log10(math.Abs(v))))
	if exp >= 6 || exp < -3 {
		s := strconv.FormatFloat(v, 'e', sig-1, 64)
		mant, e, _ := strings.Cut(s, "e")
		mant = trimZeros(mant)
		ei, _ := strconv.Atoi(e)
		b = append(b, mant...)
		b = append(b, 'e')
		return strconv.AppendInt(b, int64(ei), 10)
	}
	dec := sig - 1 - exp
	if dec < 0 {
		dec = 0
	}
	start := len(b)
	b = strconv.AppendFloat(b, v, 'f', dec, 64)
	t := trimZeros(string(b[start:]))
	if t == "-0" {
		t = "0"
	}
	return append(b[:start], t...)
}

// trimZeros drops trailing zeros after a decimal point, and the point.
func trimZeros(s string) string {
	if !strings.Contains(s, ".") {
		return s
	}
	s = strings.TrimRight(s, "0")
	return strings.TrimSuffix(s, ".")
}

// fmtFixed formats v with dec decimals, "-" when unknown.
func fmtFixed(v float64, dec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "-"
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// fmtPos formats a value whose zero means unknown, divided by div.
func fmtPos(v, div float64) string {
	if !(v > 0) {
		return "-"
	}
	return fmtSig(v/div, 4)
}

func orDash(s string) string {
	if s == "" {
		return "-"
	}
	return s
}

// appendCell appends s and a tab, with tabs and newlines in s replaced by
// spaces so that a name cannot break a table.
func appendCell(b []byte, s string) []byte {
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c == '\t' || c == '\n' || c == '\r' {
			c = ' '
		}
		b = append(b, c)
	}
	return append(b, '\t')
}

// governing returns the element's governing combination result, nil when it
// has none.
func governing(e *checks.Element) *checks.CombinationResult {
	if e.GoverningCombination == "" {
		return nil
	}
	for i := range e.Combinations {
		if e.Combinations[i].Name == e.GoverningCombination {
			return &e.Combinations[i]
		}
	}
	return nil
}

// maxKnown returns the larger known value of the two axes' f, NaN when both
// are unknown.
func maxKnown(c *checks.CombinationResult, f func(*checks.AxisResult) checks.Num) float64 {
	best := math.NaN()
	for i := range c.Axes {
		v := f(&c.Axes[i]).F()
		if math.IsNaN(v) {
			continue
		}
		if math.IsNaN(best) || math.Abs(v) > math.Abs(best) {
			best = v
		}
	}
	return best
}

func deltaM(a *checks.AxisResult) checks.Num { return a.DeltaM }
func mAmp(a *checks.AxisResult) checks.Num   { return a.MAmp }

// mainReason returns the first reason that sets the element's verdict, else
// the first reason, else nil.
func mainReason(e *checks.Element) *checks.Reason {
	for i := range e.Reasons {
		if e.Reasons[i].Verdict() == e.Verdict && e.Verdict != checks.Pass {
			return &e.Reasons[i]
		}
	}
	if len(e.Reasons) > 0 {
		return &e.Reasons[0]
	}
	return nil
}

// reasonText is "code: message [combination, axis]".
func reasonText(r *checks.Reason) string {
	var b strings.Builder
	b.WriteString(r.Code)
	if r.Message != "" {
		b.WriteString(": ")
		b.WriteString(r.Message)
	}
	if r.Combination != "" || r.Axis != "" {
		b.WriteString(" [")
		b.WriteString(r.Combination)
		if r.Combination != "" && r.Axis != "" {
			b.WriteString(", ")
		}
		b.WriteString(r.Axis)
		b.WriteString("]")
	}
	return b.String()
}

func writeListText(b *strings.Builder, title string, ss []string) {
	if len(ss) == 0 {
		return
	}
	b.WriteString("\n" + title + ":\n")
	for _, s := range ss {
		b.WriteString("  - " + s + "\n")
	}
}

func writeReasonsText(b *strings.Builder, title string, rs []checks.Reason) {
	if len(rs) == 0 {
		return
	}
	b.WriteString("\n" + title + ":\n")
	for i := range rs {
		b.WriteString("  - " + reasonText(&rs[i]))
		if rs[i].Ref != "" {
			b.WriteString(" (" + rs[i].Ref + ")")
		}
		b.WriteString("\n")
	}
}

// fmtUtil writes a governing utilisation with 3 decimals, "-" when unknown.
func fmtUtil(u checks.Num) string {
	if !u.Known() {
		return "-"
	}
	return fmtFixed(u.F(), 3)
}
