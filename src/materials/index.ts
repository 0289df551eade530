/**
 * Materials: a built-in table of nominal densities with sources, user material files, and
 * mass / mass-moment / density units with exact factors.
 */
export type { Material, MaterialTable } from './table.js';
export { MATERIALS, findMaterial, listMaterials, materialTable, normalizeMaterialName } from './table.js';
export { loadMaterialFile, MIN_PLAIN_DENSITY, MAX_DENSITY } from './file.js';
export * from './units.js';

/**
 * Caution to print beside any mass, weight or mass moment computed from these densities.
 * Nominal densities are not certified values; lifting and structural decisions need more.
 */
import { MASS_CAUTION } from '../cautions.js';
export { MASS_CAUTION };
