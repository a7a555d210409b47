import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const folder = dirname(fileURLToPath(import.meta.url));
const FORBIDDEN = [/^react$/, /^react-native/, /^react-dom/, /^express/, /^drizzle-orm/, /^node:/, /^(fs|path|url|child_process|os|crypto)$/, /^@\/(server|db|features|app)\b/];

/** Every non-test TypeScript file under geometry/, subfolders included, as paths relative to it. */
function sourceFiles(): string[] {
  return readdirSync(folder, { recursive: true, encoding: 'utf8' })
    .filter((name) => name.endsWith('.ts') && !name.endsWith('.test.ts') && !name.endsWith('.d.ts'))
    .sort();
}

function importsOf(text: string): string[] {
  const found: string[] = [];
  for (const match of text.matchAll(/(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|require\(\s*['"]([^'"]+)['"]\s*\)/g)) {
    found.push(match[1] ?? match[2] ?? match[3] ?? '');
  }
  return found;
}

describe('geometry stays pure', () => {
  it('has source files to check', () => {
    expect(sourceFiles()).toEqual(expect.arrayContaining(['units.ts', 'shapes.ts', 'clip.ts', 'checks.ts']));
  });

  it.each(sourceFiles())('%s imports nothing from React, React Native, Express, Drizzle or node:*', (name) => {
    const offending = importsOf(readFileSync(join(folder, name), 'utf8')).filter((spec) => FORBIDDEN.some((rule) => rule.test(spec)));
    expect(offending).toEqual([]);
  });

  it('recognises a forbidden import when it sees one', () => {
    const sample = "import { readFileSync } from 'node:fs';\nimport React from 'react';";
    expect(importsOf(sample).filter((spec) => FORBIDDEN.some((rule) => rule.test(spec)))).toEqual(['node:fs', 'react']);
  });
});
