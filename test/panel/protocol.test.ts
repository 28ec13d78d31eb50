/**
 * The client writes the plot protocol out (it imports nothing of ours); these checks keep its copy
 * in step with the server's request names and the service's result shapes. The shape checks are
 * type assignments, so `npm run typecheck` fails when either side changes alone.
 */
import { describe, expect, it } from 'vitest';
import * as client from '../../client/src/protocol.js';
import type { ExportResult, PlotMarker, PlotResult, PlotView } from '../../server/src/core.js';
import * as server from '../../server/src/features/plot.js';

/** Compiles only when a value of type `From` may be used where `To` is expected. */
const assignable = <To>() => <From extends To>(): true => true;

describe('plot protocol: client and server agree', () => {
  it('names the same command and requests', () => {
    expect(client.SHOW_PLOT_COMMAND).toBe(server.SHOW_PLOT_COMMAND);
    expect(client.PLOT_REQUEST).toBe(server.PLOT_REQUEST);
    expect(client.EXPORT_REQUEST).toBe(server.EXPORT_REQUEST);
  });

  it('reads the service\'s results with the client\'s types, and sends parameters the server accepts', () => {
    expect(assignable<client.PlotResult>()<PlotResult>()).toBe(true);
    expect(assignable<client.PlotMarker>()<PlotMarker>()).toBe(true);
    expect(assignable<client.ExportResult>()<ExportResult>()).toBe(true);
    expect(assignable<client.PlotView>()<PlotView>()).toBe(true);
    expect(assignable<PlotView>()<client.PlotView>()).toBe(true);
    expect(assignable<server.PlotParams>()<client.PlotParams>()).toBe(true);
    expect(assignable<server.ExportParams>()<client.ExportParams>()).toBe(true);
    const params: client.PlotParams = { uri: 'file:///a.rfsheet', name: 'trap', view: 'length', fromHz: 1e9, toHz: 2e9, points: 11 };
    expect(server.toPlotParams(params)).toEqual(params);
    const exp: client.ExportParams = { uri: 'file:///a.rfsheet', name: 'trap', format: 'csv', points: 11 };
    expect(server.toExportParams(exp)).toEqual(exp);
  });

  it('the client recognises the server\'s error results', () => {
    expect(client.isPlotError({ error: 'no stub, line or sweep named "x"' })).toBe(true);
    expect(client.isPlotError({ name: 'x', svg: '<svg/>' })).toBe(false);
    expect(client.isPlotError(null)).toBe(false);
  });
});
