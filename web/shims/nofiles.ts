/**
 * The page's stand-in for the file and font access of svgdom (fontkit, image-size, path, url): the drawings
 * the library makes never measure text or read images, so none of these is called; if one ever were, it says so
 * instead of failing somewhere deeper.
 */
function absent(what: string): never {
  throw new Error(`${what} is not available in the page (no file access in the browser)`);
}
export const openSync = (): never => absent('fontkit');
export const create = (): never => absent('fontkit');
export const imageSizeFromFile = (): never => absent('image-size');
export const join = (...p: string[]): string => p.join('/');
export const dirname = (p: string): string => p.replace(/\/[^/]*$/, '');
export const extname = (p: string): string => /\.[^./]*$/.exec(p)?.[0] ?? '';
export const fileURLToPath = (u: string): string => String(u ?? '');
export default { join, dirname, extname, openSync, create };
