// Loaded into the app process by `bench/upload/s3.ts --memory` (node --require): every 50 ms one line of
// process.memoryUsage() (ms since the epoch, rss, heapTotal, heapUsed, external, arrayBuffers, in bytes)
// appended to BENCH_MEMORY_FILE, so the bench can say what an upload's RSS growth is made of.
const fs = require('node:fs');

const file = process.env.BENCH_MEMORY_FILE;
if (file) {
  const fd = fs.openSync(file, 'a');
  const sample = () => {
    const m = process.memoryUsage();
    fs.writeSync(fd, `${Date.now()} ${m.rss} ${m.heapTotal} ${m.heapUsed} ${m.external} ${m.arrayBuffers}\n`);
  };
  setInterval(sample, 50).unref();
}
