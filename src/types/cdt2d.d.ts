declare module 'cdt2d' {
  interface Cdt2dOptions { delaunay?: boolean; interior?: boolean; exterior?: boolean; infinity?: boolean }
  function cdt2d(points: [number, number][], edges?: [number, number][], options?: Cdt2dOptions): [number, number, number][];
  export default cdt2d;
}
