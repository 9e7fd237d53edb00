package thermo

import (
	"testing"
)

func BenchmarkReactantDfG0Prime(b *testing.B) {
	c := Conditions{PH: 7, IonicStrength: 0.25, PMg: 3, Temperature: 310.15}
	for b.Loop() {
		if _, err := ReactantDfG0Prime(atp, c); err != nil {
			b.Fatal(err)
		}
	}
}
