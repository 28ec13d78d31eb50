/**
 * The one place the server reaches into shared-core: the pure sheet language service and its
 * editor-neutral types. Everything else in the server imports from here.
 */
export { createSheetService, type SheetService } from '../../shared-core/src/service/sheetService.js';
export {
  DEFAULT_SETTINGS,
  type CodeAction as SheetCodeAction,
  type CompletionItem as SheetCompletionItem,
  type DocumentSymbol as SheetSymbol,
  type EvaluatedDocument,
  type Hover as SheetHover,
  type InlayHint as SheetInlayHint,
  type ExportOptions,
  type ExportResult,
  type PlotMarker,
  type PlotOptions,
  type PlotResult,
  type PlotTarget,
  type PlotView,
  type ServiceSettings,
  type TextEdit as SheetTextEdit,
} from '../../shared-core/src/service/types.js';
export type { SheetDiagnostic } from '../../shared-core/src/sheet/types.js';
