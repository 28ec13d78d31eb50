import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

describe('expression layer dependencies', () => {
  it('imports only mathjs and its own files (no editor, no node built-ins) outside tests', () => {
    const dir = new URL('.', import.meta.url);
    const sources = readdirSync(dir).filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts') && f !== 'testUtil.ts');
    expect(sources.length).toBeGreaterThan(5);
    for (const file of sources) {
      const text = readFileSync(new URL(file, dir), 'utf8');
      for (const m of text.matchAll(/from '([^']+)'/g)) {
        expect(m[1] === 'mathjs' || /^\.\/[\w]+\.js$/.test(m[1] ?? ''), `${file} imports ${m[1]}`).toBe(true);
      }
    }
  });
});
