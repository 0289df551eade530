/**
 * The one settings grammar (src/model/settings.ts): the same texts are accepted everywhere — directly, in a
 * part file, on the command line of measure, compare and batch, and in a manifest cell.
 * Unit factors: 1 in = 25.4 mm exactly (NIST SP 811, appendix B); 1 lb = 0.45359237 kg exactly (same);
 * 1 g/cm³ = 1000 kg/m³ (SI definition). Steel 7850 kg/m³ (EN 1993-1-1, 3.2.6).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import { parseDensity, parseThickness, plausibility, thicknessInPartUnit } from '../../src/model/settings.js';
import { runCli } from '../helpers.js';

const t = (text: string | number) => parseThickness({ text, where: 'thickness' });
const d = (text: string | number) => parseDensity({ text, where: 'density' });

describe('thickness', () => {
  it('numbers with and without units, fractions and mixed numbers', () => {
    expect(t('10')).toMatchObject({ kind: 'constant', value: 10, unit: null });
    expect(t(10)).toMatchObject({ kind: 'constant', value: 10, unit: null });
    expect(t('10 mm')).toMatchObject({ kind: 'constant', value: 10, unit: 'mm' });
    expect(t('0.375in')).toMatchObject({ kind: 'constant', value: 0.375, unit: 'in' });
    expect(t('3/8 in')).toMatchObject({ kind: 'constant', value: 0.375, unit: 'in' });
    expect(t('1 1/2 in')).toMatchObject({ kind: 'constant', value: 1.5, unit: 'in' });
    expect(t('12.7 millimetres')).toMatchObject({ kind: 'constant', value: 12.7, unit: 'mm' });
    // 3/8 in = 9.525 mm exactly (1 in = 25.4 mm)
    const c = t('3/8 in');
    if (c.kind !== 'constant') throw new Error('expected a constant');
    expect(thicknessInPartUnit(c, 'mm')).toBeCloseTo(9.525, 12);
  });
  it('an expression in x and y stays an expression', () => {
    expect(t('20 - 0.025*x')).toMatchObject({ kind: 'expression', text: '20 - 0.025*x' });
  });
  it('refusals name the place', () => {
    expect(() => t('-5')).toThrow(/^thickness: expected a positive thickness/);
    expect(() => t('10 furlongs')).toThrow(/^thickness: unknown length unit "furlongs"/);
    expect(() => t('1e-320 mm')).toThrow(InputError); // subnormal: below the 1 nm hard limit
    expect(() => t('')).toThrow(/empty/);
  });
});

describe('density', () => {
  it('bare numbers are kg/m³; units convert exactly', () => {
    expect(d('7850')).toMatchObject({ kind: 'constant', kgm3: 7850 });
    expect(d('7850 kg/m3')).toMatchObject({ kind: 'constant', kgm3: 7850 });
    const g = d('7.85 g/cm3');
    expect(g.kind === 'constant' && Math.abs(g.kgm3 - 7850) < 1e-9).toBe(true);
    // 0.284 lb/in³ = 0.284 × 0.45359237 / 0.0254³ kg/m³ = 7861.0… kg/m³
    const lb = d('0.284 lb/in3');
    expect(lb.kind === 'constant' && Math.abs(lb.kgm3 - 0.284 * 0.45359237 / 0.0254 ** 3) < 1e-9).toBe(true);
  });
  it('hard limits refuse; plausible ranges warn, never silence', () => {
    expect(() => d('1e30')).toThrow(/^density: .* outside 1 to 30000 kg\/m³/);
    expect(() => d(0)).toThrow(/^density: expected a positive density/);
    expect(plausibility({ density: 50, densityWhere: '--density' }, 'mm', 100).map((w) => w.code)).toEqual(['density-implausible']);
    expect(plausibility({ density: 7850 }, 'mm', 100)).toEqual([]);
    expect(plausibility({ thickness: 500, thicknessWhere: 't' }, 'mm', 100).map((w) => w.code)).toEqual(['thickness-exceeds-part']);
  });
});

describe('the same texts on every command (built CLI)', () => {
  const dir = mkdtempSync(join(tmpdir(), 'pw-settings-'));
  // invented demo part: 1000 × 500 mm plate; 10 mm steel weighs 1000·500·10 mm³ × 7850 kg/m³ = 39.25 kg
  const part = join(dir, 'plate.json');
  writeFileSync(part, JSON.stringify({ part: 'p', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [1000, 500] } } }));
  const ref = join(dir, 'ref.json');
  writeFileSync(ref, JSON.stringify({ part: 'p', values: [{ quantity: 'netMass', value: 39.25, unit: 'kg', tolerance: '0.01 kg' }] }));
  const manifest = join(dir, 'job.csv');
  const texts: [string, string, string][] = [['10 mm', '7.85 g/cm3', '39.25'], ['0.3937007874015748in', '7850 kg/m3', '39.25'], ['10', '7850', '39.25']];
  for (const [thick, dens] of texts) {
    it(`thickness "${thick}" and density "${dens}": measure, compare and batch agree (39.25 kg)`, () => {
      const m = runCli(['measure', part, '--json', '--thickness', thick, '--density', dens]);
      expect(m.status, m.stderr).toBe(0);
      const netMass = JSON.parse(m.stdout).fabrication.quantities.netMass.value;
      expect(Math.abs(netMass - 39.25) / 39.25).toBeLessThan(1e-12);
      const c = runCli(['compare', part, '--reference', ref, '--thickness', thick, '--density', dens]);
      expect(c.status, c.stdout + c.stderr).toBe(0);
      writeFileSync(manifest, `file,thickness,density\nplate.json,${thick},${dens}\n`);
      const b = runCli(['batch', manifest, '--jsonl']);
      expect(b.status, b.stderr).toBe(0);
      const row = JSON.parse(b.stdout.trim().split('\n')[0]);
      expect(Math.abs(row.quantities.netMass.value - 39.25) / 39.25).toBeLessThan(1e-12);
    });
  }
  it('an implausible density warns on measure (never silence)', () => {
    const m = runCli(['measure', part, '--thickness', '10', '--density', '7.85']);
    expect(m.status, m.stderr).toBe(0);
    expect(m.stdout).toMatch(/warning: --density: a density of 7\.85 kg\/m³ is outside 100 to 25000 kg\/m³/);
  });
  it('a density of 1e30 is refused by measure, compare and batch alike', () => {
    const m = runCli(['measure', part, '--thickness', '10', '--density', '1e30']);
    const c = runCli(['compare', part, '--reference', ref, '--thickness', '10', '--density', '1e30']);
    writeFileSync(manifest, 'file,thickness,density\nplate.json,10,1e30\n');
    const b = runCli(['batch', manifest]);
    for (const r of [m, c, b]) {
      expect(r.status).toBe(2);
      expect(r.stderr).toMatch(/outside 1 to 30000 kg\/m³/);
    }
  });
});
