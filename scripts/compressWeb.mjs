// Pre-compresses the exported web build: a `.br` (brotli, quality 11) and a
// `.gz` (gzip, level 9) beside every text file, so the server sends the
// smallest one the browser accepts without spending CPU per request.
// Brotli at quality 11 costs seconds per megabyte, which is why it runs here
// and never on a request. Plain Node, no dependencies.
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

const COMPRESSIBLE = /\.(js|mjs|css|html|json|svg|txt|map|ttf|otf|wasm|ico)$/i;
/** Below this, the headers of a compressed answer outweigh what it saves. */
const MIN_BYTES = 1024;

function* textFiles(dir) {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) yield* textFiles(full);
    else if (COMPRESSIBLE.test(entry.name)) yield full;
  }
}

export function compressWebBuild(dir) {
  let files = 0;
  let raw = 0;
  let br = 0;
  for (const file of textFiles(dir)) {
    const bytes = fs.readFileSync(file);
    if (bytes.length < MIN_BYTES) continue;
    const brotli = zlib.brotliCompressSync(bytes, {
      params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: bytes.length },
    });
    const gzip = zlib.gzipSync(bytes, { level: 9 });
    fs.writeFileSync(`${file}.br`, brotli);
    fs.writeFileSync(`${file}.gz`, gzip);
    files += 1;
    raw += bytes.length;
    br += brotli.length;
  }
  return { files, raw, br };
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname)) {
  const dir = path.resolve(process.argv[2] ?? 'dist');
  const { files, raw, br } = compressWebBuild(dir);
  process.stdout.write(`compressed ${files} files in ${dir}: ${(raw / 1024).toFixed(0)} KB -> ${(br / 1024).toFixed(0)} KB brotli\n`);
}
