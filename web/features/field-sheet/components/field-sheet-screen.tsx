import { Link, useParams, useSearchParams } from 'react-router-dom';
import { buttonClasses, Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { useModel } from '../../models/api/get-model';
import { fieldSheetPdfUrl, useFieldSheet } from '../api/get-field-sheet';
import '../field-sheet.css';
import { FieldSheet } from './field-sheet';

/** Field sheet of a revision (`?revision=` its number or id; the latest without): to print, or as a PDF. */
export function FieldSheetScreen() {
  const { modelId = '' } = useParams();
  const [params] = useSearchParams();
  const param = params.get('revision');
  const model = useModel(modelId);
  const latestId = model.data?.latest?.id ?? null;
  const sheet = useFieldSheet(modelId, param, latestId, model.isSuccess);
  useDocumentTitle(
    sheet.data ? `Field sheet · ${sheet.data.model.name} r${sheet.data.revision.number}` : 'Field sheet',
  );

  if (model.isPending || (model.isSuccess && sheet.isPending))
    return <LoadingState label="Laying out the field sheet…" />;
  if (model.isError) return null;
  if (!model.data.latest)
    return (
      <ErrorState
        title="No revision to print yet"
        error={new Error('Save a first revision of this model, then print its sheet.')}
      />
    );
  if (sheet.isError)
    return (
      <ErrorState title="This field sheet could not be made" error={sheet.error} onRetry={() => void sheet.refetch()} />
    );
  if (!sheet.data) return <LoadingState label="Laying out the field sheet…" />;

  const isLatest = sheet.data.revision.id === latestId;
  return (
    <div className="field-sheet-screen space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3 print:hidden">
        <p className="text-base text-ink-700">
          Revision {sheet.data.revision.number}
          {isLatest ? (
            ', the latest.'
          ) : (
            <>
              {' '}
              of {model.data.latest.number}. <Link to={`/models/${modelId}/sheet`}>Show the latest</Link>
            </>
          )}
        </p>
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => window.print()}>
            Print
          </Button>
          <a href={fieldSheetPdfUrl(sheet.data.revision.id)} className={buttonClasses('primary')} download>
            Download PDF
          </a>
        </div>
      </div>
      <FieldSheet sheet={sheet.data} />
    </div>
  );
}
