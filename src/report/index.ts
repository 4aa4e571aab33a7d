/**
 * The policy options report: printable HTML, CSV exports and the scenario fingerprint.
 * Pure TypeScript over the engine's results (no Node, no DOM), shared by the CLI and the app.
 */
export { buildReportHtml, formatReportTime } from './reportHtml.ts';
export { scenarioFingerprint, shortFingerprint, canonicalJson, fingerprintInput, SHORT_FINGERPRINT_LENGTH } from './fingerprint.ts';
export { optionsTableCsv, dailySeriesCsv, csvNumber, DAILY_QUANTITIES, CSV_SIGNIFICANT_DIGITS, type DailyQuantity, type CsvSource } from './csv.ts';
export { optionsTable, columnGroups, type OptionsTable, type OutcomeRow } from './optionsTable.ts';
export { optionSummaries, optionSummary, type OptionSummary, type PhaseSummary } from './measures.ts';
export { parameterRows, bandTable, HOSPITAL_DEFAULT_SOURCE, DELAY_DEFAULT_SOURCE } from './assumptions.ts';
export { CAUTION, CAUTION_PARAGRAPHS, MODEL_LIMITS } from './cautions.ts';
export { optionStyle, optionStyleOf, OPTION_COLOURS, type OptionStyle } from './palette.ts';
export { fitRecordRows, FIT_SOURCE, R0_CHANGED_AFTER_FIT } from './fitRecord.ts';
export { orderComparisonHtml, drawsSentence } from './orderComparisonHtml.ts';
export { gapText, groupLabel, orderText } from './orderText.ts';
export * from './numberFormat.ts';
export * from './outcomes.ts';
export { PAPERS, OPTION_COLUMNS_PER_TABLE, type Paper, type Orientation, type ReportMeta, type ParameterRow, type BandTable } from './reportTypes.ts';
