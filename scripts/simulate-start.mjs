// The command line's start, bundled to .build/simulate.mjs by scripts/build-worker.mjs: it runs
// the command line's bundle (.build/simulate.cjs, scripts/simulate.ts) through V8's code cache.
// Parsing and compiling the bundle's megabyte (the model validator's share is most of it) and
// then each function the run calls would cost every start some tens of milliseconds; with the
// cache, V8 reads the compiled code back. Node 20 offers no such cache for modules, hence a
// CommonJS bundle compiled here with vm.Script (as Node compiles one).
//
// The cache (.build/simulate.cjs.cache) starts with the identity of the bundle file it was made
// from (inode, size, modification time; the build replaces the file only when its content
// changes): V8 itself checks only the source's length (and its own version and flags), so a
// rebuilt bundle must not take an older bundle's code. Hashing the bundle instead would cost a
// start more than the check saves. The cache is written at the exit of a run that found none it
// could use, so that it holds every function that run compiled; a run that failed or only
// printed its usage writes none (its cache would hold too little).

import { Buffer } from 'node:buffer';
import { closeSync, fstatSync, openSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath, URL } from 'node:url';
import vm from 'node:vm';

const file = fileURLToPath(new URL('./simulate.cjs', import.meta.url));
const cacheFile = `${file}.cache`;
const KEY_BYTES = 64;
// The identity and the content from one open file: a build renaming a new bundle into place
// meanwhile cannot pair one with the other.
const fd = openSync(file, 'r');
const { ino, size, mtimeMs } = fstatSync(fd);
const source = readFileSync(fd, 'utf8');
closeSync(fd);
const key = Buffer.alloc(KEY_BYTES);
key.write(`${ino} ${size} ${mtimeMs}`);

let cached;
try {
  const data = readFileSync(cacheFile);
  if (key.equals(data.subarray(0, key.length))) cached = data.subarray(key.length);
} catch {
  // No cache yet: this run makes it.
}
// Node's own wrapper of a CommonJS module, so the bundle sees require and module as usual.
const script = new vm.Script(`(function (exports, require, module, __filename, __dirname) {${source}\n})`, {
  filename: file,
  cachedData: cached,
});

const args = process.argv.slice(2);
if ((!cached || script.cachedDataRejected) && !args.includes('--help') && !args.includes('-h')) {
  process.once('exit', (code) => {
    if (code !== 0) return;
    // Beside the bundle and renamed into place: a concurrent run reads either cache whole.
    const tmp = `${cacheFile}.${process.pid}.tmp`;
    try {
      writeFileSync(tmp, Buffer.concat([key, script.createCachedData()]));
      renameSync(tmp, cacheFile);
    } catch {
      // A read-only install runs without the cache.
    }
  });
}

const module = { exports: {} };
script.runInThisContext()(module.exports, createRequire(file), module, file, path.dirname(file));
