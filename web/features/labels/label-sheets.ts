// The sticky-label sheets the label screen prints on, measured in millimetres: where
// the first label starts on the page, each label's size, and the gaps between them.
// The A4 and US Letter layouts are the common ones sold for address labels; the single
// label suits a small roll printer. Common practice, no published source.

export type LabelSheetId = 'a4-3x8' | 'letter-3x10' | 'single';

export interface LabelSheet {
  id: LabelSheetId;
  name: string;
  page: { width: number; height: number };
  columns: number;
  rows: number;
  label: { width: number; height: number };
  /** Page margins to the first label. */
  top: number;
  left: number;
  columnGap: number;
  rowGap: number;
}

const INCH = 25.4;

export const LABEL_SHEETS: readonly LabelSheet[] = [
  {
    id: 'a4-3x8',
    name: 'A4 sheet, 3 × 8 labels of 70 × 37 mm',
    page: { width: 210, height: 297 },
    columns: 3,
    rows: 8,
    label: { width: 70, height: 37 },
    top: 0.5,
    left: 0,
    columnGap: 0,
    rowGap: 0,
  },
  {
    id: 'letter-3x10',
    name: 'US Letter sheet, 3 × 10 labels of 2⅝ × 1 in',
    page: { width: 8.5 * INCH, height: 11 * INCH },
    columns: 3,
    rows: 10,
    label: { width: 2.625 * INCH, height: 1 * INCH },
    top: 0.5 * INCH,
    left: 0.1875 * INCH,
    columnGap: 0.125 * INCH,
    rowGap: 0,
  },
  {
    id: 'single',
    name: 'One small label of 57 × 32 mm',
    page: { width: 57, height: 32 },
    columns: 1,
    rows: 1,
    label: { width: 57, height: 32 },
    top: 0,
    left: 0,
    columnGap: 0,
    rowGap: 0,
  },
];

export const labelSheet = (id: string | null): LabelSheet =>
  LABEL_SHEETS.find((sheet) => sheet.id === id) ?? LABEL_SHEETS[0];

export const labelsPerPage = (sheet: LabelSheet): number => sheet.columns * sheet.rows;

/**
 * The pages of a print run: `skip` places left empty first (the labels already peeled
 * off a used sheet), then the units, split into pages of the sheet's size.
 */
export function paginate<T>(items: readonly T[], sheet: LabelSheet, skip = 0): (T | null)[][] {
  const cells: (T | null)[] = [...Array<null>(Math.max(0, skip)).fill(null), ...items];
  const size = labelsPerPage(sheet);
  const pages: (T | null)[][] = [];
  for (let start = 0; start < cells.length; start += size) pages.push(cells.slice(start, start + size));
  return pages;
}
