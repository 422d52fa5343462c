package ifcstep_test

import (
	"fmt"

	"swaygate/ifcstep"
)

func Example() {
	src := `ISO-10303-21;
HEADER;
FILE_DESCRIPTION(('ViewDefinition [DesignTransferView]'),'2;1');
FILE_NAME('example.ifc','2026-01-01T00:00:00',('a'),('b'),'c','d','e');
FILE_SCHEMA(('IFC4'));
ENDSEC;
DATA;
#1=IFCMATERIAL('S355',$,'Steel');
#2=IFCPROPERTYSINGLEVALUE('Note',$,IFCTEXT('Grundst\X2\00FC\X0\ck N\S\0 12'),$);
#3=IFCPROPERTYSINGLEVALUE('EffectiveLengthFactorMajor',$,IFCPOSITIVERATIOMEASURE(1.2),$);
ENDSEC;
END-ISO-10303-21;
`
	f, err := ifcstep.Parse([]byte(src), "example.ifc", ifcstep.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(f.Family, f.Len())
	for _, in := range f.ByType("IFCPROPERTYSINGLEVALUE") {
		name, _ := in.Attr(0).Text()
		v := in.Attr(2)
		typ, _, _ := v.Typed()
		if x, ok := v.Real(); ok {
			fmt.Println(name, typ, x)
		} else if s, err := v.Text(); err == nil {
			fmt.Println(name, typ, s)
		}
	}
	// Output:
	// IFC4 3
	// Note IFCTEXT Grundstück N° 12
	// EffectiveLengthFactorMajor IFCPOSITIVERATIOMEASURE 1.2
}

func ExampleError() {
	src := "ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION((''),'2;1');\nFILE_NAME('','',(''),(''),'','','');\n" +
		"FILE_SCHEMA(('IFC4'));\nENDSEC;\nDATA;\n#1=IFCX(1);\n#1=IFCY(2);\nENDSEC;\nEND-ISO-10303-21;\n"
	_, err := ifcstep.Parse([]byte(src), "dup.ifc", ifcstep.Options{})
	fmt.Println(err)
	// Output:
	// dup.ifc: line 9, column 1 (byte 138, #1): duplicate instance #1 (first defined at line 8)
}
