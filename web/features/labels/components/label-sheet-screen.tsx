import type { CSSProperties } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useQueryParams } from '../../../hooks/use-query-params';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { MOST_PICKED, useUnitsToLabel } from '../api/units-to-label';
import { LABEL_SHEETS, labelSheet, labelsPerPage, paginate, type LabelSheet } from '../label-sheets';
import '../labels.css';
import { UnitLabel } from './unit-label';

const mm = (value: number) => `${value.toFixed(3)}mm`;

/** The sheet's measurements as the custom properties labels.css lays the pages out by. */
function sheetStyle(sheet: LabelSheet): CSSProperties {
  const small = sheet.label.height < 30;
  return {
    '--page-w': mm(sheet.page.width),
    '--page-h': mm(sheet.page.height),
    '--page-top': mm(sheet.top),
    '--page-left': mm(sheet.left),
    '--columns': String(sheet.columns),
    '--column-gap': mm(sheet.columnGap),
    '--row-gap': mm(sheet.rowGap),
    '--label-w': mm(sheet.label.width),
    '--label-h': mm(sheet.label.height),
    '--label-pad': small ? '1.5mm 2mm' : '2.5mm 3mm',
    '--label-font': small ? '6.5pt' : '7.5pt',
  } as CSSProperties;
}

const positiveInt = (value: string | null, max: number): number => {
  const number = Number(value);
  return Number.isInteger(number) && number > 0 ? Math.min(number, max) : 0;
};

/**
 * Labels for the receivers on the shelf, to stick on each case: a QR code of the unit's
 * page and its short code, for the common label sheets or one small label at a time.
 * `?units=` picks units by id (the whole shelf without it), `?sheet=` the sheet, `?skip=`
 * the places already used on a part-used sheet.
 */
export function LabelSheetScreen() {
  const { inUrl } = useCurrentWorkspace();
  const [params, update] = useQueryParams();
  const sheet = labelSheet(params.get('sheet'));
  const skip = sheet.id === 'single' ? 0 : positiveInt(params.get('skip'), labelsPerPage(sheet) - 1);
  const picked = params.get('units')?.split(',').filter(Boolean) ?? null;
  const labels = useUnitsToLabel(inUrl?.id ?? null, picked);
  const { units } = labels;

  if (!inUrl) return null;
  const pages = paginate(units, sheet, skip);

  return (
    <div className="label-sheet-screen">
      <style>{`@media print { @page { size: ${mm(sheet.page.width)} ${mm(sheet.page.height)}; margin: 0; } }`}</style>
      <PageHeader
        title="Labels for the shelf"
        documentTitle={`Labels · ${inUrl.name}`}
        description="Stick one on each receiver’s case: scanning the code opens the unit’s page, and the short code finds it in the shelf’s search."
        actions={
          <>
            <Link to={`/w/${inUrl.id}/shelf`} className="text-base">
              Back to the shelf
            </Link>
            <Button onClick={() => window.print()} disabled={units.length === 0 || labels.readingAll}>
              Print labels
            </Button>
          </>
        }
      />
      <Card className="mb-6 grid gap-4 p-4 sm:grid-cols-[minmax(0,1fr)_auto]">
        <SelectField label="Label sheet" value={sheet.id} onChange={(event) => update({ sheet: event.target.value })}>
          {LABEL_SHEETS.map((option) => (
            <option key={option.id} value={option.id}>
              {option.name}
            </option>
          ))}
        </SelectField>
        {sheet.id !== 'single' && (
          <TextField
            label="Places already used"
            hint="On a part-used sheet, printing starts after them."
            type="number"
            inputMode="numeric"
            min={0}
            max={labelsPerPage(sheet) - 1}
            value={skip === 0 ? '' : String(skip)}
            placeholder="0"
            onChange={(event) => update({ skip: event.target.value || null })}
          />
        )}
        <p className="text-sm text-ink-700 sm:col-span-2">
          {units.length} {units.length === 1 ? 'label' : 'labels'} on {pages.length}{' '}
          {sheet.id === 'single' ? (pages.length === 1 ? 'label' : 'labels') : pages.length === 1 ? 'sheet' : 'sheets'}
          {picked &&
            picked.length > MOST_PICKED &&
            ` for the first ${MOST_PICKED} of the ${picked.length} units picked`}
          {picked && (
            <>
              {' '}
              · <Link to={`/w/${inUrl.id}/shelf/labels?sheet=${sheet.id}`}>Label every unit on the shelf</Link>
            </>
          )}
          . Print at actual size (100 %, no fitting to the page), with margins set to none.
        </p>
      </Card>

      {labels.pending ? (
        <LoadingState label="Loading the shelf…" />
      ) : labels.error && units.length === 0 ? (
        <ErrorState title="The shelf could not be loaded" error={labels.error} onRetry={labels.retry} />
      ) : units.length === 0 ? (
        <EmptyState title="No receiver to label">
          Add the receivers to the shelf first; each gets its short code when it is added.
        </EmptyState>
      ) : (
        <>
          {labels.error ? (
            <ErrorState
              title={`${labels.total - units.length} more units could not be loaded`}
              error={labels.error}
              onRetry={labels.retry}
            />
          ) : (
            labels.more && (
              <Card className="mb-6 flex flex-wrap items-center gap-3 p-4" role="status">
                <p className="text-base text-ink-900">
                  {labels.readingAll
                    ? `Reading the shelf: ${units.length} of ${labels.total} units…`
                    : `The labels below are for the first ${units.length} of ${labels.total} units, by label.`}
                </p>
                {!labels.readingAll && (
                  <Button variant="secondary" onClick={labels.readAll}>
                    Prepare all {labels.total} labels
                  </Button>
                )}
              </Card>
            )
          )}
          <section className="label-sheet" aria-label="Labels to print" style={sheetStyle(sheet)}>
            {pages.map((cells, page) => (
              <div key={page} className="label-page">
                {cells.map((unit, cell) =>
                  unit ? (
                    <UnitLabel key={unit.id} unit={unit} origin={window.location.origin} />
                  ) : (
                    <div key={`empty-${cell}`} className="label-cell-empty" aria-hidden="true" />
                  ),
                )}
              </div>
            ))}
          </section>
        </>
      )}
    </div>
  );
}
