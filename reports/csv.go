package reports

import (
	"encoding/csv"
	"io"
	"math"
	"strings"

	"swaygate/checks"
)

// csvHeader names the CSV columns; per-axis columns repeat for major and
// minor.
var csvHeader = func() []string {
	h := []string{"global_id", "name", "storey", "combination", "verdict", "n_star_kn"}
	for _, ax := range checks.Axes {
		for _, f := range csvAxisFields {
			h = append(h, ax.String()+"_"+f)
		}
	}
	return append(h, "reasons")
}()

var csvAxisFields = []string{"ke", "n_om_kn", "lambda_c", "delta_b", "delta_s", "delta_m", "m_star_knm", "m_amplified_knm"}

// WriteCSV writes one row per member and combination (a member without
// combinations gets one row with an empty combination): GlobalId, name,
// storey, combination, the combination's verdict, N* and per axis ke, Nom,
// lambda_c, the deltas, M* and the amplified moment (SI units as in the
// header), and the codes of the reasons that concern the member as a whole or
// that combination, joined with ';'. Unknown values are empty cells.
//
// The last line is the caution, as a comment line starting with '#' (read the
// file with encoding/csv's Comment = '#').
func WriteCSV(w io.Writer, r *checks.Report, run Run) error {
	_ = run // the CSV carries no run facts; the parameter keeps the writers alike
	cw := csv.NewWriter(w)
	if err := cw.Write(csvHeader); err != nil {
		return err
	}
	rec := make([]string, len(csvHeader))
	var codes []string
	for i := range r.Elements {
		e := &r.Elements[i]
		m := e.Member
		rec[0], rec[1], rec[2] = m.GlobalID, m.Name, m.Storey
		if len(e.Combinations) == 0 {
			rec[3], rec[4] = "", e.Verdict.String()
			for k := 5; k < len(rec)-1; k++ {
				rec[k] = ""
			}
			codes = reasonCodes(codes[:0], e.Reasons, "")
			rec[len(rec)-1] = strings.Join(codes, ";")
			if err := cw.Write(rec); err != nil {
				return err
			}
			continue
		}
		for ci := range e.Combinations {
			c := &e.Combinations[ci]
			rec[3], rec[4] = c.Name, c.Verdict.String()
			rec[5] = csvNum(c.NStar.F() / nPerKN)
			k := 6
			for _, ax := range checks.Axes {
				a := &c.Axes[ax]
				rec[k] = csvNum(a.Ke.F())
				rec[k+1] = csvNum(a.Nom.F() / nPerKN)
				rec[k+2] = csvNum(a.LambdaC.F())
				rec[k+3] = csvNum(a.DeltaB.F())
				rec[k+4] = csvNum(a.DeltaS.F())
				rec[k+5] = csvNum(a.DeltaM.F())
				rec[k+6] = csvNum(a.MStar.F() / nmmPerKNm)
				rec[k+7] = csvNum(a.MAmp.F() / nmmPerKNm)
				k += len(csvAxisFields)
			}
			codes = reasonCodes(codes[:0], e.Reasons, c.Name)
			rec[k] = strings.Join(codes, ";")
			if err := cw.Write(rec); err != nil {
				return err
			}
		}
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return err
	}
	_, err := io.WriteString(w, "# "+oneLine(Caution(r.Standard, r.Scope))+"\n")
	return err
}

// reasonCodes appends the distinct codes of the reasons that concern the
// whole member or the named combination (all reasons when comb is empty).
func reasonCodes(dst []string, rs []checks.Reason, comb string) []string {
	for i := range rs {
		if comb != "" && rs[i].Combination != "" && rs[i].Combination != comb {
			continue
		}
		dst = appendUnique(dst, rs[i].Code)
	}
	return dst
}

// csvNum formats f in full precision, "" when unknown.
func csvNum(f float64) string {
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return ""
	}
	return string(appendJSONFloat(nil, f))
}

// oneLine replaces line breaks with spaces.
func oneLine(s string) string {
	return strings.NewReplacer("\r\n", " ", "\n", " ", "\r", " ").Replace(s)
}
