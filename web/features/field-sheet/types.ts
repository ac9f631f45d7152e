// The sheet as the API answers it (built by the server, shape in shared/contract).
export type { FieldSheet, SheetPin, SheetReceiver, SheetUnit } from '@shared/contract/field-sheet';
