#!/usr/bin/python3
"""
Exact references for polynomial integrands over curved regions, written to
tests/reference/data/poly-refs.json (committed; rerun with /usr/bin/python3 tests/reference/polyRefs.py).
Used by tests/properties/boundary-polynomial.test.ts.

Every value is integrated by sympy in exact arithmetic, by a route independent of platewise's boundary
field f·(x dy − y dx)/(k + 2):
  - discs, annuli and ellipses: polar (elliptic-polar) integration over the area, x = cx + r cos t ... with
    the Jacobian r (a·b·r), t over [0, 2π], r over the radii;
  - the quarter disc with two straight edges: polar integration about its corner;
  - Bézier regions: Green's theorem as integral f dA = loop integral of F dy, F the antiderivative of f in x
    (the regions and their loops are those of bezierRefs.py);
  - a rectangle: iterated integration.
Each case names a part (the test builds the same segments) and an integrand in platewise's expression
syntax, written by sympy's printer with ** replaced by ^.
"""
import json
import sympy as sp

x, y, r, th, t = sp.symbols('x y r t_h t', real=True)


def expr_text(e):
    return sp.sstr(e).replace('**', '^')


def polar(f, cx, cy, r0, r1):
    """integral of f over the annulus r0 <= |p - c| <= r1 (r0 = 0: the disc)."""
    g = f.subs({x: cx + r * sp.cos(th), y: cy + r * sp.sin(th)}, simultaneous=True) * r
    return sp.integrate(sp.integrate(sp.expand(g), (th, 0, 2 * sp.pi)), (r, r0, r1))


def ellipse(f, cx, cy, a, b, phi):
    """integral of f over the ellipse with semi-axes a, b turned by phi about its centre (cx, cy)."""
    c, s = sp.cos(phi), sp.sin(phi)
    u, v = a * r * sp.cos(th), b * r * sp.sin(th)
    g = f.subs({x: cx + c * u - s * v, y: cy + s * u + c * v}, simultaneous=True) * a * b * r
    return sp.integrate(sp.integrate(sp.expand(g), (th, 0, 2 * sp.pi)), (r, 0, 1))


def quarter(f, px, py, R):
    """integral of f over the quarter disc of radius R with its right-angle corner at (px, py), first quadrant."""
    g = f.subs({x: px + r * sp.cos(th), y: py + r * sp.sin(th)}, simultaneous=True) * r
    return sp.integrate(sp.integrate(sp.expand(g), (th, 0, sp.pi / 2)), (r, 0, R))


def bezier(ctrl):
    n = len(ctrl) - 1
    bx = sum(sp.binomial(n, i) * (1 - t) ** (n - i) * t ** i * sp.Integer(ctrl[i][0]) for i in range(n + 1))
    by = sum(sp.binomial(n, i) * (1 - t) ** (n - i) * t ** i * sp.Integer(ctrl[i][1]) for i in range(n + 1))
    return sp.expand(bx), sp.expand(by)


def green(f, loops):
    F = sp.integrate(f, x)
    tot = sp.Integer(0)
    for loop in loops:
        for ctrl in loop:
            bx, by = bezier(ctrl)
            tot += sp.integrate(sp.expand(F.subs({x: bx, y: by}, simultaneous=True) * sp.diff(by, t)), (t, 0, 1))
    return tot


R = sp.Rational
CASES = []


def case(name, part, f, value):
    v = sp.nsimplify(value) if value.is_rational else sp.simplify(value)
    CASES.append({'name': name, 'part': part, 'expr': expr_text(f), 'exact': str(v), 'value': float(sp.N(v, 30))})


# a disc: ∫x²y² dA = πR⁶/24 about its centre (polar integration); here about the origin, centre (−7, 3)
case('disc R=25 at (-7, 3), x^2 y^2', {'disc': [-7, 3, 25]}, x**2 * y**2, polar(x**2 * y**2, -7, 3, 0, 25))
case('disc R=25 at (0, 0), x^2 y^2 (= pi R^6/24)', {'disc': [0, 0, 25]}, x**2 * y**2, polar(x**2 * y**2, 0, 0, 0, 25))
case('annulus 20..50 at (10, -5), 1 + x y^3 - 2 x^4/1000', {'annulus': [10, -5, 20, 50]}, 1 + x * y**3 - 2 * x**4 / 1000,
     polar(1 + x * y**3 - R(2, 1000) * x**4, 10, -5, 20, 50))
case('ellipse a=40 b=15 turned 30 deg at (5, -2), 1 + x y + x^3', {'ellipse': [5, -2, 40, 15, 30]}, 1 + x * y + x**3,
     ellipse(1 + x * y + x**3, 5, -2, 40, 15, sp.pi / 6))
case('quarter disc R=30 corner (120, -45), x^2 y', {'quarter': [120, -45, 30]}, x**2 * y, quarter(x**2 * y, 120, -45, 30))
case('disc R=40 at site (1000000, -2000000), (x - 1000000)^2 + 3', {'disc': [1000000, -2000000, 40]}, (x - 1000000)**2 + 3,
     polar((x - 1000000)**2 + 3, 1000000, -2000000, 0, 40))

# Bézier regions of bezierRefs.py
with open(__file__.replace('polyRefs.py', 'data/bezier-refs.json')) as fh:
    BEZ = json.load(fh)
for name, f in [('mixed-bezier-plate', x**3 * y - 5 * y**2 + 7), ('cubic-blob', (x - 3)**2 * (y + 1)**2 / 100 + x**5 / 10000), ('quadratic-lens', x * y - 1500 * y)]:
    case(f'Bezier region {name}, {expr_text(f)}', {'bezier': name}, f, green(f, BEZ[name]['loops']))

# a plate 300 x 200 with a hole r = 25 at (150, 100): mass sums with thickness 8 + 0.001 x + 0.00002 y^2 (mm) and 7850 kg/m3
T = 8 + R(1, 1000) * x + R(2, 100000) * y**2
rect = sp.integrate(sp.integrate(T, (x, 0, 300)), (y, 0, 200))
case('plate 300x200 with hole r=25 at (150, 100): volume of thickness 8 + 0.001 x + 0.00002 y^2', {'plateWithHole': [300, 200, 150, 100, 25]},
     T, rect - polar(T, 150, 100, 0, 25))
rectx = sp.integrate(sp.integrate(T * x, (x, 0, 300)), (y, 0, 200))
case('same plate: first moment of the thickness about x = 0', {'plateWithHole': [300, 200, 150, 100, 25]}, T * x, rectx - polar(T * x, 150, 100, 0, 25))
# ∫ T²/2 (the mass centre height's sum for a plate on z = 0, per unit density)
rectz = sp.integrate(sp.integrate(T**2 / 2, (x, 0, 300)), (y, 0, 200))
case('same plate: integral of thickness^2 / 2', {'plateWithHole': [300, 200, 150, 100, 25]}, T**2 / 2, rectz - polar(T**2 / 2, 150, 100, 0, 25))

with open(__file__.replace('polyRefs.py', 'data/poly-refs.json'), 'w') as fh:
    json.dump(CASES, fh, indent=1)
    fh.write('\n')
for c in CASES:
    print(c['name'], '=', c['exact'], '≈', c['value'])
