/** svgdom ships no type declarations; the drawing code uses only createSVGWindow. */
declare module 'svgdom' {
  export function createSVGWindow(): Window & typeof globalThis;
}
