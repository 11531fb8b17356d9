import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

/**
 * Size of what the browser downloads before the first page renders: the scripts and
 * stylesheets index.html loads directly (module preloads included), gzipped at level 9.
 * Lazy route chunks are listed separately. Target: initial JS under 350 kB gzipped.
 */
const browserDir = path.resolve('dist', 'client', 'browser');
const indexHtml = fs.readFileSync(path.join(browserDir, 'index.html'), 'utf8');
const initialFiles = [...indexHtml.matchAll(/(?:src|href)="([^"]+\.(?:js|css))"/g)].map((match) => match[1]!);
const gzipKb = (file: string) => zlib.gzipSync(fs.readFileSync(path.join(browserDir, file)), { level: 9 }).length / 1024;

const initialJsKb = initialFiles.filter((f) => f.endsWith('.js')).reduce((sum, f) => sum + gzipKb(f), 0);
const initialCssKb = initialFiles.filter((f) => f.endsWith('.css')).reduce((sum, f) => sum + gzipKb(f), 0);
const lazyFiles = fs.readdirSync(browserDir).filter((f) => f.endsWith('.js') && !initialFiles.includes(f));
const largestLazy = lazyFiles.map((f) => ({ f, kb: gzipKb(f) })).sort((a, b) => b.kb - a.kb)[0];

const rows = [
  ['initial JavaScript (gzip)', `${initialJsKb.toFixed(1)} kB`, initialJsKb < 350 ? 'target < 350 kB: met' : 'target < 350 kB: MISSED'],
  ['initial CSS (gzip)', `${initialCssKb.toFixed(1)} kB`, ''],
  ['lazy chunks', String(lazyFiles.length), largestLazy ? `largest ${largestLazy.kb.toFixed(1)} kB` : ''],
];
console.log('\nWeb client bundle');
for (const [name, value, note] of rows) console.log(`  ${name!.padEnd(28)} ${value!.padStart(10)}  ${note}`);
