import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { GEOMETRY_CAUTION } from '../../src/output/cautions.js';
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
});
