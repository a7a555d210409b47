import fs from 'node:fs';
import path from 'node:path';

/** The project's root folder, for tests that read its source. */
export const projectRoot = path.resolve(__dirname, '../..');

/** Every TypeScript source file (tests left out) under the named folders of the project, subfolders included. */
export function sourceFiles(...folders: string[]): string[] {
  const walk = (dir: string): string[] =>
    fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) return walk(full);
      return /\.tsx?$/.test(entry.name) && !/\.test\.tsx?$/.test(entry.name) ? [full] : [];
    });
  return folders.flatMap((folder) => walk(path.join(projectRoot, folder)));
}
