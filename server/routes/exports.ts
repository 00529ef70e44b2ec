import { Router, type Request, type Response } from 'express';
import type { ServerConfig } from '../config';
import { parseOr400 } from '../middleware/validate';
import { sweepLimiter } from '../middleware/rate-limit';
import { exportQuery } from '../../shared/schema/exportRequests';
import { hardpointsCsvFile, sweepCsvFile, type CsvFile } from '../services/exports';
import type { StoredDocument } from '../services/sketches';

function sendCsv(res: Response, file: CsvFile) {
  res.attachment(file.fileName);
  res.type('text/csv; charset=utf-8').send(file.text);
}

/**
 * `sweep.csv` and `hardpoints.csv` under a route that names a sketch (`/api/sketches/:id`, `/api/shared/:token`);
 * `find` loads the sketch the route names, or throws its 404.
 */
export function exportRoutes(config: ServerConfig, find: (req: Request) => Promise<StoredDocument>): Router {
  const router = Router({ mergeParams: true });
  const limiter = sweepLimiter(config, 'sweep-csv');

  router.get('/sweep.csv', limiter, async (req, res) => {
    const { units } = parseOr400(exportQuery, req.query, 'invalid query');
    sendCsv(res, sweepCsvFile(await find(req), units));
  });

  router.get('/hardpoints.csv', async (req, res) => {
    const { units } = parseOr400(exportQuery, req.query, 'invalid query');
    sendCsv(res, hardpointsCsvFile(await find(req), units));
  });

  return router;
}
