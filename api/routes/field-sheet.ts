import { Router } from 'express';
import type { AppContext } from '../context';
import { fieldSheetOf } from '../field-sheet/field-sheet-data';
import { renderFieldSheetPdf } from '../field-sheet/render-pdf';
import { authenticate } from '../middleware/authenticate';
import { authorizeRevision } from './authorize';
import { revisionFileName } from '../presenters/download-name';
import { sendAsDownload } from '../security/content-disposition';

export function fieldSheetRouter({ config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  // What the Field sheet screen prints: the same content as the PDF.
  router.get('/revisions/:id/field-sheet', signedIn, async (req, res) => {
    const { model, revision } = await authorizeRevision(req, req.params.id, 'read', { full: true });
    res.json({ data: await fieldSheetOf(model, revision) });
  });

  router.get('/revisions/:id/field-sheet.pdf', signedIn, async (req, res) => {
    const { model, revision } = await authorizeRevision(req, req.params.id, 'read', { full: true });
    const pdf = await renderFieldSheetPdf(await fieldSheetOf(model, revision));
    sendAsDownload(res, revisionFileName(model.name, revision.number, '-field-sheet.pdf'));
    res.type('application/pdf');
    res.set('Cache-Control', 'private, no-store');
    res.send(pdf);
  });

  return router;
}
