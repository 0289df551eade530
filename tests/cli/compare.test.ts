/**
 * `platewise compare` through the built command line (dist/cli/main.js; build with `npx tsc -p .` first):
 * verdicts on parts with closed-form properties, unit conversion, exit statuses, JSON and CSV output.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli as platewise } from '../helpers.js';
import { parseCsvRecords } from '../../src/base/csv.js';

const dir = mkdtempSync(join(tmpdir(), 'platewise-compare-'));

function file(name: string, content: unknown): string {
  const p = join(dir, name);
  writeFileSync(p, typeof content === 'string' ? content : JSON.stringify(content));
  return p;
}

// Plate 200 × 100 mm with a centred Ø40 hole. Closed forms (any mechanics handbook; rectangle bh³/12,
// circle πd⁴/64, both about their own centroids, which coincide here):
//   A  = 200·100 − π·40²/4 = 20000 − 400π
//   Ix = 200·100³/12 − π·40⁴/64,  Iy = 100·200³/12 − π·40⁴/64,  centroid (100, 50)
const plate = file('plate.json', {
  part: 'test plate (invented)', units: 'mm',
  outline: { rectangle: { corner: [0, 0], size: [200, 100] } },
  cutouts: [{ circle: { center: [100, 50], diameter: 40 } }],
});
const A = 20000 - 400 * Math.PI;
const Ix = (200 * 100 ** 3) / 12 - (Math.PI * 40 ** 4) / 64;
const Iy = (100 * 200 ** 3) / 12 - (Math.PI * 40 ** 4) / 64;

describe('compare: verdicts and exit statuses', () => {
  it('closed-form values in other units pass: exit 0, every row pass', () => {
    // unit conversions: 1 cm = 10 mm, 1 in = 25.4 mm exactly (NIST SP 811, appendix B)
    const ref = file('good.json', {
      values: [
        { quantity: 'area', value: A / 100, unit: 'cm²' },
        { quantity: 'centroidX', value: '10 cm' },
        { quantity: 'centroidY', value: 50 / 25.4, unit: 'in' },
        { quantity: 'Ix', value: Ix / 25.4 ** 4, unit: 'in^4', tolerance: '1e-6 rel' },
        { quantity: 'Iy', value: Iy / 1e4, unit: 'cm4' },
        { quantity: 'pierces', value: 2 }, // outer contour + one hole (common practice, no source)
        { quantity: 'cutLength', value: 600 + 40 * Math.PI, unit: 'mm' }, // 2(200+100) + πd
      ],
    });
    const r = platewise(['compare', plate, '--reference', ref]);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/verdict: pass — 7 pass, 0 fail, 0 inconclusive/);
    expect(r.stdout.replace(/\s+/g, " ")).toMatch(/not a structural, lifting or fitness-for-purpose check/);
  });

  it('one deliberate mismatch: exit 1, that row FAIL, no internal error on stderr', () => {
    const ref = file('bad.csv', 'quantity,value,unit,tolerance\r\narea,' + A + ',mm²,\r\ncentroidX,101,mm,0.5 mm\r\n');
    const r = platewise(['compare', plate, '--reference', ref]);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('');
    expect(r.stdout).toMatch(/^centroidX .*FAIL$/m);
    expect(r.stdout).toMatch(/^area .*pass$/m);
    expect(r.stdout).toMatch(/verdict: FAIL — 1 pass, 1 fail, 0 inconclusive/);
  });

  it('inconclusive when our own estimate is larger than the tolerance: exit 1', () => {
    // circle Ø100: A = π·100²/4 exactly (closed form). A low-degree rule gives a visible estimate e; with a
    // tolerance far below e and the stated value exact, |d| − e ≤ T < |d| + e, so neither pass nor fail.
    const circle = file('circle.json', { part: 'disc (invented)', units: 'mm', outline: { circle: { center: [0, 0], diameter: 100 } } });
    const ref = file('circle.ref.json', { values: [{ quantity: 'area', value: 2500 * Math.PI, unit: 'mm²', tolerance: '1e-12 mm²' }] });
    const j = platewise(['compare', circle, '--reference', ref, '--degree', '2', '--json']);
    expect(j.status).toBe(1);
    const doc = JSON.parse(j.stdout);
    expect(doc.verdict).toBe('inconclusive');
    expect(doc.rows[0].verdict).toBe('inconclusive');
    expect(doc.rows[0].error).toBeGreaterThan(1e-12);
    expect(Math.abs(doc.rows[0].difference)).toBeLessThanOrEqual(doc.rows[0].error + 1e-12);
  });

  it('a stated mass without thickness is inconclusive with a reason; with them it passes', () => {
    // 1000 × 500 × 10 mm steel at 7850 kg/m³ (EN 1993-1-1, 3.2.6): 0.5 m² × 0.01 m × 7850 = 39.25 kg
    const sheet = file('sheet.json', { part: 'sheet (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [1000, 500] } } });
    const ref = file('sheet.ref.json', { values: [{ quantity: 'netMass', value: 39.25, unit: 'kg' }, { quantity: 'blankMass', value: 39.25 / 0.45359237, unit: 'lb' }] });
    const none = platewise(['compare', sheet, '--reference', ref, '--json']);
    expect(none.status).toBe(1);
    expect(JSON.parse(none.stdout).rows[0].note).toMatch(/needs a thickness and a density/);
    const ok = platewise(['compare', sheet, '--reference', ref, '--thickness', '10 mm', '--material', 'steel']);
    expect(ok.status).toBe(0);
    expect(ok.stdout).toMatch(/Caution: masses and centres of gravity come from the geometry/);
    // the same thickness given in inches (10 mm = 10/25.4 in) and density in g/cm³
    const inch = platewise(['compare', sheet, '--reference', ref, '--thickness', `${10 / 25.4} in`, '--density', '7.85 g/cm3']);
    expect(inch.status).toBe(0);
  });

  it('mass properties from the part file\'s own thickness and material (src/analysis/plate.ts)', () => {
    // 1000 × 500 × 10 mm steel (7850 kg/m³, EN 1993-1-1, 3.2.6): m = 39.25 kg; weight m·g with standard gravity
    // 9.80665 m/s² (NIST SP 811); mass moment about the plate normal m(a² + b²)/12 (thin rectangular plate,
    // handbook closed form) = 39.25·(1 + 0.25)/12 kg·m²; centre of mass at half the thickness
    const own = file('own.json', { part: 'sheet with plate data (invented)', units: 'mm', thickness: 10, material: 'steel', outline: { rectangle: { corner: [0, 0], size: [1000, 500] } } });
    const m = 39.25;
    const ref = file('own.ref.json', { values: [
      { quantity: 'mass', value: m, unit: 'kg', tolerance: '1e-9 rel' },
      { quantity: 'netMass', value: m * 1000, unit: 'g', tolerance: '1e-9 rel' },
      { quantity: 'weight', value: (m * 9.80665) / 1000, unit: 'kN', tolerance: '1e-9 rel' },
      { quantity: 'massMomentZ', value: (m * 1.25) / 12, unit: 'kg·m²', tolerance: '1e-9 rel' },
      { quantity: 'massCentreZ', value: 5, unit: 'mm' },
    ] });
    const r = platewise(['compare', own, '--reference', ref, '--json']);
    expect(r.status, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout).counts).toEqual({ pass: 5, fail: 0, inconclusive: 0 });
    // a thickness in the file and on the command line: one place only (exit 2)
    const twice = platewise(['compare', own, '--reference', ref, '--thickness', '8']);
    expect(twice.status).toBe(2);
    expect(twice.stderr).toMatch(/^platewise: --thickness: the part file already gives a thickness/);
  });

  it('--csv is RFC 4180 with one record per stated value and round-trip numbers', () => {
    const ref = file('csvout.json', { values: [{ quantity: 'area', value: A, unit: 'mm²' }, { quantity: 'Ix', value: Ix * 1.01, unit: 'mm⁴' }] });
    const r = platewise(['compare', plate, '--reference', ref, '--csv']);
    expect(r.status).toBe(1);
    const t = parseCsvRecords(r.stdout, 'out');
    expect(t.records.map((x) => [x.quantity, x.verdict])).toEqual([['area', 'pass'], ['Ix', 'fail']]);
    expect(Number(t.records[0]['stated [statedUnit]'])).toBe(A);
    expect(Math.abs(Number(t.records[0]['computed [unit]']) - A) / A).toBeLessThan(1e-12);
    // units in the headings: a heading's brackets name the column that holds the row's unit
    for (const h of t.header) {
      const m = /\[(.*)\]$/.exec(h);
      if (m) expect(t.header).toContain(m[1]);
    }
    expect(t.records.map((x) => x.unit)).toEqual(['mm²', 'mm⁴']);
    // --decimal-comma: the same records with semicolons and decimal commas, the same numbers
    const dc = platewise(['compare', plate, '--reference', ref, '--csv', '--decimal-comma']);
    expect(dc.status).toBe(1);
    const u = parseCsvRecords(dc.stdout, 'out', { separator: ';' });
    expect(u.header).toEqual(t.header);
    expect(u.records[1]['computed [unit]']).toContain(',');
    expect(Number(u.records[1]['computed [unit]'].replace(',', '.'))).toBe(Number(t.records[1]['computed [unit]']));
    expect(platewise(['compare', plate, '--reference', ref, '--decimal-comma']).status).toBe(2);
  });
});

describe('compare: member figures stated on a sheet (plastic and torsion groups)', () => {
  // Closed forms (common practice, no source; the torsion tests in tests/analysis/torsion.test.ts check the
  // same): a solid circle of diameter d has J = πd⁴/32 and τmax/T = 16/(πd³); a rectangle b × h has the
  // plastic modulus Zx = b·h²/4 about its centroidal x axis, and warping constant Iw of a circle is 0.
  const disc = file('disc.json', { part: 'disc (invented)', units: 'mm', outline: { circle: { center: [0, 0], diameter: 40 } } });
  const bar = file('bar.json', { part: 'bar (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [100, 20] } } });

  it('J and τmax/T of a disc against πd⁴/32 and 16/(πd³), in several unit spellings: every row passes', () => {
    const refs = [
      file('disc-ref-mm.json', { values: [
        { quantity: 'J', value: Math.PI * 40 ** 4 / 32, unit: 'mm4', tolerance: '0.1%' },
        { quantity: 'tauPerTorque', value: 16 / (Math.PI * 40 ** 3), unit: 'mm^-3', tolerance: '0.5%' },
      ] }),
      file('disc-ref-cm.json', { values: [
        { quantity: 'J', value: Math.PI * 4 ** 4 / 32, unit: 'cm⁴', tolerance: '0.1%' },
        { quantity: 'tauPerTorque', value: 16 / (Math.PI * 4 ** 3), unit: '1/cm³', tolerance: '0.5%' },
      ] }),
    ];
    for (const ref of refs) {
      const r = platewise(['compare', disc, '--reference', ref, '--csv']);
      expect(r.status, r.stderr).toBe(0);
      const t = parseCsvRecords(r.stdout, 'out');
      expect(t.records.map((x) => [x.quantity, x.verdict])).toEqual([['J', 'pass'], ['tauPerTorque', 'pass']]);
    }
  });

  it('Zx of a bar against b·h²/4 (plastic group); a wrong Zx fails', () => {
    const ref = file('bar-ref.json', { values: [{ quantity: 'Zx', value: 100 * 20 ** 2 / 4, unit: 'mm³' }, { quantity: 'Zy', value: 20 * 100 ** 2 / 4 * 1.5, unit: 'mm³', note: 'deliberately wrong' }] });
    const r = platewise(['compare', bar, '--reference', ref]);
    expect(r.status).toBe(1);
    expect(r.stdout).toMatch(/^Zx .* pass$/m);
    expect(r.stdout).toMatch(/^Zy .* FAIL$/m);
    // no torsion stated: no torsion solve and no prismatic-member note
    expect(r.stdout).not.toMatch(/prismatic member/);
  });

  it('torsion stated: the prismatic-member note is printed with the verdicts', () => {
    const ref = file('disc-ref2.json', { values: [{ quantity: 'J', value: Math.PI * 40 ** 4 / 32, unit: 'mm4', tolerance: '0.1%' }] });
    const r = platewise(['compare', disc, '--reference', ref]);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/prismatic\s+member/);
  });

  it('a plate of two layers has no member figures: the row says why, the verdict is inconclusive', () => {
    const ref = file('td5-ref.json', { values: [{ quantity: 'J', value: 1, unit: 'mm4' }] });
    const r = platewise(['compare', 'samples/tapered-doubler-td5.json', '--reference', ref]);
    expect(r.status).toBe(1);
    expect(r.stdout).toMatch(/member figures need a plate of one shape; this one has 2 layers/);
  });

  it('units of the warping constant and of τmax/T are read; a unit of the wrong power is refused in words', () => {
    const ok = file('iw-ref.json', { values: [{ quantity: 'Iw', value: 0, unit: 'mm6', tolerance: '1 mm6' }] });
    expect(platewise(['compare', disc, '--reference', ok]).stderr).not.toMatch(/unknown unit/);
    const bad = file('tau-bad.json', { values: [{ quantity: 'tauPerTorque', value: 1, unit: 'mm^-4' }] });
    const r = platewise(['compare', disc, '--reference', bad]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/unknown unit "mm\^-4"; expected a unit of length⁻³ \(mm⁻³/);
  });
});

describe('compare --digits-tolerance', () => {
  // the perimeter of the plate above: 2(200 + 100) + 40π = 725.6637 mm (closed form); stated as 0.7257 m
  // it is 0.036 mm off: fails the default 0.01 mm + 0.01 % of the diagonal (0.032 mm), passes ± 0.00005 m
  const ref = file('digits.csv', 'quantity,value,unit\nperimeter,0.7257,m\narea,18743,mm²\n');
  it('JSON and CSV say the tolerance came from the stated digits', () => {
    expect(platewise(['compare', plate, '--reference', ref, '--json']).status).toBe(1);
    const j = platewise(['compare', plate, '--reference', ref, '--json', '--digits-tolerance']);
    expect(j.status, j.stdout + j.stderr).toBe(0);
    const rows = JSON.parse(j.stdout).rows;
    expect(rows[0]).toMatchObject({ quantity: 'perimeter', verdict: 'pass', toleranceSource: 'digits', toleranceText: 'half the last stated digit: ± 0.00005 m' });
    expect(rows[0].tolerance).toBeCloseTo(0.05, 12);
    const c = parseCsvRecords(platewise(['compare', plate, '--reference', ref, '--csv', '--digits-tolerance']).stdout, 'out');
    expect(c.records.map((x) => [x.toleranceSource, x.verdict])).toEqual([['digits', 'pass'], ['digits', 'pass']]);
  });
});

describe('compare: bad input exits 2 with one line', () => {
  const cases: [string, string | object, RegExp][] = [
    ['unknown quantity', { values: [{ quantity: 'aera', value: 1, unit: 'mm²' }] }, /values\[0\]\.quantity: unknown quantity "aera"; did you mean "area"\?/],
    ['no unit', { values: [{ quantity: 'area', value: 1 }] }, /expected a unit of area .* units are never assumed/],
    ['wrong dimension', { values: [{ quantity: 'area', value: 1, unit: 'mm' }] }, /"mm" is a unit of length; expected a unit of area/],
    ['bare tolerance', { values: [{ quantity: 'Ix', value: 1, unit: 'mm4', tolerance: 0.1 }] }, /a bare number is unclear/],
  ];
  for (const [name, ref, msg] of cases) {
    it(name, () => {
      const p = file(`e-${name.replace(/\s/g, '')}.json`, ref);
      const r = platewise(['compare', plate, '--reference', p]);
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(msg);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
    });
  }
  it('--json with --csv, and an unknown material', () => {
    const ref = file('ok.json', { values: [{ quantity: 'area', value: A, unit: 'mm²' }] });
    expect(platewise(['compare', plate, '--reference', ref, '--json', '--csv']).status).toBe(2);
    const m = platewise(['compare', plate, '--reference', ref, '--thickness', '5', '--material', 'unobtainium']);
    expect(m.status).toBe(2);
    expect(m.stderr).toMatch(/^platewise: --material: unknown material "unobtainium"/);
  });
  it('missing reference file', () => {
    const r = platewise(['compare', plate, '--reference', join(dir, 'nope.json')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/nope\.json: no such file/);
  });
});

describe('compare --help', () => {
  it('describes the stated-values file, the default tolerances and the verdict rule', () => {
    const r = platewise(['compare', '--help']);
    expect(r.status).toBe(0);
    for (const s of ['quantity,value,unit,tolerance,note', '"values"', 'Default tolerances', 'lengths 0.01 mm + 0.01 % of the part size', 'masses and forces 0.5 %', '--digits-tolerance', 'inconclusive', 'Exit status']) {
      expect(r.stdout).toContain(s);
    }
    // every line fits 100 columns
    for (const line of r.stdout.split('\n')) expect(line.length).toBeLessThanOrEqual(100);
  });
});
