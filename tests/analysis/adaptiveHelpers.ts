/** Small helpers shared by the adaptive tests. */
import { preparePart } from '../../src/analysis/measure.js';
import type { Part } from '../../src/geometry/part.js';
import { buildMesh } from '../../src/mesh/build.js';

export { integrateExpression } from '../../src/analysis/plate.js';

export function preparePlateForTest(input: Part) {
  const part = preparePart(input);
  return { part, mesh: buildMesh(part).mesh };
}
