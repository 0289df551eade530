/**
 * Checks of analysis options, the same for every command and every library user. Each failure is an
 * OptionError naming the option (the command line shows it as its flag).
 */
import { OptionError } from '../base/errors.js';
import { TRIANGULATORS, type Triangulator } from '../mesh/triangulate.js';
import { SAFE_DEGREES } from '../quadrature/rules.js';
import type { MeasureOptions } from './measure.js';
import type { IntegrationOptions } from './plate.js';

/** 'auto' (the boundary where the integrands are polynomials) or 'mesh' (always the mesh). */
function checkMethod(method: string | undefined): void {
  if (method !== undefined && method !== 'auto' && method !== 'mesh') throw new OptionError('method', `expected auto or mesh, got "${method}"`);
}

export interface SectionOptionInput { degree?: number; levels?: number; method?: string; triangulation?: string }

export function checkSectionOptions(o: SectionOptionInput): MeasureOptions {
  if (o.triangulation !== undefined && !TRIANGULATORS.includes(o.triangulation as Triangulator)) {
    throw new OptionError('triangulation', `expected one of ${TRIANGULATORS.join(', ')}, got "${o.triangulation}"`);
  }
  checkMethod(o.method);
  if (o.levels !== undefined && !(Number.isInteger(o.levels) && o.levels >= 1 && o.levels <= 6)) throw new OptionError('levels', `expected a whole number from 1 to 6, got ${o.levels}`);
  if (o.degree !== undefined && !(Number.isInteger(o.degree) && o.degree >= 1 && o.degree <= 20)) throw new OptionError('degree', `expected a rule degree from 1 to 20, got ${o.degree}`);
  return { degree: o.degree, levels: o.levels, method: o.method as MeasureOptions['method'], triangulation: o.triangulation as Triangulator | undefined };
}

export interface IntegrationOptionInput { tolerance?: number; maxTriangles?: number; timeLimit?: number; degree?: number; method?: string }

/** Tolerance (relative, 0 to 1), triangle cap (100 to 2·10⁷), time cap (seconds, up to an hour), a safe degree. */
export function checkIntegrationOptions(o: IntegrationOptionInput): IntegrationOptions {
  if (o.tolerance !== undefined && !(o.tolerance > 0 && o.tolerance < 1)) throw new OptionError('tolerance', `expected a relative tolerance between 0 and 1 (e.g. 1e-6), got ${o.tolerance}`);
  if (o.maxTriangles !== undefined && !(o.maxTriangles >= 100 && o.maxTriangles <= 20_000_000)) throw new OptionError('maxTriangles', `expected 100 to 20000000, got ${o.maxTriangles}`);
  if (o.timeLimit !== undefined && !(o.timeLimit > 0 && o.timeLimit <= 3600)) throw new OptionError('timeLimit', `expected seconds between 0 and 3600, got ${o.timeLimit}`);
  if (o.degree !== undefined && !SAFE_DEGREES.includes(o.degree)) throw new OptionError('degree', `expected one of the safe degrees ${SAFE_DEGREES.join(', ')}, got ${o.degree}`);
  checkMethod(o.method);
  return { tolerance: o.tolerance, maxTriangles: o.maxTriangles, maxMillis: o.timeLimit === undefined ? undefined : o.timeLimit * 1000, degree: o.degree, method: o.method as IntegrationOptions['method'] };
}
