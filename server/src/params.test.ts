import { ErrorCodes, ResponseError } from 'vscode-languageserver';
import { describe, expect, it } from 'vitest';
import { checkParams } from './params.js';

const doc = { textDocument: { uri: 'file:///a.rfsheet' } };
const pos = { line: 1, character: 2 };
const fails = (params: unknown, needs: Parameters<typeof checkParams>[1], field: RegExp) => {
  let error: unknown;
  try {
    checkParams(params, needs);
  } catch (e) {
    error = e;
  }
  expect(error).toBeInstanceOf(ResponseError);
  expect((error as ResponseError<unknown>).code).toBe(ErrorCodes.InvalidParams);
  expect((error as ResponseError<unknown>).message).toMatch(field);
};

describe('checkParams', () => {
  it('accepts what the protocol defines, positions past the end included (handlers clamp them)', () => {
    expect(() => checkParams(doc)).not.toThrow();
    expect(() => checkParams({ ...doc, position: { line: 1e9, character: -3 } }, { position: true })).not.toThrow();
    expect(() => checkParams({ ...doc, range: { start: pos, end: pos }, context: { diagnostics: [] } }, { range: true, context: 'diagnostics' })).not.toThrow();
    expect(() => checkParams({ ...doc, position: pos, context: { includeDeclaration: true } }, { position: true, context: 'includeDeclaration' })).not.toThrow();
    expect(() => checkParams({ ...doc, position: pos, newName: 'x' }, { position: true, newName: true })).not.toThrow();
  });

  it('names the first bad field', () => {
    fails(null, {}, /^params/);
    fails({}, {}, /^textDocument\.uri/);
    fails({ textDocument: { uri: 42 } }, {}, /^textDocument\.uri/);
    fails(doc, { position: true }, /^position must/);
    fails({ ...doc, position: { line: 'x', character: 0 } }, { position: true }, /^position\.line/);
    fails({ ...doc, position: { line: 0, character: Number.NaN } }, { position: true }, /^position\.character/);
    fails({ ...doc, range: { start: pos } }, { range: true }, /^range\.end/);
    fails({ ...doc, range: { start: pos, end: pos } }, { range: true, context: 'diagnostics' }, /^context must/);
    fails({ ...doc, range: { start: pos, end: pos }, context: {} }, { range: true, context: 'diagnostics' }, /^context\.diagnostics/);
    fails({ ...doc, position: pos, context: {} }, { position: true, context: 'includeDeclaration' }, /^context\.includeDeclaration/);
    fails({ ...doc, position: pos }, { position: true, newName: true }, /^newName/);
  });
});
