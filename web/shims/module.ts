/**
 * The page's stand-in for `node:module`. The library loads a few packages on first use with
 * `createRequire(import.meta.url)(name)` (start-up time of the command line); in the page those packages are
 * bundled, and this `createRequire` hands out the bundled module under the same name. The CSS packages live in
 * a bundle of their own (web/csslib.ts), loaded into the worker with importScripts the first time one is asked
 * for: web/start.js sends the worker that code first, and the worker keeps its address as `platewiseCssUrl`. A package the page does not carry
 * (cdt2d, only for `--triangulation cdt2d|sweep`) is refused in one line.
 */
import Constrainautor from '@kninnug/constrainautor/min';
import polygonClipping from 'polygon-clipping';

const BUNDLED: Record<string, unknown> = {
  '@kninnug/constrainautor/min': Constrainautor,
  'polygon-clipping': polygonClipping,
};
const CSS = new Set(['css-tree', 'css-select', 'css-what']);

interface WorkerScope { platewiseCssUrl?: string; platewiseCssPackages?: Record<string, unknown>; importScripts?: (url: string) => void }

function cssPackage(name: string): unknown {
  const scope = self as unknown as WorkerScope;
  if (!scope.platewiseCssPackages) {
    if (!scope.platewiseCssUrl || !scope.importScripts) throw new Error(`the page could not load the package "${name}" (no address for the CSS bundle)`);
    scope.importScripts(scope.platewiseCssUrl);
  }
  return scope.platewiseCssPackages![name];
}

export function createRequire(_from: unknown): (name: string) => unknown {
  return (name: string) => {
    if (CSS.has(name)) return cssPackage(name);
    if (!(name in BUNDLED)) throw new Error(`the page does not carry the package "${name}"; use the command line for this option`);
    return BUNDLED[name];
  };
}
