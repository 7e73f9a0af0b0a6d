import { IdParams } from '@shared/schemas';
import type { AppContext } from '../context';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { EDITORS, READERS, studyId } from '../studies/studies.routes';
import { getAnalysis, queueAnalysis } from './analyses.service';
import { streamAnalysis } from './analysis-stream';

export function analysesRoutes(ctx: AppContext): RouteSpec[] {
  return [
    {
      method: 'post', path: '/studies/:id/analyses', access: EDITORS,
      handler: async (req, res) => res.status(202).json(await queueAnalysis(ctx.db, ctx.jobs, req.user!, studyId(req.params))),
    },
    {
      method: 'get', path: '/analyses/:id', access: READERS,
      handler: async (req, res) => res.json(await getAnalysis(ctx.db, req.user!, parseRequest(IdParams, req.params, 'params').id)),
    },
    {
      method: 'get', path: '/analyses/:id/events', access: READERS,
      handler: (req, res) => streamAnalysis(ctx, req.user!, parseRequest(IdParams, req.params, 'params').id, req, res),
    },
  ];
}
