package reports

import (
	"bytes"
	"strings"
	"testing"
)

func TestWriteText(t *testing.T) {
	for _, units := range []string{UnitsSI, UnitsUS} {
		t.Run(units, func(t *testing.T) {
			run := fxRun
			run.Units = units
			var buf bytes.Buffer
			if err := WriteText(&buf, fxReport(true), run); err != nil {
				t.Fatal(err)
			}
			got := buf.String()
			golden(t, "report-"+units+".golden.txt", buf.Bytes())
			first, _, _ := strings.Cut(got, "\n")
			if want := "5 members: 3 pass, 1 fail, 1 needs-analysis; gate fail: NOT passed"; !strings.HasSuffix(first, want) {
				t.Errorf("summary line %q", first)
			}
			unit := map[string]string{UnitsSI: "N* (kN)", UnitsUS: "N* (kip)"}[units]
			if !strings.Contains(got, unit) {
				t.Errorf("table header lacks %q", unit)
			}
		})
	}
}

// TestTextUSConversion checks one converted value: C1's N* of 1450 kN is
// 1450 / 4.4482216152605 = 326.0 kip.
func TestTextUSConversion(t *testing.T) {
	run := fxRun
	run.Units = UnitsUS
	var buf bytes.Buffer
	if err := WriteText(&buf, fxReport(false), run); err != nil {
		t.Fatal(err)
	}
	for _, line := range strings.Split(buf.String(), "\n") {
		if strings.HasPrefix(line, "1hL2Wb0aL9$Qm8sZkT4p01") {
			if !strings.Contains(line, " 326.0 ") {
				t.Errorf("C1 row %q lacks 326.0 kip", line)
			}
			return
		}
	}
	t.Error("no row for C1")
}
