/**
 * The page's stand-in for `node:module`. The library loads a few packages on first use with
 * `createRequire(import.meta.url)(name)` (start-up time of the command line); in the page those packages are
 * bundled, and this `createRequire` hands out the bundled module under the same name. A package the page
 * does not carry (cdt2d, only for `--triangulation cdt2d|sweep`) is refused in one line.
 */
import Constrainautor from '@kninnug/constrainautor/min';
import polygonClipping from 'polygon-clipping';
import * as cssTree from 'css-tree';
import * as cssSelect from 'css-select';
import * as cssWhat from 'css-what';

const BUNDLED: Record<string, unknown> = {
  '@kninnug/constrainautor/min': Constrainautor,
  'polygon-clipping': polygonClipping,
  'css-tree': cssTree,
  'css-select': cssSelect,
  'css-what': cssWhat,
};

export function createRequire(_from: unknown): (name: string) => unknown {
  return (name: string) => {
    if (!(name in BUNDLED)) throw new Error(`the page does not carry the package "${name}"; use the command line for this option`);
    return BUNDLED[name];
  };
}
