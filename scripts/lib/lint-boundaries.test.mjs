// The import boundaries of eslint.config.js, each shown to fail a deliberate bad import (and to let
// a good one through), through ESLint's own Node API on the real configuration.
import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import path from 'node:path';
import { ESLint } from 'eslint';
import { ROOT_DIR } from './paths.mjs';

const eslint = new ESLint({ cwd: ROOT_DIR });

/** The no-restricted-imports messages ESLint reports for `code` as if it were the file at `file`. */
async function boundaryErrors(file, code) {
  const [result] = await eslint.lintText(code, { filePath: path.join(ROOT_DIR, file) });
  return result.messages.filter((message) => message.ruleId === 'no-restricted-imports').map((message) => message.message);
}

const CASES = [
  {
    zone: 'a feature importing another feature',
    file: 'ui/src/features/links/components/probe.tsx',
    bad: "import { diffDesign } from '@/features/link-design/design-diff';\nexport const probe = diffDesign;\n",
    good: "import { getLinks } from '@/features/links/api/get-links';\nexport const probe = getLinks;\n",
    expect: /never imports another feature/,
  },
  {
    zone: 'a feature climbing out with a relative path',
    file: 'ui/src/features/links/components/probe.tsx',
    bad: "import { probe as other } from '../../reviews/api/get-reviews';\nexport const probe = other;\n",
    good: "import { probe as own } from '../api/get-links';\nexport const probe = own;\n",
    expect: /relative path must not leave its feature/,
  },
  {
    zone: 'a feature importing app/',
    file: 'ui/src/features/reviews/components/probe.tsx',
    bad: "import { AppRouter } from '@/app/router';\nexport const probe = AppRouter;\n",
    good: "import { formatDb } from '@/lib/format';\nexport const probe = formatDb;\n",
    expect: /Features never import app/,
  },
  {
    zone: 'the ui importing api code',
    file: 'ui/src/app/routes/probe.tsx',
    bad: "import { LinksService } from '../../../../api/src/links/links.service';\nexport const probe = LinksService;\n",
    good: "import { LinkDetailSchema } from '@beamwright/link-core/contracts';\nexport const probe = LinkDetailSchema;\n",
    expect: /never imports api code/,
  },
  {
    zone: 'shared ui code importing a feature',
    file: 'ui/src/components/ui/probe.tsx',
    bad: "import { getLinks } from '@/features/links/api/get-links';\nexport const probe = getLinks;\n",
    good: "import { formatDb } from '@/lib/format';\nexport const probe = formatDb;\n",
    expect: /imports neither/,
  },
  {
    zone: 'link-core importing the fixtures',
    file: 'link-core/src/budget/probe.ts',
    bad: "import demo from '../../../fixtures/demo/links.json';\nexport const probe = demo;\n",
    good: "import { DB_PER_NEPER } from '../units/decibels.js';\nexport const probe = DB_PER_NEPER;\n",
    expect: /link-core is pure/,
  },
  {
    zone: 'link-core importing the api',
    file: 'link-core/src/contracts/probe.ts',
    bad: "import { thing } from '@beamwright/api';\nexport const probe = thing;\n",
    good: "import { z } from 'zod';\nexport const probe = z;\n",
    expect: /link-core is pure/,
  },
];

describe('lint boundaries (eslint.config.js)', () => {
  for (const boundary of CASES) {
    it(`fails ${boundary.zone}, passes the allowed import`, async () => {
      const errors = await boundaryErrors(boundary.file, boundary.bad);
      assert.equal(errors.length, 1, `one boundary error for: ${boundary.bad.split('\n')[0]}`);
      assert.match(errors[0], boundary.expect);
      assert.deepEqual(await boundaryErrors(boundary.file, boundary.good), []);
    });
  }
});
