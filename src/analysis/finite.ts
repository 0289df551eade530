/**
 * The last check of every analysis: each reported value and estimate is a finite number, or the run is
 * refused in one line naming the cause (issue 16: overflow of thickness × density, coordinates whose squares
 * overflow, an integrand that overflows). The inputs are checked against their own limits as they are read;
 * this catches what only their products reveal, so no NaN or Infinity is ever printed as a result.
 */
import { InputError } from '../base/errors.js';
import type { Quantity } from '../properties/quantities.js';

/** Keys (in order) whose value or estimate is not finite. */
export function nonFinite(quantities: Readonly<Record<string, Quantity | undefined>>): string[] {
  const bad: string[] = [];
  for (const [k, q] of Object.entries(quantities)) if (q && !(Number.isFinite(q.value) && Number.isFinite(q.error))) bad.push(k);
  return bad;
}

function list(keys: readonly string[]): string {
  return keys.length > 4 ? `${keys.slice(0, 4).join(', ')} and ${keys.length - 4} more` : keys.join(', ');
}

/**
 * Refuse non-finite section, fabrication or mass figures. `where` names the part; the cause is told by which
 * group overflowed: mass figures point to thickness × density (or layer heights), section figures to the
 * coordinates.
 */
export function assertFiniteReport(where: string, section: Readonly<Record<string, Quantity | undefined>>, mass: Readonly<Record<string, Quantity | undefined>> | undefined, other: Readonly<Record<string, Quantity | undefined>> = {}): void {
  const s = nonFinite(section);
  if (s.length > 0) throw new InputError(where, `the section properties overflow the range of numbers (${list(s)} not finite); the coordinates are too large for their squares and fourth powers: give them in a larger unit`);
  const m = mass ? nonFinite(mass) : [];
  if (m.length > 0) throw new InputError(where, `the mass properties overflow the range of numbers (${list(m)} not finite): thickness × density over this part (or a layer's height) is too large to compute; check the thickness and density and their units`);
  const o = nonFinite(other);
  if (o.length > 0) throw new InputError(where, `${list(o)} overflow the range of numbers (not finite); check the thickness, density and units`);
}

/** Refuse a user integral whose value or estimate is not finite. */
export function assertFiniteIntegral(where: string, quantities: Readonly<Record<string, Quantity | undefined>>): void {
  const bad = nonFinite(quantities);
  if (bad.length > 0) throw new InputError(where, `the integral overflows the range of numbers (${list(bad)} not finite); the integrand is too large over this part: scale it down (e.g. work in other units) and multiply afterwards`);
}
