package assemble

// Bundle exposes bundle to the external tests.
var Bundle = bundle
