import { once } from 'node:events';

import { Router, type Response } from 'express';
import type { DataSource } from 'typeorm';

import { gradebookCsvQuerySchema, gradebookQuerySchema } from '../../shared/api/gradebook';
import { requireCohortInstructor, requireShopOwner } from '../auth/authorize';
import type { Cohort } from '../cohorts/cohort.entity';
import { parseQuery } from '../http/validate-query';
import { CSV_BOM, gradebookCsvHeader, gradebookCsvRow } from './gradebook-csv';
import type { GradebookService } from './gradebook.service';

/** Rows fetched from the cursor at a time while the CSV streams. */
const CSV_BATCH = 500;

/**
 * `/api/cohorts/:id/gradebook` (JSON, one page) and `/api/cohorts/:id/gradebook.csv` (the whole
 * book, streamed): the cohort's instructor and admins. Mounted at `/api/cohorts`.
 */
export function gradebookRouter(gradebook: GradebookService, dataSource: DataSource): Router {
  const router = Router();
  const ownCohort = requireCohortInstructor(dataSource);

  router.get('/:id/gradebook', ownCohort, async (req, res) => {
    const page = await gradebook.page(res.locals['cohort'] as Cohort, parseQuery(gradebookQuerySchema, req));
    res.set('Cache-Control', 'private, no-store').json(page);
  });

  router.get('/:id/gradebook.csv', ownCohort, async (req, res) => {
    const cohort = res.locals['cohort'] as Cohort;
    const query = parseQuery(gradebookCsvQuerySchema, req);
    let closed = false;
    res.on('close', () => (closed = true));
    let started = false;
    try {
      await gradebook.eachBatch(cohort, query, CSV_BATCH, async (rows, columns) => {
        if (!started) {
          started = true;
          res
            .status(200)
            .set('Content-Type', 'text/csv; charset=utf-8; header=present')
            .set('Content-Disposition', contentDisposition(cohort.name))
            .set('Cache-Control', 'private, no-store')
            .set('X-Content-Type-Options', 'nosniff');
          await write(res, CSV_BOM + gradebookCsvHeader(columns, gradebook.lessonCount()));
        }
        for (const row of rows) if (!(await write(res, gradebookCsvRow(row, columns)))) return false;
        return !closed;
      });
    } catch (error) {
      // Once the header is out, a failure can only cut the download short (the client sees it fail).
      if (started) return void res.destroy(error as Error);
      throw error;
    }
    if (!started) {
      // An empty gradebook still gets its header row.
      res
        .status(200)
        .set('Content-Type', 'text/csv; charset=utf-8; header=present')
        .set('Content-Disposition', contentDisposition(cohort.name))
        .set('Cache-Control', 'private, no-store');
      res.write(CSV_BOM + gradebookCsvHeader(gradebook.columns(), gradebook.lessonCount()));
    }
    res.end();
  });
  return router;
}

/** `GET /api/shop/progress`: the shop owner's own apprentices, completion only. Mounted at `/api`. */
export function shopProgressRouter(gradebook: GradebookService): Router {
  const router = Router();
  router.get('/shop/progress', requireShopOwner, async (_req, res) => {
    res.set('Cache-Control', 'private, no-store').json(await gradebook.shopProgress(res.locals['shopId'] as string));
  });
  return router;
}

/** Writes, waiting for the socket to drain when its buffer is full; false once the client has gone. */
async function write(res: Response, chunk: string): Promise<boolean> {
  if (res.destroyed || res.writableEnded) return false;
  if (!res.write(chunk)) {
    await Promise.race([once(res, 'drain'), once(res, 'close')]);
  }
  return !res.destroyed;
}

function contentDisposition(cohortName: string): string {
  const ascii = cohortName.normalize('NFKD').replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '').toLowerCase().slice(0, 60) || 'cohort';
  return `attachment; filename="gradebook-${ascii}.csv"; filename*=UTF-8''${encodeURIComponent(`gradebook-${cohortName}.csv`)}`;
}
