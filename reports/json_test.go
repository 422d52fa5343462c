package reports

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/checks/standards"
	"swaygate/reports/schema"
)

func writeJSON(t *testing.T, r *checks.Report, run Run) []byte {
	t.Helper()
	var buf bytes.Buffer
	if err := WriteJSON(&buf, r, run); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

func TestWriteJSONGolden(t *testing.T) {
	for _, tc := range []struct {
		name  string
		trace bool
		mod   func(*checks.Report)
	}{
		{"report.golden.json", true, nil},
		{"report-trace-none.golden.json", false, nil},
		{"report-frame-full.golden.json", false, func(r *checks.Report) {
			r.Scope = "full"
			r.Standard = "aisc360"
			r.SwayMethod = "frame"
			r.Elements = r.Elements[:1]
			r.Elements[0].GoverningUtilisation = 0.82
			r.Elements[0].Combinations[0].Capacity = []checks.CapacityCheck{
				{Name: "in-plane-major", Clause: "AISC 360 H1.1", Demand: 1450e3, Capacity: 2100e3, Unit: "N", Utilisation: 0.82},
				{Name: "section-major", Clause: "AISC 360 F2", Demand: 80e6, Capacity: checks.Null, Unit: "N·mm", Utilisation: checks.Null},
			}
			r.Frame = &checks.FrameResult{Nodes: 2, Elements: 1, DOF: 12, Notes: []string{"invented frame"},
				Combinations: []checks.FrameCombination{{Name: fxULS1, LambdaC: 4.2, Mode: []checks.ModeNode{
					{Node: "N1", Z: 0}, {Node: "N2", Z: 4200, UY: 1},
				}}}}
		}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			r := fxReport(tc.trace)
			if tc.mod != nil {
				tc.mod(r)
			}
			got := writeJSON(t, r, fxRun)
			if err := schema.ValidateReport(got); err != nil {
				t.Fatalf("report does not match the schema: %v", err)
			}
			if !json.Valid(got) {
				t.Fatal("not valid JSON")
			}
			var ind bytes.Buffer
			if err := json.Indent(&ind, got, "", "  "); err != nil {
				t.Fatal(err)
			}
			ind.WriteByte('\n')
			golden(t, tc.name, ind.Bytes())
		})
	}
}

// TestWriteJSONContract reads the report back and checks the contract of
// design §6 field by field on the fixture.
func TestWriteJSONContract(t *testing.T) {
	got := writeJSON(t, fxReport(true), fxRun)
	var doc map[string]any
	dec := json.NewDecoder(bytes.NewReader(got))
	dec.UseNumber()
	if err := dec.Decode(&doc); err != nil {
		t.Fatal(err)
	}
	wantTop := []string{"report_version", "run_id", "created_at", "tool_version", "project", "standard", "sway_method",
		"scope", "model", "summary", "gate", "assumptions", "warnings", "skipped", "storeys", "elements", "caution"}
	if len(doc) != len(wantTop) {
		t.Errorf("top level has %d fields, want %d", len(doc), len(wantTop))
	}
	for _, k := range wantTop {
		if _, ok := doc[k]; !ok {
			t.Errorf("top level lacks %q", k)
		}
	}
	if doc["report_version"] != "1" || doc["created_at"] != "2025-01-15T09:30:00Z" {
		t.Errorf("report_version %v created_at %v", doc["report_version"], doc["created_at"])
	}
	sum := doc["summary"].(map[string]any)
	if sum["members"] != json.Number("5") || sum["pass"] != json.Number("3") || sum["fail"] != json.Number("1") ||
		sum["needs_analysis"] != json.Number("1") {
		t.Errorf("summary = %v", sum)
	}
	if doc["caution"] != Caution("as4100", "stability") {
		t.Error("caution is not Caution()")
	}

	// Elements keep member order.
	last := -1
	for k := 1; k <= 5; k++ {
		at := bytes.Index(got, []byte(`"1hL2Wb0aL9$Qm8sZkT4p0`+itoa(k)+`":{`))
		if at <= last {
			t.Errorf("element C%d at byte %d, after the previous at %d: not in member order", k, at, last)
		}
		last = at
	}

	els := doc["elements"].(map[string]any)
	c1 := els["1hL2Wb0aL9$Qm8sZkT4p01"].(map[string]any)
	comb := c1["combinations"].([]any)[0].(map[string]any)
	if comb["n_star_kn"] != json.Number("1450") {
		t.Errorf("C1 n_star_kn = %v, want 1450 (N converted to kN)", comb["n_star_kn"])
	}
	major := comb["major"].(map[string]any)
	if major["m_star_knm"] != json.Number("62") || major["sway"] != true || major["direction"] != "Y" {
		t.Errorf("C1 major = %v", major)
	}
	sec := c1["section"].(map[string]any)
	if sec["i_major_mm4"] != json.Number("223000000") || sec["area_mm2"] != json.Number("12400") {
		t.Errorf("C1 section = %v", sec)
	}

	// C4 has no section: section null, Nom null, never 0.
	c4 := els["1hL2Wb0aL9$Qm8sZkT4p04"].(map[string]any)
	if c4["section"] != nil {
		t.Errorf("C4 section = %v, want null", c4["section"])
	}
	c4major := c4["combinations"].([]any)[0].(map[string]any)["major"].(map[string]any)
	for _, k := range []string{"n_om_kn", "n_omb_kn", "lambda_c", "delta_b", "delta_m", "m_amplified_knm"} {
		if v, ok := c4major[k]; !ok || v != nil {
			t.Errorf("C4 major %s = %v, want null", k, v)
		}
	}
	if c4["verdict"] != "needs-analysis" {
		t.Errorf("C4 verdict %v", c4["verdict"])
	}
	if bytes.Contains(got, []byte("NaN")) || bytes.Contains(got, []byte("Inf")) {
		t.Error("report contains NaN or Inf")
	}
}

func TestWriteJSONNulls(t *testing.T) {
	r := fxReport(false)
	r.Elements = r.Elements[:1]
	a := &r.Elements[0].Combinations[0].Axes[0]
	a.DeltaS = checks.Num(math.Inf(1))
	a.LambdaC = checks.Null
	r.Elements[0].Combinations[0].NStar = checks.Null
	m := *r.Elements[0].Member
	m.Length = 0
	m.StoreyElevation = checks.Null
	m.Storey = ""
	r.Elements[0].Member = &m
	r.Elements[0].GoverningCombination = ""
	got := writeJSON(t, r, fxRun)
	if err := schema.ValidateReport(got); err != nil {
		t.Fatal(err)
	}
	for _, s := range []string{`"delta_s":null`, `"lambda_c":null`, `"n_star_kn":null`, `"length_mm":null`,
		`"storey_elevation_mm":null`, `"storey":null`, `"governing_combination":null`} {
		if !bytes.Contains(got, []byte(s)) {
			t.Errorf("report lacks %s", s)
		}
	}
}

// TestWriteJSONStrings checks that any string survives the hand-written
// encoder as encoding/json reads it.
func TestWriteJSONStrings(t *testing.T) {
	for _, s := range []string{
		"", "plain", `<script>alert("x")</script>`, "a\"b\\c", "tab\there\nnewline\r\x00\x1f\x7f",
		"Stütze 1 – Achse B/3", "\u2028\u2029", "日本語", "bad\xffutf8", "emoji 🏗",
	} {
		b := appendJSONString(nil, s)
		var back string
		if err := json.Unmarshal(b, &back); err != nil {
			t.Errorf("%q: %s is not a JSON string: %v", s, b, err)
			continue
		}
		want := strings.ToValidUTF8(s, "\uFFFD")
		if back != want {
			t.Errorf("%q: read back %q", s, back)
		}
		if bytes.ContainsAny(b, "<>") {
			t.Errorf("%q: %s contains < or >", s, b)
		}
	}
}

func TestWriteJSONFloats(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	vals := []float64{0, math.Copysign(0, -1), 1, -1, 1e-7, 1.5e-7, 1e21, 123456789.125, 0.1, 1e300, -2.5e-300,
		math.SmallestNonzeroFloat64, math.MaxFloat64}
	for i := 0; i < 2000; i++ {
		vals = append(vals, math.Float64frombits(rng.Uint64()))
	}
	for _, f := range vals {
		if math.IsNaN(f) || math.IsInf(f, 0) {
			if s := string(appendJSONFloat(nil, f)); s != "null" {
				t.Errorf("%v written as %s", f, s)
			}
			continue
		}
		b := appendJSONFloat(nil, f)
		want, _ := json.Marshal(f)
		if !bytes.Equal(b, want) && f != 0 {
			t.Errorf("%v written as %s, encoding/json writes %s", f, b, want)
		}
		var back float64
		if err := json.Unmarshal(b, &back); err != nil || back != f && f != 0 {
			t.Errorf("%v written as %s, read back %v (%v)", f, b, back, err)
		}
	}
}

// TestWriteJSONFloats6 checks the trace numbers: six significant digits,
// correctly rounded, in the plain layout of appendJSONFloat.
func TestWriteJSONFloats6(t *testing.T) {
	for _, tc := range []struct {
		in   float64
		want string
	}{
		{0, "0"}, {math.Copysign(0, -1), "0"}, {math.NaN(), "null"}, {math.Inf(-1), "null"},
		{210000, "210000"}, {-4500, "-4500"}, {1.4, "1.4"}, {1, "1"},
		{5459.591225192451, "5459.59"}, {104549554.33142602, "104550000"}, {516352213541.6667, "516352000000"},
		{0.4314676050528405, "0.431468"}, {-0.000123456789, "-0.000123457"}, {1e-6, "0.000001"},
		{999999.5, "1000000"}, {9.999995, "10"}, {9.9999949, "9.99999"}, {0.1234565, "0.123456"}, {0.12345651, "0.123457"},
		{1.5e-7, "1.5e-7"}, {-2.0000004e-9, "-2e-9"}, {1e21, "1e+21"}, {1.234567e300, "1.23457e+300"},
		{123456.5, "123456"}, {123457.5, "123458"}, {1234567, "1234570"}, {100000000000000000000, "100000000000000000000"},
	} {
		if got := string(appendJSONFloat6(nil, tc.in)); got != tc.want {
			t.Errorf("appendJSONFloat6(%v) = %s, want %s", tc.in, got, tc.want)
		}
	}
	// Random values of every magnitude, and values on a rounding boundary,
	// against strconv's correctly rounded digits.
	rng := rand.New(rand.NewPCG(1, 1))
	var vals []float64
	for i := 0; i < 20000; i++ {
		vals = append(vals, math.Float64frombits(rng.Uint64()))
		e := rng.IntN(40) - 12
		m := float64(100000+rng.IntN(900000)) + 0.5 // a half way case at 6 digits
		vals = append(vals, (m/1e5)*math.Pow(10, float64(e)), rng.NormFloat64()*math.Pow(10, float64(e)))
	}
	for _, f := range vals {
		got := appendJSONFloat6(nil, f)
		if math.IsNaN(f) || math.IsInf(f, 0) {
			continue
		}
		back, err := strconv.ParseFloat(string(got), 64)
		if err != nil || !json.Valid(got) {
			t.Fatalf("%v written as %s: not a JSON number", f, got)
		}
		want, _ := strconv.ParseFloat(strconv.FormatFloat(f, 'e', 5, 64), 64)
		if back != want {
			t.Fatalf("%v written as %s, want the value of %s", f, got, strconv.FormatFloat(f, 'e', 5, 64))
		}
		if bytes.HasSuffix(got, []byte("0")) && bytes.IndexByte(got, '.') >= 0 && bytes.IndexByte(got, 'e') < 0 {
			t.Fatalf("%v written as %s: trailing zero", f, got)
		}
	}
}

// TestWriteJSONParallel checks that formatting the elements on several
// goroutines writes exactly what one goroutine writes: stored traces, and
// traces replayed on demand by the engine (full and summary).
func TestWriteJSONParallel(t *testing.T) {
	stored := benchReport(300, 3)
	fx := fxReport(true)
	for i := range stored.Elements {
		stored.Elements[i].Trace = fx.Elements[i%len(fx.Elements)].Trace
	}
	stored.Elements[7].Trace = nil // an element without a trace among traced ones
	reps := map[string]*checks.Report{"stored": stored, "none": benchReport(300, 2)}
	rs, err := standards.Lookup("as4100")
	if err != nil {
		t.Fatal(err)
	}
	for _, level := range []string{"full", "summary"} {
		m := fxModel()
		base := m.Members
		m.Members = nil
		for i := range 250 {
			mb := base[i%len(base)]
			mb.GlobalID = benchGlobalID(i)
			m.Members = append(m.Members, mb)
		}
		opt := checks.DefaultOptions()
		opt.Scope, opt.Trace, opt.TraceOnDemand = "stability", level, true
		rep, err := checks.Run(m, rs, opt)
		if err != nil {
			t.Fatal(err)
		}
		reps["on-demand-"+level] = rep
	}
	for name, r := range reps {
		t.Run(name, func(t *testing.T) {
			var one, many bytes.Buffer
			if err := writeJSONWorkers(&one, r, fxRun, 1); err != nil {
				t.Fatal(err)
			}
			if err := writeJSONWorkers(&many, r, fxRun, 3); err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(one.Bytes(), many.Bytes()) {
				t.Fatalf("3 workers wrote %d bytes, one %d: the outputs differ", many.Len(), one.Len())
			}
			if traced := bytes.Count(one.Bytes(), []byte(`"trace":[{`)); name != "none" && traced < 200 {
				t.Fatalf("%d elements with a trace", traced)
			}
			if err := schema.ValidateReport(many.Bytes()); err != nil {
				t.Fatal(err)
			}
		})
	}
}

// TestNumberCache writes numbers that repeat, collide and come in both
// formats through one writer: every text equals a fresh formatting.
func TestNumberCache(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 2))
	pool := make([]float64, 3000) // more values than slots: collisions
	for i := range pool {
		pool[i] = rng.NormFloat64() * math.Pow(10, float64(rng.IntN(12)-4))
	}
	pool = append(pool, 0, math.NaN(), math.Inf(1), 42, -7.5, 1e300, 5e-324)
	var j jsonWriter
	for range 20000 {
		v := pool[rng.IntN(len(pool))]
		j.buf = j.buf[:0]
		if rng.IntN(2) == 0 {
			j.comma = false
			j.num(v)
			if want := string(appendJSONFloat(nil, v)); string(j.buf) != want {
				t.Fatalf("%v: %s, want %s", v, j.buf, want)
			}
		} else {
			if got, want := string(j.traceNumber(nil, v)), string(appendJSONFloat6(nil, v)); got != want {
				t.Fatalf("trace %v: %s, want %s", v, got, want)
			}
		}
	}
}

func TestWriteJSONRejects(t *testing.T) {
	dup := fxReport(false)
	dup.Elements[3].Member = dup.Elements[1].Member
	empty := fxReport(false)
	m := *empty.Elements[2].Member
	m.GlobalID = ""
	empty.Elements[2].Member = &m
	nilm := fxReport(false)
	nilm.Elements[0].Member = nil
	for _, tc := range []struct {
		name string
		r    *checks.Report
		want string
	}{
		{"duplicate", dup, `reports: GlobalId "1hL2Wb0aL9$Qm8sZkT4p02" of element 3 (#245) repeats element 1`},
		{"empty", empty, `reports: element 2 (#280 "C3") has no GlobalId`},
		{"nil member", nilm, `reports: element 0 has no member`},
	} {
		t.Run(tc.name, func(t *testing.T) {
			var buf bytes.Buffer
			err := WriteJSON(&buf, tc.r, fxRun)
			if err == nil || err.Error() != tc.want {
				t.Fatalf("err = %v, want %s", err, tc.want)
			}
			if buf.Len() != 0 {
				t.Errorf("wrote %d bytes before failing", buf.Len())
			}
		})
	}
}

type failWriter struct{ n int }

var errDiskFull = errors.New("disk full")

func (f *failWriter) Write(p []byte) (int, error) {
	f.n++
	return 0, errDiskFull
}

func TestWriteJSONWriteError(t *testing.T) {
	fw := &failWriter{}
	if err := WriteJSON(fw, benchReport(2000, 2), fxRun); !errors.Is(err, errDiskFull) {
		t.Fatalf("err = %v, want %v", err, errDiskFull)
	}
	if fw.n != 1 {
		t.Errorf("%d writes after the first error, want none", fw.n-1)
	}
}

// chunkWriter records the size of each write.
type chunkWriter struct {
	bytes.Buffer
	max, writes int
}

func (c *chunkWriter) Write(p []byte) (int, error) {
	c.writes++
	c.max = max(c.max, len(p))
	return c.Buffer.Write(p)
}

func TestWriteJSONStreams(t *testing.T) {
	var cw chunkWriter
	if err := WriteJSON(&cw, benchReport(5000, 2), fxRun); err != nil {
		t.Fatal(err)
	}
	if cw.writes < cw.Len()/(2*flushAt) {
		t.Errorf("%d writes for %d bytes: not streamed", cw.writes, cw.Len())
	}
	if cw.max > 2*flushAt {
		t.Errorf("largest write %d bytes, want at most %d", cw.max, 2*flushAt)
	}
	if err := schema.ValidateReport(cw.Bytes()); err != nil {
		t.Fatal(err)
	}
}
