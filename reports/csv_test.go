package reports

import (
	"bytes"
	"encoding/csv"
	"strings"
	"testing"
)

func TestWriteCSV(t *testing.T) {
	var buf bytes.Buffer
	if err := WriteCSV(&buf, fxReport(true), fxRun); err != nil {
		t.Fatal(err)
	}
	got := buf.Bytes()
	golden(t, "report.golden.csv", got)

	cr := csv.NewReader(bytes.NewReader(got))
	cr.Comment = '#'
	rows, err := cr.ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != 1+5*2 {
		t.Fatalf("%d rows, want a header and 10", len(rows))
	}
	h := strings.Join(rows[0], ",")
	want := "global_id,name,storey,combination,verdict,n_star_kn," +
		"major_ke,major_n_om_kn,major_lambda_c,major_delta_b,major_delta_s,major_delta_m,major_m_star_knm,major_m_amplified_knm," +
		"minor_ke,minor_n_om_kn,minor_lambda_c,minor_delta_b,minor_delta_s,minor_delta_m,minor_m_star_knm,minor_m_amplified_knm,reasons"
	if h != want {
		t.Errorf("header\n got %s\nwant %s", h, want)
	}
	col := map[string]int{}
	for i, c := range rows[0] {
		col[c] = i
	}
	for _, row := range rows[1:] {
		switch {
		case row[1] == "C4" && row[col["major_n_om_kn"]] != "":
			t.Errorf("C4 major_n_om_kn = %q, want empty (no section)", row[col["major_n_om_kn"]])
		case row[1] == "C4" && row[col["reasons"]] != "missing-section;missing-restraint":
			t.Errorf("C4 reasons %q", row[col["reasons"]])
		case row[1] == "C5" && row[3] == fxULS1 && (row[4] != "fail" || row[col["reasons"]] != "unstable"):
			t.Errorf("C5 %s: verdict %q reasons %q", fxULS1, row[4], row[col["reasons"]])
		case row[1] == "C5" && row[3] == fxULS2 && (row[4] != "pass" || row[col["reasons"]] != ""):
			t.Errorf("C5 %s: verdict %q reasons %q (the unstable reason names the other combination)", fxULS2, row[4], row[col["reasons"]])
		case row[1] == "C1" && row[3] == fxULS1 && row[5] != "1450":
			t.Errorf("C1 n_star_kn %q", row[5])
		}
	}
	lines := strings.Split(strings.TrimSuffix(string(got), "\n"), "\n")
	if last := lines[len(lines)-1]; last != "# "+Caution("as4100", "stability") {
		t.Errorf("last line %q is not the caution comment", last)
	}
}
