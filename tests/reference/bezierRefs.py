#!/usr/bin/python3
"""
Exact rational references for Bézier-bounded regions, written to tests/reference/data/bezier-refs.json
(committed; rerun with /usr/bin/python3 tests/reference/bezierRefs.py). Used by
tests/properties/boundary-curved.test.ts.

Each region's boundary is a list of closed loops of Bézier pieces (degree 1 = line, 2, 3) with integer
control points. Area, first and second moments about the coordinate origin are integrated in sympy exact
rational arithmetic with Green's theorem in the form  integral f dA = loop integral of F dy,  F = antiderivative
of f in x (P = 0, Q = F): a different vector field from the one platewise uses (f (x dy - y dx)/(k + 2)),
so the check is independent of its field. Loops are oriented counter-clockwise for outlines and clockwise
for holes as written below; the script checks the signed areas.
"""
import json
import sympy as sp

t, X, Y = sp.symbols('t X Y')

def bezier(ctrl):
    n = len(ctrl) - 1
    x = sum(sp.binomial(n, i) * (1 - t) ** (n - i) * t ** i * sp.Integer(ctrl[i][0]) for i in range(n + 1))
    y = sum(sp.binomial(n, i) * (1 - t) ** (n - i) * t ** i * sp.Integer(ctrl[i][1]) for i in range(n + 1))
    return sp.expand(x), sp.expand(y)

INTEGRANDS = {'A': sp.Integer(1), 'Mx': X, 'My': Y, 'Ixx': X ** 2, 'Ixy': X * Y, 'Iyy': Y ** 2}

def loop_integrals(pieces):
    out = {k: sp.Integer(0) for k in INTEGRANDS}
    for ctrl in pieces:
        x, y = bezier(ctrl)
        dy = sp.diff(y, t)
        for k, f in INTEGRANDS.items():
            F = sp.integrate(f, X)  # antiderivative in x
            out[k] += sp.integrate(sp.expand(F.subs({X: x, Y: y}) * dy), (t, 0, 1))
    return out

REGIONS = {
    # outline: quadratic bottom bulging down, straight right side, cubic top, straight left side;
    # hole: a cubic-and-quadratic blob (clockwise)
    'mixed-bezier-plate': {
        'loops': [
            [[[0, 0], [20, -8], [40, 0]], [[40, 0], [40, 30]], [[40, 30], [30, 42], [12, 36], [0, 30]], [[0, 30], [0, 0]]],
            [[[14, 12], [14, 20], [20, 20]], [[20, 20], [27, 20], [28, 15], [26, 12]], [[26, 12], [20, 6], [14, 12]]],
        ],
    },
    # a quadratic-only lens and a cubic-only blob, far from the origin (exact integers)
    'quadratic-lens': {
        'loops': [[[[1000, 2000], [1050, 1960], [1100, 2000]], [[1100, 2000], [1050, 2040], [1000, 2000]]]],
    },
    'cubic-blob': {
        'loops': [[[[0, 0], [10, -6], [30, -4], [36, 8]], [[36, 8], [42, 20], [20, 34], [6, 26]], [[6, 26], [-6, 18], [-8, 6], [0, 0]]]],
    },
}

OUT = {}
for name, reg in REGIONS.items():
    tot = {k: sp.Integer(0) for k in INTEGRANDS}
    for i, loop in enumerate(reg['loops']):
        li = loop_integrals(loop)
        assert (li['A'] > 0) == (i == 0), (name, i, li['A'])
        for k in tot:
            tot[k] += li[k]
    OUT[name] = {'loops': reg['loops'], 'exact': {k: str(v) for k, v in tot.items()}, 'float': {k: float(v) for k, v in tot.items()}}

with open(__file__.replace('bezierRefs.py', 'data/bezier-refs.json'), 'w') as fh:
    json.dump(OUT, fh, indent=1)
    fh.write('\n')
print(json.dumps({k: v['exact'] for k, v in OUT.items()}, indent=1))
