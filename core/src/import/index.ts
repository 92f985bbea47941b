export { detectDelimiter, parseDelimited, type Delimiter } from './table';
export { FIELD_SPECS, SCHEDULE_FIELDS, REQUIRED_FIELDS, mapHeaders, normaliseHeader, type ScheduleField, type FieldSpec, type ColumnMap } from './columns';
export { planFeederImport, cellProblemText, normaliseSize, normaliseMaterial, normaliseInsulation, type CellProblem, type PlannedRow, type FeederImportPlan, type FeederImportOptions } from './feederSchedule';
