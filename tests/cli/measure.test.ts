/**
 * The built command line (dist/cli/main.js, made by `npm test`'s tsc step) on the samples:
 * exit statuses, the JSON shape, one-line messages without stack traces.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, CLI, runCli as platewise } from '../helpers.js';



const samples = readdirSync(join(ROOT, 'samples')).filter((f) => /\.(json|svg|geojson|wkt)$/.test(f));

describe('platewise measure on every sample', () => {
  it('there are at least three samples', () => expect(samples.length).toBeGreaterThanOrEqual(3));
  for (const f of samples) {
    it(`${f}: table and --json, exit 0`, () => {
      const t = platewise(['measure', join('samples', f)]);
      expect(t.status, t.stderr).toBe(0);
      expect(t.stdout).toMatch(/^area\s+[\d.]+\s+±\s+\S+\s+mm²$/m);
      expect(t.stdout).toMatch(/Caution: these are geometric properties/);
      const j = platewise(['measure', join('samples', f), '--json']);
      expect(j.status).toBe(0);
      const doc = JSON.parse(j.stdout);
      expect(doc.units.length).toBe('mm');
      for (const k of ['area', 'perimeter', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy', 'IxOrigin', 'IyOrigin', 'IxyOrigin', 'I1', 'I2', 'principalAngle', 'Ip', 'rx', 'ry']) {
        expect(typeof doc.quantities[k].value, k).toBe('number');
        expect(doc.quantities[k].error, k).toBeGreaterThanOrEqual(0);
      }
      expect(doc.method.degree).toBe(10);
      // straight-edged parts take the exact boundary formula, everything else the mesh
      expect(['mesh', 'boundary']).toContain(doc.method.path);
      if (doc.method.path === 'mesh') expect(doc.method.triangles).toBeGreaterThan(0);
      expect(Array.isArray(doc.warnings)).toBe(true);
    });
  }
});

describe('exit statuses and messages', () => {
  it('bad input: exit 2, one line naming the place, no stack trace, nothing on stdout', () => {
    const r = platewise(['measure', '-'], '{"outline": {"circle": {"center": [0, 0], "diameter": -5}}}');
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toBe('platewise: outline.circle.diameter: expected a positive number, got -5\n');
  });
  it('missing file: exit 2', () => {
    const r = platewise(['measure', 'no/such/file.json']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^platewise: no\/such\/file\.json: no such file\n$/);
  });
  it('non-UTF-8 input: exit 2 with the byte offset', () => {
    const r = spawnSync(process.execPath, [CLI, 'measure', '-'], { input: Buffer.from([0x7b, 0x22, 0xff, 0x22, 0x7d]) });
    expect(r.status).toBe(2);
    expect(r.stderr.toString()).toMatch(/stdin: is not UTF-8 text \(invalid byte sequence at byte offset 2\)/);
  });
  it('bad option value: exit 2', () => {
    const r = platewise(['measure', 'samples/base-plate-bp1.json', '--degree', '25']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--degree: expected a rule degree from 1 to 20, got 25/);
  });
  it('--help on every command exits 0', () => {
    for (const c of ['measure', 'rules']) expect(platewise([c, '--help']).status).toBe(0);
    expect(platewise(['--help']).status).toBe(0);
  });
  it('rules lists 20 rules with the published point counts and marks', () => {
    const r = platewise(['rules', '--json']);
    const doc = JSON.parse(r.stdout);
    expect(doc.rules).toHaveLength(20);
    expect(doc.rules[2]).toMatchObject({ degree: 3, points: 4, negativeWeight: true });
    expect(doc.rules[10]).toMatchObject({ degree: 11, points: 27, pointsOutside: true });
  });
});
