import { describe, expect, it } from 'vitest';
import { lex, MAX_SIGN_RUN } from './lex.js';

const tokens = (text: string) => {
  const r = lex(text, 40);
  if (!r.ok) throw new Error(r.error.message);
  return r.tokens.map((t) => `${t.kind}:${t.text}@${t.start}`);
};

describe('lex', () => {
  it('reads numbers as mathjs does', () => {
    expect(tokens('1e-3 2em .5 0x1F 2.45GHz')).toEqual([
      'number:1e-3@0', 'number:2@5', 'ident:em@6', 'number:.5@9', 'number:0x1F@12', 'number:2.45@17', 'ident:GHz@21',
    ]);
    expect(tokens('2e+ 0xZ')).toEqual(['number:2@0', 'ident:e@1', 'op:+@2', 'number:0@4', 'ident:xZ@5']);
  });

  it('reads names with Greek and Latin letters', () => {
    expect(tokens('μr * gap_2 + $k')).toEqual(['ident:μr@0', 'op:*@3', 'ident:gap_2@5', 'op:+@11', 'ident:$k@13']);
  });

  it('shows invisible characters by code point', () => {
    const r = lex('1 \u200b 2', 40);
    expect(!r.ok && r.error.message).toBe('unexpected character U+200B');
  });

  it('counts signs across spaces', () => {
    const run = '- '.repeat(MAX_SIGN_RUN);
    expect(lex(`1 ${run}1`, 40).ok).toBe(true);
    expect(lex(`1 ${run}- 1`, 40)).toMatchObject({ ok: false, error: { code: 'limit', start: 2 } });
  });
});
