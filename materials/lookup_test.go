package materials

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestLookupForgiving(t *testing.T) {
	tests := []struct {
		query, want string
	}{
		{"concrete C25/30", "concrete C25/30"},
		{"Concrete_C25-30", "concrete C25/30"},
		{"CONCRETE C25 30", "concrete C25/30"},
		{"concrete-c25/30", "concrete C25/30"},
		{"C25/30", "concrete C25/30"},
		{"sand dry", "sand dry"},
		{"dry sand", "sand dry"},
		{"Sand_Dry", "sand dry"},
		{"epoxy granite", "epoxy granite"},
		{"epoxy-granite", "epoxy granite"},
		{"mineral casting", "epoxy granite"},
		{"polymer concrete", "epoxy granite"},
		{"granite", "granite"},
		{"steel S235", "steel S235"},
		{"s235", "steel S235"},
		{"S 355", "steel S355"},
		{"steel a500 grade b", "steel A500 Gr B"},
		{"A500GrC", "steel A500 Gr C"},
		{"aluminum 6061-T6", "aluminium 6061-T6"},
		{"6061 T6", "aluminium 6061-T6"},
		{"6063_t5", "aluminium 6063-T5"},
		{"Cast Iron Class 30", "cast iron class 30"},
		{"class 60", "cast iron class 60"},
		{"grey cast iron", "cast iron class 30"},
		{"65-45-12", "ductile iron 65-45-12"},
		{"stainless 316", "stainless 316"},
		{"Douglas fir larch", "timber Douglas fir-larch No.2"},
		{"SPF", "timber spruce-pine-fir No.2"},
		{"DF-L", "timber Douglas fir-larch No.2"},
		{"SYP", "timber southern pine No.2"},
		{"white oak", "timber white oak"},
		{"lvl", "LVL 2.0E"},
		{"glulam", "glulam 24F-1.8E"},
		{"neoprene pad", "pad neoprene"},
		{"  Pad   Natural   Rubber  ", "pad natural rubber"},
	}
	for _, tc := range tests {
		t.Run(tc.query, func(t *testing.T) {
			m, err := Lookup(tc.query)
			require.NoError(t, err)
			assert.Equal(t, tc.want, m.Name)
		})
	}
}

func TestLookupMisses(t *testing.T) {
	tests := []struct {
		query   string
		mention []string // names the error must suggest
	}{
		{"S235JR", []string{`"steel S235"`}},
		{"steel S275", []string{`"steel S235"`}},
		{"concrete C25/35", []string{`"concrete C25/30"`}},
		{"alumnium 6061-T6", []string{`"aluminium 6061-T6"`}},
		{"cast iorn class 40", []string{`"cast iron class 40"`}},
		{"epoxy granit", []string{`"epoxy granite"`}},
		{"stainles 304", []string{`"stainless 304"`}},
	}
	for _, tc := range tests {
		t.Run(tc.query, func(t *testing.T) {
			_, err := Lookup(tc.query)
			require.Error(t, err)
			msg := err.Error()
			assert.True(t, strings.HasPrefix(msg, "materials: "), msg)
			assert.Contains(t, msg, tc.query, "names what was asked for")
			assert.Contains(t, msg, "closest:")
			for _, s := range tc.mention {
				assert.Contains(t, msg, s)
			}
		})
	}
}

func TestLookupAmbiguousAndEmpty(t *testing.T) {
	_, err := Lookup("concrete")
	require.Error(t, err)
	assert.Contains(t, err.Error(), "several")
	assert.Contains(t, err.Error(), `"concrete C20/25"`)
	assert.Contains(t, err.Error(), `"concrete C40/50"`)

	// "grout" alone fits three products; the error lists them.
	_, err = Lookup("grout")
	require.Error(t, err)
	assert.Contains(t, err.Error(), `"grout epoxy"`)

	_, err = Lookup("timber oak")
	require.Error(t, err)
	assert.Contains(t, err.Error(), `"timber white oak"`)
	assert.Contains(t, err.Error(), `"timber red oak"`)

	for _, q := range []string{"", "  ", "-/_"} {
		_, err = Lookup(q)
		assert.ErrorContains(t, err, "materials: empty material name", "%q", q)
	}
}

func TestEditDistance(t *testing.T) {
	// Levenshtein distances, worked by hand (and the classic textbook pair
	// kitten → sitting = 3).
	tests := []struct {
		a, b string
		d    int
	}{
		{"kitten", "sitting", 3}, {"", "abc", 3}, {"abc", "", 3}, {"same", "same", 0},
		{"flaw", "lawn", 2}, {"s235", "s355", 2}, {"granit", "granite", 1},
	}
	for _, tc := range tests {
		t.Run(tc.a+"→"+tc.b, func(t *testing.T) {
			assert.Equal(t, tc.d, EditDistance(tc.a, tc.b))
			assert.Equal(t, tc.d, EditDistance(tc.b, tc.a), "symmetric")
		})
	}
}
