import { ErrorCodes, ResponseError } from 'vscode-languageserver';
import { describe, expect, it } from 'vitest';
import { sheetName, toExportParams, toPlotParams } from './plot.js';

const code = (fn: () => unknown) => {
  try {
    fn();
  } catch (e) {
    return e instanceof ResponseError ? e.code : 'not a ResponseError';
  }
  return 'no error';
};

describe('plot request parameters', () => {
  it('keeps the known fields and drops nulls', () => {
    expect(toPlotParams({ uri: 'file:///a', name: 'trap', view: 'length', fromHz: 1e9, toHz: null, extra: 1 }))
      .toEqual({ uri: 'file:///a', name: 'trap', view: 'length', fromHz: 1e9 });
    expect(toExportParams({ uri: 'file:///a', name: 'trap', format: 'touchstone', points: 11 }))
      .toEqual({ uri: 'file:///a', name: 'trap', format: 'touchstone', points: 11 });
  });

  it('refuses malformed parameters with InvalidParams', () => {
    for (const bad of [null, [], 'trap', { uri: 'file:///a' }, { uri: '', name: 'x' }, { uri: 'file:///a', name: 'x', view: 'polar' },
      { uri: 'file:///a', name: 'x', points: 2.5 }, { uri: 'file:///a', name: 'x', fromHz: -1 }, { uri: 'file:///a', name: 'x', toHz: Number.NaN }]) {
      expect(code(() => toPlotParams(bad)), JSON.stringify(bad)).toBe(ErrorCodes.InvalidParams);
    }
    expect(code(() => toExportParams({ uri: 'file:///a', name: 'x' }))).toBe(ErrorCodes.InvalidParams);
    expect(code(() => toExportParams({ uri: 'file:///a', name: 'x', format: 'pdf' }))).toBe(ErrorCodes.InvalidParams);
  });

  it('names the sheet file of a URI for the export header', () => {
    expect(sheetName('file:///work/my%20sheets/sensor-node.rfsheet')).toBe('sensor-node.rfsheet');
    expect(sheetName('untitled:Untitled-1')).toBe('untitled:Untitled-1');
    expect(sheetName('file:///work/bad%E0.rfsheet?x#y')).toBe('bad%E0.rfsheet');
    expect(sheetName('file:///')).toBeUndefined();
  });
});
