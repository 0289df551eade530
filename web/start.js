// Starts the page's worker; web/build.mjs puts this at the top of <body>. The worker's code and the CSS
// packages' code (web/csslib.ts, loaded by the worker only when an SVG needs CSS) are gzip in base64 in the
// elements #worker-source and #css-source; DecompressionStream (Chrome 80, Firefox 113, Safari 16.4) unpacks them.
self.platewiseWorker = (async () => {
  const unpack = (id) => {
    const text = atob(document.getElementById(id).textContent);
    const bytes = new Uint8Array(text.length);
    for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
    return new Response(new Blob([bytes]).stream().pipeThrough(new DecompressionStream('gzip'))).blob();
  };
  const [code, css] = await Promise.all([unpack('worker-source'), unpack('css-source')]);
  const worker = new Worker(URL.createObjectURL(new Blob([code], { type: 'text/javascript' })));
  // the worker makes its own address for the CSS code (one made here would not load there from file://)
  worker.postMessage({ id: 0, op: 'css-packages', code: new Blob([css], { type: 'text/javascript' }) });
  return worker;
})();
