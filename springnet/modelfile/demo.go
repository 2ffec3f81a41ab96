package modelfile

import _ "embed"

//go:embed demo/lathe-stand.toml
var demo []byte

// Demo returns the text of a demo model file: a welded steel stand for a
// small lathe (four square-tube legs, stretchers, one braced face, a
// rigid top with headstock and tailstock mounts, compression-only
// levelling feet, the machine's mass with its centre offset, a cutting
// case, a weight case and running speeds). It is invented for the
// documentation and is not a design. Each call returns a new copy.
func Demo() []byte { return append([]byte(nil), demo...) }
