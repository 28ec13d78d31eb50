import { describe, expect, it } from 'vitest';
import { parseArgs, parseMarginPct, parseQuantityArg } from './args.js';

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

describe('parseArgs: export and plot', () => {
  it('parses export with Touchstone (ports from the extension) or CSV, and the sweep options', () => {
    expect(ok(['export', 'a.rfsheet', '--name', 'trap', '--touchstone', 'trap.s1p'])).toEqual({
      kind: 'export', file: 'a.rfsheet', name: 'trap', format: 'touchstone', output: 'trap.s1p', ports: 1, range: {},
    });
    expect(ok(['export', 'a', '--name=t', '--touchstone=o.S2P', '--from', '1GHz', '--to=2.5 GHz', '--points', '11', '--margin', '5'])).toEqual({
      kind: 'export', file: 'a', name: 't', format: 'touchstone', output: 'o.S2P', ports: 2, range: { from: 1e9, to: 2.5e9, points: 11 }, marginPct: 5,
    });
    expect(ok(['export', 'a', '--name', 't', '--csv', 'o.csv'])).toMatchObject({ format: 'csv', output: 'o.csv' });
  });

  it('parses plot, with lengths for the length view', () => {
    expect(ok(['plot', 'a', '--name', 't', '--svg', 'p.svg'])).toEqual({ kind: 'plot', file: 'a', name: 't', output: 'p.svg', view: 'frequency', range: {} });
    expect(ok(['plot', 'a', '--name', 't', '--svg', 'p.svg', '--view', 'length', '--from', '2mm', '--to', '300 mil', '--length-unit', 'mil'])).toEqual({
      kind: 'plot', file: 'a', name: 't', output: 'p.svg', view: 'length', range: { from: 2e-3, to: 300 * 25.4e-6 }, lengthUnit: 'mil',
    });
    expect(ok(['help', 'export'])).toEqual({ kind: 'help', topic: 'export' });
    expect(ok(['plot', '--help'])).toEqual({ kind: 'help', topic: 'plot' });
  });

  it.each([
    [['export', 'a', '--touchstone', 'x.s1p'], /--name NAME/],
    [['export', 'a', '--name', '1x', '--csv', 'x'], /--name takes a declared name/],
    [['export', 'a', 'b', '--name', 't', '--csv', 'x'], /export takes one sheet, got 2/],
    [['export', '--name', 't', '--csv', 'x'], /no sheet given: stubwright export FILE --name NAME/],
    [['export', 'a', '--name', 't', '--touchstone', 'x.s3p'], /ending in \.s1p/],
    [['export', 'a', '--name', 't', '--csv', 'x', '--touchstone', 'y.s1p'], /give one of/],
    [['export', 'a', '--name', 't', '--csv', 'x', '--svg', 'y'], /unknown option '--svg' for export/],
    [['export', 'a', '--name', 't', '--csv', 'x', '--from', '2 parsecs'], /--from is a positive frequency/],
    [['export', 'a', '--name', 't', '--csv', 'x', '--points', '1'], /--points is a whole number from 2 to 10001/],
    [['export', 'a', '--name', 't', '--csv', 'x', '--points', '3.5'], /--points is a whole number/],
    [['export', 'a', '--name', 't', '--csv', 'x', '--from', '2GHz', '--to', '1GHz'], /--from must be below --to/],
    [['plot', 'a', '--name', 't'], /--svg OUT\.svg/],
    [['plot', 'a', '--name', 't', '--svg', 'x', '--view', 'smith'], /--view must be frequency or length/],
    [['plot', 'a', '--name', 't', '--svg', 'x', '--length-unit', 'in'], /--length-unit must be mm or mil/],
    [['plot', 'a', '--name', 't', '--svg', 'x', '--view', 'length', '--to', '12'], /a positive length with its unit/],
    [['plot', 'a', '--name', 't', '--svg', 'x', '--touchstone', 'y.s1p'], /unknown option '--touchstone' for plot/],
    [['help', 'frob'], /commands are eval, check, export and plot/],
  ])('refuses %j', (argv, message) => {
    expect(bad(argv as string[])).toMatch(message);
  });
});

describe('parseQuantityArg', () => {
  it.each([
    ['2.4GHz', 'frequency', 2.4e9], ['2.4 ghz', 'frequency', 2.4e9], ['2.4e9', 'frequency', 2.4e9], ['100 MHz', 'frequency', 1e8], ['5kHz', 'frequency', 5e3],
    ['12mm', 'length', 12e-3], ['500 mil', 'length', 500 * 25.4e-6], ['30um', 'length', 30e-6], ['0.1 m', 'length', 0.1],
  ] as const)('reads %j as a %s', (text, kind, value) => expect(parseQuantityArg(text, kind)).toBeCloseTo(value, 12));

  it.each([
    ['', 'frequency'], ['0', 'frequency'], ['-1GHz', 'frequency'], ['2 GHz GHz', 'frequency'], ['2 mm', 'frequency'], ['12', 'length'], ['2GHz', 'length'], ['1e999', 'frequency'],
  ] as const)('refuses %j as a %s', (text, kind) => expect(parseQuantityArg(text, kind)).toBeNull());
});
