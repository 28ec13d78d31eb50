/** Identifiers shared by the extension and its manifest (`package.json` must use the same strings). */

/** Language id of `*.rfsheet` documents. */
export const LANGUAGE_ID = 'rfsheet';
/** Settings section the server reads (`stubwright.resonanceMargin`, …). */
export const CONFIGURATION_SECTION = 'stubwright';
/** Client id; VS Code also uses it for the `stubwright.trace.server` setting. */
export const CLIENT_ID = 'stubwright';
/** Name of the client and of its output channel. */
export const CLIENT_NAME = 'Stubwright Language Server';
/** The bundled server, shipped in the extension's `dist/` folder. */
export const SERVER_MODULE = 'server.js';
/** Setting (in CONFIGURATION_SECTION) that shows the "Plot" code lenses above stubs and lines. */
export const PLOT_CODE_LENS_SETTING = 'plotCodeLens';
