#!/usr/bin/python3
"""
Independent references for tests/reference/site-coordinates.test.ts, written to
tests/reference/data/site-refs.json (committed; rerun with /usr/bin/python3 tests/reference/siteRefs.py).

1. An SVG plate with `A 120 80 15 ...` arcs at x ~ 3.1e6 mm: the arcs' centres found from the SVG 1.1
   endpoint-to-centre formulas (Appendix F.6.5) in 50-digit mpmath arithmetic, then area, first and
   second moments by Green's theorem along the boundary (mpmath.quad, 50 digits), and the bounding box
   from the arcs' extreme parameters.
2. An angled slot at (3141592.65625, -1234567.25), alone and cut from a rectangle: sympy exact
   arithmetic (rectangle L x w plus two half discs; second moments about the slot's own axes rotated by
   the exact cos and sin of its direction), printed to 40 digits.
"""
import json
import mpmath as mp
import sympy as sp

mp.mp.dps = 50
OUT = {}

# ---------------------------------------------------------------- 1. SVG arcs far from the origin
X, Y = mp.mpf('3141592.65625'), mp.mpf('1234567.25')
H = mp.mpf(4000000)  # viewport height in mm: y_up = H - y_svg
STEPS = [('M', 0, 0), ('L', 150, 0), ('A', 300, 10), ('L', 400, 0), ('A', 410, 150), ('L', 400, 300),
         ('L', 250, 300), ('A', 70, 290), ('L', 0, 300), ('A', -15, 140), ('L', 0, 0)]
RX, RY, PHI = mp.mpf(120), mp.mpf(80), mp.radians(15)
SVG_PATH = ' '.join(
    (f'{c} {X + x} {Y + y}' if c != 'A' else f'A 120 80 15 0 1 {X + x} {Y + y}') for c, x, y in STEPS) + ' Z'


def arc_centre(x1, y1, x2, y2, large, sweep):
    cp, sn = mp.cos(PHI), mp.sin(PHI)
    dx, dy = (x1 - x2) / 2, (y1 - y2) / 2
    x1p, y1p = cp * dx + sn * dy, -sn * dx + cp * dy
    lam = x1p ** 2 / RX ** 2 + y1p ** 2 / RY ** 2
    assert lam < 1
    num = RX ** 2 * RY ** 2 - RX ** 2 * y1p ** 2 - RY ** 2 * x1p ** 2
    coef = mp.sqrt(num / (RX ** 2 * y1p ** 2 + RY ** 2 * x1p ** 2))
    if large == sweep:
        coef = -coef
    cxp, cyp = coef * RX * y1p / RY, -coef * RY * x1p / RX
    cx = cp * cxp - sn * cyp + (x1 + x2) / 2
    cy = sn * cxp + cp * cyp + (y1 + y2) / 2
    ang = lambda ux, uy: mp.atan2(uy, ux)
    th1 = ang((x1p - cxp) / RX, (y1p - cyp) / RY)
    ux, uy = (x1p - cxp) / RX, (y1p - cyp) / RY
    vx, vy = (-x1p - cxp) / RX, (-y1p - cyp) / RY
    dth = mp.atan2(ux * vy - uy * vx, ux * vx + uy * vy)
    if sweep and dth < 0:
        dth += 2 * mp.pi
    if not sweep and dth > 0:
        dth -= 2 * mp.pi
    return cx, cy, th1, dth


# pieces in SVG coordinates (y down), each a function t in [0,1] -> (x, y) and its derivative
pieces = []
box = [mp.inf, mp.inf, -mp.inf, -mp.inf]
cur = None
for c, x, y in STEPS:
    p = (X + x, Y + y)
    if c == 'L':
        a, b = cur, p
        pieces.append((lambda t, a=a, b=b: (a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t),
                       lambda t, a=a, b=b: (b[0] - a[0], b[1] - a[1])))
    elif c == 'A':
        cx, cy, th1, dth = arc_centre(cur[0], cur[1], p[0], p[1], 0, 1)
        cp, sn = mp.cos(PHI), mp.sin(PHI)
        pt = lambda th, cx=cx, cy=cy: (cx + RX * cp * mp.cos(th) - RY * sn * mp.sin(th), cy + RX * sn * mp.cos(th) + RY * cp * mp.sin(th))
        pieces.append((lambda t, pt=pt, th1=th1, dth=dth: pt(th1 + dth * t),
                       lambda t, th1=th1, dth=dth: (dth * (-RX * cp * mp.sin(th1 + dth * t) - RY * sn * mp.cos(th1 + dth * t)),
                                                    dth * (-RX * sn * mp.sin(th1 + dth * t) + RY * cp * mp.cos(th1 + dth * t)))))
        # extreme parameters of x and y on the full ellipse, kept where inside the sweep
        for base in (mp.atan2(-RY * sn, RX * cp), mp.atan2(RY * cp, RX * sn)):
            for k in range(-4, 5):
                th = base + k * mp.pi
                t = (th - th1) / dth
                if 0 < t < 1:
                    q = pt(th)
                    box = [min(box[0], q[0]), min(box[1], q[1]), max(box[2], q[0]), max(box[3], q[1])]
    box = [min(box[0], p[0]), min(box[1], p[1]), max(box[2], p[0]), max(box[3], p[1])]
    cur = p

# moments in y-up coordinates about the local point (X, H - Y)
ox, oy = X, H - Y
m = [mp.mpf(0)] * 6  # A, ∫x, ∫y, ∫x², ∫xy, ∫y² (local)
for f, d in pieces:
    def g(t, k):
        x, y = f(t)
        dx, dy = d(t)
        x, y, dx, dy = x - ox, (H - y) - oy, dx, -dy
        return [(x * dy - y * dx) / 2, x * x * dy / 2, -y * y * dx / 2, x ** 3 * dy / 3, x * x * y * dy / 2, -y ** 3 * dx / 3][k]
    for k in range(6):
        m[k] += mp.quad(lambda t: g(t, k), [0, 0.5, 1])
sign = 1 if m[0] > 0 else -1
A, Sx, Sy, Sxx, Sxy, Syy = [sign * v for v in m]
cxl, cyl = Sx / A, Sy / A
svg = {
    'path': SVG_PATH,
    'area': A, 'centroidX': ox + cxl, 'centroidY': oy + cyl,
    'Ix': Syy - A * cyl ** 2, 'Iy': Sxx - A * cxl ** 2, 'Ixy': Sxy - A * cxl * cyl,
    'xMin': box[0], 'xMax': box[2], 'yMin': H - box[3], 'yMax': H - box[1],
}
svg['width'] = svg['xMax'] - svg['xMin']
svg['height'] = svg['yMax'] - svg['yMin']
OUT['svgArcs'] = {k: (v if isinstance(v, str) else mp.nstr(v, 40)) for k, v in svg.items()}

# ---------------------------------------------------------------- 2. angled slot, exact
R = sp.Rational
fx, fy = R('3141592.65625'), R('-1234567.25')
dx, dy, w = 170, 300, R('12.5')
r = R(w, 2)
L = sp.sqrt(dx ** 2 + dy ** 2)
c, s = dx / L, dy / L
Iu = w ** 3 * L / 12 + sp.pi * r ** 4 / 4                                  # about the slot's axis
Iv = w * L ** 3 / 12 + sp.pi * r ** 2 * L ** 2 / 4 + 4 * L * r ** 3 / 3 + sp.pi * r ** 4 / 4   # about its middle normal
slot = {'area': w * L + sp.pi * r ** 2, 'centroidX': fx + R(dx, 2), 'centroidY': fy + R(dy, 2),
        'Ix': Iv * s ** 2 + Iu * c ** 2, 'Iy': Iv * c ** 2 + Iu * s ** 2, 'Ixy': (Iv - Iu) * s * c}
# the slot alone: its box is the two end circles' boxes (the caps face outwards along ±(c, s))
slot_alone = dict(slot, xMin=fx - r, xMax=fx + dx + r, yMin=fy - r, yMax=fy + dy + r)
slot_alone['width'] = slot_alone['xMax'] - slot_alone['xMin']
slot_alone['height'] = slot_alone['yMax'] - slot_alone['yMin']
# cut from the rectangle corner (3141000, -1235000), size 1500 x 1000
rx0, ry0, rw, rh = R(3141000), R(-1235000), R(1500), R(1000)
Ar, crx, cry = rw * rh, rx0 + rw / 2, ry0 + rh / 2
A = Ar - slot['area']
cx_ = (Ar * crx - slot['area'] * slot['centroidX']) / A
cy_ = (Ar * cry - slot['area'] * slot['centroidY']) / A
plate = {'area': A, 'centroidX': cx_, 'centroidY': cy_,
         'Ix': rw * rh ** 3 / 12 + Ar * (cry - cy_) ** 2 - (slot['Ix'] + slot['area'] * (slot['centroidY'] - cy_) ** 2),
         'Iy': rh * rw ** 3 / 12 + Ar * (crx - cx_) ** 2 - (slot['Iy'] + slot['area'] * (slot['centroidX'] - cx_) ** 2),
         'Ixy': Ar * (crx - cx_) * (cry - cy_) - (slot['Ixy'] + slot['area'] * (slot['centroidX'] - cx_) * (slot['centroidY'] - cy_))}
OUT['slotAlone'] = {k: str(sp.N(v, 40)) for k, v in slot_alone.items()}
OUT['slotInPlate'] = {k: str(sp.N(v, 40)) for k, v in plate.items()}

path = __file__.rsplit('/', 1)[0] + '/data/site-refs.json'
with open(path, 'w') as f:
    json.dump(OUT, f, indent=2)
    f.write('\n')
print(json.dumps(OUT, indent=2))
