import { describe, expect, it } from 'vitest';
// @ts-expect-error plain JavaScript module of the drawing thread, without types
import { scriptSafeJson, spliceDrawing } from './drawingThread.mjs';

const template = [
  '<!DOCTYPE html><html lang="en"><head><title>Matwright</title>',
  '<style id="react-native-stylesheet">.build-rule{}</style>',
  '<link rel="preload" href="/fonts/a.woff2" as="font"/></head>',
  '<body><div id="root"><div class="wheel"></div></div>',
  '<script src="/_expo/static/js/web/entry-0f3c.js" defer></script></body></html>',
].join('');
const drawn = [
  '<!DOCTYPE html><html><head><style id="react-native-stylesheet">.drawn-rule{}</style></head>',
  '<body><div id="root"><div class="list" data-testid="job-list">Gannets jersey #31</div></div></body></html>',
].join('');

describe("the drawing thread's page", () => {
  it("puts the drawing's styles and markup where the build's page had its own, keeping everything else", () => {
    const page: string = spliceDrawing(template, drawn, { queries: [] }, '/after-paint-0a1b.js');
    expect(page).toContain('<style id="react-native-stylesheet">.drawn-rule{}</style>');
    expect(page).not.toContain('.build-rule');
    // Test ids are left out: the app's own page, drawn beside it before taking over, has them.
    expect(page).toContain('<div id="root"><div class="list">Gannets jersey #31</div></div>');
    expect(page).not.toContain('class="wheel"');
    // The build's head (fonts) and scripts stay, in their order.
    expect(page.indexOf('/fonts/a.woff2')).toBeLessThan(page.indexOf('Gannets'));
    expect(page.indexOf('Gannets')).toBeLessThan(page.indexOf('id="matwright-first-reads"'));
    expect(page.indexOf('id="matwright-first-reads"')).toBeLessThan(page.indexOf('entry-0f3c.js'));
    // The scripts are fetched at once (preloaded) and started after the first paint, in their order.
    expect(page).toContain('<link rel="preload" href="/_expo/static/js/web/entry-0f3c.js" as="script"/>');
    expect(page).toContain('<script src="/after-paint-0a1b.js" defer data-scripts="/_expo/static/js/web/entry-0f3c.js"></script>');
    expect(page).not.toContain('<script src="/_expo/static/js/web/entry-0f3c.js"');
    expect(page).not.toContain('data-testid');
    expect(page.endsWith('</body></html>')).toBe(true);
  });

  it('is painted only once the whole drawing is in (render-blocking until the element after its root)', () => {
    const page: string = spliceDrawing(template, drawn, { queries: [] }, '/after-paint-0a1b.js');
    // HTML Living Standard, "expect" link type with blocking="render": the browser holds the first
    // paint until the element the link points to has been parsed. It must be in the head.
    const link = /<link rel="expect" href="#([^"]+)" blocking="render"\/>/.exec(page);
    expect(link).not.toBeNull();
    expect(link!.index).toBeLessThan(page.indexOf('</head>'));
    const target = page.indexOf(`id="${link![1]}"`);
    expect(target).toBeGreaterThan(page.indexOf('Gannets jersey #31'));
  });

  it('leaves a page it cannot read to be sent undrawn', () => {
    expect(spliceDrawing(template.replace('id="root"', 'id="app"'), drawn, {}, '/after-paint-0a1b.js')).toBeNull();
    expect(spliceDrawing(template, drawn.replace('react-native-stylesheet', 'other'), {}, '/after-paint-0a1b.js')).toBeNull();
  });

  it('writes reads no text in them can break out of (the HTML standard: a script element ends at "</script")', () => {
    const reads = { title: '</script><script>alert(1)</script><!-- \u2028 \u2029 & >' };
    const text: string = scriptSafeJson(reads);
    expect(text.toLowerCase()).not.toContain('</script');
    expect(text).not.toContain('<!--');
    expect(text).not.toMatch(/[\u2028\u2029<>]/);
    expect(JSON.parse(text)).toEqual(reads);
    // And read back from a page: the block's text, up to the first "</script", is the JSON.
    const page: string = spliceDrawing(template, drawn, reads, '/after-paint-0a1b.js');
    const block = /<script type="application\/json" id="matwright-first-reads"[^>]*>([^]*?)<\/script>/.exec(page);
    expect(JSON.parse(block![1]!)).toEqual(reads);
  });
});
