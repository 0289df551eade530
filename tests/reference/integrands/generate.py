#!/usr/bin/python3
"""
Reference values for the adaptive-integration honesty suite (tests/reference/integrands.test.ts).

Run with Debian's interpreter:  /usr/bin/python3 tests/reference/integrands/generate.py
It writes references.json beside this file; both are committed. Every value names its source:
  - "sympy": exact symbolic integration (sympy.integrate), printed to 25 digits with sympy.N;
  - "scipy-quad": scipy.integrate.quad (QUADPACK) on a one-dimensional reduction, with its own error estimate;
  - "mpmath": a closed form evaluated at 40 digits (mpmath), the closed form's terms stated beside it
    (Bessel functions from the integral of e^{i k·x} over a disc: 2πr·J1(r|k|)/|k|, I1 for real exponents;
    the error function for the Gaussian bump).
Nothing here is copied from another program; the geometry is invented for the tests.
"""
import json, math, os
import mpmath as mp
import sympy as sp
from scipy import integrate

mp.mp.dps = 40
out = {"generator": "tests/reference/integrands/generate.py", "scipy": __import__('scipy').__version__, "sympy": sp.__version__, "mpmath": mp.__version__, "cases": {}}
X = sp.symbols('x', real=True)
R_, r_ = sp.symbols('R r', positive=True)

def put(name, value, source, note, err=None):
    out["cases"][name] = {"value": float(value), "digits": str(value), "source": source, "note": note, **({"sourceError": err} if err is not None else {})}

# 1. |x - c| over the 300 x 100 rectangle with a Ø40 hole at (100, 50): kink lines through the hole, tangent to
#    it and along the outline. Exact by sympy: rectangle part in closed form, disc part ∫ |u - d|·2√(r² - u²) du.
u = sp.symbols('u', real=True)
for c in ['0', '60', '80', '85.5', '92.25', '100', '107.7', '116.3', '120', '300']:
    C = sp.Rational(c)
    rect = 100 * (C**2 + (300 - C)**2) / 2
    d = C - 100
    w = 2 * sp.sqrt(400 - u**2)
    if d <= -20: disc = sp.integrate((u - d) * w, (u, -20, 20))
    elif d >= 20: disc = sp.integrate((d - u) * w, (u, -20, 20))
    else: disc = sp.integrate((d - u) * w, (u, -20, d)) + sp.integrate((u - d) * w, (u, d, 20))
    v = sp.N(rect - disc, 25)
    # independent check by QUADPACK on the 1-D reduction ∫ |x - c|·(height of material at x) dx
    h = lambda x: 100 - (2 * math.sqrt(max(0.0, 400 - (x - 100)**2)) if abs(x - 100) < 20 else 0)
    q, e = integrate.quad(lambda x: abs(x - float(C)) * h(x), 0, 300, points=sorted({x for x in [float(C), 80.0, 120.0] if 0 < x < 300}) or None, limit=500, epsabs=0, epsrel=1e-13)
    assert abs(q - float(v)) <= 1e-9 * abs(float(v)), (c, q, v)
    put(f'kink-circle-hole c={c}', v, 'sympy', 'abs(x - c) over [0,300]x[0,100] minus the disc centre (100,50) radius 20; scipy-quad agrees', err=abs(q - float(v)))

# 2. |x - c| and 2·max(x - c, 0) over the same rectangle minus the rectangle [150,200] x [20,80]: kinks along the
#    hole's edges and through it. Exact rationals (sympy).
for c in ['150', '170', '200']:
    C = sp.Rational(c)
    a = sp.integrate(sp.Abs(X - C), (X, 0, 300)) * 100 - sp.integrate(sp.Abs(X - C), (X, 150, 200)) * 60
    m = sp.integrate(2 * sp.Max(X - C, 0), (X, 0, 300)) * 100 - sp.integrate(2 * sp.Max(X - C, 0), (X, 150, 200)) * 60
    put(f'kink-rect-hole abs c={c}', sp.N(a, 25), 'sympy', 'abs(x - c) over [0,300]x[0,100] minus [150,200]x[20,80]')
    put(f'kink-rect-hole max c={c}', sp.N(m, 25), 'sympy', '2*max(x - c, 0) over the same part')

# 3. The rigid punch: ∫∫ 1/√(R² − r²) over the disc of radius R = ∫0^R 2πr/√(R² − r²) dr = 2πR (sympy), R = 100.
punch = sp.integrate(2 * sp.pi * r_ / sp.sqrt(R_**2 - r_**2), (r_, 0, R_))
assert sp.simplify(punch - 2 * sp.pi * R_) == 0
put('punch R=100', sp.N(punch.subs(R_, 100), 25), 'sympy', '1/sqrt(10000 - x^2 - y^2) over the disc of radius 100: 2*pi*R')

# 4. Defined only inside: ∫∫ √(R² − r²) over the disc = (2/3)πR³ (sympy), R = 40.
hemi = sp.integrate(2 * sp.pi * r_ * sp.sqrt(R_**2 - r_**2), (r_, 0, R_))
put('hemisphere R=40', sp.N(hemi.subs(R_, 40), 25), 'sympy', 'sqrt(1600 - x^2 - y^2) over the disc of radius 40')

# 5. Gaussian bump exp(−((x−120)² + (y−90)²)/(2·12²)) over [0,300] × [0,200]: (π s²/2)·(erf + erf)·(erf + erf).
for sw in [12, 30, 60]:
    s, a_, b_ = mp.mpf(sw), mp.mpf(120), mp.mpf(90)
    g = (mp.pi * s**2 / 2) * (mp.erf((300 - a_) / (s * mp.sqrt(2))) + mp.erf(a_ / (s * mp.sqrt(2)))) * (mp.erf((200 - b_) / (s * mp.sqrt(2))) + mp.erf(b_ / (s * mp.sqrt(2))))
    put('gauss' if sw == 12 else f'gauss s={sw}', mp.nstr(g, 30), 'mpmath', f'error-function closed form of the separable Gaussian of width {sw} centred at (120, 90) over [0,300]x[0,200]')

# 6. Near-singular 1/√((x−37.3)² + (y−21.7)² + 1e-6) over [0,100] × [0,60]: antiderivative
#    F = X·asinh(Y/√(X²+c²)) + Y·asinh(X/√(Y²+c²)) − c·atan(XY/(c·√(X²+Y²+c²))), checked by differentiation (sympy).
Xs, Ys, cs = sp.symbols('X Y c', positive=True)
F = Xs * sp.asinh(Ys / sp.sqrt(Xs**2 + cs**2)) + Ys * sp.asinh(Xs / sp.sqrt(Ys**2 + cs**2)) - cs * sp.atan(Xs * Ys / (cs * sp.sqrt(Xs**2 + Ys**2 + cs**2)))
mixed = sp.diff(F, Xs, Ys) - 1 / sp.sqrt(Xs**2 + Ys**2 + cs**2)
for pt in [(0.3, 0.7, 0.01), (2.0, 1.5, 0.5), (5.0, 0.2, 1.0)]:
    assert abs(float(mixed.subs({Xs: pt[0], Ys: pt[1], cs: pt[2]}))) < 1e-12
Fm = lambda x, y, c: x * mp.asinh(y / mp.sqrt(x**2 + c**2)) + y * mp.asinh(x / mp.sqrt(y**2 + c**2)) - c * mp.atan(x * y / (c * mp.sqrt(x**2 + y**2 + c**2)))
cc, sa, sb = mp.mpf('1e-3'), mp.mpf('37.3'), mp.mpf('21.7')
ns = Fm(100 - sa, 60 - sb, cc) - Fm(-sa, 60 - sb, cc) - Fm(100 - sa, -sb, cc) + Fm(-sa, -sb, cc)
put('near-singular', mp.nstr(ns, 30), 'mpmath', 'antiderivative above (checked by sympy differentiation) at the four corners, 40 digits')

# 7. The 2000 x 1000 panel with 50 x 25 holes Ø20 at pitch 40: cos((x+y)/100) and exp((x+y)/1000).
#    Rectangle: separable; each disc: ∫ e^{k·p} over a disc = e^{k·centre}·2πr·I1(r|k|)/|k| (real k), and for
#    cos(k·p) = Re e^{i k·p}: cos(k·centre)·2πr·J1(r|k|)/|k|.
def panel(kind, sc):
    sc = mp.mpf(sc)
    k = mp.sqrt(2) / sc
    if kind == 'cos':
        ex = lambda W: (sc * mp.sin(W / sc), sc * (1 - mp.cos(W / sc)))
        (a1, b1), (a2, b2) = ex(mp.mpf(2000)), ex(mp.mpf(1000))
        total = a1 * a2 - b1 * b2
        disc = 2 * mp.pi * 10 * mp.besselj(1, 10 * k) / k
        f = lambda cx, cy: mp.cos((cx + cy) / sc)
    else:
        total = (sc * (mp.exp(2000 / sc) - 1)) * (sc * (mp.exp(1000 / sc) - 1))
        disc = 2 * mp.pi * 10 * mp.besseli(1, 10 * k) / k
        f = lambda cx, cy: mp.exp((cx + cy) / sc)
    for i in range(50):
        for j in range(25):
            total -= f(mp.mpf(40) * i + 20, mp.mpf(40) * j + 20) * disc
    return total
put('panel cos', mp.nstr(panel('cos', 100), 30), 'mpmath', 'cos((x+y)/100) over the 1,250-hole panel: rectangle closed form minus discs via J1')
put('panel cos20', mp.nstr(panel('cos', 20), 30), 'mpmath', 'cos((x+y)/20) over the 1,250-hole panel: rectangle closed form minus discs via J1')
put('panel exp', mp.nstr(panel('exp', 1000), 30), 'mpmath', 'exp((x+y)/1000) over the 1,250-hole panel: rectangle closed form minus discs via I1')
put('panel area', sp.N(2000 * 1000 - 1250 * sp.pi * 100, 25), 'sympy', 'area of the 1,250-hole panel: 2e6 - 1250*pi*10^2')

# 8. Kink lines through the corners of the 100 x 100 square with a Ø30 hole at its centre: |x - y| and
#    |x - y|·|x + y - 100|. In u = (x − y)/√2, v = (x + y − 100)/√2 the square is the diamond |u| + |v| ≤ 50√2 and
#    the hole the disc of radius 15 about the origin: ∫|x − y| = 100³/3 − √2·(4/3)·15³ and
#    ∫|x − y||x + y − 100| = (50√2)⁴/3 − 15⁴ (sympy below), checked by scipy dblquad on the square (x, y) split
#    along both diagonals, minus the disc in polar coordinates.
uu, vv, a = sp.symbols('u v a', positive=True)
Yv = sp.Symbol('y', real=True)
sq1 = 2 * sp.integrate(sp.integrate(X - Yv, (Yv, 0, X)), (X, 0, 100))  # symmetric about y = x
disc1 = sp.sqrt(2) * sp.Rational(4, 3) * 15**3
sq2 = 2 * 4 * sp.integrate(sp.integrate(uu * vv, (vv, 0, a - uu)), (uu, 0, a)).subs(a, 50 * sp.sqrt(2))
disc2 = 2 * 4 * sp.integrate(sp.integrate(uu * vv, (vv, 0, sp.sqrt(225 - uu**2))), (uu, 0, 15))
d1, d2 = sp.N(sq1 - disc1, 25), sp.N(sq2 - disc2, 25)
def sq_part(f):
    # four triangles between the diagonals of the square, f smooth on each
    tot = 0.0
    tot += integrate.dblquad(lambda y, x: f(x, y), 0, 50, lambda x: x, lambda x: 100 - x, epsabs=1e-10, epsrel=1e-13)[0]
    tot += integrate.dblquad(lambda y, x: f(x, y), 50, 100, lambda x: 100 - x, lambda x: x, epsabs=1e-10, epsrel=1e-13)[0]
    tot += integrate.dblquad(lambda x, y: f(x, y), 0, 50, lambda y: y, lambda y: 100 - y, epsabs=1e-10, epsrel=1e-13)[0]
    tot += integrate.dblquad(lambda x, y: f(x, y), 50, 100, lambda y: 100 - y, lambda y: y, epsabs=1e-10, epsrel=1e-13)[0]
    return tot
def disc_part(f):
    tot = 0.0
    for k in range(4):
        lo = -math.pi / 4 + k * math.pi / 2
        tot += integrate.dblquad(lambda rho, th: f(50 + rho * math.cos(th), 50 + rho * math.sin(th)) * rho, lo, lo + math.pi / 2, 0, 15, epsabs=1e-10, epsrel=1e-13)[0]
    return tot
f1 = lambda x, y: abs(x - y)
f2 = lambda x, y: abs(x - y) * abs(x + y - 100)
for f, d in [(f1, d1), (f2, d2)]:
    q = sq_part(f) - disc_part(f)
    assert abs(q - float(d)) <= 1e-9 * float(d), (q, d)
put('diagonal abs', d1, 'sympy', '|x - y| over the 100 x 100 square minus the disc centre (50,50) radius 15; scipy dblquad agrees')
put('diagonal product', d2, 'sympy', '|x - y|*|x + y - 100| over the same part; scipy dblquad agrees')

with open(os.path.join(os.path.dirname(os.path.abspath(__file__)), 'references.json'), 'w') as fh:
    json.dump(out, fh, indent=2)
    fh.write('\n')
print(len(out["cases"]), 'references written')
