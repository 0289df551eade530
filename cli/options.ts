/** Small argument parsers shared by command definitions. */
import { InvalidArgumentError } from 'commander';

export function intArg(name: string) {
  return (v: string) => {
    const n = Number(v);
    if (!Number.isInteger(n)) throw new InvalidArgumentError(`${name} must be a whole number, got "${v}"`);
    return n;
  };
}

export function numberArg(name: string) {
  return (v: string) => {
    const n = Number(v);
    if (v.trim() === '' || !Number.isFinite(n)) throw new InvalidArgumentError(`${name} must be a number, got "${v}"`);
    return n;
  };
}

/**
 * How a drawing is read (SVG, DXF, GeoJSON, WKT): format, unit, and what is cut, marking or ignored. The same
 * options on every command that reads a part; README "How drawings are read".
 */
export function addDrawingOptions(cmd: import('commander').Command): import('commander').Command {
  return cmd
    .option('--format <format>', 'input format: part-json, svg, dxf, geojson or wkt (default: by extension, then content)')
    .option('--units <unit>', 'length unit of drawing coordinates: mm, cm, m, in, ft (required where the drawing states none)')
    .option('--units-override', 'let --units stand where the drawing states another unit')
    .option('--cut-layers <names>', 'only contours on these layers (comma-separated) are cut')
    .option('--mark-layers <names>', 'contours on these layers are marking (etch) lines, never cut; default: layers named etch, mark, engrave, scribe …')
    .option('--skip-layers <names>', 'contours on these layers are ignored')
    .option('--mark-colours <colours>', 'contours in these colours are marking (SVG colours, DXF colour numbers; comma-separated)')
    .option('--unite', 'unite overlapping outlines and subtract cut-outs that cross them, instead of refusing the drawing')
    .option('--one-part', 'all material in one part, instead of one part per outer contour')
    .option('--sheet-border <how>', 'material inside a cut-out (a sheet border around parts): refuse (default), skip the border, or part (keep all)')
    .option('--join-tolerance <length>', 'DXF: largest gap between loose entity ends that is closed (drawing units; default from the drawing size)', numberArg('--join-tolerance'));
}

/** Repeatable option values, in order. */
export const collect = (v: string, prev: string[] = []) => [...prev, v];

/** --net-line (repeatable), shared by member, draw and report. */
export function addNetLineOption(cmd: import('commander').Command): import('commander').Command {
  return cmd.option('--net-line <points>', 'net section along a line or polyline "x,y x,y …" in the part\'s coordinates (repeat for several lines)', collect);
}

/** Section marks on drawings (draw, report). */
export function addMarkOptions(cmd: import('commander').Command): import('commander').Command {
  return addNetLineOption(cmd.option('--show <marks>', 'section marks on the drawing: shear-centre, plastic-axes (comma-separated), keyed under the scale bar'));
}
