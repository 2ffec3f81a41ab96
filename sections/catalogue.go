package sections

// Kind is one shape keyword of the spec syntax, for listings.
type Kind struct {
	Name        string // the keyword, e.g. "rect-tube"
	Description string // one line: what it is and what the sizes mean
	Example     string // a spec that parses
}

// List returns the shape keywords with a one-line description and an
// example spec each, in a fixed order (solid bars, tubes, open shapes,
// timber and masonry, composites, general).
func List() []Kind {
	ks := kinds()
	out := make([]Kind, len(ks))
	for i, k := range ks {
		out[i] = Kind{Name: k.name, Description: k.desc, Example: k.example}
	}
	return out
}
