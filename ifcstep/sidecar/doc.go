// Package sidecar reads design actions given beside an IFC model (design
// §4.3), for analysis programs that do not write results into IFC. Rows are
// keyed by IFC GlobalId, one per member and load combination.
//
// # CSV
//
// A header row names the columns (case-insensitive, in any order); the units
// are fixed by the names:
//
//	global_id,combination,axial_compression_kN,m_major_start_kNm,m_major_end_kNm,m_minor_start_kNm,m_minor_end_kNm
//	2Xq7cKs1b0vQ8sP3a1c9dQ,ULS-1,620,-12,25,3,6
//
// Optional columns:
//
//	theory            first-order (default when empty) or second-order
//	m_major_peak_kNm  the largest |M| along the member about the major axis,
//	m_minor_peak_kNm  when the analysis knows it (for a load between the ends)
//
// Compression is positive. Moments are internal bending moments at the
// member's start (bottom) and end (top): the same sign at both ends is single
// curvature. Lines starting with '#' are comments; blank lines are skipped; a
// UTF-8 byte order mark is accepted. Every required cell must hold a number.
//
// # JSON
//
// An object with an "actions" array (or the array alone), each element an
// object with the CSV column names as keys:
//
//	{
//	  "combinations": ["ULS-1", "ULS-2"],
//	  "actions": [
//	    {"global_id": "2Xq7cKs1b0vQ8sP3a1c9dQ", "combination": "ULS-1",
//	     "axial_compression_kN": 620, "m_major_start_kNm": -12, "m_major_end_kNm": 25,
//	     "m_minor_start_kNm": 3, "m_minor_end_kNm": 6, "theory": "first-order"}
//	  ]
//	}
//
// The optional "combinations" array fixes the order of the combinations and
// may name combinations that have no rows (every member is then missing
// actions for them); without it the order is that of first appearance. Unknown
// keys are errors, so that a misspelt unit is never silently dropped.
//
// # Combinations
//
// The set of combinations is every name in the file. A member with no row
// for one of them has no actions for it (the extraction reports
// missing-actions); a GlobalId that is not in the model is reported, not
// ignored. The same GlobalId and combination twice is an error.
//
// # Storey rows (optional file, storeys.go)
//
// The storey shear and first-order drift of a storey, per global direction
// and combination, feed the drift forms of the storey buckling load factor:
// AS 4100 4.4.2.3(a)(i), EN 1993-1-1 5.2.1(4)B (alpha_cr =
// (H_Ed/V_Ed)(h/δ_H,Ed)) and AISC 360 A-8-7 (P_e,story = R_M H L/Δ_H). They
// are a file of their own beside the actions (ParseStoreys, ReadStoreys,
// ReadStoreysFile), CSV with a header row:
//
//	storey,direction,combination,storey_shear_kN,storey_drift_mm,storey_height_mm
//	Level 1,Y,ULS-2,112,50,4000
//
// or JSON, an object with a "storeys" array (or the array alone) of objects
// with the same keys. storey is the IfcBuildingStorey's Name (or give
// storey_key, the storey's instance reference such as "#38", when names
// repeat); direction is X or Y, the global direction of the shear and drift;
// the shear is the total design horizontal storey shear that produced the
// drift, positive (for EN 1993 including the equivalent imperfection forces); the drift is the inter-storey drift in that direction (≥
// 0); storey_height_mm is positive. The optional vertical_load_kN is the
// storey's total design vertical load; without it the sum of the columns'
// compression is used. A storey, direction and combination with no row takes
// lambda_c from the storey sums of its columns (design §5.3). The same storey, direction and
// combination twice is an error; unknown columns and keys are errors.
//
// # Errors
//
// Every error is a *Error with the file name and the line (and, for CSV, the
// column) of the fault: "actions.csv:12:3: ...".
package sidecar
