import type { AppContext } from '../context';
import type { RouteSpec } from '../http/routes';
import { EDITORS, READERS, studyId } from '../studies/studies.routes';
import { getPlan, queuePlan } from './plans.service';

/** A method comparison's plan by simulation: read it (with the imprecision found by signed precision studies), run it. */
export function plansRoutes(ctx: AppContext): RouteSpec[] {
  return [
    { method: 'get', path: '/studies/:id/plan', access: READERS, handler: async (req, res) => res.json(await getPlan(ctx.db, req.user!, studyId(req.params))) },
    {
      method: 'post', path: '/studies/:id/plan-runs', access: EDITORS,
      handler: async (req, res) => res.status(202).json(await queuePlan(ctx.db, ctx.jobs, req.user!, studyId(req.params))),
    },
  ];
}
