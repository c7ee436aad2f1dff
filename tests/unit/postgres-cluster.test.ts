// Where `npm start` keeps a cluster the postgres user cannot reach inside the checkout, and what
// it says when a cluster has lost its password file (scripts/lib/postgres.ts).
import { chmodSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { fallbackClusterDir, missingPasswordMessage, startPostgres } from '../../scripts/lib/postgres';

describe('the fallback cluster folder', () => {
  it('differs for two clones whose data folders end alike, and is stable for one', () => {
    const a = fallbackClusterDir('/root/clone-a/app/.data/pg');
    const b = fallbackClusterDir('/root/clone-b/app/.data/pg');
    expect(a).not.toBe(b);
    expect(fallbackClusterDir('/root/clone-a/app/.data/pg')).toBe(a);
    expect(path.dirname(a)).toBe('/var/tmp');
    expect(path.basename(a)).toMatch(/^packwright-pg-[0-9a-f]{16}$/);
  });

  it('is named after the absolute path, so a relative spelling of the same folder gives the same name', () => {
    const absolute = path.resolve('some/clone/.data/pg');
    expect(fallbackClusterDir('some/clone/.data/pg')).toBe(fallbackClusterDir(absolute));
  });
});

describe('a cluster without its password file', () => {
  const scratch = mkdtempSync(path.join(os.tmpdir(), 'packwright-pgdir-'));
  // The postgres user (when the tests run as root) must reach it, or the fallback would be used.
  chmodSync(scratch, 0o755);
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it('stops start-up with one line that says what to do', () => {
    const dataDir = path.join(scratch, 'pg');
    mkdirSync(dataDir, { recursive: true });
    writeFileSync(path.join(dataDir, 'PG_VERSION'), '16\n');
    const passwordFile = path.join(scratch, 'pg-password');
    let message = '';
    try {
      startPostgres({ dataDir, port: 1, passwordFile });
    } catch (error) {
      message = (error as Error).message;
    }
    expect(message).toBe(missingPasswordMessage(dataDir, passwordFile));
    expect(message.split('\n')).toHaveLength(1);
    expect(message).toContain('restore that file, or remove');
  });
});
