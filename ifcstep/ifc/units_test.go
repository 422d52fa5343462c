package ifc

import (
	"strings"
	"testing"

	"swaygate/ifcstep"
)

// unitModel is a minimal IFC4 file with the given unit instances (ids from
// #10) and assignment.
func unitModel(t *testing.T, units string, assigned string) *extractor {
	t.Helper()
	src := "ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION((''),'2;1');\nFILE_NAME('u.ifc','',(''),(''),'','','');\nFILE_SCHEMA(('IFC4'));\nENDSEC;\nDATA;\n" +
		units + "\n#1=IFCUNITASSIGNMENT((" + assigned + "));\n#2=IFCPROJECT('0000000000000000000001',$,'P',$,$,$,$,$,#1);\nENDSEC;\nEND-ISO-10303-21;\n"
	f, err := ifcstep.Parse([]byte(src), "u.ifc", ifcstep.Options{})
	if err != nil {
		t.Fatal(err)
	}
	x := newExtractor(f, Options{})
	x.readUnits()
	return x
}

func TestUnits(t *testing.T) {
	const (
		si = `#10=IFCSIUNIT(*,.LENGTHUNIT.,.MILLI.,.METRE.);
#11=IFCSIUNIT(*,.FORCEUNIT.,.KILO.,.NEWTON.);
#12=IFCSIUNIT(*,.LENGTHUNIT.,$,.METRE.);
#13=IFCDERIVEDUNITELEMENT(#11,1);
#14=IFCDERIVEDUNITELEMENT(#12,1);
#15=IFCDERIVEDUNIT((#13,#14),.TORQUEUNIT.,$);
#16=IFCSIUNIT(*,.PRESSUREUNIT.,.MEGA.,.PASCAL.);
#17=IFCSIUNIT(*,.AREAUNIT.,.MILLI.,.SQUARE_METRE.);
#18=IFCDERIVEDUNITELEMENT(#10,4);
#19=IFCDERIVEDUNIT((#18),.MOMENTOFINERTIAUNIT.,$);
#20=IFCSIUNIT(*,.PLANEANGLEUNIT.,$,.RADIAN.);
#21=IFCMEASUREWITHUNIT(IFCPLANEANGLEMEASURE(0.0174532925199433),#20);
#22=IFCDIMENSIONALEXPONENTS(0,0,0,0,0,0,0);
#23=IFCCONVERSIONBASEDUNIT(#22,.PLANEANGLEUNIT.,'degree',#21);`
		imperial = `#10=IFCSIUNIT(*,.LENGTHUNIT.,$,.METRE.);
#11=IFCMEASUREWITHUNIT(IFCLENGTHMEASURE(0.3048),#10);
#12=IFCCONVERSIONBASEDUNIT(#13,.LENGTHUNIT.,'foot',#11);
#13=IFCDIMENSIONALEXPONENTS(1,0,0,0,0,0,0);
#14=IFCSIUNIT(*,.FORCEUNIT.,$,.NEWTON.);
#15=IFCMEASUREWITHUNIT(IFCMASSMEASURE(4.44822162),#14);
#16=IFCCONVERSIONBASEDUNIT(#17,.FORCEUNIT.,'pound-force',#15);
#17=IFCDIMENSIONALEXPONENTS(1,1,-2,0,0,0,0);
#18=IFCSIUNIT(*,.PRESSUREUNIT.,$,.PASCAL.);
#19=IFCMEASUREWITHUNIT(IFCPRESSUREMEASURE(6894.7572932),#18);
#20=IFCCONVERSIONBASEDUNIT(#21,.PRESSUREUNIT.,'pound-force per square inch',#19);
#21=IFCDIMENSIONALEXPONENTS(-1,1,-2,0,0,0,0);
#22=IFCDERIVEDUNITELEMENT(#20,1);
#23=IFCDERIVEDUNIT((#22),.MODULUSOFELASTICITYUNIT.,$);
#24=IFCDERIVEDUNITELEMENT(#16,1);
#25=IFCDERIVEDUNITELEMENT(#12,1);
#26=IFCDERIVEDUNIT((#24,#25),.TORQUEUNIT.,$);`
	)
	tests := []struct {
		name        string
		units, list string
		want        map[quantity]float64 // factor to the internal unit
		assumes     string               // a word every assumption must contain ("" none)
	}{
		// source: SI prefixes (IfcSIPrefix): MILLI 1e-3, KILO 1e3, MEGA 1e6; a kN·m is 1e6 N·mm
		{"SI with prefixes", si, "#10,#11,#15,#16,#17,#19,#23", map[quantity]float64{
			qLength: 1, qForce: 1e3, qTorque: 1e6, qPressure: 1, qArea: 1, qInertia: 1, qAngle: 0.0174532925199433}, ""},
		// source: the conversion factors written in the model (foot 0.3048 m, pound-force 4.44822162 N, psi 6894.7572932 Pa)
		{"imperial", imperial, "#12,#16,#20,#23,#26", map[quantity]float64{
			qLength: 304.8, qForce: 4.44822162, qPressure: 6894.7572932e-6, qModulus: 6894.7572932e-6, qTorque: 4.44822162 * 304.8}, ""},
		// No assignment: SI units, recorded when used.
		{"nothing assigned", si, "#20", map[quantity]float64{qLength: 1e3, qForce: 1, qTorque: 1e3, qPressure: 1e-6}, "SI"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			x := unitModel(t, tc.units, tc.list)
			for q, want := range tc.want {
				if got := x.factor(q); !within(got, want, 1e-12) {
					t.Errorf("%s: factor %g, want %g", quantityInfo[q].unitType, got, want)
				}
			}
			if tc.assumes == "" && len(x.model.Assumptions) > 0 {
				t.Errorf("assumptions %q", x.model.Assumptions)
			}
			if tc.assumes != "" && (len(x.model.Assumptions) == 0 || !strings.Contains(x.model.Assumptions[0], tc.assumes)) {
				t.Errorf("assumptions %q", x.model.Assumptions)
			}
		})
	}
}

func TestUnitWithWrongDimensions(t *testing.T) {
	// A modulus unit built from a mass (pound per square inch), as the
	// buildingSMART structural sample writes it: refused, SI used, warned.
	x := unitModel(t, `#10=IFCSIUNIT(*,.MASSUNIT.,.KILO.,.GRAM.);
#11=IFCMEASUREWITHUNIT(IFCMASSMEASURE(0.45359237),#10);
#12=IFCCONVERSIONBASEDUNIT(#13,.MASSUNIT.,'pound',#11);
#13=IFCDIMENSIONALEXPONENTS(0,1,0,0,0,0,0);
#14=IFCSIUNIT(*,.AREAUNIT.,$,.SQUARE_METRE.);
#15=IFCDERIVEDUNITELEMENT(#12,1);
#16=IFCDERIVEDUNITELEMENT(#14,-1);
#17=IFCDERIVEDUNIT((#15,#16),.MODULUSOFELASTICITYUNIT.,$);`, "#17")
	if x.factor(qModulus) != 1e-6 || len(x.model.Warnings) != 1 || x.model.Warnings[0].Code != "unit-dimensions" {
		t.Errorf("factor %g, warnings %+v", x.factor(qModulus), x.model.Warnings)
	}
}
