// Command gencompounds writes builtin_data.go of package compounds from data/compounds.json. Run it
// with go generate ./engine/compounds after editing the data.
package main

import (
	"log"
	"os"

	"gibbsheet/engine/compounds/internal/gen"
)

func main() {
	log.SetFlags(0)
	log.SetPrefix("gencompounds: ")
	data, err := os.ReadFile("data/compounds.json")
	if err != nil {
		log.Fatal(err)
	}
	src, err := gen.Generate(data)
	if err != nil {
		log.Fatal(err)
	}
	if err := os.WriteFile("builtin_data.go", src, 0o644); err != nil {
		log.Fatal(err)
	}
}
