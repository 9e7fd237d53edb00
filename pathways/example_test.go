package pathways_test

import (
	"fmt"

	"gibbsheet/pathways"
)

func ExampleGet() {
	tpl, err := pathways.Get("tca-cycle.json")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(tpl.Title)
	// Output: Citric acid cycle, one turn
}
