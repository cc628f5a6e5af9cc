// The client's first download: build with Vite into a private folder, then measure what index.html makes the
// browser fetch before anything lazy — the entry script, its static imports (followed through the built chunks,
// not only the modulepreload hints) and the stylesheets — gzip-compressed as a server would send them.
// Target: initial JS ≤ 180 kB gzip (issue 7; docs/decisions/009-client-bundle.md).
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, posix, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { gzipSync } from 'node:zlib';
import { inProductionMode } from '../tests/e2e/helpers/server';

export const INITIAL_JS_TARGET_KB = 180;

export type BundleBenchResult = {
  outDir: string;
  jsFiles: string[];
  cssFiles: string[];
  jsGzipKb: number;
  cssGzipKb: number;
  jsRawKb: number;
  targetJsKb: number;
};

/** Builds the client with Vite's API into `outDir` (a temp folder by default, so dist/ of a running server is untouched). */
export async function buildClient(outDir = mkdtempSync(join(tmpdir(), 'kitlane-bench-dist-'))): Promise<string> {
  const { build } = await import('vite');
  await inProductionMode(() => build({ root: process.cwd(), logLevel: 'error', build: { outDir, emptyOutDir: true } }));
  return outDir;
}

const attr = (tag: string, name: string) => new RegExp(`${name}="([^"]+)"`).exec(tag)?.[1];

/** The assets index.html itself asks for: module scripts, modulepreloads and stylesheets. */
export function assetsOfHtml(html: string): { js: string[]; css: string[] } {
  const js: string[] = [];
  const css: string[] = [];
  for (const tag of html.match(/<(script|link)\b[^>]*>/g) ?? []) {
    if (tag.startsWith('<script')) {
      const src = attr(tag, 'src');
      if (src) js.push(src);
    } else if (/rel="modulepreload"/.test(tag)) {
      const href = attr(tag, 'href');
      if (href) js.push(href);
    } else if (/rel="stylesheet"/.test(tag)) {
      const href = attr(tag, 'href');
      if (href) css.push(href);
    }
  }
  return { js, css };
}

// Static imports in Vite's minified output: `import{a as b}from"./x.js"`, `import"./y.js"`, `export*from"./z.js"`.
// Dynamic `import("./lazy.js")` is deliberately not matched: those are the lazy route chunks.
const STATIC_IMPORT = /(?:^|[;}\s])(?:import|export)\s*(?:[\w*{}\s,$]+?\s*from\s*)?["'](\.{1,2}\/[^"']+\.js)["']/g;

export function staticImportsOf(code: string): string[] {
  return [...code.matchAll(STATIC_IMPORT)].map((m) => m[1]);
}

function closure(outDir: string, entries: string[]): string[] {
  const seen = new Set<string>();
  const queue = entries.map((e) => e.replace(/^\//, ''));
  while (queue.length) {
    const file = queue.shift()!;
    if (seen.has(file)) continue;
    seen.add(file);
    const code = readFileSync(join(outDir, file), 'utf8');
    for (const spec of staticImportsOf(code)) queue.push(posix.normalize(posix.join(posix.dirname(file), spec)));
  }
  return [...seen];
}

const gzipKb = (outDir: string, files: string[]) => files.reduce((sum, f) => sum + gzipSync(readFileSync(join(outDir, f))).length, 0) / 1000;
const rawKb = (outDir: string, files: string[]) => files.reduce((sum, f) => sum + readFileSync(join(outDir, f)).length, 0) / 1000;

export function measureInitialLoad(outDir: string): BundleBenchResult {
  const html = readFileSync(join(outDir, 'index.html'), 'utf8');
  const { js, css } = assetsOfHtml(html);
  const jsFiles = closure(outDir, js);
  const cssFiles = css.map((c) => c.replace(/^\//, ''));
  const round1 = (v: number) => Math.round(v * 10) / 10;
  return {
    outDir,
    jsFiles,
    cssFiles,
    jsGzipKb: round1(gzipKb(outDir, jsFiles)),
    cssGzipKb: round1(gzipKb(outDir, cssFiles)),
    jsRawKb: round1(rawKb(outDir, jsFiles)),
    targetJsKb: INITIAL_JS_TARGET_KB,
  };
}

export async function runBundleBench(opts: { outDir?: string } = {}): Promise<BundleBenchResult> {
  return measureInitialLoad(await buildClient(opts.outDir));
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  const r = await runBundleBench();
  console.log(`initial JS ${r.jsGzipKb} kB gzip (${r.jsRawKb} kB raw, ${r.jsFiles.length} files), CSS ${r.cssGzipKb} kB gzip; target JS ≤ ${r.targetJsKb} kB`);
  console.log(r.jsFiles.join('\n'));
}
