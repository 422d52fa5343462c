package api

import (
	"bytes"
	"compress/gzip"
	"encoding/json"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// malformed is one bad upload.
type malformed struct {
	name string
	data []byte
}

// malformedInputs generates bad models from the demo model and public
// samples by truncation, byte flips and header edits.
func malformedInputs(t *testing.T) []malformed {
	t.Helper()
	read := func(p string) []byte {
		b, err := os.ReadFile(p)
		if err != nil {
			t.Fatalf("test file: %v", err)
		}
		return b
	}
	demo := read(demoModel)
	col := read(filepath.Join(samplesDir, "ifc4x3", "column-extruded-solid.ifc"))
	ex := read(filepath.Join(samplesDir, "ifc2x3", "example.ifc"))
	var out []malformed
	add := func(name string, b []byte) { out = append(out, malformed{name, b}) }

	// Truncations.
	for _, src := range []struct {
		name string
		b    []byte
	}{{"demo", demo}, {"column", col}, {"example", ex}} {
		n := len(src.b)
		for _, cut := range []int{1, 13, n / 4, n / 2, 3 * n / 4, n - 20, n - 1} {
			add(src.name+"-truncated-"+strconv.Itoa(cut), bytes.Clone(src.b[:cut]))
		}
	}
	// Byte flips with a fixed seed.
	rng := rand.New(rand.NewPCG(5, 5))
	for _, flips := range []int{1, 8, 64, 512} {
		for _, src := range []struct {
			name string
			b    []byte
		}{{"demo", demo}, {"column", col}} {
			b := bytes.Clone(src.b)
			for range flips {
				b[rng.IntN(len(b))] ^= byte(1 + rng.IntN(255))
			}
			add(src.name+"-flipped-"+strconv.Itoa(flips), b)
		}
	}
	// Header and structure edits.
	edit := func(name string, b []byte, old, new string, n int) {
		if !bytes.Contains(b, []byte(old)) {
			t.Fatalf("%s: %q not found", name, old)
		}
		add(name, bytes.Replace(b, []byte(old), []byte(new), n))
	}
	edit("unknown-schema", demo, "FILE_SCHEMA(('IFC4'))", "FILE_SCHEMA(('IFC9X9'))", 1)
	edit("no-magic", demo, "ISO-10303-21;", "ISO-10303-22;", 1)
	edit("no-data-section", demo, "DATA;", "DAT;", 1)
	edit("no-endsec", demo, "ENDSEC;", "", -1)
	edit("no-end", demo, "END-ISO-10303-21;", "", 1)
	edit("duplicate-id", demo, "#2=", "#1=", 1)
	edit("unterminated-string", demo, "'", "", 1)
	edit("open-list", demo, ");", ",(;", 3)
	edit("header-garbage", col, "HEADER;", "HEADER;\x00\x01\x02(((((", 1)
	edit("utf16", col, "ISO-10303-21;", "\xff\xfeI\x00S\x00O\x00", 1)
	deep := append(bytes.Clone(col[:bytes.Index(col, []byte("DATA;"))+5]), []byte("\n#1=IFCX("+strings.Repeat("(", 100000)+");\n")...)
	add("deep-nesting", deep)
	huge := append(bytes.Clone(col[:bytes.Index(col, []byte("DATA;"))+5]), []byte("\n#1=IFCX('"+strings.Repeat("x", 1<<20)+"');\nENDSEC;\nEND-ISO-10303-21;\n")...)
	add("long-string", huge)
	garbage := make([]byte, 4096)
	for i := range garbage {
		garbage[i] = byte(rng.IntN(256))
	}
	add("random-bytes", garbage)
	var gz bytes.Buffer
	zw := gzip.NewWriter(&gz)
	zw.Write(demo)
	zw.Close()
	add("gzip-truncated", bytes.Clone(gz.Bytes()[:gz.Len()/2]))
	add("gzip-corrupt", append([]byte{0x1f, 0x8b}, garbage[:200]...))
	add("zip-garbage", append([]byte("PK\x03\x04"), garbage[:300]...))
	return out
}

// TestBadInput: malformed models never crash the service, never answer 5xx,
// and leave the stored runs as they were; the server still answers and
// still checks a good model afterwards.
func TestBadInput(t *testing.T) {
	ls := startLive(t, t.TempDir(), nil)
	ls.waitReady(t)
	code, good := ls.uploadFile(t, "project=bad", demoModel, "")
	if code != 201 {
		t.Fatalf("good model: %d %s", code, good)
	}
	var first struct {
		RunID string `json:"run_id"`
	}
	json.Unmarshal(good, &first)

	inputs := malformedInputs(t)
	if len(inputs) < 20 {
		t.Fatalf("only %d malformed inputs", len(inputs))
	}
	counts := map[int]int{}
	for _, in := range inputs {
		code, body := ls.post(t, "project=bad&name="+in.name+".ifc", "application/octet-stream", bytes.NewReader(in.data))
		counts[code]++
		switch code {
		case 201, 400, 413, 415, 422:
		default:
			t.Errorf("%s: status %d: %s", in.name, code, body)
		}
		if code != 201 {
			var e errorBody
			if err := json.Unmarshal(body, &e); err != nil || e.Error.Code == "" || e.Error.Message == "" {
				t.Errorf("%s: not a JSON error: %s", in.name, body)
			}
			for _, leak := range []string{"goroutine", tmpPrefix, ls.dir} {
				if strings.Contains(string(body), leak) {
					t.Errorf("%s: the response shows %q: %s", in.name, leak, body)
				}
			}
		}
		if code == 422 && (strings.Contains(in.name, "truncated") || in.name == "no-magic") {
			var e errorBody
			json.Unmarshal(body, &e)
			if e.Error.Position == nil && !strings.HasPrefix(in.name, "gzip") {
				t.Errorf("%s: 422 without a position: %s", in.name, body)
			}
		}
		if code, _ := ls.get(t, "/healthz"); code != 200 {
			t.Fatalf("after %s: healthz %d", in.name, code)
		}
	}
	t.Logf("%d malformed inputs; statuses %v", len(inputs), counts)

	// A side-car naming a GlobalId the model does not have is a warning.
	side := filepath.Join(t.TempDir(), "unknown.csv")
	os.WriteFile(side, []byte("global_id,combination,axial_compression_kN,m_major_start_kNm,m_major_end_kNm,m_minor_start_kNm,m_minor_end_kNm\n"+
		"0000000000000000000000,ULS-1,100,0,0,0,0\n"), 0o644)
	code, body := ls.uploadFile(t, "project=bad", demoModel, side)
	if code != 201 || !strings.Contains(string(body), `"unknown-global-id"`) {
		t.Errorf("side-car with an unknown GlobalId: %d %.300s", code, body)
	}
	// A malformed side-car is a 4xx with its position.
	os.WriteFile(side, []byte("global_id,combination,axial_compression_kN\nx,ULS-1,not-a-number\n"), 0o644)
	if code, body := ls.uploadFile(t, "project=bad", demoModel, side); code != 400 && code != 422 {
		t.Errorf("malformed side-car: %d %s", code, body)
	}

	// A model without columns is a stored run with an empty report and a
	// warning.
	code, body = ls.uploadFile(t, "project=bad", filepath.Join(samplesDir, "ifc4x3", "beam-extruded-solid.ifc"), "")
	var empty struct {
		Summary  map[string]int   `json:"summary"`
		Elements map[string]any   `json:"elements"`
		Warnings []map[string]any `json:"warnings"`
	}
	json.Unmarshal(body, &empty)
	if code != 201 || empty.Summary["members"] != 0 || len(empty.Elements) != 0 || len(empty.Warnings) == 0 {
		t.Errorf("model without columns: %d %.400s", code, body)
	}

	// The first run is intact and a good model still checks.
	if code, body := ls.get(t, "/v1/checks/"+first.RunID); code != 200 || !bytes.Equal(body, good) {
		t.Errorf("stored run after the battery: %d, same bytes %v", code, bytes.Equal(body, good))
	}
	if code, body := ls.uploadFile(t, "project=bad", demoModel, ""); code != 201 {
		t.Errorf("good model after the battery: %d %s", code, body)
	}
}

// TestExpandedLimit: a gzip model that expands beyond the upload limit is
// refused (422, the reader's limit); a plain one beyond it is 413.
func TestExpandedLimit(t *testing.T) {
	demo, err := os.ReadFile(demoModel)
	if err != nil {
		t.Fatal(err)
	}
	var gz bytes.Buffer
	zw := gzip.NewWriter(&gz)
	zw.Write(demo)
	zw.Close()
	limit := int64(len(demo) / 2)
	if int64(gz.Len()) >= limit {
		t.Fatalf("the compressed demo (%d bytes) is not below the limit %d", gz.Len(), limit)
	}
	ls := startLive(t, t.TempDir(), func(o *Options) { o.MaxUploadBytes = limit })
	code, body := ls.post(t, "name=demo.ifc.gz", "application/gzip", bytes.NewReader(gz.Bytes()))
	var e errorBody
	json.Unmarshal(body, &e)
	if code != 422 || e.Error.Code != "model-limit" {
		t.Errorf("expanding gzip model: %d %s", code, body)
	}
	if code, body := ls.post(t, "name=demo.ifc", "application/x-step", bytes.NewReader(demo)); code != 413 {
		t.Errorf("plain model beyond the limit: %d %s", code, body)
	}
}
