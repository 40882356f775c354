/** programVersion is the version package.json publishes (the report and `gvf --version` show it). */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { programName, programVersion } from '../../src/core/version.js';

describe('programVersion', () => {
  it('programVersion equals package.json version and programName its name', () => {
    const pkg = JSON.parse(readFileSync(join(import.meta.dirname, '..', '..', 'package.json'), 'utf8')) as { name: string; version: string };
    expect(programVersion).toBe(pkg.version);
    expect(programName).toBe(pkg.name);
  });
});
