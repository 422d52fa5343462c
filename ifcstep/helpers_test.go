package ifcstep

import "testing"

// headerLines is the number of lines before the data of doc.
const headerLines = 7

// doc wraps data statements in a minimal IFC4 file.
func doc(data string) string {
	return docSchema("IFC4", data)
}

func docSchema(schema, data string) string {
	return "ISO-10303-21;\n" +
		"HEADER;\n" +
		"FILE_DESCRIPTION(('ViewDefinition [CoordinationView]'),'2;1');\n" +
		"FILE_NAME('t.ifc','2024-01-01T00:00:00',('a'),('o'),'p','s','z');\n" +
		"FILE_SCHEMA(('" + schema + "'));\n" +
		"ENDSEC;\n" +
		"DATA;\n" +
		data +
		"ENDSEC;\n" +
		"END-ISO-10303-21;\n"
}

func mustParse(t testing.TB, src string) *File {
	t.Helper()
	f, err := Parse([]byte(src), "t.ifc", Options{Workers: 1})
	if err != nil {
		t.Fatalf("Parse: %v", err)
	}
	return f
}

// attr0 parses "#1=X(<value>);" and returns the value.
func attr0(t testing.TB, value string) Value {
	t.Helper()
	f := mustParse(t, doc("#1=X("+value+");\n"))
	in, ok := f.Get(1)
	if !ok {
		t.Fatal("no #1")
	}
	vs, err := in.Attrs()
	if err != nil {
		t.Fatalf("Attrs: %v", err)
	}
	if len(vs) != 1 {
		t.Fatalf("got %d attributes, want 1", len(vs))
	}
	return vs[0]
}
