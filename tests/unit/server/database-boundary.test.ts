import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const serverDir = path.resolve(import.meta.dirname, '../../../server');
const databaseDir = path.join(serverDir, 'database');

/** Every TypeScript file of the server outside server/database/. */
function serverFilesOutsideDatabase(dir = serverDir): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return full === databaseDir ? [] : serverFilesOutsideDatabase(full);
    return entry.name.endsWith('.ts') ? [full] : [];
  });
}

/** What only a dialect may say: which database it is, and SQLite's own statements. */
const DIALECT_SPECIFIC = [/\bgetDialect\s*\(/, /\bPRAGMA\b/i, /\bsqlite_master\b/i, /\bpg_[a-z_]+\s*\(/];

describe('the database module', () => {
  it('holds everything dialect-specific: no server file outside it asks which database it is or runs its own pragmas', () => {
    const files = serverFilesOutsideDatabase();
    expect(files.length).toBeGreaterThan(20);
    const found = files.flatMap((file) => {
      const text = fs.readFileSync(file, 'utf8');
      return DIALECT_SPECIFIC.filter((pattern) => pattern.test(text)).map(
        (pattern) => `${path.relative(serverDir, file)}: ${pattern}`,
      );
    });
    expect(found).toEqual([]);
  });
});
