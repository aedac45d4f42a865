import { Router, type Request } from 'express';
import { readingCreateSchema, readingsQuerySchema } from '../../shared/schemas/reading.js';
import type { AppDeps } from '../deps.js';
import { onReadingLogged, onReadingsImported } from '../jobs/alerts.js';
import { notFound } from '../errors.js';
import { csvText, parseUpload } from '../middleware/csv-upload.js';
import { validateBody, validateQuery, validBody, validQuery } from '../middleware/validate.js';
import { afterCommit, requestDb } from '../middleware/request-db.js';
import { presentImportResult, presentReading, presentReadingPage } from '../presenters/reading.js';
import { readingsToCsv } from '../services/readings-csv.js';
import { commitImport, previewImport } from '../services/readings-import.js';
import { addReading, allReadings, deleteReading, listReadings } from '../services/readings.js';
import { idParam, uuidParam } from './params.js';

const NO_SUCH_READING = 'No such water test on this tank.';
/** The tank `ownTank` (server/routes/tanks.ts) already checked. */
const tankIdOf = (req: Request) => idParam(req, 'tankId', 'tank');

/** /api/tanks/:tankId/readings — mounted after auth and the tank-ownership check. */
export function readingsRouter(deps: AppDeps): Router {
  const ds = deps.dataSource;
  const router = Router({ mergeParams: true });

  router.get('/', validateQuery(readingsQuerySchema), async (req, res) => {
    const { page, pageSize } = validQuery(req, readingsQuerySchema);
    const { readings, total } = await listReadings(ds, tankIdOf(req), page, pageSize);
    res.json(presentReadingPage(readings, { page, pageSize, total }));
  });

  router.post('/', validateBody(readingCreateSchema), async (req, res) => {
    const reading = await addReading(requestDb(req, ds), tankIdOf(req), validBody(req, readingCreateSchema));
    // Alert check on the job queue (server/jobs/alerts.ts), once the test is committed; never throws.
    await afterCommit(req, () => onReadingLogged(deps, reading));
    res.status(201).json(presentReading(reading));
  });

  router.get('/export.csv', async (req, res) => {
    const csv = readingsToCsv((await allReadings(ds, tankIdOf(req))).map(presentReading));
    const day = new Date().toISOString().slice(0, 10);
    res
      .status(200)
      .type('text/csv; charset=utf-8')
      .set('Content-Disposition', `attachment; filename="shoalshift-water-tests-${day}.csv"`)
      .set('X-Content-Type-Options', 'nosniff')
      .send(csv);
  });

  router.post('/import/preview', parseUpload, async (req, res) => {
    res.json(await previewImport(ds, tankIdOf(req), csvText(req)));
  });

  router.post('/import/commit', parseUpload, async (req, res) => {
    const tankId = tankIdOf(req);
    const imported = await commitImport(ds, requestDb(req, ds), tankId, csvText(req));
    // One alert check for the import's recent tests (server/jobs/alerts.ts); never throws.
    await afterCommit(req, () => onReadingsImported(deps, tankId, imported));
    res.status(201).json(presentImportResult(imported));
  });

  router.delete('/:readingId', async (req, res) => {
    if (!(await deleteReading(ds, tankIdOf(req), uuidParam(req, 'readingId', NO_SUCH_READING)))) throw notFound(NO_SUCH_READING);
    res.status(204).end();
  });

  return router;
}
