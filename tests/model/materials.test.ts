import { describe, it, expect } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import { MATERIALS, findMaterial, listMaterials, loadMaterialFile, massOfVolume } from '../../src/model/index.js';

describe('built-in table', () => {
  it('holds the standard design densities with their sources', () => {
    // EN 1993-1-1:2005, 3.2.6: ρ = 7850 kg/m³ for steel
    expect(findMaterial('steel').density).toBe(7850);
    expect(findMaterial('steel').source).toMatch(/EN 1993-1-1:2005, 3\.2\.6/);
    // EN 1999-1-1:2007, 3.2.5: ρ = 2700 kg/m³ for aluminium alloys
    expect(findMaterial('aluminium').density).toBe(2700);
    expect(findMaterial('aluminium').source).toMatch(/EN 1999-1-1:2007, 3\.2\.5/);
    // EN 10088-1 per-grade table, 1.4301 = 7900 kg/m³ (from memory)
    expect(findMaterial('stainless-1.4301').density).toBe(7900);
    // Ti-6Al-4V ≈ 4430 kg/m³ (from memory)
    expect(findMaterial('titanium-6al4v').density).toBe(4430);
  });
  it('every material names a source and a plausible density', () => {
    for (const m of MATERIALS) {
      expect(m.source.length, m.id).toBeGreaterThan(5);
      expect(m.density, m.id).toBeGreaterThan(1000);
      expect(m.density, m.id).toBeLessThan(23000);
      expect(m.origin).toBe('built-in');
    }
    expect(new Set(MATERIALS.map((m) => m.id)).size).toBe(MATERIALS.length);
  });
  it('finds by alias, case and spacing insensitive', () => {
    expect(findMaterial('Aluminum').id).toBe('aluminium');
    expect(findMaterial('  S355 ').id).toBe('steel');
    expect(findMaterial('Ti 6Al 4V').id).toBe('titanium-6al4v');
    expect(findMaterial('1.4301').id).toBe('stainless-1.4301');
    expect(findMaterial('structural_steel').id).toBe('steel');
  });
  it('unknown material: InputError on "material" listing the known ids and a guess', () => {
    let err: unknown;
    try {
      findMaterial('stel');
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    const e = err as InputError;
    expect(e.where).toBe('material');
    expect(e.detail).toMatch(/^unknown material "stel"; known: steel, aluminium, stainless-1\.4301, /);
    expect(e.detail).toMatch(/did you mean "steel"\?$/);
    expect(() => findMaterial('xyz')).toThrow(/^material: unknown material "xyz"; known: .*copper.*$/);
    expect(() => findMaterial('xyz')).not.toThrow(/did you mean/);
    expect(() => findMaterial('constructor')).toThrow(InputError);
    expect(() => findMaterial('__proto__')).toThrow(InputError);
  });
});

describe('user material files', () => {
  const file = JSON.stringify({
    comment: 'invented demo data',
    materials: {
      's355-plate': { density: 7850, unit: 'kg/m3', source: 'demo certificate (invented)', aliases: ['plate-a'] },
      hdpe: { density: 0.95, unit: 'g/cm3', source: 'demo data sheet (invented)' },
      'bar-stock': { density: 0.284, unit: 'lb/in3', source: 'demo (invented)' },
      steel: { density: 7800, unit: 'kg/m3', source: 'site practice (invented)' },
    },
  });

  it('adds materials with unit conversion to kg/m³', () => {
    const t = loadMaterialFile(file, 'mats.json');
    expect(findMaterial('s355-plate', t).density).toBe(7850);
    expect(findMaterial('plate-a', t).id).toBe('s355-plate');
    expect(findMaterial('hdpe', t).density).toBeCloseTo(950, 10);
    // 0.284 lb/in³ × 27 679.90 (NIST SP 811) = 7861.1 kg/m³
    expect(findMaterial('bar-stock', t).density).toBeCloseTo(0.284 * 0.45359237 / 0.0254 ** 3, 9);
    expect(findMaterial('bar-stock', t).origin).toBe('mats.json');
    // built-ins stay reachable
    expect(findMaterial('aluminium', t).density).toBe(2700);
  });
  it('overrides a built-in under all its names, and the plate check follows the override', () => {
    const t = loadMaterialFile(file, 'mats.json');
    expect(findMaterial('steel', t).density).toBe(7800);
    expect(findMaterial('S355', t).density).toBe(7800); // built-in alias follows the replacement
    expect(findMaterial('steel').density).toBe(7850); // the built-in table itself is unchanged
    expect(massOfVolume(1e6 * 10, 'mm', findMaterial('steel', t).density)).toBeCloseTo(78.0, 12);
    const ids = listMaterials(t).map((m) => m.id);
    expect(ids.filter((i) => i === 'steel')).toHaveLength(1);
    expect(listMaterials(t).find((m) => m.id === 'steel')!.origin).toBe('mats.json');
    expect(ids).toContain('copper');
  });
  it('unknown-material message lists user materials too', () => {
    const t = loadMaterialFile(file, 'mats.json');
    expect(() => findMaterial('hdp', t)).toThrow(/known: s355-plate, hdpe, bar-stock, steel, aluminium.*did you mean "hdpe"\?/);
  });

  const bad = (text: string): InputError => {
    try {
      loadMaterialFile(text, 'mats.json');
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      return e as InputError;
    }
    throw new Error('expected rejection');
  };
  const one = (entry: unknown, id = 'x1') => JSON.stringify({ materials: { [id]: entry } });

  it('names the JSON path of each fault', () => {
    expect(bad('{"materials": {"a": {"density": 1}}').where).toMatch(/^mats\.json(:\d+:\d+)?$/);
    expect(bad('{"materials": {"a": {"density": 1}}').detail).toMatch(/^not valid JSON/);
    expect(bad('[]').where).toBe('mats.json: (top level)');
    expect(bad('{"material": {}}').where).toBe('mats.json: material');
    expect(bad('{"materials": []}').where).toBe('mats.json: materials');
    const noDensity = bad(one({ unit: 'kg/m3', source: 's' }));
    expect(noDensity.where).toBe('mats.json: materials.x1.density');
    expect(noDensity.detail).toBe('expected a positive number, got nothing');
    expect(bad(one({ density: -5, unit: 'kg/m3', source: 's' })).detail).toBe('expected a positive number, got -5');
    expect(bad(one({ density: 7850, source: 's' })).where).toBe('mats.json: materials.x1.unit');
    const badUnit = bad(one({ density: 7850, unit: 'kg/l', source: 's' }));
    expect(badUnit.where).toBe('mats.json: materials.x1.unit');
    expect(badUnit.detail).toMatch(/unknown density unit "kg\/l"; expected one of kg\/m3, g\/cm3, lb\/in3, lb\/ft3/);
    expect(bad(one({ density: 7850, unit: 'kg/m3' })).where).toBe('mats.json: materials.x1.source');
    expect(bad(one({ density: 7850, unit: 'kg/m3', source: 's', colour: 'red' })).where).toBe('mats.json: materials.x1.colour');
    expect(bad(one({ density: 7850, unit: 'kg/m3', source: 's', aliases: ['ok', 3] })).where).toBe('mats.json: materials.x1.aliases[1]');
    expect(bad(one({ density: 7850, unit: 'kg/m3', source: 's' }, 'bad id!')).where).toBe('mats.json: materials["bad id!"]');
    expect(bad(one({ density: 7850, unit: 'kg/m3', source: 's', name: 5 })).where).toBe('mats.json: materials.x1.name');
    expect(bad(one('7850')).where).toBe('mats.json: materials.x1');
  });
  it('refuses unit mix-ups: too light without confirmation, denser than any element', () => {
    const light = bad(one({ density: 7.85, unit: 'kg/m3', source: 's' }));
    expect(light.where).toBe('mats.json: materials.x1.density');
    expect(light.detail).toMatch(/below 100 kg\/m³; check the unit/);
    const ok = loadMaterialFile(one({ density: 30, unit: 'kg/m3', source: 'foam (invented)', confirmLowDensity: true }), 'f');
    expect(findMaterial('x1', ok).density).toBe(30);
    const heavy = bad(one({ density: 7850, unit: 'g/cm3', source: 's' }));
    expect(heavy.detail).toMatch(/denser than any element/);
  });
  it('refuses a name used twice in one file', () => {
    const e = bad(JSON.stringify({ materials: { a: { density: 7850, unit: 'kg/m3', source: 's', aliases: ['b'] }, B: { density: 7850, unit: 'kg/m3', source: 's' } } }));
    expect(e.where).toBe('mats.json: materials.B');
    expect(e.detail).toMatch(/name "b" is already used by materials\.a\.aliases\[0\]/);
  });
});

describe('designations and general names (common practice, no source: EN 10025 writes grade, then quality and delivery)', () => {
  it('structural steel designations with quality and delivery suffixes find steel', async () => {
    const { findMaterial } = await import('../../src/model/materials.js');
    for (const d of ['S355J2+N', 'S355JR', 'S275J0', 'S460ML', 'S355MC', 's235jr+ar', 'S690QL']) expect(findMaterial(d).id, d).toBe('steel');
  });
  it('aluminium alloy designations with temper find aluminium; a stainless number is not taken for one', async () => {
    const { findMaterial } = await import('../../src/model/materials.js');
    for (const d of ['EN AW-6082-T6', '5754-H22', '6061']) expect(findMaterial(d).id, d).toBe('aluminium');
    expect(findMaterial('1.4404').id).toBe('stainless-1.4404');
  });
  it('"stainless" alone is refused with the grades it could be', async () => {
    const { findMaterial } = await import('../../src/model/materials.js');
    expect(() => findMaterial('stainless')).toThrow(/"stainless" could be stainless-1\.4301 .* or stainless-1\.4404 .*; name the grade/);
    expect(() => findMaterial('S999J2')).toThrow(/unknown material/);
  });
});
