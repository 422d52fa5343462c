package main

import (
	"encoding/json"
	"math"
	"strings"
	"testing"

	"swaygate/reports/schema"
)

// frameReport is the part of the JSON report these tests read.
type frameReport struct {
	SwayMethod  string   `json:"sway_method"`
	Assumptions []string `json:"assumptions"`
	Storeys     []struct {
		Name        string   `json:"name"`
		Direction   string   `json:"direction"`
		Combination string   `json:"combination"`
		LambdaC     *float64 `json:"lambda_c"`
		FormA       *float64 `json:"lambda_form_a"`
	} `json:"storeys"`
	Frame *struct {
		Nodes        int                   `json:"nodes"`
		Members      []struct{ ID string } `json:"members"`
		Combinations []struct {
			Name    string   `json:"name"`
			LambdaC *float64 `json:"lambda_c"`
			LambdaX *float64 `json:"lambda_c_x"`
			Mode    []struct {
				UX, UY, UZ *float64
			} `json:"mode"`
			Drivers []struct {
				Member string  `json:"member"`
				Share  float64 `json:"share"`
			} `json:"drivers"`
		} `json:"combinations"`
		Covered  int `json:"covered_members"`
		FellBack int `json:"fallback_axes"`
	} `json:"frame"`
	Elements map[string]struct {
		Name         string `json:"name"`
		Verdict      string `json:"verdict"`
		Combinations []struct {
			Name  string `json:"name"`
			Major struct {
				Sway    bool     `json:"sway"`
				LambdaC *float64 `json:"lambda_c"`
			} `json:"major"`
		} `json:"combinations"`
	} `json:"elements"`
}

func frameJSON(t *testing.T, args ...string) frameReport {
	t.Helper()
	out, stderr, code := runCheckCmd(t, append(args, "--format", "json")...)
	if code == exitUsage {
		t.Fatalf("check %q: exit 2: %s", args, stderr)
	}
	if err := schema.ValidateReport([]byte(out)); err != nil {
		t.Fatalf("the report does not match its schema: %v", err)
	}
	var r frameReport
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	return r
}

// TestCheckDemoFrame checks the demo depot with --sway-method frame end to
// end and compares the frame's lambda_c with the storey method's. The
// depot's numbers are invented; what is pinned is how the two methods relate:
//   - the lowest mode of the frame is not a sway mode: column C2 of the
//     mezzanine (900 kN on a 150UC30, the depot's deliberately overloaded
//     column) buckles between its floors, which its own braced check already
//     finds (unstable: N* ≥ N_omb);
//   - the sway frames in X buckle at a higher factor, which every X sway
//     axis takes; it lies between the storey method's form B (the lower,
//     which AS 4100 uses) and its form A for the ground storey: the frame
//     counts the restraint the beams actually give where the property set
//     takes ke = 1.3, and the interaction of the two storeys.
func TestCheckDemoFrame(t *testing.T) {
	const model = "../../testdata/demo/tern-street-depot.ifc"
	st := frameJSON(t, model)
	fr := frameJSON(t, model, "--sway-method", "frame")
	if fr.SwayMethod != "frame" || fr.Frame == nil {
		t.Fatalf("sway method %q, frame %v", fr.SwayMethod, fr.Frame)
	}
	if fr.Frame.Nodes != 24 || len(fr.Frame.Members) != 44 || fr.Frame.Covered != 16 || fr.Frame.FellBack != 0 {
		t.Errorf("frame: %d nodes, %d members, %d covered, %d fell back; want 24, 44, 16, 0",
			fr.Frame.Nodes, len(fr.Frame.Members), fr.Frame.Covered, fr.Frame.FellBack)
	}
	if len(fr.Storeys) != 0 {
		t.Errorf("storey rows in a frame run without fallback: %d", len(fr.Storeys))
	}
	storey := map[string]float64{} // ground storey, X: combination -> lambda_c (form B)
	formA := map[string]float64{}
	for _, s := range st.Storeys {
		if s.Name == "Ground Floor" && s.Direction == "X" && s.LambdaC != nil {
			storey[s.Combination] = *s.LambdaC
			formA[s.Combination] = *s.FormA
		}
	}
	for _, c := range fr.Frame.Combinations {
		if c.LambdaC == nil || c.LambdaX == nil {
			t.Fatalf("%s: lambda_c %v, x %v", c.Name, c.LambdaC, c.LambdaX)
		}
		low, x := *c.LambdaC, *c.LambdaX
		t.Logf("%s: frame lowest %.3f (driven by %s), sway X %.3f; storey ground X form B %.3f, form A %.3f",
			c.Name, low, c.Drivers[0].Member, x, storey[c.Name], formA[c.Name])
		if !strings.Contains(c.Drivers[0].Member, "C-C2M") {
			t.Errorf("%s: the lowest mode is driven by %s, want the overloaded mezzanine column C2", c.Name, c.Drivers[0].Member)
		}
		if !(low < x) || !(x > storey[c.Name]) || !(x < 1.25*formA[c.Name]) {
			t.Errorf("%s: want lowest %.3f < sway X %.3f, and sway X between form B %.3f and 1.25 x form A %.3f",
				c.Name, low, x, storey[c.Name], formA[c.Name])
		}
		for _, e := range fr.Elements {
			for _, ec := range e.Combinations {
				if ec.Name == c.Name && ec.Major.Sway && (ec.Major.LambdaC == nil || math.Abs(*ec.Major.LambdaC-x) > 1e-9*x) {
					t.Errorf("%s %s: sway lambda_c %v, want the frame's sway X %.4f", e.Name, c.Name, ec.Major.LambdaC, x)
				}
			}
		}
	}
	// The overloaded column fails under either method.
	for _, r := range []frameReport{st, fr} {
		for _, e := range r.Elements {
			if e.Name == "Column C2 Mezzanine" && e.Verdict != "fail" {
				t.Errorf("%s: %s, want fail", r.SwayMethod, e.Verdict)
			}
		}
	}
}

// TestCheckKeFrom: --ke-from accepts the frame sources and rejects others.
func TestCheckKeFrom(t *testing.T) {
	const model = "../../testdata/demo/tern-street-depot.ifc"
	for _, k := range []string{"auto", "property-set", "restraint-ratios", "buckling"} {
		r := frameJSON(t, model, "--ke-from", k)
		if k == "buckling" && r.Frame == nil {
			t.Errorf("--ke-from buckling: no frame section in the report")
		}
		found := false
		for _, a := range r.Assumptions {
			found = found || strings.Contains(a, "analytical frame") || strings.Contains(a, "buckling load factor")
		}
		if (k == "restraint-ratios" || k == "buckling") && !found {
			t.Errorf("--ke-from %s: no assumption recorded: %v", k, r.Assumptions)
		}
	}
	if _, stderr, code := runCheckCmd(t, model, "--ke-from", "chart"); code != exitUsage || !strings.Contains(stderr, "--ke-from") {
		t.Errorf("--ke-from chart: exit %d, %q", code, stderr)
	}
}
