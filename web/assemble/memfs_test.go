package assemble_test

import (
	"testing"
	"testing/fstest"
)

// memFS is an in-memory folder "js" holding the given files.
func memFS(t *testing.T, files map[string]string) fstest.MapFS {
	t.Helper()
	m := fstest.MapFS{}
	for name, src := range files {
		m["js/"+name] = &fstest.MapFile{Data: []byte(src)}
	}
	return m
}
