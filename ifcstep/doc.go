// Package ifcstep reads STEP physical files (ISO 10303-21) as IFC models
// use them: the header, one data section and the instances in it.
//
// It knows no IFC semantics beyond the header: it detects the schema family
// from FILE_SCHEMA (IFC2X3, IFC4, IFC4X3) and leaves entities, attribute
// positions and units to the packages built on it.
//
// # Indexing
//
// Parse (or ReadFile, Read) makes one pass over the whole file held in
// memory and builds a compact index of every instance "#N = TYPE(...);": its
// id, byte offset and interned type name, stored as parallel arrays. The
// pass checks the syntax at the statement level (balanced lists, terminated
// strings and comments, unique ids, limits) without decoding values; large
// files are indexed in parallel over chunks split at statement boundaries.
//
//	f, err := ifcstep.ReadFile("model.ifc", ifcstep.Options{})
//	if err != nil {
//		return err // an *ifcstep.Error: "model.ifc: line 12, column 5 (byte 301, #7): ..."
//	}
//	for _, col := range f.ByType("IFCCOLUMN") {
//		name, _ := col.Attr(2).Text()
//		...
//	}
//
// # Values
//
// Attribute values are decoded lazily, when an Instance's Attrs or Attr is
// called. A Value is a small value type that refers to its bytes in the
// file; its accessors (Ref, Int, Real, Bool, Enum, Text, List, Typed,
// Binary) decode on each call. Typed values such as IFCLENGTHMEASURE(2.5)
// are unwrapped by the scalar accessors.
//
// Strings are decoded per literal: doubled apostrophes, \\, the directives \S\, \P?\,
// \X\hh, \X2\...\X0\ and \X4\...\X0\, raw UTF-8 with an ISO 8859-1 fallback.
// A malformed directive spoils only its own string: Text returns the text as
// written with a *StringError and records a warning.
//
// # Errors and warnings
//
// Fatal errors are *Error values with a kind and a position, rendered as
//
//	FILE: line N, column M (byte B, #id): message
//
// Findings that do not stop reading (a dangling reference met by Deref, a
// malformed string, a complex instance, a schema read as a related family)
// are Warnings, kept by the File in the order found.
//
// # Limits
//
// Limits bound the file size, list nesting, string length and instance
// count; the defaults suit real building models. No input makes the package
// panic, and memory and time stay proportional to the file size.
package ifcstep
