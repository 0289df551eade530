import { describe, it, expect } from 'vitest';
import { parseCsv, parseCsvRecords, formatCsvRow, formatCsv, formatCsvNumber } from '../../src/base/csv.js';
import { InputError } from '../../src/base/errors.js';
import { rng as mulberry32 } from '../helpers.js';


function errorOf(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

// The examples of RFC 4180, section 2, rules 1–7, written as there (CRLF shown as \r\n).
describe('RFC 4180 section 2 examples', () => {
  it('rule 1: records on separate lines ended by CRLF', () => {
    expect(parseCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n', 't')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });
  it('rule 2: the last record may lack a line break', () => {
    expect(parseCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx', 't')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });
  it('rule 3: an optional header line in the same format', () => {
    const text = 'field_name,field_name,field_name\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n';
    expect(parseCsv(text, 't')).toEqual([
      ['field_name', 'field_name', 'field_name'], ['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx'],
    ]);
    // the RFC's example header repeats its names; header-keyed records need distinct names
    const e = errorOf(() => parseCsvRecords(text, 't'));
    expect(e.where).toBe('t:line 1, column 12');
    expect(e.detail).toMatch(/repeats the column name "field_name"/);
  });
  it('rule 4: spaces are part of a field; no comma after the last field', () => {
    expect(parseCsv('aaa,bbb,ccc', 't')).toEqual([['aaa', 'bbb', 'ccc']]);
    expect(parseCsv(' aaa , bbb,ccc ', 't')).toEqual([[' aaa ', ' bbb', 'ccc ']]);
  });
  it('rule 5: fields may be enclosed in double quotes', () => {
    expect(parseCsv('"aaa","bbb","ccc"\r\nzzz,yyy,xxx', 't')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });
  it('rule 6: line breaks, quotes and commas inside quoted fields', () => {
    expect(parseCsv('"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx', 't')).toEqual([['aaa', 'b\r\nbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
    expect(parseCsv('"a,b",c', 't')).toEqual([['a,b', 'c']]);
  });
  it('rule 7: a double quote inside a quoted field is doubled', () => {
    expect(parseCsv('"aaa","b""bb","ccc"', 't')).toEqual([['aaa', 'b"bb', 'ccc']]);
  });
});

describe('parseCsv details', () => {
  it('accepts LF line ends, a BOM, empty fields and an empty text', () => {
    expect(parseCsv('\ufeffa,b\nc,\n', 't')).toEqual([['a', 'b'], ['c', '']]);
    expect(parseCsv('', 't')).toEqual([]);
    expect(parseCsv('\ufeff', 't')).toEqual([]);
    expect(parseCsv('a,\r\n,b', 't')).toEqual([['a', ''], ['', 'b']]);
    expect(parseCsv('""', 't')).toEqual([['']]);
  });
  it('locates a stray quote inside an unquoted field', () => {
    const e = errorOf(() => parseCsv('a,b\r\nxx,y"y,z\r\n', 'ref.csv'));
    expect(e.where).toBe('ref.csv:line 2, column 5');
    expect(e.message).toMatch(/^ref\.csv:line 2, column 5: /);
  });
  it('locates text after a closing quote', () => {
    const e = errorOf(() => parseCsv('"ab"c,d', 'f'));
    expect(e.where).toBe('f:line 1, column 5');
  });
  it('locates an unterminated quote at its opening, across lines', () => {
    const e = errorOf(() => parseCsv('a,b\n c,"never\nclosed', 'f'));
    expect(e.where).toBe('f:line 2, column 4');
  });
  it('counts lines inside quoted fields for later locations', () => {
    const e = errorOf(() => parseCsv('"x\r\ny\ny",ok\nbad"', 'f'));
    expect(e.where).toBe('f:line 4, column 4');
  });
  it('BOM is not counted in columns', () => {
    const e = errorOf(() => parseCsv('\ufeffa"', 'f'));
    expect(e.where).toBe('f:line 1, column 2');
  });
});

describe('parseCsvRecords', () => {
  it('keys records by trimmed header names and keeps locations', () => {
    const r = parseCsvRecords('quantity, value\narea,12\n\nIx,"3"\n', 't');
    expect(r.header).toEqual(['quantity', 'value']);
    expect(r.records.map((x) => ({ ...x }))).toEqual([{ quantity: 'area', value: '12' }, { quantity: 'Ix', value: '3' }]);
    expect(r.locations[1].line).toBe(4);
    expect(r.locations[1].fields.value).toEqual([4, 4]);
  });
  it('rejects wrong field counts, missing and unknown columns, empty header names', () => {
    expect(errorOf(() => parseCsvRecords('a,b\n1,2,3\n', 't')).where).toBe('t:line 2, column 5');
    expect(errorOf(() => parseCsvRecords('a,b\n1\n', 't')).where).toBe('t:line 2, column 1');
    expect(errorOf(() => parseCsvRecords('a,b\n1,2\n', 't', { required: ['c'] })).detail).toMatch(/column named "c"/);
    expect(errorOf(() => parseCsvRecords('a,x\n1,2\n', 't', { required: ['a'], allowed: ['b'] })).where).toBe('t:line 1, column 3');
    expect(errorOf(() => parseCsvRecords('a,,b\n', 't')).where).toBe('t:line 1, column 3');
    expect(errorOf(() => parseCsvRecords('\n\n', 't')).detail).toMatch(/header/);
  });
  it('a header named __proto__ is an ordinary key', () => {
    const r = parseCsvRecords('__proto__,b\n1,2\n', 't');
    expect(r.records[0]['__proto__']).toBe('1');
  });
});

describe('formatCsvRow', () => {
  it('quotes only when needed', () => {
    expect(formatCsvRow(['a', 'b c', 'x,y', 'say "hi"', 'l1\nl2', null, undefined, 1.5])).toBe(
      'a,b c,"x,y","say ""hi""","l1\nl2",,,1.5');
  });
  it('writes -0 and non-finite numbers so that Number() reads them back', () => {
    expect(formatCsvNumber(-0)).toBe('-0');
    expect(Object.is(Number(formatCsvNumber(-0)), -0)).toBe(true);
    expect(Number(formatCsvNumber(Infinity))).toBe(Infinity);
  });
  it('round-trips random fields through parseCsv (seeded)', () => {
    const rnd = mulberry32(20261202);
    const alphabet = ['a', 'Z', '0', ' ', ',', '"', '\r', '\n', '\r\n', 'é', '²', '\t', ';'];
    const rows: string[][] = [];
    for (let r = 0; r < 300; r++) {
      const nf = 1 + Math.floor(rnd() * 6);
      const row: string[] = [];
      for (let f = 0; f < nf; f++) {
        let s = '';
        const len = Math.floor(rnd() * 8);
        for (let k = 0; k < len; k++) s += alphabet[Math.floor(rnd() * alphabet.length)];
        row.push(s);
      }
      rows.push(row);
    }
    expect(parseCsv(formatCsv(rows), 't')).toEqual(rows);
    for (const row of rows) expect(parseCsv(formatCsvRow(row), 't')).toEqual([row]);
  });
  it('round-trips random doubles exactly (seeded)', () => {
    const rnd = mulberry32(7);
    const buf = new DataView(new ArrayBuffer(8));
    const nums: number[] = [];
    for (let k = 0; k < 20000; k++) {
      // random bit patterns cover subnormals, huge and tiny exponents; skip NaN payloads
      buf.setUint32(0, Math.floor(rnd() * 2 ** 32));
      buf.setUint32(4, Math.floor(rnd() * 2 ** 32));
      const x = buf.getFloat64(0);
      if (!Number.isNaN(x)) nums.push(x);
      nums.push((rnd() - 0.5) * 10 ** Math.floor(rnd() * 20 - 10));
    }
    nums.push(0.1 + 0.2, 5e-324, Number.MAX_VALUE, -0, 1 / 3);
    const text = formatCsv(nums.map((x) => [x, -x]));
    const back = parseCsv(text, 't');
    expect(back.length).toBe(nums.length);
    back.forEach((r, k) => {
      expect(Object.is(Number(r[0]), nums[k])).toBe(true);
      expect(Object.is(Number(r[1]), -nums[k])).toBe(true);
    });
  });
});
