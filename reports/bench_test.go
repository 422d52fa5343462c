package reports

import (
	"io"
	"strconv"
	"testing"

	"swaygate/checks"
)

// benchReport builds a report of n members with nComb combinations each and
// no trace, by repeating the fixture's members with new GlobalIds and
// storeys of 100 members.
func benchReport(n, nComb int) *checks.Report {
	fx := fxReport(false)
	r := &checks.Report{Standard: fx.Standard, SwayMethod: fx.SwayMethod, Scope: fx.Scope,
		Assumptions: fx.Assumptions, Warnings: fx.Warnings, Skipped: fx.Skipped}
	members := make([]checks.Member, n)
	r.Elements = make([]checks.Element, n)
	for i := range n {
		src := &fx.Elements[i%len(fx.Elements)]
		members[i] = *src.Member
		m := &members[i]
		m.GlobalID = benchGlobalID(i)
		m.Name = "C" + strconv.Itoa(i+1)
		m.Storey = "Level " + strconv.Itoa(i/100+1)
		e := *src
		e.Member = m
		e.Trace = nil
		e.Combinations = make([]checks.CombinationResult, nComb)
		for k := range nComb {
			e.Combinations[k] = src.Combinations[k%len(src.Combinations)]
			e.Combinations[k].Name = "ULS-" + strconv.Itoa(k+1)
		}
		e.GoverningCombination = e.Combinations[0].Name
		r.Elements[i] = e
		r.Summary.Members++
		switch e.Verdict {
		case checks.Pass:
			r.Summary.Pass++
		case checks.Fail:
			r.Summary.Fail++
		default:
			r.Summary.NeedsAnalysis++
		}
	}
	for s := 0; s < n/100+1; s++ {
		for k := range nComb {
			st := fx.Storeys[0]
			st.Name = "Level " + strconv.Itoa(s+1)
			st.Combination = "ULS-" + strconv.Itoa(k+1)
			r.Storeys = append(r.Storeys, st)
		}
	}
	return r
}

// benchGlobalID is a 22-character id in the IFC base-64 alphabet.
func benchGlobalID(i int) string {
	const alphabet = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$"
	b := []byte("2Bench00000000000000000")[:22]
	for k := 21; k >= 8 && i > 0; k-- {
		b[k] = alphabet[i%64]
		i /= 64
	}
	return string(b)
}

// countWriter counts bytes and discards them.
type countWriter struct{ n int64 }

func (c *countWriter) Write(p []byte) (int, error) { c.n += int64(len(p)); return len(p), nil }

// BenchmarkWriteJSON writes 100,000 members × 2 combinations with no trace.
func BenchmarkWriteJSON(b *testing.B) {
	r := benchReport(100_000, 2)
	var cw countWriter
	if err := WriteJSON(&cw, r, fxRun); err != nil {
		b.Fatal(err)
	}
	b.SetBytes(cw.n)
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		if err := WriteJSON(io.Discard, r, fxRun); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkWriteJSONTrace writes 10,000 members × 2 combinations with the
// fixture's full trace.
func BenchmarkWriteJSONTrace(b *testing.B) {
	r := benchReport(10_000, 2)
	fx := fxReport(true)
	for i := range r.Elements {
		r.Elements[i].Trace = fx.Elements[i%len(fx.Elements)].Trace
	}
	var cw countWriter
	if err := WriteJSON(&cw, r, fxRun); err != nil {
		b.Fatal(err)
	}
	b.SetBytes(cw.n)
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		if err := WriteJSON(io.Discard, r, fxRun); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkWriters writes 10,000 members × 2 combinations with no trace in
// each of the other formats.
func BenchmarkWriters(b *testing.B) {
	r := benchReport(10_000, 2)
	for _, name := range []string{"junit", "csv", "html", "text"} {
		write := writers[name]
		b.Run(name, func(b *testing.B) {
			var cw countWriter
			if err := write(&cw, r, fxRun); err != nil {
				b.Fatal(err)
			}
			b.SetBytes(cw.n)
			b.ReportAllocs()
			for b.Loop() {
				if err := write(io.Discard, r, fxRun); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
