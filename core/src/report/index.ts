/** Renderers of a finished AnalysisReport; none re-analyzes, none touches I/O. */
export { renderText, wrap, type TextOptions } from './text';
export { toJsonReport, type JsonReport, type JsonConductor, type JsonFinding, type JsonTrial } from './json';
export { toSarif, toUriReference, idLines, SARIF_SCHEMA, type SarifLog, type SarifOptions } from './sarif';
export { toConductorScheduleCsv, csvField, SCHEDULE_COLUMNS } from './csv';
export { spreadsheetCell, looksLikeFormula, inertText, clipText, textLength } from './safeText';
export { renderPermitPdf, renderResponseLetterPdf, pdfSafe, type PdfOptions, type LetterOptions } from './pdf';
export { SHEET_SIZES, SHEET_SIZE_IDS, type SheetSize } from './pdf/sheetSizes';
export { layoutNodes, DEFAULT_COLUMN_GAP, DEFAULT_LAYER_GAP, type Point, type LayoutNode, type LayoutEdge, type LayoutOptions } from './layout';
export { projectJsonSchema, projectJsonSchemaText } from './jsonSchema';
export { TOOL_NAME, TOOL_VERSION } from './version';
export { faultText, pctText, faultWorking, loadDropRows, type FaultStep, type LoadDropRow } from './studies';
export {
  VERDICT_WORDS,
  VERDICT_COLOURS,
  hexToRgb,
  SEVERITY_WORDS,
  ROLE_WORDS,
  MATERIAL_WORDS,
  verdictClass,
  showsViolation,
  displayClass,
  verdictAlarmText,
  verdictText,
  conductorText,
  sizeText,
  citationText,
  deviceText,
  fixText,
  refText,
  numberFindings,
  hasViolations,
  type VerdictClass,
  type NumberedFinding,
} from './format';
