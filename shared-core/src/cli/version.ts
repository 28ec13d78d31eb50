/**
 * The Stubwright version, from the root package.json. esbuild inlines just this string into the
 * bundle (a named JSON import is tree-shaken), so the installed CLI never reads package.json at run time.
 */
import { version } from '../../../package.json';

/** The Stubwright version (`0.1.0`). */
export const STUBWRIGHT_VERSION: string = version;
