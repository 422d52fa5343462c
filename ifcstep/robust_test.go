package ifcstep

import (
	"errors"
	"math/rand/v2"
	"os"
	"strings"
	"testing"
)

// sameIndex reports how two parses of the same data differ ("" if not).
func sameIndex(a, b *File) string {
	if a.Len() != b.Len() {
		return "Len " + itoa(a.Len()) + " vs " + itoa(b.Len())
	}
	for s := 0; s < a.Len(); s++ {
		x, y := Instance{f: a, s: uint32(s)}, Instance{f: b, s: uint32(s)}
		if x.ID() != y.ID() || x.Offset() != y.Offset() || x.Type() != y.Type() || x.Complex() != y.Complex() {
			return "slot " + itoa(s) + ": " + x.String() + " vs " + y.String()
		}
	}
	return ""
}

// parseBoth parses data serially and in small parallel chunks and checks
// that both agree; it returns the serial result.
func parseBoth(t testing.TB, data []byte, chunk int) (*File, error) {
	t.Helper()
	f1, err1 := Parse(data, "t.ifc", Options{Workers: 1})
	f2, err2 := Parse(data, "t.ifc", Options{Workers: 3, chunkSize: chunk})
	switch {
	case (err1 == nil) != (err2 == nil):
		t.Fatalf("serial: %v\nchunked: %v", err1, err2)
	case err1 != nil:
		if err1.Error() != err2.Error() {
			t.Fatalf("serial: %v\nchunked: %v", err1, err2)
		}
	default:
		if d := sameIndex(f1, f2); d != "" {
			t.Fatalf("serial and chunked differ: %s", d)
		}
	}
	return f1, err1
}

// A data section whose strings and comments look like statement boundaries:
// the chunk starts guessed inside them must be rejected and skimmed again.
func trickyDoc() string { return trickyDocN(400) }

func trickyDocN(count int) string {
	var b strings.Builder
	for i := 1; i <= count; i++ {
		n := itoa(i)
		switch i % 4 {
		case 0:
			b.WriteString("#" + n + "=IFCLABEL('text;\n#9" + n + "=IFCFAKE(1);\n''still a string''');\n")
		case 1:
			b.WriteString("/* comment ;\n#8" + n + "= IFCFAKE(2); */\n#" + n + " = IFCX((1.,2.),$,'a;b',#1);\n")
		case 2:
			b.WriteString("#" + n + "=IFCY(IFCTEXT('x;\r\n#7" + n + "=Z(') , \"0FF\" , .T.);\r\n")
		default:
			b.WriteString("#" + n + "=(IFCA(1)IFCB('c;#6" + n + "=D(1);'));\n")
		}
	}
	return doc(b.String())
}

func TestChunksAgree(t *testing.T) {
	src := []byte(trickyDoc())
	for _, chunk := range []int{7, 64, 300, 1000, 5000} {
		f, err := parseBoth(t, src, chunk)
		if err != nil {
			t.Fatal(err)
		}
		if f.Len() != 400 {
			t.Fatalf("Len = %d", f.Len())
		}
		g, _ := Parse(src, "t.ifc", Options{Workers: 3, chunkSize: chunk})
		if chunk == 300 && g.relexed == 0 {
			t.Errorf("chunk %d: no chunk was skimmed again; the test does not exercise mismatches", chunk)
		}
	}
	for _, rel := range []string{"ifc4/beam_01.ifc", "ifc4x3/tessellation-with-pixel-texture.ifc", "ifc2x3/example.ifc"} {
		data, err := os.ReadFile(sample(t, rel))
		if err != nil {
			t.Fatal(err)
		}
		for _, chunk := range []int{100, 4096} {
			if _, err := parseBoth(t, data, chunk); err != nil {
				t.Fatalf("%s: %v", rel, err)
			}
		}
	}
}

// Cutting a file anywhere gives a positioned error, never a panic; cutting
// it at a statement boundary inside the data section gives ErrTruncated.
func TestTruncation(t *testing.T) {
	for _, src := range []struct{ name, data string }{
		{"tricky", trickyDocN(40)},
		{"column-extruded-solid", readSample(t, "ifc4x3/column-extruded-solid.ifc")},
		{"beam_01", readSample(t, "ifc4/beam_01.ifc")},
	} {
		t.Run(src.name, func(t *testing.T) {
			data := []byte(src.data)
			full, err := Parse(data, "t.ifc", Options{})
			if err != nil {
				t.Fatal(err)
			}
			boundaries := map[int]bool{}
			for s := 0; s < full.Len(); s++ {
				boundaries[full.offset(uint32(s))] = true // the cut ends just before an instance
			}
			end := strings.LastIndex(src.data, "END-ISO-10303-21;") + len("END-ISO-10303-21;")
			for n := 0; n < end; n++ {
				_, err := parseBoth(t, data[:n], 97)
				var e *Error
				if !errors.As(err, &e) {
					t.Fatalf("cut at %d: err = %v, want *Error", n, err)
				}
				if e.Pos.Offset < 0 || e.Pos.Offset > n || e.Pos.Line < 1 || e.Pos.Column < 1 {
					t.Fatalf("cut at %d: bad position in %v", n, err)
				}
				if boundaries[n] && e.Kind != ErrTruncated {
					t.Fatalf("cut at statement boundary %d: %v (kind %v), want truncated", n, err, e.Kind)
				}
			}
		})
	}
}

func readSample(t testing.TB, rel string) string {
	data, err := os.ReadFile(sample(t, rel))
	if err != nil {
		t.Fatal(err)
	}
	return string(data)
}

// Flipping bytes never panics; whatever parses decodes without panicking.
func TestByteFlips(t *testing.T) {
	base := []byte(trickyDoc())
	rng := rand.New(rand.NewPCG(1, 2))
	flips := []byte("'();/*#=\"$.,\\ \nX0")
	for i := 0; i < 3000; i++ {
		data := append([]byte(nil), base...)
		for k := 0; k < 1+rng.IntN(3); k++ {
			p := rng.IntN(len(data))
			if rng.IntN(2) == 0 {
				data[p] = flips[rng.IntN(len(flips))]
			} else {
				data[p] = byte(rng.IntN(256))
			}
		}
		f, err := parseBoth(t, data, 50+rng.IntN(500))
		if err == nil {
			decodeAll(t, f)
		}
	}
}

func decodeAll(t testing.TB, f *File) {
	for s := 0; s < f.Len(); s++ {
		in := Instance{f: f, s: uint32(s)}
		if in.NumAttrs() < 0 {
			t.Fatal("negative")
		}
		_ = in.Attr(1)
		_ = decodeInstance(in)
	}
	for _, typ := range f.Types() {
		_ = f.ByType(typ)
	}
	_ = f.Warnings()
}
