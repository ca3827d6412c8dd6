// Package geom is Plumb's plane geometry: points, affine maps, boundary segments (lines, elliptical
// arcs, quadratic and cubic Béziers), loops, regions under a fill rule, their boolean combination, and
// the integrals of an areal density over them: mass, first and second moments, from which come the
// centroid (balance point), the central and principal second moments and the radii of gyration.
//
// # Conventions
//
// Coordinates are in the document's length unit with y pointing up; angles are in radians, positive
// counter-clockwise. A density ρ(x, y) is mass per unit area in the same unit, so ∬ρ dA is a mass.
//
// A Boundary is oriented with the material on the left of every piece: outer outlines run
// counter-clockwise, the edges of holes clockwise. Integrals over a region are then plain sums of line
// integrals over the pieces, and moments of unions, holes and overlays combine by addition
// (Moments.Add, Moments.Sub).
//
// # Green's theorem
//
// For a region D with boundary ∂D oriented as above, Green's theorem ∬_D (∂Q/∂x − ∂P/∂y) dA = ∮_∂D P dx + Q dy
// gives, with P = 0 and Q(x, y) = ∫_ξ^x f(s, y) ds for any fixed ξ,
//
//	∬_D f dA = ∮_∂D Q(x, y) dy.
//
// For a monomial f = x^i y^j this is ∬ x^i y^j dA = ∮ x^(i+1)/(i+1) · y^j dy. On a segment P(t), t ∈ [0, 1],
// the line integral is ∫₀¹ x(t)^(i+1)/(i+1) · y(t)^j · y'(t) dt. For lines and Béziers of degree k the
// integrand is a polynomial of degree k(i+j+2) − 1 in t, so Gauss–Legendre with ⌈k(i+j+2)/2⌉ nodes
// integrates it exactly (Boundary.IntegratePoly; Boundary.IntegratePolyAbout takes the polynomial in
// coordinates about a point near the part, so that a density written about a far point is never
// expanded into terms that cancel). An arc is cut into pieces of at most 90°, and each
// piece contributes its chord (a line) plus the area integral over the segment between chord and arc,
// computed in the chord's frame from the end points and the sweep (product Gauss–Legendre with the
// order chosen for the rounding level), so that a nearly flat arc keeps its small segment exactly: the
// tests check circular segments with sweeps from 10⁻⁹ rad to nearly a full turn, a square with an edge
// of radius up to 10⁸ times its side and thin lenses against their closed forms (evaluated in 512-bit
// arithmetic) to 1e-13 of each quantity. Points inside such an arc are found in the same frame.
//
// For a general density (Boundary.Integrate) the inner integral Q is itself computed by Gauss–Legendre
// along the horizontal from the base line x = ξ, taken through the centre of the bounding box: every node
// lies in the bounding box, and no horizontal is longer than half its width, so that a rule of a given
// order integrates a density that changes along the rows about 2^(2n+1) times more closely than from
// the box's left edge (the Gauss–Legendre error grows as the (2n+1)th power of the length). This is the Gauss–Green product cubature of A. Sommariva and M. Vianello,
// "Product Gauss cubature over polygons based on Green's integration formula", BIT Numerical Mathematics
// 47 (2007) 441–453, and its extension to curved boundaries, "Gauss–Green cubature and moment computation
// over arbitrary geometries", J. Comput. Appl. Math. 231 (2009) (volume and year from memory). Nodes may
// lie outside a non-convex region, so the density must be defined on the whole bounding box; it must
// also be at least zero there unless the caller has checked its sign on the region itself
// (Options.SignChecked), since values outside the region cancel in the sum whatever their sign.
// Boundary.Local gives the pieces about a nearby exact origin, for callers that work in a local frame.
//
// For a constant density the straight edges use the closed-form moments of the triangles they form with
// the local origin (Steger, below), the arcs their chords' triangles plus their segments, and Béziers
// are converted to the same triangle-fan form by adding the line integrals along the two radii from
// the local origin to their ends. Runs of straight edges are summed by vertex rather than by edge
// (fanChain: 25 floating-point operations an edge against 29), on amd64 by an SSE2 kernel (fan_amd64.s) that keeps
// the x and y halves of each sum in the two lanes of a register; other targets run the same loop in Go.
//
// # Moments
//
// Moments holds M = ∬ρ dA, Sx = ∬xρ dA, Sy = ∬yρ dA, Sxx = ∬x²ρ dA, Sxy = ∬xyρ dA and Syy = ∬y²ρ dA about
// the origin. Central moments follow the structural-engineering naming: Ixx = ∬(y−ȳ)²ρ dA is the moment
// about the horizontal axis through the centroid, Iyy = ∬(x−x̄)²ρ dA about the vertical one, and the product
// Ixy = ∬(x−x̄)(y−ȳ)ρ dA.
//
// Far from the origin the moments about the origin lose digits to cancellation (C. Steger, "On the
// calculation of arbitrary moments of polygons", TR FGBV-96-05, 1996). So Combine works about a nearby
// origin to which the input's points translate exactly (a box edge within a factor of two of every
// coordinate, by Sterbenz's lemma), and keeps its result relative to it besides the absolute pieces;
// the integrators work about that origin (or, for a Boundary written directly, the first piece's start)
// and Moments keeps the local values, so only the centroid is moved back. The tests move a copy of every
// closed-form case to 1e6 and 5e9 from the origin: directly and through Combine, mass, centroid offset
// (Moments.CentroidFrom) and central second moments equal those at the origin to 1e-13 of themselves,
// and the centroid to 2 units in the last place. Combine's coincidence tolerance still grows with the
// distance from the origin (by 1e-13 of it: 5e-4 at 5e9), and features thinner than the reach of its
// side probes, 64 tolerances, may be taken for hairlines there. Callers that do their own work in such
// a frame take it from Boundary.Local and place the moments they sum there with Moments.At, which keeps
// the local values (Moments.Translate would round the reference point to the far origin's magnitude).
package geom
