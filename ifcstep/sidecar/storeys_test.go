package sidecar_test

import (
	"errors"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/ifcstep/sidecar"
)

// TestStoreysCSV reads the storey rows of standards-notes §6.4 (H_Ed =
// 50 kN, h = 4000 mm, δ = 15 mm) and checks units and references.
func TestStoreysCSV(t *testing.T) {
	src := "# storey shear and drift\n" +
		"storey,direction,combination,storey_shear_kN,storey_drift_mm,storey_height_mm,vertical_load_kN\n" +
		"Level 1,Y,ULS-1,50,15,4000,2000\n" +
		"Level 1, x ,ULS-1,40,12.5,4000,\n" +
		"\n" +
		"Level 2,Y,ULS-1,30,0,3500,\n"
	rows, err := sidecar.ParseStoreys([]byte(src), "storeys.csv")
	if err != nil {
		t.Fatal(err)
	}
	want := []checks.StoreyData{
		{Storey: "Level 1", Direction: checks.DirY, Combination: "ULS-1", ShearN: 50e3, DriftMM: 15, HeightMM: 4000, VerticalN: 2000e3, Ref: "storeys.csv:3"},
		{Storey: "Level 1", Direction: checks.DirX, Combination: "ULS-1", ShearN: 40e3, DriftMM: 12.5, HeightMM: 4000, Ref: "storeys.csv:4"},
		{Storey: "Level 2", Direction: checks.DirY, Combination: "ULS-1", ShearN: 30e3, DriftMM: 0, HeightMM: 3500, Ref: "storeys.csv:6"},
	}
	if len(rows) != len(want) {
		t.Fatalf("%d rows: %+v", len(rows), rows)
	}
	for i := range want {
		if rows[i] != want[i] {
			t.Errorf("row %d: %+v, want %+v", i, rows[i], want[i])
		}
	}
}

// TestStoreysJSON: the object and the bare array forms, with storey_key.
func TestStoreysJSON(t *testing.T) {
	obj := `{
  "storeys": [
    {"storey": "Level 1", "direction": "Y", "combination": "ULS-1",
     "storey_shear_kN": 50, "storey_drift_mm": 15, "storey_height_mm": 4000},
    {"storey_key": "#38", "direction": "X", "combination": "ULS-1",
     "storey_shear_kN": 40, "storey_drift_mm": 12, "storey_height_mm": 4000, "vertical_load_kN": 1800}
  ]
}`
	rows, err := sidecar.ParseStoreys([]byte(obj), "s.json")
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != 2 || rows[0].ShearN != 50e3 || rows[0].Ref != "s.json:3" || rows[1].StoreyKey != "#38" ||
		rows[1].VerticalN != 1800e3 || rows[1].Direction != checks.DirX || rows[1].Ref != "s.json:5" {
		t.Errorf("rows %+v", rows)
	}
	arr := `[{"storey": "L1", "direction": "y", "combination": "C", "storey_shear_kN": 1, "storey_drift_mm": 1, "storey_height_mm": 1}]`
	rows, err = sidecar.ParseStoreys([]byte(arr), "a.json")
	if err != nil || len(rows) != 1 || rows[0].Direction != checks.DirY {
		t.Errorf("array form: %+v, %v", rows, err)
	}
}

// TestStoreysErrors: every fault names the file, line and (CSV) column.
func TestStoreysErrors(t *testing.T) {
	const head = "storey,direction,combination,storey_shear_kN,storey_drift_mm,storey_height_mm\n"
	cases := []struct {
		name, src string
		line, col int
		msg       string
	}{
		{"empty", "", 0, 0, "empty storey file"},
		{"unknown column", "storey,direction,combination,storey_shear_kip\n", 1, 4, "unknown column"},
		{"missing column", "storey,direction,combination,storey_shear_kN,storey_drift_mm\n", 1, 0, `missing column "storey_height_mm"`},
		{"direction", head + "L1,Z,C,50,15,4000\n", 2, 2, "want X or Y"},
		{"not a number", head + "L1,Y,C,fifty,15,4000\n", 2, 4, "not a finite number"},
		{"negative drift", head + "L1,Y,C,50,-1,4000\n", 2, 5, "must not be negative"},
		{"zero shear", head + "L1,Y,C,0,1,4000\n", 2, 4, "must be positive"},
		{"duplicate", head + "L1,Y,C,50,15,4000\nL1,Y,C,50,16,4000\n", 3, 1, "already given on line 2"},
		{"no storey", head + ",Y,C,50,15,4000\n", 2, 1, "empty storey"},
		{"json missing key", `[{"storey": "L1", "direction": "Y", "combination": "C", "storey_shear_kN": 1, "storey_height_mm": 1}]`, 1, 0, `missing key "storey_drift_mm"`},
		{"json unknown key", "{\"storeys\": [\n{\"storey\": \"L1\", \"drift_in\": 1}]}", 2, 0, "unknown field"},
		{"json type", "[\n{\"storey\": 5}]", 2, 0, `key "storey"`},
		{"json no storeys", `{}`, 1, 0, `"storeys" array`},
	}
	for _, tc := range cases {
		_, err := sidecar.ParseStoreys([]byte(tc.src), "s")
		var se *sidecar.Error
		if !errors.As(err, &se) {
			t.Errorf("%s: error %v is not a *sidecar.Error", tc.name, err)
			continue
		}
		if se.Line != tc.line || se.Column != tc.col || !strings.Contains(se.Msg, tc.msg) {
			t.Errorf("%s: %q (line %d col %d), want line %d col %d containing %q", tc.name, se.Error(), se.Line, se.Column, tc.line, tc.col, tc.msg)
		}
	}
}
