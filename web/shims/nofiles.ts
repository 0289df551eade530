/**
 * The page's stand-in for `path` and `url`, which library modules the page bundles name (file access and batch
 * manifests) but the page never calls for a file on disk; the few helpers work on plain '/'-joined names.
 */
export const join = (...p: string[]): string => p.join('/');
export const dirname = (p: string): string => p.replace(/\/[^/]*$/, '');
export const extname = (p: string): string => /\.[^./]*$/.exec(p)?.[0] ?? '';
export const fileURLToPath = (u: string): string => String(u ?? '');
export default { join, dirname, extname };
