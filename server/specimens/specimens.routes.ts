import { PutSpecimensBody } from '@shared/schemas';
import type { AppContext } from '../context';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { EDITORS, READERS, studyId } from '../studies/studies.routes';
import { getRows, putRows } from './specimens.service';

export function specimensRoutes(ctx: AppContext): RouteSpec[] {
  return [
    { method: 'get', path: '/studies/:id/specimens', access: READERS, handler: async (req, res) => res.json(await getRows(ctx.db, req.user!, studyId(req.params))) },
    {
      method: 'put', path: '/studies/:id/specimens', access: EDITORS,
      handler: async (req, res) => {
        const body = parseRequest(PutSpecimensBody, req.body, 'body');
        res.json(await putRows(ctx.db, req.user!, studyId(req.params), body.version, body.rows));
      },
    },
  ];
}
