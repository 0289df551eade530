/**
 * Plastic section moduli against closed forms (steel design handbooks and plastic-analysis texts, e.g.
 * Neal, "The Plastic Methods of Structural Analysis"; formulas from memory): rectangle Z = bh²/4, solid
 * circle d³/6, hollow circle (D³ − d³)/6; a T-section worked by hand (below).
 */
import { describe, expect, it } from 'vitest';
import { measureSection, preparePart } from '../../src/analysis/measure.js';
import { plasticSection } from '../../src/properties/plasticSection.js';
import { sideIntegrals } from '../../src/properties/plastic.js';
import type { Part } from '../../src/geometry/part.js';
import { partFromObject } from '../../src/read/partJson.js';

function run(p: Part) {
  const r = measureSection(p);
  return { r, pl: plasticSection(preparePart(p), r.quantities) };
}

function close(q: { value: number; error: number }, exact: number, tol: number, label: string) {
  const err = Math.abs(q.value - exact);
  console.log(`${label}: ${q.value} vs ${exact}, true error ${(err / Math.abs(exact || 1)).toExponential(2)} rel, estimate ${(q.error / Math.abs(exact || 1)).toExponential(2)}`);
  expect(err / Math.abs(exact || 1), label).toBeLessThanOrEqual(tol);
  expect(q.error, `${label}: estimate ≥ true error`).toBeGreaterThanOrEqual(err);
}

describe('plastic moduli, closed forms', () => {
  it('rectangle b × h: Zx = bh²/4, Zy = hb²/4, shape factor 1.5, axes through the centre', () => {
    const b = 80, h = 30;
    const { pl } = run(partFromObject({ outline: { rectangle: { corner: [5, -7], size: [b, h] } } }));
    close(pl.quantities.Zx, (b * h * h) / 4, 1e-12, 'rectangle Zx');
    close(pl.quantities.Zy, (h * b * b) / 4, 1e-12, 'rectangle Zy');
    close(pl.quantities.plasticAxisY, -7 + h / 2, 1e-12, 'rectangle PNA y');
    close(pl.quantities.plasticAxisX, 5 + b / 2, 1e-12, 'rectangle PNA x');
    close(pl.quantities.shapeFactorX, 1.5, 1e-12, 'rectangle shape factor');
    close(pl.quantities.Z1, (h * b * b) / 4, 1e-12, 'rectangle Z1 (major axis is y here)');
    close(pl.quantities.S1, (h * b * b) / 6, 1e-12, 'rectangle S1');
  });

  it('solid circle d: Z = d³/6 (shape factor 16/(3π)); hollow circle (D³ − d³)/6', () => {
    const d = 50;
    const { pl } = run(partFromObject({ outline: { circle: { center: [3, 4], diameter: d } } }));
    close(pl.quantities.Zx, d ** 3 / 6, 1e-12, 'circle Zx');
    close(pl.quantities.Zy, d ** 3 / 6, 1e-12, 'circle Zy');
    close(pl.quantities.shapeFactorX, 16 / (3 * Math.PI), 1e-12, 'circle shape factor');
    const D = 80, di = 60;
    const { pl: ph } = run(partFromObject({ outline: { circle: { center: [0, 0], diameter: D } }, cutouts: [{ circle: { center: [0, 0], diameter: di } }] }));
    close(ph.quantities.Zx, (D ** 3 - di ** 3) / 6, 1e-12, 'hollow circle Zx');
    close(ph.quantities.Z2, (D ** 3 - di ** 3) / 6, 1e-12, 'hollow circle Z2');
  });

  it('T-section by hand: flange 100 × 20 on a web 20 × 100 (total depth 120)', () => {
    // A = 2000 + 2000 = 4000; half the area lies in the flange, so the plastic neutral axis is the
    // flange's underside, y = 100. Zx = 2000·10 (flange centroid 10 above) + 2000·50 (web centroid 50
    // below) = 120000. Zy: both parts symmetric about x = 0: 20·100²/4 + 100·20²/4 = 50000 + 10000 = 60000.
    const T = partFromObject({ outline: { polygon: [[-10, 0], [10, 0], [10, 100], [50, 100], [50, 120], [-50, 120], [-50, 100], [-10, 100]] } });
    const { r, pl } = run(T);
    close(pl.quantities.Zx, 120000, 1e-12, 'T Zx');
    close(pl.quantities.Zy, 60000, 1e-12, 'T Zy');
    close(pl.quantities.plasticAxisY, 100, 1e-12, 'T PNA');
    // elastic: ȳ = (2000·110 + 2000·50)/4000 = 80; bottom fibre 80 away: S = Ix/80
    close(pl.quantities.shapeFactorX, 120000 / (r.quantities.Ix.value / 80), 1e-12, 'T shape factor');
  });

  it('side integrals: the half of a circle above its centre has area πR²/2 and first moment 2R³/3 about the cut', () => {
    const R = 7;
    const p = preparePart(partFromObject({ outline: { circle: { center: [1, 2], diameter: 2 * R } } }));
    const s = sideIntegrals(p, 0, 1, 2);
    expect(Math.abs(s.area - (Math.PI * R * R) / 2) / (R * R)).toBeLessThan(1e-14);
    expect(Math.abs(s.moment - (2 * R ** 3) / 3) / R ** 3).toBeLessThan(1e-14);
    // a line cutting off a circular segment of half-angle α at distance R cos α: area R²(α − sin α cos α)
    const a = 0.7, cut = sideIntegrals(p, Math.SQRT1_2, Math.SQRT1_2, Math.SQRT1_2 * 1 + Math.SQRT1_2 * 2 + R * Math.cos(a));
    expect(Math.abs(cut.area - R * R * (a - Math.sin(a) * Math.cos(a))) / (R * R)).toBeLessThan(1e-13);
  });

  it('a section turned 30°: principal moduli equal the unturned x/y moduli', () => {
    const b = 60, h = 20, t = Math.PI / 6, c = Math.cos(t), s = Math.sin(t);
    const pts = [[0, 0], [b, 0], [b, h], [0, h]].map(([x, y]) => [c * x - s * y + 100, s * x + c * y - 50]);
    const { pl } = run(partFromObject({ outline: { polygon: pts } }));
    close(pl.quantities.Z1, (h * b * b) / 4, 1e-11, 'turned Z1');
    close(pl.quantities.Z2, (b * h * h) / 4, 1e-11, 'turned Z2');
    close(pl.quantities.S2, (b * h * h) / 6, 1e-11, 'turned S2');
    close(pl.quantities.fibre2, h / 2, 1e-11, 'turned fibre2');
  });
});
