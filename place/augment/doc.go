// Package augment adds dummy edges to a plane embedding until every
// connected component of three or more vertices is a triangulation: a
// simple plane graph whose faces are all triangles. Biconnect joins
// consecutive neighbours that lie in different blocks; TriangulateFaces
// then splits every face, from its vertex of least degree, without ever
// creating a loop or a repeated edge (the argument of G. Kant and H. L.
// Bodlaender, "Triangulating planar graphs while minimizing the maximum
// degree", Inform. and Comput. 135, 1997, in its simplest form). The input's
// rotation system is kept: new darts are only inserted between old ones.
package augment
