import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { GEOMETRY_CAUTION, NET_SECTION_NOTE } from '../../src/output/cautions.js';
import { PRISMATIC_NOTE } from '../../src/output/memberText.js';
import { runCli } from '../helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'pw-member-'));
const file = join(dir, 'circle.json');
writeFileSync(file, JSON.stringify({ part: 'disc', units: 'mm', outline: { circle: { center: [0, 0], diameter: 100 } }, cutouts: [{ circle: { center: [20, 0], diameter: 10 } }] }));

describe('platewise member', () => {
  it('prints JSON in the chosen unit with the cautions; J of a disc with a small hole lies below πd⁴/32', () => {
    const r = runCli(['member', file, '--json', '--print-unit', 'cm', '--bolts']);
    expect(r.status, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.cautions).toEqual([GEOMETRY_CAUTION, PRISMATIC_NOTE]);
    const p = j.parts[0];
    expect(p.unit).toBe('cm');
    expect(p.torsion.J.unit).toBe('cm⁴');
    expect(p.plastic.Zx.unit).toBe('cm³');
    expect(p.torsion.Iw.unit).toBe('cm⁶');
    expect(p.torsion.J.value).toBeLessThan(Math.PI * 10 ** 4 / 32);
    expect(p.torsion.J.value).toBeGreaterThan(0.9 * Math.PI * 10 ** 4 / 32);
    expect(p.boltGroup.count).toBe(1);
    expect(p.boltGroup.centroid[0]).toBeCloseTo(2, 12);
  });

  it('prints a table with the caution, and without the prismatic note when torsion is skipped', () => {
    const r = runCli(['member', file, '--no-torsion', '--print-unit', 'in']);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toContain(GEOMETRY_CAUTION);
    expect(r.stdout).not.toContain(PRISMATIC_NOTE);
    expect(r.stdout).toMatch(/Zx\s+[\d.]+ ± \S+\s+in³/);
  });

  it('refuses a bad unit with exit 2', () => {
    const r = runCli(['member', file, '--print-unit', 'furlong']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('--print-unit');
  });

  // invented splice plate: 300 × 200, t = 10, three Ø22 holes
  const plate = join(dir, 'plate.json');
  writeFileSync(plate, JSON.stringify({
    part: 'splice (invented)', units: 'mm', thickness: 10, outline: { rectangle: { corner: [0, 0], size: [300, 200] } },
    cutouts: [[100, 40], [100, 160], [160, 100]].map((center) => ({ circle: { center, diameter: 22 } })),
  }));

  it('--net-line: lengths, runs and net area in the print unit, with the net-section note (width − n·d, common practice, no source)', () => {
    const r = runCli(['member', plate, '--no-torsion', '--json', '--print-unit', 'cm', '--net-line', '100,-10 100,210', '--net-line', '100,-10 100,40 160,100 100,160 100,210']);
    expect(r.status, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.cautions).toEqual([GEOMETRY_CAUTION, NET_SECTION_NOTE]);
    const [straight, chain] = j.parts[0].netSections;
    expect(straight.grossLength.unit).toBe('cm');
    expect(Math.abs(straight.grossLength.value - 20)).toBeLessThanOrEqual(straight.grossLength.error + 1e-14);
    expect(Math.abs(straight.netLength.value - (20 - 2 * 2.2))).toBeLessThanOrEqual(straight.netLength.error + 1e-14);
    expect(straight.netArea.unit).toBe('cm²');
    expect(Math.abs(straight.netArea.value - 15.6)).toBeLessThanOrEqual(straight.netArea.error + 1e-13);
    expect(straight.intervals.map((i: { from: number }) => i.from)).toEqual([1, 6.1, 18.1].map((v) => expect.closeTo(v, 12)));
    // chain by hand: 2 × 29 straight, and two diagonals of 60√2 each minus the three holes' halves on them
    const net = 2 * 29 + 2 * (60 * Math.SQRT2 - 22);
    expect(Math.abs(chain.netLength.value * 10 - net)).toBeLessThanOrEqual(chain.netLength.error * 10 + 1e-12);
  });

  it('--net-line: a missed part, a malformed line, a thickness given twice or varying: exit 2, one line, nothing on stdout', () => {
    const cases: [string[], RegExp][] = [
      [['--net-line', '400,0 500,10'], /^platewise: --net-line: the line \(400, 0\) → \(500, 10\) misses the part/],
      [['--net-line', '10,10'], /^platewise: --net-line: expected at least two points/],
      [['--net-line', '100,-10 100,210', '--thickness', '12'], /^platewise: --thickness: the part file already gives a thickness/],
      [['--thickness', '12'], /^platewise: --thickness: is used for the net area/],
    ];
    for (const [args, re] of cases) {
      const r = runCli(['member', plate, '--no-torsion', ...args]);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(re);
    }
  });

  it('--net-line on a file of several parts: taken where it crosses, missed elsewhere, refused when it misses them all; draw keeps going', () => {
    const two = join(dir, 'two.svg');
    writeFileSync(two, '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 300 100"><rect x="0" y="0" width="100" height="100"/><circle cx="50" cy="50" r="10" fill="white"/><rect x="200" y="0" width="100" height="100"/></svg>');
    const r = runCli(['member', two, '--units', 'mm', '--no-torsion', '--json', '--net-line', '50,-10 50,110']);
    expect(r.status, r.stderr).toBe(0);
    const [a, b] = JSON.parse(r.stdout).parts;
    // 100 high less a Ø20 hole (common practice, no source)
    expect(Math.abs(a.netSections[0].netLength.value - 80)).toBeLessThanOrEqual(a.netSections[0].netLength.error);
    expect(b.netSections).toEqual([null]);
    const all = runCli(['member', two, '--units', 'mm', '--no-torsion', '--net-line', '150,-10 150,110']);
    expect(all.status).toBe(2);
    expect(all.stderr).toMatch(/^platewise: --net-line: the line \(150, -10\) → \(150, 110\) misses every one of the 2 parts\n$/);
    const d = runCli(['draw', two, '--units', 'mm', '--sheet', '--net-line', '50,-10 50,110']);
    expect(d.status, d.stderr).toBe(0);
    expect([...d.stdout.matchAll(/data-role="net-line"/g)]).toHaveLength(1);
  });
});
