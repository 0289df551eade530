#!/usr/bin/python3
"""
Inputs and independent references for tests/reference/site-sweep.test.ts, written to
tests/reference/data/site-sweep.json (committed; rerun with /usr/bin/python3 tests/reference/siteSweep.py).

One small plate with curved edges and holes per input format, drawn at two site offsets (about 1.2e6 and
9.9e6 mm; every coordinate a binary fraction, so the files hold the intended geometry exactly). The
drawings are invented test data. Each reference is computed from the format's own definition, never
from the tool:
  - part JSON: rounded rectangle, angled slot, circle and a path arc, built as the README's part format
    describes them (tangent points of the slot, corner arcs) in 50-digit mpmath arithmetic;
  - SVG: arcs by the SVG 1.1 endpoint-to-centre conversion (Appendix F.6.5), `<ellipse>` under
    `rotate(a cx cy)` (SVG 1.1 section 7.6), `<circle>`; the viewport maps y down to y up;
  - DXF: written with ezdxf (python3-ezdxf); LWPOLYLINE bulges as arcs per the AutoCAD DXF Reference
    (bulge = tan(sweep/4)), CIRCLE, ELLIPSE (centre, major-axis end point, ratio);
  - GeoJSON and WKT: straight polygons with holes.
Area, centroid and second moments come from Green's theorem along the exact boundary, integrated with
mpmath.quad at 50 digits about a point near the plate (the moments are then exact rational sums of
those and of the offset).
"""
import io
import json
import mpmath as mp
import ezdxf

mp.mp.dps = 50
M = mp.mpf
OFFSETS = {'1e6': (M('1234567.375'), M('-1048576.625')), '1e7': (M('9876543.21875'), M('3141592.5'))}


def fmt(v):
    """A binary fraction printed exactly (no exponent)."""
    s = mp.nstr(v, 30, strip_zeros=True)
    assert M(s) == v, (s, v)
    return s[:-2] if s.endswith('.0') else s


# ---------------------------------------------------------------- pieces of a boundary
def line(a, b):
    return ('line', a, b)


def arc(c, r, a0, a1):
    """Circular arc, angle a0 to a1 (radians, counter-clockwise when a1 > a0)."""
    return ('arc', c, r, a0, a1)


def ell(c, rx, ry, phi, t0, t1):
    return ('ell', c, rx, ry, phi, t0, t1)


def point_and_derivative(p, t):
    if p[0] == 'line':
        a, b = p[1], p[2]
        return (a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t), (b[0] - a[0], b[1] - a[1])
    if p[0] == 'arc':
        _, c, r, a0, a1 = p
        th = a0 + (a1 - a0) * t
        return (c[0] + r * mp.cos(th), c[1] + r * mp.sin(th)), (-(a1 - a0) * r * mp.sin(th), (a1 - a0) * r * mp.cos(th))
    _, c, rx, ry, phi, t0, t1 = p
    th, d = t0 + (t1 - t0) * t, t1 - t0
    cp, sp = mp.cos(phi), mp.sin(phi)
    u, v, du, dv = rx * mp.cos(th), ry * mp.sin(th), -d * rx * mp.sin(th), d * ry * mp.cos(th)
    return (c[0] + cp * u - sp * v, c[1] + sp * u + cp * v), (cp * du - sp * dv, sp * du + cp * dv)


def loop_moments(pieces, o):
    """[A, ∫x, ∫y, ∫x², ∫xy, ∫y²] of the region a closed loop bounds, about o, signed by its direction."""
    m = [M(0)] * 6
    for p in pieces:
        def g(t, k):
            (x, y), (dx, dy) = point_and_derivative(p, t)
            x, y = x - o[0], y - o[1]
            return [(x * dy - y * dx) / 2, x * x * dy / 2, -y * y * dx / 2, x ** 3 * dy / 3, x * x * y * dy / 2, -y ** 3 * dx / 3][k]
        for k in range(6):
            m[k] += mp.quad(lambda t: g(t, k), [0, M(1) / 2, 1])
    return m


def check_closed(pieces):
    for a, b in zip(pieces, pieces[1:] + pieces[:1]):
        e, s = point_and_derivative(a, 1)[0], point_and_derivative(b, 0)[0]
        assert abs(e[0] - s[0]) + abs(e[1] - s[1]) < M(10) ** -30, (a, b)


def properties(outline, holes, o):
    """Section properties of an outline minus holes (each loop may run either way)."""
    tot = [M(0)] * 6
    for i, pieces in enumerate([outline] + holes):
        check_closed(pieces)
        m = loop_moments(pieces, o)
        sgn = (1 if m[0] > 0 else -1) * (1 if i == 0 else -1)
        tot = [a + sgn * b for a, b in zip(tot, m)]
    A, Sx, Sy, Sxx, Sxy, Syy = tot
    cx, cy = Sx / A, Sy / A
    return {'area': A, 'centroidX': o[0] + cx, 'centroidY': o[1] + cy,
            'Ix': Syy - A * cy ** 2, 'Iy': Sxx - A * cx ** 2, 'Ixy': Sxy - A * cx * cy}


def polygon(pts):
    return [line(pts[i], pts[(i + 1) % len(pts)]) for i in range(len(pts))]


# ---------------------------------------------------------------- part JSON
def part_json(X, Y):
    P = lambda x, y: (X + x, Y + y)
    w, h, r = M(200), M(120), M(15)
    H = mp.pi / 2
    outline = [line(P(r, 0), P(w - r, 0)), arc(P(w - r, r), r, -H, 0), line(P(w, r), P(w, h - r)), arc(P(w - r, h - r), r, 0, H),
               line(P(w - r, h), P(r, h)), arc(P(r, h - r), r, H, 2 * H), line(P(0, h - r), P(0, r)), arc(P(r, r), r, 2 * H, 3 * H)]
    # slot: points within width/2 of the segment a-b (README, part format)
    a, b, sw = P(40, 30), P(90, 75), M('12.5')
    dx, dy = b[0] - a[0], b[1] - a[1]
    L, sr = mp.sqrt(dx * dx + dy * dy), sw / 2
    nx, ny = -dy / L * sr, dx / L * sr
    th = mp.atan2(dy, dx)
    slot = [line((a[0] - nx, a[1] - ny), (b[0] - nx, b[1] - ny)), arc(b, sr, th - H, th + H),
            line((b[0] + nx, b[1] + ny), (a[0] + nx, a[1] + ny)), arc(a, sr, th + H, th + 3 * H)]
    circle = [arc(P(150, 40), M(15), 0, 2 * mp.pi)]
    d_shape = [line(P(130, 85), P(170, 85)), arc(P(150, 85), M(20), 0, mp.pi)]
    obj = {'part': 'site sweep plate (invented test data)', 'units': 'mm',
           'outline': {'rectangle': {'corner': [fmt(X), fmt(Y)], 'size': [200, 120], 'cornerRadius': 15}},
           'cutouts': [{'slot': {'from': [fmt(a[0]), fmt(a[1])], 'to': [fmt(b[0]), fmt(b[1])], 'width': 12.5}},
                       {'circle': {'center': [fmt(X + 150), fmt(Y + 40)], 'diameter': 30}},
                       {'path': {'start': [fmt(X + 130), fmt(Y + 85)], 'segments': [
                           {'to': [fmt(X + 170), fmt(Y + 85)]},
                           {'to': [fmt(X + 130), fmt(Y + 85)], 'center': [fmt(X + 150), fmt(Y + 85)], 'turn': 'ccw'}]}}]}
    text = json.dumps(obj, indent=1)
    # numbers as written: JSON numbers, not strings
    for v in [X, Y, X + 150, Y + 40, X + 130, X + 170, Y + 85, X + 150, a[0], a[1], b[0], b[1]]:
        text = text.replace(f'"{fmt(v)}"', fmt(v))
    return text, properties(outline, [slot, circle, d_shape], P(100, 60))


# ---------------------------------------------------------------- SVG
SVG_H = M(2) ** 24   # viewBox height: y_up = H - y_svg


def svg_arc(x1, y1, rx, ry, phi_deg, large, sweep, x2, y2):
    """SVG 1.1 F.6.5 in SVG coordinates (y down); returns the arc as an elliptical arc in y-up coordinates."""
    phi = mp.radians(phi_deg)
    cp, sn = mp.cos(phi), mp.sin(phi)
    dx, dy = (x1 - x2) / 2, (y1 - y2) / 2
    x1p, y1p = cp * dx + sn * dy, -sn * dx + cp * dy
    assert x1p ** 2 / rx ** 2 + y1p ** 2 / ry ** 2 < 1
    coef = mp.sqrt((rx ** 2 * ry ** 2 - rx ** 2 * y1p ** 2 - ry ** 2 * x1p ** 2) / (rx ** 2 * y1p ** 2 + ry ** 2 * x1p ** 2))
    if large == sweep:
        coef = -coef
    cxp, cyp = coef * rx * y1p / ry, -coef * ry * x1p / rx
    cx, cy = cp * cxp - sn * cyp + (x1 + x2) / 2, sn * cxp + cp * cyp + (y1 + y2) / 2
    ux, uy, vx, vy = (x1p - cxp) / rx, (y1p - cyp) / ry, (-x1p - cxp) / rx, (-y1p - cyp) / ry
    th1 = mp.atan2(uy, ux)
    dth = mp.atan2(ux * vy - uy * vx, ux * vx + uy * vy)
    if sweep and dth < 0:
        dth += 2 * mp.pi
    if not sweep and dth > 0:
        dth -= 2 * mp.pi
    # y-up image: (x, y) -> (x, H - y) flips the rotation and the parameter direction
    return ell((cx, SVG_H - cy), rx, ry, -phi, -th1, -(th1 + dth))


def svg(X, Y):
    Ys = SVG_H - Y     # the plate's lower-left corner at (X, Y) in y-up coordinates
    S = lambda x, y: (X + x, Ys - y)            # SVG coordinates of a point (x, y) above the corner
    U = lambda p: (p[0], SVG_H - p[1])           # SVG point -> y-up point
    c = [S(0, 0), S(150, 0), S(200, 50), S(200, 120), S(0, 120)]
    outline = [line(U(c[0]), U(c[1])), svg_arc(*c[1], M(60), M(40), 20, 0, 0, *c[2]), line(U(c[2]), U(c[3])),
               line(U(c[3]), U(c[4])), svg_arc(*c[4], M(90), M(70), -15, 0, 0, *c[0])]
    d = (f'M {fmt(c[0][0])} {fmt(c[0][1])} L {fmt(c[1][0])} {fmt(c[1][1])} A 60 40 20 0 0 {fmt(c[2][0])} {fmt(c[2][1])} '
         f'L {fmt(c[3][0])} {fmt(c[3][1])} L {fmt(c[4][0])} {fmt(c[4][1])} A 90 70 -15 0 0 {fmt(c[0][0])} {fmt(c[0][1])} Z')
    # <ellipse> turned 25° about its centre: on screen (y down) rotate() turns clockwise seen with y up
    ec = S(60, 50)
    ellipse = [ell(U(ec), M(25), M(12), -mp.radians(25), 0, 2 * mp.pi)]
    cc = S(150, 75)
    circle = [arc(U(cc), M(18), 0, 2 * mp.pi)]
    text = ('<svg xmlns="http://www.w3.org/2000/svg" width="16777216mm" height="16777216mm" viewBox="0 0 16777216 16777216">\n'
            f'  <!-- invented test data -->\n  <path d="{d}"/>\n'
            f'  <ellipse cx="{fmt(ec[0])}" cy="{fmt(ec[1])}" rx="25" ry="12" transform="rotate(25 {fmt(ec[0])} {fmt(ec[1])})"/>\n'
            f'  <circle cx="{fmt(cc[0])}" cy="{fmt(cc[1])}" r="18"/>\n</svg>\n')
    return text, properties(outline, [ellipse, circle], (X + 100, Y + 60))


# ---------------------------------------------------------------- DXF
def dxf(X, Y):
    P = lambda x, y: (X + x, Y + y)
    verts = [(P(0, 0), M('0.3')), (P(200, 0), M(0)), (P(200, 120), M('-0.1')), (P(0, 120), M(0))]
    outline = []
    for i, (p, b) in enumerate(verts):
        q = verts[(i + 1) % len(verts)][0]
        if b == 0:
            outline.append(line(p, q))
            continue
        dx, dy = q[0] - p[0], q[1] - p[1]
        d = mp.sqrt(dx * dx + dy * dy)
        k = (1 - b * b) / (4 * b)
        c = ((p[0] + q[0]) / 2 - dy * k, (p[1] + q[1]) / 2 + dx * k)
        r = d * (1 + b * b) / (4 * abs(b))
        a0 = mp.atan2(p[1] - c[1], p[0] - c[0])
        outline.append(arc(c, r, a0, a0 + 4 * mp.atan(b)))
    circle = [arc(P(150, 60), M(20), 0, 2 * mp.pi)]
    # ELLIPSE: centre, major-axis end point relative to it (24, 10): length 26, ratio 0.5
    ec, mx, my, ratio = P(60, 60), M(24), M(10), M('0.5')
    rx = mp.sqrt(mx * mx + my * my)
    ellipse = [ell(ec, rx, rx * ratio, mp.atan2(my, mx), 0, 2 * mp.pi)]
    doc = ezdxf.new('R2010')
    doc.header['$INSUNITS'] = 4
    msp = doc.modelspace()
    msp.add_lwpolyline([(float(p[0]), float(p[1]), 0, 0, float(b)) for p, b in verts], format='xyseb', close=True)
    msp.add_circle((float(X + 150), float(Y + 60)), 20)
    msp.add_ellipse((float(ec[0]), float(ec[1])), major_axis=(24, 10), ratio=0.5)
    for v in [p for p, _ in verts] + [ec, P(150, 60)]:
        assert M(float(v[0])) == v[0] and M(float(v[1])) == v[1]
    out = io.StringIO()
    doc.write(out)
    return out.getvalue(), properties(outline, [circle, ellipse], P(100, 60))


# ---------------------------------------------------------------- GeoJSON and WKT
def straight(X, Y):
    P = lambda x, y: (X + x, Y + y)
    outer = [P(0, 0), P(200, 0), P(200, 40), P(150, 120), P(0, 120)]
    hole = [P(30, 30), P(30, 80), P(90, 95), P(110, 35)]
    return outer, hole


def geojson(X, Y):
    outer, hole = straight(X, Y)
    ring = lambda pts: [[float(x), float(y)] for x, y in pts + pts[:1]]
    text = json.dumps({'type': 'Polygon', 'coordinates': [ring(outer), ring(list(reversed(hole)))]})
    return text, properties(polygon(outer), [polygon(hole)], (X + 100, Y + 60))


def wkt(X, Y):
    outer, hole = straight(X, Y)
    ring = lambda pts: '(' + ', '.join(f'{fmt(x)} {fmt(y)}' for x, y in pts + pts[:1]) + ')'
    return f'POLYGON ({ring(outer)}, {ring(list(reversed(hole)))})', properties(polygon(outer), [polygon(hole)], (X + 100, Y + 60))


OUT = {}
for fmt_name, make, ext in [('part-json', part_json, 'json'), ('svg', svg, 'svg'), ('dxf', dxf, 'dxf'), ('geojson', geojson, 'geojson'), ('wkt', wkt, 'wkt')]:
    for off, (X, Y) in OFFSETS.items():
        text, ref = make(X, Y)
        OUT[f'{fmt_name} {off}'] = {'format': fmt_name, 'label': f'sweep.{ext}', 'text': text,
                                     'ref': {k: mp.nstr(v, 40) for k, v in ref.items()}}

path = __file__.rsplit('/', 1)[0] + '/data/site-sweep.json'
with open(path, 'w') as f:
    json.dump(OUT, f, indent=1)
    f.write('\n')
for k, v in OUT.items():
    print(k, v['ref']['area'])
