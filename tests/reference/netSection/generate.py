#!/usr/bin/python3
"""
References for the net section along a line (tests/reference/netSection.test.ts), from shapely
(python3-shapely, Debian): LineString ∩ Polygon length on invented random plates.

Each plate (invented data, seeded) is a rectangle with rounded corners (quarter-circle arcs) and circular
holes that neither touch each other nor the outline. shapely sees the curves as polygons whose vertices lie
on the exact circles (N vertices per full turn), so its lengths differ from the exact ones by at most the
polygonisation allowance written beside each reference: for a circle of radius r at distance h from a
line piece, each crossing moves by at most √(r² − h²) − √(max(0, (r cos(π/N))² − h²)) (the inscribed
polygon lies between the circle and the circle of radius r cos(π/N)). Run with /usr/bin/python3; the output
refs.json is committed so CI needs no python.
"""
import json
import math
import random

from shapely.geometry import LineString, Polygon

N = 4096  # vertices per full turn
SHRINK = math.cos(math.pi / N)


def arc_points(cx, cy, r, a0, a1, n, ends=False):
    return [(cx + r * math.cos(a0 + (a1 - a0) * i / n), cy + r * math.sin(a0 + (a1 - a0) * i / n)) for i in range(n + 1 if ends else n)]


def plate(rng):
    w, h = rng.uniform(150, 400), rng.uniform(100, 300)
    x0, y0 = rng.uniform(-50, 50), rng.uniform(-50, 50)
    rc = rng.uniform(5, min(w, h) / 4)
    x1, y1 = x0 + w, y0 + h
    corners = [(x1 - rc, y0 + rc, -math.pi / 2), (x1 - rc, y1 - rc, 0.0), (x0 + rc, y1 - rc, math.pi / 2), (x0 + rc, y0 + rc, math.pi)]
    segs, pts = [], []
    for i, (cx, cy, a) in enumerate(corners):
        segs.append({"kind": "arc", "cx": cx, "cy": cy, "r": rc, "a0": a, "a1": a + math.pi / 2})
        pts += arc_points(cx, cy, rc, a, a + math.pi / 2, N // 4, ends=True)
        ncx, ncy, na = corners[(i + 1) % 4]
        ex, ey = cx + rc * math.cos(a + math.pi / 2), cy + rc * math.sin(a + math.pi / 2)
        sx, sy = ncx + rc * math.cos(na), ncy + rc * math.sin(na)
        segs.append({"kind": "line", "x0": ex, "y0": ey, "x1": sx, "y1": sy})
    holes, hole_pts, circles = [], [], [(cx, cy, rc) for cx, cy, _ in corners]
    for _ in range(rng.randint(2, 9)):
        for _try in range(50):
            r = rng.uniform(4, 16)
            cx, cy = rng.uniform(x0 + rc + r + 2, x1 - rc - r - 2), rng.uniform(y0 + r + 2, y1 - r - 2)
            if all(math.hypot(cx - q[0], cy - q[1]) > r + q[2] + 2 for q in circles[4:]):
                break
        else:
            continue
        circles.append((cx, cy, r))
        # clockwise, as the part format keeps holes
        holes.append([{"kind": "arc", "cx": cx, "cy": cy, "r": r, "a0": 0.0, "a1": -math.pi},
                      {"kind": "arc", "cx": cx, "cy": cy, "r": r, "a0": -math.pi, "a1": -2 * math.pi}])
        hole_pts.append(arc_points(cx, cy, r, 0.0, 2 * math.pi, N))
    box = (x0, y0, x1, y1)
    return segs, holes, Polygon(pts), Polygon(pts, hole_pts), circles, box


def allowance(points, circles):
    a = 0.0
    for (px, py), (qx, qy) in zip(points, points[1:]):
        L = math.hypot(qx - px, qy - py)
        ux, uy = (qx - px) / L, (qy - py) / L
        for cx, cy, r in circles:
            h = abs((cx - px) * uy - (cy - py) * ux)
            if h < r:
                a += 2 * (math.sqrt(r * r - h * h) - math.sqrt(max(0.0, (r * SHRINK) ** 2 - h * h)))
    return a + 1e-9


def main():
    rng = random.Random(20261202)
    cases = []
    for k in range(30):
        segs, holes, hull, poly, circles, (x0, y0, x1, y1) = plate(rng)
        size = max(x1 - x0, y1 - y0)
        for j in range(4):
            if j < 3:
                th = rng.uniform(0, math.pi)
                # a line through a hole centre half of the time, else through a random point
                cx, cy = (circles[rng.randrange(4, len(circles))][:2] if rng.random() < 0.5 and len(circles) > 4
                          else (rng.uniform(x0, x1), rng.uniform(y0, y1)))
                R = 2 * size
                points = [(cx - R * math.cos(th), cy - R * math.sin(th)), (cx + R * math.cos(th), cy + R * math.sin(th))]
            else:
                # a staggered chain: below the plate, a point inside, above the plate
                points = [(rng.uniform(x0, x1), y0 - 20), (rng.uniform(x0 + 10, x1 - 10), rng.uniform(y0 + 10, y1 - 10)), (rng.uniform(x0, x1), y1 + 20)]
            ls = LineString(points)
            gross, net = ls.intersection(hull).length, ls.intersection(poly).length
            if gross <= 0:
                continue
            cases.append({"plate": k, "outer": segs, "holes": holes, "points": [list(p) for p in points],
                          "gross": gross, "net": net, "allowance": allowance(points, circles)})
    with open(__file__.replace("generate.py", "refs.json"), "w") as f:
        json.dump({"source": "shapely " + __import__("shapely").__version__ + ", LineString ∩ Polygon length; invented plates (seed 20261202)", "cases": cases}, f)
    print(len(cases), "cases")


main()
