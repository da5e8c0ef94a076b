import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkFile } from '../../scripts/check-imports';

const at = (p: string) => resolve(__dirname, '../..', p);

describe('layering lint (DESIGN.md section 1)', () => {
  it.each([
    ['core/stats/x.ts', "import { readFileSync } from 'node:fs';", /Node built-ins/],
    ['core/stats/x.ts', "import fs from 'fs';", /may not import "fs"/],
    ['core/stats/x.ts', "import { a } from '../node/read';", /core may import only core/],
    ['core/stats/x.ts', "import React from 'react';", /may not import "react"/],
    ['core/stats/x.ts', "const m = await import('../../renderer/app');", /core may import only core/],
    ['renderer/app.tsx', "import { x } from '../core/node/cli';", /renderer may not import core\/node/],
    ['renderer/app.tsx', "import { api } from '../electron/common/ipc';", /types only/],
    ['renderer/app.tsx', "import { app } from 'electron';", /may not import "electron"/],
    ['core/node/cli.ts', "import { App } from '../../renderer/app';", /core\/node may import only/],
  ])('%s: %s is refused', (file, src, re) => {
    const v = checkFile(at(file), src);
    expect(v).toHaveLength(1);
    expect(v[0].rule).toMatch(re);
  });
  it.each([
    ['core/stats/x.ts', "import { lowerBound } from '../align/lower-bound';"],
    ['core/node/cli.ts', "import { readFile } from 'node:fs/promises';\nimport { STEPS } from '../pipeline/steps';"],
    ['renderer/app.tsx', "import type { Api } from '../electron/common/ipc';\nimport { createRoot } from 'react-dom/client';"],
    ['electron/main.ts', "import { app } from 'electron';\nimport { x } from '../core/node/read';"],
  ])('%s: allowed imports pass', (file, src) => {
    expect(checkFile(at(file), src)).toEqual([]);
  });
});
