// The JavaScript the landing page loads, gzip: the client is built into a folder of our own
// (with `--manifest`, so vite.config.ts and dist/ stay as they are), then the manifest gives the
// entry, the landing route's chunk, and every chunk either imports statically; dynamic imports
// (the other routes) are not loaded on the landing page and do not count.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { ROOT, tail } from './children';

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}

export const LANDING_SOURCE = 'src/app/routes/landing.tsx';

export interface LandingSize {
  files: { file: string; bytes: number; gzip: number }[];
  gzipBytes: number;
  rawBytes: number;
  buildSeconds: number;
}

export async function buildClient(outDir: string): Promise<number> {
  const started = Date.now();
  await new Promise<void>((resolve, reject) => {
    const child = spawn(
      process.execPath,
      [path.join(ROOT, 'node_modules/vite/bin/vite.js'), 'build', '--outDir', outDir, '--emptyOutDir', '--manifest', '--logLevel', 'warn'],
      { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] },
    );
    let text = '';
    child.stdout.on('data', (c: Buffer) => (text += c.toString()));
    child.stderr.on('data', (c: Buffer) => (text += c.toString()));
    child.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`vite build failed (code ${code}):\n${tail(text)}`))));
  });
  return (Date.now() - started) / 1000;
}

export function landingSize(outDir: string, buildSeconds: number): LandingSize {
  const manifestFile = [path.join(outDir, '.vite/manifest.json'), path.join(outDir, 'manifest.json')].find((f) => fs.existsSync(f));
  if (!manifestFile) throw new Error(`No manifest in ${outDir}.`);
  const manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as Record<string, ManifestChunk>;
  const entries = Object.entries(manifest).filter(([, c]) => c.isEntry);
  if (entries.length !== 1) throw new Error(`Expected one entry in the manifest, found ${entries.length}.`);
  if (!manifest[LANDING_SOURCE]) throw new Error(`The manifest has no chunk for ${LANDING_SOURCE}.`);
  const keys = new Set<string>();
  const visit = (key: string) => {
    if (keys.has(key)) return;
    keys.add(key);
    for (const imported of manifest[key]?.imports ?? []) visit(imported);
  };
  visit(entries[0][0]);
  visit(LANDING_SOURCE);
  const files = [...new Set([...keys].map((k) => manifest[k].file))]
    .filter((f) => f.endsWith('.js'))
    .map((file) => {
      const content = fs.readFileSync(path.join(outDir, file));
      return { file, bytes: content.length, gzip: zlib.gzipSync(content).length };
    });
  return {
    files,
    gzipBytes: files.reduce((s, f) => s + f.gzip, 0),
    rawBytes: files.reduce((s, f) => s + f.bytes, 0),
    buildSeconds,
  };
}
