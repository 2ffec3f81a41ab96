// Package draw makes pictures of a stand: SVG and PNG drawings of a
// network of nodes and members in three orthographic views (front, side,
// top) and an isometric, with a displaced shape (a load case's deflection
// or a mode shape) drawn magnified over the unloaded outline, members
// coloured by a value per member (utilisation, strain-energy share) on a
// colour scale with a legend, rigid groups (a machine bed, a top plate)
// shaded, and feet, supports and mounts marked and named.
//
// # Input
//
// A Scene holds plain geometry, not an analysis: node positions and their
// displacements, members as pairs of node indices with a value each,
// rigid groups as lists of node indices, and mount points. FromModel fills the geometry of a springnet.Model; the
// caller adds the displacements and values it wants shown (see the
// trestle command for an example).
//
// # Units, axes
//
// Positions and displacements are in metres, in the model's global axes
// with Z up. The front view looks along +Y (X to the right, Z up), the side
// view looks along −X (Y to the right, Z up), the top view looks down
// (X to the right, Y up), and the isometric looks from the front right
// above, along (−1, 1, −1). The orthographic views share one scale.
//
// Displacements are drawn multiplied by Scene.Scale; zero means automatic:
// the largest displacement is drawn as AutoFraction of the stand's
// largest dimension. The legend states the factor used.
//
// # Colours
//
// The colour scale is trestle's own: blue (0) through teal, green and
// amber to red at Colours.Max, purple above it, grey for members without
// a value. See Colour.
//
// # Output
//
// SVG writes a standalone SVG 1.1 document: every member is a <line> with
// class "member" and data-member naming it, one per view; PNG renders the
// same drawing at 96 dpi. Both fail only on an invalid Scene (Validate)
// or when the writer does. Errors start with "draw:".
package draw
