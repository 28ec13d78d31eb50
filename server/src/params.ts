/**
 * Request parameters as the protocol defines them, checked before a handler reads them: a client
 * that sends something else gets `InvalidParams` naming the first bad field (instead of an
 * internal error in the log and an empty answer). Values inside the right shape (a position past
 * the end of the document) are the handlers' business: they clamp.
 */
import { ErrorCodes, ResponseError } from 'vscode-languageserver';

/** What a request carries besides `textDocument.uri`. */
export interface ParamNeeds {
  position?: boolean;
  range?: boolean;
  /** `context.diagnostics` (code actions) or `context.includeDeclaration` (references). */
  context?: 'diagnostics' | 'includeDeclaration';
  newName?: boolean;
}

const invalid = (field: string, what: string) => new ResponseError<never>(ErrorCodes.InvalidParams, `${field} must be ${what}`);
const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function checkPosition(v: unknown, field: string): void {
  if (!isObject(v)) throw invalid(field, 'an object { line, character }');
  for (const k of ['line', 'character'] as const) {
    if (typeof v[k] !== 'number' || !Number.isFinite(v[k])) throw invalid(`${field}.${k}`, 'a finite number');
  }
}

/** Throws `InvalidParams` unless `params` has what the request needs. */
export function checkParams(params: unknown, needs: ParamNeeds = {}): void {
  if (!isObject(params)) throw invalid('params', 'an object');
  const doc = params.textDocument;
  if (!isObject(doc) || typeof doc.uri !== 'string') throw invalid('textDocument.uri', 'a string');
  if (needs.position) checkPosition(params.position, 'position');
  if (needs.range) {
    if (!isObject(params.range)) throw invalid('range', 'an object { start, end }');
    checkPosition(params.range.start, 'range.start');
    checkPosition(params.range.end, 'range.end');
  }
  if (needs.context) {
    const context = params.context;
    if (!isObject(context)) throw invalid('context', 'an object');
    if (needs.context === 'diagnostics' && !Array.isArray(context.diagnostics)) throw invalid('context.diagnostics', 'an array');
    if (needs.context === 'includeDeclaration' && typeof context.includeDeclaration !== 'boolean') throw invalid('context.includeDeclaration', 'a boolean');
  }
  if (needs.newName && typeof params.newName !== 'string') throw invalid('newName', 'a string');
}
