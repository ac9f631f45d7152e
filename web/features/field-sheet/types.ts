// The sheet as the API answers it (api/field-sheet/field-sheet-data.ts).
export type { FieldSheet, SheetPin, SheetReceiver, SheetUnit } from '../../../api/field-sheet/field-sheet-data';
