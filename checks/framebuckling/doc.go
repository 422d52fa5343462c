// Package framebuckling connects the elastic buckling analysis of the
// analytical frame (checks/frame) to the checks engine: it builds the load
// combinations of the frame from the members' actions and the analysis
// results, runs the analysis, and provides
//
//   - the frame sway method (--sway-method frame): a checks.SwayProvider
//     whose lambda_c of every sway and leaning axis of a member idealised in
//     the frame is the frame's lowest buckling load factor of the
//     combination (AS 4100 4.7.2 rational buckling analysis, EN 1993-1-1
//     5.2.1 alpha_cr = F_cr/F_Ed, AISC 360 App. 8 sidesway buckling
//     analysis); members outside the frame fall back to the storey method
//     with the informational reason frame-fallback;
//   - effective length factors from the frame (--ke-from): the end-restraint
//     ratios γ (AS 4100 4.6.3.3) / G (AISC Commentary App. 7) of each column
//     end from the members rigidly connected there in the plane of buckling,
//     solved with the alignment-chart equations (checks/effective), or the
//     factor implied by the buckling load factor, K = π·sqrt(EI/(λ·N*))/L;
//   - the report's frame section (checks.FrameResult): lambda_c and the
//     buckled shape of each combination.
//
// The package knows no IFC: a reader fills Input.
//
// # Idealisation
//
// Floors are taken as rigid diaphragms when Options.Diaphragms is set, and
// surface members (Input.Planes) as rigid in their plane: the nodes of each
// group are tied by stiff pin-ended links in the plane (axial stiffness 1000
// times the stiffest member's, no geometric stiffness), which leaves them
// free out of the plane and in rotation. Members carry a constant axial
// force per combination: the member's own result where the reader found
// one, else the design compression of the checked column it idealises,
// else 0 (counted in the notes).
package framebuckling
