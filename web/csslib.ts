/**
 * The CSS packages of the SVG reader (src/read/css.ts), bundled apart from the worker: they are a third of its
 * code and most of its start-up, and only an SVG with a style sheet or style attributes needs them.
 * web/build.mjs packs this bundle beside the worker's; the worker loads it with importScripts on first use
 * (web/shims/module.ts), which leaves the packages here.
 */
import * as cssTree from 'css-tree';
import * as cssSelect from 'css-select';
import * as cssWhat from 'css-what';

(self as unknown as { platewiseCssPackages: Record<string, unknown> }).platewiseCssPackages = {
  'css-tree': cssTree,
  'css-select': cssSelect,
  'css-what': cssWhat,
};
