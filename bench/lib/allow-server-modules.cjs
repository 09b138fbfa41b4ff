// Benchmarks run server modules outside Next; 'server-only' would throw there (Vitest aliases it the same way).
const Module = require('node:module');
const resolve = Module._resolveFilename;
Module._resolveFilename = function (request, ...rest) {
  if (request === 'server-only') return require.resolve('./empty.cjs');
  return resolve.call(this, request, ...rest);
};
