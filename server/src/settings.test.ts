import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from './core.js';
import { createSettingsStore, toServiceSettings } from './settings.js';

describe('toServiceSettings', () => {
  it('maps the editor section onto service settings (grid mm → m)', () => {
    expect(toServiceSettings({ resonanceMargin: 5, manufacturingGrid: 0.05, lengthUnit: 'mil', inlayHints: false })).toEqual({
      marginPct: 5, gridM: 0.05e-3, lengthUnit: 'mil', inlayHints: false,
    });
  });

  it('takes the defaults for a missing section, missing keys and invalid values, warning for each invalid one', () => {
    const warnings: string[] = [];
    expect(toServiceSettings(null)).toEqual(DEFAULT_SETTINGS);
    expect(toServiceSettings({ resonanceMargin: 12 })).toEqual({ ...DEFAULT_SETTINGS, marginPct: 12 });
    const bad = { resonanceMargin: -1, manufacturingGrid: 0, lengthUnit: 'inch', inlayHints: 'yes' };
    expect(toServiceSettings(bad, (w) => warnings.push(w))).toEqual(DEFAULT_SETTINGS);
    expect(warnings.map((w) => w.split(':')[0])).toEqual([
      'stubwright.resonanceMargin', 'stubwright.manufacturingGrid', 'stubwright.lengthUnit', 'stubwright.inlayHints',
    ]);
  });
});

describe('createSettingsStore', () => {
  it('fetches once per document until cleared, and counts generations', async () => {
    const fetched: string[] = [];
    const store = createSettingsStore({ pull: true, fetch: async (uri) => (fetched.push(uri), { resonanceMargin: 3 }), warn: () => {} });
    expect((await store.get('a')).marginPct).toBe(3);
    await store.get('a');
    await store.get('b');
    expect(fetched).toEqual(['a', 'b']);
    const before = store.generation;
    store.clear();
    await store.get('a');
    expect(fetched).toEqual(['a', 'b', 'a']);
    expect(store.generation).toBe(before + 1);
  });

  it('uses the pushed section for clients without workspace/configuration', async () => {
    const store = createSettingsStore({ pull: false, fetch: () => Promise.reject(new Error('not asked')), warn: () => {} });
    expect(await store.get('a')).toEqual(DEFAULT_SETTINGS);
    store.clear({ stubwright: { lengthUnit: 'mil' } });
    expect((await store.get('a')).lengthUnit).toBe('mil');
  });

  it('falls back to the defaults when the client fails the configuration request', async () => {
    const warnings: string[] = [];
    const store = createSettingsStore({ pull: true, fetch: () => Promise.reject(new Error('boom')), warn: (w) => warnings.push(w) });
    expect(await store.get('a')).toEqual(DEFAULT_SETTINGS);
    expect(warnings[0]).toContain('boom');
  });
});
