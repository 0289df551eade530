import { describe, it, expect } from 'vitest';
import { parseReferenceJson, parseReferenceCsv, readReference, suggestKey, suggestQuantities } from '../../src/qa/reference.js';
import { parseUnit, factorToReport } from '../../src/qa/units.js';
import { InputError } from '../../src/base/errors.js';

function errorOf(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}
const conv = (u: string, to: 'mm' | 'cm' | 'm' | 'in' | 'ft' = 'mm') => factorToReport(parseUnit(u)!, to);

describe('unit conversion (exact definitions: NIST SP 811 appendix B)', () => {
  it('in² → mm² is 645.16 (1 in = 25.4 mm exactly)', () => {
    expect(conv('in²')).toBe(645.16);
    expect(conv('in2')).toBe(645.16);
    expect(conv('in^2')).toBe(645.16);
    expect(conv('in')).toBe(25.4);
    expect(conv('in³')).toBe(16387.064);
    expect(conv('in⁴')).toBe(416231.4256);
  });
  it('ft → in is 12, ft² → mm² is 92903.04 (1 ft = 0.3048 m exactly)', () => {
    expect(conv('ft', 'in')).toBe(12);
    expect(conv('ft²')).toBe(92903.04);
    expect(conv('cm²')).toBe(100);
    expect(conv('m^4')).toBe(1e12);
    expect(conv('mm', 'in')).toBe(1 / 25.4);
    expect(conv('cm4', 'm')).toBe(1e-8);
  });
  it('masses, mass moments, forces, angles, percent', () => {
    expect(conv('lb')).toBe(0.45359237);
    expect(conv('g')).toBe(0.001);
    expect(conv('t')).toBe(1000);
    expect(conv('lb·in²')).toBeCloseTo(0.45359237 * 0.0254 ** 2, 18);
    expect(conv('kg*mm^2')).toBe(1e-6);
    expect(conv('lbf')).toBe(4.4482216152605); // 0.45359237 kg × 9.80665 m/s² (standard gravity, NIST SP 811)
    expect(conv('kN')).toBe(1000);
    expect(conv('rad')).toBe(180 / Math.PI);
    expect(conv('°')).toBe(1);
    expect(conv('%')).toBe(0.01);
    expect(parseUnit('furlong')).toBeNull();
    expect(parseUnit('mm5')).toBeNull();
  });
});

describe('reading references', () => {
  it('JSON: values with units in a field or after the number, tolerances in every form', () => {
    const r = parseReferenceJson(JSON.stringify({
      part: 'demo (invented values)',
      values: [
        { quantity: 'area', value: 4.65, unit: 'in²', tolerance: '0.5%' },
        { quantity: 'centroidX', value: '50.0 mm', tolerance: '0.05 mm' },
        { quantity: 'Ix', value: 1.234e6, unit: 'mm^4', tolerance: { relative: 0.002 } },
        { quantity: 'principalAngle', value: 0.5236, unit: 'rad', tolerance: { absolute: 0.1, unit: 'deg' } },
        { quantity: 'pierces', value: 4, tolerance: 0 },
        { quantity: 'scrapFraction', value: '12 %', tolerance: '0.002 rel' },
      ],
    }), 'r.json');
    expect(r.part).toBe('demo (invented values)');
    expect(r.values.map((v) => [v.quantity, v.value, v.unit.text])).toEqual([
      ['area', 4.65, 'in²'], ['centroidX', 50, 'mm'], ['Ix', 1.234e6, 'mm^4'], ['principalAngle', 0.5236, 'rad'],
      ['pierces', 4, ''], ['scrapFraction', 12, '%'],
    ]);
    expect(r.values[0].tolerance).toMatchObject({ kind: 'relative', fraction: 0.005 });
    expect(r.values[1].tolerance).toMatchObject({ kind: 'absolute', value: 0.05 });
    expect(r.values[2].tolerance).toMatchObject({ kind: 'relative', fraction: 0.002 });
    expect(r.values[3].tolerance).toMatchObject({ kind: 'absolute', value: 0.1 });
    expect(r.values[4].tolerance).toMatchObject({ kind: 'absolute', value: 0 });
  });

  it('CSV: the same, located by line and column', () => {
    const text = '\ufeffquantity,value,unit,tolerance,note\r\narea,4.65,in²,0.5%,from drawing\r\ncentroidX,50.0 mm,,0.05 mm,\r\n';
    const r = readReference(text, 'ref.csv');
    expect(r.values.map((v) => [v.quantity, v.value, v.unit.text, v.note])).toEqual([
      ['area', 4.65, 'in²', 'from drawing'], ['centroidX', 50, 'mm', undefined],
    ]);
    expect(r.values[1].where).toBe('ref.csv:line 3, column 1');
    expect(readReference('{"values":[{"quantity":"area","value":"1 m2"}]}', 'stdin').values[0].unit.text).toBe('m2');
  });

  it('bad references: unknown quantity with a suggestion, unknown or wrong-dimension units, missing units', () => {
    let e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"centroidx","value":"1 mm"}]}', 'r.json'));
    expect(e.where).toBe('r.json:values[0].quantity');
    expect(e.detail).toMatch(/did you mean "centroidX"/);
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":1,"unit":"mm"}]}', 'r.json'));
    expect(e.where).toBe('r.json:values[0].unit');
    expect(e.detail).toMatch(/unit of length; expected a unit of area/);
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":1}]}', 'r.json'));
    expect(e.detail).toMatch(/never assumed/);
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":1,"unit":"acre"}]}', 'r.json'));
    expect(e.detail).toMatch(/unknown unit "acre"/);
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"pierces","value":1,"unit":"mm"}]}', 'r.json'));
    expect(e.detail).toMatch(/expected a unit of count/);
    e = errorOf(() => parseReferenceCsv('quantity,value,unit\narea,1,mm²\nIxx,2,mm^4\n', 'r.csv'));
    expect(e.where).toBe('r.csv:line 3, column 1');
    expect(e.detail).toMatch(/did you mean "Ix"/);
    e = errorOf(() => parseReferenceCsv('quantity,value,unit\narea,1,mm³\n', 'r.csv'));
    expect(e.where).toBe('r.csv:line 2, column 8');
    e = errorOf(() => parseReferenceCsv('quantity,value\narea,twelve\n', 'r.csv'));
    expect(e.where).toBe('r.csv:line 2, column 6');
  });

  it('bad tolerances, duplicates, unknown keys and columns, JSON syntax', () => {
    let e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":"1 mm2","tolerance":0.1}]}', 'r.json'));
    expect(e.where).toBe('r.json:values[0].tolerance');
    expect(e.detail).toMatch(/bare number is unclear/);
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"principalAngle","value":"1 deg","tolerance":"1%"}]}', 'r.json'));
    expect(e.detail).toMatch(/absolute tolerance for an angle/);
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":"1 mm2","tolerance":"-1%"}]}', 'r.json'));
    expect(e.where).toBe('r.json:values[0].tolerance');
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":"1 mm2","tolerance":{"absolute":1,"unit":"kg"}}]}', 'r.json'));
    expect(e.where).toBe('r.json:values[0].tolerance.unit');
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":"1 mm2"},{"quantity":"area","value":"2 mm2"}]}', 'r.json'));
    expect(e.where).toBe('r.json:values[1].quantity');
    e = errorOf(() => parseReferenceJson('{"values":[{"quantity":"area","value":"1 mm2","tolerence":"1%"}]}', 'r.json'));
    expect(e.detail).toMatch(/did you mean "tolerance"/);
    e = errorOf(() => parseReferenceJson('{"values":[]}', 'r.json'));
    expect(e.where).toBe('r.json:values');
    e = errorOf(() => parseReferenceJson('{"values":[\n  {"quantity": "area",}\n]}', 'r.json'));
    expect(e.where).toMatch(/^r\.json:line 2, column \d+$/);
    e = errorOf(() => parseReferenceCsv('quantity,value,tolerence\narea,1 mm2,1%\n', 'r.csv'));
    expect(e.where).toBe('r.csv:line 1, column 16');
    e = errorOf(() => parseReferenceCsv('quantity,value\narea,1 mm2\narea,2 mm2\n', 'r.csv'));
    expect(e.detail).toMatch(/already stated on line 2/);
    e = errorOf(() => parseReferenceCsv('quantity,value,unit\narea,1 mm2,mm2\n', 'r.csv'));
    expect(e.detail).toMatch(/unit in one place/);
  });

  it('suggestKey: case first, then edit distance', () => {
    expect(suggestKey('IX', ['Ix', 'Iy'])).toBe('Ix');
    expect(suggestKey('perimiter', ['perimeter', 'area'])).toBe('perimeter');
    expect(suggestKey('zzzzzz', ['area'])).toBeUndefined();
  });
});

describe('suggestions for an unknown quantity: meaning first, then keys it begins, then spelling', () => {
  // the pairs are trade usage (common practice, no source): Sx is the elastic section modulus about x,
  // which this tool gives per extreme fibre (SxTop, SxBottom); "qty" is a count of pieces, not a property
  const keys = ['area', 'Ix', 'Iy', 'SxTop', 'SxBottom', 'SyRight', 'SyLeft', 'centroidX', 'Zx', 'cutLength', 'pierces', 'perimeter'];
  it('Sx leads to the section moduli, not to Ix', () => {
    expect(suggestQuantities('Sx', keys)).toEqual({ keys: ['SxTop', 'SxBottom'] });
    expect(suggestQuantities('xbar', keys)).toEqual({ keys: ['centroidX'] });
    expect(suggestQuantities('holes', keys)).toEqual({ keys: ['pierces'] });
  });
  it('qty is explained, not turned into Iy; a short name takes one edit at most', () => {
    expect(suggestQuantities('qty', keys)).toHaveProperty('instead');
    expect(suggestQuantities('Ixx', keys)).toEqual({ keys: ['Ix'] });
    expect(suggestQuantities('Iz', keys)).toEqual({ keys: ['Ix'] }); // one edit: still offered
    expect(suggestQuantities('abc', keys)).toEqual({ keys: [] });
  });
  it('keys a name begins', () => {
    expect(suggestQuantities('cut', keys)).toEqual({ keys: ['cutLength'] });
    expect(suggestQuantities('perimiter', keys)).toEqual({ keys: ['perimeter'] });
  });
});
