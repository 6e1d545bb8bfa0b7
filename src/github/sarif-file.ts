/**
 * Writes the SARIF log for upload to code scanning (github/codeql-action/upload-sarif). The log itself is built by
 * src/report/sarif.ts with artifact URIs relative to the repository root.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { dirname } from 'node:path';

export async function writeSarifFile(path: string, sarif: object): Promise<void> {
  await mkdir(dirname(path), { recursive: true });
  await writeFile(path, JSON.stringify(sarif, null, 2) + '\n', 'utf8');
}
