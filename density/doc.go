// Package density turns the way a fabricator describes a part's material into an areal density
// ρ(x, y) that package geom can integrate: a material and a thickness ("aluminium 5052, 3 mm"), a
// thickness that varies ("t0 + (t1 - t0)*x/1200 mm"), or an areal density typed directly
// ("k*x^2*y" in kg/m² with k = 2e-6). It also holds the units, sheet materials and gauge tables
// these descriptions use. It imports nothing else of Plumb's.
//
// # Units
//
// A Field works in one internal system: x and y are in the document's length unit (mm, in, px, …,
// measured from the document origin, y up) and the field's value is in kilograms per square
// document unit, so that ∬ρ dA over document coordinates is the mass in kilograms. Spec.Field does
// the conversion from the units the user typed:
//
//	formula:   ρ = f(x, y) · [unit in kg/m²] · (doc unit in m)²
//	thickness: ρ = t(x, y) · [thickness unit in m] · density [kg/m³] · (doc unit in m)²
//
// The unit definitions are exact: 1 in = 25.4 mm and 1 lb = 0.45359237 kg (international yard and
// pound, 1959), g0 = 9.80665 m/s² (3rd CGPM, 1901), 1 lbf = 0.45359237 × 9.80665 N; px, pt and pc
// are the CSS units (1 px = 1/96 in, 1 pt = 1/72 in, 1 pc = 12 pt).
//
// # The formula language
//
// A formula is an ordinary maths expression in x and y. The grammar, from loosest to tightest
// binding:
//
//	expr    = term { ("+" | "-") term }
//	term    = unary { ("*" | "/") unary | power }     // the last: product by juxtaposition
//	unary   = ("-" | "+") unary | power
//	power   = postfix [ "^" unary ]                   // right-associative: 2^3^2 = 2^9
//	postfix = primary { superscript }                 // x², x³, x⁻¹
//	primary = number | name | function "(" [ expr { "," expr } ] ")" | "(" expr ")"
//
// A sign binds less tightly than a power, as in written maths: -x^2 is -(x²), and x^-2 is 1/x².
//
// Numbers are decimal with an optional exponent: 12, 1.5, .5, 5., 2e-6, 1.5E+3. An e that is not
// followed by digits is the constant e, so 2e is 2·e.
//
// Names are x and y (document units, from the document origin), r and theta (polar about the
// origin: r = hypot(x, y), theta = atan2(y, x) in radians, from −π to π), the constants pi and e,
// and the parameters the user defines (k = 2e-6). A parameter name is a letter or '_' followed by
// letters, digits or '_', and may not be one of the language's own names.
//
// Functions:
//
//	sqrt(v)  exp(v)  ln(v)  log10(v)  sin(v)  cos(v)  tan(v)  (angles in radians)
//	abs(v)  floor(v)  ceil(v)  pow(a, b) = a^b  hypot(a, b) = √(a² + b²)
//	min(a, b, …)  max(a, b, …)   two or more arguments
//	blend(a, b, v)   the smooth step from 0 (v ≤ a) to 1 (v ≥ b): 3t² − 2t³ with t = (v − a)/(b − a);
//	                 with a = b it is a step at a. Use it to fade one density into another:
//	                 8*blend(0, 300, x) + 2*(1 - blend(0, 300, x))
//
// A product may be written without '*' where that reads only one way: 2x, 3(x+1), k x^2 y, x²y,
// (x+1)(x-1), 2 sin(x). The right factor must begin with a name or '('; a number after an operand
// needs '*'. Two readings are refused with a message asking for '*' and parentheses: a product
// after a division (1/2x: is it (1/2)x or 1/(2x)?) and a name or '(' directly after a power
// written with a number (e^2x: e^(2x) or e²·x?); with a space, e^2 x is e²·x. A name directly
// before '(' that is not a function, k(x+1), is a product.
//
// Text pasted from documents is accepted: · ⋅ × for '*', − for '-', ÷ for '/', π and θ for pi and
// theta, superscript digits with an optional superscript minus for powers (x², x³, x⁻¹), and any
// Unicode space.
//
// Errors give the 1-based column counted in characters, what was found and what was expected:
// "col 7: expected operand, found ')'". An unknown name suggests the nearest known one
// ("did you mean \"sqrt\"?"), or what two names run together stand for (kx → k*x, sinx → sin(x)).
// Input is limited to 2000 characters and to 64 levels of nesting (parentheses, signs and powers),
// which bounds the work done on hostile input.
//
// # Compiled formulas
//
// Compile binds names and folds every part that does not depend on x or y to a constant (so
// rho*t/1000 costs nothing per point), writes e^v as exp(v), and records whether the formula is a
// polynomial in x and y: made of constants, x, y, even powers of r, +, −, ×, division by a
// constant and whole powers, up to total degree 24. Polynomial returns its terms, which lets geom
// choose an exact integration rule. PolynomialAbout gives the same terms in u = x − x0,
// v = y − y0, expanded after reading x as u + x0 (and y as v + y0): for a point near the part, a
// formula written about a far point, k·(x − 1e6)²·(y − 1e6), keeps its digits instead of cancelling
// in terms about the origin. Names lists the variables and parameters used.
//
// Program.Eval works on batches: it runs a flat list of instructions, each a tight loop over a
// column of up to 256 points, with constants held in the instructions and x² and x³ written as
// products. Its working columns come from a pool, so it does not allocate per point or, once warm,
// per call. The benchmarks compare it with the same formula written in Go.
//
// # Bounds and pieces
//
// Field.Bounds evaluates the formula over a box in interval arithmetic, each operation rounded
// outward (elementary functions by two units in the last place, beyond their accuracy), so the
// interval it returns holds every value the density takes in the box; where the formula may be
// undefined in the box (a square root of a range below zero, a division by a range holding zero)
// it is the whole line. Field.Restrict simplifies the formula on one piece of the plane, given by
// the range of any linear function over it: abs, min and max of arguments linear in x and y become
// one argument, floor and ceil a whole number, blend 0, 1 or its cubic, and theta is cut along the
// negative x axis; where such a kink or step crosses the piece it names the line to cut along.
// Kinks of arguments that are not linear (abs(x² − y)) are named as rough. Both serve the sign
// proof and the piecewise exact integration in package sketch.
//
// # Lengths and thicknesses
//
// ParseLength and Spec.Thickness read a number or constant expression followed by a unit: "3 mm",
// "3mm", "0.125 in", "1/8 in", `0.5"`, "2'", "2 ft". A whole number and a fraction, "1 1/2 in" or
// "1-1/2 in", is 1½ in as rules are marked; written with spaces, "1 - 1/2 in", it is 1 − ½. A gauge is "16 ga" or "16 gauge" followed
// by a material or gauge system name ("16 ga steel", "18 ga aluminium"), or, in a Spec, the Spec's
// material. A thickness may also be a formula in x and y and the Spec's parameters, ending with
// its unit: "6 - 4*x/1200 mm".
//
// # Materials and gauges
//
// Materials lists sheet materials with their nominal volumetric density and where it comes from;
// those whose density varies by supplier or grade are marked Approx. Aluminium composite panel is a
// layered sheet: it is given as an areal density per millimetre of total thickness, derived from a
// common build-up, and marked so (Material.Areal). Users add their own materials in Spec.Custom.
//
// Gauge numbers mean different thicknesses for different materials, so a Gauge always carries its
// thickness in mm and inches. Steel uses the Manufacturers' Standard Gauge (defined by weight:
// lb/ft² ÷ 41.82 per inch). Galvanized steel has its own gauge, the steel gauge's weight plus
// 2.5 oz/ft² of zinc. Carbon and galvanized steel given by one of these gauges weigh the table's
// lb/ft² (Gauge.LbFt2, Material.GaugeWeight), the basis the gauge is defined on: about 2.4 % more
// than the rounded thickness × 7850 kg/m³. Stainless steel takes the Manufacturers' Standard Gauge
// thicknesses (common practice; some mills' stainless tables differ slightly: confirm with the
// supplier) times its own density. Aluminium, brass and copper sheet use
// the Brown & Sharpe gauge (ASTM B258: 0.005 in × 92^((36 − n)/39)).
//
// # Domain
//
// A density must be finite and at least zero wherever geom evaluates it (zero is allowed: it cuts
// an area away). Field.CheckDomain reports the first point where it is not, in the user's terms:
// "density is −3.2 kg/m² at x = 120 mm, y = 40 mm" or "thickness is −0.4 mm at …".
//
// The values are estimates for planning. Hardware ratings, fixings and overhead signs follow local
// codes and a licensed engineer.
package density
