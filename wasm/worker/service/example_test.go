package service_test

import (
	"fmt"

	"gibbsheet/wasm/worker/service"
)

func ExampleID() {
	doc := []byte(`{"format": "gibbsheet-worksheet/1"}`)
	fmt.Println(service.ID(doc), service.ValidID(service.ID(doc)))
	// Output: BT8VWgF5mD-NRClL_Rs8kQ true
}

func ExampleMarkPage() {
	page, _ := service.MarkPage([]byte("<!doctype html><html><head><title>Gibbsheet</title></head></html>"))
	fmt.Println(string(page))
	// Output: <!doctype html><html><head><meta name="gibbsheet-service" content="/v1/worksheets"><title>Gibbsheet</title></head></html>
}
