package sidecar

import (
	"errors"
	"math"
	"strings"
	"testing"

	"swaygate/checks"
)

func TestCSV(t *testing.T) {
	src := "\xEF\xBB\xBF# comment\n" +
		"Global_ID, combination ,axial_compression_kN,m_major_start_kNm,m_major_end_kNm,m_minor_start_kNm,m_minor_end_kNm,theory,m_major_peak_kNm\n" +
		"A,ULS-1,620,-12,25,3,6,,\n" +
		"\n" +
		"A,\"ULS-2, wind\",440,95,-70,2,4,second-order,101.5\n" +
		"B,ULS-1,-20,0,0,0,0,first-order,\n"
	f, err := Parse([]byte(src), "a.csv")
	if err != nil {
		t.Fatal(err)
	}
	if strings.Join(f.Combinations, "|") != "ULS-1|ULS-2, wind" || len(f.Rows) != 3 {
		t.Fatalf("combinations %q, %d rows", f.Combinations, len(f.Rows))
	}
	r := f.Rows[1]
	// Units fixed by the header: kN -> N, kNm -> N·mm.
	if r.GlobalID != "A" || r.NStar != 440e3 || r.MajorStart != 95e6 || r.MajorEnd != -70e6 || r.MinorStart != 2e6 ||
		r.MinorEnd != 4e6 || r.Theory != checks.SecondOrder || r.MajorPeak != 101.5e6 || !math.IsNaN(r.MinorPeak) || r.Line != 5 {
		t.Errorf("row %+v", r)
	}
	if f.Ref(&f.Rows[0]) != "a.csv:3" || !math.IsNaN(f.Rows[0].MajorPeak) || f.Rows[2].NStar != -20e3 {
		t.Errorf("rows %+v", f.Rows)
	}
}

func TestJSON(t *testing.T) {
	src := `{
  "combinations": ["ULS-0", "ULS-1"],
  "actions": [
    {"global_id": "A", "combination": "ULS-1", "axial_compression_kN": 620, "m_major_start_kNm": -12,
     "m_major_end_kNm": 25, "m_minor_start_kNm": 3, "m_minor_end_kNm": 6},
    {"global_id": "B", "combination": "ULS-2", "axial_compression_kN": 1, "m_major_start_kNm": 0,
     "m_major_end_kNm": 0, "m_minor_start_kNm": 0, "m_minor_end_kNm": 0, "theory": "second-order", "m_minor_peak_kNm": 3}
  ]
}`
	f, err := Parse([]byte(src), "a.json")
	if err != nil {
		t.Fatal(err)
	}
	if strings.Join(f.Combinations, "|") != "ULS-0|ULS-1|ULS-2" || len(f.Rows) != 2 {
		t.Fatalf("combinations %q rows %d", f.Combinations, len(f.Rows))
	}
	if r := f.Rows[0]; r.NStar != 620e3 || r.MajorStart != -12e6 || r.Line != 4 {
		t.Errorf("row %+v", r)
	}
	if r := f.Rows[1]; r.Theory != checks.SecondOrder || r.MinorPeak != 3e6 || r.Line != 6 {
		t.Errorf("row %+v", r)
	}
	// A bare array is accepted.
	f, err = Parse([]byte(`[{"global_id":"A","combination":"C","axial_compression_kN":1,"m_major_start_kNm":0,"m_major_end_kNm":0,"m_minor_start_kNm":0,"m_minor_end_kNm":0}]`), "b.json")
	if err != nil || len(f.Rows) != 1 {
		t.Errorf("array: %v", err)
	}
}

func TestErrors(t *testing.T) {
	const head = "global_id,combination,axial_compression_kN,m_major_start_kNm,m_major_end_kNm,m_minor_start_kNm,m_minor_end_kNm\n"
	const row = `{"global_id":"A","combination":"C","axial_compression_kN":1,"m_major_start_kNm":0,"m_major_end_kNm":0,"m_minor_start_kNm":0,"m_minor_end_kNm":0`
	tests := []struct {
		name, src, want string
	}{
		{"empty", "", "x: empty file"},
		{"unknown column", "global_id,combination,axial_compression_kN,m_major_start_kN\n", "x:1:4: unknown column \"m_major_start_kN\""},
		{"missing column", "global_id,combination\n", "x:1: missing column \"axial_compression_kn\""},
		{"not a number", head + "A,C,12,x,0,0,0\n", "x:2:4: m_major_start_knm: \"x\" is not a finite number"},
		{"empty cell", head + "A,C,,0,0,0,0\n", "x:2:3: axial_compression_kn: empty cell: want a number"},
		{"short row", head + "A,C,1\n", "x:2: row has 3 fields, the header 7"},
		{"duplicate", head + "A,C,1,0,0,0,0\nB,C,1,0,0,0,0\nA,C,2,0,0,0,0\n", "x:4: global_id \"A\" and combination \"C\" already given on line 2"},
		{"bad theory", "global_id,combination,axial_compression_kN,m_major_start_kNm,m_major_end_kNm,m_minor_start_kNm,m_minor_end_kNm,theory\nA,C,1,0,0,0,0,third\n", "x:2:8: theory \"third\": want first-order or second-order"},
		{"quote", head + "A,\"C,1,0,0,0,0\n", "x:2:"},
		{"json syntax", "{\n  \"actions\": [\n  {\"global_id\": }\n]}", "x:3: invalid JSON"},
		{"json missing key", "{\"actions\": [\n" + strings.Replace(row, `"axial_compression_kN":1,`, "", 1) + "}]}", "x:2: missing axial_compression_kN"},
		{"json unknown key", "{\"actions\": [\n" + row + `,"m_major_start_kN":3}]}`, "x:2: unknown field"},
		{"json wrong type", "{\"actions\": [\n" + strings.Replace(row, `"axial_compression_kN":1`, `"axial_compression_kN":"1"`, 1) + "}]}", "x:2: key \"axial_compression_kN\": want a float64, not string"},
		{"json top-level key", "{\"rows\": []}", "x:1: unknown key \"rows\""},
		{"json no actions", "{\"combinations\": [\"A\"]}", "x:1: no \"actions\" array"},
		{"json trailing", "[]\n[]", "x:2: data after the end"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Parse([]byte(tc.src), "x")
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("error %v, want a *Error", err)
			}
			if !strings.HasPrefix(err.Error(), tc.want) {
				t.Errorf("error %q, want prefix %q", err, tc.want)
			}
		})
	}
}
