/** The Stubwright version reported as `serverInfo.version` (inlined from the root package.json at bundle time). */
import { version } from '../../package.json';

/** The Stubwright version, e.g. `0.1.0`. */
export const SERVER_VERSION: string = version;
