export { diffSetups } from './diff-setups';
export { compareRevisions, type CompareSide, type Comparison } from './compare';
export { findingsDelta, type FindingsDelta } from './findings-delta';
export { outputsDelta, renamedControls, REST_LABEL, type OutputDelta, type PositionSet } from './outputs-delta';
export { jsonPatch, type JsonPatchOperation } from './json-patch';
export { textDiff, type TextDiff, type TextHunk, type TextRow, type TextRowKind } from './text-diff';
export {
  CHANGE_KINDS,
  SECTIONS,
  type Change,
  type ChangeCounts,
  type ChangeKind,
  type Section,
  type SetupDiff,
} from './types';
