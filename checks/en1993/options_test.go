package en1993_test

import "swaygate/checks"

// stabilityOptions are the default options with scope stability: the tests of
// the amplification provisions alone. (The product default is scope full,
// which adds the member capacity checks; their tests set it explicitly.)
func stabilityOptions() checks.Options {
	opt := checks.DefaultOptions()
	opt.Scope = "stability"
	return opt
}
