import { ESLint } from 'eslint';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';

// Each import boundary of eslint.config.js, checked on a few lines of code linted in memory
// under a file name inside the part it belongs to. The imported modules exist, so the import
// resolves as it would in the real file.
const root = fileURLToPath(new URL('../..', import.meta.url));
let eslint: ESLint;

beforeAll(() => {
  eslint = new ESLint({ cwd: root });
});

/** The boundary messages ESLint reports for `code` as if it were the file `filePath`, by line. */
async function boundaryFindings(filePath: string, code: string) {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((m) => m.ruleId === 'boundaries/dependencies').map((m) => ({ line: m.line, message: m.message }));
}

describe('import boundaries', () => {
  it('a feature never imports another feature, however it imports', async () => {
    const findings = await boundaryFindings(
      'src/features/editor/components/Probe.tsx',
      [
        "import { budgetListQuery } from '../../budgets/api/budgets';",
        "export { auditQuery } from '../../audit/api/audit';",
        "export const lazyReport = () => import('../../report/components/ReportPage');",
        "import { nextUMove } from '../u-move';",
        "import { api } from '../../../app/http';",
        'export const used = [budgetListQuery, nextUMove, api];',
      ].join('\n'),
    );
    expect(findings.map((f) => f.line)).toEqual([1, 2, 3]);
    expect(findings[0].message).toContain('editor → budgets');
  });

  it('src/budget never imports a feature', async () => {
    const findings = await boundaryFindings(
      'src/budget/probe.ts',
      ["import { nextUMove } from '../features/editor/u-move';", "import { api } from '../app/http';", 'export const used = [nextUMove, api];'].join('\n'),
    );
    expect(findings.map((f) => f.line)).toEqual([1]);
  });

  it('shared/ imports neither the client, the server, the command line nor Node', async () => {
    const findings = await boundaryFindings(
      'shared/gum/probe.ts',
      [
        "import { api } from '../../src/app/http';",
        "import { createApp } from '../../server/app';",
        "import { expandFiles } from '../../cli/expand-files';",
        "import { readFileSync } from 'node:fs';",
        "import { join } from 'path';",
        "import { z } from 'zod';",
        "import { propagateGum } from './propagate';",
        'export const used = [api, createApp, expandFiles, readFileSync, join, z, propagateGum];',
      ].join('\n'),
    );
    expect(findings.map((f) => f.line)).toEqual([1, 2, 3, 4, 5]);
  });

  it('the client imports neither the server nor the command line', async () => {
    const findings = await boundaryFindings(
      'src/app/probe.ts',
      [
        "import { createApp } from '../../server/app';",
        "import { expandFiles } from '../../cli/expand-files';",
        "import { groupDigits } from '../../shared/format/digit-groups';",
        'export const used = [createApp, expandFiles, groupDigits];',
      ].join('\n'),
    );
    expect(findings.map((f) => f.line)).toEqual([1, 2]);
  });

  it('the server never imports the client', async () => {
    const findings = await boundaryFindings(
      'server/probe.ts',
      [
        "import { api } from '../src/app/http';",
        "import { nextUMove } from '../src/features/editor/u-move';",
        "import { groupDigits } from '../shared/format/digit-groups';",
        "import { join } from 'node:path';",
        'export const used = [api, nextUMove, groupDigits, join];',
      ].join('\n'),
    );
    expect(findings.map((f) => f.line)).toEqual([1, 2]);
  });

  it('the command line imports only shared/ and Node', async () => {
    const findings = await boundaryFindings(
      'cli/probe.ts',
      [
        "import { createApp } from '../server/app';",
        "import { api } from '../src/app/http';",
        "import { z } from 'zod';",
        "import { groupDigits } from '../shared/format/digit-groups';",
        "import { join } from 'node:path';",
        "import { expandFiles } from './expand-files';",
        'export const used = [createApp, api, z, groupDigits, join, expandFiles];',
      ].join('\n'),
    );
    expect(findings.map((f) => f.line)).toEqual([1, 2, 3]);
  });
});
