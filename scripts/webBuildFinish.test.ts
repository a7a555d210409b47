import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
// @ts-expect-error plain Node module without types
import { COMPILE_HINT, finishWebBuild, modulesOf } from './webBuildFinish.mjs';
// @ts-expect-error the installed source-map (0.5, Metro's) ships no types
import { SourceMapConsumer } from 'source-map';

/**
 * A small export written here in Metro's chunk format (each module as
 * `__d(factory,<id>,<dependency map>);` on a line of its own, an async import's
 * chunk under the map's "paths"): pages whose scripts define every module they
 * require lose the shared script, the others keep it.
 */
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'matwright-finish-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

const js = path.join(dir, '_expo/static/js/web');
fs.mkdirSync(js, { recursive: true });
const write = (name: string, text: string) => fs.writeFileSync(path.join(dir, name), text);
const chunk = (name: string, lines: string[]) => write(`_expo/static/js/web/${name}`, `${lines.join('\n')}\n`);
const mod = (id: number, map: string) => `__d(function(g,r,i,a,m,e,d){"use strict";var x=r(d[0])},${id},${map});`;

// The entry defines 1-3; module 3 loads route chunks 10 and 20 later. The shared script holds 50.
chunk('index-0123456789abcdef0123.js', [mod(1, '[]'), mod(2, '[1]'), mod(3, '{"0":1,"1":10,"2":20,"paths":{"10":"/_expo/static/js/web/open-aaaaaaaaaaaaaaaa0000.js","20":"/_expo/static/js/web/shop-bbbbbbbbbbbbbbbb0000.js"}}'), '__r(3);']);
chunk('__common-fedcba9876543210fedc.js', [mod(50, '[1]')]);
chunk('open-aaaaaaaaaaaaaaaa0000.js', [mod(10, '[2,1]')]);
chunk('shop-bbbbbbbbbbbbbbbb0000.js', [mod(20, '[50,2]')]);
const page = (route: string) =>
  `<!DOCTYPE html><html><head><title>x</title></head><body><div id="root"></div><script src="/_expo/static/js/web/${route}" defer></script><script src="/_expo/static/js/web/__common-fedcba9876543210fedc.js" defer></script><script src="/_expo/static/js/web/index-0123456789abcdef0123.js" defer></script></body></html>`;
write('open.html', page('open-aaaaaaaaaaaaaaaa0000.js'));
write('shop.html', page('shop-bbbbbbbbbbbbbbbb0000.js'));
fs.mkdirSync(path.join(dir, 'fonts'));

describe('the shared script, only where a page needs it', () => {
  it("reads Metro's modules and their dependency maps, later loads apart", () => {
    const modules = modulesOf(fs.readFileSync(path.join(js, 'index-0123456789abcdef0123.js'), 'utf8'));
    expect([...modules.keys()]).toEqual([1, 2, 3]);
    expect(modules.get(3)).toEqual({ requires: [1], later: [10, 20] });
    expect(modules.get(2)).toEqual({ requires: [1], later: [] });
  });

  it('leaves it out of a page whose scripts define all they require, and names it there for later', () => {
    const { withoutSharedCode } = finishWebBuild(dir);
    expect(withoutSharedCode).toEqual(['open.html']);
    const open = fs.readFileSync(path.join(dir, 'open.html'), 'utf8');
    expect(open).not.toContain('<script src="/_expo/static/js/web/__common-fedcba9876543210fedc.js"');
    const meta = /<meta name="matwright-shared-code" content="([^"]+)" data-not-needed-by="([^"]+)"\/>/.exec(open);
    expect(meta?.[1]).toBe('/_expo/static/js/web/__common-fedcba9876543210fedc.js');
    expect(meta?.[2]!.split(' ')).toContain('/_expo/static/js/web/open-aaaaaaaaaaaaaaaa0000.js');
    expect(meta?.[2]!.split(' ')).not.toContain('/_expo/static/js/web/shop-bbbbbbbbbbbbbbbb0000.js');
    // Every page preloads the Latin part of each face, and names the rest by unicode-range only.
    const preloads = [...open.matchAll(/<link rel="preload" href="\/fonts\/([^"]+)" as="font"/g)].map((m) => m[1]!);
    expect(preloads.map((name) => name.replace(/\.[0-9a-f]{20}\.woff2$/, '')).sort()).toEqual(['Manrope_400Regular-latin', 'Manrope_600SemiBold-latin', 'Manrope_700Bold-latin']);
    expect(open.match(/@font-face \{[^}]*unicode-range: U\+[^}]*\}/g)).toHaveLength(6);
    for (const name of preloads) expect(fs.existsSync(path.join(dir, 'fonts', name))).toBe(true);
    // The page whose screen requires module 50 keeps the script.
    expect(fs.readFileSync(path.join(dir, 'shop.html'), 'utf8')).toContain('<script src="/_expo/static/js/web/__common-fedcba9876543210fedc.js" defer></script>');
  });
});

describe('the compile hint on every script', () => {
  it('puts it on the first line once, and moves the source map down a line to match', async () => {
    const name = 'open-aaaaaaaaaaaaaaaa0000.js';
    // The shift is checked with the source-map library: generated line 1 before, line 2 after.
    const mapFile = path.join(js, `${name}.map`);
    const map = { version: 3, sources: ['open.tsx'], names: [], mappings: 'AAAA' };
    fs.writeFileSync(mapFile, JSON.stringify(map));
    const before = fs.readFileSync(path.join(js, name), 'utf8').replace(/^\/\/# allFunctionsCalledOnLoad\n/, '');
    fs.writeFileSync(path.join(js, name), before);
    const { eagerlyCompiled } = finishWebBuild(dir);
    finishWebBuild(dir); // run twice: still one hint
    expect(eagerlyCompiled).toContain(name);
    for (const file of fs.readdirSync(js).filter((n) => n.endsWith('.js'))) {
      const code = fs.readFileSync(path.join(js, file), 'utf8');
      expect(code.startsWith(`${COMPILE_HINT}\n`), file).toBe(true);
      expect(code.split(COMPILE_HINT)).toHaveLength(2);
    }
    expect(fs.readFileSync(path.join(js, name), 'utf8')).toBe(`${COMPILE_HINT}\n${before}`);
    const consumer = await new SourceMapConsumer(JSON.parse(fs.readFileSync(mapFile, 'utf8')));
    expect(consumer.originalPositionFor({ line: 2, column: 0 })).toMatchObject({ source: 'open.tsx', line: 1, column: 0 });
    expect(consumer.originalPositionFor({ line: 1, column: 0 }).source).toBeNull();
  });
});
