import { describe, expect, it } from 'vitest';
import { readPartJson } from '../../src/read/partJson.js';
import { measureObj } from '../helpers.js';

const bad = (obj: unknown) => () => measureObj(obj);

describe('part description: messages name the JSON path and what was expected', () => {
  const cases: [string, unknown, RegExp][] = [
    ['negative diameter', { outline: { rectangle: { corner: [0, 0], size: [100, 100] } }, cutouts: [{ circle: { center: [1, 1], diameter: 1 } }, { circle: { center: [1, 1], diameter: 1 } }, { circle: { center: [50, 50], diameter: 2 } }, { circle: { center: [50, 50], diameter: -5 } }] },
      /^cutouts\[3\]\.circle\.diameter: expected a positive number, got -5$/],
    ['missing outline', { part: 'x' }, /^outline: expected the outline shape \(missing\)$/],
    ['unknown top key', { outline: { circle: { center: [0, 0], diameter: 1 } }, cutout: [] }, /^cutout: unknown key; expected one of part, units, .*outline, .*cutouts/],
    ['unknown unit', { units: 'furlong', outline: { circle: { center: [0, 0], diameter: 1 } } }, /^units: expected one of mm, cm, m, in, ft, got "furlong"$/],
    ['two shape kinds', { outline: { circle: { center: [0, 0], diameter: 1 }, polygon: [] } }, /^outline: expected exactly one of rectangle, circle, slot, polygon, path/],
    ['point of wrong length', { outline: { circle: { center: [0], diameter: 1 } } }, /^outline\.circle\.center: expected a point \[x, y\], got an array of 1$/],
    ['string coordinate', { outline: { polygon: [[0, 0], [1, '0'], [0, 1]] } }, /^outline\.polygon\[1\]\[1\]: expected a number, got "0"$/],
    ['huge coordinate', { outline: { polygon: [[0, 0], [1e308, 0], [0, 1]] } }, /^outline\.polygon\[1\]\[0\]: coordinate 1e\+308 is out of range/],
    ['repeated point', { outline: { polygon: [[0, 0], [1, 0], [1, 0], [0, 1]] } }, /^outline\.polygon\[2\]: repeats the point before it/],
    ['corner radius too big', { outline: { rectangle: { corner: [0, 0], size: [10, 4], cornerRadius: 3 } } }, /^outline\.rectangle\.cornerRadius: expected a number from 0 to half the shorter side \(2\), got 3$/],
    ['arc end off the circle', { outline: { path: { start: [10, 0], segments: [{ to: [0, 12], center: [0, 0], turn: 'ccw' }, { to: [0, 0] }] } } }, /^outline\.path\.segments\[0\]\.to: expected a point at the arc's radius 10 from the centre, got one at 12$/],
    ['bad turn', { outline: { path: { start: [10, 0], segments: [{ to: [0, 10], center: [0, 0], turn: 'left' }] } } }, /^outline\.path\.segments\[0\]\.turn: expected "ccw" or "cw", got "left"$/],
    ['bow-tie', { outline: { polygon: [[0, 0], [10, 10], [10, 0], [0, 10]] } }, /^outline\.polygon: crosses or touches itself near \(5, 5\)/],
    ['hole outside', { outline: { rectangle: { corner: [0, 0], size: [10, 10] } }, cutouts: [{ circle: { center: [30, 5], diameter: 2 } }] }, /^cutouts\[0\]\.circle: lies outside outline\.rectangle: it removes no material/],
    ['tangent holes', { outline: { rectangle: { corner: [0, 0], size: [100, 100] } }, cutouts: [{ circle: { center: [40, 50], diameter: 20 } }, { circle: { center: [60, 50], diameter: 20 } }] }, /crosses or touches cutouts\[\d\]\.circle near \(50, 50\)/],
    ['zero-area sliver', { outline: { polygon: [[0, 0], [10, 0], [20, 0]] } }, /^outline\.polygon: (encloses no area|crosses or touches itself)/],
  ];
  for (const [name, obj, re] of cases) it(name, () => expect(bad(obj)).toThrow(re));
});

describe('JSON syntax errors give line and column', () => {
  it('trailing comma', () => {
    expect(() => readPartJson('{\n  "outline": 1,\n}', 'p.json')).toThrow(/^p\.json:3:1: not valid JSON/);
  });
  it('truncated file', () => {
    expect(() => readPartJson('{"outline": {"circle"', 'p.json')).toThrow(/p\.json:1:\d+: not valid JSON/);
  });
});

describe('accepted forms', () => {
  it('a cut-out crossing the outline makes a notch; overlapping cut-outs merge (booleans keep the exact arcs)', () => {
    const notch = measureObj({ outline: { rectangle: { corner: [0, 0], size: [10, 10] } }, cutouts: [{ circle: { center: [10, 5], diameter: 2 } }] });
    // rectangle minus a half disc of radius 1 (closed form)
    expect(Math.abs(notch.quantities.area.value - (100 - Math.PI / 2)) / 100).toBeLessThan(1e-13);
    const two = measureObj({ outline: { rectangle: { corner: [0, 0], size: [100, 100] } }, cutouts: [{ circle: { center: [50, 50], diameter: 40 } }, { circle: { center: [50, 50], diameter: 10 } }] });
    // the small hole lies in the large one: the union is the large disc
    expect(Math.abs(two.quantities.area.value - (1e4 - Math.PI * 400)) / 1e4).toBeLessThan(1e-13);
  });

  it('regions: two plates in one part add up', () => {
    const r = measureObj({ regions: [
      { outline: { rectangle: { corner: [0, 0], size: [10, 10] } } },
      { outline: { rectangle: { corner: [20, 0], size: [10, 10] } }, cutouts: [{ circle: { center: [25, 5], diameter: 2 } }] },
    ] });
    expect(Math.abs(r.quantities.area.value - (200 - Math.PI))).toBeLessThan(1e-12);
  });
  it('a polygon may repeat its first point at the end; orientation is free', () => {
    const a = measureObj({ outline: { polygon: [[0, 0], [0, 5], [8, 5], [8, 0], [0, 0]] } });
    expect(a.quantities.area.value).toBeCloseTo(40, 12);
  });
  it('an island inside a cut-out as a second region is accepted', () => {
    const r = measureObj({ regions: [
      { outline: { rectangle: { corner: [0, 0], size: [100, 100] } }, cutouts: [{ circle: { center: [50, 50], diameter: 60 } }] },
      { outline: { circle: { center: [50, 50], diameter: 20 } } },
    ] });
    expect(Math.abs(r.quantities.area.value - (1e4 - Math.PI * 900 + Math.PI * 100)) / 1e4).toBeLessThan(1e-13);
  });
});
