// The layer walls in eslint.config.mjs, checked against the rules written in DEVELOPERS.md ("Lint and layers"):
// each row is an import placed in a file of one layer, and whether the linter must refuse it.
import { ESLint } from 'eslint';
import path from 'node:path';
import { describe, expect, test } from 'vitest';

const RULES = 'DEVELOPERS.md, Lint and layers';
const eslint = new ESLint({ cwd: path.resolve(__dirname, '../..'), cache: false });

async function refusals(filePath: string, source: string) {
  const [result] = await eslint.lintText(`${source}\nexport const used = x;\n`, { filePath });
  return result.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message);
}

describe('layer walls', () => {
  test.each([
    // [file, import, refused, source]
    ['components/log/example.tsx', "import { x } from '@/lib/server/projects';", true, `${RULES}: components never import lib/server`],
    ['components/log/example.tsx', "import { x } from '../../lib/server/projects';", true, `${RULES}: components never import lib/server`],
    ['components/log/example.tsx', "import { x } from '@/db/models';", true, `${RULES}: components never import db`],
    ['components/log/example.tsx', "import { x } from '../../db/connection';", true, `${RULES}: components never import db`],
    ['components/log/example.tsx', "import { x } from '@/lib/types/projects';", false, `${RULES}: shapes shared with components live in lib/types`],
    ['lib/fits/example.ts', "import { x } from 'react';", true, `${RULES}: pure engines import no React`],
    ['lib/calculators/example.ts', "import { x } from 'next/navigation';", true, `${RULES}: pure engines import no Next`],
    ['lib/measurements/example.ts', "import { x } from '@/db/models';", true, `${RULES}: pure engines import no db`],
    ['lib/chapters/example.ts', "import { x } from '../server/entries';", true, `${RULES}: pure engines import no lib/server`],
    ['lib/media/example.ts', "import { x } from '@/components/ui/button';", true, `${RULES}: pure engines import no components`],
    ['lib/safety/example.ts', "import { x } from '@/app/api/health/route';", true, `${RULES}: pure engines import nothing from app`],
    ['lib/comments/deep/example.ts', "import { x } from '../../../db/models';", true, `${RULES}: pure engines import no db`],
    ['lib/fits/example.ts', "import { x } from './iso';", false, `${RULES}: an engine's own files`],
    ['lib/calculators/example.ts', "import { x } from '../fits';", false, `${RULES}: one engine may use another`],
    ['lib/calculators/example.ts', "import { x } from './pages/registry';", true, `${RULES}: a calculator knows no page`],
    ['lib/calculators/example.ts', "import { x } from '@/lib/calculators/pages/definition';", true, `${RULES}: a calculator knows no page`],
    ['lib/calculators/example.ts', "import { x } from '@/db/models';", true, `${RULES}: the calculators keep the engines' walls too`],
    ['lib/calculators/pages/example.ts', "import { x } from '../registry';", false, `${RULES}: a page's description uses the calculators`],
    ['lib/calculators/pages/example.ts', "import { x } from 'react';", true, `${RULES}: pages' descriptions are pure (their components are in components/calculators)`],
    ['lib/calculators/pages/example.ts', "import { x } from '@/components/calculators/boxes';", true, `${RULES}: pure engines import no components`],
    ['lib/units/example.ts', "import { x } from 'next/navigation';", true, `${RULES}: pure engines import no Next`],
    ['lib/bench/example.ts', "import { x } from '../measurements';", false, `${RULES}: the bench's words come from the measurement engine`],
    ['lib/bench/example.ts', "import { x } from 'react';", true, `${RULES}: the bench's queue logic is pure`],
    ['lib/server/example.ts', "import { x } from '@/components/ui/button';", true, `${RULES}: lib/server never imports components`],
    ['lib/server/example.ts', "import { x } from '../../app/api/health/route';", true, `${RULES}: lib/server never imports app`],
    ['lib/server/example.ts', "import { x } from '../../db/models';", false, `${RULES}: lib/server is the way to db`],
    ['app/(public)/example/page.tsx', "import { x } from '@/lib/server/projects';", false, `${RULES}: pages load through lib/server`],
  ])('%s: %s (refused: %s) — %s', { timeout: 60_000 }, async (file, source, refused) => {
    const found = await refusals(file, source);
    if (refused) expect(found, `${file} should refuse ${source}`).not.toHaveLength(0);
    else expect(found).toEqual([]);
  });
});
