/**
 * The one analysis entry point (src/analysis/analyze.ts): a part is validated once and meshed at most once
 * per run whatever the options; the report carries facts (codes, not sentences); the quantity catalogue is
 * static. Reference figures: disc area πr² and plate mass = area × thickness × density (closed forms);
 * steel 7850 kg/m³ (EN 1993-1-1, 3.2.6).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { ROOT, runCli } from '../helpers.js';

const calls = { validate: 0, mesh: 0 };
vi.mock('../../src/geometry/validate.js', async (orig) => {
  const m = await orig<typeof import('../../src/geometry/validate.js')>();
  return { ...m, validatePart: (...a: Parameters<typeof m.validatePart>) => { calls.validate++; return m.validatePart(...a); } };
});
vi.mock('../../src/mesh/build.js', async (orig) => {
  const m = await orig<typeof import('../../src/mesh/build.js')>();
  return { ...m, buildMesh: (...a: Parameters<typeof m.buildMesh>) => { calls.mesh++; return m.buildMesh(...a); } };
});

const { analyzePart } = await import('../../src/analysis/analyze.js');
const { readModels } = await import('../../src/read/models.js');

// invented demo part: 300 × 200 mm plate with a Ø50 hole (curved, so the section uses the mesh)
const plateWithHole = (extra: Record<string, unknown> = {}) => JSON.stringify({
  part: 'demo', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [300, 200] } },
  cutouts: [{ circle: { center: [150, 100], diameter: 50 } }], ...extra,
});

describe('analyzePart', () => {
  it('validates once and meshes at most once: section, mass and fabrication together', () => {
    const [model] = readModels(plateWithHole({ thickness: 10, material: 'steel' }), 'demo.json');
    calls.validate = 0; calls.mesh = 0;
    const r = analyzePart(model, { mass: 'required', fabrication: 'always' });
    expect(calls.validate).toBe(1);
    // constant thickness and density: mass from the exact boundary moments, no mesh at all
    expect(calls.mesh).toBe(0);
    expect(r.mass!.method.estimator).toBe('exact boundary integrals');
    calls.validate = 0; calls.mesh = 0;
    const m2 = analyzePart(model, { mass: 'required', fabrication: 'always', section: { method: 'mesh' } });
    expect(calls.validate).toBe(1);
    expect(calls.mesh).toBe(1);
    // the two paths agree within both estimates
    for (const k of ['mass', 'massCentreX', 'massCentreY', 'massCentreZ', 'massMomentX', 'massMomentY', 'massMomentZ', 'massProductXY'] as const) {
      const a = r.mass!.quantities[k], b = m2.mass!.quantities[k];
      expect(Math.abs(a.value - b.value), k).toBeLessThanOrEqual(a.error + b.error);
    }
    const A = 300 * 200 - Math.PI * 25 * 25;
    expect(Math.abs(r.quantities.area.value - A) / A).toBeLessThan(1e-13);
    const m = A * 10 * 7850 * 1e-9; // kg
    expect(Math.abs(r.mass!.quantities.mass.value - m) / m).toBeLessThan(1e-12);
    expect(Math.abs(r.quantities.netMass.value - m) / m).toBeLessThan(1e-12);
    expect(r.cautions).toEqual(['geometry', 'mass']);
  });

  it('a straight part with a plate: the section needs no mesh; a non-polynomial density meshes once, a polynomial one not at all', () => {
    const plate = (density: string) => readModels(JSON.stringify({ part: 's', outline: { rectangle: { corner: [0, 0], size: [100, 50] } }, thickness: 5, density }), 's.json')[0];
    calls.validate = 0; calls.mesh = 0;
    analyzePart(plate('7850 + 0*sin(x)'), { mass: 'required', fabrication: 'auto' });
    expect(calls.validate).toBe(1);
    expect(calls.mesh).toBe(1);
    calls.validate = 0; calls.mesh = 0;
    const r = analyzePart(plate('7850 - 0.5*x'), { mass: 'required', fabrication: 'auto' });
    expect(calls.validate).toBe(1);
    expect(calls.mesh).toBe(0);
    expect(r.mass!.method.estimator).toBe('exact boundary integrals');
    // ∫∫ 5·(7850 − 0.5x) dA over [0, 100] × [0, 50] mm = 5·50·(7850·100 − 0.25·100²) mm³ (elementary)
    const m = 5 * 50 * (7850 * 100 - 0.25 * 100 * 100) * 1e-9;
    expect(Math.abs(r.mass!.quantities.mass.value - m)).toBeLessThanOrEqual(r.mass!.quantities.mass.error);
    expect(Math.abs(r.mass!.quantities.mass.value - m) / m).toBeLessThan(1e-14);
  });

  it('warnings are codes with parameters, not sentences', () => {
    const [model] = readModels(JSON.stringify({ part: 'c', outline: { circle: { center: [0, 0], diameter: 50 } } }), 'c.json');
    const r = analyzePart(model, { given: { thickness: { text: '10', where: 'thickness setting' }, density: { text: '50', where: 'density setting' } }, mass: 'required' });
    expect(r.warnings).toContainEqual({ code: 'principal-axes-undefined' });
    expect(r.warnings).toContainEqual(expect.objectContaining({ code: 'density-implausible', where: 'density setting', value: 50 }));
    for (const w of r.warnings) for (const v of Object.values(w)) if (typeof v === 'string') expect(v.split(' ').length).toBeLessThan(4);
  });

  it('missing plate data: an error when required, a fact when optional', () => {
    const [model] = readModels(plateWithHole({ thickness: 10 }), 'demo.json');
    expect(() => analyzePart(model, { mass: 'required' })).toThrow(/no density for the part/);
    const r = analyzePart(model, { mass: 'optional' });
    expect(r.missing).toEqual(['density']);
    expect(r.mass).toBeUndefined();
  });
});

describe('the quantity catalogue is static', () => {
  it('a stated-values file naming mass is read in a process that never loaded the mass module', () => {
    // fresh process: only the reference reader is imported (before, "mass" was known only once mass.ts had run)
    const dir = mkdtempSync(join(tmpdir(), 'pw-cat-'));
    const ref = join(dir, 'ref.json');
    writeFileSync(ref, JSON.stringify({ values: [{ quantity: 'mass', value: 12.5, unit: 'kg', tolerance: '1%' }] }));
    const script = `import { readReference } from ${JSON.stringify(join(ROOT, 'dist/src/qa/reference.js'))};
      import { readFileSync } from 'node:fs';
      const r = readReference(readFileSync(${JSON.stringify(ref)}, 'utf8'), 'ref.json');
      console.log(r.values[0].quantity, r.values[0].dimension);`;
    const out = execFileSync(process.execPath, ['--input-type=module', '-e', script]).toString().trim();
    expect(out).toBe('mass mass');
  });
});

describe('exit statuses', () => {
  it('a method that gives up on valid input exits 3 with what was tried and what to do', () => {
    // a hole 1e-5 mm from another: valid (above the touching tolerance) but beyond the default triangulator
    const dir = mkdtempSync(join(tmpdir(), 'pw-exit-'));
    const f = join(dir, 'near.json');
    writeFileSync(f, JSON.stringify({ outline: { rectangle: { corner: [0, 0], size: [500, 200] } }, cutouts: [{ circle: { center: [200, 100], diameter: 100 } }, { polygon: [[250.00001, 60], [300, 60], [300, 140], [250.00001, 140]] }] }));
    // the boundary path needs no triangulation: plain measure succeeds; the forced mesh gives up
    expect(runCli(['measure', f]).status).toBe(0);
    const r = runCli(['measure', f, '--method', 'mesh']);
    expect(r.status).toBe(3);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/^platewise: triangulation gave up: .*; try another triangulation \(cdt2d\)/);
  });
  it('an internal fault exits 4 with one line and no stack unless PLATEWISE_DEBUG is set', async () => {
    const { run } = await import('../../cli/run.js');
    const writes: string[] = [];
    const spy = vi.spyOn(process.stderr, 'write').mockImplementation((s: string | Uint8Array) => { writes.push(String(s)); return true; });
    const before = process.exitCode;
    const debug = process.env.PLATEWISE_DEBUG;
    delete process.env.PLATEWISE_DEBUG;
    try {
      await run(async () => { throw new TypeError('x is undefined'); });
      expect(process.exitCode).toBe(4);
    } finally {
      spy.mockRestore();
      process.exitCode = before;
      if (debug !== undefined) process.env.PLATEWISE_DEBUG = debug;
    }
    expect(writes.join('')).toMatch(/^platewise: internal error: x is undefined \(this is a fault in platewise, not in your input: please report it/);
    expect(writes.join('').split('\n').filter(Boolean)).toHaveLength(1);
  });
  it('--materials-file feeds the fabrication masses as well as the mass properties', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-mat-'));
    const part = join(dir, 'p.json');
    writeFileSync(part, plateWithHole());
    const mats = join(dir, 'mats.json');
    // invented material for the test
    writeFileSync(mats, JSON.stringify({ materials: { 'test-alloy': { density: 5000, unit: 'kg/m3', source: 'invented for a test' } } }));
    const r = runCli(['measure', part, '--json', '--thickness', '10', '--material', 'test-alloy', '--materials-file', mats]);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    const m = (300 * 200 - Math.PI * 625) * 10 * 5000 * 1e-9;
    expect(Math.abs(doc.fabrication.quantities.netMass.value - m) / m).toBeLessThan(1e-12);
    expect(Math.abs(doc.massProperties.quantities.mass.value - m) / m).toBeLessThan(1e-12);
  });
});
