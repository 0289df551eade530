/**
 * Smoothness analysis of expressions (src/expr/smooth.ts): straight kink and jump lines of linear-argument
 * nodes, and interval proofs that a tree is smooth on a box. Each positive case has a negative control.
 */
import { describe, expect, it } from 'vitest';
import { parseExpression } from '../../src/expr/index.js';
import { type Box4, MAX_KINK_LINES, kinkLines, smoothOnBox } from '../../src/expr/smooth.js';

const tree = (s: string) => parseExpression(s, 'test');
const BOX: Box4 = [0, 0, 300, 100];
/** The lines as normalised (a, b, c) of a·x + b·y + c = 0, for comparison. */
const norm = (s: string, box = BOX) => (kinkLines(tree(s), box) ?? []).map((l) => {
  const n = Math.hypot(l.a, l.b), sg = l.a !== 0 ? Math.sign(l.a) : Math.sign(l.b);
  return [sg * l.a / n, sg * l.b / n, sg * (l.c - l.a * l.x0 - l.b * l.y0) / n].map((v) => Math.round(v * 1e9) / 1e9 + 0);
});

describe('kinkLines', () => {
  it('abs, min, max, comparisons, if and floor on linear arguments give their lines', () => {
    expect(norm('abs(x - 85.5)')).toEqual([[1, 0, -85.5]]);
    expect(norm('min(x, 2*y)')).toEqual([[Math.round(1e9 / Math.sqrt(5)) / 1e9, -Math.round(2e9 / Math.sqrt(5)) / 1e9, 0]]);
    expect(norm('if(y < 40, 1, 2) * x')).toEqual([[0, 1, -40]]);
    expect(norm('max(x - 100, 0) + (x > 200)')).toEqual([[1, 0, -100], [1, 0, -200]]);
    expect(norm('floor(x / 100)')).toEqual([[1, 0, -100], [1, 0, -200]]);
    // a line repeated in two places is one line
    expect(norm('abs(x - 50) + abs(2*x - 100)')).toEqual([[1, 0, -50]]);
  });
  it('lines that miss the box, nonlinear arguments and smooth functions give none', () => {
    expect(norm('abs(x - 400)')).toEqual([]);
    expect(norm('abs(x^2 + y^2 - 2500)')).toEqual([]);
    expect(norm('exp(-x) * sin(y)')).toEqual([]);
  });
  it('too many lines give null', () => {
    expect(kinkLines(tree('floor(x)'), BOX)).toBeNull();
    expect(kinkLines(tree(`floor(x / ${300 / (MAX_KINK_LINES - 2)})`), BOX)).not.toBeNull();
  });
});

describe('smoothOnBox', () => {
  it('proves smooth functions smooth and refuses possible singularities', () => {
    expect(smoothOnBox(tree('exp(-((x-120)^2 + (y-90)^2)/288)'), BOX, false)).toBe(true);
    expect(smoothOnBox(tree('1/sqrt((x-37.3)^2 + (y-21.7)^2 + 1e-6)'), BOX, false)).toBe(true);
    // the same without the 1e-6: the argument reaches zero in the box
    expect(smoothOnBox(tree('1/sqrt((x-37.3)^2 + (y-21.7)^2)'), BOX, false)).toBe(false);
    // a rim singularity: smooth on a box well inside the disc, not on one reaching the rim
    const punch = tree('1/sqrt(10000 - x^2 - y^2)');
    expect(smoothOnBox(punch, [-50, -50, 50, 50], false)).toBe(true);
    expect(smoothOnBox(punch, [60, 60, 80, 80], false)).toBe(false);
    expect(smoothOnBox(tree('log(x)'), [1, 0, 2, 1], false)).toBe(true);
    expect(smoothOnBox(tree('log(x)'), [0, 0, 2, 1], false)).toBe(false);
    expect(smoothOnBox(tree('x^1.5'), [0, 0, 2, 1], false)).toBe(false);
    expect(smoothOnBox(tree('x^3 / (y - 5)'), [0, 0, 2, 1], false)).toBe(true);
    expect(smoothOnBox(tree('x^3 / (y - 5)'), [0, 0, 2, 10], false)).toBe(false);
    expect(smoothOnBox(tree('tan(x)'), [0, 0, 1, 1], false)).toBe(true);
    expect(smoothOnBox(tree('tan(x)'), [1, 0, 2, 1], false)).toBe(false);
    expect(smoothOnBox(tree('atan2(y, x)'), [-1, 1, 1, 2], false)).toBe(true);
    expect(smoothOnBox(tree('atan2(y, x)'), [-2, -1, -1, 1], false)).toBe(false);
    expect(smoothOnBox(tree('asin(x/3)'), [0, 0, 2, 1], false)).toBe(true);
    expect(smoothOnBox(tree('asin(x/3)'), [0, 0, 3, 1], false)).toBe(false);
  });
  it('kinks: refused where they cross the box, accepted on linear arguments when the mesh is cut', () => {
    expect(smoothOnBox(tree('abs(x - 85.5)'), [90, 0, 100, 10], false)).toBe(true);
    expect(smoothOnBox(tree('abs(x - 85.5)'), [80, 0, 90, 10], false)).toBe(false);
    expect(smoothOnBox(tree('abs(x - 85.5)'), [80, 0, 90, 10], true)).toBe(true);
    // a nonlinear kink is never taken as cut
    expect(smoothOnBox(tree('abs(x^2 - 7000)'), [80, 0, 90, 10], true)).toBe(false);
    expect(smoothOnBox(tree('min(x, y)'), [0, 5, 4, 6], false)).toBe(true);
    expect(smoothOnBox(tree('min(x, y)'), [0, 0, 4, 6], false)).toBe(false);
    expect(smoothOnBox(tree('floor(x)'), [0.1, 0, 0.9, 1], false)).toBe(true);
    expect(smoothOnBox(tree('floor(x)'), [0.5, 0, 1.5, 1], false)).toBe(false);
    expect(smoothOnBox(tree('if(x > 1, x, 0)'), [2, 0, 3, 1], false)).toBe(true);
    expect(smoothOnBox(tree('if(x > 1, x, 0)'), [0, 0, 3, 1], false)).toBe(false);
  });
});
