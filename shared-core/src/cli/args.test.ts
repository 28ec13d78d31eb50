import { describe, expect, it } from 'vitest';
import { parseArgs, parseMarginPct } from './args.js';

const ok = (argv: string[]) => {
  const r = parseArgs(argv);
  if (!r.ok) throw new Error(r.message);
  return r.command;
};
const bad = (argv: string[]) => {
  const r = parseArgs(argv);
  if (r.ok) throw new Error(`accepted ${argv.join(' ')}`);
  return r.message;
};

describe('parseArgs', () => {
  it('parses help and version', () => {
    expect(ok(['--help'])).toEqual({ kind: 'help' });
    expect(ok(['-h'])).toEqual({ kind: 'help' });
    expect(ok(['help', 'check'])).toEqual({ kind: 'help', topic: 'check' });
    expect(ok(['eval', 'a.rfsheet', '--help'])).toEqual({ kind: 'help', topic: 'eval' });
    expect(ok(['--version'])).toEqual({ kind: 'version' });
    expect(ok(['-v'])).toEqual({ kind: 'version' });
  });

  it('parses eval', () => {
    expect(ok(['eval', 'a.rfsheet', 'b.rfsheet'])).toEqual({ kind: 'eval', files: ['a.rfsheet', 'b.rfsheet'], json: false });
    expect(ok(['eval', '--json', '--margin', '15', 'a'])).toEqual({ kind: 'eval', files: ['a'], json: true, marginPct: 15 });
    expect(ok(['eval', 'a', '--margin=7.5%'])).toEqual({ kind: 'eval', files: ['a'], json: false, marginPct: 7.5 });
  });

  it('parses check with every option, in either spelling', () => {
    expect(ok(['check', 'a'])).toEqual({ kind: 'check', files: ['a'], format: 'text', strict: false });
    expect(ok(['check', '--format', 'sarif', '--strict', '--margin', '20', '--output', 'r.sarif', 'a', 'b'])).toEqual({
      kind: 'check', files: ['a', 'b'], format: 'sarif', strict: true, marginPct: 20, output: 'r.sarif',
    });
    expect(ok(['check', '--format=json', '--output=out/r.json', 'a'])).toMatchObject({ format: 'json', output: 'out/r.json' });
  });

  it('treats everything after -- as files', () => {
    expect(ok(['check', '--', '--strict', '-x'])).toMatchObject({ files: ['--strict', '-x'], strict: false });
  });

  it.each([
    [[], /missing command/],
    [['frobnicate'], /unknown command 'frobnicate'/],
    [['--frob'], /unknown option '--frob'/],
    [['help', 'nope'], /no help for 'nope'/],
    [['eval'], /no sheet given/],
    [['check', '--strict'], /no sheet given/],
    [['check', '--bogus', 'a'], /unknown option '--bogus' for check/],
    [['eval', '--format', 'json', 'a'], /unknown option '--format' for eval/],
    [['check', '--json', 'a'], /unknown option '--json' for check/],
    [['eval', '--output', 'x', 'a'], /unknown option '--output' for eval/],
    [['check', '--format', 'xml', 'a'], /--format must be text, json or sarif \(got 'xml'\)/],
    [['check', '--format'], /--format needs a value/],
    [['check', '--output', '--strict', 'a'], /--output needs a value/],
    [['check', '--output=', 'a'], /--output needs a value/],
    [['check', '--strict=yes', 'a'], /--strict takes no value/],
    [['check', '--strict', '--strict', 'a'], /--strict given twice/],
    [['check', '--format', 'json', '--format=text', 'a'], /--format given twice/],
    [['check', '--margin', 'abc', 'a'], /--margin must be a percentage/],
    [['check', '--margin', '0', 'a'], /got '0'/],
    [['check', '--margin', '-5', 'a'], /got '-5'/],
    [['check', '--margin', '150', 'a'], /got '150'/],
    [['eval', '-', 'a'], /standard input/],
  ])('refuses %j', (argv, message) => {
    expect(bad(argv as string[])).toMatch(message);
  });
});

describe('parseMarginPct', () => {
  it.each([
    ['10', 10], ['7.5', 7.5], ['.5', 0.5], ['12%', 12], [' 12 % ', 12], ['1e1', 10], ['100', 100], ['+3', 3],
  ])('accepts %j', (text, value) => expect(parseMarginPct(text)).toBe(value));

  it.each(['', '0', '0.0', '-1', '100.01', '1e3', 'NaN', 'Infinity', '10 percent', '0x10', '1,5', '%'])('refuses %j', (text) => {
    expect(parseMarginPct(text)).toBeNull();
  });
});
