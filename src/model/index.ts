/**
 * Materials: a built-in table of nominal densities with sources, user material files, and
 * mass / mass-moment / density units with exact factors.
 */
export type { Material, MaterialTable } from './materials.js';
export { MATERIALS, findMaterial, listMaterials, materialTable, normalizeMaterialName } from './materials.js';
export { loadMaterialFile, MIN_PLAIN_DENSITY, MAX_DENSITY } from './materialFile.js';
export * from './massUnits.js';

