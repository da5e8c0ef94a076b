/**
 * Layering lint (DESIGN.md section 1). Fails closed: every import of every
 * source file under core/, electron/ and renderer/ must be allowed by the
 * rules below, otherwise the script prints the file, line and rule, and exits 1.
 *
 *  core       -> core (not core/node), pure-JS packages in CORE_PACKAGES
 *  core/node  -> core, core/node, node:* built-ins, NODE_PACKAGES
 *  electron   -> core, core/node, electron/, node:*, electron, ELECTRON_PACKAGES
 *  renderer   -> renderer, core (not core/node), electron/common (type-only), RENDERER_PACKAGES
 *
 * Run: npm run lint (part of npm test).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** Packages allowed in pure core: no DOM, no Node built-ins inside. */
export const CORE_PACKAGES = ['ml-pca', 'simple-statistics'];
/** vite: loaded on demand by core/node/module-bundle.ts only, to bundle the CLI and worker modules when running from the TypeScript sources. */
export const NODE_PACKAGES = [...CORE_PACKAGES, 'h5wasm', 'h5wasm/node', 'vite'];
export const ELECTRON_PACKAGES = [...NODE_PACKAGES, 'electron', 'vite'];
export const RENDERER_PACKAGES = [...CORE_PACKAGES, 'react', 'react-dom', 'react-dom/client', 'react/jsx-runtime', 'plotly.js-dist-min', 'comlink', 'h5wasm'];
/** The plotting library's source as text, embedded in the HTML report the app exports (loaded on demand). */
RENDERER_PACKAGES.push('plotly.js-dist-min/plotly.min.js?raw');

type Area = 'core' | 'core/node' | 'electron' | 'electron/common' | 'renderer';

function areaOf(rel: string): Area | null {
  const p = rel.split(sep).join('/');
  if (p === 'renderer/vite.config.ts') return null; // build tooling: runs in Node, never in the page
  if (p.startsWith('core/node/')) return 'core/node';
  if (p.startsWith('core/')) return 'core';
  if (p.startsWith('electron/common/')) return 'electron/common';
  if (p.startsWith('electron/')) return 'electron';
  if (p.startsWith('renderer/')) return 'renderer';
  return null;
}

function walk(dir: string, out: string[]): void {
  for (const name of readdirSync(dir)) {
    if (name === 'node_modules' || name === 'dist' || name.startsWith('.')) continue;
    const p = join(dir, name);
    if (statSync(p).isDirectory()) walk(p, out);
    else if (/\.(ts|tsx|mts|js|mjs)$/.test(name) && !name.endsWith('.d.ts')) out.push(p);
  }
}

const IMPORT_RE =
  /(?:^|[\s;])(?:import|export)\s+(type\s+)?(?:[\w*{}\s,$]+?\s+from\s+)?['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)|require\(\s*['"]([^'"]+)['"]\s*\)|new URL\(\s*['"]([^'"]+)['"]\s*,\s*import\.meta\.url/g;

export interface Violation {
  file: string;
  line: number;
  spec: string;
  rule: string;
}

export function checkFile(abs: string, text: string): Violation[] {
  const rel = relative(ROOT, abs);
  const area = areaOf(rel);
  if (!area) return [];
  const out: Violation[] = [];
  IMPORT_RE.lastIndex = 0;
  let m: RegExpExecArray | null;
  while ((m = IMPORT_RE.exec(text))) {
    const typeOnly = Boolean(m[1]);
    const spec = m[2] ?? m[3] ?? m[4] ?? m[5];
    const line = text.slice(0, m.index).split('\n').length;
    const rule = violates(area, abs, spec, typeOnly);
    if (rule) out.push({ file: rel, line, spec, rule });
  }
  return out;
}

function violates(area: Area, abs: string, spec: string, typeOnly: boolean): string | null {
  if (spec.startsWith('.')) {
    const target = relative(ROOT, resolve(dirname(abs), spec)).split(sep).join('/');
    const tArea = areaOf(target + (target.includes('.') ? '' : '/x'));
    const to = tArea ?? (target.startsWith('..') ? 'outside' : target.split('/')[0]);
    switch (area) {
      case 'core':
        return to === 'core' ? null : `core may import only core (not ${to})`;
      case 'core/node':
        return to === 'core' || to === 'core/node' ? null : `core/node may import only core and core/node (not ${to})`;
      case 'electron/common':
        return to === 'core' || to === 'electron/common' ? null : `electron/common may import only core types (not ${to})`;
      case 'electron':
        return to === 'core' || to === 'core/node' || to === 'electron' || to === 'electron/common' ? null : `electron may not import ${to}`;
      case 'renderer':
        if (to === 'renderer' || to === 'core') return null;
        if (to === 'electron/common') return typeOnly ? null : 'renderer may import electron/common as types only (import type ...)';
        return `renderer may not import ${to}`;
    }
  }
  if (spec.startsWith('node:')) {
    return area === 'core/node' || area === 'electron' ? null : `${area} may not import Node built-ins (${spec})`;
  }
  const allowed: Record<Area, string[]> = {
    core: CORE_PACKAGES,
    'core/node': NODE_PACKAGES,
    'electron/common': [],
    electron: ELECTRON_PACKAGES,
    renderer: RENDERER_PACKAGES,
  };
  if (area === 'renderer' && (spec.endsWith('?worker') || spec.endsWith('?url'))) {
    return spec.startsWith('.') ? null : `renderer may not import ${spec}`;
  }
  return allowed[area].includes(spec)
    ? null
    : `${area} may not import "${spec}" (bare Node built-ins need the node: prefix and belong to core/node or electron; packages must be on the allowlist in scripts/check-imports.ts)`;
}

function main(): void {
  const files: string[] = [];
  for (const d of ['core', 'electron', 'renderer']) {
    try {
      walk(join(ROOT, d), files);
    } catch {
      /* folder absent */
    }
  }
  const violations = files.flatMap((f) => checkFile(f, readFileSync(f, 'utf8')));
  for (const v of violations) console.error(`${v.file}:${v.line}: import "${v.spec}": ${v.rule}`);
  if (violations.length) {
    console.error(`check-imports: ${violations.length} layering violation(s) in ${files.length} files`);
    process.exit(1);
  }
  console.log(`check-imports: ${files.length} files follow the layering rules`);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
