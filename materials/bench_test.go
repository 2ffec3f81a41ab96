package materials

import "testing"

// BenchmarkLookup measures a forgiving hit (the catalogue is rebuilt on
// every call, by design: no package-level state).
func BenchmarkLookup(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Lookup("Concrete_C25-30"); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkLookupMiss measures a miss, which ranks every entry by edit distance.
func BenchmarkLookupMiss(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Lookup("steel S275"); err == nil {
			b.Fatal("want a miss")
		}
	}
}
